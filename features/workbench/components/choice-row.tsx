import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, minTouch, radius, space, type } from '@/features/ui';

type Option<T extends string> = { value: T; label: string; description?: string };

type Props<T extends string> = {
  label: string;
  options: readonly Option<T>[];
  value: T | null;
  onChange: (value: T) => void;
  disabled?: boolean;
  testID?: string;
};

/** A row of mutually exclusive choices, announced as a radio group. Wraps on narrow screens. */
export function ChoiceRow<T extends string>({
  label,
  options,
  value,
  onChange,
  disabled = false,
  testID,
}: Props<T>) {
  return (
    <View style={styles.root}>
      <Text style={styles.label}>{label}</Text>
      <View role="radiogroup" aria-label={label} style={styles.row} testID={testID}>
        {options.map((option) => {
          const checked = option.value === value;
          return (
            <Pressable
              key={option.value}
              role="radio"
              aria-checked={checked}
              aria-label={option.description ? `${option.label}: ${option.description}` : option.label}
              disabled={disabled}
              onPress={() => onChange(option.value)}
              style={[styles.option, checked && styles.checked]}
              testID={testID ? `${testID}-${option.value}` : undefined}
            >
              <Text style={[styles.optionText, checked && styles.checkedText]}>{option.label}</Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.xs },
  label: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  option: {
    minHeight: minTouch,
    paddingHorizontal: space.md,
    justifyContent: 'center',
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  checked: { backgroundColor: colors.primary, borderColor: colors.primary },
  optionText: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  checkedText: { color: colors.onPrimary },
});
