import type { TracedWavelengthSummary } from '../../shared/trace';
import type { TraceReport } from './types';

/** Each reachable traced wavelength as the API and the script answer it (shared/trace.ts). */
export function summarizeTrace(report: TraceReport): TracedWavelengthSummary[] {
  return report.wavelengths
    .filter((w) => w.reachable)
    .map((w) => ({
      wavelengthNm: w.wavelengthNm,
      raysTraced: w.raysTraced,
      raysVignetted: w.raysVignetted,
      centroidMm: { x: w.centroidMm.x, y: w.centroidMm.y },
      rmsWidthMm: w.rmsWidthMm,
      rmsHeightMm: w.rmsHeightMm,
      tracedFwhmNm: w.tracedFwhmNm,
      curvatureSagittaMm: w.curvatureSagittaMm,
      tracedLinearDispersionMmPerNm: w.tracedLinearDispersionMmPerNm,
      bestFocusShiftMm: w.bestFocusShiftMm,
    }));
}
