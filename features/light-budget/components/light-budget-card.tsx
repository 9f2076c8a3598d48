import { memo, useCallback, useMemo, useState, type ReactNode } from 'react';
import { StyleSheet, Text, View, type LayoutChangeEvent } from 'react-native';
import { XyPlot, type XySeries } from '@/features/selectors';
import type { Evaluation } from '@/features/solver';
import { Button, Card, DisclosureButton, RadioGroup, colors, fonts, radius, space, type } from '@/features/ui';
import { INPUT_KIND_FIELDS, inputKindWords, type InputText, type InputTextKey } from '@/features/workbench/input-fields';
import { MAX_DESIGN_CURVES, type DesignCurve } from '@/shared/curves';
import type { Design } from '@/shared/design';
import { formatNumber, formatPercent } from '@/shared/format';
import { INPUT_KINDS } from '@/shared/light-input';
import { FILL_STATE_WORDS, curveLine, factorRows, fillSentence, threePlaces, valueText } from '../light-budget-words';
import { CurveUploadPanel, type CurveLibrary } from './curve-upload-panel';

export type LightBudgetCardProps = {
  design: Design;
  /** A plain sweep: the light budget's arrays run alongside its points, one value each. */
  evaluation: Evaluation;
  readOnly: boolean;
  dimmed: boolean;
  /** The editor's chosen input kind ('' for none) and how to change it. */
  inputKind: InputText['kind'];
  onInputKind: (kind: InputText['kind']) => void;
  /** The editor's typed fields for these input keys (bound to its form, so refused text keeps its message). */
  inputFields: (keys: readonly InputTextKey[]) => ReactNode;
  /** The attached curves as the editor holds them. */
  curves: readonly DesignCurve[];
  /** Replaces the attached curves; `text` (when given) is the undo note. */
  onCurvesChange: (curves: DesignCurve[], text: string | null) => void;
  undo: { text: string; onUndo: () => void } | null;
  collapsedAtFirst: boolean;
  /** In a team's notebook: the team's curve library (reuse, and where an owner's uploads are kept). */
  library?: CurveLibrary | null;
};

const INPUT_OPTIONS = (['', ...INPUT_KINDS] as const).map((value) => ({
  value: value === '' ? ('none' as const) : value,
  label: inputKindWords[value].label,
  accessibilityLabel: `${inputKindWords[value].label}: ${inputKindWords[value].help}`,
}));

/** Colours and dashes per factor: the product solid and dark, each factor its own dash so grey print tells them apart. */
const FACTOR_STYLE: Readonly<Record<string, { color: string; dash: string }>> = {
  grating: { color: colors.primary, dash: '6 3' },
  collimator: { color: colors.accent, dash: '2 3' },
  camera: { color: colors.warning, dash: '8 3 2 3' },
  filter: { color: colors.ok, dash: '4 4' },
  detector: { color: colors.focus, dash: '1 3' },
  input: { color: colors.inkMuted, dash: '10 4' },
};

const pct = (v: number | null) => (v === null ? 'no data' : formatPercent(v, { maximumFractionDigits: 1 }));

function Figures({ evaluation }: { evaluation: Evaluation }) {
  const light = evaluation.lightBudget;
  const rows: [string, string][] = [
    ['Slit area', `${formatNumber(light.slitAreaMm2, 4)} mm²`],
    [
      'Acceptance',
      light.acceptanceSolidAngleSr === null
        ? 'not known (centre unreachable)'
        : `${formatNumber(light.acceptanceSolidAngleSr, 3)} sr (≈ f/${formatNumber(light.acceptanceFNumber ?? 0, 3)})`,
    ],
    ['Étendue G = A·Ω', light.etendueMm2Sr === null ? '—' : `${formatNumber(light.etendueMm2Sr, 3)} mm²·sr`],
  ];
  return (
    <View style={styles.figures} role="list" testID="light-budget-figures">
      {rows.map(([label, value]) => (
        <View key={label} style={styles.figure} role="listitem">
          <Text style={styles.figureLabel}>{label}</Text>
          <Text style={styles.figureValue}>{value}</Text>
        </View>
      ))}
    </View>
  );
}

function FillMark({ state }: { state: keyof typeof FILL_STATE_WORDS }) {
  const bad = state === 'overfilled' || state === 'underfilled';
  return (
    <View style={[styles.mark, bad ? styles.markBad : styles.markOk]} testID="light-budget-fill-state">
      <Text style={[styles.markText, bad ? styles.markTextBad : null]}>{FILL_STATE_WORDS[state]}</Text>
    </View>
  );
}

