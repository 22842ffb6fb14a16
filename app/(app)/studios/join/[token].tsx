import { useLocalSearchParams } from 'expo-router';
import { JoinStudio } from '../../../../components/studios/JoinStudio';

export default function JoinStudioScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return <JoinStudio token={token} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../../../components/RouteError';
