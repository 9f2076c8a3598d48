import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import { RadioGroup, Text, space } from '@/features/ui';

type Props = { label: string; count: number; value: number; onChange: (n: number) => void; testID: string };

/** v1 … vN, newest first, as one scrolling radio group; the chosen one is filled. */
export function VersionPicker({ label, count, value, onChange, testID }: Props) {
  const options = useMemo(
    () =>
      Array.from({ length: count }, (_, i) => {
        const n = count - i;
        return { value: `v${n}`, label: `v${n}`, accessibilityLabel: `${label}: version ${n}` };
      }),
    [count, label],
  );
  return (
    <View style={styles.row}>
      <Text variant="small" weight="semibold" style={styles.label}>
        {label}
      </Text>
      <RadioGroup
        label={label}
        options={options}
        value={`v${value}`}
        onChange={(v) => onChange(Number(v.slice(1)))}
        size="compact"
        scroll
        mono
        testID={testID}
        style={styles.group}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: space.xs, alignItems: 'center' },
  label: { minWidth: 56 },
  group: { flexShrink: 1 },
});
