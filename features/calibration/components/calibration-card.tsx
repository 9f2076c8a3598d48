import { memo, useCallback, useDeferredValue, useMemo, useState } from 'react';
import { Pressable, StyleSheet, Text as RNText, View, type LayoutChangeEvent } from 'react-native';
import { calibrationReport, type CalibrationReport } from '@/features/solver';
import { Card, DisclosureButton, Text, colors, fonts, minTouch, radius, space, type } from '@/features/ui';
import type { Design } from '@/shared/design';
import { formatInteger, formatNumber } from '@/shared/format';
import { LAMP_ELEMENTS, LAMP_ELEMENT_WORDS, LAMP_LINES_MEDIUM, LAMP_LINES_SOURCE, type LampElement } from '@/shared/lamp-lines';
import {
  NO_DETECTOR_SENTENCE,
  coverageSentences,
  ghostSentence,
  lineNm,
  lineSource,
  linesInRangeSentence,
  pairSentence,
  placementCell,
  resolvedPairsSentence,
} from '../calibration-words';
import { DEFAULT_LAMP_ELEMENTS, designCalibrationLines, designLineListNames } from '../design-lines';
import { detectorStrip } from '../detector-strip';
import { OZONE_NOTE, cautionClosingLine, mercuryLampCautions } from '../lamp-caution';
import { DetectorStripFigure } from './detector-strip-figure';

export type CalibrationCardProps = {
  design: Design;
  /** Phones open it on demand: the line lists are long. */
  collapsedAtFirst: boolean;
};

/** Rows of the line table before "and N more": a lamp pair in range gives 40–60 lines. */
const MAX_TABLE_LINES = 40;
/** Pairs and ghosts listed in words before "and N more". */
const MAX_LISTED = 12;

/** The lamps to show, as toggle buttons whose pressed state a screen reader hears. */
function LampChoice({ chosen, onToggle }: { chosen: readonly LampElement[]; onToggle: (e: LampElement) => void }) {
  return (
    <View role="group" aria-label="Lamps shown" style={styles.choice} testID="calibration-lamps">
      {LAMP_ELEMENTS.map((element) => {
        const on = chosen.includes(element);
        const label = `${element} ${LAMP_ELEMENT_WORDS[element]}`;
        return (
          <Pressable
            key={element}
            role="button"
            aria-pressed={on}
            accessibilityLabel={label}
            onPress={() => onToggle(element)}
            testID={`calibration-lamp-${element}`}
            style={({ focused }: { pressed: boolean; focused?: boolean }) => [
              styles.toggle,
              on && styles.toggleOn,
              focused && styles.toggleFocused,
            ]}
          >
            <RNText style={[styles.toggleText, on && styles.toggleTextOn]}>{`${on ? '✓ ' : ''}${label}`}</RNText>
          </Pressable>
        );
      })}
    </View>
  );
}

/** Element, air wavelength, bandpass there and pixel, for the first lines in the range. */
function LineTable({ report, pixelCount, width }: { report: CalibrationReport; pixelCount: number | null; width: number }) {
  const rows = report.linesInRange.slice(0, MAX_TABLE_LINES);
  const more = report.linesInRangeCount - rows.length;
  // Four columns; the pixel words ("before pixel 0") get the most room.
  const cols = [0.22, 0.26, 0.2, 0.32].map((f) => Math.floor(width * f));
  return (
    <View style={styles.section}>
      <View role="table" aria-label="Lamp lines in the range" testID="calibration-line-table">
        <View role="row" style={[styles.tableRow, styles.headRow]}>
          {['Lamp', 'Air (nm)', 'Bandpass (nm)', 'Pixel'].map((head, i) => (
            <Text key={head} role="columnheader" variant="caption" weight="semibold" tone="muted" style={[styles.cellPad, { width: cols[i] }]}>
              {head}
            </Text>
          ))}
        </View>
        {rows.map((row) => (
          <View
            key={`${row.line.wavelengthNm}-${lineSource(row.line)}`}
            role="row"
            style={styles.tableRow}
            testID={`calibration-line-${row.line.wavelengthNm}`}
          >
            <Text role="cell" variant="caption" weight="semibold" style={[styles.cellPad, { width: cols[0] }]} numberOfLines={2}>
              {lineSource(row.line)}
            </Text>
            <RNText role="cell" style={[styles.num, styles.cellPad, { width: cols[1] }]}>
              {lineNm(row.line.wavelengthNm)}
            </RNText>
            <RNText role="cell" style={[styles.num, styles.cellPad, { width: cols[2] }]}>
              {row.bandpassNm === null ? 'unreachable' : formatNumber(row.bandpassNm, 3)}
            </RNText>
            <RNText
              role="cell"
              style={[styles.num, styles.cellPad, { width: cols[3] }, row.detector?.placement !== 'on-detector' && styles.off]}
              testID={`calibration-line-${row.line.wavelengthNm}-pixel`}
            >
              {placementCell(row.detector, pixelCount)}
            </RNText>
          </View>
        ))}
      </View>
      {more > 0 ? (
        <Text variant="caption" tone="muted" testID="calibration-line-more">
          {`…and ${formatInteger(more)} more.`}
        </Text>
      ) : null}
    </View>
  );
}

