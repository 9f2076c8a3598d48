import { StyleSheet, View } from 'react-native';
import { Button, Card, Text, TextField, space } from '@/features/ui';

type Props = {
  message: string;
  notes: string;
  onChangeMessage: (message: string) => void;
  onChangeNotes: (notes: string) => void;
  messageError: string | null;
  formError: string | null;
  /** Why saving is not possible now (refused fields, nothing changed), or null. */
  blockedReason: string | null;
  nextNumber: number;
  busy: boolean;
  onSave: () => void;
};

/** "Save as new version": a one-line message like a commit subject, and the notes in Markdown. */
export function SaveCard({ message, notes, onChangeMessage, onChangeNotes, messageError, formError, blockedReason, nextNumber, busy, onSave }: Props) {
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
      <TextField
        label="Notes (Markdown: # headings, - lists, *emphasis*, `code`)"
        value={notes}
        onChangeText={onChangeNotes}
        multiline
        numberOfLines={6}
        testID="version-notes"
      />
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
});
