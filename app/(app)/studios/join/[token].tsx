import { useLocalSearchParams } from 'expo-router';
import { JoinStudio } from '../../../../components/studios/JoinStudio';

export default function JoinStudioScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return <JoinStudio token={token} />;
}