function Sentences({ items, total, label, testID }: { items: string[]; total: number; label: string; testID: string }) {
  if (items.length === 0) return null;
  const more = total - items.length;
  return (
    <View style={styles.section}>
      <View role="list" aria-label={label} style={styles.list} testID={testID}>
        {items.map((item) => (
          <Text key={item} role="listitem" variant="small">
            {item}
          </Text>
        ))}
      </View>
      {more > 0 ? (
        <Text variant="caption" tone="muted">
          {`…and ${formatInteger(more)} more.`}
        </Text>
      ) : null}
    </View>
  );
}

function Heading3({ children }: { children: string }) {
  return (
    <Text role="heading" aria-level={3} variant="small" weight="semibold">
      {children}
    </Text>
  );
}

/** The report, worked out only while the card is open. */
function Body({ design, elements, onToggle }: { design: Design; elements: readonly LampElement[]; onToggle: (e: LampElement) => void }) {
  const [width, setWidth] = useState(0);
  const onLayout = useCallback((event: LayoutChangeEvent) => {
    const next = Math.round(event.nativeEvent.layout.width);
    setWidth((current) => (Math.abs(current - next) >= 1 ? next : current));
  }, []);
  const lines = useMemo(() => designCalibrationLines(design, elements), [design, elements]);
  const report = useMemo(() => calibrationReport(design, lines), [design, lines]);
  const strip = useMemo(() => detectorStrip(design, lines), [design, lines]);
  const cautions = useMemo(() => (elements.includes('Hg') ? mercuryLampCautions(design) : []), [design, elements]);
  const lists = designLineListNames(design);
  const filters = design.filters ?? [];
  const unresolved = report.pairs.filter((p) => p.resolved === false);
  const pixelCount = design.detector?.pixelCount ?? null;
  return (
    <View onLayout={onLayout} style={styles.body} testID="calibration-body">
      <LampChoice chosen={elements} onToggle={onToggle} />
      <View style={styles.section}>
        <Text variant="small" weight="semibold" testID="calibration-count">
          {`${linesInRangeSentence(report.linesInRangeCount, design.range.startNm, design.range.endNm)}.`}
        </Text>
        {lists.length > 0 ? (
          <Text variant="caption" testID="calibration-user-lists">
            {`Your line ${lists.length === 1 ? 'list' : 'lists'} included: ${lists.join(', ')}.`}
          </Text>
        ) : null}
        <Text variant="caption" tone="muted" testID="calibration-source">
          {`Built-in lines: ${LAMP_LINES_SOURCE}. Wavelengths in ${LAMP_LINES_MEDIUM}.`}
        </Text>
      </View>

      <Heading3>On the detector</Heading3>
      {strip && report.coverage ? (
        <>
          {width > 0 ? <DetectorStripFigure strip={strip} width={width} /> : null}
          <View style={styles.list} testID="calibration-coverage">
            {coverageSentences(report.coverage).map((s) => (
              <Text key={s} variant="small">
                {s}
              </Text>
            ))}
          </View>
        </>
      ) : (
        <Text variant="small" tone="muted" testID="calibration-no-detector">
          {design.detector ? 'The mount cannot reach the range centre, so no line can be placed on the detector.' : NO_DETECTOR_SENTENCE}
        </Text>
      )}

      {report.linesInRangeCount > 0 ? (
        <>
          <Heading3>Lines in the range</Heading3>
          {width > 0 ? <LineTable report={report} pixelCount={pixelCount} width={width} /> : null}
        </>
      ) : null}

      <Heading3>Neighbouring pairs</Heading3>
      <Text variant="small" testID="calibration-pairs-count">
        {resolvedPairsSentence(report.pairCount, report.unresolvedPairCount)}
      </Text>
      <Sentences
        items={unresolved.slice(0, MAX_LISTED).map(pairSentence)}
        total={report.unresolvedPairCount}
        label="Pairs not resolved"
        testID="calibration-unresolved"
      />
      <Text variant="caption" tone="muted">
        Resolved when the lines are at least the bandpass (the slit function’s FWHM) apart: common practice.
      </Text>

      <Heading3>Through other orders</Heading3>
      <Text variant="small" testID="calibration-ghost-count">
        {report.ghostCount === 0
          ? 'No line reaches the range through another order.'
          : `${formatInteger(report.ghostCount)} ${report.ghostCount === 1 ? 'line shows' : 'lines show'} inside the range through another order:`}
      </Text>
      <Sentences
        items={report.ghosts.slice(0, MAX_LISTED).map((g) => ghostSentence(g, filters))}
        total={report.ghostCount}
        label="Lines through other orders"
        testID="calibration-ghosts"
      />

      {cautions.length > 0 ? (
        <View style={styles.caution} testID="calibration-mercury-caution">
          <Heading3>Working with a mercury lamp</Heading3>
          {cautions.map((c) => (
            <Text key={c.id} variant="caption">
              <Text variant="caption" weight="semibold">{`${c.title}. `}</Text>
              {c.text}
            </Text>
          ))}
          <Text variant="caption">{OZONE_NOTE}</Text>
          <Text variant="caption" tone="muted">
            {cautionClosingLine}
          </Text>
        </View>
      ) : null}
    </View>
  );
}