function ThroughputPlots({ evaluation, width }: { evaluation: Evaluation; width: number }) {
  const light = evaluation.lightBudget;
  const xs = useMemo(() => evaluation.points.map((p) => p.wavelengthNm), [evaluation.points]);
  const series = useMemo<XySeries[]>(() => {
    const product: XySeries = { label: 'Throughput', unit: '', values: light.throughput, color: colors.ink, format: pct };
    const factors = light.factors
      .filter((f) => f.basis !== 'not-counted')
      .map<XySeries>((f) => ({
        label: factorRows(light, xs).find((row) => row.id === f.id)?.name ?? f.id,
        unit: '',
        values: f.values,
        color: FACTOR_STYLE[f.id]?.color ?? colors.inkMuted,
        dash: FACTOR_STYLE[f.id]?.dash ?? '3 3',
        format: pct,
      }));
    return [product, ...factors];
  }, [light, xs]);
  const signal = useMemo<XySeries[]>(
    () => [{ label: 'Expected signal', unit: '', values: light.signal, color: colors.primary, format: pct }],
    [light.signal],
  );
  const gaps = light.factors.some((f) => f.gapsNm.length > 0);
  return (
    <View style={styles.plots}>
      <XyPlot
        testID="light-budget-throughput-plot"
        title="Relative throughput and its factors"
        width={width}
        xs={xs}
        xName="wavelength"
        xTitle="Wavelength (nm)"
        xUnit="nm"
        series={series}
        yTitle="Share of light"
        yTickFormat=".0%"
        yDomain={[0, 1]}
        caption={
          gaps
            ? 'A measured curve that does not cover the range is drawn only where it has data; the product only where every counted factor is known.'
            : null
        }
      />
      <XyPlot
        testID="light-budget-signal-plot"
        title={light.sourceBasis === 'measured' ? 'Expected signal: source × throughput × bandpass' : 'Expected signal: throughput × bandpass (flat source)'}
        width={width}
        xs={xs}
        xName="wavelength"
        xTitle="Wavelength (nm)"
        xUnit="nm"
        series={signal}
        yTitle="Relative signal"
        yTickFormat=".0%"
        yDomain={[0, 1]}
        caption="Scaled so its largest value is 100 %: a shape to compare across the range, not a count."
      />
    </View>
  );
}

function FactorTable({ evaluation }: { evaluation: Evaluation }) {
  const light = evaluation.lightBudget;
  const xs = evaluation.points.map((p) => p.wavelengthNm);
  const places = threePlaces(xs);
  const rows = factorRows(light, xs);
  return (
    <View style={styles.factorList} role="list" testID="light-budget-factors">
      {rows.map((row) => (
        <View key={row.id} style={styles.factor} role="listitem" testID={`light-budget-factor-${row.id}`}>
          <Text style={styles.factorName}>{row.name}</Text>
          <Text style={styles.note}>{row.basis}</Text>
          {row.counted ? (
            <Text style={styles.values}>
              {places.map((p, i) => `${formatNumber(p.nm)} nm ${row.values[i]}`).join(' · ')}
            </Text>
          ) : null}
          {row.gaps ? <Text style={styles.gap}>{row.gaps}</Text> : null}
        </View>
      ))}
      <View style={[styles.factor, styles.product]} role="listitem" testID="light-budget-product">
        <Text style={styles.factorName}>Product</Text>
        <Text style={styles.values}>
          {places.map((p) => `${formatNumber(p.nm)} nm ${valueText(light.throughput[p.index])}`).join(' · ')}
        </Text>
        <Text style={styles.note}>
          {light.lowest
            ? `Lowest ${valueText(light.lowest.value)} at ${formatNumber(light.lowest.wavelengthNm)} nm.`
            : 'Nothing is counted yet: give the blaze, attach a curve or give the light input.'}
        </Text>
      </View>
    </View>
  );
}

function CurveList({
  curves,
  readOnly,
  onRemove,
}: {
  curves: readonly DesignCurve[];
  readOnly: boolean;
  onRemove: (index: number) => void;
}) {
  if (curves.length === 0) {
    return <Text style={styles.note}>No measured curves attached: the grating uses the scalar blaze estimate.</Text>;
  }
  return (
    <View role="list" style={styles.curves} testID="light-budget-curves">
      {curves.map((curve, index) => (
        <View key={`${curve.checksum}-${index}`} style={styles.curve} role="listitem" testID={`light-budget-curve-${index}`}>
          <View style={styles.curveText}>
            <Text style={styles.factorName}>{curve.name}</Text>
            <Text style={styles.note}>{curveLine(curve)}</Text>
          </View>
          {readOnly ? null : (
            <Button
              kind="quiet"
              label="Remove"
              accessibilityLabel={`Remove the curve ${curve.name}`}
              onPress={() => onRemove(index)}
              testID={`light-budget-curve-remove-${index}`}
            />
          )}
        </View>
      ))}
    </View>
  );
}

