import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, space, type } from '@/features/ui';
import { formatNumber, formatQuantity } from '@/shared/format';
import type { SelectedReadout } from '../hooks/use-workbench';

/** The phone's sticky line: bandpass and resolving power at the chosen wavelength. */
export function SummaryBar({ selected, blocked }: { selected: SelectedReadout; blocked: boolean }) {
  let text: string;
  if (!selected.ok) text = 'Choose a wavelength to read out';
  else if (!selected.point.reachable) text = `${formatQuantity(selected.wavelengthNm, 'nm')} · not reachable`;
  else
    text = `${formatQuantity(selected.wavelengthNm, 'nm')} · bandpass ${formatQuantity(selected.point.bandpassNm, 'nm', 3)} · R ${formatNumber(selected.point.resolvingPower, 3)}`;
  return (
    <View style={[styles.bar, blocked && styles.blocked]} role="status" testID="summary-bar">
      <Text style={styles.text} numberOfLines={1}>
        {blocked ? `Last valid · ${text}` : text}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    backgroundColor: colors.ink,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
  },
  blocked: { backgroundColor: colors.inkMuted },
  text: { ...type.small, fontFamily: fonts.monoMedium, color: colors.onPrimary },
});
