import { useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { Fragment, useCallback, useMemo, useState } from 'react';
import { Pressable, StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import { flattenDesign } from '@/shared/design-diff';
import type { CompareResponse, Version } from '@/shared/notebooks';
import { LinePlot, type PlotSeries } from '@/features/plots';
import { SheetButton } from '@/features/sheets';
import { OverlaySketch } from '@/features/sketch';
import { Card, Heading, Screen, Text, colors, fonts, space, useDocumentTitle, useLayout } from '@/features/ui';
import { compareSeries, type ComparedMetric } from '../compare-series';
import {
  changeTone,
  editorFieldName,
  editorSectionTitle,
  figureLabels,
  formatFigure,
  formatParamAt,
  formatRelativeChange,
  formatRequirementsMet,
  REQUIREMENTS_MET_LABEL,
  requirementsChange,
  requirementsMetLabel,
} from '../format';
import { useCompareQuery, useNotebookQuery } from '../queries';
import { CompareSpots } from './compare-spots';
import { VersionPicker } from './version-picker';

const BEFORE = { color: colors.inkMuted, dash: '6 4' };
const AFTER = { color: colors.accent };

/** Column titles of a compare table: the first names the row, the others sit over numbers. */
function HeaderRow({ titles }: { titles: readonly string[] }) {
  return (
    <View role="row" style={[styles.row, styles.headerRow]}>
      {titles.map((title, i) => (
        <Text
          key={title}
          role="columnheader"
          variant="caption"
          tone="muted"
          weight="semibold"
          style={i === 0 ? styles.wideCell : [styles.cell, styles.numHead]}
        >
          {title.toUpperCase()}
        </Text>
      ))}
    </View>
  );
}

function FiguresTable({ data }: { data: CompareResponse }) {
  return (
    <View role="table" aria-label="Derived figures" testID="compare-figures">
      <HeaderRow titles={['Figure', `v${data.a.number}`, `v${data.b.number}`, 'Change']} />
      {data.figures.map((figure) => (
        <View key={figure.key} role="row" style={styles.row} testID={`figure-${figure.key}`}>
          <Text role="cell" variant="small" style={styles.wideCell}>
            {figureLabels[figure.key].label}
          </Text>
          <Text role="cell" variant="number" style={[styles.cell, styles.num]}>
            {formatFigure(figure.key, figure.before)}
          </Text>
          <Text role="cell" variant="number" style={[styles.cell, styles.num]}>
            {formatFigure(figure.key, figure.after)}
          </Text>
          <Text
            role="cell"
            variant="number"
            weight="semibold"
            tone={changeTone(figure.key, figure.relativeChange)}
            style={[styles.cell, styles.num]}
            testID={`change-${figure.key}`}
          >
            {formatRelativeChange(figure.relativeChange)}
          </Text>
        </View>
      ))}
      <RequirementsRow data={data} />
    </View>
  );
}

/**
 * Requirements met before and after, and the change in words ("bandpass no longer fails"); only
 * when either version states requirements, so older notebooks compare as they always did.
 */
function RequirementsRow({ data }: { data: CompareResponse }) {
  const before = data.a.summary.requirements;
  const after = data.b.summary.requirements;
  if (!before?.total && !after?.total) return null;
  const change = requirementsChange(before, after);
  // The count sits beside the other changes; the names under it, across the table, where a
  // phone's narrow column would break them mid-word.
  const words = change.detail;
  return (
    <>
      <View role="row" style={[styles.row, words !== null && styles.rowOpen]} testID="figure-requirements">
        <Text role="cell" variant="small" style={styles.wideCell}>
          {REQUIREMENTS_MET_LABEL}
        </Text>
        <Text role="cell" variant="number" aria-label={requirementsMetLabel(before)} style={[styles.cell, styles.num]}>
          {formatRequirementsMet(before)}
        </Text>
        <Text role="cell" variant="number" aria-label={requirementsMetLabel(after)} style={[styles.cell, styles.num]}>
          {formatRequirementsMet(after)}
        </Text>
        <Text
          role="cell"
          variant="number"
          weight="semibold"
          tone={change.tone}
          style={[styles.cell, styles.num]}
          testID="change-requirements"
        >
          {change.delta}
        </Text>
      </View>
      {words !== null ? (
        <View role="row" style={styles.row}>
          <Text role="cell" variant="small" tone={change.tone} style={styles.cell} testID="change-requirements-words">
            {words.charAt(0).toUpperCase() + words.slice(1)}
          </Text>
        </View>
      ) : null}
    </>
  );
}

/** Two stored values differ: lists (the requirements' wavelengths) by their items. */
function valuesDiffer(a: unknown, b: unknown): boolean {
  if (Array.isArray(a) && Array.isArray(b)) return a.length !== b.length || a.some((item, i) => !Object.is(item, b[i]));
  return a !== b;
}

/** Figures in the table's figure face; a choice ("Czerny–Turner") and a yes/no read as words. */
const valueVariant = (value: unknown) => (typeof value === 'string' || typeof value === 'boolean' ? 'small' : 'number');

function ParametersTable({ data }: { data: CompareResponse }) {
  const [onlyChanged, setOnlyChanged] = useState(false);
  const a = flattenDesign(data.a.params);
  const b = flattenDesign(data.b.params);
  const changed = new Set(data.changes.map((c) => c.path));
  const paths = [...new Set([...Object.keys(a), ...Object.keys(b)])];
  const rows = paths.filter(
    (path) => !onlyChanged || changed.has(path) || changed.has(path.split('.')[0] ?? ''),
  );
  return (
    <View style={styles.stack}>
      <Text variant="small" tone="muted">
        {data.changes.length === 0
          ? 'No parameter differs.'
          : `${data.changes.length} ${data.changes.length === 1 ? 'parameter differs' : 'parameters differ'}, highlighted.`}{' '}
        <Text
          variant="small"
          weight="semibold"
          role="button"
          style={styles.inlineLink}
          onPress={() => setOnlyChanged((v) => !v)}
        >
          {onlyChanged ? 'Show all' : 'Show only changes'}
        </Text>
      </Text>
      <View role="table" aria-label="Parameters" testID="compare-params">
        <HeaderRow titles={['Parameter', `v${data.a.number}`, `v${data.b.number}`]} />
        {rows.map((path, i) => {
          const differs = changed.has(path) || changed.has(path.split('.')[0] ?? '') || valuesDiffer(a[path], b[path]);
          // Rows come section by section; each section opens under the editor's heading for it.
          const section = editorSectionTitle(path);
          const opensSection = i === 0 || editorSectionTitle(rows[i - 1] ?? '') !== section;
          return (
            <Fragment key={path}>
              {opensSection ? (
                <View role="row" style={styles.sectionRow}>
                  <Text role="rowheader" variant="caption" weight="semibold" tone="muted">
                    {section.toUpperCase()}
                  </Text>
                </View>
              ) : null}
              <View
                role="row"
                style={[styles.row, differs && styles.changedRow]}
                testID={differs ? `changed-${path}` : `same-${path}`}
              >
                <Text
                  role="cell"
                  variant="small"
                  weight={differs ? 'semibold' : 'regular'}
                  style={styles.wideCell}
                >
                  {differs ? '● ' : ''}
                  {editorFieldName(path, data.a.params, data.b.params)}
                </Text>
                <Text role="cell" variant={valueVariant(a[path])} style={[styles.cell, styles.num]}>
                  {formatParamAt(path, a[path])}
                </Text>
                <Text role="cell" variant={valueVariant(b[path])} style={[styles.cell, styles.num, differs && styles.after]}>
                  {formatParamAt(path, b[path])}
                </Text>
              </View>
            </Fragment>
          );
        })}
      </View>
    </View>
  );
}

function Legend({ a, b }: { a: Version; b: Version }) {
  return (
    <View style={styles.legend}>
      <View style={styles.legendItem}>
        <View style={[styles.swatch, styles.swatchBefore]} />
        <Text variant="small">
          v{a.number} (before): {a.message}
        </Text>
      </View>
      <View style={styles.legendItem}>
        <View style={[styles.swatch, styles.swatchAfter]} />
        <Text variant="small">
          v{b.number} (after): {b.message}
        </Text>
      </View>
    </View>
  );
}

function series(
  label: string,
  unit: string,
  metric: ComparedMetric,
  which: 'a' | 'b',
  format?: PlotSeries['format'],
): PlotSeries {
  const ink = which === 'a' ? BEFORE : AFTER;
  return {
    label,
    unit,
    values: metric[which],
    color: ink.color,
    dash: 'dash' in ink ? ink.dash : undefined,
    domain: metric.domain ?? undefined,
    format,
  };
}

function ComparePlots({ data, width }: { data: CompareResponse; width: number }) {
  const compared = useMemo(() => compareSeries(data.a.params, data.b.params), [data]);
  const failing = compared.failingB;
  const plots = [
    { id: 'bandpass', title: 'Bandpass', unit: 'nm', metric: compared.bandpassNm, shade: failing?.bandpass },
    {
      id: 'dispersion',
      title: 'Reciprocal dispersion',
      unit: 'nm/mm',
      metric: compared.reciprocalDispersionNmPerMm,
      shade: failing?.dispersion,
    },
    // The bandpass plot's shading covers resolving power too (the two come from one slit width).
    { id: 'power', title: 'Resolving power R', unit: '', metric: compared.resolvingPower, shade: failing?.bandpass },
    { id: 'efficiency', title: 'Blaze efficiency', unit: '', metric: compared.blazeEfficiency, shade: failing?.efficiency },
  ];
  const columns = width >= 700 ? 2 : 1;
  const plotWidth = columns === 2 ? Math.floor((width - space.lg) / 2) : width;
  return (
    <View style={[styles.plots, columns === 2 && styles.plotsTwo]}>
      {plots.map((plot) => (
        <View key={plot.id} style={{ width: plotWidth }}>
          <LinePlot
            testID={`compare-plot-${plot.id}`}
            title={plot.title}
            width={plotWidth}
            wavelengthsNm={compared.wavelengthsNm}
            series={{
              ...series(`v${data.a.number}`, plot.unit, plot.metric, 'a'),
              axisTitle: plot.unit || plot.title,
            }}
            secondSeries={{
              ...series(`v${data.b.number}`, plot.unit, plot.metric, 'b'),
              axisTitle: plot.unit || plot.title,
            }}
            emptyMessage="Neither version reaches these wavelengths"
            {...(plot.shade && plot.shade.intervals.length > 0
              ? {
                  failing: plot.shade.intervals,
                  failingLabel: `Hatched: v${data.b.number} misses a requirement here`,
                  failingSummary: `v${data.b.number}: ${plot.shade.summary}`,
                }
              : {})}
          />
        </View>
      ))}
    </View>
  );
}

/** `/notebooks/:id/compare?a=1&b=2`: what changed between two versions and what it did. */
export function CompareScreen() {
  const {
    notebookId = '',
    a: aText = '1',
    b: bText = '2',
  } = useLocalSearchParams<{ notebookId: string; a?: string; b?: string }>();
  const router = useRouter();
  const layout = useLayout();
  const a = Number(aText);
  const b = Number(bText);
  const notebook = useNotebookQuery(notebookId);
  const compare = useCompareQuery(notebookId, a, b);
  const [width, setWidth] = useState(340);
  const onLayout = useCallback(
    (event: LayoutChangeEvent) => setWidth(Math.round(event.nativeEvent.layout.width)),
    [],
  );
  const count = notebook.data?.design.latestVersion ?? Math.max(a, b);
  const pick = (next: { a?: number; b?: number }) =>
    router.setParams({ a: String(next.a ?? a), b: String(next.b ?? b) });
  const data = compare.data;
  const sideBySide = layout !== 'phone';
  useDocumentTitle(`${notebook.data?.design.title ?? 'Design'}: compare v${a} and v${b}`);

  return (
    <Screen wide style={styles.page}>
      <Pressable
        role="link"
        onPress={() => router.push(`/notebooks/${notebookId}` as Href)}
        style={styles.back}
        testID="back-to-notebook"
      >
        <Text variant="small" weight="semibold" style={styles.backText}>
          ← {notebook.data?.design.title ?? 'The notebook'}
        </Text>
      </Pressable>
      <Heading level={1} testID="compare-heading">
        Compare v{a} and v{b}
      </Heading>
      <Card>
        <VersionPicker
          label="Before"
          count={count}
          value={a}
          onChange={(n) => pick({ a: n })}
          testID="compare-a"
        />
        <VersionPicker
          label="After"
          count={count}
          value={b}
          onChange={(n) => pick({ b: n })}
          testID="compare-b"
        />
        {/* Once the comparison loads, so the sheet is offered only for a pair that exists. */}
        {data ? (
          <SheetButton
            target={{ kind: 'compare', designId: notebookId, a: data.a.number, b: data.b.number, title: notebook.data?.design.title ?? '' }}
            testID="compare-sheet-download"
          />
        ) : null}
      </Card>
      {compare.isError ? (
        <Text role="alert" tone="danger">
          {compare.error.message}
        </Text>
      ) : null}
      {!data ? (
        <Text tone="muted">{compare.isError ? '' : 'Comparing…'}</Text>
      ) : (
        <View style={styles.stack} onLayout={onLayout}>
          <Legend a={data.a} b={data.b} />
          <View style={[styles.split, sideBySide && styles.splitWide]}>
            <Card title="Derived figures" style={sideBySide ? styles.half : undefined}>
              <FiguresTable data={data} />
            </Card>
            <Card title="Parameters" style={sideBySide ? styles.half : undefined}>
              <ParametersTable data={data} />
            </Card>
          </View>
          <Card title="Ray sketches" testID="compare-sketches">
            <Text variant="small" tone="muted">
              One drawing, one scale: v{data.a.number} dashed grey beneath, v{data.b.number} on top in colour.
            </Text>
            <OverlaySketch
              before={data.a.params}
              after={data.b.params}
              width={width - 2 * space.lg - 2}
              testID="compare-sketch-overlay"
            />
          </Card>
          <CompareSpots
            before={{ number: data.a.number, params: data.a.params, when: 'before' }}
            after={{ number: data.b.number, params: data.b.params, when: 'after' }}
            width={width - 2 * space.lg - 2}
          />
          <Card title="Across the range" testID="compare-plots">
            <Text variant="small" tone="muted">
              Dashed grey: v{data.a.number}; copper: v{data.b.number}. Both on one scale, each only over its
              own range.
            </Text>
            <ComparePlots data={data} width={width - 2 * space.lg - 2} />
          </Card>
        </View>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  page: { maxWidth: 1240 },
  back: { alignSelf: 'flex-start', minHeight: 28, justifyContent: 'center' },
  backText: { color: colors.primary },
  stack: { gap: space.lg },
  split: { gap: space.lg },
  splitWide: { flexDirection: 'row', alignItems: 'flex-start' },
  half: { flex: 1, minWidth: 0 },
  row: {
    flexDirection: 'row',
    gap: space.sm,
    paddingVertical: space.xs,
    paddingHorizontal: space.xs,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  headerRow: { borderBottomWidth: 2 },
  // A row whose words follow on the next line: no rule between them.
  rowOpen: { borderBottomWidth: 0 },
  sectionRow: { paddingTop: space.sm, paddingBottom: space.xxs, paddingHorizontal: space.xs },
  changedRow: { backgroundColor: '#FFF2E6' },
  wideCell: { flex: 2, minWidth: 0 },
  cell: { flex: 1, minWidth: 0 },
  num: { fontSize: 14, textAlign: 'right' },
  numHead: { textAlign: 'right' },
  after: { color: colors.accent, fontFamily: fonts.semibold },
  inlineLink: { color: colors.primary, textDecorationLine: 'underline' },
  legend: { gap: space.xs },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  swatch: { width: 28, height: 0, borderTopWidth: 3 },
  swatchBefore: { borderColor: colors.inkMuted, borderStyle: 'dashed' },
  swatchAfter: { borderColor: colors.accent },
  plots: { gap: space.lg },
  plotsTwo: { flexDirection: 'row', flexWrap: 'wrap' },
});
