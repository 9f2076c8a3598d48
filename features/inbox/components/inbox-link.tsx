import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, Text } from 'react-native';
import { useSessionQuery } from '@/features/auth';
import { colors, fonts, minTouch, printHidden, radius, space, type } from '@/features/ui';
import { inboxBadgeText, inboxLinkName } from '../links';
import { useUnreadCountQuery } from '../queries';

/**
 * The header's way to what waits for the signed-in person, with the unread count as visible text
 * (a number in a badge, not a coloured dot). Nothing while signed out.
 */
export function InboxLink() {
  const session = useSessionQuery();
  const signedIn = Boolean(session.data?.user);
  const unread = useUnreadCountQuery(signedIn);
  if (!signedIn) return null;
  const count = unread.data;
  return (
    <Link href={'/inbox' as Href} asChild>
      <Pressable
        {...printHidden}
        role="link"
        accessibilityLabel={inboxLinkName(count)}
        testID="header-inbox"
        // One flat style object: Link's slot merges plain objects only (no arrays, no press-state functions).
        style={styles.link}
      >
        <Text style={styles.label} numberOfLines={1}>
          Inbox
          {count ? (
            <>
              {' '}
              <Text style={styles.badge} testID="header-inbox-count">
                {inboxBadgeText(count)}
              </Text>
            </>
          ) : null}
        </Text>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  link: {
    minHeight: minTouch - 8,
    justifyContent: 'center',
    paddingHorizontal: space.sm,
    marginRight: space.sm,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: 'rgba(255,255,255,0.5)',
  },
  label: { ...type.small, fontFamily: fonts.semibold, color: colors.onPrimary },
  badge: {
    ...type.caption,
    fontFamily: fonts.bold,
    color: colors.primary,
    backgroundColor: colors.onPrimary,
    borderRadius: radius.sm,
    paddingHorizontal: space.xs,
  },
});
