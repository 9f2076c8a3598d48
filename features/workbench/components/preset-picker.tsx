import { StyleSheet, View } from 'react-native';
import { Button, Card, Text, space } from '@/features/ui';
import { presets, type Preset } from '../presets';

type Props = {
  presetId: string | null;
  onPick: (preset: Preset) => void;
  /** Shown after a pick replaced the design, so the replaced text can come back. */
  undo: { title: string; onUndo: () => void } | null;
};

/** Starting mounts of our own; picking one replaces the scratch design (with an undo). */
export function PresetPicker({ presetId, onPick, undo }: Props) {
  const current = presets.find((p) => p.id === presetId);
  return (
    <Card title="Start from" testID="preset-picker">
      <View style={styles.row}>
        {presets.map((preset) => (
          <Button
            key={preset.id}
            kind={preset.id === presetId ? 'primary' : 'secondary'}
            label={preset.title}
            accessibilityLabel={`Start from ${preset.title}: ${preset.summary}`}
            onPress={() => onPick(preset)}
            testID={`preset-${preset.id}`}
          />
        ))}
      </View>
      {current ? (
        <Text variant="small" tone="muted">
          {current.summary}
        </Text>
      ) : null}
      {undo ? (
        <View style={styles.undo}>
          <Text variant="small">Replaced your design with “{undo.title}”.</Text>
          <Button kind="quiet" label="Undo" onPress={undo.onUndo} testID="preset-undo" />
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  undo: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.sm },
});
