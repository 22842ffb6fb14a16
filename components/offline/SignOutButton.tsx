// Signing out with changes still on this device asks first: they stay queued under this person (another person
// signing in here never sends or drops them) and go out when this person signs in again, or they can be sent now.
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { useSignOut } from '../../hooks/auth';
import { isOnlineNow, sendQueuedNow, useOfflineQueue, useOnline } from '../../hooks/offline';
import { offlineQueue } from '../../hooks/offlineQueue';
import { Button, ErrorText } from '../ui';

const changes = (n: number) => `${n} change${n === 1 ? '' : 's'}`;

export function SignOutButton({ onSignedOut }: { onSignedOut: () => void }) {
  const signOut = useSignOut();
  const qc = useQueryClient();
  const online = useOnline();
  const { waiting } = useOfflineQueue();
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState<'send' | 'out' | null>(null);
  const [error, setError] = useState<string | null>(null);
  const box = useRef<View>(null);
  const showing = asking && waiting > 0;
  // The question opens where the button was, at the foot of a long page: on a phone most of it would sit below
  // the fold, its buttons out of sight. Bring all of it into view when it opens (the web's own scrolling).
  useEffect(() => {
    if (!showing || Platform.OS !== 'web') return;
    (box.current as unknown as { scrollIntoView?: (o: ScrollIntoViewOptions) => void } | null)?.scrollIntoView?.({ block: 'nearest' });
  }, [showing]);

  const leave = async () => {
    setBusy('out');
    setError(null);
    try {
      if (!isOnlineNow()) throw new Error('Signing out needs a connection.');
      await signOut();
      onSignedOut();
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Signing out failed.');
      setBusy(null);
    }
  };
  const sendNow = async () => {
    setBusy('send');
    setError(null);
    try {
      await sendQueuedNow(qc);
      const left = (await offlineQueue.all()).reduce((n, e) => n + e.count, 0);
      if (left === 0) return await leave();
      setError(`${changes(left)} could not be sent yet (the server did not take ${left === 1 ? 'it' : 'them'}). ${left === 1 ? 'It stays' : 'They stay'} on this device.`);
    } finally {
      setBusy((b) => (b === 'send' ? null : b));
    }
  };

  if (!showing) {
    return (
      <View style={s.wrap}>
        <Button label="Sign out" kind="quiet" testID="sign-out" busy={busy === 'out'} onPress={() => (waiting > 0 ? setAsking(true) : void leave())} />
        {error ? <ErrorText>{error}</ErrorText> : null}
      </View>
    );
  }
  return (
    <View ref={box} style={[s.wrap, s.box]} accessibilityRole="alert" testID="sign-out-unsent">
      <Text style={s.head}>{changes(waiting)} not sent</Text>
      <Text style={s.note}>
        {waiting === 1 ? 'It is' : 'They are'} kept on this device under your name and sent the next time you sign in here. Nobody else who signs in on
        this device can send or remove {waiting === 1 ? 'it' : 'them'}.
        {online ? '' : ' There is no connection now, and signing out needs one.'}
      </Text>
      {error ? <ErrorText>{error}</ErrorText> : null}
      <View style={s.row}>
        <Button label="Send now" onPress={() => void sendNow()} busy={busy === 'send'} disabled={!online || busy !== null} testID="sign-out-send" />
        <Button label="Sign out anyway" kind="quiet" onPress={() => void leave()} busy={busy === 'out'} disabled={!online || busy !== null} testID="sign-out-anyway" />
        <Button label="Stay signed in" kind="quiet" onPress={() => setAsking(false)} disabled={busy !== null} />
      </View>
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { gap: space.sm },
  box: { borderWidth: 1, borderColor: colours.line, borderRadius: radius.md, backgroundColor: colours.panelRaised, padding: space.md },
  head: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 16 },
  note: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 14, lineHeight: 20 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
