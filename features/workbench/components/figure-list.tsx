import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, space, type } from '@/features/ui';
import { keepTogether, unitSuffix } from '@/shared/format';

export type Figure = { label: string; value: string; unit?: string; testID?: string };

/**
 * Label on the left, value with unit on the right; the label wraps when the row is narrow, the
 * value and its unit never do (one run joined by no-break spaces, `withUnit`).
 */
export function FigureList({ figures }: { figures: readonly Figure[] }) {
  return (
    <View style={styles.list}>
      {figures.map((figure) => (
        <View key={figure.label} style={styles.row}>
          <Text style={styles.label}>{figure.label}</Text>
          <Text style={styles.value} testID={figure.testID}>
            {keepTogether(figure.value)}
            {figure.unit && figure.value !== '—' ? (
              <Text style={styles.unit}>{unitSuffix(figure.unit)}</Text>
            ) : null}
          </Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: 0 },
  row: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    justifyContent: 'space-between',
    alignItems: 'baseline',
    gap: space.sm,
    paddingVertical: space.xs + 1,
    borderBottomWidth: StyleSheet.hairlineWidth,
    borderBottomColor: colors.line,
  },
  label: { ...type.small, fontFamily: fonts.regular, color: colors.inkMuted, flexShrink: 1 },
  value: {
    ...type.small,
    fontFamily: fonts.monoMedium,
    color: colors.ink,
    fontVariant: ['tabular-nums'],
    textAlign: 'right',
  },
  unit: { fontFamily: fonts.mono, color: colors.inkMuted },
});
