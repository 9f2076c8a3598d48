/**
 * How each requirement's worst figure moves with each parameter: one finite difference per
 * parameter, a stated step forward, on the ordinary solver. Read as a partial derivative times
 * the step ("+10 µm exit slit → +0.016 nm bandpass"); the sign says which way to turn the knob.
 */

import type { Design } from '../../shared/design';
import { formatNumber, withUnit } from '../../shared/format';
import type { RequirementId } from '../../shared/requirements';
import { evaluateDesign } from '../solver';
import { REQUIREMENT_POINTS, checkRequirements } from './check';
import { applyDesignChanges, type DesignChange } from './design-change';
import { designFootprintMm } from './footprint';

/** The key figures followed when a design has no requirements. */
export type KeyFigure = 'bandpass' | 'reciprocalDispersion' | 'resolvingPower';

export interface SensitivityEffect {
  requirement: RequirementId | KeyFigure;
  /** Worst value after the step minus before, in the figure's unit. */
  delta: number;
  /** Change of the requirement's margin (a fraction of its limit, positive = more headroom); null for key figures. */
  marginDelta: number | null;
  /** "+10 µm exit slit → +0.016 nm bandpass". */
  text: string;
}

export interface SensitivityRow {
  /** The design field stepped (Littrow and Ebert–Fastie step both focal lengths: one optic). */
  path: string;
  /** "+10 µm exit slit". */
  stepText: string;
  effects: SensitivityEffect[];
}

interface Step {
  path: string;
  stepText: string;
  changes: (design: Design) => DesignChange[];
}

const singleOptic = (design: Design) => design.layout.kind === 'littrow' || design.layout.kind === 'ebert-fastie';

const focalStep = (design: Design, path: string): DesignChange[] => {
  const paths = singleOptic(design) ? ['layout.collimatorFocalMm', 'layout.cameraFocalMm'] : [path];
  return paths.map((p) => ({
    path: p,
    value: (p === 'layout.cameraFocalMm' ? design.layout.cameraFocalMm : design.layout.collimatorFocalMm) + 10,
  }));
};

function steps(design: Design): Step[] {
  const out: Step[] = [
    {
      path: 'slits.exitWidthUm',
      stepText: '+10\u00A0µm exit slit',
      changes: (d) => [{ path: 'slits.exitWidthUm', value: d.slits.exitWidthUm + 10 }],
    },
    {
      path: 'slits.entranceWidthUm',
      stepText: '+10\u00A0µm entrance slit',
      changes: (d) => [{ path: 'slits.entranceWidthUm', value: d.slits.entranceWidthUm + 10 }],
    },
  ];
  if (singleOptic(design)) {
    out.push({
      path: 'layout.collimatorFocalMm',
      stepText: '+10\u00A0mm focal length',
      changes: (d) => focalStep(d, 'layout.collimatorFocalMm'),
    });
  } else {
    out.push(
      {
        path: 'layout.cameraFocalMm',
        stepText: '+10\u00A0mm camera focal length',
        changes: (d) => focalStep(d, 'layout.cameraFocalMm'),
      },
      {
        path: 'layout.collimatorFocalMm',
        stepText: '+10\u00A0mm collimator focal length',
        changes: (d) => focalStep(d, 'layout.collimatorFocalMm'),
      },
    );
  }
  out.push({
    path: 'grating.grooveDensityPerMm',
    stepText: '+1\u202F% groove density',
    changes: (d) => [{ path: 'grating.grooveDensityPerMm', value: d.grating.grooveDensityPerMm * 1.01 }],
  });
  // A Littrow mount's deviation is 0 by definition; past 179° the step leaves the schema.
  if (design.layout.kind !== 'littrow' && design.layout.deviationAngleDeg < 179) {
    out.push({
      path: 'layout.deviationAngleDeg',
      stepText: '+1° deviation',
      changes: (d) => [{ path: 'layout.deviationAngleDeg', value: d.layout.deviationAngleDeg + 1 }],
    });
  }
  out.push({
    path: 'grating.ruledWidthMm',
    stepText: '+5\u00A0mm ruled width',
    changes: (d) => [{ path: 'grating.ruledWidthMm', value: d.grating.ruledWidthMm + 5 }],
  });
  return out;
}

/** Each followed figure's words and unit. */
const FIGURES: Record<RequirementId | KeyFigure, { noun: string; unit: string }> = {
  maxBandpassNm: { noun: 'bandpass', unit: 'nm' },
  bandpass: { noun: 'bandpass', unit: 'nm' },
  minResolvingPower: { noun: 'resolving power', unit: '' },
  resolvingPower: { noun: 'resolving power', unit: '' },
  minBlazeEfficiency: { noun: 'blaze efficiency', unit: '' },
  minRelativeThroughput: { noun: 'relative throughput', unit: '' },
  maxFNumber: { noun: 'f-number', unit: '' },
  maxFocalLengthMm: { noun: 'focal length', unit: 'mm' },
  maxFootprintMm: { noun: 'footprint', unit: 'mm' },
  minPixelsPerBandpass: { noun: 'pixels per bandpass', unit: '' },
  oneShotCoverage: { noun: 'coverage', unit: '' },
  maxWavelengthErrorNm: { noun: 'wavelength error', unit: 'nm' },
  maxReciprocalDispersionNmPerMm: { noun: 'reciprocal dispersion', unit: 'nm/mm' },
  reciprocalDispersion: { noun: 'reciprocal dispersion', unit: 'nm/mm' },
  orderOverlap: { noun: 'overlapping orders', unit: '' },
};

