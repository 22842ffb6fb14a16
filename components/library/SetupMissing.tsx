// What a setup link shows when the setup cannot be opened: why, who is signed in, and the ways on from here
// (back to the library, or sign in as the person the link was meant for, coming back to this setup).
import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { colours, space } from '../../constants/theme';
import { ApiRequestError } from '../../hooks/api';
import { useSignOut } from '../../hooks/auth';
import { useMe } from '../../hooks/me';
import { Body, Button, Title } from '../ui';

export function SetupMissing({ setupId, error, onRetry }: { setupId: string; error: unknown; onRetry: () => void }) {
  const router = useRouter();
  const me = useMe();
  const signOut = useSignOut();
  // Not there, or not yours to see (the server answers both alike); anything else is a failure to load.
  const missing = error instanceof ApiRequestError && ([400, 403, 404].includes(error.status));
  const who = me.data?.user;
  return (
    <View style={{ flex: 1, padding: space.lg, gap: space.md, backgroundColor: colours.graphite, maxWidth: 640 }} testID="setup-missing">
      <Title>{missing ? 'Setup not found' : 'The setup could not be loaded'}</Title>
      <Body dim>
        {missing
          ? 'It may have been deleted, or it belongs to a studio or class you are not in.'
          : 'The server did not answer as it should. Your setups are safe; try again in a moment.'}
      </Body>
      {missing && who ? (
        <Body dim testID="setup-missing-who">
          You are signed in as {who.name} ({who.email}). If the link was sent to another address, sign in with that one.
        </Body>
      ) : null}
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        {missing ? null : <Button label="Try again" onPress={onRetry} />}
        <Button label="Back to your setups" kind={missing ? 'primary' : 'quiet'} onPress={() => router.replace('/setups')} testID="setup-missing-library" />
        {missing ? (
          <Button
            label="Sign in as someone else"
            kind="quiet"
            testID="setup-missing-switch"
            onPress={async () => {
              await signOut();
              router.replace(`/sign-in?next=${encodeURIComponent(`/setups/${setupId}`)}`);
            }}
          />
        ) : null}
      </View>
    </View>
  );
}
