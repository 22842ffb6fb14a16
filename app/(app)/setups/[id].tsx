// One setup in the editor (crew see it read-only).
import { useLocalSearchParams } from 'expo-router';
import { View } from 'react-native';
import { EditorScreen } from '../../../components/editor/EditorScreen';
import { Loading } from '../../../components/Loading';
import { Body, Title } from '../../../components/ui';
import { colours } from '../../../constants/theme';
import { useMe } from '../../../hooks/me';
import { useSetup } from '../../../hooks/setups';

export default function SetupEditorRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const me = useMe();
  const setup = useSetup(id);
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
