import { useCallback, useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import { useForm, useWatch, type FieldErrors as FormErrors, type Resolver } from 'react-hook-form';
import {
  evaluateDesign,
  loadUnitParser,
  parseQuantity,
  unitParserReady,
  type Evaluation,
  type WavelengthPoint,
} from '@/features/solver';
import { checkRequirements, hasRequirements, solveForValues, type DesignChange } from '@/features/requirements';
import type { Design, LayoutKind } from '@/shared/design';
import type { OrderSortingFilter } from '@/shared/filters';
import { formatMachineNumber } from '@/shared/format';
import type { FieldErrors } from '@/shared/validation';
import type { Draft } from '../draft';
import { filtersToText, type FiltersText } from '../filter-fields';
import { blankInputText, type DraftCurves, type InputText } from '../input-fields';
import { designToForm, formToDesign, readForm, type FormResult, type FormValues } from '../form-model';
import { rememberDeviation, switchDeviation, type DeviationMemory } from '../mount-switch';
import { defaultPreset, type Preset } from '../presets';
import { followRange, outsideRangeMessage, withReadoutPoint } from '../readout-wavelength';

/** Points along the range for the plots and the sketch's live redraw. */
export const PLOT_POINTS = 200;
/** Rows of the range table. */
export const TABLE_ROWS = 11;

/** Flat `{ 'slits.exitWidthUm': why }` → react-hook-form's nested error tree. */
function nestErrors(fields: FieldErrors): FormErrors<FormValues> {
  type Tree = { [key: string]: Tree | { type: string; message: string } };
  const tree: Tree = {};
  for (const [path, message] of Object.entries(fields)) {
    const keys = path.split('.');
    // A whole section (or the requirements block) has no field of its own to hold the message.
    if (keys.length < 2) continue;
    let node = tree;
    for (const key of keys.slice(0, -1)) node = (node[key] ??= {}) as Tree;
    node[keys[keys.length - 1] as string] = { type: 'validate', message };
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
  const [selectedText, setSelectedTextState] = useState(start.selectedNm);
  // The wavelength the user last chose (typed, tapped or from a preset); the read-out follows a
  // range change away from it and back to it.
  const [wantedNm, setWantedNm] = useState<number | null>(() => readNm(start.selectedNm));
  const [readoutNote, setReadoutNote] = useState<string | null>(null);
  const setSelectedText = useCallback((text: string) => {
    setSelectedTextState(text);
    setWantedNm(readNm(text));
    setReadoutNote(null);
  }, []);
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

  // A new range that no longer holds the read-out moves it to the nearer end, and says so.
  const rangeKey = `${shown.range.startNm}|${shown.range.endNm}`;
  const [rangeSeen, setRangeSeen] = useState(rangeKey);
  if (rangeKey !== rangeSeen) {
    setRangeSeen(rangeKey);
    if (wantedNm !== null) {
      const moved = followRange(wantedNm, readNm(selectedText), shown.range);
      if (moved.note) {
        setSelectedTextState(formatMachineNumber(moved.nm));
        setReadoutNote(moved.note);
      }
    }
  }

  const sweep: Evaluation = useMemo(() => evaluateDesign(shown, { points: PLOT_POINTS }), [shown]);
  const table = useMemo(() => evaluateDesign(shown, { points: TABLE_ROWS }).points, [shown]);

  const selected: SelectedReadout = useMemo(() => {
    const parsed = parseQuantity(selectedText, 'nm');
    if (!parsed.ok) return { ok: false, message: parsed.message };
    if (parsed.value <= 0) return { ok: false, message: 'must be greater than 0' };
    const outside = outsideRangeMessage(parsed.value, shown.range);
    if (outside) return { ok: false, message: outside };
    const point = evaluateDesign(shown, { wavelengthsNm: [parsed.value] }).points[0] as WavelengthPoint;
    return { ok: true, wavelengthNm: parsed.value, point };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- unitsReady changes how the same text reads
  }, [selectedText, shown, unitsReady]);

  // Checked on the design on screen (the last valid one while the text is refused). Solving for
  // values takes tens of ms (a search per offer), so the checks may trail typing by a frame.
  const checked = useDeferredValue(shown);
  const requirementsSet = useMemo(() => hasRequirements(checked), [checked]);
  const requirementsReport = useMemo(() => checkRequirements(checked), [checked]);
  const solveOffers = useMemo(
    () => (requirementsSet ? solveForValues(checked, requirementsReport) : []),
    [checked, requirementsSet, requirementsReport],
  );

  // The plots sample the range; the read-out's own wavelength joins their samples.
  const evaluation = useMemo(() => withReadoutPoint(sweep, selected.ok ? selected.point : null), [sweep, selected]);

  // Each mount keeps the last deviation typed for it, so a switch never leaves a two-mirror mount at 0.
  const deviationMemory = useRef<DeviationMemory>(
    rememberDeviation({}, start.values.layout.kind, start.values.layout.deviationAngleDeg),
  );
  const switchMount = useCallback(
    (kind: LayoutKind) => {
      const current = form.getValues('layout');
      const next = switchDeviation(deviationMemory.current, current.kind, current.deviationAngleDeg, kind);
      deviationMemory.current = next.memory;
      form.setValue('layout.kind', kind, { shouldDirty: true });
      form.setValue('layout.deviationAngleDeg', next.deviationText, { shouldValidate: true, shouldDirty: true });
    },
    [form],
  );

  useEffect(() => {
    onDraftChange({ values, selectedNm: selectedText, presetId });
  }, [values, selectedText, presetId, onDraftChange]);

  /** Loads a whole design into the editor (a preset, a search candidate); returns the text it replaced, for an undo. */
  function openDesign(design: Design, fromPresetId: string | null = null) {
    const previous = form.getValues();
    form.reset(designToForm(design));
    deviationMemory.current = rememberDeviation(
      deviationMemory.current,
      design.layout.kind,
      String(design.layout.deviationAngleDeg),
    );
    setPresetId(fromPresetId);
    setSelectedText(String((design.range.startNm + design.range.endNm) / 2));
    return previous;
  }

  function applyPreset(preset: Preset) {
    return openDesign(preset.design, preset.id);
  }

  /** Sets fields to solved values, checked like typing; returns the text they replaced, for an undo. */
  function applyChanges(changes: readonly DesignChange[]) {
    const previous = form.getValues();
    for (const change of changes) {
      form.setValue(change.path as Parameters<typeof form.setValue>[0], formatMachineNumber(change.value), {
        shouldValidate: true,
        shouldDirty: true,
      });
    }
    return previous;
  }

  /** Replaces the filter rows, checked like typing; returns the text they replaced, for an undo. */
  function setFilterRows(rows: FiltersText) {
    const previous = form.getValues();
    form.setValue('filters', rows, { shouldValidate: true, shouldDirty: true });
    return previous;
  }

  /** Chooses how light reaches the slit ('' for none); the other kinds' typed text is kept for a switch back. */
  function setInputKind(kind: InputText['kind']) {
    const previous = form.getValues();
    form.setValue('input', { ...(previous.input ?? blankInputText()), kind }, { shouldValidate: true, shouldDirty: true });
    return previous;
  }

  /** Replaces the attached curves (null for none); returns the replaced text, for an undo. */
  function setCurves(curves: DraftCurves) {
    const previous = form.getValues();
    form.setValue('curves', curves, { shouldValidate: true, shouldDirty: true });
    return previous;
  }

  /** Replaces the design's filters (a proposed plan; undefined for none); returns the replaced text, for an undo. */
  function applyFilters(filters: readonly OrderSortingFilter[] | undefined) {
    return setFilterRows(filtersToText(filters));
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
    /**
     * The plain sweep, without the read-out's point: arrays that run alongside its points (the light
     * budget's factors) stay aligned with them.
     */
    sweep,
    table,
    selectedText,
    setSelectedText,
    selected,
    /** Says why the read-out wavelength moved after a range change; null otherwise. */
    readoutNote,
    switchMount,
    presetId,
    applyPreset,
    openDesign,
    applyChanges,
    applyFilters,
    setFilterRows,
    setInputKind,
    setCurves,
    restore,
    requirementsSet,
    requirementsReport,
    solveOffers,
  };
}

export type Workbench = ReturnType<typeof useWorkbench>;

/** A plain wavelength in nm from the read-out's text, or null while it does not read as one. */
function readNm(text: string): number | null {
  const parsed = parseQuantity(text, 'nm');
  return parsed.ok && parsed.value > 0 ? parsed.value : null;
}
