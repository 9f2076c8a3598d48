import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '../../../features/solver';
import { nearestIndex } from '../../../features/plots/plot-paths';
import {
  clampToRange,
  followRange,
  outsideRangeMessage,
  withReadoutPoint,
} from '../../../features/workbench/readout-wavelength';
import { exampleDesign } from '../../../shared/design';
import { UNIT_SPACE } from '../../../shared/format';

const range = { startNm: 250, endNm: 800 };

describe('the read-out wavelength and the range', () => {
  it.each([
    { wanted: 580, nm: 580 },
    { wanted: 900, nm: 800 },
    { wanted: 200, nm: 250 },
    { wanted: 250, nm: 250 },
  ] satisfies { wanted: number; nm: number }[])('clamps $wanted nm into 250–800 nm as $nm nm', ({ wanted, nm }) => {
    expect(clampToRange(wanted, range)).toBe(nm);
  });

  it('moves the read-out to the nearer end and says so when the range no longer holds it', () => {
    const moved = followRange(580, 580, { startNm: 600, endNm: 900 });
    expect(moved.nm).toBe(600);
    expect(moved.note).toBe(`Read-out moved from 580${UNIT_SPACE}nm to 600${UNIT_SPACE}nm: the range now starts there.`);
    expect(followRange(580, 580, { startNm: 300, endNm: 500 }).note).toMatch(/to 500\snm: the range now ends there/);
  });

  it('stays put, silently, while the range still holds it', () => {
    expect(followRange(580, 580, range)).toEqual({ nm: 580, note: null });
  });

  it('comes back to the wavelength chosen once the range holds it again', () => {
    const back = followRange(580, 500, range);
    expect(back.nm).toBe(580);
    expect(back.note).toMatch(/back at 580\snm/);
  });

  it('refuses a typed wavelength outside the range, naming the range', () => {
    expect(outsideRangeMessage(900, range)).toBe(`must be within the wavelength range, 250–800${UNIT_SPACE}nm`);
    expect(outsideRangeMessage(800, range)).toBeNull();
  });

  it('puts the read-out wavelength among the plotted samples, so the plots read out that very wavelength', () => {
    const design = { ...exampleDesign, range };
    const sweep = evaluateDesign(design, { points: 200 });
    const wavelengths = sweep.points.map((p) => p.wavelengthNm);
    // 580 nm is not one of the 200 samples: the plots would name the nearest one instead.
    expect(wavelengths).not.toContain(580);
    const point = evaluateDesign(design, { wavelengthsNm: [580] }).points[0] ?? null;
    const merged = withReadoutPoint(sweep, point).points.map((p) => p.wavelengthNm);
    expect(merged).toHaveLength(201);
    expect(merged).toEqual([...merged].sort((a, b) => a - b));
    expect(merged[nearestIndex(merged, 580)]).toBe(580);
    // A wavelength already sampled is not added twice.
    const end = evaluateDesign(design, { wavelengthsNm: [800] }).points[0] ?? null;
    expect(withReadoutPoint(sweep, end).points).toHaveLength(200);
  });
});
