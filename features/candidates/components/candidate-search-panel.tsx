import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Design } from '@/shared/design';
import type { Candidate } from '@/shared/search';
import { Button, Text, space } from '@/features/ui';
import { cancelledWords, candidateMessage, finishedWords } from '../format';
import { useCandidateSearch } from '../hooks/use-candidate-search';
import { DEFAULT_CONTROLS, searchRequestFromDesign, type SearchControls as Controls } from '../search-request';
import { CandidateResults, type SaveState } from './candidate-results';
import { NothingPasses } from './nothing-passes';
import { SearchControls } from './search-controls';
import { SearchProgress } from './search-progress';

export type CandidateSearchPanelProps = {
  /** The design shown in the workbench: its range, source, detector and requirements are the search's input. */
  design: Design;
  /** Loads a candidate into the editor ("open in the workbench"). */
  onOpen: (design: Design) => void;
  /** Saves a candidate as a new version of the open notebook; absent where there is none or no right to save. */
  onSave?: (design: Design, message: string) => Promise<void>;
  readOnly?: boolean;
};

/**
 * The candidate search: from the design's requirements to ranked designs that meet them. The
 * search runs off the UI thread (search-runner.web.ts) so the editor stays live; the request is
 * read from the design when "Find designs" is pressed, so a search after an edit uses the edit.
 */
export function CandidateSearchPanel({ design, onOpen, onSave, readOnly = false }: CandidateSearchPanelProps) {
  const [controls, setControls] = useState<Controls>(DEFAULT_CONTROLS);
  const [saves, setSaves] = useState<ReadonlyMap<number, SaveState>>(new Map());
  const request = useMemo(() => searchRequestFromDesign(design, controls), [design, controls]);
  const { state, start, cancel } = useCandidateSearch(request);
  const requestKey = useMemo(() => JSON.stringify(request), [request]);
  const running = state.status === 'running';

  const find = () => {
    if (!request) return;
    setSaves(new Map());
    start(request);
  };

  const setSave = (rank: number, save: SaveState) => setSaves((current) => new Map(current).set(rank, save));
  const saveCandidate = onSave
    ? (candidate: Candidate, rank: number) => {
        setSave(rank, { status: 'saving' });
        onSave(candidate.design as Design, candidateMessage(rank, candidate.figures)).then(
          () => setSave(rank, { status: 'saved' }),
          (error: unknown) =>
            setSave(rank, {
              status: 'failed',
              message: error instanceof Error && error.message ? error.message : 'the server did not answer; try again.',
            }),
        );
      }
    : undefined;

  // What the live region reads out: only the start and the end of a search, never each batch.
  const announcement =
    state.status === 'running'
      ? 'Searching…'
      : state.status === 'done'
        ? finishedWords(state.answer)
        : state.status === 'cancelled'
          ? cancelledWords(state.done)
          : state.status === 'failed'
            ? state.message
            : '';

  if (!request) {
    return (
      <Text tone="muted" testID="search-needs-requirements">
        Add requirements first (bandpass, resolving power, efficiency…): the search looks for designs that meet them.
      </Text>
    );
  }

  const stale = state.status === 'done' && JSON.stringify(state.request) !== requestKey;
  return (
    <View style={styles.box} testID="candidate-search">
      <Text variant="small" tone="muted">
        Tries stock gratings, blaze wavelengths, orders, deviation angles and focal lengths for this range and source; the slit
        width is solved from the bandpass requirement.
      </Text>
      <SearchControls value={controls} onChange={setControls} />
      <View style={styles.buttons}>
        <Button label={state.status === 'idle' ? 'Find designs' : 'Find designs again'} onPress={find} testID="search-run" />
        {running ? <Button kind="secondary" label="Cancel" accessibilityLabel="Cancel the search" onPress={cancel} testID="search-cancel" /> : null}
      </View>
      {/* Left where it stopped after a cancel, so the count in the words can be seen on the bar. */}
      {running || (state.status === 'cancelled' && state.total > 0) ? <SearchProgress done={state.done} total={state.total} /> : null}
      <Text
        role="status"
        aria-live="polite"
        tone={state.status === 'failed' ? 'danger' : 'default'}
        weight="semibold"
        testID="search-status"
      >
        {announcement}
      </Text>
      {stale ? (
        <Text variant="small" tone="warning" testID="search-stale">
          The design or the search settings have changed since this search; find designs again to use them.
        </Text>
      ) : null}
      {state.status === 'done' && state.answer.candidates.length > 0 ? (
        <CandidateResults
          candidates={state.answer.candidates}
          onOpen={readOnly ? undefined : (candidate) => onOpen(candidate.design as Design)}
          onSave={readOnly ? undefined : saveCandidate}
          saves={saves}
        />
      ) : null}
      {state.status === 'done' && state.answer.candidates.length === 0 ? <NothingPasses answer={state.answer} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.md },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
