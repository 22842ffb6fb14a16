// One setup in the editor (crew see it read-only).
import { useLocalSearchParams } from 'expo-router';
import { preloadWorkspace, workspaceScreen } from '../../../components/workspaceScreen';
import { Loading } from '../../../components/Loading';
import { SetupMissing } from '../../../components/library/SetupMissing';
import { useMe } from '../../../hooks/me';
import { useSetup } from '../../../hooks/setups';

// Loaded with the other plan screens when first shown (components/workspace.ts).
const EditorScreen = workspaceScreen('EditorScreen');

export default function SetupEditorRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  // The editor's chunks evaluate while the setup downloads (the screen would otherwise ask for them only once
  // it arrived), and the meter's worker starts as they arrive, for the first reading.
  preloadWorkspace({ meter: true });
  const me = useMe();
  const setup = useSetup(id);
  if (setup.isPending || me.isPending) return <Loading />;
  if (setup.isError) return <SetupMissing setupId={id} error={setup.error} onRetry={() => void setup.refetch()} />;
  return <EditorScreen setup={setup.data} units={me.data?.user.units ?? 'metric'} />;
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../../components/RouteError';
