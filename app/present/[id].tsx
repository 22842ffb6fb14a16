// Presentation mode is outside the signed-in frame (no navigation bar on the projector), so it checks the
// session itself.
import { Redirect, useLocalSearchParams } from 'expo-router';
import { Loading } from '../../components/Loading';
import { workspaceScreen } from '../../components/workspaceScreen';
import { useSession } from '../../hooks/session';

// Loaded with the other plan screens when first shown (components/workspace.ts).
const Presentation = workspaceScreen('Presentation');

export default function PresentRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const { data, isPending } = useSession();
  if (isPending) return <Loading />;
  if (!data) return <Redirect href={`/sign-in?next=${encodeURIComponent(`/present/${id}`)}`} />;
  return <Presentation lessonId={id} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
