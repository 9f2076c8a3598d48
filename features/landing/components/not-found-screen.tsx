import { Link } from 'expo-router';
import { Heading, Screen, Text, colors, useDocumentTitle } from '@/features/ui';

/** Shown for any address the app has no screen for (a mistyped or outdated link). */
export function NotFoundScreen() {
  useDocumentTitle('Page not found');
  return (
    <Screen>
      <Heading level={1}>No page at this address</Heading>
      <Text tone="muted">The link may be mistyped, or the page may have moved.</Text>
      <Link href="/" style={{ color: colors.primary }}>
        <Text weight="semibold" style={{ color: colors.primary }}>
          Go to the start page
        </Text>
      </Link>
    </Screen>
  );
}
