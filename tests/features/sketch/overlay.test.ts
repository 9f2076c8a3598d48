import { describe, expect, it } from 'vitest';
import { sketchGeometry } from '../../../features/sketch/geometry';
import { overlaySketchScenes } from '../../../features/sketch/overlay';
import { buildSketchScene } from '../../../features/sketch/sketch-scene';
import { colors } from '../../../features/ui/theme';
import { exampleDesign, type Design } from '../../../shared/design';

const longerCamera: Design = { ...exampleDesign, layout: { ...exampleDesign.layout, cameraFocalMm: 450 } };

describe('two versions on one sketch', () => {
  const before = sketchGeometry(exampleDesign);
  const after = sketchGeometry(longerCamera);
  const overlay = overlaySketchScenes(before, after, { widthPx: 600 });

  it('draws both at one scale, set by the larger of the two mounts', () => {
    const alone = buildSketchScene(after, { widthPx: 600 });
    // The 450 mm camera reaches further than the 300 mm one, so the later mount sets the extent.
    expect(overlay.pxPerMm).toBeCloseTo(alone.pxPerMm, 9);
    const shrunk = overlaySketchScenes(after, before, { widthPx: 600 });
    expect(shrunk.pxPerMm).toBeCloseTo(overlay.pxPerMm, 9);
  });

  it('puts the earlier version beneath, unlabelled and in dashed grey', () => {
    const earlier = overlay.shapes.filter((s) => s.key.startsWith('before-'));
    expect(earlier.length).toBeGreaterThan(5);
    expect(earlier.every((s) => s.type === 'path' && s.stroke === colors.inkFaint && s.dash)).toBe(true);
    const firstLater = overlay.shapes.findIndex((s) => !s.key.startsWith('before-'));
    expect(firstLater).toBe(earlier.length);
  });

  it('keeps the later version exactly as it is drawn alone on the common extent', () => {
    const later = overlay.shapes.filter((s) => !s.key.startsWith('before-'));
    const bounds = {
      minX: Math.min(before.bounds.minX, after.bounds.minX),
      minY: Math.min(before.bounds.minY, after.bounds.minY),
      maxX: Math.max(before.bounds.maxX, after.bounds.maxX),
      maxY: Math.max(before.bounds.maxY, after.bounds.maxY),
    };
    expect(later).toEqual(buildSketchScene({ ...after, bounds }, { widthPx: 600 }).shapes);
  });
});
