// A read-only link (/s/<token>), opened by anyone: no account, phone first.
import { useLocalSearchParams } from 'expo-router';
import { SharedSetupScreen } from '../../components/crew/SharedSetupScreen';

export default function SharedSetupRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return <SharedSetupScreen token={String(token ?? '')} />;
}
