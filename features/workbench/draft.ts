import { z } from 'zod';
import { LAYOUT_KINDS } from '@/shared/design';
import { designToForm, type FormValues } from './form-model';
import { defaultPreset } from './presets';
import { draftStorage } from './storage';

/** Where the scratch design lives until notebooks exist; versioned so a format change can migrate. */
export const DRAFT_KEY = 'blazebook.scratch-design.v1';

const text = z.string().max(200);
const formValuesSchema = z.object({
  grating: z.object({
    grooveDensityPerMm: text,
    order: text,
    blazeWavelengthNm: text,
    ruledWidthMm: text,
    ruledHeightMm: text,
  }),
  layout: z.object({
    kind: z.enum(LAYOUT_KINDS),
    deviationAngleDeg: text,
    collimatorFocalMm: text,
    cameraFocalMm: text,
    collimatorOffAxisDeg: text,
    cameraOffAxisDeg: text,
  }),
  slits: z.object({ entranceWidthUm: text, exitWidthUm: text, heightMm: text }),
  range: z.object({ startNm: text, endNm: text }),
  source: z.object({ minNm: text, maxNm: text }),
  detector: z.object({ pixelPitchUm: text, pixelCount: text }),
}) satisfies z.ZodType<FormValues>;

const draftSchema = z.object({
  values: formValuesSchema,
  /** The wavelength the summary card shows, as typed. */
  selectedNm: text,
  presetId: z.string().nullable(),
});

export type Draft = z.infer<typeof draftSchema>;

export function initialDraft(): Draft {
  const { design } = defaultPreset;
  return {
    values: designToForm(design),
    selectedNm: String((design.range.startNm + design.range.endNm) / 2),
    presetId: defaultPreset.id,
  };
}

/** The saved scratch design, or the default preset when there is none or it cannot be read. */
export function loadDraft(): Draft {
  const raw = draftStorage.read(DRAFT_KEY);
  if (!raw) return initialDraft();
  try {
    const parsed = draftSchema.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data : initialDraft();
  } catch {
    return initialDraft();
  }
}

export function saveDraft(draft: Draft): boolean {
  return draftStorage.write(DRAFT_KEY, JSON.stringify(draft));
}
