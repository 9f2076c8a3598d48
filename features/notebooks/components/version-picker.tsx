import { Pressable, ScrollView, StyleSheet } from 'react-native';
import { Text, colors, fonts, radius, space, type } from '@/features/ui';

type Props = { label: string; count: number; value: number; onChange: (n: number) => void; testID: string };

/** v1 … vN as a row of toggles; the chosen one is filled. */
export function VersionPicker({ label, count, value, onChange, testID }: Props) {
  const numbers = Array.from({ length: count }, (_, i) => count - i);
  return (
    <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.row} role="radiogroup" aria-label={label} testID={testID}>
      <Text variant="small" weight="semibold" style={styles.label}>
        {label}
      </Text>
      {numbers.map((n) => {
        const current = n === value;
        return (
          <Pressable
            key={n}
            role="radio"
            aria-checked={current}
            accessibilityLabel={`${label}: version ${n}`}
            onPress={() => onChange(n)}
            style={[styles.chip, current && styles.chipCurrent]}
            testID={`${testID}-v${n}`}
          >
            <Text style={[styles.chipText, current && styles.chipTextCurrent]}>v{n}</Text>
          </Pressable>
        );
      })}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.xs, alignItems: 'center' },
  label: { minWidth: 56 },
  chip: { minHeight: 36, minWidth: 44, alignItems: 'center', justifyContent: 'center', borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface, paddingHorizontal: space.sm },
  chipCurrent: { backgroundColor: colors.primary, borderColor: colors.primary },
  chipText: { ...type.small, fontFamily: fonts.mono, color: colors.ink },
  chipTextCurrent: { color: colors.onPrimary },
});
