import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet } from 'react-native';
import { Text, colors, minTouch, printHidden, radius, space } from '@/features/ui';

type Props = { href: string; label: string; accessibilityLabel: string; primary?: boolean; testID: string };

/** A way into one of a team's pages, drawn as a button but an anchor on the web (new tab, print). */
export function TeamLink({ href, label, accessibilityLabel, primary = false, testID }: Props) {
  return (
    <Link href={href as Href} asChild>
      <Pressable
        {...printHidden}
        role="link"
        accessibilityLabel={accessibilityLabel}
        testID={testID}
        // One flat style object: Link's slot merges plain objects only (no arrays, no press-state functions).
        style={StyleSheet.flatten([styles.link, primary && styles.linkPrimary])}
      >
        <Text weight="semibold" style={{ color: primary ? colors.onPrimary : colors.primary }}>
          {label}
        </Text>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  link: {
    minHeight: minTouch,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.primary,
    backgroundColor: colors.surface,
    alignItems: 'center',
    justifyContent: 'center',
  },
  linkPrimary: { backgroundColor: colors.primary },
});
