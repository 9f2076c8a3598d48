import { memo } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Evaluation, WavelengthPoint } from '@/features/solver';
import { Card, Text, TextField, space } from '@/features/ui';
import type { Design } from '@/shared/design';
import { formatInteger, formatMachineNumber, formatNumber, formatPercent, formatQuantity } from '@/shared/format';
import { carriesOwnUnit } from '../form-model';
import { overlapsText } from '../overlaps';
import { clampToRange } from '../readout-wavelength';
import { stepKeyProps } from '../step-keys';
import type { SelectedReadout } from '../hooks/use-workbench';
import { ResultMarkers } from '../field-marks';
import { markEditStart } from '../perf-marks';
import { FigureList, type Figure } from './figure-list';

function pointFigures(p: WavelengthPoint): Figure[] {
  return [
    { label: 'Incidence α', value: formatNumber(p.incidenceDeg, 5), unit: '°' },
    { label: 'Diffraction β', value: formatNumber(p.diffractionDeg, 5), unit: '°' },
    {
      label: 'Grating rotation φ',
      value: formatNumber(p.gratingRotationDeg, 5),
      unit: '°',
      testID: 'readout-rotation',
    },
    { label: 'Angular dispersion', value: formatNumber(p.angularDispersionDegPerNm), unit: '°/nm' },
    { label: 'Linear dispersion', value: formatNumber(p.linearDispersionMmPerNm), unit: 'mm/nm' },
    {
      label: 'Reciprocal linear dispersion',
      value: formatNumber(p.reciprocalDispersionNmPerMm),
      unit: 'nm/mm',
      testID: 'readout-rld',
    },
    { label: 'Anamorphic magnification', value: formatNumber(p.anamorphicMagnification) },
    { label: 'Bandpass (FWHM)', value: formatNumber(p.bandpassNm), unit: 'nm', testID: 'readout-bandpass' },
    {
      label: 'Slit function',
      value: p.slitFunction
        ? p.slitFunction.shape === 'triangle'
          ? `triangle, base ${formatNumber(p.slitFunction.baseNm)}`
          : `trapezoid, base ${formatNumber(p.slitFunction.baseNm)}, top ${formatNumber(p.slitFunction.topNm)}`
        : '—',
      unit: 'nm',
    },
    { label: 'Diffraction limit λ/(|m|N)', value: formatNumber(p.diffractionLimitNm), unit: 'nm' },
    { label: 'Resolving power λ/Δλ', value: formatNumber(p.resolvingPower, 3), testID: 'readout-resolving-power' },
    { label: 'Theoretical resolving power |m|N', value: formatNumber(p.theoreticalResolvingPower, 3) },
    { label: 'Free spectral range λ/|m|', value: formatNumber(p.freeSpectralRangeNm), unit: 'nm' },
    {
      label: 'Blaze efficiency (scalar estimate)',
      value: formatPercent(p.blazeEfficiency),
      testID: 'readout-efficiency',
    },
    {
      label: 'Other orders at this angle',
      value:
        p.overlapCount === 0
          ? 'none'
          : overlapsText(p, (o) => `m=${formatInteger(o.order)}: ${formatQuantity(o.wavelengthNm, 'nm')}`, ', '),
    },
    { label: 'Scan sensitivity', value: formatNumber(p.scanSensitivityNmPerArcsec, 3), unit: 'nm per arc-second' },
  ];
}

