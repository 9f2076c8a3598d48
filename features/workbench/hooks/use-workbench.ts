import { useEffect, useMemo, useState } from 'react';
import { useForm, useWatch, type FieldErrors as FormErrors, type Resolver } from 'react-hook-form';
import {
  evaluateDesign,
  loadUnitParser,
  parseQuantity,
  unitParserReady,
  type Evaluation,
  type WavelengthPoint,
} from '@/features/solver';
import type { Design } from '@/shared/design';
import type { FieldErrors } from '@/shared/validation';
import type { Draft } from '../draft';
import { designToForm, formToDesign, readForm, type FormResult, type FormValues } from '../form-model';
import { defaultPreset, type Preset } from '../presets';

/** Points along the range for the plots and the sketch's live redraw. */
export const PLOT_POINTS = 200;
/** Rows of the range table. */
export const TABLE_ROWS = 11;

/** Flat `{ 'slits.exitWidthUm': why }` → react-hook-form's nested error tree. */
function nestErrors(fields: FieldErrors): FormErrors<FormValues> {
  const tree: Record<string, Record<string, { type: string; message: string }>> = {};
  for (const [path, message] of Object.entries(fields)) {
    const [section, key] = path.split('.');
    if (!section || !key) continue;
    (tree[section] ??= {})[key] = { type: 'validate', message };
  }
  return tree as FormErrors<FormValues>;
}

/** The editor's resolver: the shared design schema, behind the unit parser. */
export const designResolver: Resolver<FormValues> = (values) => {
  const result = readForm(values);
  return result.ok ? { values, errors: {} } : { values: {}, errors: nestErrors(result.fields) };
};

export type SelectedReadout =
  { ok: true; wavelengthNm: number; point: WavelengthPoint } | { ok: false; message: string };

/**
 * The workbench's state: the typed text (kept in local storage on every change), the design it
 * makes, and the results of the last design that passed the schema — so a bad value dims the
 * results instead of blanking them.
 */
export function useWorkbench(initial: () => Draft, onDraftChange: (draft: Draft) => void) {
  const [start] = useState(initial);
  const form = useForm<FormValues>({
    defaultValues: start.values,
    mode: 'onChange',
    resolver: designResolver,
  });
  const values = useWatch({ control: form.control }) as FormValues;
  const [selectedText, setSelectedText] = useState(start.selectedNm);
  const [presetId, setPresetId] = useState<string | null>(start.presetId);

  // The unit parser arrives as its own chunk after the first paint; until then only plain numbers
  // are read, and a field with units says it is waiting.
  const [unitsReady, setUnitsReady] = useState(unitParserReady);
  useEffect(() => {
    if (unitsReady) return;
    let live = true;
    void loadUnitParser().then(() => {
      if (!live) return;
      setUnitsReady(true);
      void form.trigger();
    });
    return () => {
      live = false;
    };
  }, [unitsReady, form]);

  // eslint-disable-next-line react-hooks/exhaustive-deps -- unitsReady changes how the same text reads
  const result: FormResult = useMemo(() => readForm(values), [values, unitsReady]);
  const [lastValid, setLastValid] = useState<Design>(() => {
    const first = formToDesign(start.values);
    // A stored draft that is refused still opens with its text in the fields; the results start
    // from the default preset until the text passes.
    return first.ok ? first.design : defaultPreset.design;
  });
  if (result.ok && result.design !== lastValid) setLastValid(result.design);

  const shown = result.ok ? result.design : lastValid;
  const evaluation: Evaluation = useMemo(() => evaluateDesign(shown, { points: PLOT_POINTS }), [shown]);
  const table = useMemo(() => evaluateDesign(shown, { points: TABLE_ROWS }).points, [shown]);

  const selected: SelectedReadout = useMemo(() => {
    const parsed = parseQuantity(selectedText, 'nm');
    if (!parsed.ok) return { ok: false, message: parsed.message };
    if (parsed.value <= 0) return { ok: false, message: 'must be greater than 0' };
    const point = evaluateDesign(shown, { wavelengthsNm: [parsed.value] }).points[0] as WavelengthPoint;
    return { ok: true, wavelengthNm: parsed.value, point };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- unitsReady changes how the same text reads
  }, [selectedText, shown, unitsReady]);

  useEffect(() => {
    onDraftChange({ values, selectedNm: selectedText, presetId });
  }, [values, selectedText, presetId, onDraftChange]);

  function applyPreset(preset: Preset) {
    const previous = form.getValues();
    form.reset(designToForm(preset.design));
    setPresetId(preset.id);
    setSelectedText(String((preset.design.range.startNm + preset.design.range.endNm) / 2));
    return previous;
  }

  function restore(previous: FormValues) {
    form.reset(previous);
    setPresetId(null);
  }

  return {
    form,
    values,
    result,
    /** Field path → reason, when the typed design is refused. */
    blockedBy: result.ok ? null : result.fields,
    design: shown,
    evaluation,
    table,
    selectedText,
    setSelectedText,
    selected,
    presetId,
    applyPreset,
    restore,
  };
}

export type Workbench = ReturnType<typeof useWorkbench>;
