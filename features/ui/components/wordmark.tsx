import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, type } from '../theme';

/**
 * The product name in the top bar. Not a heading: each screen has its own level-1 heading, and
 * screen readers should meet that first.
 */
export function Wordmark() {
  return (
    <View style={styles.row} accessibilityLabel="Blazebook">
      <View style={styles.mark} />
      <Text style={styles.name}>Blazebook</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: 8 },
  // A blazed groove in profile: one steep face, one long face.
  mark: {
    width: 0,
    height: 0,
    borderLeftWidth: 14,
    borderBottomWidth: 14,
    borderLeftColor: 'transparent',
    borderBottomColor: colors.accent,
  },
  name: { ...type.lead, fontFamily: fonts.bold, color: colors.onPrimary, letterSpacing: 0.3 },
});
