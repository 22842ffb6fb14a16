// Signed-out screens; a signed-in visitor goes straight on (to ?next= or their setups).
import { Redirect, Slot } from 'expo-router';
import { Loading } from '../../components/Loading';
import { useSession } from '../../hooks/session';
import { useReturnPath } from '../../hooks/returnPath';

export default function AuthLayout() {
  const { data, isPending } = useSession();
  const next = useReturnPath();
  if (isPending) return <Loading />;
  if (data) return <Redirect href={next as '/setups'} />;
  return <Slot />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
