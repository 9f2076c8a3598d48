import type { Design } from '../../shared/design';
import { radToDeg } from '../solver';
import { defaultOffAxisRad } from './place-optics';
import { formatDeg } from './sketch-format';

/**
 * Plain-words remarks about the off-axis angles the drawing used where the design gives none
 * (or gives ones it cannot draw), naming each mirror's angle as drawn.
 */
export function sketchNotes(layout: Design['layout'], halfDeviationRad: number): string[] {
  if (layout.kind === 'czerny-turner') {
    const collimator = layout.collimatorOffAxisDeg;
    const camera = layout.cameraOffAxisDeg;
    if (collimator !== undefined && camera !== undefined) return [];
    const fallback = formatDeg(radToDeg(defaultOffAxisRad(halfDeviationRad)));
    if (collimator === undefined && camera === undefined) {
      return [
        `Mirror off-axis angles not given: collimator and camera both drawn at ${fallback}, which puts the slits level with the grating.`,
      ];
    }
    if (camera === undefined) {
      return [
        `Camera off-axis angle not given: drawn at ${fallback}, which puts the exit slit level with the grating; collimator drawn at ${formatDeg(collimator as number)} as given.`,
      ];
    }
    return [
      `Collimator off-axis angle not given: drawn at ${fallback}, which puts the entrance slit level with the grating; camera drawn at ${formatDeg(camera)} as given.`,
    ];
  }
  if (layout.kind === 'ebert-fastie') {
    if (layout.collimatorOffAxisDeg === undefined && layout.cameraOffAxisDeg === undefined) return [];
    return [
      `One mirror, used twice: it is drawn at K/2 = ${formatDeg(radToDeg(halfDeviationRad / 2))} on both sides, where both zones lie on one sphere; the design's own off-axis angle is not drawn.`,
    ];
  }
  return [];
}
