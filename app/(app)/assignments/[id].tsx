import { useLocalSearchParams } from 'expo-router';
import { AssignmentScreen } from '../../../components/classes/AssignmentScreen';

export default function AssignmentRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <AssignmentScreen assignmentId={id} />;
}
