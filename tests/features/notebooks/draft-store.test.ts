import { describe, expect, it, vi } from 'vitest';
import { exampleDesign } from '@/shared/design';
import { draftFromDesign } from '@/features/workbench/draft';
import {
  clearEdits,
  freshEdits,
  loadEdits,
  notebookDraftKey,
  notesAreNew,
  saveEdits,
  startFromNotes,
} from '@/features/notebooks/draft-store';
import { withFakeLocalStorage } from '../../support/fake-local-storage';

// The workbench's door also exports its screens; React Native cannot load in Node.
vi.mock('@/features/workbench', async () => ({ draftSchema: (await import('@/features/workbench/draft')).draftSchema }));

const local = withFakeLocalStorage();

describe('unsaved notebook edits', () => {
  const key = notebookDraftKey('user-1', 'design-1');
  const draft = draftFromDesign(exampleDesign);
  const edits = { draft, baseVersion: 3, notes: 'Narrower slit', message: 'Try 20 µm' };

  it('keep the draft, the version it started from and the text in one entry', () => {
    saveEdits(key, edits);
    expect(loadEdits(key)).toEqual(edits);
    expect([...local.items.keys()]).toEqual([key]);
    clearEdits(key);
    expect(loadEdits(key)).toBeNull();
  });

  it('are taken over from the two keys older releases split them over, once', () => {
    local.items.set('blazebook.notebook.v1.user-1.design-1', JSON.stringify(draft));
    local.items.set(
      'blazebook.notebook.v1.user-1.design-1.meta',
      JSON.stringify({ baseVersion: 3, notes: 'Narrower slit', message: 'Try 20 µm' }),
    );
    expect(loadEdits(key)).toEqual(edits);
    expect([...local.items.keys()]).toEqual([key]);
    expect(loadEdits(key)).toEqual(edits);
  });

  it('drop old edits that were made on no known version, as before', () => {
    local.items.set('blazebook.notebook.v1.user-1.design-1', JSON.stringify(draft));
    expect(loadEdits(key)).toBeNull();
    expect(local.items.size).toBe(0);
  });

  it('belong to one user and one design', () => {
    saveEdits(key, edits);
    expect(loadEdits(notebookDraftKey('user-2', 'design-1'))).toBeNull();
    expect(loadEdits(notebookDraftKey('user-1', 'design-2'))).toBeNull();
  });
});

describe('the notes of a new version', () => {
  const v2Notes = '# Why\nThe doublet is **0.6 nm** apart.';

  it('start empty, with the parameters of the version they follow', () => {
    const draft = draftFromDesign(exampleDesign);
    const start = freshEdits(draft, 2);
    expect(start).toEqual({ draft, baseVersion: 2, notes: '', message: '' });
  });

  it('take the earlier notes on request when nothing is typed yet', () => {
    expect(startFromNotes('', v2Notes)).toBe(v2Notes);
    expect(startFromNotes('  \n', v2Notes)).toBe(v2Notes);
  });

  it('keep what was already typed, below the earlier notes', () => {
    expect(startFromNotes('Entrance slit 30 µm now.', v2Notes)).toBe(`${v2Notes}\n\nEntrance slit 30 µm now.`);
  });

  it('change nothing when asked twice, or when the earlier version had no notes', () => {
    const once = startFromNotes('Entrance slit 30 µm now.', v2Notes);
    expect(startFromNotes(once, v2Notes)).toBe(once);
    expect(startFromNotes('Mine', '')).toBe('Mine');
  });

  it.each([
    { notes: '', earlier: v2Notes, isNew: false },
    { notes: '   ', earlier: '', isNew: false },
    { notes: v2Notes, earlier: v2Notes, isNew: false },
    { notes: `${v2Notes}\n`, earlier: v2Notes, isNew: false },
    { notes: `${v2Notes}\n\nAnd a narrower slit.`, earlier: v2Notes, isNew: true },
    { notes: 'Anything', earlier: '', isNew: true },
  ] satisfies { notes: string; earlier: string; isNew: boolean }[])(
    'count as a change only when they say something the earlier ones did not ($notes)',
    ({ notes, earlier, isNew }) => {
      expect(notesAreNew(notes, earlier)).toBe(isNew);
    },
  );
});
