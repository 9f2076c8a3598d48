import { describe, expect, it } from 'vitest';
import { summarizeTrace, traceDesign, traceWarnings } from '../../../features/trace';
import { exampleDesign, type Design } from '../../../shared/design';
import { TRACE_LIMITS, tracedWavelengthSchema, traceOptionsSchema } from '../../../shared/trace';

/** What the trace's report promises its readers (the API, the card, the sheet). */

const slow: Design = {
  grating: { grooveDensityPerMm: 1200, order: 1, ruledWidthMm: 20, ruledHeightMm: 20 },
  layout: { kind: 'czerny-turner', deviationAngleDeg: 30, collimatorFocalMm: 500, cameraFocalMm: 500, collimatorOffAxisDeg: 4, cameraOffAxisDeg: 4 },
  slits: { entranceWidthUm: 100, exitWidthUm: 100, heightMm: 2 },
  range: { startNm: 400, endNm: 700 },
};

describe('the traced wavelengths', () => {
  it('are the range’s start, centre and end plus those asked for, sorted, each once', () => {
    const report = traceDesign(slow, { rays: 500, atNm: [550, 420, 420] });
    expect(report.wavelengths.map((w) => [w.wavelengthNm, w.role])).toEqual([
      [400, 'start'],
      [420, 'asked'],
      [550, 'centre'],
      [700, 'end'],
    ]);
    expect(report.raysPerWavelength).toBe(500);
  });

  it('marks a wavelength the grating cannot reach instead of throwing', () => {
    // 1200 grooves/mm, first order, 30° deviation: mλ ≤ 2d cos K = 1610 nm.
    const report = traceDesign(slow, { rays: 500, atNm: [2000] });
    const far = report.wavelengths.find((w) => w.wavelengthNm === 2000)!;
    expect(far.reachable).toBe(false);
    expect(far.tracedFwhmNm).toBeNull();
    expect(summarizeTrace(report).map((w) => w.wavelengthNm)).toEqual([400, 550, 700]);
  });

  it('keeps the ray count inside its bounds', () => {
    expect(traceDesign(slow, { rays: 10 }).raysPerWavelength).toBe(TRACE_LIMITS.minRays);
    expect(traceOptionsSchema.safeParse({ rays: TRACE_LIMITS.maxRays + 1 }).success).toBe(false);
  });
});

describe('a monochromator', () => {
  it('brings each wavelength to the exit slit’s centre and images the slit there', () => {
    const report = traceDesign(slow, { rays: 1500 });
    expect(report.mode).toBe('monochromator');
    for (const w of report.wavelengths) {
      // The grating turns to each wavelength: its image sits on the exit slit, within a tenth of its width.
      expect(Math.abs(w.centroidMm.x)).toBeLessThan(0.01);
      // A slow, gently folded mount: the traced line is the slit-limited triangle to within 10 %
      // (Palmer & Loewen, ch. 9: FWHM = RLD × slit width with matched slits).
      expect(w.tracedFwhmNm! / w.slitLimitedFwhmNm).toBeGreaterThan(0.9);
      expect(w.tracedFwhmNm! / w.slitLimitedFwhmNm).toBeLessThan(1.1);
    }
    expect(traceWarnings(report).filter((w) => w.code === 'traced-bandpass-differs')).toEqual([]);
  });

  it('warns when the traced bandpass is more than 10 % wider than the slit-limited one', () => {
    // A fast mount folded hard (f/3.3, 12° off axis, narrow slits): aberrations outgrow the slits.
    const fast: Design = {
      ...slow,
      grating: { ...slow.grating, ruledWidthMm: 60, ruledHeightMm: 60 },
      layout: { ...slow.layout, collimatorFocalMm: 200, cameraFocalMm: 200, collimatorOffAxisDeg: 12, cameraOffAxisDeg: 12 },
      slits: { entranceWidthUm: 20, exitWidthUm: 20, heightMm: 2 },
    };
    const report = traceDesign(fast, { rays: 2000 });
    const warnings = traceWarnings(report).filter((w) => w.code === 'traced-bandpass-differs');
    expect(warnings.length).toBeGreaterThan(0);
    const centre = report.wavelengths.find((w) => w.role === 'centre')!;
    expect(centre.tracedFwhmNm! / centre.slitLimitedFwhmNm).toBeGreaterThan(1.1);
    expect(warnings.find((w) => w.wavelengthNm === centre.wavelengthNm)?.message).toMatch(/wider than the slit-limited/);
  });
});

