import { describe, expect, it } from 'vitest';
import {
  evaluateDesign,
  FEW_GROOVES,
  SCALAR_LIMIT_LAMBDA_OVER_D,
  TRUSTED_F_NUMBER,
  type WarningCode,
} from '@/features/solver';
import { designSchema } from '@/shared/design';
import { makeDesign } from './fixtures';

const codes = (design: Parameters<typeof evaluateDesign>[0]) =>
  evaluateDesign(design, { points: 11 }).warnings.map((w) => w.code);

const find = (design: Parameters<typeof evaluateDesign>[0], code: WarningCode) =>
  evaluateDesign(design, { points: 11 }).warnings.find((w) => w.code === code);

describe('where the scalar blaze estimate holds', () => {
  it('warns once λ/d passes 0.2, naming the largest λ/d and the source', () => {
    // Palmer & Loewen, Diffraction Grating Handbook, ch. 9: scalar theory holds for λ/d < 0.2
    // (from memory). 1200 g/mm (d = 833.3 nm) over 300–900 nm: λ/d from 0.36 to 1.08.
    expect(SCALAR_LIMIT_LAMBDA_OVER_D).toBe(0.2);
    const warning = find(makeDesign(), 'beyond-scalar-blaze');
    expect(warning?.message).toMatch(/^Everywhere evaluated \(between 300 and 900 nm\) λ\/d exceeds 0\.2 \(up to 1\.08\)/);
    expect(warning?.message).toContain('Palmer & Loewen');
  });

  it('names only the wavelengths past the limit', () => {
    // 300 g/mm: d = 3333 nm, so λ/d = 0.2 at 666.7 nm; 400–900 nm crosses it.
    const warning = find(
      makeDesign({ grating: { grooveDensityPerMm: 300, blazeWavelengthNm: 500 }, range: { startNm: 400, endNm: 900 } }),
      'beyond-scalar-blaze',
    );
    expect(warning?.message).toMatch(/^At 5 of 11 wavelengths between 700 and 900 nm λ\/d exceeds 0\.2 \(up to 0\.27\)/);
  });

  it('stays quiet where λ/d is small, and without a blaze wavelength', () => {
    // 300 g/mm at 400–600 nm: λ/d from 0.12 to 0.18.
    expect(codes(makeDesign({ grating: { grooveDensityPerMm: 300 }, range: { startNm: 400, endNm: 600 } }))).not.toContain('beyond-scalar-blaze');
    expect(codes(makeDesign({ grating: { blazeWavelengthNm: undefined } }))).not.toContain('beyond-scalar-blaze');
  });
});

describe('where the closed forms are trustworthy', () => {
  it('warns below about 100 illuminated grooves (from memory)', () => {
    expect(FEW_GROOVES).toBe(100);
    const few = makeDesign({ grating: { grooveDensityPerMm: 1.8, ruledWidthMm: 50, blazeWavelengthNm: undefined } }); // N = 90
    expect(designSchema.safeParse(few).success).toBe(true);
    expect(find(few, 'few-grooves')?.message).toMatch(/^Only 90 grooves are illuminated/);
    expect(codes(makeDesign({ grating: { grooveDensityPerMm: 2, ruledWidthMm: 50, blazeWavelengthNm: undefined } }))).not.toContain('few-grooves');
  });

  it('warns when any beam is faster than f/1 (common practice), listing each', () => {
    expect(TRUSTED_F_NUMBER).toBe(1);
    // 50 mm grating, 40 mm collimator, 30 mm camera: f/0.8 and f/0.6 along the slit.
    const fast = makeDesign({ layout: { collimatorFocalMm: 40, cameraFocalMm: 30 } });
    expect(designSchema.safeParse(fast).success).toBe(true);
    const warning = find(fast, 'fast-optics');
    expect(warning?.message).toContain('f/0.8 (collimator, along the slit)');
    expect(warning?.message).toContain('f/0.6 (camera, along the slit)');
    // The example design is f/6.
    expect(codes(makeDesign())).not.toContain('fast-optics');
  });

  it('reports the camera f-numbers beside the collimator ones', () => {
    const summary = evaluateDesign(makeDesign({ layout: { cameraFocalMm: 150 } }), { points: 3 }).design;
    expect(summary.cameraFNumberHeight).toBe(3);
    const centre = evaluateDesign(makeDesign(), { wavelengthsNm: [600] }).points[0]!;
    // f_cam / (W cos β) at the centre wavelength (the diffracted beam's width, Palmer & Loewen ch. 2).
    expect(summary.cameraFNumberProjectedWidth).toBeCloseTo(150 / (50 * Math.cos(((centre.diffractionDeg ?? NaN) * Math.PI) / 180)), 10);
  });
});

describe('degenerate mounts', () => {
  it.each([
    { kind: 'czerny-turner', words: 'Czerny–Turner collimator and camera mirrors sit in the same place' },
    { kind: 'ebert-fastie', words: 'two zones of the Ebert–Fastie mirror fall on the same place' },
  ] as const)('warns for a $kind at a deviation of 0°', ({ kind, words }) => {
    // Geometry (from memory): with 2K = 0 the outgoing chief ray retraces the incoming one.
    const warning = find(makeDesign({ layout: { kind, deviationAngleDeg: 0, cameraFocalMm: 300 } }), 'degenerate-mount');
    expect(warning?.message).toContain(words);
    expect(warning?.message).toContain('choose Littrow');
  });

  it('accepts Littrow at 0° and a Czerny–Turner at 30° without it', () => {
    expect(codes(makeDesign({ layout: { kind: 'littrow', deviationAngleDeg: 0 } }))).not.toContain('degenerate-mount');
    expect(codes(makeDesign())).not.toContain('degenerate-mount');
  });
});
