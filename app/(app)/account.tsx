import { useRouter } from 'expo-router';
import { ScrollView } from 'react-native';
import { AccountSettings } from '../../components/AccountSettings';
import { StudiosCard } from '../../components/studios/StudiosCard';
import { SignOutButton } from '../../components/offline/SignOutButton';
import { Body, Card, Title } from '../../components/ui';
import { colours, space } from '../../constants/theme';
import { useMe } from '../../hooks/me';

export default function AccountScreen() {
  const me = useMe();
  const router = useRouter();
  return (
    <ScrollView style={{ flex: 1, backgroundColor: colours.graphite }} contentContainerStyle={{ padding: space.lg, gap: space.md, maxWidth: 720 }}>
      <Title>Account</Title>
      {me.data ? (
        <>
          <Card>
            <Body style={{ fontSize: 17 }}>{me.data.user.name}</Body>
            <Body dim>{me.data.user.email}</Body>
          </Card>
          <AccountSettings me={me.data} />
          <StudiosCard />
        </>
      ) : null}
      <SignOutButton onSignedOut={() => router.replace('/sign-in')} />
    </ScrollView>
  );
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
