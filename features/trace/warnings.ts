import type { TraceReport } from './types';

/** The traced bandpass differs from the slit-limited one by more than this share (the 10 %). */
export const TRACED_BANDPASS_TOLERANCE = 0.1;

export interface TraceWarning {
  code: 'traced-bandpass-differs' | 'trace-vignettes';
  wavelengthNm: number;
  message: string;
}

/**
 * What the trace finds that the first-order figures miss: a traced FWHM more than 10 % from the
 * slit-limited bandpass (aberrations widen the line), and rays lost inside the instrument.
 */
export function traceWarnings(report: TraceReport): TraceWarning[] {
  const out: TraceWarning[] = [];
  for (const w of report.wavelengths) {
    if (!w.reachable) continue;
    if (w.tracedFwhmNm !== null && w.slitLimitedFwhmNm > 0) {
      const ratio = w.tracedFwhmNm / w.slitLimitedFwhmNm;
      if (Math.abs(ratio - 1) > TRACED_BANDPASS_TOLERANCE) {
        out.push({
          code: 'traced-bandpass-differs',
          wavelengthNm: w.wavelengthNm,
          message:
            `At ${w.wavelengthNm.toFixed(1)} nm the traced bandpass is ${w.tracedFwhmNm.toPrecision(3)} nm, ` +
            `${Math.round(Math.abs(ratio - 1) * 100)} % ${ratio > 1 ? 'wider' : 'narrower'} than the slit-limited ` +
            `${w.slitLimitedFwhmNm.toPrecision(3)} nm: the mirrors’ aberrations ${ratio > 1 ? 'blur the slit image' : 'narrow the image'}.`,
        });
      }
    }
    if (w.raysVignetted > 0.05 * w.raysLaunched) {
      out.push({
        code: 'trace-vignettes',
        wavelengthNm: w.wavelengthNm,
        message:
          `At ${w.wavelengthNm.toFixed(1)} nm ${Math.round((100 * w.raysVignetted) / w.raysLaunched)} % of the traced rays ` +
          'miss an optic (the grating’s ruled area or a mirror) before the image plane.',
      });
    }
  }
  return out;
}
