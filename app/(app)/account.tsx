import { useRouter } from 'expo-router';
import { ScrollView } from 'react-native';
import { AccountSettings } from '../../components/AccountSettings';
import { StudiosCard } from '../../components/studios/StudiosCard';
import { Body, Button, Card, Title } from '../../components/ui';
import { colours, space } from '../../constants/theme';
import { useSignOut } from '../../hooks/auth';
import { useMe } from '../../hooks/me';

export default function AccountScreen() {
  const me = useMe();
  const signOut = useSignOut();
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
      <Button
        label="Sign out"
        kind="quiet"
        testID="sign-out"
        onPress={async () => {
          await signOut();
          router.replace('/sign-in');
        }}
      />
    </ScrollView>
  );
}
