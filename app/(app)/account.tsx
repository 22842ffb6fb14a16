import { useRouter } from 'expo-router';
import { ScrollView, View } from 'react-native';
import { Body, Button, Card, Title } from '../../components/ui';
import { colours, space } from '../../constants/theme';
import { useSignOut } from '../../hooks/auth';
import { useMe } from '../../hooks/me';

const roleWords = { owner: 'Owner', editor: 'Editor', crew: 'Crew' } as const;

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
            <Body dim>
              Units: {me.data.user.units === 'metric' ? 'metres' : 'feet'} · Paper: {me.data.user.paper === 'a4' ? 'A4' : 'US Letter'}
            </Body>
          </Card>
          <Card>
            <Body style={{ fontSize: 17, marginBottom: space.sm }}>Studios</Body>
            {me.data.studios.map((s) => (
              <View key={s.id} style={{ flexDirection: 'row', justifyContent: 'space-between', paddingVertical: 4 }}>
                <Body>{s.name}</Body>
                <Body dim>{roleWords[s.role]}</Body>
              </View>
            ))}
          </Card>
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
