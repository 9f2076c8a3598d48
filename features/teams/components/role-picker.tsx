import { Pressable, StyleSheet, Text, View } from 'react-native';
import { roleLabels, roles, type Role } from '@/shared/teams';
import { colors, fonts, minTouch, radius, space, type } from '@/features/ui';

type Props = {
  value: Role;
  onChange: (role: Role) => void;
  /** Names the group for screen readers, e.g. "Role of Ada Lindqvist". */
  label: string;
  disabled?: boolean;
  testID?: string;
};

/** Three mutually exclusive roles as one segmented control (a radio group to assistive tech). */
export function RolePicker({ value, onChange, label, disabled = false, testID }: Props) {
  return (
    <View role="radiogroup" aria-label={label} style={styles.group} testID={testID}>
      {roles.map((role) => {
        const selected = role === value;
        return (
          <Pressable
            key={role}
            role="radio"
            aria-checked={selected}
            aria-disabled={disabled}
            accessibilityLabel={roleLabels[role]}
            disabled={disabled}
            onPress={() => !selected && onChange(role)}
            style={({ hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [
              styles.option,
              selected && styles.selected,
              hovered && !selected && styles.hovered,
              focused && styles.focused,
              disabled && styles.disabled,
            ]}
            testID={testID ? `${testID}-${role}` : undefined}
          >
            <Text style={[styles.label, selected && styles.labelSelected]}>{roleLabels[role]}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  group: { flexDirection: 'row', borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden', alignSelf: 'flex-start' },
  option: { minHeight: minTouch, paddingHorizontal: space.md, justifyContent: 'center', backgroundColor: colors.surface },
  selected: { backgroundColor: colors.primary },
  hovered: { backgroundColor: colors.surfaceSunken },
  focused: { borderColor: colors.focus, borderWidth: 2 },
  disabled: { opacity: 0.5 },
  label: { ...type.small, fontFamily: fonts.semibold, color: colors.primary },
  labelSelected: { color: colors.onPrimary },
});
