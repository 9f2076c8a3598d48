import { describe, expect, it } from 'vitest';
import { SCRATCH_KEY, draftFromDesign, initialDraft, loadDraft, saveDraft } from '@/features/workbench/draft';
import { exampleDesign } from '@/shared/design';
import { withFakeLocalStorage } from '../../support/fake-local-storage';

const local = withFakeLocalStorage();

describe('the scratch draft', () => {
  const draft = { ...draftFromDesign(exampleDesign), selectedNm: '612.5' };

  it('comes back as it was saved', () => {
    saveDraft(draft);
    expect(loadDraft()).toEqual(draft);
  });

  it('starts from the default preset when there is none', () => {
    expect(loadDraft()).toEqual(initialDraft());
  });

  it('is taken over from the key older releases kept it under, once', () => {
    local.items.set('blazebook.scratch-design.v1', JSON.stringify(draft));
    expect(loadDraft()).toEqual(draft);
    expect(local.items.has('blazebook.scratch-design.v1')).toBe(false);
    expect(JSON.parse(local.items.get(SCRATCH_KEY) ?? 'null')).toEqual({ version: 1, value: draft });
  });

  it('falls back to the default preset when the stored draft does not parse, and drops it', () => {
    local.items.set(SCRATCH_KEY, JSON.stringify({ version: 1, value: { values: 'nonsense' } }));
    expect(loadDraft()).toEqual(initialDraft());
    expect(local.items.has(SCRATCH_KEY)).toBe(false);
  });
});
