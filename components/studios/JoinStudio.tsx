// The page an invitation link opens (signed in): what it invites to, and joining.
import { useRouter } from 'expo-router';
import { ScrollView, View } from 'react-native';
import { colours, space } from '../../constants/theme';
import { useMe } from '../../hooks/me';
import { useAcceptInvitation, useInvitationPreview } from '../../hooks/studios';
import { Loading } from '../Loading';
import { Body, Button, Card, ErrorText, Title } from '../ui';

const roleWords = { owner: 'an owner', editor: 'an editor', crew: 'crew' } as const;
const closed = { accepted: 'This invitation has already been used.', revoked: 'This invitation was withdrawn.', expired: 'This invitation has expired.' } as const;

export function JoinStudio({ token }: { token: string }) {
  const router = useRouter();
  const me = useMe();
  const preview = useInvitationPreview(token);
  const accept = useAcceptInvitation();
  if (preview.isPending) return <Loading />;
  const p = preview.data;
  const myEmail = me.data?.user.email.toLowerCase();
  return (
    <ScrollView style={{ flex: 1, backgroundColor: colours.graphite }} contentContainerStyle={{ padding: space.lg, maxWidth: 560, width: '100%' }}>
      <Card style={{ gap: space.md }}>
        {!p ? (
          <>
            <Title>Invitation not found</Title>
            <Body dim>The link may be incomplete. Ask whoever invited you for a new one.</Body>
          </>
        ) : (
          <>
            <Title>Join {p.studioName}</Title>
            <Body>
              {p.invitedBy ?? 'Someone'} invited {p.email} to join as {roleWords[p.role]}.
            </Body>
            {p.status !== 'open' ? (
              <ErrorText>{closed[p.status]} Ask for a new one.</ErrorText>
            ) : myEmail && myEmail !== p.email.toLowerCase() ? (
              <ErrorText>
                You are signed in as {me.data?.user.email}. Sign out and sign in (or sign up) as {p.email} to join.
              </ErrorText>
            ) : (
              <View>
                {accept.error ? <ErrorText>{accept.error.message}</ErrorText> : null}
                <Button label="Join the studio" busy={accept.isPending} onPress={() => accept.mutate(token, { onSuccess: (r) => router.replace(`/studios/${r.studioId}`) })} testID="join-studio" />
              </View>
            )}
          </>
        )}
      </Card>
    </ScrollView>
  );
}
