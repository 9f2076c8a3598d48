import { radToDeg } from '../solver';
import type { GratingFrame } from './grating-frame';
import type { AngleArc } from './sketch-types';

/** α and β from the normal (one `α = β` arc in Littrow) and K from the bisector; none without a setting. */
export function angleArcs(frame: GratingFrame): AngleArc[] {
  if (!frame.setting.reachable) return [];
  const { halfDeviationRad: K, incidenceRad: alpha, normalRad, bisectorRad, shorterFocalMm: fMin } = frame;
  const beta = frame.rotationRad - K;
  const fromNormal = (label: AngleArc['label'], angleRad: number, radiusMm: number): AngleArc => ({
    label,
    valueDeg: radToDeg(angleRad),
    centre: { x: 0, y: 0 },
    radiusMm,
    fromRad: normalRad,
    toRad: normalRad + angleRad,
  });
  if (!(K > 0)) return [fromNormal('α = β', alpha, 0.3 * fMin)];
  return [
    fromNormal('α', alpha, 0.3 * fMin),
    fromNormal('β', beta, 0.38 * fMin),
    {
      label: 'K',
      valueDeg: radToDeg(K),
      centre: { x: 0, y: 0 },
      radiusMm: 0.22 * fMin,
      fromRad: bisectorRad,
      toRad: bisectorRad + K,
    },
  ];
}
