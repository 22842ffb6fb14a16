// One setup in the editor (crew see it read-only).
import { useQuery } from '@tanstack/react-query';
import { useLocalSearchParams } from 'expo-router';
import { View } from 'react-native';
import { EditorScreen } from '../../../components/editor/EditorScreen';
import { Loading } from '../../../components/Loading';
import { Body, Title } from '../../../components/ui';
import { colours } from '../../../constants/theme';
import { api } from '../../../hooks/api';
import { useMe } from '../../../hooks/me';
import { setupKeys } from '../../../hooks/setups';
import type { ServerSetup } from '../../../hooks/useSetupSync';
import { parseDocument } from '../../../model/document';

export default function SetupEditorRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const me = useMe();
  const setup = useQuery({
    queryKey: setupKeys.detail(id),
    // Parsed with the shared schema on load: old documents are migrated, bad ones are refused here.
    queryFn: async ({ signal }) => {
      const s = await api<ServerSetup>(`/setups/${id}`, { signal });
      return { ...s, document: parseDocument(s.document) };
    },
    // The editor owns the document once open; refetching would fight the user's edits.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
    // Autosave writes the cache on every save; the open editor must not re-render for that.
    notifyOnChangeProps: ['status', 'error'],
  });
  if (setup.isPending || me.isPending) return <Loading />;
  if (setup.isError) {
    return (
      <View style={{ flex: 1, padding: 24, backgroundColor: colours.graphite }}>
        <Title>Setup not found</Title>
        <Body dim>It may have been deleted, or it belongs to a studio you are not in.</Body>
      </View>
    );
  }
  return <EditorScreen setup={setup.data} units={me.data?.user.units ?? 'metric'} />;
}
