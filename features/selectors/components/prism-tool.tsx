import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import { prismMonochromator } from '@/features/solver';
import { Card, RadioGroup, Text, colors, space } from '@/features/ui';
import { formatNumber, formatQuantity } from '@/shared/format';
import { useChecked } from '../hooks/use-checked';
import { useWidth } from '../hooks/use-width';
import {
  PRISM_MATERIAL_CHOICES,
  checkPrism,
  missingMonochromatorFields,
  prismFieldsFor,
  type PrismKey,
  type PrismMaterialChoice,
  type PrismText,
} from '../prism-form';
import { bandpassSpread } from '../prism-series';
import { uvNote } from '../uv-note';
import { BlockedNote, FigureList, Note, UvNoteView, WarningNotes } from './calculator-parts';
import { CalculatorFieldInput } from './calculator-field';
import { ToolLayout } from './tool-layout';
import { XyPlot } from './xy-plot';
import type { XySeries } from '../xy-plot-summary';

type Props = { text: PrismText; onChange: (text: PrismText) => void };

/** The prism calculator: material and geometry in, index, dispersion, resolving power and bandpass across the range out. */
export function PrismTool({ text, onChange }: Props) {
  const { current, lastGood } = useChecked(text, checkPrism);
  const [plotWidth, onPlotLayout] = useWidth(320);
  const result = useMemo(() => {
    if (!lastGood) return null;
    return { input: lastGood, answer: prismMonochromator(lastGood) };
  }, [lastGood]);
  const errors = current.ok ? {} : current.errors;
  const set = (key: PrismKey) => (value: string) => onChange({ ...text, [key]: value });
  const missing = missingMonochromatorFields(text);

  const inputs = (
    <View style={styles.fields}>
      <RadioGroup
        label="Material"
        showLabel
        options={PRISM_MATERIAL_CHOICES}
        value={text.material}
        onChange={(material: PrismMaterialChoice) => onChange({ ...text, material })}
        testID="prism-material"
      />
      {prismFieldsFor(text.material).map((field) => (
        <CalculatorFieldInput
          key={field.key}
          field={field}
          value={text[field.key]}
          onChange={set(field.key)}
          error={errors[field.key]}
          testID={`prism-${field.key}`}
        />
      ))}
      {missing.length > 0 ? (
        <Note testID="prism-bandpass-fields">
          {`The bandpass needs all four monochromator fields: fill ${missing.map((f) => f.label.toLowerCase()).join(', ')}, or clear the others.`}
        </Note>
      ) : null}
    </View>
  );

  const blocked = current.ok ? null : <BlockedNote errors={errors} hasResults={result !== null} testID="prism-blocked" />;
  if (!result) {
    return <ToolLayout testID="prism-tool" stale={false} inputs={inputs} blocked={blocked} results={null} plots={null} />;
  }
  const { input, answer } = result;
  const points = answer.points;
  const xs = points.map((p) => p.wavelengthNm);
  const startNm = xs[0]!;
  const endNm = xs[xs.length - 1]!;
  const hasBandpass = points.some((p) => p.bandpassNm !== null);
  const spread = bandpassSpread(points);
  const mid = points[Math.floor(points.length / 2)]!;
  const figures = [
    { id: 'index', label: `Index at ${formatNumber(mid.wavelengthNm, 4)} nm`, value: formatNumber(mid.index, 6) },
    { id: 'deviation', label: 'Minimum deviation there', value: mid.minDeviationDeg === null ? '—' : `${formatNumber(mid.minDeviationDeg, 4)}°` },
    {
      id: 'resolving-power',
      label: 'Resolving power, range ends',
      value: `${formatNumber(points[0]!.resolvingPower, 3)} – ${formatNumber(points[points.length - 1]!.resolvingPower, 3)}`,
    },
    ...(spread
      ? [
          {
            id: 'bandpass',
            label: 'Bandpass, range ends',
            value: `${formatNumber(spread.startNm, 3)} – ${formatQuantity(spread.endNm, 'nm', 3)}`,
          },
        ]
      : []),
  ];
  const withoutWarned = answer.warnings.filter((w) => w.code !== 'incomplete-monochromator');
  const outsideData = withoutWarned.filter((w) => w.code === 'outside-data');
  const others = withoutWarned.filter((w) => w.code !== 'outside-data');
  const plot = (testID: string, title: string, series: XySeries, yTitle: string, caption?: string, yTickFormat?: string) => (
    <XyPlot
      testID={testID}
      title={title}
      width={Math.max(240, plotWidth)}
      xs={xs}
      xName="wavelength"
      xTitle="Wavelength (nm)"
      xUnit="nm"
      series={[series]}
      yTitle={yTitle}
      yTickFormat={yTickFormat}
      caption={caption}
    />
  );
  const results = (
    <Card title="Results">
      <View style={styles.source} testID="prism-source">
        <Text variant="small" weight="semibold">
          {answer.material.label}
        </Text>
        <Text variant="small" tone="muted">
          {`Source: ${answer.material.source}.`}
          {answer.material.validFromNm !== null && answer.material.validToNm !== null
            ? ` Fitted over ${formatNumber(answer.material.validFromNm)}–${formatQuantity(answer.material.validToNm, 'nm')}.`
            : ' No data range is known for a formula of your own.'}
        </Text>
      </View>
      <FigureList figures={figures} testID="prism-figures" />
      {outsideData.map((w) => (
        <Note key={w.code} testID="prism-outside-data">
          {w.message}
        </Note>
      ))}
      <WarningNotes warnings={others} testID="prism-warning" />
      <UvNoteView note={uvNote(startNm)} testID="prism-uv" />
    </Card>
  );
  const plots = (
    <Card title="Plots">
      <View onLayout={onPlotLayout} style={styles.plots}>
        {hasBandpass
          ? plot(
              'prism-bandpass',
              'Bandpass',
              { label: 'Bandpass', unit: 'nm', values: points.map((p) => p.bandpassNm), color: colors.primary },
              'bandpass, nm',
              spread
                ? `From ${formatQuantity(spread.startNm, 'nm', 3)} at ${formatQuantity(startNm, 'nm')} to ${formatQuantity(spread.endNm, 'nm', 3)} at ${formatQuantity(endNm, 'nm')}, ${formatNumber(spread.ratio, 3)} times wider: a prism's dispersion falls steeply toward long wavelengths (non-linear dispersion), where a grating's bandpass stays nearly even. Slit-limited: the wider of the entrance-slit image and the exit slit over the linear dispersion.`
                : undefined,
            )
          : (
            <Note testID="prism-no-bandpass">
              Fill the collimator and camera focal lengths and both slits to plot the bandpass across the range.
            </Note>
          )}
        {plot(
          'prism-resolving-power',
          'Resolving power',
          { label: 'R', unit: '', values: points.map((p) => p.resolvingPower), color: colors.accent, format: (v) => formatNumber(v === null ? null : Math.round(v), 3) },
          'resolving power R',
          `R = b |dn/dλ| with the beam filling the ${formatQuantity(input.baseMm, 'mm')} base (Born & Wolf, §4.7).`,
          '~s',
        )}
        {plot(
          'prism-dispersion',
          'Angular dispersion',
          { label: 'Angular dispersion', unit: '°/nm', values: points.map((p) => p.angularDispersionDegPerNm), color: colors.ok },
          '°/nm',
          `dD/dλ = 2 sin(A/2) / √(1 − n² sin²(A/2)) · |dn/dλ| at minimum deviation, apex ${formatNumber(input.apexDeg, 4)}° (Born & Wolf, §4.7; Hecht, §5.5).`,
        )}
        {plot(
          'prism-index',
          'Refractive index',
          { label: 'n', unit: '', values: points.map((p) => p.index), color: colors.primary, format: (v) => formatNumber(v, 5) },
          'index n',
          'From the Sellmeier formula n² − 1 = Σ Bᵢ λ² / (λ² − Cᵢ²), λ and Cᵢ in µm.',
        )}
      </View>
    </Card>
  );
  return <ToolLayout testID="prism-tool" stale={!current.ok} inputs={inputs} blocked={blocked} results={results} plots={plots} />;
}

const styles = StyleSheet.create({
  fields: { gap: space.md },
  source: { gap: space.xxs },
  plots: { gap: space.xl },
});
