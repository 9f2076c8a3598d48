import { Pressable, StyleSheet, View, type TextStyle } from 'react-native';
import type { VersionHeader } from '@/shared/notebooks';
import type { VersionReviewState } from '@/shared/reviews';
import { ReviewStateBadge } from '@/features/reviews';
import { Text, colors, fonts, radius, space, useLayout } from '@/features/ui';
import { formatWhen, summaryFigures } from '../format';

type Props = {
  versions: readonly VersionHeader[];
  /** The version on screen, marked in the table. */
  current: number;
  baselineVersion: number | null;
  onOpen: (n: number) => void;
  onCompare: (a: number, b: number) => void;
  /** Each version's review state and open threads, by number; missing while they load. */
  reviewStates?: ReadonlyMap<number, VersionReviewState>;
};

const REQUIREMENTS_COLUMN = 'Requirements';
const columns = ['Version', 'Message', 'Review', 'Author', 'Saved', 'Range', 'Bandpass', 'R', 'f-number', REQUIREMENTS_COLUMN, ''] as const;
const columnStyle: TextStyle[] = [
  { width: 72 },
  { flex: 2, minWidth: 0 },
  { width: 160 },
  { flex: 1, minWidth: 0 },
  { width: 150 },
  { width: 120 },
  { width: 96 },
  { width: 72 },
  { width: 72 },
  { width: 104 },
  { width: 190 },
];

function Badge({ label, tone }: { label: string; tone: 'accent' | 'primary' }) {
  return (
    <View style={[styles.badge, tone === 'accent' ? styles.badgeAccent : styles.badgePrimary]}>
      <Text variant="caption" weight="semibold" style={tone === 'accent' ? styles.badgeAccentText : styles.badgePrimaryText}>
        {label}
      </Text>
    </View>
  );
}

function openThreadsText(count: number): string {
  return count === 1 ? '1 open thread' : `${count} open threads`;
}

/** A version's review state in words, and its open threads when there are any. */
function ReviewCell({ n, state }: { n: number; state: VersionReviewState | undefined }) {
  if (!state) return null;
  return (
    <View style={styles.cellStack}>
      <ReviewStateBadge state={state.state} compact testID={`history-review-state-${n}`} />
      {state.openThreads > 0 ? (
        <Text variant="caption" tone="muted" testID={`history-open-threads-${n}`}>
          {openThreadsText(state.openThreads)}
        </Text>
      ) : null}
    </View>
  );
}

/** Danger when a requirement fails; the words say so too, so the colour is never the only sign. */
function requirementsTone(version: VersionHeader): 'danger' | undefined {
  return (version.summary.requirements?.failing.length ?? 0) > 0 ? 'danger' : undefined;
}

