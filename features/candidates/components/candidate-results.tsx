import { useState } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { Button, Text, colors, fonts, radius, space, type } from '@/features/ui';
import type { Candidate } from '@/shared/search';
import { FIGURE_COLUMNS } from '../format';

/** Where saving one candidate has got to. */
export type SaveState = { status: 'saving' } | { status: 'saved' } | { status: 'failed'; message: string };

type Props = {
  candidates: readonly Candidate[];
  onOpen?: (candidate: Candidate) => void;
  onSave?: (candidate: Candidate, rank: number) => void;
  saves: ReadonlyMap<number, SaveState>;
};

function SaveNote({ state, rank }: { state: SaveState | undefined; rank: number }) {
  if (!state) return null;
  const words =
    state.status === 'saving'
      ? 'Saving as a new version…'
      : state.status === 'saved'
        ? 'Saved as a new version.'
        : `Not saved: ${state.message}`;
  return (
    <Text variant="small" tone={state.status === 'failed' ? 'danger' : state.status === 'saved' ? 'ok' : 'muted'} testID={`candidate-save-status-${rank}`}>
      {words}
    </Text>
  );
}

function Actions({ candidate, rank, onOpen, onSave, saves }: { candidate: Candidate; rank: number } & Omit<Props, 'candidates'>) {
  const save = saves.get(rank);
  const busy = [...saves.values()].some((state) => state.status === 'saving');
  return (
    <View style={styles.actions}>
      {onOpen ? (
        <Button
          kind="secondary"
          label="Open in the workbench"
          accessibilityLabel={`Open in the workbench: candidate ${rank}`}
          onPress={() => onOpen(candidate)}
          testID={`candidate-open-${rank}`}
        />
      ) : null}
      {onSave ? (
        <Button
          kind="quiet"
          label={save?.status === 'saved' ? 'Saved' : 'Save as a new version'}
          accessibilityLabel={`${save?.status === 'saved' ? 'Saved' : 'Save as a new version'}: candidate ${rank}`}
          onPress={() => onSave(candidate, rank)}
          disabled={busy || save?.status === 'saved'}
          testID={`candidate-save-${rank}`}
        />
      ) : null}
      <SaveNote state={save} rank={rank} />
    </View>
  );
}

/**
 * Twelve figures and the actions need this much width as a table (rank 32 + figures 12 × 96 +
 * actions 260 = 1444 px); narrower, a table would hide most columns behind a sideways scroll.
 */
export const TABLE_MIN_WIDTH_PX = 1444;
/** Cards side by side from this width of the panel. */
const TWO_CARDS_MIN_WIDTH_PX = 640;

/**
 * The candidates best first: a table where the panel is wide enough for every figure, else cards
 * (one column on a phone or in the workbench's results column, two where there is room). Decided
 * by the panel's own width: the workbench puts it in a narrow column even on a wide screen.
 */
export function CandidateResults(props: Props) {
  const [widthPx, setWidthPx] = useState(0);
  const { candidates } = props;
  const measure = (event: { nativeEvent: { layout: { width: number } } }) => setWidthPx(event.nativeEvent.layout.width);
  if (widthPx < TABLE_MIN_WIDTH_PX) {
    return (
      <View
        role="list"
        aria-label="Candidate designs, best first"
        style={[styles.cards, widthPx >= TWO_CARDS_MIN_WIDTH_PX && styles.cardGrid]}
        onLayout={measure}
      >
        {candidates.map((candidate, index) => {
          const rank = index + 1;
          return (
            <View
              key={rank}
              role="listitem"
              style={[styles.card, widthPx >= TWO_CARDS_MIN_WIDTH_PX && styles.gridCard]}
              testID={`candidate-row-${rank}`}
            >
              <Text weight="semibold">
                {rank}. {FIGURE_COLUMNS[0]?.text(candidate.figures, candidate.score)}, order{' '}
                {FIGURE_COLUMNS[1]?.text(candidate.figures, candidate.score)}
              </Text>
              <View style={styles.pairs}>
                {FIGURE_COLUMNS.slice(2).map((column) => (
                  <View key={column.key} style={styles.pair}>
                    <Text variant="small" tone="muted">
                      {column.label}
                    </Text>
                    <Text variant="number" style={styles.value}>
                      {column.text(candidate.figures, candidate.score)}
                    </Text>
                  </View>
                ))}
              </View>
              <Actions candidate={candidate} rank={rank} {...props} />
            </View>
          );
        })}
      </View>
    );
  }
  return (
    <ScrollView horizontal contentContainerStyle={styles.scroller} onLayout={measure}>
      <View role="table" aria-label="Candidate designs, best first">
        <View role="row" style={[styles.row, styles.headerRow]}>
          <Text role="columnheader" variant="caption" tone="muted" weight="semibold" style={styles.rank}>
            #
          </Text>
          {FIGURE_COLUMNS.map((column) => (
            <Text key={column.key} role="columnheader" variant="caption" tone="muted" weight="semibold" style={styles.cell}>
              {column.label}
            </Text>
          ))}
          <Text role="columnheader" variant="caption" tone="muted" weight="semibold" style={styles.actionCell}>
            Actions
          </Text>
        </View>
        {candidates.map((candidate, index) => {
          const rank = index + 1;
          return (
            <View key={rank} role="row" style={styles.row} testID={`candidate-row-${rank}`}>
              <Text role="rowheader" variant="number" style={styles.rank}>
                {rank}
              </Text>
              {FIGURE_COLUMNS.map((column) => (
                <Text key={column.key} role="cell" variant="number" style={[styles.cell, styles.value]}>
                  {column.text(candidate.figures, candidate.score)}
                </Text>
              ))}
              <View role="cell" style={styles.actionCell}>
                <Actions candidate={candidate} rank={rank} {...props} />
              </View>
            </View>
          );
        })}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  cards: { gap: space.md },
  cardGrid: { flexDirection: 'row', flexWrap: 'wrap' },
  gridCard: { flexBasis: '45%', flexGrow: 1 },
  card: { gap: space.sm, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.md },
  pairs: { flexDirection: 'row', flexWrap: 'wrap', rowGap: space.xs, columnGap: space.lg },
  pair: { minWidth: 140, flexGrow: 1, flexBasis: 140 },
  value: { ...type.small, fontFamily: fonts.mono },
  actions: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  scroller: { flexGrow: 1 },
  row: { flexDirection: 'row', alignItems: 'center', borderBottomWidth: 1, borderBottomColor: colors.line, paddingVertical: space.xs },
  headerRow: { alignItems: 'flex-end' },
  rank: { width: 32 },
  cell: { width: 96, paddingRight: space.sm },
  actionCell: { width: 260 },
});
