import { Pressable, StyleSheet, Text } from 'react-native';
import type { FieldErrors } from '@/shared/validation';
import { colors, fonts, radius, space, type } from '@/features/ui';
import { fieldLabel } from '../fields';

/** Says which field keeps the results from updating, while the last valid ones stay on screen. */
export function BlockedNote({
  fields,
  onShowField,
}: {
  fields: FieldErrors;
  onShowField: (path: string) => void;
}) {
  const entries = Object.entries(fields);
  const [firstPath] = entries[0] ?? [];
  const list = entries
    .slice(0, 3)
    .map(([path, why]) => `${fieldLabel(path)} ${why}`)
    .join('; ');
  const more = entries.length > 3 ? ` and ${entries.length - 3} more` : '';
  return (
    <Pressable
      role="alert"
      onPress={() => firstPath && onShowField(firstPath)}
      style={styles.note}
      testID="blocked-note"
    >
      <Text style={styles.text}>
        Showing the last valid results. Fix {entries.length === 1 ? 'this field' : 'these fields'} to update
        them: {list}
        {more}.
      </Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  note: {
    backgroundColor: colors.dangerSoft,
    borderLeftWidth: 4,
    borderLeftColor: colors.danger,
    borderRadius: radius.sm,
    padding: space.md,
  },
  text: { ...type.small, fontFamily: fonts.semibold, color: colors.danger },
});
