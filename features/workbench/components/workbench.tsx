import {
  useCallback,
  useDeferredValue,
  useEffect,
  useLayoutEffect,
  useMemo,
  useRef,
  useState,
  type ReactNode,
} from 'react';
import { ScrollView, StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
// The file, not the notebooks index: that index reaches back into this feature.
import { SaveToNotebook } from '@/features/notebooks/components/save-to-notebook';
import { CalibrationCard } from '@/features/calibration';
import { CandidateSearchPanel } from '@/features/candidates';
import { LightBudgetCard, type CurveLibrary } from '@/features/light-budget';
import { OrderSortingCard } from '@/features/order-sorting';
import { PerformancePlots } from '@/features/plots';
import { TradeStudyCard } from '@/features/selectors';
import { CautionsCard } from '@/features/safety';
import { RaySketch, SaveSketchButton } from '@/features/sketch';
import { ImageQualityCard } from '@/features/trace/ui';
import { Card, colors, space, useLayout } from '@/features/ui';
import type { Design } from '@/shared/design';
import type { OrderSortingFilter } from '@/shared/filters';
import type { Draft } from '../draft';
import { useFieldMarks } from '../field-marks';
import type { FormResult, FormValues } from '../form-model';
import { useWorkbench } from '../hooks/use-workbench';
import { measureEditEnd } from '../perf-marks';
import type { Preset } from '../presets';
import { filterToText } from '../filter-fields';
import { BlockedNote } from './blocked-note';
import { FilterRowFields } from './filter-row-fields';
import { InputFields } from './input-fields';
import type { InputTextKey } from '../input-fields';
import type { DesignCurve } from '@/shared/curves';
import { DesignEditor } from './design-editor';
import { PresetPicker } from './preset-picker';
import { RangeTable } from './range-table';
import { RequirementsCard, type SolveOffer } from './requirements-card';
import { SensitivityCard } from './sensitivity-card';
import { ReadoutCard } from './readout-card';
import { SummaryBar } from './summary-bar';
import { WarningList } from './warning-list';

/** Width of a column, measured after layout, for the sketch and plots to fit. */
function useWidth(initial: number) {
  const [width, setWidth] = useState(initial);
  const onLayout = useCallback((event: LayoutChangeEvent) => {
    const next = Math.round(event.nativeEvent.layout.width);
    setWidth((current) => (Math.abs(current - next) >= 1 ? next : current));
  }, []);
  return [width, onLayout] as const;
}

export type WorkbenchProps = {
  /** The draft to start from (read once, on mount; remount with a `key` to start over). */
  initial: () => Draft;
  /** Called with the typed text on every change, e.g. to keep it in local storage. */
  onDraftChange: (draft: Draft) => void;
  /** Told the typed design, or why it is refused, whenever it changes. */
  onResultChange?: (result: FormResult) => void;
  /** Above the editor: the page's heading and its own controls. */
  header: ReactNode;
  /** Reviewers, viewers and share links see the design without editing it. */
  readOnly?: boolean;
  /** Offer the starting presets (the scratch page). */
  showPresets?: boolean;
  /** A pane beside the editor on tablet and wide layouts (the review panel); phones use a sheet instead. */
  aside?: ReactNode;
  /** Saves a search candidate as a new version of the open notebook; absent where there is none. */
  onSaveCandidate?: (design: Design, message: string) => Promise<void>;
  /** The notebook's team curve library, for the light budget's uploads; absent on the scratch page. */
  curveLibrary?: CurveLibrary | null;
};

/** Edit a design and see every figure, the sketch and the plots follow. */
export function Workbench({
  initial,
  onDraftChange,
  onResultChange,
  header,
  readOnly = false,
  showPresets = false,
  aside = null,
  onSaveCandidate,
  curveLibrary = null,
}: WorkbenchProps) {
  const bench = useWorkbench(initial, onDraftChange);
  const layout = useLayout();
  const insets = useSafeAreaInsets();
  const [highlightedPath, setHighlightedPath] = useState<string | null>(null);
  const [undo, setUndo] = useState<{ title: string; previous: FormValues } | null>(null);
  const [graphicsWidth, onGraphicsLayout] = useWidth(360);
  const clearHighlight = useRef<ReturnType<typeof setTimeout> | null>(null);

  // The benchmark's edit ends when the sketch and plots for the new design are committed.
  useLayoutEffect(() => {
    measureEditEnd();
  }, [bench.evaluation, bench.selected]);

  useEffect(
    () => () => {
      if (clearHighlight.current) clearTimeout(clearHighlight.current);
    },
    [],
  );

  const { setFocus } = bench.form;
  const showField = useCallback(
    (path: string) => {
      setHighlightedPath(path);
      // The section opens on this render; focus once the field exists.
      setTimeout(() => setFocus(path as Parameters<typeof setFocus>[0]), 0);
      if (clearHighlight.current) clearTimeout(clearHighlight.current);
      clearHighlight.current = setTimeout(() => setHighlightedPath(null), 4000);
    },
    [setFocus],
  );

  // A review thread's pin label asks for its field: the same highlight as a warning's "fix" link.
  const marks = useFieldMarks();
  const askedField = marks?.highlighted ?? null;
  useEffect(() => {
    if (!askedField) return;
    // After the frame that closed a sheet over the field, so the field can take the focus.
    const timer = setTimeout(() => showField(askedField.path), 0);
    return () => clearTimeout(timer);
  }, [askedField, showField]);

  // One undo for the last solved value, opened candidate or filter plan: the text they replaced.
  // `from` says which card offers it, beside the button that made the change.
  const [valueUndo, setValueUndo] = useState<{
    text: string;
    previous: FormValues;
    from: 'requirements' | 'filters' | 'curves';
  } | null>(null);
  const applyOffer = (offer: SolveOffer) => {
    const previous = bench.applyChanges(offer.changes);
    setValueUndo({ text: `Applied: ${offer.text}.`, previous, from: 'requirements' });
  };
  const openCandidate = (design: Design) => {
    const previous = bench.openDesign(design);
    setValueUndo({ text: 'Opened a candidate design in the editor.', previous, from: 'requirements' });
  };
  const undoFor = (from: 'requirements' | 'filters' | 'curves') =>
    valueUndo?.from === from
      ? { text: valueUndo.text, onUndo: () => (bench.restore(valueUndo.previous), setValueUndo(null)) }
      : null;
  const undoValue = undoFor('requirements');
  const applyFilters = (filters: OrderSortingFilter[] | undefined, text: string) => {
    const previous = bench.applyFilters(filters);
    setValueUndo({ text, previous, from: 'filters' });
  };
  const filterRows = bench.values.filters ?? [];
  const addFilter = () => {
    // The next filter of the proposed plan when there is one, else a row whose cut-on is to be typed.
    const proposed = bench.evaluation.orderSorting.proposedFilters[filterRows.length];
    const { startNm, endNm } = bench.design.range;
    const row = proposed
      ? filterToText(proposed)
      : { kind: 'long-pass' as const, cutOnNm: '', inFromNm: String(startNm), inToNm: String(endNm), edgeWidthNm: '10' };
    bench.setFilterRows([...filterRows, row]);
  };
  const removeFilter = (index: number) => {
    const next = filterRows.filter((_, i) => i !== index);
    // Removing the last filter leaves the design without a list, as before any was added.
    const previous = bench.setFilterRows(next.length > 0 ? next : null);
    setValueUndo({ text: `Removed filter ${index + 1}.`, previous, from: 'filters' });
  };
  const { control } = bench.form;
  const filterFields = useCallback(
    (index: number) => <FilterRowFields control={control} index={index} highlightedPath={highlightedPath} />,
    [control, highlightedPath],
  );

  const inputFields = useCallback(
    (keys: readonly InputTextKey[]) => <InputFields control={control} keys={keys} highlightedPath={highlightedPath} />,
    [control, highlightedPath],
  );
  const changeCurves = (curves: DesignCurve[], text: string | null) => {
    // Removing the last curve leaves the design without a list, as before any was attached.
    const previous = bench.setCurves(curves.length > 0 ? curves : null);
    if (text) setValueUndo({ text, previous, from: 'curves' });
  };

  const pickPreset = (preset: Preset) => {
    const previous = bench.applyPreset(preset);
    setUndo({ title: preset.title, previous });
  };

  useEffect(() => {
    onResultChange?.(bench.result);
  }, [bench.result, onResultChange]);

  const dimmed = bench.blockedBy !== null;
  const selectedNm = bench.selected.ok ? bench.selected.wavelengthNm : null;
  // The sketch turns the grating to the read-out wavelength when it can; otherwise it keeps its
  // default (the range centre) rather than drawing an empty mount.
  const sketchSettingNm =
    bench.selected.ok && bench.selected.point.reachable ? bench.selected.wavelengthNm : null;
  const { setSelectedText } = bench;
  const onSelectWavelength = useCallback(
    (nm: number) => setSelectedText(String(Math.round(nm * 10) / 10)),
    [setSelectedText],
  );

  const editor = (
    <>
      {showPresets && !readOnly ? <SaveToNotebook result={bench.result} /> : null}
      {showPresets && !readOnly ? (
        <PresetPicker
          presetId={bench.presetId}
          onPick={pickPreset}
          undo={
            undo ? { title: undo.title, onUndo: () => (bench.restore(undo.previous), setUndo(null)) } : null
          }
        />
      ) : null}
      <DesignEditor
        control={bench.form.control}
        onSwitchMount={bench.switchMount}
        values={bench.values}
        collapsible={layout === 'phone'}
        highlightedPath={highlightedPath}
        readOnly={readOnly}
      />
    </>
  );
  const blocked = bench.blockedBy ? <BlockedNote fields={bench.blockedBy} onShowField={showField} /> : null;
  const graphics = (
    <View onLayout={onGraphicsLayout} style={styles.stack}>
      <Card title="Ray sketch" testID="sketch-card">
        <View style={dimmed ? styles.dimmed : undefined}>
          <RaySketch
            design={bench.design}
            evaluation={bench.evaluation}
            width={Math.max(240, graphicsWidth - 2 * space.lg - 2)}
            // A scanning instrument turns its grating: draw it set for the wavelength being read out.
            settingNm={sketchSettingNm}
          />
        </View>
        <View style={styles.actions}>
          <SaveSketchButton design={bench.design} settingNm={sketchSettingNm} />
        </View>
      </Card>
      <Card title="Across the range" testID="plots-card">
        <View style={dimmed ? styles.dimmed : undefined}>
          <PerformancePlots
            evaluation={bench.evaluation}
            width={Math.max(240, graphicsWidth - 2 * space.lg - 2)}
            selectedNm={selectedNm}
            onSelectWavelength={onSelectWavelength}
            design={bench.requirementsSet ? bench.design : null}
            filters={bench.design.filters ?? null}
          />
        </View>
      </Card>
    </View>
  );
  // The sketch and plots follow each keystroke at once; the long text lists (about 200 text
  // elements) may trail by a frame so typing stays smooth on a tablet.
  const deferredEvaluation = useDeferredValue(bench.evaluation);
  const deferredSweep = useDeferredValue(bench.sweep);
  const deferredTable = useDeferredValue(bench.table);
  const deferredSelected = useDeferredValue(bench.selected);
  const readout = (
    <ReadoutCard
      evaluation={deferredEvaluation}
      selectedText={bench.selectedText}
      onChangeSelected={bench.setSelectedText}
      selected={deferredSelected}
      note={bench.readoutNote}
      range={bench.design.range}
      dimmed={dimmed}
    />
  );
  const report = bench.requirementsReport;
  const failingRequirements = useMemo(
    () => report.checks.filter((check) => check.status === 'fail'),
    [report],
  );
  const warnings = (
    <WarningList
      warnings={deferredEvaluation.warnings}
      failingRequirements={failingRequirements}
      onShowField={showField}
    />
  );
  const requirements = (
    <RequirementsCard
      report={report}
      hasAny={bench.requirementsSet}
      offers={bench.solveOffers}
      onApplyOffer={applyOffer}
      undo={undoValue}
      onShowField={showField}
      readOnly={readOnly}
      dimmed={dimmed}
    />
  );
  // The filter plan beside the warnings it clears: the order-overlap warning's fix is here.
  const orderSorting = (
    <OrderSortingCard
      design={bench.design}
      evaluation={deferredEvaluation}
      onApplyFilters={applyFilters}
      readOnly={readOnly}
      dimmed={dimmed}
      rows={{ count: filterRows.length, fields: filterFields }}
      onAddFilter={addFilter}
      onRemoveFilter={removeFilter}
      undo={undoFor('filters')}
    />
  );
  const search = bench.requirementsSet ? (
    <Card title="Find designs that meet the requirements" testID="search-card">
      <CandidateSearchPanel
        design={bench.design}
        onOpen={openCandidate}
        {...(onSaveCandidate ? { onSave: onSaveCandidate } : {})}
        readOnly={readOnly}
      />
    </Card>
  ) : null;
  const sensitivity = <SensitivityCard design={bench.design} collapsedAtFirst={layout === 'phone'} />;
  // The grating against the simpler selectors, for this design's range and requirements.
  const tradeStudy = (
    <TradeStudyCard
      design={bench.design}
      collapsedAtFirst={layout === 'phone'}
    />
  );
  // Étendue, fill and throughput: the light the design gathers, beside its measured curves.
  const lightBudget = (
    <LightBudgetCard
      design={bench.design}
      evaluation={deferredSweep}
      readOnly={readOnly}
      dimmed={dimmed}
      inputKind={bench.values.input?.kind ?? ''}
      onInputKind={bench.setInputKind}
      inputFields={inputFields}
      curves={bench.values.curves ?? []}
      onCurvesChange={changeCurves}
      undo={undoFor('curves')}
      collapsedAtFirst={layout === 'phone'}
      library={curveLibrary}
    />
  );
  // The lamp lines the design will be calibrated with.
  const calibration = <CalibrationCard design={bench.design} collapsedAtFirst={layout === 'phone'} />;
  // The exact ray trace of the design, at the range's ends and centre and the read-out wavelength.
  const imageQuality = (
    <ImageQualityCard
      design={bench.design}
      readoutNm={selectedNm}
      collapsedAtFirst={layout === 'phone'}
      strip={layout === 'phone'}
    />
  );
  const table = <RangeTable points={deferredTable} dimmed={dimmed} />;
  // Last in every layout: what to take care of at the bench, for this design's range and source.
  const cautions = <CautionsCard design={bench.design} />;
  const pad = { paddingBottom: insets.bottom + space.xxl };

  if (layout === 'phone') {
    return (
      <View style={styles.root} testID="workbench-phone">
        <SummaryBar selected={bench.selected} blocked={dimmed} />
        <ScrollView contentContainerStyle={[styles.column, pad]}>
          {header}
          {editor}
          {blocked}
          {warnings}
          {orderSorting}
          {requirements}
          {search}
          {sensitivity}
          {tradeStudy}
          {lightBudget}
          {calibration}
          {readout}
          {graphics}
          {imageQuality}
          {table}
          {cautions}
        </ScrollView>
      </View>
    );
  }

  if (layout === 'tablet' || aside) {
    // Editor, then the review when it is open (the middle column), then figures, read-out and table.
    return (
      <View
        style={[styles.root, styles.row]}
        testID={layout === 'tablet' ? 'workbench-tablet' : 'workbench-wide'}
      >
        <ScrollView style={styles.editorPane} contentContainerStyle={[styles.column, pad]}>
          {header}
          {editor}
        </ScrollView>
        {aside ? (
          <ScrollView style={styles.asidePane} contentContainerStyle={[styles.column, pad]}>
            {aside}
          </ScrollView>
        ) : null}
        <ScrollView style={styles.flexPane} contentContainerStyle={[styles.column, pad]}>
          {blocked}
          {graphics}
          {warnings}
          {orderSorting}
          {requirements}
          {search}
          {sensitivity}
          {tradeStudy}
          {lightBudget}
          {calibration}
          {readout}
          {imageQuality}
          {table}
          {cautions}
        </ScrollView>
      </View>
    );
  }

  return (
    <View style={[styles.root, styles.row]} testID="workbench-wide">
      <ScrollView style={styles.editorPane} contentContainerStyle={[styles.column, pad]}>
        {header}
        {editor}
      </ScrollView>
      <ScrollView style={styles.flexPane} contentContainerStyle={[styles.column, pad]}>
        {blocked}
        {graphics}
        {/* Beside the plots, where the spot grid has the width. */}
        {imageQuality}
      </ScrollView>
      <ScrollView style={styles.resultsPane} contentContainerStyle={[styles.column, pad]}>
        {warnings}
        {orderSorting}
        {requirements}
        {search}
        {sensitivity}
        {tradeStudy}
        {lightBudget}
        {calibration}
        {readout}
        {table}
        {cautions}
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.paper },
  row: { flexDirection: 'row' },
  column: { padding: space.lg, gap: space.lg },
  stack: { gap: space.lg },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  editorPane: { width: 360, flexGrow: 0, flexShrink: 0, borderRightWidth: 1, borderRightColor: colors.line },
  flexPane: { flex: 1 },
  asidePane: { width: 420, flexGrow: 0, flexShrink: 0, borderRightWidth: 1, borderRightColor: colors.line },
  resultsPane: { width: 480, flexGrow: 0, flexShrink: 0, borderLeftWidth: 1, borderLeftColor: colors.line },
  dimmed: { opacity: 0.45 },
});
