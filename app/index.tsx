import { Redirect } from 'expo-router';
import { Loading } from '../components/Loading';
import { useSession } from '../hooks/session';

export default function Index() {
  const { data, isPending } = useSession();
  if (isPending) return <Loading />;
  return <Redirect href={data ? '/setups' : '/sign-in'} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../components/RouteError';
