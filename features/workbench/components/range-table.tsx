import { memo, useState } from 'react';
import { ScrollView, StyleSheet, Text, View, type NativeScrollEvent, type NativeSyntheticEvent } from 'react-native';
import type { WavelengthPoint } from '@/features/solver';
import { Button, Card, colors, fonts, space, type, copyText } from '@/features/ui';
import { rangeTableCsv } from '../csv';
import { formatInteger, formatNumber, formatPercent } from '@/shared/format';
import { overlapsText } from '../overlaps';

const columns = [
  { title: 'λ\nnm', width: 56, cell: (p: WavelengthPoint) => formatNumber(p.wavelengthNm, 5) },
  { title: 'rotation\n°', width: 60, cell: (p: WavelengthPoint) => formatNumber(p.gratingRotationDeg) },
  { title: 'RLD\nnm/mm', width: 56, cell: (p: WavelengthPoint) => formatNumber(p.reciprocalDispersionNmPerMm, 3) },
  { title: 'bandpass\nnm', width: 66, cell: (p: WavelengthPoint) => formatNumber(p.bandpassNm, 3) },
  { title: 'R\nλ/Δλ', width: 56, cell: (p: WavelengthPoint) => formatNumber(p.resolvingPower, 3) },
  { title: 'blaze\neff.', width: 48, cell: (p: WavelengthPoint) => formatPercent(p.blazeEfficiency) },
  {
    title: 'other\norders',
    width: 84,
    cell: (p: WavelengthPoint) =>
      p.overlapCount === 0 ? '—' : overlapsText(p, (o) => `${formatInteger(o.order)}: ${formatNumber(o.wavelengthNm, 3)}`, ', '),
  },
] as const;

/** The design across its range, a row per step, copyable as CSV for a spreadsheet. */
export const RangeTable = memo(function RangeTable({
  points,
  dimmed,
}: {
  points: readonly WavelengthPoint[];
  dimmed: boolean;
}) {
  const [copied, setCopied] = useState<null | 'ok' | 'failed'>(null);
  // On a phone the columns are wider than the card: say so, and which way the rest lies.
  const [viewWidth, setViewWidth] = useState(0);
  const [contentWidth, setContentWidth] = useState(0);
  const [atEnd, setAtEnd] = useState(false);
  const scrolls = viewWidth > 0 && contentWidth - viewWidth > 1;
  const onScroll = ({ nativeEvent: n }: NativeSyntheticEvent<NativeScrollEvent>) =>
    setAtEnd(n.contentOffset.x + n.layoutMeasurement.width >= n.contentSize.width - 2);
  return (
    <Card title="Across the range" testID="range-table">
      {scrolls ? (
        <Text style={styles.cue} testID="range-table-scroll-cue">
          {atEnd
            ? `← Scroll back for the first columns (${columns.length} in all)`
            : `Scroll sideways for all ${columns.length} columns →`}
        </Text>
      ) : null}
      <ScrollView
        horizontal
        style={dimmed ? styles.dimmed : undefined}
        onLayout={(event) => setViewWidth(event.nativeEvent.layout.width)}
        onContentSizeChange={(width) => setContentWidth(width)}
        onScroll={onScroll}
        scrollEventThrottle={32}
        // A keyboard user scrolls it with the arrow keys once it has focus (WCAG 2.1.1).
        focusable={scrolls}
        aria-label={scrolls ? 'Figures across the wavelength range, scrolls sideways' : undefined}
        testID="range-table-scroll"
      >
        <View role="table" aria-label="Figures across the wavelength range">
          <View role="row" style={[styles.row, styles.headRow]}>
            {columns.map((c) => (
              <Text key={c.title} role="columnheader" style={[styles.head, { width: c.width }]}>
                {c.title}
              </Text>
            ))}
          </View>
          {points.map((p) => (
            <View key={p.wavelengthNm} role="row" style={[styles.row, !p.reachable && styles.unreachable]}>
              {p.reachable ? (
                columns.map((c) => (
                  <Text key={c.title} role="cell" style={[styles.cell, { width: c.width }]}>
                    {c.cell(p)}
                  </Text>
                ))
              ) : (
                <>
                  <Text role="cell" style={[styles.cell, { width: columns[0].width }]}>
                    {columns[0].cell(p)}
                  </Text>
                  <Text role="cell" style={[styles.cell, styles.reason]}>
                    not reachable
                  </Text>
                </>
              )}
            </View>
          ))}
        </View>
      </ScrollView>
      <View style={styles.actions}>
        <Button
          kind="secondary"
          label="Copy as CSV"
          testID="copy-csv"
          onPress={async () => setCopied((await copyText(rangeTableCsv(points))) ? 'ok' : 'failed')}
        />
        {copied ? (
          <Text role="status" style={styles.copied}>
            {copied === 'ok' ? 'Copied — paste into a spreadsheet.' : 'Could not reach the clipboard.'}
          </Text>
        ) : null}
      </View>
    </Card>
  );
});

const styles = StyleSheet.create({
  dimmed: { opacity: 0.45 },
  row: { flexDirection: 'row', borderBottomWidth: StyleSheet.hairlineWidth, borderBottomColor: colors.line },
  headRow: { borderBottomWidth: 1, borderBottomColor: colors.inkFaint },
  head: {
    ...type.caption,
    fontFamily: fonts.semibold,
    color: colors.inkMuted,
    paddingVertical: space.xs,
    paddingRight: space.sm,
  },
  cell: {
    ...type.caption,
    fontFamily: fonts.mono,
    color: colors.ink,
    paddingVertical: space.xs,
    paddingRight: space.sm,
    fontVariant: ['tabular-nums'],
  },
  unreachable: { backgroundColor: colors.dangerSoft },
  reason: { color: colors.danger, fontFamily: fonts.semibold },
  actions: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.md },
  copied: { ...type.small, color: colors.ok, fontFamily: fonts.regular },
  cue: { ...type.caption, fontFamily: fonts.semibold, color: colors.primary },
});
