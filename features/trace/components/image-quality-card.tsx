import { memo, useCallback, useMemo, useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
// The inbox's switch: the kit has none yet.
import { Card, DisclosureButton, RadioGroup, SwitchRow, Text, colors, radius, space } from '@/features/ui';
import type { Design } from '@/shared/design';
import { formatQuantity } from '@/shared/format';
import { TRACE_LIMITS, TRACE_RAY_CHOICES, type TraceOptions } from '@/shared/trace';
import { useTrace } from '../hooks/use-trace';
import {
  astigmatismWords,
  bandpassWords,
  comaWords,
  curvatureWords,
  micrometres,
  straighteningWords,
  tiltWords,
  traceStatusWords,
  wavelengthLabel,
} from '../image-quality-words';
import type { TraceReport, TracedWavelength } from '../types';
import { lineShapeWindow } from '../line-shape-window';
import { traceWarnings } from '../warnings';
import { SmallPlot } from './small-plot';
import { SpotStrip } from './spot-strip';

export type ImageQualityCardProps = {
  design: Design;
  /** The read-out wavelength, traced besides the range's start, centre and end; null when there is none. */
  readoutNm: number | null;
  /** Phones open it on demand: the trace then runs only when asked for. */
  collapsedAtFirst: boolean;
  /** Phones swipe the spot diagrams; wider screens see them side by side. */
  strip: boolean;
};

type RayChoice = `${(typeof TRACE_RAY_CHOICES)[number]}`;
const RAY_OPTIONS = TRACE_RAY_CHOICES.map((n) => ({
  value: String(n) as RayChoice,
  label: n.toLocaleString('en-GB').replace(/,/g, '\u202F'),
  accessibilityLabel: `${n} rays per wavelength`,
}));

function Heading3({ children }: { children: string }) {
  return (
    <Text role="heading" aria-level={3} variant="small" weight="semibold">
      {children}
    </Text>
  );
}

/** The wavelength the details below the spots are for: the read-out one when traced, else the centre. */
function defaultDetail(report: TraceReport): TracedWavelength | null {
  const reachable = report.wavelengths.filter((w) => w.reachable);
  return reachable.find((w) => w.role === 'asked') ?? reachable.find((w) => w.role === 'centre') ?? reachable[0] ?? null;
}

/** Memoised, as the spots are: redrawn for a new trace, not for the status line. */
const Details = memo(function Details({ report, w, width, curved, onCurved }: { report: TraceReport; w: TracedWavelength; width: number; curved: boolean; onCurved: (on: boolean) => void }) {
  const centre = w.spots.find((s) => s.role === 'centre') ?? w.spots[0];
  const lineShape = useMemo(() => {
    const { offsetNm, traced, closedForm } = w.lineShape;
    const { from, to } = lineShapeWindow(offsetNm, [traced, closedForm]);
    const cut = (a: Float64Array) => Array.from(a.subarray(from, to + 1));
    return {
      xs: cut(offsetNm),
      series: [
        { label: 'Traced', values: cut(traced), color: colors.accent },
        { label: 'Slit-limited trapezoid', values: cut(closedForm), color: colors.primary, dash: '5 4' },
      ],
    };
  }, [w]);
  const focus = useMemo(
    () => ({
      xs: Array.from(w.throughFocus.shiftMm),
      series: [{ label: 'RMS width', values: Array.from(w.throughFocus.rmsWidthMm, (mm) => mm * 1000), color: colors.accent }],
    }),
    [w],
  );
  const minFocus = focus.series[0]!.values.reduce((best, v, i) => (v < (focus.series[0]!.values[best] ?? Infinity) ? i : best), 0);
  const plotWidth = Math.min(width, 420);
  return (
    <View style={styles.body}>
      <View style={styles.section}>
        <Heading3>Line shape (instrument function)</Heading3>
        <SmallPlot
          testID="trace-line-shape"
          summary={`Traced line shape at ${wavelengthLabel(w)} beside the slit-limited trapezoid. ${bandpassWords(w)}`}
          width={plotWidth}
          xs={lineShape.xs}
          xTitle="Offset (nm)"
          yTitle="Relative signal"
          series={lineShape.series}
          yDomain={[0, 1]}
        />
        <Text variant="small" testID="trace-bandpass">
          {bandpassWords(w)}
        </Text>
      </View>

      <View style={styles.section}>
        <Heading3>Slit-image curvature</Heading3>
        <Text variant="small" testID="trace-curvature">
          {curvatureWords(report, w)}
        </Text>
        <Text variant="small" tone="muted" testID="trace-straightening">
          {straighteningWords(report)}
        </Text>
        <SwitchRow
          label="Curved entrance slit"
          hint="Trace with the entrance slit bent to that radius"
          value={curved}
          onChange={onCurved}
          disabled={report.straighteningRadiusMm === null && !curved}
          testID="trace-curved-entrance"
        />
      </View>

      <View style={styles.section}>
        <Heading3>Astigmatism and coma</Heading3>
        <View role="list" style={styles.list} testID="trace-astigmatism">
          {astigmatismWords(w).map((line) => (
            <Text key={line} role="listitem" variant="small">
              {line}
            </Text>
          ))}
        </View>
        {centre ? (
          <Text variant="small" testID="trace-coma">
            {comaWords(centre)}
          </Text>
        ) : null}
        {report.detectorTilt ? (
          <Text variant="small" testID="trace-detector-tilt">
            {tiltWords(report.detectorTilt)}
          </Text>
        ) : null}
      </View>

      <View style={styles.section}>
        <Heading3>Through focus</Heading3>
        <SmallPlot
          testID="trace-through-focus"
          summary={`RMS width of the slit-centre spot at ${wavelengthLabel(w)} as the image plane moves along the chief ray: smallest, ${micrometres((focus.series[0]!.values[minFocus] ?? NaN) / 1000)}, at ${formatQuantity(focus.xs[minFocus], 'mm', 2)}.`}
          width={plotWidth}
          xs={focus.xs}
          xTitle="Image plane shift (mm, + away from the camera)"
          yTitle="RMS width (µm)"
          series={focus.series}
        />
      </View>
    </View>
  );
});

function Body({ design, readoutNm, strip }: { design: Design; readoutNm: number | null; strip: boolean }) {
  const [rays, setRays] = useState<RayChoice>(String(TRACE_LIMITS.defaultRays) as RayChoice);
  const [curved, setCurved] = useState(false);
  const [detailNm, setDetailNm] = useState<string | null>(null);
  const [width, setWidth] = useState(0);
  const onLayout = useCallback((event: LayoutChangeEvent) => {
    const next = Math.round(event.nativeEvent.layout.width);
    setWidth((current) => (Math.abs(current - next) >= 1 ? next : current));
  }, []);
  const options: TraceOptions = useMemo(
    () => ({ rays: Number(rays), ...(readoutNm !== null ? { atNm: [readoutNm] } : {}), ...(curved ? { curvedEntrance: true } : {}) }),
    [rays, readoutNm, curved],
  );
  const trace = useTrace(design, options);
  const report = trace.report;
  const warnings = useMemo(() => (report ? traceWarnings(report) : []), [report]);
  const reachable = report ? report.wavelengths.filter((w) => w.reachable) : [];
  const detail =
    (report && reachable.find((w) => String(w.wavelengthNm) === detailNm)) ?? (report ? defaultDetail(report) : null);
  const status = traceStatusWords({
    tracing: trace.tracing,
    failure: trace.failure,
    elapsedMs: trace.elapsedMs,
    rays: report?.raysPerWavelength ?? null,
  });
  return (
    <View onLayout={onLayout} style={styles.body} testID="trace-body">
      <RadioGroup
        label="Rays per wavelength"
        showLabel
        look="segmented"
        options={RAY_OPTIONS}
        value={rays}
        onChange={setRays}
        testID="trace-rays"
      />
      {/* Always one line high, so the card does not jump as tracing starts and ends. */}
      <Text variant="caption" tone={trace.failure && !trace.tracing ? 'danger' : 'muted'} aria-live="polite" style={styles.status} testID="trace-status">
        {status}
      </Text>
      {report ? (
        <>
          {/* The spots first: on a phone they are what the card is opened for. */}
          <Heading3>Spot diagrams</Heading3>
          <Text variant="caption" tone="muted">
            {`Where the rays from one point of the entrance slit land, x and y to the same scale; the band between the blue lines is ${report.mode === 'spectrograph' && report.pixel ? 'one pixel' : 'the exit slit'}${report.mode === 'monochromator' && report.pixel ? ', the dark mark on top one pixel' : ''}. A spot drawn out along the slit is astigmatism; a one-sided flare is coma.`}
          </Text>
          {width > 0 ? <SpotStrip report={report} width={width} strip={strip} /> : null}
          <Text variant="caption" tone="muted" testID="trace-image-plane">
            {`Image plane: ${report.imagePlane}. x along the dispersion (right: longer wavelengths), y along the slit (up: its top), to the same scale.`}
          </Text>
          {warnings.length > 0 ? (
            <View role="list" aria-label="What the trace finds" style={styles.warnings} testID="trace-warnings">
              {warnings.map((warning) => (
                <Text key={`${warning.code}-${warning.wavelengthNm}`} role="listitem" variant="small">
                  {warning.message}
                </Text>
              ))}
            </View>
          ) : null}
          {detail ? (
            <>
              <RadioGroup
                label="Details for"
                showLabel
                size="compact"
                options={reachable.map((w) => ({ value: String(w.wavelengthNm), label: wavelengthLabel(w) }))}
                value={String(detail.wavelengthNm)}
                onChange={setDetailNm}
                testID="trace-detail"
              />
              <Details report={report} w={detail} width={width} curved={curved} onCurved={setCurved} />
            </>
          ) : (
            <Text variant="small" tone="muted">
              The mount reaches none of the traced wavelengths.
            </Text>
          )}
        </>
      ) : null}
    </View>
  );
}

/** Image quality by exact ray trace: spots, the traced line shape, curvature, astigmatism and coma. */
export const ImageQualityCard = memo(function ImageQualityCard({ design, readoutNm, collapsedAtFirst, strip }: ImageQualityCardProps) {
  const [open, setOpen] = useState(!collapsedAtFirst);
  return (
    <Card title="Image quality" testID="trace-card">
      <Text variant="small" tone="muted">
        Every ray traced through the mirrors and grating, as built: what the first-order figures leave out.
      </Text>
      <View style={styles.actions}>
        <DisclosureButton open={open} onToggle={() => setOpen((o) => !o)} what="the image quality" testID="trace-toggle" />
      </View>
      {open ? <Body design={design} readoutNm={readoutNm} strip={strip} /> : null}
    </Card>
  );
});

const styles = StyleSheet.create({
  body: { gap: space.md },
  section: { gap: space.xs },
  list: { gap: space.xxs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  status: { minHeight: 16 },
  warnings: {
    gap: space.xs,
    borderLeftWidth: 3,
    borderLeftColor: colors.warning,
    borderRadius: radius.sm,
    paddingLeft: space.md,
  },
});
