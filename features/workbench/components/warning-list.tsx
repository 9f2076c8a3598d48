import { memo } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { RequirementCheck } from '@/features/requirements';
import type { Warning } from '@/features/solver';
import { Card, colors, fonts, radius, space, type } from '@/features/ui';
import { fieldLabel } from '../fields';
import { requirementFixField, warningField } from '../warning-fields';

type Props = {
  warnings: readonly Warning[];
  /** Requirements the design fails: listed first, each with a link to the field that fixes it. */
  failingRequirements?: readonly RequirementCheck[];
  onShowField: (path: string) => void;
};

/** What to worry about, in plain words with the fix; tapping one takes you to the field to change. */
export const WarningList = memo(function WarningList({ warnings, failingRequirements = [], onShowField }: Props) {
  const count = warnings.length + failingRequirements.length;
  return (
    <Card title={count === 0 ? 'No warnings' : `Warnings (${count})`} testID="warning-list">
      {count === 0 ? (
        <Text style={styles.none}>Every wavelength in the range is reachable and resolved as designed.</Text>
      ) : (
        <View style={styles.list}>
          {failingRequirements.map((check) => {
            const path = requirementFixField(check);
            const message = `Requirement not met: ${check.message}.`;
            return (
              <Pressable
                key={`requirement-${check.id}`}
                role="button"
                aria-label={`${message} Fix: go to ${fieldLabel(path)}.`}
                onPress={() => onShowField(path)}
                style={({ pressed }) => [styles.item, styles.failing, pressed && styles.pressed]}
                testID={`warning-requirement-${check.id}`}
              >
                <Text style={styles.message}>{message}</Text>
                <Text style={styles.link}>Fix: go to {fieldLabel(path)} →</Text>
              </Pressable>
            );
          })}
          {warnings.map((warning) => {
            const path = warningField[warning.code];
            return (
              <Pressable
                key={`${warning.code}-${warning.wavelengthNm ?? ''}`}
                role="button"
                aria-label={`${warning.message} Go to ${fieldLabel(path)}.`}
                onPress={() => onShowField(path)}
                style={({ pressed }) => [styles.item, pressed && styles.pressed]}
                testID={`warning-${warning.code}`}
              >
                <Text style={styles.message}>{warning.message}</Text>
                <Text style={styles.link}>Go to {fieldLabel(path)} →</Text>
              </Pressable>
            );
          })}
        </View>
      )}
    </Card>
  );
});

const styles = StyleSheet.create({
  none: { ...type.small, fontFamily: fonts.regular, color: colors.ok },
  list: { gap: space.sm },
  item: {
    backgroundColor: colors.warningSoft,
    borderLeftWidth: 4,
    borderLeftColor: colors.warning,
    borderRadius: radius.sm,
    padding: space.md,
    gap: space.xs,
  },
  failing: { backgroundColor: colors.dangerSoft, borderLeftColor: colors.danger },
  pressed: { opacity: 0.8 },
  message: { ...type.small, fontFamily: fonts.regular, color: colors.ink },
  link: { ...type.caption, fontFamily: fonts.semibold, color: colors.primary },
});
