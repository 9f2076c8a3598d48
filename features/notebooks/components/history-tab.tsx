import { useRouter, type Href } from 'expo-router';
import { useMemo, useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Notebook } from '@/shared/notebooks';
import { useReviewStatesQuery } from '@/features/reviews';
import { Button, Card, Screen, Text, space } from '@/features/ui';
import { useVersionsQuery } from '../queries';
import { HistoryTable } from './history-table';
import { VersionPicker } from './version-picker';

/** `top`: the notebook's header, when it should scroll away with the page (phones). */
export function HistoryTab({ design, current, top }: { design: Notebook; current: number; top?: ReactNode }) {
  const router = useRouter();
  const versions = useVersionsQuery(design.id);
  const states = useReviewStatesQuery(design.id);
  const reviewStates = useMemo(() => new Map(states.data?.map((state) => [state.version, state])), [states.data]);
  const [a, setA] = useState(Math.max(1, design.latestVersion - 1));
  const [b, setB] = useState(design.latestVersion);
  const compare = (before: number, after: number) => router.push(`/notebooks/${design.id}/compare?a=${before}&b=${after}` as Href);
  return (
    <Screen wide style={styles.page}>
      {top}
      {design.latestVersion > 1 ? (
        <Card title="Compare two versions" testID="compare-picker">
          <VersionPicker label="Before" count={design.latestVersion} value={a} onChange={setA} testID="pick-a" />
          <VersionPicker label="After" count={design.latestVersion} value={b} onChange={setB} testID="pick-b" />
          <View style={styles.row}>
            <Button label={`Compare v${a} with v${b}`} onPress={() => compare(a, b)} disabled={a === b} testID="open-compare" />
          </View>
        </Card>
      ) : null}
      <Card title="Versions">
        {versions.data ? (
          <HistoryTable
            versions={versions.data}
            current={current}
            baselineVersion={design.baselineVersion}
            onOpen={(n) => router.push(`/notebooks/${design.id}/v/${n}` as Href)}
            onCompare={compare}
            reviewStates={reviewStates}
          />
        ) : (
          <Text tone="muted">{versions.isError ? versions.error.message : 'Loading the history…'}</Text>
        )}
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  // Wide enough for the table's eleven columns to leave its message readable on a 1440 px screen.
  page: { maxWidth: 1400 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
