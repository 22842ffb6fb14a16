import { useLocalSearchParams } from 'expo-router';
import { workspaceScreen } from '../../../components/workspaceScreen';

// Loaded with the other plan screens when first shown (components/workspace.ts).
const ReviewScreen = workspaceScreen('ReviewScreen');

export default function SubmissionRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ReviewScreen submissionId={id} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../../components/RouteError';
