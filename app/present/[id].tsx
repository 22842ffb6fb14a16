// Presentation mode is outside the signed-in frame (no navigation bar on the projector), so it checks the
// session itself.
import { Redirect, useLocalSearchParams } from 'expo-router';
import { Loading } from '../../components/Loading';
import { Presentation } from '../../components/classes/Presentation';
import { useSession } from '../../hooks/auth';

export default function PresentRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const { data, isPending } = useSession();
  if (isPending) return <Loading />;
  if (!data) return <Redirect href={`/sign-in?next=${encodeURIComponent(`/present/${id}`)}`} />;
  return <Presentation lessonId={id} />;
}
