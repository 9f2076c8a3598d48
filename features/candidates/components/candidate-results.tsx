import { ScrollView, StyleSheet, View } from 'react-native';
import { Button, Text, colors, fonts, radius, space, type, useLayout } from '@/features/ui';
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
          accessibilityLabel={`Open candidate ${rank} in the workbench`}
          onPress={() => onOpen(candidate)}
          testID={`candidate-open-${rank}`}
        />
      ) : null}
      {onSave ? (
        <Button
          kind="quiet"
          label={save?.status === 'saved' ? 'Saved' : 'Save as a new version'}
          accessibilityLabel={`Save candidate ${rank} as a new version`}
          onPress={() => onSave(candidate, rank)}
          disabled={busy || save?.status === 'saved'}
          testID={`candidate-save-${rank}`}
        />
      ) : null}
      <SaveNote state={save} rank={rank} />
    </View>
  );
}

/** The candidates best first: cards on a phone, a table (scrolling sideways when narrow) from tablets up. */
export function CandidateResults(props: Props) {
  const phone = useLayout() === 'phone';
  const { candidates } = props;
  if (phone) {
    return (
      <View role="list" aria-label="Candidate designs, best first" style={styles.cards}>
        {candidates.map((candidate, index) => {
          const rank = index + 1;
          return (
            <View key={rank} role="listitem" style={styles.card} testID={`candidate-row-${rank}`}>
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
    <ScrollView horizontal contentContainerStyle={styles.scroller}>
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
