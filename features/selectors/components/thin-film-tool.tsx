import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import { designInterferenceFilter } from '@/features/solver';
import { Card, Text, colors, space } from '@/features/ui';
import { formatNumber, formatPercent, formatQuantity } from '@/shared/format';
import { useChecked } from '../hooks/use-checked';
import { useWidth } from '../hooks/use-width';
import { THIN_FILM_FIELDS, checkThinFilm, thinFilmCurve, type ThinFilmKey, type ThinFilmText } from '../thin-film-form';
import { uvNote } from '../uv-note';
import { BlockedNote, FigureList, UvNoteView, WarningNotes } from './calculator-parts';
import { CalculatorFieldInput } from './calculator-field';
import { ToolLayout } from './tool-layout';
import { XyPlot } from './xy-plot';
import type { XySeries } from '../xy-plot-summary';

type Props = { text: ThinFilmText; onChange: (text: ThinFilmText) => void };

const percent = (v: number | null) => formatPercent(v, { maximumFractionDigits: 1 });

/** Peaks listed in words before "and N more". */
const LISTED_PEAKS = 12;

/** The thin-film (Fabry–Pérot) filter calculator: inputs, figures, the Airy curve and the tilt curve. */
export function ThinFilmTool({ text, onChange }: Props) {
  const { current, lastGood } = useChecked(text, checkThinFilm);
  const [plotWidth, onPlotLayout] = useWidth(320);
  const result = useMemo(() => {
    if (!lastGood) return null;
    const answer = designInterferenceFilter(lastGood);
    return { input: lastGood, answer, curve: thinFilmCurve(lastGood, answer) };
  }, [lastGood]);
  const errors = current.ok ? {} : current.errors;
  const set = (key: ThinFilmKey) => (value: string) => onChange({ ...text, [key]: value });

  const inputs = (
    <View style={styles.fields}>
      {THIN_FILM_FIELDS.map((field) => (
        <CalculatorFieldInput
          key={field.key}
          field={field}
          value={text[field.key]}
          onChange={set(field.key)}
          error={errors[field.key]}
          testID={`thin-film-${field.key}`}
        />
      ))}
    </View>
  );

  if (!result) {
    return (
      <ToolLayout
        testID="thin-film-tool"
        stale={false}
        inputs={inputs}
        blocked={<BlockedNote errors={errors} hasResults={false} testID="thin-film-blocked" />}
        results={null}
        plots={null}
      />
    );
  }
  const { input, answer, curve } = result;
  const peaks = answer.peaksNm;
  const peakWords =
    peaks.length === 0
      ? 'none in the range'
      : peaks.slice(0, LISTED_PEAKS).map((p) => formatNumber(p, 5)).join(', ') +
        ' nm' +
        (answer.peakCount > LISTED_PEAKS ? ` and ${answer.peakCount - LISTED_PEAKS} more` : '');
  const lastTilt = answer.tilt[answer.tilt.length - 1];
  const figures = [
    { id: 'thickness', label: 'Spacer thickness', value: `${formatQuantity(answer.spacerThicknessNm, 'nm', 5)}` },
    { id: 'finesse', label: 'Finesse', value: formatNumber(answer.finesse, 4) },
    { id: 'fwhm', label: 'FWHM', value: formatQuantity(answer.fwhmNm, 'nm', 4) },
    { id: 'fsr', label: 'Free spectral range', value: formatQuantity(answer.freeSpectralRangeNm, 'nm', 4) },
    {
      id: 'tilt',
      label: lastTilt ? `Peak at ${formatNumber(lastTilt.tiltDeg, 3)}° tilt` : 'Peak when tilted',
      value: lastTilt ? formatQuantity(lastTilt.peakNm, 'nm', 5) : '—',
    },
  ];
  const airy: XySeries[] = [
    { label: 'Transmission', unit: '', values: curve.ys, color: colors.primary, format: (v) => percent(v) },
  ];
  const tilt: XySeries[] = [
    {
      label: 'Peak wavelength',
      unit: 'nm',
      values: answer.tilt.map((t) => t.peakNm),
      color: colors.accent,
    },
  ];
  const results = (
    <Card title="Results">
      <FigureList figures={figures} testID="thin-film-figures" />
      <View style={styles.peaks}>
        <Text variant="small" weight="semibold">
          {`Transmission peaks in ${formatNumber(input.rangeNm.startNm)}–${formatQuantity(input.rangeNm.endNm, 'nm')} (${answer.peakCount})`}
        </Text>
        <Text variant="number" testID="thin-film-peaks">
          {peakWords}
        </Text>
      </View>
      <WarningNotes warnings={answer.warnings} testID="thin-film-warning" />
      <UvNoteView note={uvNote(input.rangeNm.startNm)} testID="thin-film-uv" />
    </Card>
  );
  const plots = (
    <Card title="Plots">
      <View onLayout={onPlotLayout} style={styles.plots}>
        <XyPlot
          testID="thin-film-airy"
          title="Transmission at normal incidence"
          width={Math.max(240, plotWidth)}
          xs={curve.xs}
          xName="wavelength"
          xTitle="Wavelength (nm)"
          xUnit="nm"
          series={airy}
          yTitle="transmission"
          yTickFormat=".0%"
          yDomain={[0, 1]}
          markers={[{ x: input.targetNm, color: colors.accent }]}
          summaryExtra={peaks.length > 0 ? `peaks at ${peakWords}; target ${formatQuantity(input.targetNm, 'nm', 5)}` : null}
          caption={`Lossless Airy function 1 / (1 + F sin²(δ/2)), F = 4R/(1 − R)², for mirrors of reflectance ${percent(input.mirrorReflectance)} (Hecht, Optics, §9.6). Dashed: the target.`}
        />
        <XyPlot
          testID="thin-film-tilt"
          title="Peak wavelength against tilt"
          width={Math.max(240, plotWidth)}
          xs={answer.tilt.map((t) => t.tiltDeg)}
          xName="tilt"
          xTitle="Tilt from the normal (°)"
          xUnit="°"
          series={tilt}
          yTitle="peak, nm"
          caption={`λ(θ) = λ₀ √(1 − (sin θ / n_eff)²) with n_eff = ${formatNumber(input.effectiveIndex ?? input.spacerIndex, 4)}: tilting only ever moves the peak shorter.`}
        />
      </View>
    </Card>
  );
  return (
    <ToolLayout
      testID="thin-film-tool"
      stale={!current.ok}
      inputs={inputs}
      blocked={current.ok ? null : <BlockedNote errors={errors} hasResults testID="thin-film-blocked" />}
      results={results}
      plots={plots}
    />
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.md },
  peaks: { gap: space.xxs },
  plots: { gap: space.xl },
});
