import type { Design } from '../../shared/design';
import { formatDeg, formatMm, formatNm, formatSketchNumber } from './sketch-format';
import type { SketchGeometry } from './sketch-types';

/** One line naming the mount and its main figures, for screen readers and file titles. */
export function describeSketch(geometry: SketchGeometry, design: Design): string {
  const name =
    geometry.kind === 'czerny-turner'
      ? 'Czerny–Turner'
      : geometry.kind === 'littrow'
        ? 'Littrow'
        : 'Ebert–Fastie';
  const { grating, layout } = design;
  const optics =
    geometry.kind === 'littrow'
      ? `lens of ${formatMm(layout.collimatorFocalMm)} focal length`
      : geometry.kind === 'ebert-fastie'
        ? `one mirror of ${formatMm(layout.collimatorFocalMm)} focal length, used twice`
        : `collimator ${formatMm(layout.collimatorFocalMm)}, camera ${formatMm(layout.cameraFocalMm)}`;
  const parts = [
    `${name} layout to scale`,
    `${formatSketchNumber(grating.grooveDensityPerMm)} grooves/mm grating ${formatMm(grating.ruledWidthMm)} wide`,
    optics,
    geometry.settingReachable
      ? `grating turned ${formatDeg(geometry.rotationDeg)} for ${formatNm(geometry.settingNm)}`
      : `no grating angle delivers ${formatNm(geometry.settingNm)}`,
  ];
  if (geometry.rays.length > 0) {
    parts.push(`rays drawn for ${geometry.rays.map((r) => formatNm(r.wavelengthNm)).join(', ')}`);
  }
  if (geometry.unreachable.length > 0) {
    parts.push(`not drawn: ${geometry.unreachable.map((r) => formatNm(r.wavelengthNm)).join(', ')}`);
  }
  return `${parts.join('; ')}.`;
}
