// Who is in a class. Instructors see addresses, the join code (and can change it), invite by e-mail,
// remove members and withdraw invitations; anyone may leave (the server keeps at least one instructor).
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useForm } from 'react-hook-form';
import { Text, View } from 'react-native';
import type { z } from 'zod';
import { space } from '../../constants/theme';
import { useClassInvitations, useClassMembers, useInviteToClass, useNewJoinCode, useRemoveClassMember, useWithdrawClassInvitation } from '../../hooks/classes';
import { useMe } from '../../hooks/me';
import { inviteToClassBody, type ClassView } from '../../model/api';
import { ChoiceField } from '../ChoiceField';
import { FormField } from '../FormField';
import { showServerError } from '../library/SetupDialogs';
import { Button, Card, ErrorText } from '../ui';
import { Heading, Pill, errorText, s } from './parts';

export function Roster({ klass }: { klass: ClassView }) {
  const router = useRouter();
  const me = useMe();
  const teaching = klass.role === 'instructor';
  const members = useClassMembers(klass.id);
  const invitations = useClassInvitations(klass.id, teaching);
  const remove = useRemoveClassMember(klass.id);
  const withdraw = useWithdrawClassInvitation(klass.id);
  const newCode = useNewJoinCode(klass.id);
  const myId = me.data?.user.id;

  return (
    <Card style={{ gap: space.sm }}>
      <Heading>People</Heading>
      {teaching && klass.joinCode ? (
        <View style={[s.row, { justifyContent: 'space-between' }]}>
          <View>
            <Text style={s.label}>Join code</Text>
            <Text style={[s.mono, { fontSize: 24, letterSpacing: 3 }]} testID="join-code" selectable>
              {klass.joinCode}
            </Text>
          </View>
          <Button kind="quiet" label="New code" onPress={() => newCode.mutate()} busy={newCode.isPending} />
        </View>
      ) : null}
      {remove.error ? <ErrorText>{errorText(remove.error)}</ErrorText> : null}
      {(members.data ?? []).map((m) => (
        <View key={m.userId} style={[s.item, s.row]} testID="class-member">
          <View style={{ flex: 1, minWidth: 160 }}>
            <Text style={s.text}>
              {m.name}
              {m.userId === myId ? ' (you)' : ''}
            </Text>
            {m.email ? <Text style={s.dim}>{m.email}</Text> : null}
          </View>
          <Pill label={m.role === 'instructor' ? 'Instructor' : 'Student'} tone={m.role === 'instructor' ? 'accent' : 'dim'} />
          {teaching && m.userId !== myId ? <Button kind="quiet" label="Remove" onPress={() => remove.mutate(m.userId)} /> : null}
          {m.userId === myId && !teaching ? (
            <Button kind="quiet" label="Leave the class" onPress={() => remove.mutate(m.userId, { onSuccess: () => router.replace('/classes') })} />
          ) : null}
        </View>
      ))}
      {teaching ? (
        <>
          {(invitations.data ?? []).map((i) => (
            <View key={i.id} style={[s.item, s.row]}>
              <View style={{ flex: 1 }}>
                <Text style={s.text}>{i.email}</Text>
                <Text style={s.dim}>
                  invited as {i.role} · {i.delivery === 'email' ? 'e-mail sent' : i.delivery === 'failed' ? 'e-mail failed: give them the join code' : 'not e-mailed'}
                </Text>
              </View>
              <Button kind="quiet" label="Withdraw" onPress={() => withdraw.mutate(i.id)} />
            </View>
          ))}
          <Invite classId={klass.id} />
        </>
      ) : null}
    </Card>
  );
}

type InviteValues = z.input<typeof inviteToClassBody>;
function Invite({ classId }: { classId: string }) {
  const invite = useInviteToClass(classId);
  const { control, handleSubmit, formState, reset, setError } = useForm<InviteValues>({ resolver: zodResolver(inviteToClassBody), defaultValues: { email: '', role: 'student' } });
  const submit = handleSubmit(async (v) => {
    try {
      await invite.mutateAsync(v);
      reset({ email: '', role: v.role });
    } catch (err) {
      const other = showServerError(err, setError, ['email', 'role']);
      if (other) setError('root', { message: other });
    }
  });
  return (
    <View style={[s.item, { paddingTop: space.md }]}>
      <Text style={[s.dim, { marginBottom: space.sm }]}>Invite by e-mail: they get the join code and join from their Classes screen.</Text>
      <FormField control={control} name="email" label="E-mail" placeholder="student@example.com" keyboardType="email-address" autoCapitalize="none" error={formState.errors.email?.message} onSubmitEditing={submit} />
      <ChoiceField control={control} name="role" label="As" options={[{ value: 'student', label: 'Student' }, { value: 'instructor', label: 'Instructor' }]} error={formState.errors.role?.message} />
      {formState.errors.root ? <ErrorText>{formState.errors.root.message}</ErrorText> : null}
      <Button label="Send the invitation" onPress={submit} busy={formState.isSubmitting} />
    </View>
  );
}
