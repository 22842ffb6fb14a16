import { useLocalSearchParams } from 'expo-router';
import { StudioMembers } from '../../../components/studios/StudioMembers';

export default function StudioScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <StudioMembers studioId={id} />;
}
