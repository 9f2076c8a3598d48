import { Pressable, StyleSheet, Text } from 'react-native';
import { printHidden } from '../print';
import { colors, fonts, minTouch, radius, space, type } from '../theme';

type Props = {
  label: string;
  onPress?: () => void;
  kind?: 'primary' | 'secondary' | 'quiet';
  disabled?: boolean;
  /** Read by screen readers when the visible label is not enough ("Remove exit slit preset"). */
  accessibilityLabel?: string;
  /** A disclosure button: whether what it shows and hides is open (aria-expanded). */
  expanded?: boolean;
  testID?: string;
};

export function Button({ label, onPress, kind = 'primary', disabled = false, accessibilityLabel, expanded, testID }: Props) {
  return (
    <Pressable
      // A button does nothing on paper: printed screens leave it out.
      {...printHidden}
      role="button"
      accessibilityLabel={accessibilityLabel ?? label}
      accessibilityState={{ disabled }}
      {...(expanded === undefined ? {} : { 'aria-expanded': expanded })}
      disabled={disabled}
      onPress={onPress}
      testID={testID}
      style={({ pressed, hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [
        styles.base,
        styles[kind],
        (pressed || hovered) && kind === 'primary' && styles.primaryPressed,
        (pressed || hovered) && kind !== 'primary' && styles.quietPressed,
        focused && styles.focused,
        disabled && styles.disabled,
      ]}
    >
      <Text style={[styles.label, kind === 'primary' ? styles.labelPrimary : styles.labelOther]}>{label}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: minTouch,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    alignItems: 'center',
    justifyContent: 'center',
    borderWidth: 1,
    borderColor: 'transparent',
  },
  primary: { backgroundColor: colors.primary },
  primaryPressed: { backgroundColor: colors.primaryPressed },
  secondary: { backgroundColor: colors.surface, borderColor: colors.primary },
  quiet: { backgroundColor: 'transparent' },
  quietPressed: { backgroundColor: colors.surfaceSunken },
  focused: { borderColor: colors.focus, borderWidth: 2 },
  disabled: { opacity: 0.45 },
  label: { ...type.body, fontFamily: fonts.semibold },
  labelPrimary: { color: colors.onPrimary },
  labelOther: { color: colors.primary },
});
