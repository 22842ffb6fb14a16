// A read-only link (/s/<token>), opened by anyone: no account, phone first.
import { useLocalSearchParams } from 'expo-router';
import { sharedSetupScreen } from '../../components/workspaceScreen';
import { fetchSharedEarly } from '../../hooks/sharedEarly';

// A chunk of its own, without the editor's (components/shareScreen.ts).
const SharedSetupScreen = sharedSetupScreen();

export default function SharedSetupRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  // The setup downloads while the screen's chunk does.
  fetchSharedEarly(String(token ?? ''));
  return <SharedSetupScreen token={String(token ?? '')} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