/** The lamp lines a design will see: where they land, which it resolves, which arrive through other orders. */
export const CalibrationCard = memo(function CalibrationCard({ design, collapsedAtFirst }: CalibrationCardProps) {
  const [open, setOpen] = useState(!collapsedAtFirst);
  // Kept here, not in the body, so closing and reopening the card keeps the lamps chosen.
  const [elements, setElements] = useState<readonly LampElement[]>(DEFAULT_LAMP_ELEMENTS);
  const onToggle = useCallback(
    (element: LampElement) =>
      setElements((current) =>
        current.includes(element) ? current.filter((e) => e !== element) : LAMP_ELEMENTS.filter((e) => e === element || current.includes(e)),
      ),
    [],
  );
  // A sweep over every line per design: it may trail the typing by a frame.
  const deferred = useDeferredValue(design);
  return (
    <Card title="Calibration lamp lines" testID="calibration-card">
      <View style={styles.actions}>
        <DisclosureButton open={open} onToggle={() => setOpen((o) => !o)} what="the lamp lines" testID="calibration-toggle" />
      </View>
      {open ? <Body design={deferred} elements={elements} onToggle={onToggle} /> : null}
    </Card>
  );
});

const styles = StyleSheet.create({
  body: { gap: space.md },
  section: { gap: space.xs },
  list: { gap: space.xs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  choice: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  toggle: {
    minHeight: minTouch,
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.primary,
    backgroundColor: colors.surface,
    justifyContent: 'center',
  },
  toggleOn: { backgroundColor: colors.primary },
  toggleFocused: { borderColor: colors.focus, borderWidth: 2 },
  toggleText: { ...type.small, fontFamily: fonts.semibold, color: colors.primary },
  toggleTextOn: { color: colors.onPrimary },
  tableRow: { flexDirection: 'row', borderTopWidth: 1, borderTopColor: colors.line, paddingVertical: space.xxs },
  headRow: { borderTopWidth: 0 },
  cellPad: { paddingRight: space.xs },
  // Inter with tabular figures, as the trade study's table: the mono face broke short cells mid-number.
  num: { ...type.caption, fontFamily: fonts.regular, fontVariant: ['tabular-nums'], color: colors.ink },
  off: { color: colors.inkMuted },
  caution: {
    gap: space.xs,
    borderLeftWidth: 3,
    borderLeftColor: colors.warning,
    borderRadius: radius.sm,
    paddingLeft: space.md,
  },
});
