import { useLocalSearchParams } from 'expo-router';
import { workspaceScreen } from '../../../components/workspaceScreen';

// Loaded with the other plan screens when first shown (components/workspace.ts).
const ClassScreen = workspaceScreen('ClassScreen');

export default function ClassRoute() {
  // ?joined=new|again: arrived from the join form (the screen says so).
  const { id, joined } = useLocalSearchParams<{ id: string; joined?: string }>();
  return <ClassScreen classId={id} joined={joined === 'new' || joined === 'again' ? joined : undefined} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../../components/RouteError';