function Body(props: LightBudgetCardProps) {
  const { evaluation, readOnly, curves, onCurvesChange } = props;
  const [width, setWidth] = useState(320);
  const onLayout = useCallback((e: LayoutChangeEvent) => {
    const next = Math.round(e.nativeEvent.layout.width);
    setWidth((w) => (Math.abs(w - next) >= 1 ? next : w));
  }, []);
  const [adding, setAdding] = useState(false);
  const light = evaluation.lightBudget;
  const kind = props.inputKind;
  return (
    <View style={styles.body} onLayout={onLayout}>
      <Text style={styles.subheading} role="heading" aria-level={3}>
        Light input
      </Text>
      <RadioGroup
        label="How light reaches the entrance slit"
        options={INPUT_OPTIONS}
        value={kind === '' ? 'none' : kind}
        onChange={(value) => props.onInputKind(value === 'none' ? '' : value)}
        disabled={readOnly}
        look="chips"
        size="compact"
        testID="light-budget-input-kind"
      />
      <Text style={styles.note}>{inputKindWords[kind].help}</Text>
      {kind !== '' && !readOnly ? props.inputFields(INPUT_KIND_FIELDS[kind]) : null}
      <Figures evaluation={evaluation} />
      <View style={styles.fillRow}>
        {light.fill ? <FillMark state={light.fill.state} /> : null}
        <Text style={[styles.small, styles.fillText]} testID="light-budget-fill">
          {fillSentence(light.fill, light.acceptanceFNumber)}
        </Text>
      </View>
      <ThroughputPlots evaluation={evaluation} width={Math.max(240, width)} />
      <FactorTable evaluation={evaluation} />
      <Text style={styles.subheading} role="heading" aria-level={3}>
        Measured curves
      </Text>
      <CurveList
        curves={curves}
        readOnly={readOnly}
        onRemove={(index) => onCurvesChange(curves.filter((_, i) => i !== index), `Removed the curve ${curves[index]?.name ?? ''}.`)}
      />
      {props.undo ? (
        <View style={styles.undo}>
          <Text style={styles.small}>{props.undo.text}</Text>
          <Button kind="quiet" label="Undo" onPress={props.undo.onUndo} testID="light-budget-undo" />
        </View>
      ) : null}
      {readOnly ? null : adding ? (
        <CurveUploadPanel
          design={props.design}
          library={props.library ?? null}
          onAttach={(curve) => {
            onCurvesChange([...curves, curve], null);
            setAdding(false);
          }}
          onCancel={() => setAdding(false)}
        />
      ) : (
        <View style={styles.actions}>
          <Button
            kind="secondary"
            label="Add a measured curve"
            onPress={() => setAdding(true)}
            disabled={curves.length >= MAX_DESIGN_CURVES}
            testID="light-budget-add-curve"
          />
          {curves.length >= MAX_DESIGN_CURVES ? <Text style={styles.note}>At most {MAX_DESIGN_CURVES} curves per design.</Text> : null}
        </View>
      )}
    </View>
  );
}

/** Étendue, how the input fills the grating, and the throughput of each element and their product. */
export const LightBudgetCard = memo(function LightBudgetCard(props: LightBudgetCardProps) {
  const [open, setOpen] = useState(!props.collapsedAtFirst);
  return (
    <Card title="Light budget" testID="light-budget-card">
      <View style={styles.actions}>
        <DisclosureButton open={open} onToggle={() => setOpen((o) => !o)} what="the light budget" testID="light-budget-toggle" />
      </View>
      {open ? (
        <View style={props.dimmed ? styles.dimmed : undefined}>
          <Body {...props} />
        </View>
      ) : (
        <Text style={styles.note} testID="light-budget-closed-summary">
          {props.evaluation.lightBudget.lowest
            ? `Lowest relative throughput ${valueText(props.evaluation.lightBudget.lowest.value)} at ${formatNumber(props.evaluation.lightBudget.lowest.wavelengthNm)} nm.`
            : 'Throughput not counted yet.'}
        </Text>
      )}
    </Card>
  );
});

const styles = StyleSheet.create({
  body: { gap: space.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  subheading: { ...type.small, fontFamily: fonts.semibold, color: colors.ink, marginTop: space.xs },
  note: { ...type.caption, fontFamily: fonts.regular, color: colors.inkMuted },
  small: { ...type.small, fontFamily: fonts.regular, color: colors.ink },
  figures: { gap: space.xs },
  figure: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: space.sm, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.xxs },
  figureLabel: { ...type.small, fontFamily: fonts.regular, color: colors.inkMuted },
  figureValue: { ...type.small, fontFamily: fonts.regular, fontVariant: ['tabular-nums'], color: colors.ink },
  fillRow: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start', flexWrap: 'wrap' },
  fillText: { flex: 1, minWidth: 200 },
  mark: { minWidth: 72, alignItems: 'center', borderRadius: radius.sm, paddingHorizontal: space.xs, paddingVertical: space.xxs },
  markOk: { backgroundColor: colors.okSoft },
  markBad: { backgroundColor: colors.danger },
  markText: { ...type.caption, fontFamily: fonts.semibold, color: colors.ink },
  markTextBad: { color: colors.onPrimary },
  plots: { gap: space.md },
  factorList: { gap: space.xs },
  factor: { gap: space.xxs, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.xs },
  product: { borderTopWidth: 2, borderTopColor: colors.ink },
  factorName: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  values: { ...type.caption, fontFamily: fonts.regular, fontVariant: ['tabular-nums'], color: colors.ink },
  gap: { ...type.caption, fontFamily: fonts.regular, color: colors.warning },
  curves: { gap: space.xs },
  curve: { flexDirection: 'row', gap: space.sm, alignItems: 'center', borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.xs },
  curveText: { flex: 1, minWidth: 0, gap: space.xxs },
  undo: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  dimmed: { opacity: 0.45 },
});
