import { StyleSheet, View } from 'react-native';
import type { Design } from '@/shared/design';
import type { Version } from '@/shared/notebooks';
import { Button, Card, Text, colors, radius, space } from '@/features/ui';
import { editorFieldName, formatParamAt, formatWhen } from '../format';
import { conflictRows } from '../rebase';

type Props = {
  latest: Version;
  baseVersion: number;
  mine: Design | null;
  myNotes: string;
  busy: boolean;
  /** Null while the version the edits started from is still loading. */
  onReapply: (() => void) | null;
  onSaveOnTop: () => void;
  onDiscard: () => void;
};

/**
 * Someone saved while this user was editing. Both are shown — the newest version and the user's
 * edits — and nothing happens until the user picks how to go on.
 */
export function ConflictCard({ latest, baseVersion, mine, myNotes, busy, onReapply, onSaveOnTop, onDiscard }: Props) {
  const rows = mine ? conflictRows(mine, latest.params) : [];
  const notesDiffer = myNotes.trim() !== latest.notes.trim();
  return (
    <Card title="Saved by someone else meanwhile" testID="conflict-card" style={styles.card}>
      <Text role="alert">
        Your edits started from v{baseVersion}. Since then v{latest.number} “{latest.message}” was saved by{' '}
        {latest.author?.displayName ?? 'a former member'} ({formatWhen(latest.createdAt)}). Nothing has been overwritten.
      </Text>
      <View role="table" aria-label={`Latest version ${latest.number} and your edits`} style={styles.table}>
        <View role="row" style={[styles.row, styles.header]}>
          <Text role="columnheader" variant="caption" weight="semibold" tone="muted" style={styles.path}>
            PARAMETER
          </Text>
          <Text role="columnheader" variant="caption" weight="semibold" tone="muted" style={styles.value}>
            LATEST v{latest.number}
          </Text>
          <Text role="columnheader" variant="caption" weight="semibold" tone="muted" style={styles.value}>
            YOURS
          </Text>
        </View>
        {rows.length === 0 ? (
          <Text variant="small" tone="muted" style={styles.emptyRow}>
            {mine ? 'Your parameters equal the latest version’s.' : 'Your edits do not form a complete design yet.'}
          </Text>
        ) : (
          rows.map((row) => (
            <View key={row.path} role="row" style={styles.row} testID={`conflict-${row.path}`}>
              <Text role="cell" variant="small" style={styles.path}>
                {editorFieldName(row.path, latest.params, mine)}
              </Text>
              <Text role="cell" variant="number" style={styles.value}>
                {formatParamAt(row.path, row.latest)}
              </Text>
              <Text role="cell" variant="number" style={[styles.value, styles.mine]}>
                {formatParamAt(row.path, row.mine)}
              </Text>
            </View>
          ))
        )}
      </View>
      {notesDiffer ? (
        <Text variant="small" tone="muted">
          The notes differ too; yours are kept in the notes box under “Save version” whichever way you go on.
        </Text>
      ) : null}
      <View style={styles.actions}>
        <Button
          label={`Start from v${latest.number} and re-apply my changes`}
          onPress={onReapply ?? undefined}
          disabled={busy || onReapply === null || mine === null}
          testID="rebase-reapply"
        />
        <Button kind="secondary" label={`Save mine as is, on top of v${latest.number}`} onPress={onSaveOnTop} disabled={busy || mine === null} testID="rebase-save-on-top" />
        <Button kind="quiet" label={`Drop my edits and open v${latest.number}`} onPress={onDiscard} disabled={busy} testID="rebase-discard" />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { borderColor: colors.warning, borderWidth: 2 },
  table: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden' },
  row: { flexDirection: 'row', gap: space.sm, paddingVertical: space.xs, paddingHorizontal: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  header: { backgroundColor: colors.surfaceSunken },
  emptyRow: { padding: space.sm },
  path: { flex: 2, minWidth: 0 },
  value: { flex: 1, minWidth: 0, fontSize: 14 },
  mine: { color: colors.accent },
  actions: { gap: space.sm },
});
