import { useLocalSearchParams } from 'expo-router';
import { StudioMembers } from '../../../components/studios/StudioMembers';

export default function StudioScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <StudioMembers studioId={id} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../../components/RouteError';
