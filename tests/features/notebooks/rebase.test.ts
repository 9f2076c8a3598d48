import { describe, expect, it } from 'vitest';
import { editedCopy, plainDesign } from '../../support/design-edits';
import type { Design } from '../../../shared/design';
import { conflictRows, reapplyEdits } from '../../../features/notebooks/rebase';

const base = plainDesign;
const edit = (changes: (d: Design) => void): Design => editedCopy(changes);

describe('rebasing unsaved edits on a newer version', () => {
  it('keeps the newer version’s changes and re-applies mine where we touched different fields', () => {
    const mine = edit((d) => (d.slits.exitWidthUm = 25));
    const latest = edit((d) => (d.grating.grooveDensityPerMm = 1800));
    const result = reapplyEdits(base, mine, latest);
    expect(result.design.grating.grooveDensityPerMm).toBe(1800);
    expect(result.design.slits.exitWidthUm).toBe(25);
    expect(result.applied).toEqual(['slits.exitWidthUm']);
    expect(result.overridden).toEqual([]);
  });

  it('reports a field both changed to different values, and keeps mine', () => {
    const mine = edit((d) => (d.slits.exitWidthUm = 25));
    const latest = edit((d) => (d.slits.exitWidthUm = 100));
    const result = reapplyEdits(base, mine, latest);
    expect(result.design.slits.exitWidthUm).toBe(25);
    expect(result.overridden).toEqual([{ path: 'slits.exitWidthUm', latest: 100, mine: 25 }]);
  });

  it('does not call it a clash when both made the same change', () => {
    const same = edit((d) => (d.range.endNm = 700));
    expect(reapplyEdits(base, same, same).overridden).toEqual([]);
  });

  it('re-applies an optional field I removed', () => {
    const mine = edit((d) => delete d.grating.blazeWavelengthNm);
    const result = reapplyEdits(base, mine, base);
    expect(result.design.grating.blazeWavelengthNm).toBeUndefined();
  });

  it('shows latest and mine side by side for every differing field', () => {
    const rows = conflictRows(edit((d) => (d.slits.heightMm = 2)), edit((d) => (d.range.startNm = 400)));
    expect(rows).toEqual([
      { path: 'range.startNm', label: 'Range: start (nm)', latest: 400, mine: 380 },
      { path: 'slits.heightMm', label: 'Slits: height (mm)', latest: 4, mine: 2 },
    ]);
  });
});
