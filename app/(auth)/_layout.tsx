// Signed-out screens; a signed-in visitor goes straight on (to ?next= or their setups) once the session has
// been read. Until then the page shows: it is rendered at build time (scripts/staticPages.mjs), where the
// session is never known, and paints before any script; a signed-in visitor sees the form for the moment the
// session takes to arrive.
import { Redirect, Slot } from 'expo-router';
import { useSession } from '../../hooks/session';
import { useReturnPath } from '../../hooks/returnPath';

export default function AuthLayout() {
  const { data } = useSession();
  const next = useReturnPath();
  if (data) return <Redirect href={next as '/setups'} />;
  return <Slot />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
