import { z } from 'zod';
import type { Design } from '@/shared/design';
import { designToForm, formValuesSchema } from './form-model';
import { defaultPreset } from './presets';
import { draftStorage } from './storage';

/** Where the scratch design lives until notebooks exist; versioned so a format change can migrate. */
export const DRAFT_KEY = 'blazebook.scratch-design.v1';

const text = z.string().max(200);

const draftSchema = z.object({
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

/**
 * The draft kept under `key`, or `fallback` when there is none or it cannot be read. Notebooks
 * keep one per user and design, so a reload or a lost connection loses no unsaved edit.
 */
export function loadDraft(key: string = DRAFT_KEY, fallback: () => Draft = initialDraft): Draft {
  const raw = draftStorage.read(key);
  if (!raw) return fallback();
  try {
    const parsed = draftSchema.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data : fallback();
  } catch {
    return fallback();
  }
}

export function saveDraft(draft: Draft, key: string = DRAFT_KEY): boolean {
  return draftStorage.write(key, JSON.stringify(draft));
}

export function clearDraft(key: string): void {
  draftStorage.remove(key);
}
