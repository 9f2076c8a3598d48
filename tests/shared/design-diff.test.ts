import { describe, expect, it } from 'vitest';
import { editedCopy, plainDesign } from '../support/design-edits';
import type { Design } from '@/shared/design';
import {
  changedPaths,
  describedChanges,
  designChanges,
  flattenDesign,
  unflattenDesign,
} from '@/shared/design-diff';

const base = plainDesign;
const edit = (changes: (d: Design) => void): Design => editedCopy(changes);

describe('the design diff', () => {
  it('finds nothing between a design and its copy', () => {
    expect(designChanges(base, structuredClone(base))).toEqual([]);
    expect(changedPaths(base, structuredClone(base))).toEqual([]);
  });

  it('lists changed values in the order of the first design, then values only the second has', () => {
    const after = edit((d) => {
      d.slits.exitWidthUm = 25;
      d.grating.order = -1;
      delete d.grating.blazeWavelengthNm;
      d.layout.cameraOffAxisDeg = 10;
    });
    expect(designChanges(base, after)).toEqual([
      { path: 'grating.order', before: 1, after: -1 },
      { path: 'grating.blazeWavelengthNm', before: 500, after: null },
      { path: 'layout.cameraOffAxisDeg', before: null, after: 10 },
      { path: 'slits.exitWidthUm', before: 50, after: 25 },
    ]);
  });

  it('reports a section on one side only field by field, with null on the missing side', () => {
    const after = edit((d) => (d.detector = { pixelPitchUm: 25, pixelCount: 1024 }));
    expect(designChanges(base, after)).toEqual([
      { path: 'detector.pixelPitchUm', before: null, after: 25 },
      { path: 'detector.pixelCount', before: null, after: 1024 },
    ]);
    expect(designChanges(after, base).map((change) => change.after)).toEqual([null, null]);
  });

  it('sorts changed paths for the editor and the rebase', () => {
    const after = edit((d) => {
      d.slits.heightMm = 2;
      d.range.startNm = 400;
      d.grating.ruledWidthMm = 50;
    });
    expect(changedPaths(base, after)).toEqual(['grating.ruledWidthMm', 'range.startNm', 'slits.heightMm']);
  });

  it('names each change the way the compare and conflict tables do', () => {
    const after = edit((d) => {
      d.slits.exitWidthUm = 25;
      d.layout.kind = 'littrow';
    });
    expect(describedChanges(base, after)).toEqual([
      { path: 'layout.kind', label: 'Layout: kind', before: 'czerny-turner', after: 'littrow' },
      { path: 'slits.exitWidthUm', label: 'Slits: exit width (µm)', before: 50, after: 25 },
    ]);
  });

  it('flattens to dotted paths without absent values, and back', () => {
    const flat = flattenDesign(base);
    expect(flat['slits.exitWidthUm']).toBe(50);
    expect('layout.collimatorOffAxisDeg' in flat).toBe(false);
    expect(Object.keys(flat).some((path) => path.startsWith('source'))).toBe(false);
    expect(unflattenDesign(flat)).toEqual(base);
  });

  describe('order-sorting filters (a list of records)', () => {
    const filter = (cutOnNm: number, inFromNm: number, inToNm: number) =>
      ({ kind: 'long-pass', cutOnNm, inFromNm, inToNm, edgeWidthNm: 10 }) as const;
    const withFilters = edit((d) => {
      d.filters = [filter(395, 400, 780), filter(770, 780, 900)];
    });

    it('finds nothing between two designs whose filters are equal but not the same objects', () => {
      expect(designChanges(withFilters, structuredClone(withFilters))).toEqual([]);
    });

    it('names a changed filter field by its filter and field', () => {
      const after = structuredClone(withFilters);
      after.filters![1]!.cutOnNm = 765;
      expect(describedChanges(withFilters, after)).toEqual([
        { path: 'filters.1.cutOnNm', label: 'Filter 2: cut-on (nm)', before: 770, after: 765 },
      ]);
    });

    it('reports an added or removed filter field by field', () => {
      const fewer = structuredClone(withFilters);
      fewer.filters!.pop();
      expect(changedPaths(withFilters, fewer)).toEqual([
        'filters.1.cutOnNm',
        'filters.1.edgeWidthNm',
        'filters.1.inFromNm',
        'filters.1.inToNm',
        'filters.1.kind',
      ]);
    });

    it('flattens to indexed paths and back to the same list', () => {
      const flat = flattenDesign(withFilters);
      expect(flat['filters.1.inFromNm']).toBe(780);
      expect(unflattenDesign(flat)).toEqual(withFilters);
    });
  });
});
