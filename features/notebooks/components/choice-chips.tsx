import { Pressable, StyleSheet, View } from 'react-native';
import { Text, colors, fonts, radius, space, type } from '@/features/ui';

type Props<T extends string> = {
  label: string;
  options: readonly { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
  testID: string;
};

/** A small single choice drawn as toggles. */
export function ChoiceChips<T extends string>({ label, options, value, onChange, testID }: Props<T>) {
  return (
    <View style={styles.root}>
      <Text variant="small" weight="semibold">
        {label}
      </Text>
      <View role="radiogroup" aria-label={label} style={styles.row} testID={testID}>
        {options.map((option) => {
          const current = option.value === value;
          return (
            <Pressable
              key={option.value}
              role="radio"
              aria-checked={current}
              onPress={() => onChange(option.value)}
              style={[styles.chip, current && styles.chipCurrent]}
              testID={`${testID}-${option.value}`}
            >
              <Text style={[styles.text, current && styles.textCurrent]}>{option.label}</Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chip: { minHeight: 36, justifyContent: 'center', borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface, paddingHorizontal: space.md },
  chipCurrent: { backgroundColor: colors.primary, borderColor: colors.primary },
  text: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  textCurrent: { color: colors.onPrimary },
});
