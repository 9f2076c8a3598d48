import { afterEach, describe, expect, it, vi } from 'vitest';
import {
  checkRequirements,
  clearTracedBandpassCache,
  requirementFailsAt,
  tracedRequirementWavelengthsNm,
  TRACED_REQUIREMENT_RAYS,
} from '@/features/requirements';
import { evaluateDesign } from '@/features/solver';
import { traceDesign, tracedBandpasses } from '@/features/trace';
import type { Design } from '@/shared/design';
import { requirementsSchema, type Requirements } from '@/shared/requirements';

/**
 * `bandpassBasis: 'traced'`: the bandpass limit judged on the exact trace's FWHM at a few
 * wavelengths. The engine is real where the physics is asked about; where the check's own rules
 * are (a null FWHM, an unreachable wavelength, an engine that refuses), its answer is stood in for.
 */

vi.mock('@/features/trace/index', async (importOriginal) => {
  const actual = await importOriginal<typeof import('@/features/trace/index')>();
  return { ...actual, tracedBandpasses: vi.fn(actual.tracedBandpasses) };
});

afterEach(() => {
  vi.mocked(tracedBandpasses).mockClear();
  clearTracedBandpassCache();
});

/**
 * A fast Czerny–Turner used far off axis: f = 100 mm mirrors over a 50 mm grating (about f/2),
 * each mirror 15° off axis, 10 µm slits. Third-order blur of a spherical mirror (Schroeder,
 * Astronomical Optics, ch. 5; from memory): angular spherical aberration ~ 1/(128 F³) ≈ 1.0 mrad,
 * sagittal coma ~ θ/(16 F²) = 0.262/64 ≈ 4.1 mrad (tangential three times that); times f = 100 mm
 * these are 0.1–1 mm in the image, tens of times the 10 µm slit. The traced line is therefore far
 * wider than the slit-limited one, which is RLD × 10 µm: at 500 nm, 1200/mm, deviation 30°,
 * β ≈ 2.1°, RLD = d cos β / f = 833.3 × 0.999 / 100 ≈ 8.3 nm/mm, so about 0.083 nm.
 */
function fastCzernyTurner(requirements: Requirements): Design {
  return {
    grating: { grooveDensityPerMm: 1200, order: 1, blazeWavelengthNm: 500, ruledWidthMm: 50, ruledHeightMm: 50 },
    layout: {
      kind: 'czerny-turner',
      deviationAngleDeg: 30,
      collimatorFocalMm: 100,
      cameraFocalMm: 100,
      collimatorOffAxisDeg: 15,
      cameraOffAxisDeg: 15,
    },
    slits: { entranceWidthUm: 10, exitWidthUm: 10, heightMm: 2 },
    range: { startNm: 400, endNm: 600 },
    requirements,
  };
}

/** The slit-limited bandpass the closed forms give at 500 nm (the solver's own figure, not the trace's). */
function slitLimitedAt500(): number {
  const point = evaluateDesign(fastCzernyTurner({}), { wavelengthsNm: [500] }).points[0]!;
  return point.bandpassNm!;
}

