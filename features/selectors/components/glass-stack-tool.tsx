import { useMemo, useRef } from 'react';
import { StyleSheet, View } from 'react-native';
import { absorptionFilterTransmission, absorptionStack } from '@/features/solver';
import { Button, Card, Heading, RadioGroup, colors, space } from '@/features/ui';
import { formatPercent } from '@/shared/format';
import { useChecked } from '../hooks/use-checked';
import { useWidth } from '../hooks/use-width';
import {
  MAX_GLASS_FILTERS,
  RANGE_FIELDS,
  checkGlassStack,
  glassErrorKey,
  glassFieldsFor,
  type GlassFilterKey,
  type GlassShape,
  type GlassStackText,
} from '../glass-stack-form';
import { edgeWidthText, glassTradeOff } from '../glass-trade-off';
import { uvNote } from '../uv-note';
import { BlockedNote, FigureList, Note, UvNoteView, WarningNotes } from './calculator-parts';
import { CalculatorFieldInput } from './calculator-field';
import { ToolLayout } from './tool-layout';
import { XyPlot } from './xy-plot';
import type { XySeries } from '../xy-plot-summary';

type Props = { text: GlassStackText; onChange: (text: GlassStackText) => void };

const SHAPES: readonly { value: GlassShape; label: string }[] = [
  { value: 'long-pass', label: 'Long-pass' },
  { value: 'band-pass', label: 'Band-pass' },
];

/** Each filter's own line, in turn; all pass 3:1 against white for graphics (WCAG 2.2, 1.4.11). */
const FILTER_INK = [colors.accent, colors.ok, colors.warning, colors.focus, colors.danger, colors.inkMuted] as const;

const percent = (v: number | null) => formatPercent(v, { maximumFractionDigits: 1 });