interface Figure {
  key: RequirementId | KeyFigure;
  value: number;
  /** For requirements: the limit and whether it caps the figure from above. */
  limit: number | null;
  kind: 'max' | 'min' | null;
  /** Footprint: which dimension is followed. */
  noun: string;
}

const MIN_KEYED: ReadonlySet<string> = new Set([
  'minResolvingPower',
  'minBlazeEfficiency',
  'minRelativeThroughput',
  'minPixelsPerBandpass',
]);

/** The worst value of each numeric requirement, or of the key figures when there are none. */
function figures(design: Design, footprintDimension: 'widthMm' | 'depthMm' | null): Figure[] {
  const report = checkRequirements(design);
  if (report.checks.length > 0) {
    const out: Figure[] = [];
    for (const check of report.checks) {
      if (check.id === 'maxFootprintMm' && footprintDimension && design.requirements?.maxFootprintMm) {
        const limit = design.requirements.maxFootprintMm[footprintDimension];
        out.push({
          key: check.id,
          value: designFootprintMm(design)[footprintDimension],
          limit,
          kind: 'max',
          noun: `footprint ${footprintDimension === 'widthMm' ? 'width' : 'depth'}`,
        });
        continue;
      }
      // Yes/no requirements and overlap counts have no figure to differentiate.
      if (check.worst === null || check.limit === null || check.id === 'orderOverlap') continue;
      out.push({
        key: check.id,
        value: check.worst,
        limit: check.limit,
        kind: MIN_KEYED.has(check.id) ? 'min' : 'max',
        noun: FIGURES[check.id].noun,
      });
    }
    return out;
  }
  const points = evaluateDesign(design, { points: REQUIREMENT_POINTS }).points.filter((p) => p.reachable);
  if (points.length === 0) return [];
  const pick = (key: KeyFigure, values: number[], worst: (...v: number[]) => number): Figure => ({
    key,
    value: worst(...values),
    limit: null,
    kind: null,
    noun: FIGURES[key].noun,
  });
  return [
    pick('bandpass', points.map((p) => p.bandpassNm ?? 0), Math.max),
    pick('reciprocalDispersion', points.map((p) => p.reciprocalDispersionNmPerMm ?? 0), Math.max),
    pick('resolvingPower', points.map((p) => p.resolvingPower ?? Infinity), Math.min),
  ];
}

/** The footprint dimension with less headroom, followed through every step so the row compares like with like. */
function footprintDimension(design: Design): 'widthMm' | 'depthMm' | null {
  const limit = design.requirements?.maxFootprintMm;
  if (!limit) return null;
  const { widthMm, depthMm } = designFootprintMm(design);
  return (limit.widthMm - widthMm) / limit.widthMm <= (limit.depthMm - depthMm) / limit.depthMm ? 'widthMm' : 'depthMm';
}

/** "+0.016 nm", "−120": signed, two figures, true minus. */
export function signedText(delta: number, unit: string): string {
  const text = `${delta > 0 ? '+' : ''}${formatNumber(delta, 2)}`;
  return withUnit(text, unit);
}

/**
 * Below this fraction of the figure a difference is rounding or the sweep's sampling (a worst
 * value at a stationary point moves by parts per billion), not an effect.
 */
const NO_CHANGE = 1e-6;

/**
 * For each parameter, the finite-difference change of each requirement's worst value (the key
 * figures bandpass, reciprocal dispersion and resolving power at their worst when there are no
 * requirements) for a step of +10 µm slit, +10 mm focal length, +1 % groove density,
 * +1° deviation or +5 mm ruled width.
 */
export function requirementSensitivities(design: Design): SensitivityRow[] {
  const dimension = footprintDimension(design);
  const before = figures(design, dimension);
  return steps(design).map((step) => {
    const after = new Map(figures(applyDesignChanges(design, step.changes(design)), dimension).map((f) => [f.key, f]));
    const effects: SensitivityEffect[] = [];
    for (const figure of before) {
      const moved = after.get(figure.key);
      if (!moved) continue;
      const raw = moved.value - figure.value;
      const delta = Math.abs(raw) <= NO_CHANGE * Math.abs(figure.value) ? 0 : raw;
      const { unit } = FIGURES[figure.key];
      const marginDelta =
        figure.limit === null || figure.kind === null
          ? null
          : delta === 0
            ? 0
          : ((figure.kind === 'max' ? -1 : 1) * delta) / figure.limit;
      effects.push({
        requirement: figure.key,
        delta,
        marginDelta,
        text:
          delta === 0
            ? `${step.stepText} → no change in ${figure.noun}`
            : `${step.stepText} → ${signedText(delta, unit)} ${figure.noun}`,
      });
    }
    return { path: step.path, stepText: step.stepText, effects };
  });
}
