import { useLocalSearchParams } from 'expo-router';
import { ClassScreen } from '../../../components/classes/ClassScreen';

export default function ClassRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ClassScreen classId={id} />;
}
