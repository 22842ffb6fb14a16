// The app-wide word about the connection, above the signed-in screens: offline with N changes waiting on this
// device, those changes being sent once the connection is back, and setups whose queued changes crossed
// someone else's save (opening one offers the usual choices). When a send fails (the server busy, the session
// lost) it says so and when the next try is, with a way to try at once.
import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, space } from '../../constants/theme';
import { sendQueuedNow, useOfflineQueue, useOnline, useSendState } from '../../hooks/offline';

const changes = (n: number) => `${n} change${n === 1 ? '' : 's'}`;

export function OfflineBanner() {
  const online = useOnline();
  const { waiting, conflicts } = useOfflineQueue();
  const send = useSendState();
  const qc = useQueryClient();
  if (online && !waiting) return null;
  const stuck = online && !conflicts.length && !send.sending && send.failed !== null;
  const text = !online
    ? waiting
      ? `Offline — ${changes(waiting)} waiting`
      : 'Offline — setups kept on this device still open'
    : conflicts.length
      ? `${conflicts.length === 1 ? 'A setup was' : `${conflicts.length} setups were`} changed elsewhere while you were offline: open ${conflicts.length === 1 ? 'it' : 'each'} to choose`
      : stuck
        ? `${changes(waiting)} not sent yet: ${send.failed}. Trying again shortly`
        : `Back online — sending ${changes(waiting)}`;
  return (
    <View style={[s.bar, online && conflicts.length ? { borderBottomColor: colours.accent } : null]} accessibilityRole="alert" accessibilityLiveRegion="polite" testID="offline-banner">
      <View style={[s.dot, { backgroundColor: online ? colours.ok : colours.danger }]} />
      <Text style={s.text}>{text}</Text>
      {online
        ? conflicts.map((c) => (
            <Link key={c.setupId} href={`/setups/${c.setupId}`} style={s.link}>
              Open
            </Link>
          ))
        : null}
      {stuck ? (
        <Pressable accessibilityRole="button" onPress={() => void sendQueuedNow(qc)} style={s.button} hitSlop={8}>
          <Text style={s.link}>Try now</Text>
        </Pressable>
      ) : null}
    </View>
  );
}

const s = StyleSheet.create({
  bar: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.sm, paddingHorizontal: space.lg, paddingVertical: space.sm, backgroundColor: colours.panelRaised, borderBottomWidth: 1, borderBottomColor: colours.line },
  dot: { width: 8, height: 8, borderRadius: 4 },
  text: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14, flexShrink: 1 },
  button: { minHeight: 44, justifyContent: 'center' },
  link: { color: colours.accent, fontFamily: fonts.sansMedium, fontSize: 14, paddingHorizontal: space.sm, paddingVertical: space.xs },
});