describe('a spectrograph', () => {
  it('keeps the grating at the range centre, spreads the wavelengths along x, and proposes a detector tilt', () => {
    // 300 grooves/mm at f = 200 mm: f/(d cos β) ≈ 200/3333 = 0.06 mm/nm, so 400–700 nm spreads
    // about 18 mm (Palmer & Loewen, ch. 2): the 25.6 mm detector holds it all.
    const design: Design = {
      grating: { grooveDensityPerMm: 300, order: 1, ruledWidthMm: 20, ruledHeightMm: 20 },
      layout: { kind: 'czerny-turner', deviationAngleDeg: 30, collimatorFocalMm: 200, cameraFocalMm: 200, collimatorOffAxisDeg: 10, cameraOffAxisDeg: 12 },
      slits: { entranceWidthUm: 25, exitWidthUm: 25, heightMm: 1 },
      range: { startNm: 400, endNm: 700 },
      detector: { pixelPitchUm: 25, pixelCount: 1024 },
    };
    const report = traceDesign(design, { rays: 1500 });
    expect(report.mode).toBe('spectrograph');
    const [start, centre, end] = report.wavelengths;
    expect(start!.centroidMm.x).toBeLessThan(centre!.centroidMm.x);
    expect(centre!.centroidMm.x).toBeLessThan(end!.centroidMm.x);
    expect(Math.abs(centre!.centroidMm.x)).toBeLessThan(0.05);
    expect(report.detectorTilt).not.toBeNull();
    // Tilting to follow the foci never blurs more than the flat detector does.
    expect(report.detectorTilt!.rmsWidthTiltedMm).toBeLessThanOrEqual(report.detectorTilt!.rmsWidthFlatMm);
    expect(report.pixel).toEqual({ widthMm: 0.025 });
  });
});

describe('the API summary', () => {
  it('is one schema-valid entry per reachable wavelength, with the report’s own figures', () => {
    const report = traceDesign(exampleDesign, { rays: 800, atNm: [404.66] });
    const summary = summarizeTrace(report);
    expect(summary).toHaveLength(report.wavelengths.filter((w) => w.reachable).length);
    for (const entry of summary) {
      expect(tracedWavelengthSchema.parse(entry)).toEqual(entry);
      const w = report.wavelengths.find((x) => x.wavelengthNm === entry.wavelengthNm)!;
      expect(entry.raysTraced + entry.raysVignetted).toBe(800);
      expect(entry.rmsWidthMm).toBe(w.spots.find((s) => s.role === 'centre')!.rmsWidthMm);
    }
    // JSON-safe: typed arrays stay out of the summary.
    expect(JSON.parse(JSON.stringify(summary))).toEqual(summary);
  });
});

describe('through focus', () => {
  it('spans the tangential focus and the image plane, and its least width is at the focus it reports', () => {
    const report = traceDesign(exampleDesign, { rays: 1500 });
    for (const w of report.wavelengths) {
      const { shiftMm, rmsWidthMm } = w.throughFocus;
      expect(shiftMm[0]).toBeLessThanOrEqual(Math.min(0, w.tangentialFocusShiftMm));
      expect(shiftMm[shiftMm.length - 1]).toBeGreaterThanOrEqual(Math.max(0, w.tangentialFocusShiftMm));
      // A dip the eye can find: the far end has grown well past the least width (to about twice it,
      // three times over, by construction: the width is the root of a quadratic in the shift).
      const least = Math.min(...rmsWidthMm);
      const ends = Math.max(rmsWidthMm[0]!, rmsWidthMm[rmsWidthMm.length - 1]!);
      expect(ends).toBeGreaterThan(1.5 * least);
    }
  });
});
