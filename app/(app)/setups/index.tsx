import { SetupLibrary } from '../../../components/SetupLibrary';

export default function SetupsScreen() {
  return <SetupLibrary />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../../components/RouteError';
