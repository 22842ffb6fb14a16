// A read-only link (/s/<token>), opened by anyone: no account, phone first.
import { useLocalSearchParams } from 'expo-router';
import { SharedShell } from '../../components/SharedShell';
import { sharedSetupScreen } from '../../components/workspaceScreen';
import { useHydrated } from '../../hooks/hydration';
import { fetchSharedEarly } from '../../hooks/sharedEarly';

// A chunk of its own, without the editor's (components/shareScreen.ts).
const SharedSetupScreen = sharedSetupScreen();

export default function SharedSetupRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  // The setup downloads while the screen's chunk does (in the browser: the page is also rendered at build time).
  if (typeof window !== 'undefined') fetchSharedEarly(String(token ?? ''));
  // The page's HTML is this route rendered at build time (scripts/staticPages.mjs): the shell, for any link. The
  // browser hydrates that same shell, then asks for the screen (which shows the shell until its chunk is in).
  if (!useHydrated()) return <SharedShell />;
  return <SharedSetupScreen token={String(token ?? '')} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
