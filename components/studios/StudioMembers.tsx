// A studio's members and their roles. Everyone in the studio sees who is in it; an owner invites by e-mail
// (and hands over the link until a mailer sends it), changes roles, removes members and withdraws
// invitations. A member may leave. The server refuses to leave a studio without an owner.
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Platform, Pressable, ScrollView, StyleSheet, Text, View } from 'react-native';
import type { z } from 'zod';
import { colours, fonts, radius, space } from '../../constants/theme';
import { useMe } from '../../hooks/me';
import { useChangeMember, useInvitations, useInvite, useMembers, useRevokeInvitation, useStudio } from '../../hooks/studios';
import type { StudioMember, StudioRole } from '../../model/api';
import { inviteMemberBody, studioRoles } from '../../model/forms';
import { ChoiceField } from '../ChoiceField';
import { Chip } from '../Chips';
import { Dialog, DialogActions } from '../Dialog';
import { FormField } from '../FormField';
import { showServerError } from '../library/SetupDialogs';
import { Body, Button, Card, ErrorText, Title } from '../ui';
import { count, formatDate } from '../../model/format';

const roleWords: Record<StudioRole, string> = { owner: 'Owner', editor: 'Editor', crew: 'Crew' };
const roleHints: Record<StudioRole, string> = {
  owner: 'everything, and the studio’s members',
  editor: 'creates, edits and deletes setups',
  crew: 'opens setups and comments; never changes them',
};

export function StudioMembers({ studioId }: { studioId: string }) {
  const router = useRouter();
  const me = useMe();
  const studio = useStudio(studioId);
  const members = useMembers(studioId);
  const isOwner = studio.data?.role === 'owner';
  const invitations = useInvitations(studioId, isOwner);
  const change = useChangeMember(studioId);
  const revoke = useRevokeInvitation(studioId);
  const [removing, setRemoving] = useState<StudioMember | null>(null);
  const myId = me.data?.user.id;

  if (studio.isError) {
    return (
      <View style={s.root}>
        <View style={s.page}>
          <Title>Studio not found</Title>
          <Body dim>You may have left it, or it was never yours to see.</Body>
        </View>
      </View>
    );
  }
  return (
    <ScrollView style={s.root} contentContainerStyle={s.page}>
      <Link href="/account" style={s.back}>
        ← Account
      </Link>
      <Title>{studio.data?.name ?? 'Studio'}</Title>
      <Body dim style={{ marginBottom: space.md }}>
        {studio.data ? `${count(studio.data.memberCount, 'member')} · you are ${roleWords[studio.data.role].toLowerCase()}` : ' '}
      </Body>

      <Card style={{ gap: space.md }}>
        <Text style={s.heading}>Members</Text>
        {change.error ? <ErrorText>{change.error.message}</ErrorText> : null}
        {(members.data ?? []).map((m) => (
          <View key={m.userId} style={s.member} testID="member-row">
            <View style={{ flex: 1, minWidth: 180 }}>
              <Text style={s.name}>
                {m.name}
                {m.userId === myId ? ' (you)' : ''}
              </Text>
              <Text style={s.email}>{m.email}</Text>
            </View>
            {isOwner ? (
              <View style={s.roles} role="radiogroup" aria-label={`Role of ${m.name}`}>
                {studioRoles.map((r) => (
                  <Chip key={r} label={roleWords[r]} hint={roleHints[r]} selected={m.role === r} onPress={() => m.role !== r && change.mutate({ userId: m.userId, role: r })} />
                ))}
              </View>
            ) : (
              <Text style={s.role}>{roleWords[m.role]}</Text>
            )}
            {isOwner && m.userId !== myId ? <Button label="Remove" kind="quiet" onPress={() => setRemoving(m)} /> : null}
            {!isOwner && m.userId === myId ? <Button label="Leave studio" kind="quiet" onPress={() => setRemoving(m)} /> : null}
          </View>
        ))}
      </Card>

      {isOwner ? (
        <>
          <InviteCard studioId={studioId} personal={studio.data?.personal ?? false} />
          {(invitations.data ?? []).length ? (
            <Card style={{ gap: space.sm }}>
              <Text style={s.heading}>Waiting to join</Text>
              {invitations.data!.map((i) => (
                <View key={i.id} style={s.member}>
                  <View style={{ flex: 1 }}>
                    <Text style={s.name}>{i.email}</Text>
                    <Text style={s.email}>
                      {roleWords[i.role]} · link works until {formatDate(i.expiresAt)}
                    </Text>
                  </View>
                  <Button label="Withdraw" kind="quiet" onPress={() => revoke.mutate(i.id)} />
                </View>
              ))}
            </Card>
          ) : null}
        </>
      ) : null}

      <Dialog visible={!!removing} title={removing?.userId === myId ? 'Leave this studio?' : `Remove ${removing?.name}?`} onClose={() => setRemoving(null)}>
        <Body>
          {removing?.userId === myId
            ? 'You will no longer see its setups. An owner can invite you again.'
            : 'They will no longer see the studio’s setups. Their own copies elsewhere stay theirs.'}
        </Body>
        <DialogActions>
          <Button label="Cancel" kind="quiet" onPress={() => setRemoving(null)} />
          <Button
            label={removing?.userId === myId ? 'Leave' : 'Remove'}
            onPress={() => {
              const m = removing!;
              setRemoving(null);
              change.mutate({ userId: m.userId, role: null }, { onSuccess: () => m.userId === myId && router.replace('/setups') });
            }}
          />
        </DialogActions>
      </Dialog>
    </ScrollView>
  );
}

