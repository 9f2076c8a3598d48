import { describe, expect, it } from 'vitest';
import { sketchGeometry } from '../../../features/sketch/geometry';
import { boxesOverlap, declutterTexts, textBox } from '../../../features/sketch/scene-declutter';
import { buildSketchScene, type SketchShape } from '../../../features/sketch/sketch-scene';
import { LAYOUT_KINDS, exampleDesign, type Design, type LayoutKind } from '../../../shared/design';

type TextShape = Extract<SketchShape, { type: 'text' }>;

function texts(design: Design, widthPx: number): TextShape[] {
  const scene = buildSketchScene(sketchGeometry(design), { widthPx });
  return scene.shapes.filter((s): s is TextShape => s.type === 'text');
}

function overlaps(list: readonly TextShape[]): string[] {
  const found: string[] = [];
  for (let i = 0; i < list.length; i++) {
    for (let j = i + 1; j < list.length; j++) {
      const a = list[i] as TextShape;
      const b = list[j] as TextShape;
      if (boxesOverlap(textBox(a), textBox(b))) found.push(`"${a.text}" on "${b.text}"`);
    }
  }
  return found;
}

function withLayout(kind: LayoutKind, deviationAngleDeg: number, offAxis: boolean): Design {
  const focal = exampleDesign.layout.collimatorFocalMm;
  return {
    ...exampleDesign,
    layout: {
      kind,
      deviationAngleDeg: kind === 'littrow' ? 0 : deviationAngleDeg,
      collimatorFocalMm: focal,
      cameraFocalMm: kind === 'czerny-turner' ? 450 : focal,
      ...(offAxis ? { collimatorOffAxisDeg: 6, cameraOffAxisDeg: 8 } : {}),
    },
  };
}

describe('labels of the sketch', () => {
  it('never lands on each other: every mount, deviation from 0 up, phone to wide', () => {
    const problems: string[] = [];
    for (const kind of LAYOUT_KINDS) {
      for (const deviation of [0, 2, 10, 24, 60]) {
        for (const offAxis of [true, false]) {
          for (const widthPx of [240, 326, 900]) {
            const found = overlaps(texts(withLayout(kind, deviation, offAxis), widthPx));
            if (found.length > 0) problems.push(`${kind} ${deviation}° ${widthPx}px: ${found.join(', ')}`);
          }
        }
      }
    }
    expect(problems).toEqual([]);
  }, 30_000);

  it('at a Czerny–Turner deviation of 0 keeps the collimator and the camera names apart', () => {
    // Equal focal lengths at deviation 0: both mirrors sit at one place, as the issue found them.
    const design = withLayout('czerny-turner', 0, false);
    const list = texts({ ...design, layout: { ...design.layout, cameraFocalMm: design.layout.collimatorFocalMm } }, 326);
    const collimator = list.find((t) => t.text === 'Collimator');
    const camera = list.find((t) => t.text === 'Camera');
    expect(collimator && camera).toBeTruthy();
    expect(boxesOverlap(textBox(collimator as TextShape), textBox(camera as TextShape))).toBe(false);
  });

  it('moves a later label off an earlier one and leaves labels that are clear alone', () => {
    const label = (key: string, x: number, y: number): TextShape => ({
      type: 'text',
      key,
      x,
      y,
      text: 'Collimator',
      fontSize: 11,
      anchor: 'middle',
      fill: '#000',
      weight: 'semibold',
    });
    const out = declutterTexts(
      [label('a-0', 100, 100), label('b-0', 100, 100), label('c-0', 100, 200)],
      [],
      { widthPx: 300, heightPx: 300 },
    ) as TextShape[];
    expect(out[0]).toEqual(label('a-0', 100, 100));
    expect(boxesOverlap(textBox(out[0] as TextShape), textBox(out[1] as TextShape))).toBe(false);
    expect(out[2]).toEqual(label('c-0', 100, 200));
  });
});

describe('notes under the sketch', () => {
  const ct = (collimatorOffAxisDeg?: number, cameraOffAxisDeg?: number): Design => ({
    ...exampleDesign,
    layout: {
      kind: 'czerny-turner',
      deviationAngleDeg: 24,
      collimatorFocalMm: 300,
      cameraFocalMm: 300,
      ...(collimatorOffAxisDeg === undefined ? {} : { collimatorOffAxisDeg }),
      ...(cameraOffAxisDeg === undefined ? {} : { cameraOffAxisDeg }),
    },
  });

  it('names the angle used for each mirror when only the collimator angle is given', () => {
    const [note] = sketchGeometry(ct(6)).notes;
    // K = 12°, which the drawing uses for the camera; the collimator keeps its own 6°.
    expect(note).toMatch(/^Camera off-axis angle not given: drawn at 12\.00°/);
    expect(note).toMatch(/collimator drawn at 6\.00° as given/);
    expect(note).not.toMatch(/Mirror off-axis angles not given/);
  });

  it('names the angle used for each mirror when only the camera angle is given', () => {
    const [note] = sketchGeometry(ct(undefined, 9)).notes;
    expect(note).toMatch(/^Collimator off-axis angle not given: drawn at 12\.00°/);
    expect(note).toMatch(/camera drawn at 9\.00° as given/);
  });

  it('says both mirrors take the default when neither angle is given, and nothing when both are', () => {
    expect(sketchGeometry(ct()).notes[0]).toMatch(/collimator and camera both drawn at 12\.00°/);
    expect(sketchGeometry(ct(6, 8)).notes).toEqual([]);
  });

  it('speaks of one mirror, never a camera, for an Ebert–Fastie', () => {
    const design: Design = {
      ...exampleDesign,
      layout: { kind: 'ebert-fastie', deviationAngleDeg: 24, collimatorFocalMm: 300, cameraFocalMm: 300, collimatorOffAxisDeg: 6, cameraOffAxisDeg: 6 },
    };
    const geometry = sketchGeometry(design);
    expect(geometry.notes.join(' ')).not.toMatch(/camera/i);
    expect(geometry.notes.join(' ')).toMatch(/One mirror, used twice/);
  });
});