/** Newest first: number, author, date, message, review state and the figures a reviewer scans for. */
export function HistoryTable({ versions, current, baselineVersion, onOpen, onCompare, reviewStates }: Props) {
  const layout = useLayout();
  // Eleven columns need a wide screen: on a tablet the message and author were squeezed to a letter
  // a line, so tablets get the phone's stacked rows.
  const wide = layout === 'wide';
  // The column appears once a version states requirements: a notebook without any keeps its
  // table as it was, and its message column the room it had.
  const showRequirements = versions.some((version) => (version.summary.requirements?.total ?? 0) > 0);
  return (
    <View role="table" aria-label="Version history" testID="history-table">
      {wide ? (
        <View role="row" style={[styles.row, styles.headerRow]}>
          {columns.map((title, i) => (title === REQUIREMENTS_COLUMN && !showRequirements ? null : (
            <Text key={title || 'actions'} role="columnheader" variant="caption" tone="muted" weight="semibold" style={columnStyle[i]}>
              {title.toUpperCase()}
            </Text>
          )))}
        </View>
      ) : null}
      {versions.map((version) => {
        const figures = summaryFigures(version.summary);
        const marks = (
          <>
            {version.number === current ? <Badge label="On screen" tone="primary" /> : null}
            {version.number === baselineVersion ? <Badge label="Baseline" tone="accent" /> : null}
          </>
        );
        const actions = (
          <View style={styles.actions}>
            {version.number !== current ? (
              <Pressable role="link" onPress={() => onOpen(version.number)} testID={`open-v${version.number}`} style={styles.linkBox}>
                <Text weight="semibold" style={styles.link}>
                  Open v{version.number}
                </Text>
              </Pressable>
            ) : null}
            {version.parentNumber !== null ? (
              <Pressable
                role="link"
                accessibilityLabel={`Compare with v${version.parentNumber}, from v${version.number}`}
                onPress={() => onCompare(version.parentNumber as number, version.number)}
                testID={`compare-v${version.number}`}
                style={styles.linkBox}
              >
                <Text weight="semibold" style={styles.link}>
                  Compare with v{version.parentNumber}
                </Text>
              </Pressable>
            ) : null}
          </View>
        );
        const author = version.author?.displayName ?? 'Former member';
        const review = <ReviewCell n={version.number} state={reviewStates?.get(version.number)} />;
        if (!wide) {
          return (
            <View key={version.number} role="row" style={[styles.block, version.number === current && styles.currentRow]} testID={`history-v${version.number}`}>
              <View style={styles.blockLine}>
                <Text role="cell" variant="number" weight="semibold">
                  v{version.number}
                </Text>
                {marks}
              </View>
              <Text role="cell" weight="semibold">
                {version.message}
              </Text>
              <View role="cell">{review}</View>
              <Text role="cell" variant="small" tone="muted">
                {author} · {formatWhen(version.createdAt)}
              </Text>
              <Text role="cell" variant="small">
                {figures.range} · bandpass {figures.bandpass} · R {figures.resolvingPower} · {figures.fNumber}
              </Text>
              {figures.hasRequirements ? (
                <Text
                  role="cell"
                  variant="small"
                  tone={requirementsTone(version)}
                  aria-label={figures.requirementsLabel}
                  testID={`history-requirements-${version.number}`}
                >
                  Requirements: {figures.requirements}
                </Text>
              ) : null}
              <View role="cell">{actions}</View>
            </View>
          );
        }
        return (
          <View key={version.number} role="row" style={[styles.row, version.number === current && styles.currentRow]} testID={`history-v${version.number}`}>
            <View role="cell" style={[columnStyle[0], styles.cellStack]}>
              <Text variant="number" weight="semibold">
                v{version.number}
              </Text>
              {marks}
            </View>
            <Text role="cell" style={columnStyle[1]}>
              {version.message}
            </Text>
            <View role="cell" style={columnStyle[2]}>
              {review}
            </View>
            <Text role="cell" variant="small" tone="muted" style={columnStyle[3]}>
              {author}
            </Text>
            <Text role="cell" variant="small" tone="muted" style={columnStyle[4]}>
              {formatWhen(version.createdAt)}
            </Text>
            <Text role="cell" variant="number" style={[styles.figure, columnStyle[5]]}>
              {figures.range}
            </Text>
            <Text role="cell" variant="number" style={[styles.figure, columnStyle[6]]}>
              {figures.bandpass}
            </Text>
            <Text role="cell" variant="number" style={[styles.figure, columnStyle[7]]}>
              {figures.resolvingPower}
            </Text>
            <Text role="cell" variant="number" style={[styles.figure, columnStyle[8]]}>
              {figures.fNumber}
            </Text>
            {showRequirements ? (
              <Text
                role="cell"
                variant="number"
                tone={requirementsTone(version)}
                aria-label={figures.requirementsLabel}
                style={[styles.figure, columnStyle[9]]}
                testID={`history-requirements-${version.number}`}
              >
                {figures.requirements}
              </Text>
            ) : null}
            <View role="cell" style={columnStyle[10]}>
              {actions}
            </View>
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingVertical: space.sm,
    paddingHorizontal: space.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  headerRow: { borderBottomWidth: 2 },
  currentRow: { backgroundColor: '#FFF8F1' },
  cellStack: { gap: space.xxs, alignItems: 'flex-start' },
  figure: { fontSize: 14 },
  block: { gap: space.xxs, paddingVertical: space.md, paddingHorizontal: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  blockLine: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  actions: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md },
  linkBox: { minHeight: 32, justifyContent: 'center' },
  link: { color: colors.primary, fontSize: 14, textDecorationLine: 'underline', fontFamily: fonts.semibold },
  badge: { borderRadius: radius.sm, paddingHorizontal: space.xs, alignSelf: 'flex-start' },
  badgeAccent: { backgroundColor: colors.accent },
  badgeAccentText: { color: colors.onPrimary },
  badgePrimary: { backgroundColor: colors.surfaceSunken },
  badgePrimaryText: { color: colors.primary },
});

export { Badge };