/** The coloured-glass stack calculator: a list of filters, the stack's curve with each filter's own, and the trade-off in numbers. */
export function GlassStackTool({ text, onChange }: Props) {
  const { current, lastGood } = useChecked(text, checkGlassStack);
  const [plotWidth, onPlotLayout] = useWidth(320);
  const nextId = useRef(text.filters.length + 1);
  const result = useMemo(() => {
    if (!lastGood) return null;
    const answer = absorptionStack(lastGood);
    const xs = lastGood.wavelengthsNm;
    const startNm = xs[0]!;
    const endNm = xs[xs.length - 1]!;
    const own = lastGood.filters.map((filter) => xs.map((nm) => absorptionFilterTransmission(filter, nm)));
    return { input: lastGood, answer, xs, own, tradeOff: glassTradeOff(lastGood.filters, startNm, endNm), startNm };
  }, [lastGood]);
  const errors = current.ok ? {} : current.errors;

  const setFilter = (index: number, patch: Partial<GlassStackText['filters'][number]>) =>
    onChange({ ...text, filters: text.filters.map((f, i) => (i === index ? { ...f, ...patch } : f)) });
  const add = () => {
    const last = text.filters[text.filters.length - 1]!;
    onChange({ ...text, filters: [...text.filters, { ...last, id: `f${++nextId.current}` }] });
  };
  const remove = (index: number) => onChange({ ...text, filters: text.filters.filter((_, i) => i !== index) });

  const inputs = (
    <View style={styles.fields}>
      {RANGE_FIELDS.map((field) => (
        <CalculatorFieldInput
          key={field.key}
          field={field}
          value={text[field.key]}
          onChange={(value) => onChange({ ...text, [field.key]: value })}
          error={errors[field.key]}
          testID={`glass-${field.key}`}
        />
      ))}
      {text.filters.map((filter, index) => (
        <View key={filter.id} style={styles.filter} testID={`glass-filter-${index + 1}`}>
          <Heading level={3}>{`Filter ${index + 1}`}</Heading>
          <RadioGroup
            label={`Filter ${index + 1} shape`}
            showLabel
            look="segmented"
            options={SHAPES}
            value={filter.shape}
            onChange={(shape) => setFilter(index, { shape })}
            testID={`glass-filter-${index + 1}-shape`}
          />
          {glassFieldsFor(filter.shape).map((field) => (
            <CalculatorFieldInput
              key={field.key}
              field={field}
              value={filter[field.key]}
              onChange={(value) => setFilter(index, { [field.key]: value } as Partial<Record<GlassFilterKey, string>>)}
              error={errors[glassErrorKey(index, field.key)]}
              testID={`glass-filter-${index + 1}-${field.key}`}
            />
          ))}
          {text.filters.length > 1 ? (
            <Button
              kind="secondary"
              label={`Remove filter ${index + 1}`}
              onPress={() => remove(index)}
              testID={`glass-filter-${index + 1}-remove`}
            />
          ) : null}
        </View>
      ))}
      {text.filters.length < MAX_GLASS_FILTERS ? (
        <Button kind="secondary" label="Add a filter (a copy of the last)" onPress={add} testID="glass-add-filter" />
      ) : (
        <Note testID="glass-full">{`A stack holds at most ${MAX_GLASS_FILTERS} filters.`}</Note>
      )}
    </View>
  );

  const blocked = current.ok ? null : <BlockedNote errors={errors} hasResults={result !== null} testID="glass-blocked" />;
  if (!result) {
    return <ToolLayout testID="glass-tool" stale={false} inputs={inputs} blocked={blocked} results={null} plots={null} />;
  }
  const { input, answer, xs, own, tradeOff } = result;
  const stackSeries: XySeries[] = [
    { label: 'Stack', unit: '', values: answer.points.map((p) => p.transmission), color: colors.primary, format: percent },
    ...(input.filters.length > 1
      ? own.map((values, i) => ({
          label: `Filter ${i + 1}`,
          unit: '',
          values,
          color: FILTER_INK[i % FILTER_INK.length]!,
          dash: '6 3',
          format: percent,
        }))
      : []),
  ];
  const figures = tradeOff
    ? [
        { id: 'stack-peak', label: 'Stack peak', value: percent(tradeOff.stack.peak) },
        { id: 'stack-edge', label: 'Stack edge, 10–90 %', value: edgeWidthText(tradeOff.stack) },
        { id: 'baseline-peak', label: `${tradeOff.baselineShort}: peak`, value: percent(tradeOff.baseline.peak) },
        { id: 'baseline-edge', label: `${tradeOff.baselineShort}: edge`, value: edgeWidthText(tradeOff.baseline) },
      ]
    : [];
  const results = (
    <Card title="Results">
      <FigureList figures={figures} testID="glass-figures" />
      {tradeOff ? (
        <Note testID="glass-trade-off">{tradeOff.sentence}</Note>
      ) : null}
      <WarningNotes warnings={answer.warnings} testID="glass-warning" />
      <UvNoteView note={uvNote(result.startNm)} testID="glass-uv" />
    </Card>
  );
  const plots = (
    <Card title="Plots">
      <View onLayout={onPlotLayout}>
        <XyPlot
          testID="glass-plot"
          title={input.filters.length > 1 ? 'Transmission of the stack and of each filter' : 'Transmission of the filter'}
          width={Math.max(240, plotWidth)}
          xs={xs}
          xName="wavelength"
          xTitle="Wavelength (nm)"
          xUnit="nm"
          series={stackSeries}
          yTitle="transmission"
          yTickFormat=".0%"
          yDomain={[0, 1]}
          caption="External transmission: internal transmission scaled by Beer–Lambert, T_ref^(t/t_ref), times (1 − ((n − 1)/(n + 1))²) for each of two surfaces (Hecht, Optics, §4.6); a stack is the product. Edges are a parametric model of coloured glass, not a maker's curve."
        />
      </View>
    </Card>
  );
  return <ToolLayout testID="glass-tool" stale={!current.ok} inputs={inputs} blocked={blocked} results={results} plots={plots} />;
}

const styles = StyleSheet.create({
  fields: { gap: space.md },
  filter: { gap: space.md, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md },
});
