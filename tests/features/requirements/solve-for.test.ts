import { describe, expect, it } from 'vitest';
import {
  applyDesignChanges,
  checkRequirements,
  roundSignificant,
  solveForValues,
  type SolvedValue,
} from '@/features/requirements';
import { evaluateDesign } from '@/features/solver';
import type { Design } from '@/shared/design';
import type { RequirementId } from '@/shared/requirements';
import { makeDesign } from '../solver/fixtures';
import { littrowDesign } from './littrow-fixture';

const D_NM = 1e6 / 1200;
/** Littrow at 500 nm: RLD = d cos β / (m f) = 833.33 × √0.91 / 500 (Palmer & Loewen, ch. 2). */
const RLD_500 = (D_NM * Math.sqrt(0.91)) / 500;

function valueFor(design: Design, requirement: RequirementId): SolvedValue {
  const value = solveForValues(design).find((v) => v.requirement === requirement);
  expect(value, `a value for ${requirement}`).toBeDefined();
  return value!;
}

function statusAfter(design: Design, value: SolvedValue, requirement: RequirementId) {
  return checkRequirements(applyDesignChanges(design, value.changes)).checks.find((c) => c.id === requirement)?.status;
}

describe('solveForValues', () => {
  it('slit widths for a bandpass: w = bandpass / RLD, both slits together', () => {
    // Palmer & Loewen, ch. 9: bandpass = RLD × w with matched slits: 0.1 nm / 1.58990 nm/mm =
    // 62.897 µm; offered cut to three figures, 62.8 µm.
    const design = littrowDesign({ maxBandpassNm: 0.1, atWavelengthsNm: [500] });
    expect(checkRequirements(design).checks[0]?.status).toBe('fail');
    const value = valueFor(design, 'maxBandpassNm');
    expect(value.changes).toEqual([
      { path: 'slits.entranceWidthUm', value: 62.8 },
      { path: 'slits.exitWidthUm', value: 62.8 },
    ]);
    expect(0.1 / RLD_500).toBeCloseTo(0.062897, 6);
    expect(value.text).toBe('Exit and entrance slits 62.8\u00A0µm meet bandpass ≤ 0.1\u00A0nm (was 100\u00A0µm)');
    expect(statusAfter(design, value, 'maxBandpassNm')).toBe('pass');
  });

  it('keeps the slits’ ratio when they differ', () => {
    const design = littrowDesign({ maxBandpassNm: 0.1, atWavelengthsNm: [500] });
    design.slits.entranceWidthUm = 50;
    const value = valueFor(design, 'maxBandpassNm');
    const [entrance, exit] = value.changes.map((c) => c.value) as [number, number];
    // The exit slit (wider) sets the bandpass: 62.8 µm as above, the entrance half of it.
    expect(exit).toBe(62.8);
    expect(entrance).toBeCloseTo(31.4, 1);
    expect(statusAfter(design, value, 'maxBandpassNm')).toBe('pass');
  });

  it('slit widths for a resolving power: the bandpass left once the diffraction limit is taken out', () => {
    // R = λ / √(bp² + (λ/mN)²) (common practice) ⇒ bp = √((500/2500)² − (500/60 000)²) = 0.199826 nm,
    // w = 0.199826 / 1.58990 = 125.69 µm: the slits may open from 100 µm (offered cut to 125 µm).
    const design = littrowDesign({ minResolvingPower: 2500, atWavelengthsNm: [500] });
    const value = valueFor(design, 'minResolvingPower');
    const exit = value.changes.find((c) => c.path === 'slits.exitWidthUm')?.value ?? 0;
    expect(exit).toBe(125);
    expect(statusAfter(design, value, 'minResolvingPower')).toBe('pass');
  });

  it('offers nothing where passing slits could open by less than 5 % (rounding, not a design change)', () => {
    // As above with R = 3000: bp = √((500/3000)² − (500/60 000)²) = 0.166458 nm, w = 104.70 µm,
    // only 4.7 % wider than the 100 µm slits that already pass.
    const design = littrowDesign({ minResolvingPower: 3000, atWavelengthsNm: [500] });
    expect(solveForValues(design).find((v) => v.requirement === 'minResolvingPower')).toBeUndefined();
  });

  it('offers no slit width for a resolving power beyond |m|N (no slit reaches it)', () => {
    // |m|N = 60 000: no slit width gives more.
    const design = littrowDesign({ minResolvingPower: 61_000, atWavelengthsNm: [500] });
    expect(solveForValues(design).find((v) => v.requirement === 'minResolvingPower')).toBeUndefined();
  });

  it('focal length for a reciprocal dispersion: f = d cos β / (m RLD), both at once for one lens', () => {
    // 833.33 × 0.953939 / 1.5 = 529.97 mm, offered rounded up to 530 mm.
    const design = littrowDesign({ maxReciprocalDispersionNmPerMm: 1.5, atWavelengthsNm: [500] });
    const value = valueFor(design, 'maxReciprocalDispersionNmPerMm');
    expect(value.changes).toEqual([
      { path: 'layout.collimatorFocalMm', value: 530 },
      { path: 'layout.cameraFocalMm', value: 530 },
    ]);
    expect(statusAfter(design, value, 'maxReciprocalDispersionNmPerMm')).toBe('pass');
  });

  it('camera focal length alone in a Czerny–Turner, checked over the whole range', () => {
    const design = makeDesign({ requirements: { maxReciprocalDispersionNmPerMm: 2 } });
    const value = valueFor(design, 'maxReciprocalDispersionNmPerMm');
    expect(value.changes.map((c) => c.path)).toEqual(['layout.cameraFocalMm']);
    expect(value.changes[0]!.value).toBeGreaterThan(300);
    expect(value.text).toMatch(/^Camera focal length .* meets reciprocal dispersion ≤ 2\u00A0nm\/mm \(was 300\u00A0mm\)$/);
    expect(statusAfter(design, value, 'maxReciprocalDispersionNmPerMm')).toBe('pass');
  });

  it('pixels for one-shot coverage from the detector geometry, not the centre dispersion', () => {
    // Grating set for 500 nm (sin α = sin β_c = 0.3). At fixed α, sin β(400) = 0.48 − 0.3 = 0.18 and
    // sin β(600) = 0.42; x = f tan(β − β_c) = 62.171 and 64.734 mm (detector.ts's model). The
    // farther end sets the half-width: 2 × 64.734 / 0.025 = 5178.75 → 5179 pixels.
    const design = littrowDesign({ oneShotCoverage: true });
    const value = valueFor(design, 'oneShotCoverage');
    expect(value.changes).toEqual([{ path: 'detector.pixelCount', value: 5179 }]);
    expect(statusAfter(design, value, 'oneShotCoverage')).toBe('pass');
    // One pixel fewer misses the range end.
    const short = applyDesignChanges(design, [{ path: 'detector.pixelCount', value: 5178 }]);
    expect(checkRequirements(short).checks[0]?.status).toBe('fail');
  });

  it('the coma-free camera angle, when the design’s differs, and none when it matches', () => {
    const design = makeDesign();
    const value = solveForValues(design).find((v) => v.id === 'comaBalance:cameraOffAxis');
    expect(value?.requirement).toBeNull();
    const applied = applyDesignChanges(design, value!.changes);
    const residual = evaluateDesign(applied, { points: 2 }).design.aberrations.comaResidualAtCentreDeg;
    // Rounded to 0.01°, so within 0.005° of the angle (Shafer, Megill & Droppleman's condition).
    expect(Math.abs(residual ?? 1)).toBeLessThanOrEqual(0.005);
    expect(solveForValues(applied).find((v) => v.id === 'comaBalance:cameraOffAxis')).toBeUndefined();
  });

  it('every value offered for the spec’s example makes its requirement pass', () => {
    const design = makeDesign({
      requirements: { maxBandpassNm: 0.25, minResolvingPower: 2000, oneShotCoverage: true, maxReciprocalDispersionNmPerMm: 2.6 },
    });
    const values = solveForValues(design).filter((v) => v.requirement !== null);
    expect(values.map((v) => v.requirement)).toEqual([
      'maxBandpassNm',
      'minResolvingPower',
      'maxReciprocalDispersionNmPerMm',
      'oneShotCoverage',
    ]);
    for (const value of values) expect(statusAfter(design, value, value.requirement!)).toBe('pass');
  });

  it('rounds to significant figures in the safe direction', () => {
    expect(roundSignificant(62.897, 3, 'down')).toBe(62.8);
    expect(roundSignificant(529.97, 3, 'up')).toBe(530);
    expect(roundSignificant(0.0012345, 3, 'up')).toBe(0.00124);
  });
});
