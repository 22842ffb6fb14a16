// Signed-in screens inside the navigation frame; a signed-out visitor is sent to sign in.
import { Redirect, Slot, usePathname } from 'expo-router';
import { useRef } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { Loading } from '../../components/Loading';
import { NavShell } from '../../components/NavShell';
import { useSession } from '../../hooks/session';

export default function AppLayout() {
  const { data, isPending } = useSession();
  const routerPath = usePathname();
  // Where the visitor arrived, taken when this layout first mounts.
  const arrived = useRef(routerPath !== '/' || Platform.OS !== 'web' || typeof window === 'undefined' ? routerPath : window.location.pathname);
  if (!isPending && !data) {
    // Come back here after signing in (an invitation link, a setup someone sent).
    const here = arrived.current;
    return <Redirect href={here && here !== '/' && here !== '/setups' ? `/sign-in?next=${encodeURIComponent(here)}` : '/sign-in'} />;
  }
  // The screens mount while the session is still being checked, so a reload stays on the page it was on
  // (the router falls back to its first screen when a layout renders no screen at all).
  return (
    <View style={{ flex: 1 }}>
      <NavShell>
        <Slot />
      </NavShell>
      {isPending ? (
        <View style={StyleSheet.absoluteFill}>
          <Loading />
        </View>
      ) : null}
    </View>
  );
}

// A deep link or reload on any signed-in screen keeps Setups as the screen below it.
export const unstable_settings = { initialRouteName: 'setups/index' };

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
