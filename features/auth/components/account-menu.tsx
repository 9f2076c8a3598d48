import { usePathname, useRouter, type Href } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, minTouch, printHidden, radius, space, type, useLayout } from '@/features/ui';
import { useCurrentPath } from '../hooks/use-current-path';
import { useSessionQuery } from '../queries';

/** The header's right side: who is signed in (a way to their teams), or a way to sign in. */
export function AccountMenu() {
  const session = useSessionQuery();
  const router = useRouter();
  const pathname = usePathname();
  const here = useCurrentPath();
  const layout = useLayout();
  const user = session.data?.user;
  if (session.isPending) return null;
  const onAuthPage = ['/sign-in', '/sign-up'].includes(pathname);
  if (!user && onAuthPage) return null;
  const label = user ? (layout === 'phone' ? user.displayName.split(' ')[0] ?? 'Teams' : `${user.displayName} · Teams`) : 'Sign in';
  const href = (user ? '/teams' : `/sign-in?next=${encodeURIComponent(here)}`) as Href;
  return (
    <View style={styles.wrap} {...printHidden}>
      <Pressable
        role="link"
        accessibilityLabel={user ? `${label}: your teams, signed in as ${user.displayName}` : 'Sign in'}
        onPress={() => router.push(href)}
        style={({ hovered }: { pressed: boolean; hovered?: boolean }) => [styles.button, hovered && styles.hovered]}
        testID="account-menu"
      >
        <Text style={styles.label} numberOfLines={1}>
          {label}
        </Text>
      </Pressable>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { paddingRight: space.md },
  button: {
    minHeight: minTouch - 8,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: 'rgba(255,255,255,0.5)',
    maxWidth: 260,
  },
  hovered: { backgroundColor: 'rgba(255,255,255,0.12)' },
  label: { ...type.small, fontFamily: fonts.semibold, color: colors.onPrimary },
});
