import { useLocalSearchParams } from 'expo-router';
import { workspaceScreen } from '../../../components/workspaceScreen';

// Loaded with the other plan screens when first shown (components/workspace.ts).
const AssignmentScreen = workspaceScreen('AssignmentScreen');

export default function AssignmentRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <AssignmentScreen assignmentId={id} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../../components/RouteError';
