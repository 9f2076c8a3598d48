import { useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { notebookFileSchema, type NotebookFileInput } from '@/shared/notebooks';
import { fieldErrors } from '@/shared/validation';
import { ApiError } from '@/features/api';
import { Button, Text, space } from '@/features/ui';

type Props = { onImport: (file: NotebookFileInput) => Promise<unknown>; busy: boolean };

/**
 * Web: a hidden file input. The file is checked with the shared schema first, so every problem is
 * listed with its path before anything is sent; the server checks again and writes all or nothing.
 */
export function ImportButton({ onImport, busy }: Props) {
  const input = useRef<HTMLInputElement | null>(null);
  const [problems, setProblems] = useState<[string, string][]>([]);
  const [status, setStatus] = useState<string | null>(null);

  const read = async (file: File) => {
    setProblems([]);
    setStatus(null);
    let json: unknown;
    try {
      json = JSON.parse(await file.text());
    } catch {
      setProblems([['(file)', `${file.name} is not JSON`]]);
      return;
    }
    const parsed = notebookFileSchema.safeParse(json);
    if (!parsed.success) {
      setProblems(Object.entries(fieldErrors(parsed.error)));
      return;
    }
    try {
      await onImport(json as NotebookFileInput);
      setStatus(`Imported “${parsed.data.title}” with ${parsed.data.versions.length} versions.`);
    } catch (error) {
      if (error instanceof ApiError && Object.keys(error.fields).length > 0) setProblems(Object.entries(error.fields));
      else setProblems([['(file)', error instanceof Error ? error.message : 'could not be imported']]);
    }
  };

  return (
    <View style={styles.root}>
      <input
        ref={input}
        type="file"
        accept="application/json,.json"
        style={{ display: 'none' }}
        data-testid="import-file"
        onChange={(event) => {
          const file = event.currentTarget.files?.[0];
          event.currentTarget.value = '';
          if (file) void read(file);
        }}
      />
      <Button kind="secondary" label={busy ? 'Importing…' : 'Import a notebook file'} onPress={() => input.current?.click()} disabled={busy} testID="import-notebook" />
      {status ? (
        <Text role="status" tone="ok" testID="import-status">
          {status}
        </Text>
      ) : null}
      {problems.length > 0 ? (
        <View role="alert" style={styles.problems} testID="import-problems">
          <Text tone="danger" weight="semibold">
            Nothing was imported. {problems.length === 1 ? 'One problem' : `${problems.length} problems`}:
          </Text>
          {problems.map(([path, why]) => (
            <Text key={path} variant="small" tone="danger">
              <Text variant="number" tone="danger">
                {path}
              </Text>{' '}
              {why}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.sm, alignItems: 'flex-start' },
  problems: { gap: space.xxs },
});
