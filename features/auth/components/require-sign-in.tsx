import { Redirect, type Href } from 'expo-router';
import type { ReactNode } from 'react';
import { ActivityIndicator, View } from 'react-native';
import { Button, Screen, Text, colors, space } from '@/features/ui';
import { useCurrentPath } from '../hooks/use-current-path';
import { useSessionQuery } from '../queries';

/**
 * Guards the workspace route group: signed-out visitors go to sign-in and come back to the same
 * address (path and query) afterwards.
 */
export function RequireSignIn({ children }: { children: ReactNode }) {
  const session = useSessionQuery();
  const here = useCurrentPath();
  if (session.isPending) {
    return (
      <View style={{ flex: 1, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.paper }}>
        <ActivityIndicator color={colors.primary} accessibilityLabel="Checking your session" />
      </View>
    );
  }
  if (session.isError) {
    return (
      <Screen>
        <Text tone="danger">The notebook server could not be reached, so we cannot tell who you are.</Text>
        <View style={{ flexDirection: 'row', gap: space.sm }}>
          <Button label="Try again" onPress={() => void session.refetch()} />
        </View>
      </Screen>
    );
  }
  if (!session.data.user) {
    return <Redirect href={`/sign-in?next=${encodeURIComponent(here)}` as Href} />;
  }
  return <>{children}</>;
}
