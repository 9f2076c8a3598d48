import { summarizeTrace, traceDesign, traceWarnings } from '../../features/trace/index';
import type { TraceAnswer, TraceRequest } from '../../shared/contract/trace';

/**
 * The trace answer of `POST /api/trace` and `npm run trace`, built in one place so the route and
 * the script print the same JSON: the per-wavelength summary, the image plane and the findings.
 * The request has passed `traceRequestSchema`, so its bounds hold before any ray is traced.
 */
export function traceAnswer({ design, ...options }: TraceRequest): TraceAnswer {
  const report = traceDesign(design, options);
  return {
    wavelengths: summarizeTrace(report),
    imagePlane: report.imagePlane,
    mode: report.mode,
    raysPerWavelength: report.raysPerWavelength,
    straighteningRadiusMm: report.straighteningRadiusMm,
    detectorTilt: report.detectorTilt && {
      bestTiltDeg: report.detectorTilt.bestTiltDeg,
      rmsWidthFlatMm: report.detectorTilt.rmsWidthFlatMm,
      rmsWidthTiltedMm: report.detectorTilt.rmsWidthTiltedMm,
      gain: report.detectorTilt.gain,
    },
    warnings: traceWarnings(report).map(({ code, wavelengthNm, message }) => ({ code, wavelengthNm, message })),
  };
}