describe('a traced bandpass requirement with the real trace', () => {
  it('fails a fast, far-off-axis Czerny–Turner that passes on the slit-limited bandpass', () => {
    const slitLimited = slitLimitedAt500();
    // Hand figure above: RLD × 10 µm ≈ 0.083 nm (a check that the fixture is the instrument described).
    expect(slitLimited).toBeGreaterThan(0.07);
    expect(slitLimited).toBeLessThan(0.1);
    // Half as much again as the slit-limited figure: room for the slit images, none for the blur.
    const limit = 1.5 * slitLimited;
    const slit = checkRequirements(fastCzernyTurner({ maxBandpassNm: limit, atWavelengthsNm: [500] })).checks[0]!;
    expect(slit.status).toBe('pass');
    expect(slit.message).toMatch(/^bandpass /);

    const traced = checkRequirements(
      fastCzernyTurner({ maxBandpassNm: limit, atWavelengthsNm: [500], bandpassBasis: 'traced' }),
    ).checks[0]!;
    expect(traced.status).toBe('fail');
    expect(traced.limitText).toMatch(/^traced bandpass ≤ /);
    expect(traced.message).toMatch(/^traced bandpass [\d.]+\u00A0nm at 500\u00A0nm, \d+\u202F% over/);
    expect(traced.worst!).toBeGreaterThan(limit);
    expect(traced.failingSpansNm).toEqual([[500, 500]]);
  });

  it('traces only the five wavelengths across the range, with a modest ray count, when none are listed', () => {
    const design = fastCzernyTurner({ maxBandpassNm: 100, bandpassBasis: 'traced' });
    // 400–600 nm: start, quarter points, centre, end.
    expect(tracedRequirementWavelengthsNm(design)).toEqual([400, 450, 500, 550, 600]);
    const check = checkRequirements(design).checks[0]!;
    // 100 nm is far wider than any blur of this instrument: every traced wavelength passes.
    expect(check.status).toBe('pass');
    const calls = vi.mocked(tracedBandpasses).mock.calls;
    expect(calls).toHaveLength(1);
    expect(calls[0]!.slice(1)).toEqual([[400, 450, 500, 550, 600], TRACED_REQUIREMENT_RAYS]);
  });

  it('judges the figure the trace card shows: the same FWHM as the whole trace at the same rays', () => {
    const design = fastCzernyTurner({ maxBandpassNm: 100, bandpassBasis: 'traced' });
    const lean = tracedBandpasses(design, [450, 500], TRACED_REQUIREMENT_RAYS);
    const whole = traceDesign(design, { rays: TRACED_REQUIREMENT_RAYS, atNm: [450] }).wavelengths;
    for (const entry of lean) {
      const same = whole.find((w) => w.wavelengthNm === entry.wavelengthNm)!;
      expect(entry.fwhmNm).toBe(same.tracedFwhmNm);
      expect(entry.slitLimitedNm).toBe(same.slitLimitedFwhmNm);
    }
  });
});

type Lean = ReturnType<typeof tracedBandpasses>[number];

/** One wavelength as the engine's lean path answers it. */
function tracedAt(wavelengthNm: number, fwhmNm: number | null, reachable = true): Lean {
  return { wavelengthNm, reachable, fwhmNm, slitLimitedNm: reachable ? 0.1 : null };
}