type InviteValues = z.input<typeof inviteMemberBody>;

function InviteCard({ studioId, personal }: { studioId: string; personal: boolean }) {
  const invite = useInvite(studioId);
  const [link, setLink] = useState<{ email: string; link: string } | null>(null);
  const [copied, setCopied] = useState(false);
  const { control, handleSubmit, formState, reset, setError } = useForm<InviteValues>({ resolver: zodResolver(inviteMemberBody), defaultValues: { email: '', role: 'crew' } });
  const submit = handleSubmit(async (v) => {
    try {
      const r = await invite.mutateAsync(v);
      setLink({ email: r.invitation.email, link: r.link });
      setCopied(false);
      reset({ email: '', role: v.role });
    } catch (err) {
      const other = showServerError(err, setError, ['email', 'role']);
      if (other) setError('root', { message: other });
    }
  });
  const roles = (personal ? studioRoles.filter((r) => r !== 'owner') : studioRoles).map((r) => ({ value: r, label: roleWords[r], hint: roleHints[r] }));
  return (
    <Card>
      <Text style={s.heading}>Invite someone</Text>
      <Body dim style={{ marginBottom: space.md }}>They get a link that signs them up or in and joins them to the studio in the role you choose.</Body>
      <FormField control={control} name="email" label="E-mail" placeholder="assistant@example.com" keyboardType="email-address" autoCapitalize="none" autoComplete="email" error={formState.errors.email?.message} onSubmitEditing={submit} testID="invite-email" />
      <ChoiceField control={control} name="role" label="Role" options={roles} error={formState.errors.role?.message} />
      {formState.errors.root ? <ErrorText>{formState.errors.root.message}</ErrorText> : null}
      <Button label="Make the invitation" onPress={submit} busy={formState.isSubmitting} testID="invite-submit" />
      {link ? (
        <View style={s.linkBox} testID="invitation-link">
          <Body>E-mail is not sent yet: give {link.email} this link (it works for 14 days, once).</Body>
          <Text selectable style={s.link}>
            {link.link}
          </Text>
          {Platform.OS === 'web' && typeof navigator !== 'undefined' && navigator.clipboard ? (
            <Pressable accessibilityRole="button" onPress={() => void navigator.clipboard.writeText(link.link).then(() => setCopied(true))}>
              <Text style={s.copy}>{copied ? 'Copied' : 'Copy the link'}</Text>
            </Pressable>
          ) : null}
        </View>
      ) : null}
    </Card>
  );
}

const s = StyleSheet.create({
  root: { flex: 1, backgroundColor: colours.graphite },
  page: { padding: space.lg, gap: space.md, maxWidth: 760, width: '100%' },
  back: { color: colours.accent, fontFamily: fonts.sansMedium, fontSize: 14, marginBottom: space.sm },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 17 },
  member: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm, paddingVertical: space.xs, borderTopWidth: 1, borderTopColor: colours.line, paddingTop: space.sm },
  name: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 15 },
  email: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 13 },
  role: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 14 },
  roles: { flexDirection: 'row', gap: space.xs },
  linkBox: { marginTop: space.md, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colours.line, backgroundColor: colours.graphite, gap: space.sm },
  link: { color: colours.cool, fontFamily: fonts.mono, fontSize: 13 },
  copy: { color: colours.accent, fontFamily: fonts.sansBold, fontSize: 14 },
});
