// The root: fonts (never waited for on the web), server data through TanStack Query, gestures, safe areas.
// Every route below loads as a chunk of its own on the web (async routes, app.json): this file and what it
// imports are in every page's first download, so it stays small.
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { Slot } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useState } from 'react';
import { View } from 'react-native';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { ErrorBoundary as AppErrorBoundary } from '../components/ErrorBoundary';
import { GestureRoot } from '../components/GestureRoot';
import { OfflineRoot } from '../components/offline/OfflineRoot';
import { colours } from '../constants/theme';
import { ApiRequestError } from '../hooks/api';
import { useAppFonts } from '../hooks/useAppFonts';
import { useWarmDates } from '../hooks/warmDates';

function makeQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // Ask even when the device says it is offline: the service worker answers kept setups from its cache.
        networkMode: 'offlineFirst',
        // A 4xx will not get better by asking again.
        retry: (n, err) => !(err instanceof ApiRequestError && err.status < 500) && n < 2,
      },
    },
  });
}

export default function RootLayout() {
  const [client] = useState(makeQueryClient);
  const fontsLoaded = useAppFonts();
  // The date formatter the library's cards and the share screen need, built while the page waits (hooks/warmDates.ts).
  useWarmDates();
  if (!fontsLoaded) return <View style={{ flex: 1, backgroundColor: colours.graphite }} />;
  return (
    <GestureRoot style={{ flex: 1, backgroundColor: colours.graphite }}>
      <SafeAreaProvider>
        <QueryClientProvider client={client}>
          <StatusBar style="light" />
          <OfflineRoot />
          {/* One group at a time (signed in or signed out): a Stack would keep the other mounted behind. */}
          <AppErrorBoundary what="the app" onLeave={() => typeof window !== 'undefined' && window.location?.assign('/setups')}>
            <Slot />
          </AppErrorBoundary>
        </QueryClientProvider>
      </SafeAreaProvider>
    </GestureRoot>
  );
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../components/RouteError';
