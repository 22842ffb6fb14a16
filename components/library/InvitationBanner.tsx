// "You were invited": shown in the library when this browser brought an invitation link through sign-up or
// sign-in (the server remembered it; see server/routes/invitations.ts).
import { StyleSheet, Text, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { useAcceptInvitation, useCarriedInvitation, useForgetInvitation } from '../../hooks/studios';
import { Button, ErrorText } from '../ui';

const roleWords = { owner: 'an owner', editor: 'an editor', crew: 'crew' } as const;

export function InvitationBanner({ onJoined }: { onJoined: (studioName: string) => void }) {
  const carried = useCarriedInvitation();
  const accept = useAcceptInvitation();
  const forget = useForgetInvitation();
  const inv = carried.data;
  if (!inv || !inv.token) return null;
  return (
    <View style={s.banner} accessibilityRole="alert" testID="invitation-banner">
      <Text style={s.text}>
        {inv.invitedBy ?? 'Someone'} invited you to join <Text style={s.strong}>{inv.studioName}</Text> as {roleWords[inv.role]}.
      </Text>
      {accept.error ? <ErrorText>{accept.error.message}</ErrorText> : null}
      <View style={s.actions}>
        <Button label="Not now" kind="quiet" onPress={() => forget.mutate()} />
        <Button label="Join the studio" busy={accept.isPending} onPress={() => accept.mutate(inv.token, { onSuccess: () => onJoined(inv.studioName) })} testID="join-studio" />
      </View>
    </View>
  );
}

const s = StyleSheet.create({
  banner: { backgroundColor: '#2f2a20', borderColor: colours.accent, borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.sm },
  text: { color: colours.text, fontFamily: fonts.sans, fontSize: 15, lineHeight: 21 },
  strong: { fontFamily: fonts.sansBold },
  actions: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm, flexWrap: 'wrap' },
});
