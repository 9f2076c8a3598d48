import { describe, expect, it, vi } from 'vitest';
import { exampleDesign } from '@/shared/design';
import { draftFromDesign } from '@/features/workbench/draft';
import { clearEdits, loadEdits, notebookDraftKey, saveEdits } from '@/features/notebooks/draft-store';
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
