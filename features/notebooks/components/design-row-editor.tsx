import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { tagsSchema, type Notebook } from '@/shared/notebooks';
import { Button, Text, TextField, colors, space } from '@/features/ui';
import { useUpdateDesignMutation } from '../queries';

/** A row of the design list opened to rename the design and edit its tags. */
export function DesignRowEditor({ design, onDone }: { design: Notebook; onDone: () => void }) {
  const update = useUpdateDesignMutation();
  const [title, setTitle] = useState(design.title);
  const [tags, setTags] = useState(design.tags.join(', '));
  const [error, setError] = useState<string | null>(null);
  const save = async () => {
    const parsedTags = tagsSchema.safeParse(
      tags
        .split(',')
        .map((t) => t.trim())
        .filter(Boolean),
    );
    if (!parsedTags.success) {
      setError(`Tags ${parsedTags.error.issues[0]?.message ?? 'are not valid'}`);
      return;
    }
    try {
      await update.mutateAsync({ id: design.id, body: { title, tags: parsedTags.data } });
      onDone();
    } catch (failure) {
      setError(failure instanceof Error ? failure.message : 'That did not work.');
    }
  };
  return (
    <View style={styles.editor} testID={`edit-${design.id}`}>
      <TextField label="Title" value={title} onChangeText={setTitle} maxLength={120} testID="edit-title" />
      <TextField
        label="Tags, separated by commas"
        value={tags}
        onChangeText={setTags}
        placeholder="uv, teaching"
        testID="edit-tags"
      />
      {error ? (
        <Text role="alert" tone="danger">
          {error}
        </Text>
      ) : null}
      <View style={styles.row}>
        <Button label="Save" onPress={() => void save()} disabled={update.isPending} testID="edit-save" />
        <Button kind="quiet" label="Cancel" onPress={onDone} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  editor: { gap: space.sm, paddingVertical: space.md, borderBottomWidth: 1, borderBottomColor: colors.line },
});
