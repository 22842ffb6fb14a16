import { useLocalSearchParams } from 'expo-router';
import { workspaceScreen } from '../../../../components/workspaceScreen';

// Loaded with the other plan screens when first shown (components/workspace.ts).
const LessonScreen = workspaceScreen('LessonScreen');

export default function LessonRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <LessonScreen lessonId={id} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../../../components/RouteError';
