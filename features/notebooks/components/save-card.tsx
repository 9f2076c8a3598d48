import { StyleSheet, View } from 'react-native';
import { Button, Card, Text, TextField, colors, radius, space } from '@/features/ui';
import { MarkdownView } from './markdown-view';

type Props = {
  message: string;
  notes: string;
  onChangeMessage: (message: string) => void;
  onChangeNotes: (notes: string) => void;
  /** The version the new one follows, whose notes are shown read-only beside the box. */
  earlier: { number: number; notes: string };
  onStartFromEarlier: () => void;
  messageError: string | null;
  formError: string | null;
  /** Why saving is not possible now (refused fields, nothing changed), or null. */
  blockedReason: string | null;
  nextNumber: number;
  /** What the open review threads of this version are pinned to: the save leaves them unresolved. */
  openThreads?: readonly string[];
  busy: boolean;
  onSave: () => void;
};

/**
 * "Save as new version": a one-line message like a commit subject, and the new version's notes in
 * Markdown. The notes start empty; the earlier version's are beside them (under, when narrow) and
 * come in only when asked for.
 */
export function SaveCard({
  message,
  notes,
  onChangeMessage,
  onChangeNotes,
  earlier,
  onStartFromEarlier,
  messageError,
  formError,
  blockedReason,
  nextNumber,
  openThreads = [],
  busy,
  onSave,
}: Props) {
  const hasEarlierNotes = earlier.notes.trim() !== '';
  return (
    <Card title="Save as new version" testID="save-card">
      <TextField
        label="What changed (one line)"
        value={message}
        onChangeText={(text) => onChangeMessage(text.replace(/[\r\n]+/g, ' '))}
        placeholder="e.g. Narrower exit slit for the sodium doublet"
        error={messageError}
        maxLength={200}
        onSubmitEditing={onSave}
        testID="version-message"
      />
      <View style={styles.notesRow}>
        <View style={styles.notesColumn}>
          <TextField
            label={`Notes of v${nextNumber} (Markdown: # headings, - lists, *emphasis*, \`code\`)`}
            value={notes}
            onChangeText={onChangeNotes}
            placeholder={`Why v${nextNumber}? Its notes start empty.`}
            multiline
            numberOfLines={6}
            testID="version-notes"
          />
        </View>
        <View style={[styles.notesColumn, styles.earlier]} testID="earlier-notes">
          <Text variant="small" weight="semibold">
            Notes of v{earlier.number} (read-only)
          </Text>
          {hasEarlierNotes ? (
            <>
              <MarkdownView source={earlier.notes} testID="earlier-notes-text" />
              <View style={styles.actions}>
                <Button kind="secondary" label={`Start from v${earlier.number}'s notes`} onPress={onStartFromEarlier} testID="start-from-notes" />
              </View>
            </>
          ) : (
            <Text variant="small" tone="muted">
              v{earlier.number} has no notes.
            </Text>
          )}
        </View>
      </View>
      {openThreads.length > 0 ? (
        <Text variant="small" tone="warning" weight="semibold" testID="save-open-threads">
          This save leaves {openThreads.length === 1 ? '1 open thread' : `${openThreads.length} open threads`} unresolved:{' '}
          {openThreads.join(', ')}. They carry over to v{nextNumber}.
        </Text>
      ) : null}
      {formError ? (
        <Text role="alert" tone="danger" weight="semibold" testID="save-error">
          {formError}
        </Text>
      ) : null}
      {blockedReason ? (
        <Text variant="small" tone="muted" testID="save-blocked">
          {blockedReason}
        </Text>
      ) : null}
      <View style={styles.actions}>
        <Button label={busy ? 'Saving…' : `Save as v${nextNumber}`} onPress={onSave} disabled={busy || blockedReason !== null} testID="save-version" />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  // Side by side where both fit, the earlier notes under the box where they do not.
  notesRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  notesColumn: { flexGrow: 1, flexBasis: 280, minWidth: 0, gap: space.xs },
  earlier: { backgroundColor: colors.surfaceSunken, borderRadius: radius.md, padding: space.sm },
});
