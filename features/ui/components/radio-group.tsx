import { Pressable, ScrollView, StyleSheet, Text, View, type StyleProp, type ViewStyle } from 'react-native';
import { radioKeyProps } from '../radio-keys';
import { nextIndex, tabStopIndex } from '../radio-navigation';
import { colors, fonts, minTouch, radius, space, type } from '../theme';

export type RadioOption<T extends string> = {
  value: T;
  label: string;
  /** Read instead of the label when the label alone says too little ("Blaze: at 500 nm"). */
  accessibilityLabel?: string;
};

type Props<T extends string> = {
  /** Names the group for assistive tech; shown above the options with `showLabel`. */
  label: string;
  options: readonly RadioOption<T>[];
  /** Null or undefined when nothing is chosen yet: then the first option takes the Tab stop. */
  value: T | null | undefined;
  onChange: (value: T) => void;
  showLabel?: boolean;
  disabled?: boolean;
  /** `chips` are separate toggles that wrap; `segmented` joins them into one control. */
  look?: 'chips' | 'segmented';
  size?: 'regular' | 'compact';
  /** One line that scrolls sideways instead of wrapping (long lists such as teams or versions). */
  scroll?: boolean;
  /** Set the option labels in the monospaced face (version numbers). */
  mono?: boolean;
  testID?: string;
  /** testID of each option; `${testID}-${value}` unless given. */
  optionTestID?: (value: T) => string;
  style?: StyleProp<ViewStyle>;
};

/**
 * One choice out of a few, as a WAI-ARIA radio group: only the checked option is a Tab stop, the
 * arrow keys move the choice (and the focus) and wrap, Home/End jump, Space and Enter choose.
 */
export function RadioGroup<T extends string>({
  label,
  options,
  value,
  onChange,
  showLabel = false,
  disabled = false,
  look = 'chips',
  size = 'regular',
  scroll = false,
  mono = false,
  testID,
  optionTestID,
  style,
}: Props<T>) {
  const checkedIndex = options.findIndex((option) => option.value === value);
  const tabStop = tabStopIndex(checkedIndex, options.length);
  const segmented = look === 'segmented';

  const choose = (index: number) => {
    const option = options[index];
    if (option && option.value !== value) onChange(option.value);
  };
  const onKey = (index: number, key: string): number | null => {
    // Enter already presses a focused Pressable on the web; choosing here too would choose twice.
    if (disabled || key === 'Enter') return null;
    const target = nextIndex(key, index, options.length);
    if (target !== null) choose(target);
    return target;
  };

  const items = options.map((option, index) => {
    const checked = index === checkedIndex;
    return (
      <Pressable
        key={option.value}
        role="radio"
        aria-checked={checked}
        aria-disabled={disabled}
        aria-label={option.accessibilityLabel ?? option.label}
        disabled={disabled}
        tabIndex={index === tabStop && !disabled ? 0 : -1}
        onPress={() => choose(index)}
        {...radioKeyProps((key) => onKey(index, key))}
        style={({ hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [
          segmented ? styles.segment : styles.chip,
          size === 'compact' && styles.compact,
          checked && styles.checked,
          hovered && !checked && !disabled && styles.hovered,
          focused && styles.focused,
          disabled && styles.disabled,
        ]}
        testID={optionTestID ? optionTestID(option.value) : testID ? `${testID}-${option.value}` : undefined}
      >
        <Text
          numberOfLines={scroll ? 1 : undefined}
          style={[styles.text, mono && styles.mono, segmented && !checked && styles.segmentText, checked && styles.checkedText]}
        >
          {option.label}
        </Text>
      </Pressable>
    );
  });

  const rowStyle = [segmented ? styles.segmentedRow : styles.chipRow, !scroll && styles.wrap];
  const group = scroll ? (
    <ScrollView
      horizontal
      showsHorizontalScrollIndicator={false}
      contentContainerStyle={rowStyle}
      role="radiogroup"
      aria-label={label}
      aria-disabled={disabled}
      testID={testID}
    >
      {items}
    </ScrollView>
  ) : (
    <View role="radiogroup" aria-label={label} aria-disabled={disabled} style={rowStyle} testID={testID}>
      {items}
    </View>
  );

  if (!showLabel) return style ? <View style={style}>{group}</View> : group;
  return (
    <View style={[styles.labelled, style]}>
      <Text style={styles.label}>{label}</Text>
      {group}
    </View>
  );
}

const styles = StyleSheet.create({
  labelled: { gap: space.xs },
  label: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  chipRow: { flexDirection: 'row', gap: space.xs, alignItems: 'center' },
  wrap: { flexWrap: 'wrap' },
  segmentedRow: {
    flexDirection: 'row',
    alignSelf: 'flex-start',
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  chip: {
    minHeight: minTouch,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
    maxWidth: 240,
  },
  segment: {
    minHeight: minTouch,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderWidth: 1,
    borderColor: 'transparent',
    backgroundColor: colors.surface,
  },
  compact: { minHeight: 36, minWidth: 44, alignItems: 'center', paddingHorizontal: space.sm },
  checked: { backgroundColor: colors.primary, borderColor: colors.primary },
  hovered: { backgroundColor: colors.surfaceSunken },
  focused: { borderColor: colors.focus, borderWidth: 2 },
  disabled: { opacity: 0.5 },
  text: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  mono: { fontFamily: fonts.mono },
  segmentText: { color: colors.primary },
  checkedText: { color: colors.onPrimary },
});
