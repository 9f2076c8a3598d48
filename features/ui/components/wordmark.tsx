import { Link } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, type } from '../theme';

/**
 * The product name in the top bar, a link home from every page. Not a heading: each screen has
 * its own level-1 heading, and screen readers should meet that first.
 */
export function Wordmark() {
  return (
    // Back down the stack to the start page when it is there, rather than a second copy on top.
    <Link href="/" dismissTo asChild>
      <Pressable
        role="link"
        accessibilityLabel="Blazebook home"
        testID="wordmark"
        // A plain style object: Link's slot merges plain objects only (no arrays, no press-state functions).
        style={styles.row}
      >
        <View style={styles.mark} />
        <Text style={styles.name}>Blazebook</Text>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: 8,
    paddingHorizontal: space.xs,
    paddingVertical: space.xxs,
    borderRadius: radius.md,
  },
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
