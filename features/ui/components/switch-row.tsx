import { Pressable, StyleSheet, View } from 'react-native';
import { colors, minTouch, radius, space } from '../theme';
import { Text } from './text';
import { switchKeyProps } from '../switch-keys';

type Props = {
  label: string;
  /** A second line under the label, in small muted type. */
  hint?: string;
  value: boolean;
  onChange: (value: boolean) => void;
  disabled?: boolean;
  testID?: string;
};

/**
 * One on/off choice as a WAI-ARIA switch, named by its visible label. The thumb sits left when off
 * and right when on, with a tick when on, so the state does not rest on colour alone.
 */
export function SwitchRow({ label, hint, value, onChange, disabled = false, testID }: Props) {
  const toggle = () => {
    if (!disabled) onChange(!value);
  };
  return (
    <Pressable
      role="switch"
      aria-checked={value}
      aria-disabled={disabled}
      disabled={disabled}
      onPress={toggle}
      {...switchKeyProps(toggle)}
      testID={testID}
      style={({ hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [
        styles.row,
        hovered && !disabled && styles.hovered,
        focused && styles.focused,
        disabled && styles.disabled,
      ]}
    >
      <View style={styles.text}>
        <Text weight="semibold">{label}</Text>
        {hint ? (
          <Text variant="small" tone="muted">
            {hint}
          </Text>
        ) : null}
      </View>
      <View style={[styles.track, value && styles.trackOn]} aria-hidden>
        <View style={[styles.thumb, value && styles.thumbOn]}>{value ? <Text style={styles.tick}>✓</Text> : null}</View>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: {
    minHeight: minTouch,
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.md,
    paddingVertical: space.sm,
    paddingHorizontal: space.sm,
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: 'transparent',
  },
  hovered: { backgroundColor: colors.surfaceSunken },
  focused: { borderColor: colors.focus },
  disabled: { opacity: 0.5 },
  text: { flexShrink: 1, gap: space.xxs },
  track: {
    width: 48,
    height: 28,
    borderRadius: 14,
    borderWidth: 1,
    borderColor: colors.inkMuted,
    backgroundColor: colors.surfaceSunken,
    padding: 2,
    justifyContent: 'center',
    flexShrink: 0,
  },
  trackOn: { backgroundColor: colors.primary, borderColor: colors.primary },
  thumb: {
    width: 22,
    height: 22,
    borderRadius: 11,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.inkMuted,
    alignItems: 'center',
    justifyContent: 'center',
  },
  thumbOn: { alignSelf: 'flex-end', borderColor: colors.surface },
  tick: { fontSize: 13, lineHeight: 16, color: colors.primary },
});
