import type { Design } from '../../shared/design';
import { radToDeg } from '../solver';
import { defaultOffAxisRad } from './place-optics';
import { formatDeg } from './sketch-format';

/** Plain-words remarks about the off-axis angles the drawing chose instead of the design's. */
export function sketchNotes(layout: Design['layout'], halfDeviationRad: number): string[] {
  if (layout.kind === 'czerny-turner') {
    if (layout.collimatorOffAxisDeg !== undefined && layout.cameraOffAxisDeg !== undefined) return [];
    const fallback = defaultOffAxisRad(halfDeviationRad);
    return [
      `Mirror off-axis angles not given: drawn at ${formatDeg(radToDeg(fallback))}, which puts the slits level with the grating.`,
    ];
  }
  if (layout.kind === 'ebert-fastie') {
    if (layout.collimatorOffAxisDeg === undefined && layout.cameraOffAxisDeg === undefined) return [];
    return [
      `One mirror fixes both off-axis angles at K/2 = ${formatDeg(radToDeg(halfDeviationRad / 2))}; the design's own off-axis angles are not drawn.`,
    ];
  }
  return [];
}