function designFigures(evaluation: Evaluation): Figure[] {
  const d = evaluation.design;
  const a = d.aberrations;
  const figures: Figure[] = [
    {
      label: 'Reachable wavelengths in this mount',
      value: `${formatNumber(d.reachableMinNm)} – ${formatNumber(d.reachableMaxNm)}`,
      unit: 'nm',
    },
    {
      label: 'Grating rotation over the range',
      value:
        d.gratingRotationStartDeg === null || d.gratingRotationEndDeg === null
          ? '—'
          : `${formatNumber(d.gratingRotationStartDeg)} → ${formatNumber(d.gratingRotationEndDeg)}`,
      unit: '°',
    },
    { label: 'Blaze wavelength in this mount', value: formatNumber(d.blazeWavelengthInMountNm), unit: 'nm' },
    { label: 'Grooves illuminated N', value: formatNumber(d.illuminatedGrooves, 5) },
    {
      label: 'f-number (projected width)',
      value: d.fNumberProjectedWidth === null ? '—' : `f/${formatNumber(d.fNumberProjectedWidth, 3)}`,
    },
    { label: 'f-number (height)', value: `f/${formatNumber(d.fNumberHeight, 3)}` },
    {
      label: 'Coma-free camera angle at centre',
      value: formatNumber(a.comaFreeCameraOffAxisDeg),
      unit: '°',
      testID: 'readout-coma-free',
    },
    {
      label: 'Coma imbalance at start / end',
      value:
        a.comaResidualAtStartDeg === null || a.comaResidualAtEndDeg === null
          ? '—'
          : `${formatNumber(a.comaResidualAtStartDeg, 2)} / ${formatNumber(a.comaResidualAtEndDeg, 2)}`,
      unit: '°',
    },
    {
      label: 'Astigmatic focal difference (collimator / camera)',
      value:
        a.collimatorAstigmatismMm === null && a.cameraAstigmatismMm === null
          ? '—'
          : `${formatNumber(a.collimatorAstigmatismMm, 3)} / ${formatNumber(a.cameraAstigmatismMm, 3)}`,
      unit: 'mm',
    },
  ];
  if (d.detector) {
    const det = d.detector;
    figures.push(
      { label: 'Detector edges', value: `${formatNumber(det.startNm, 5)} – ${formatNumber(det.endNm, 5)}`, unit: 'nm' },
      {
        label: 'Detector coverage',
        value: `${formatNumber(det.coverageNm)}${det.coversRange ? '' : ' (not the whole range)'}`,
        unit: 'nm',
      },
      { label: 'Per pixel at centre', value: formatNumber(det.nmPerPixel), unit: 'nm' },
      {
        label: 'Pixels per resolution element (fewest over the range)',
        value: formatNumber(det.pixelsPerResolutionElement, 3),
        testID: 'readout-pixels-per-bandpass',
      },
    );
  }
  return figures;
}

type Props = {
  evaluation: Evaluation;
  selectedText: string;
  onChangeSelected: (text: string) => void;
  selected: SelectedReadout;
  /** Why the read-out wavelength just moved (a range change); null when it did not. */
  note: string | null;
  /** The design's range: ArrowUp/ArrowDown step the read-out within it. */
  range: Design['range'];
  dimmed: boolean;
};

/** Every figure of the solver at the chosen wavelength, then the figures of the whole design. */
export const ReadoutCard = memo(function ReadoutCard({
  evaluation,
  selectedText,
  onChangeSelected,
  selected,
  note,
  range,
  dimmed,
}: Props) {
  const change = (text: string) => {
    markEditStart();
    onChangeSelected(text);
  };
  // 1 nm a step (10 with Shift), within the range.
  const step = (direction: 1 | -1, times: number): boolean => {
    if (!selected.ok) return false;
    const from = selected.wavelengthNm;
    const next = clampToRange(direction > 0 ? Math.floor(from) + times : Math.ceil(from) - times, range);
    change(formatMachineNumber(next));
    return true;
  };
  return (
    <Card title="At one wavelength" testID="readout-card">
      <TextField
        label="Wavelength to read out"
        value={selectedText}
        onChangeText={change}
        unit={carriesOwnUnit(selectedText) ? undefined : 'nm'}
        numeric
        {...stepKeyProps(step)}
        error={selected.ok ? null : selected.message}
        hint="Type a wavelength, or tap a plot."
        autoCapitalize="none"
        testID="field-readout-wavelength"
      />
      <ResultMarkers />
      {note ? (
        <Text variant="small" tone="warning" role="status" testID="readout-moved">
          {note}
        </Text>
      ) : null}
      <View style={dimmed ? styles.dimmed : undefined}>
        {selected.ok ? (
          selected.point.reachable ? (
            <FigureList figures={pointFigures(selected.point)} />
          ) : (
            <Text tone="danger" testID="readout-unreachable">
              {formatQuantity(selected.wavelengthNm, 'nm')} cannot be reached: {selected.point.reason}
            </Text>
          )
        ) : null}
      </View>
      <Text variant="small" weight="semibold">
        Whole design
      </Text>
      <View style={dimmed ? styles.dimmed : undefined}>
        <FigureList figures={designFigures(evaluation)} />
      </View>
      <Text variant="caption" tone="muted">
        Efficiency is a scalar estimate of the blaze envelope; it ignores polarisation and groove shape, so
        use the grating maker’s measured curves for throughput budgets.
      </Text>
    </Card>
  );
});

const styles = StyleSheet.create({
  dimmed: { opacity: 0.45, gap: space.sm },
});
