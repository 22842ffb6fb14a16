import { useLocalSearchParams } from 'expo-router';
import { ReviewScreen } from '../../../components/classes/ReviewScreen';

export default function SubmissionRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ReviewScreen submissionId={id} />;
}
