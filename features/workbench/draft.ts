import { z } from 'zod';
import type { Design } from '@/shared/design';
// Not the ui index: that would pull React Native components into the unit tests.
import { persistedState } from '@/features/ui/persisted-state';
import { designToForm, formValuesSchema } from './form-model';
import { defaultPreset } from './presets';

/** Where the workbench keeps its scratch design; the entry carries its own version. */
export const SCRATCH_KEY = 'blazebook.scratch-design';
/** Where releases before the versioned entries kept it, as a bare draft. */
const LEGACY_SCRATCH_KEY = 'blazebook.scratch-design.v1';

const text = z.string().max(200);

/** One workbench draft: what notebooks keep beside their own fields, too. */
export const draftSchema = z.object({
  values: formValuesSchema,
  /** The wavelength the summary card shows, as typed. */
  selectedNm: text,
  presetId: z.string().nullable(),
});

export type Draft = z.infer<typeof draftSchema>;

/** A draft that starts from a stored design, read out at the centre of its range. */
export function draftFromDesign(design: Design, presetId: string | null = null): Draft {
  return {
    values: designToForm(design),
    selectedNm: String((design.range.startNm + design.range.endNm) / 2),
    presetId,
  };
}

export function initialDraft(): Draft {
  return draftFromDesign(defaultPreset.design, defaultPreset.id);
}

const scratch = persistedState({
  version: 1,
  schema: draftSchema,
  legacy: (_key, readOld) => {
    const value = readOld(LEGACY_SCRATCH_KEY);
    return value === undefined ? null : { value, keys: [LEGACY_SCRATCH_KEY] };
  },
});

/** The scratch design as it was left, or the default preset when there is none (or it is unreadable). */
export function loadDraft(): Draft {
  return scratch.read(SCRATCH_KEY) ?? initialDraft();
}

export function saveDraft(draft: Draft): boolean {
  return scratch.write(SCRATCH_KEY, draft);
}
