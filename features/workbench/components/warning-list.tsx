import { memo } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { Warning } from '@/features/solver';
import { Card, colors, fonts, radius, space, type } from '@/features/ui';
import { fieldLabel } from '../fields';
import { warningField } from '../warning-fields';

type Props = { warnings: readonly Warning[]; onShowField: (path: string) => void };

/** What to worry about, in plain words with the fix; tapping one takes you to the field to change. */
export const WarningList = memo(function WarningList({ warnings, onShowField }: Props) {
  return (
    <Card
      title={warnings.length === 0 ? 'No warnings' : `Warnings (${warnings.length})`}
      testID="warning-list"
    >
      {warnings.length === 0 ? (
        <Text style={styles.none}>Every wavelength in the range is reachable and resolved as designed.</Text>
      ) : (
        <View style={styles.list}>
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
  pressed: { opacity: 0.8 },
  message: { ...type.small, fontFamily: fonts.regular, color: colors.ink },
  link: { ...type.caption, fontFamily: fonts.semibold, color: colors.primary },
});
