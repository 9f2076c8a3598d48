import { describe, expect, it } from 'vitest';
import { centreWavelengthSpot, sharedSpotWindows, spotAperture, spotChangeWords } from '@/features/notebooks/compare-spots';
import type { Spot, TraceReport, TracedWavelength } from '@/features/trace';
import { spotWindow } from '@/features/trace/spot-figure';

/**
 * The compare screen's and sheet's spot pair: which spot each version shows, one scale for both,
 * and the change in words. Spots and reports are hand-made: these are rules, not physics.
 */

function spot(halfWidthMm: number, role: Spot['role'] = 'centre'): Spot {
  const x = Float64Array.from([-halfWidthMm, 0, halfWidthMm]);
  const y = Float64Array.from([0, 0.01, -0.01]);
  return {
    role,
    slitHeightMm: 0,
    x,
    y,
    centroidMm: { x: 0, y: 0 },
    rmsWidthMm: halfWidthMm,
    rmsHeightMm: 0.01,
    comaSkew: 0,
    comaMm: 0,
    raysLaunched: 3,
    raysVignetted: 0,
  };
}

function wavelength(overrides: Partial<TracedWavelength>): TracedWavelength {
  const empty = new Float64Array(0);
  return {
    wavelengthNm: 600,
    role: 'centre',
    reachable: true,
    spots: [spot(0.02, 'top'), spot(0.05), spot(0.02, 'bottom')],
    raysLaunched: 3,
    raysTraced: 3,
    raysVignetted: 0,
    centroidMm: { x: 0, y: 0 },
    rmsWidthMm: 0.0512,
    rmsHeightMm: 0,
    lineShape: { offsetNm: empty, traced: empty, closedForm: empty },
    tracedFwhmNm: 0.412,
    slitLimitedFwhmNm: 0.276,
    curvatureSagittaMm: 0,
    tracedLinearDispersionMmPerNm: 1,
    cameraToImageMm: 300,
    bestFocusShiftMm: 0,
    tangentialFocusShiftMm: 0,
    sagittalFocusShiftMm: 0,
    astigmatismMm: 0,
    throughFocus: { shiftMm: empty, rmsWidthMm: empty },
    ...overrides,
  };
}

function report(wavelengths: TracedWavelength[], mode: TraceReport['mode'] = 'monochromator'): TraceReport {
  return {
    imagePlane: 'test',
    mode,
    raysPerWavelength: 3,
    wavelengths,
    straighteningRadiusMm: null,
    curvedEntrance: false,
    detectorTilt: null,
    exitSlit: { widthMm: 0.1, heightMm: 10 },
    pixel: { widthMm: 0.025 },
  };
}

describe('the spot a compare shows', () => {
  it('is the slit-middle spot at the range centre, drawn against the exit slit', () => {
    const picked = centreWavelengthSpot(report([wavelength({ role: 'start', wavelengthNm: 300 }), wavelength({})]));
    expect(picked.ok).toBe(true);
    if (!picked.ok) return;
    expect(picked.wavelength.wavelengthNm).toBe(600);
    expect(picked.spot.role).toBe('centre');
    expect(picked.aperture).toEqual({ centreXMm: 0, widthMm: 0.1, label: 'the exit slit' });
  });

  it('is drawn against one pixel on a spectrograph', () => {
    expect(spotAperture(report([], 'spectrograph'))).toEqual({ centreXMm: 0, widthMm: 0.025, label: 'one detector pixel' });
  });

  it('says why there is none when the centre is out of reach', () => {
    const none = centreWavelengthSpot(report([wavelength({ reachable: false, spots: [] })]));
    expect(none).toEqual({ ok: false, reason: 'the mount cannot reach 600\u00A0nm' });
  });
});

describe('two spots at one scale', () => {
  it('gives both the window the wider spot needs, each centred on its own spot', () => {
    const aperture = { centreXMm: 0, widthMm: 0.1, label: 'the exit slit' };
    const narrow = { spot: spot(0.02), aperture };
    const wide = { spot: { ...spot(0.3), centroidMm: { x: 0.05, y: 0 } }, aperture };
    const [a, b] = sharedSpotWindows([narrow, wide], 200);
    const own = [narrow, wide].map(({ spot: s }) => spotWindow(s.x, s.y, s.centroidMm, aperture, 200));
    expect(a!.halfMm).toBe(b!.halfMm);
    expect(a!.halfMm).toBe(Math.max(own[0]!.halfMm, own[1]!.halfMm));
    expect(own[1]!.halfMm).toBeGreaterThan(own[0]!.halfMm);
    expect(b!.centreXMm).toBe(0.05);
    expect(a!.centreXMm).toBe(0);
  });
});

describe('the change in words', () => {
  it('names the width and traced FWHM before and after with the relative change', () => {
    // 38.4 / 51.2 = 0.75: 25 % narrower; 0.309 / 0.412 = 0.75 too.
    const words = spotChangeWords(wavelength({}), wavelength({ rmsWidthMm: 0.0384, tracedFwhmNm: 0.309 }));
    expect(words).toBe('RMS width 51.2\u00A0µm → 38.4\u00A0µm (−25\u202F%); traced FWHM 0.412\u00A0nm → 0.309\u00A0nm (−25\u202F%)');
  });

  it('says "none" for a traced FWHM the trace could not measure, with no change figure', () => {
    expect(spotChangeWords(wavelength({}), wavelength({ tracedFwhmNm: null }))).toMatch(/; traced FWHM 0\.412\u00A0nm → none$/);
  });
});
