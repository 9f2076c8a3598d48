// The pure module, not the plots' index: that one brings the React components along.
import { requirementShading, type RequirementShade, type ShadedPlot } from '@/features/plots/requirement-shading';
import { evaluateDesign, sweepWavelengthsNm } from '@/features/solver';
import type { Design } from '@/shared/design';

type Values = (number | null)[];
export type ComparedMetric = { a: Values; b: Values; domain: [number, number] | null };
export type ComparedSeries = {
  wavelengthsNm: number[];
  bandpassNm: ComparedMetric;
  reciprocalDispersionNmPerMm: ComparedMetric;
  resolvingPower: ComparedMetric;
  blazeEfficiency: ComparedMetric;
  /**
   * Where the after version (b) misses its own requirements on this axis, per plot (as the
   * workbench hatches it); null when it states none.
   */
  failingB: Record<ShadedPlot, RequirementShade> | null;
};

function extent(...lists: Values[]): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const list of lists) {
    for (const v of list) {
      if (v === null || !Number.isFinite(v)) continue;
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
  }
  if (lo > hi) return null;
  if (hi === lo) return [lo - (Math.abs(lo) * 0.05 || 1), hi + (Math.abs(hi) * 0.05 || 1)];
  return [lo, hi];
}

/**
 * Both designs over one wavelength axis (the union of their ranges), so two versions share a
 * plot: each is drawn only inside its own range, and both series share one value scale.
 */
export function compareSeries(a: Design, b: Design, points = 121): ComparedSeries {
  const startNm = Math.min(a.range.startNm, b.range.startNm);
  const endNm = Math.max(a.range.endNm, b.range.endNm);
  const wavelengthsNm = sweepWavelengthsNm(startNm, endNm, points);
  const evalA = evaluateDesign(a, { wavelengthsNm }).points;
  const evalB = evaluateDesign(b, { wavelengthsNm }).points;
  const inside = (design: Design, nm: number) => nm >= design.range.startNm - 1e-9 && nm <= design.range.endNm + 1e-9;
  const pick = (key: 'bandpassNm' | 'reciprocalDispersionNmPerMm' | 'resolvingPower' | 'blazeEfficiency'): ComparedMetric => {
    const va = evalA.map((p, i) => (inside(a, wavelengthsNm[i] as number) ? p[key] : null));
    const vb = evalB.map((p, i) => (inside(b, wavelengthsNm[i] as number) ? p[key] : null));
    return { a: va, b: vb, domain: extent(va, vb) };
  };
  // Only b's own range is judged: outside it the design is not asked to meet anything.
  const pointsB = evalB.filter((_, i) => inside(b, wavelengthsNm[i] as number));
  return {
    wavelengthsNm,
    failingB: requirementShading(pointsB, b),
    bandpassNm: pick('bandpassNm'),
    reciprocalDispersionNmPerMm: pick('reciprocalDispersionNmPerMm'),
    resolvingPower: pick('resolvingPower'),
    blazeEfficiency: pick('blazeEfficiency'),
  };
}