describe('the traced check’s own rules', () => {
  const design = fastCzernyTurner({ maxBandpassNm: 0.5, atWavelengthsNm: [450, 550], bandpassBasis: 'traced' });

  it('fails a wavelength whose traced FWHM is unknown, naming it, instead of passing it', () => {
    vi.mocked(tracedBandpasses).mockReturnValueOnce([tracedAt(450, 0.3), tracedAt(550, null)]);
    const check = checkRequirements(design).checks[0]!;
    expect(check.status).toBe('fail');
    expect(check.worstWavelengthNm).toBe(550);
    expect(check.message).toMatch(/no half-maximum width at 550\u00A0nm/);
    // The wavelength that was measured is still reported.
    expect(check.message).toMatch(/traced bandpass 0\.3\u00A0nm at worst where traced, at 450\u00A0nm/);
    expect(check.failingSpansNm).toEqual([[550, 550]]);
  });

  it('fails a listed wavelength the grating cannot send through', () => {
    vi.mocked(tracedBandpasses).mockReturnValueOnce([tracedAt(450, 0.3), tracedAt(550, null, false)]);
    const check = checkRequirements(design).checks[0]!;
    expect(check.status).toBe('fail');
    expect(check.message).toMatch(/^traced bandpass unreachable at 550\u00A0nm/);
  });

  it('judges the worst traced figure against the limit: 0.3 nm under 0.5 nm is 40 % to spare', () => {
    vi.mocked(tracedBandpasses).mockReturnValueOnce([tracedAt(450, 0.3), tracedAt(550, 0.25)]);
    const check = checkRequirements(design).checks[0]!;
    expect(check.status).toBe('pass');
    // (0.5 − 0.3) / 0.5 = 0.4.
    expect(check.margin).toBeCloseTo(0.4, 12);
    expect(check.message).toBe('traced bandpass 0.3\u00A0nm at worst (450\u00A0nm), 40\u202F% to spare; slit-limited 0.1\u00A0nm');
  });

  it('says so when the trace cannot run, and never passes', () => {
    vi.mocked(tracedBandpasses).mockImplementationOnce(() => {
      throw new Error('the mount has no camera');
    });
    const check = checkRequirements(design).checks[0]!;
    expect(check.status).toBe('unknown');
    expect(check.message).toBe('the ray trace could not run: the mount has no camera');
  });

  it('does not trace again when only a limit changes, and does when the optics do', () => {
    const at = (limit: number, exitWidthUm = 10) =>
      checkRequirements({ ...fastCzernyTurner({ maxBandpassNm: limit, atWavelengthsNm: [500], bandpassBasis: 'traced' }), slits: { entranceWidthUm: 10, exitWidthUm, heightMm: 2 } });
    at(0.5);
    at(0.6);
    expect(vi.mocked(tracedBandpasses).mock.calls).toHaveLength(1);
    at(0.6, 20);
    expect(vi.mocked(tracedBandpasses).mock.calls).toHaveLength(2);
  });

  it('traces a long wavelength list in one call, each listed wavelength once', () => {
    const listed = Array.from({ length: 12 }, (_, i) => 401 + i * 15);
    vi.mocked(tracedBandpasses).mockImplementationOnce((_d, nms) => nms.map((nm) => tracedAt(nm, 0.2)));
    const check = checkRequirements(fastCzernyTurner({ maxBandpassNm: 0.5, atWavelengthsNm: listed, bandpassBasis: 'traced' })).checks[0]!;
    expect(check.status).toBe('pass');
    expect(vi.mocked(tracedBandpasses).mock.calls.map((call) => call[1])).toEqual([listed]);
  });

  it('leaves the traced limit out of the plots’ per-point shading, which has no traced figure', () => {
    const requirements: Requirements = { maxBandpassNm: 1e-6, bandpassBasis: 'traced' };
    const point = evaluateDesign(fastCzernyTurner({}), { wavelengthsNm: [500] }).points[0]!;
    expect(requirementFailsAt(requirements, point, fastCzernyTurner(requirements))).toEqual([]);
    expect(requirementFailsAt({ maxBandpassNm: 1e-6 }, point, fastCzernyTurner({}))).toEqual(['maxBandpassNm']);
  });
});

describe('the bandpass basis field', () => {
  it('takes slit-limited and traced, and is optional', () => {
    expect(requirementsSchema.parse({ bandpassBasis: 'traced' })).toEqual({ bandpassBasis: 'traced' });
    expect(requirementsSchema.parse({ bandpassBasis: 'slit-limited' })).toEqual({ bandpassBasis: 'slit-limited' });
    expect(requirementsSchema.parse({ maxBandpassNm: 0.5 })).toEqual({ maxBandpassNm: 0.5 });
  });

  it('refuses another value with a message naming requirements.bandpassBasis inside a design', async () => {
    const { designSchema, exampleDesign } = await import('@/shared/design');
    const result = designSchema.safeParse({ ...exampleDesign, requirements: { bandpassBasis: 'measured' } });
    expect(result.success).toBe(false);
    const issue = result.error!.issues[0]!;
    expect(issue.path.join('.')).toBe('requirements.bandpassBasis');
    expect(issue.message).toBe('must be one of slit-limited or traced');
  });
});
