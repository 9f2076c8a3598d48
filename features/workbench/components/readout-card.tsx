import { memo } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Evaluation, WavelengthPoint } from '@/features/solver';
import { Card, Text, TextField, space } from '@/features/ui';
import { fmt, overlapsText, percent } from '../format';
import type { SelectedReadout } from '../hooks/use-workbench';
import { markEditStart } from '../perf-marks';
import { FigureList, type Figure } from './figure-list';

function pointFigures(p: WavelengthPoint): Figure[] {
  return [
    { label: 'Incidence α', value: fmt(p.incidenceDeg, 5), unit: '°' },
    { label: 'Diffraction β', value: fmt(p.diffractionDeg, 5), unit: '°' },
    {
      label: 'Grating rotation φ',
      value: fmt(p.gratingRotationDeg, 5),
      unit: '°',
      testID: 'readout-rotation',
    },
    { label: 'Angular dispersion', value: fmt(p.angularDispersionDegPerNm), unit: '°/nm' },
    { label: 'Linear dispersion', value: fmt(p.linearDispersionMmPerNm), unit: 'mm/nm' },
    {
      label: 'Reciprocal linear dispersion',
      value: fmt(p.reciprocalDispersionNmPerMm),
      unit: 'nm/mm',
      testID: 'readout-rld',
    },
    { label: 'Anamorphic magnification', value: fmt(p.anamorphicMagnification) },
    { label: 'Bandpass (FWHM)', value: fmt(p.bandpassNm), unit: 'nm', testID: 'readout-bandpass' },
    {
      label: 'Slit function',
      value: p.slitFunction
        ? p.slitFunction.shape === 'triangle'
          ? `triangle, base ${fmt(p.slitFunction.baseNm)}`
          : `trapezoid, base ${fmt(p.slitFunction.baseNm)}, top ${fmt(p.slitFunction.topNm)}`
        : '—',
      unit: 'nm',
    },
    { label: 'Diffraction limit λ/(|m|N)', value: fmt(p.diffractionLimitNm), unit: 'nm' },
    { label: 'Resolving power λ/Δλ', value: fmt(p.resolvingPower, 3), testID: 'readout-resolving-power' },
    { label: 'Theoretical resolving power |m|N', value: fmt(p.theoreticalResolvingPower, 3) },
    { label: 'Free spectral range λ/|m|', value: fmt(p.freeSpectralRangeNm), unit: 'nm' },
    {
      label: 'Blaze efficiency (scalar estimate)',
      value: percent(p.blazeEfficiency),
      testID: 'readout-efficiency',
    },
    {
      label: 'Other orders at this angle',
      value:
        p.overlapCount === 0
          ? 'none'
          : overlapsText(p, (o) => `m=${o.order}: ${fmt(o.wavelengthNm)} nm`, ', '),
    },
    { label: 'Scan sensitivity', value: fmt(p.scanSensitivityNmPerArcsec, 3), unit: 'nm per arc-second' },
  ];
}

function designFigures(evaluation: Evaluation): Figure[] {
  const d = evaluation.design;
  const a = d.aberrations;
  const figures: Figure[] = [
    {
      label: 'Reachable wavelengths in this mount',
      value: `${fmt(d.reachableMinNm)} – ${fmt(d.reachableMaxNm)}`,
      unit: 'nm',
    },
    {
      label: 'Grating rotation over the range',
      value:
        d.gratingRotationStartDeg === null || d.gratingRotationEndDeg === null
          ? '—'
          : `${fmt(d.gratingRotationStartDeg)} → ${fmt(d.gratingRotationEndDeg)}`,
      unit: '°',
    },
    { label: 'Blaze wavelength in this mount', value: fmt(d.blazeWavelengthInMountNm), unit: 'nm' },
    { label: 'Grooves illuminated N', value: fmt(d.illuminatedGrooves, 5) },
    {
      label: 'f-number (projected width)',
      value: d.fNumberProjectedWidth === null ? '—' : `f/${fmt(d.fNumberProjectedWidth, 3)}`,
    },
    { label: 'f-number (height)', value: `f/${fmt(d.fNumberHeight, 3)}` },
    {
      label: 'Coma-free camera angle at centre',
      value: fmt(a.comaFreeCameraOffAxisDeg),
      unit: '°',
      testID: 'readout-coma-free',
    },
    {
      label: 'Coma imbalance at start / end',
      value:
        a.comaResidualAtStartDeg === null || a.comaResidualAtEndDeg === null
          ? '—'
          : `${fmt(a.comaResidualAtStartDeg, 2)} / ${fmt(a.comaResidualAtEndDeg, 2)}`,
      unit: '°',
    },
    {
      label: 'Astigmatic focal difference (collimator / camera)',
      value:
        a.collimatorAstigmatismMm === null && a.cameraAstigmatismMm === null
          ? '—'
          : `${fmt(a.collimatorAstigmatismMm, 3)} / ${fmt(a.cameraAstigmatismMm, 3)}`,
      unit: 'mm',
    },
  ];
  if (d.detector) {
    const det = d.detector;
    figures.push(
      { label: 'Detector edges', value: `${fmt(det.startNm, 5)} – ${fmt(det.endNm, 5)}`, unit: 'nm' },
      {
        label: 'Detector coverage',
        value: `${fmt(det.coverageNm)}${det.coversRange ? '' : ' (not the whole range)'}`,
        unit: 'nm',
      },
      { label: 'Per pixel at centre', value: fmt(det.nmPerPixel), unit: 'nm' },
      {
        label: 'Pixels per bandpass',
        value: fmt(det.pixelsPerBandpass, 3),
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
  dimmed: boolean;
};

/** Every figure of the solver at the chosen wavelength, then the figures of the whole design. */
export const ReadoutCard = memo(function ReadoutCard({
  evaluation,
  selectedText,
  onChangeSelected,
  selected,
  dimmed,
}: Props) {
  return (
    <Card title="At one wavelength" testID="readout-card">
      <TextField
        label="Wavelength to read out"
        value={selectedText}
        onChangeText={(text) => {
          markEditStart();
          onChangeSelected(text);
        }}
        unit="nm"
        numeric
        error={selected.ok ? null : selected.message}
        hint="Type a wavelength, or tap a plot."
        autoCapitalize="none"
        testID="field-readout-wavelength"
      />
      <View style={dimmed ? styles.dimmed : undefined}>
        {selected.ok ? (
          selected.point.reachable ? (
            <FigureList figures={pointFigures(selected.point)} />
          ) : (
            <Text tone="danger" testID="readout-unreachable">
              {fmt(selected.wavelengthNm)} nm cannot be reached: {selected.point.reason}
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
