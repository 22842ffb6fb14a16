import { workspaceScreen } from '../../../components/workspaceScreen';

// Loaded with the other plan screens when first shown (components/workspace.ts).
const ClassesScreen = workspaceScreen('ClassesScreen');

export default function ClassesRoute() {
  return <ClassesScreen />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../../components/RouteError';
