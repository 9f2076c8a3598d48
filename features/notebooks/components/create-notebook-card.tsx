import { useRouter, type Href } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { designTitleSchema } from '@/shared/notebooks';
import { ApiError } from '@/features/api';
import { Button, Card, Text, TextField, space } from '@/features/ui';
import { formToDesign, loadDraft, presets } from '@/features/workbench';
import { useCreateDesignMutation } from '../queries';
import { ChoiceChips } from './choice-chips';

const scratch = 'scratch';

/** A new notebook: a title, and its first version from the scratch workbench or a preset. */
export function CreateNotebookCard({ teamId, onCancel }: { teamId: string; onCancel: () => void }) {
  const router = useRouter();
  const create = useCreateDesignMutation(teamId);
  const [title, setTitle] = useState('');
  const [from, setFrom] = useState<string>(scratch);
  const [error, setError] = useState<string | null>(null);

  const submit = async () => {
    setError(null);
    const checked = designTitleSchema.safeParse(title);
    if (!checked.success) {
      setError(`The title ${checked.error.issues[0]?.message ?? 'is not valid'}`);
      return;
    }
    let params;
    if (from === scratch) {
      // The scratch workbench keeps what was typed; only a design the schema accepts can start a notebook.
      const typed = formToDesign(loadDraft().values);
      if (!typed.ok) {
        setError('The scratch workbench has refused fields. Fix them there, or start from a preset.');
        return;
      }
      params = typed.design;
    } else {
      params = presets.find((preset) => preset.id === from)?.design;
    }
    if (!params) return;
    try {
      const made = await create.mutateAsync({ title: checked.data, params, message: 'First version' });
      setTitle('');
      router.push(`/notebooks/${made.design.id}` as Href);
    } catch (failure) {
      setError(failure instanceof ApiError ? (failure.fields.title ? `The title ${failure.fields.title}` : failure.message) : 'The design could not be created.');
    }
  };

  return (
    <Card title="New design" testID="create-notebook">
      <TextField label="Title" value={title} onChangeText={setTitle} placeholder="e.g. Sodium doublet monochromator" maxLength={120} onSubmitEditing={() => void submit()} testID="new-title" />
      <ChoiceChips
        label="Starts from"
        options={[{ value: scratch, label: 'My workbench design' }, ...presets.map((preset) => ({ value: preset.id, label: preset.title }))]}
        value={from}
        onChange={setFrom}
        testID="new-from"
      />
      {error ? (
        <Text role="alert" tone="danger" weight="semibold" testID="create-error">
          {error}
        </Text>
      ) : null}
      <View style={styles.row}>
        <Button label={create.isPending ? 'Creating…' : 'Create design'} onPress={() => void submit()} disabled={create.isPending} testID="create-design" />
        <Button kind="quiet" label="Cancel" onPress={onCancel} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm } });
