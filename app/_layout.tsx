import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Stack } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useState } from 'react';
import { View } from 'react-native';
import { createQueryClient } from '@/features/api';
import { AccountMenu } from '@/features/auth';
import { InboxLink } from '@/features/inbox';
import { Wordmark, colors, fontAssets, fonts, installFocusRing, installPlainShaping, installPrintStyles } from '@/features/ui';

// Printed screens show their content without the controls (web only).
installPrintStyles();
installFocusRing();
installPlainShaping();

export default function RootLayout() {
  const [fontsLoaded, fontError] = useFonts(fontAssets);
  const [queryClient] = useState(createQueryClient);
  // Text drawn before the fonts arrive would flash in a fallback face; a failed load falls back.
  if (!fontsLoaded && !fontError) return null;
  return (
    <QueryClientProvider client={queryClient}>
      <StatusBar style="light" />
      <Stack
        screenOptions={{
          headerStyle: { backgroundColor: colors.primary },
          headerTintColor: colors.onPrimary,
          headerTitleStyle: { fontFamily: fonts.semibold },
          contentStyle: { backgroundColor: colors.paper },
          headerTitle: () => <Wordmark />,
          headerRight: () => (
            <View style={{ flexDirection: 'row', alignItems: 'center' }}>
              <InboxLink />
              <AccountMenu />
            </View>
          ),
        }}
      >
        <Stack.Screen name="index" options={{ title: 'Blazebook' }} />
        <Stack.Screen name="workbench" options={{ title: 'Workbench' }} />
        <Stack.Screen name="selectors" options={{ title: 'Filters and prisms' }} />
        <Stack.Screen name="(auth)" options={{ title: 'Account' }} />
        <Stack.Screen name="(workspace)" options={{ title: 'Teams' }} />
        <Stack.Screen name="share/[token]" options={{ title: 'Shared design' }} />
        <Stack.Screen name="+not-found" options={{ title: 'Not found' }} />
      </Stack>
    </QueryClientProvider>
  );
}
