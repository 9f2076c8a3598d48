import { describe, expect, it } from 'vitest';
import { editedCopy, plainDesign } from '../support/design-edits';
import type { Design } from '@/shared/design';
import type { DesignCurve } from '@/shared/curves';
import {
  changedPaths,
  curvePointsOf,
  describedChanges,
  designChanges,
  flattenDesign,
  unflattenDesign,
} from '@/shared/design-diff';
import { editorFieldName, editorSectionTitle, formatChangeAt, formatParam, formatParamAt, formatStoredValue } from '@/shared/design-values';

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

  describe('the light input', () => {
    const withFibre = edit((d) => (d.input = { kind: 'fibre', numericalAperture: 0.22, coreDiameterUm: 200 }));

    it('names a changed input field in the editor’s words and shows its value with its unit', () => {
      const after = structuredClone(withFibre);
      after.input = { kind: 'fibre', numericalAperture: 0.12, coreDiameterUm: 100 };
      expect(describedChanges(withFibre, after)).toEqual([
        { path: 'input.coreDiameterUm', label: 'Light input: core diameter (µm)', before: 200, after: 100 },
        { path: 'input.numericalAperture', label: 'Light input: numerical aperture', before: 0.22, after: 0.12 },
      ]);
      expect(editorFieldName('input.numericalAperture')).toBe('Light input: numerical aperture');
      expect(editorSectionTitle('input.kind')).toBe('Light input');
      expect(formatStoredValue('input.coreDiameterUm', 200)).toBe('200\u00a0µm');
      expect(formatParamAt('input.numericalAperture', 0.22)).toBe('0.22');
    });

    it('reads a missing input as taken as matched and a kind by its chip’s label', () => {
      const lens = edit((d) => (d.input = { kind: 'lens', fNumber: 4 }));
      const changes = designChanges(base, lens);
      expect(changes).toEqual([
        { path: 'input.kind', before: null, after: 'lens' },
        { path: 'input.fNumber', before: null, after: 4 },
      ]);
      expect(formatParamAt('input.kind', null)).toBe('not given: taken as matched');
      expect(formatParamAt('input.kind', 'lens')).toBe('Lens');
      expect(formatParamAt('input.kind', 'free-space')).toBe('Free space');
      expect(formatChangeAt('input.fNumber', 4, 2.5)).toBe('4 → 2.5');
    });

    it('re-applies through flatten and back', () => {
      expect(unflattenDesign(flattenDesign(withFibre))).toEqual(withFibre);
      expect(flattenDesign(withFibre)['input.numericalAperture']).toBe(0.22);
    });
  });

  describe('measured curves (each with up to 5,000 points)', () => {
    const spread = (n: number, fromNm: number, toNm: number) => Array.from({ length: n }, (_, i) => fromNm + ((toNm - fromNm) * i) / (n - 1));
    const curve = (n: number, toNm = 900): DesignCurve => ({
      kind: 'grating-efficiency',
      name: 'Bench grating',
      checksum: 'c'.repeat(64),
      medium: 'air',
      wavelengthsNm: spread(n, 300, toNm),
      values: spread(n, 0.2, 0.7),
    });
    const mirror: DesignCurve = { ...curve(3), kind: 'mirror-reflectance', name: 'Mirrors', mirror: 'both' };
    const before = edit((d) => (d.curves = [mirror, curve(412)]));

    it('finds nothing between equal curves that are not the same objects', () => {
      expect(designChanges(before, structuredClone(before))).toEqual([]);
    });

    it('takes a curve’s points as one change, worded by count and span, never the numbers', () => {
      const after = edit((d) => (d.curves = [mirror, curve(415)]));
      const changes = describedChanges(before, after);
      expect(changes.map((c) => [c.path, c.label])).toEqual([['curves.1.points', 'Curve 2 (grating efficiency): points']]);
      const [change] = changes;
      expect(curvePointsOf(change!.before)?.wavelengthsNm).toHaveLength(412);
      expect(formatChangeAt(change!.path, change!.before, change!.after)).toBe('points changed: 412 → 415 points, 300–900\u00a0nm');
      expect(formatParamAt(change!.path, change!.after)).toBe('415 points, 300–900\u00a0nm');
      const wider = edit((d) => (d.curves = [mirror, curve(412, 1000)]));
      const [widerChange] = designChanges(before, wider);
      expect(formatChangeAt(widerChange!.path, widerChange!.before, widerChange!.after)).toBe(
        'points changed: 412 points, 300–900\u00a0nm → 412 points, 300–1000\u00a0nm',
      );
    });

    it('names a curve’s other fields with the curve’s kind, and formats them as the curve list does', () => {
      const after = structuredClone(before);
      after.curves![1]!.name = 'Bench grating, remeasured';
      after.curves![1]!.polarisation = 'te';
      expect(describedChanges(before, after)).toEqual([
        { path: 'curves.1.name', label: 'Curve 2 (grating efficiency): name', before: 'Bench grating', after: 'Bench grating, remeasured' },
        { path: 'curves.1.polarisation', label: 'Curve 2 (grating efficiency): polarisation', before: null, after: 'te' },
      ]);
      expect(editorFieldName('curves.1.name', before, after)).toBe('Curve 2 (grating efficiency): name');
      expect(formatParamAt('curves.1.polarisation', 'te')).toBe('TE');
      expect(formatParamAt('curves.1.kind', 'detector-response')).toBe('detector response (quantum efficiency)');
      expect(formatParamAt('curves.1.checksum', 'c'.repeat(64))).toBe('cccccccccccc…');
      expect(editorSectionTitle('curves.1.name')).toBe('Measured curves');
    });

    it('reports an added curve field by field, its points as one value', () => {
      const after = edit((d) => (d.curves = [mirror, curve(412), { ...curve(20), name: 'Third' }]));
      expect(changedPaths(before, after)).toEqual([
        'curves.2.checksum',
        'curves.2.kind',
        'curves.2.medium',
        'curves.2.name',
        'curves.2.points',
      ]);
    });

    it('flattens a curve’s points to one value and back to the same two lists, number for number', () => {
      const flat = flattenDesign(before);
      expect(Object.keys(flat).filter((path) => path.startsWith('curves.1.'))).toEqual([
        'curves.1.kind',
        'curves.1.name',
        'curves.1.checksum',
        'curves.1.medium',
        'curves.1.points',
      ]);
      expect(unflattenDesign(flat)).toEqual(before);
      // A rebase re-applies the points whole: mine, never their wavelengths with my values.
      const mine = edit((d) => (d.curves = [mirror, curve(415)]));
      const merged = unflattenDesign({ ...flattenDesign(before), 'curves.1.points': flattenDesign(mine)['curves.1.points'] });
      expect(merged.curves![1]).toEqual(mine.curves![1]);
    });

    it('prints a long list of numbers by its length and span wherever it is met', () => {
      const text = formatParam(spread(5000, 300, 900));
      expect(text).toBe('5000 numbers, 300–900');
      expect(text.length).toBeLessThan(40);
      expect(formatParam([404.7, 546.1])).toBe('404.7, 546.1');
      expect(formatParam([])).toBe('none');
    });
  });
});
