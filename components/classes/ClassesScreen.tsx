// Classes: the ones you teach or take, invitations to your address, joining with a code, starting a class.
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useForm } from 'react-hook-form';
import { Text, View } from 'react-native';
import type { z } from 'zod';
import { space } from '../../constants/theme';
import { useAcceptClassInvitation, useClasses, useCreateClass, useJoinClass } from '../../hooks/classes';
import { createClassBody, joinClassBody, type ClassSummary } from '../../model/api';
import { FormField } from '../FormField';
import { showServerError } from '../library/SetupDialogs';
import { Button, Card, ErrorText, Title } from '../ui';
import { CardLink, Heading, Page, Pill, errorText, s } from './parts';

export function ClassesScreen() {
  const list = useClasses();
  const accept = useAcceptClassInvitation();
  const classes = list.data?.classes ?? [];
  const invitations = list.data?.invitations ?? [];
  return (
    <Page testID="classes-screen">
      <Title>Classes</Title>
      {invitations.map((i) => (
        <Card key={i.classId} style={{ gap: space.sm }}>
          <Text style={s.text}>
            {i.invitedBy ?? 'An instructor'} invited you to <Text style={{ fontWeight: '600' }}>{i.className}</Text> as {i.role === 'instructor' ? 'an instructor' : 'a student'}.
          </Text>
          <Button label={`Join ${i.className}`} onPress={() => accept.mutate(i.classId)} busy={accept.isPending} />
        </Card>
      ))}
      {accept.error ? <ErrorText>{errorText(accept.error)}</ErrorText> : null}
      {list.isError ? <ErrorText>{errorText(list.error)}</ErrorText> : null}
      {list.isSuccess && classes.length === 0 ? <Text style={s.dim}>You are not in a class yet. Join one with the code your instructor gives you, or start your own.</Text> : null}
      {classes.map((c) => (
        <ClassCard key={c.id} c={c} />
      ))}
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
        <JoinCard mine={classes} />
        <NewClassCard />
      </View>
    </Page>
  );
}

function ClassCard({ c }: { c: ClassSummary }) {
  return (
    <CardLink href={`/classes/${c.id}`} testID="class-card">
        <View style={s.headingRow}>
          <Text style={[s.heading, { flex: 1 }]}>{c.name}</Text>
          <Pill label={c.role === 'instructor' ? 'You teach' : 'Student'} tone={c.role === 'instructor' ? 'accent' : 'dim'} />
        </View>
        <Text style={s.dim}>
          {c.lessonCount} {c.lessonCount === 1 ? 'lesson' : 'lessons'} · {c.studentCount} {c.studentCount === 1 ? 'student' : 'students'}
        </Text>
    </CardLink>
  );
}

type JoinValues = z.input<typeof joinClassBody>;
/** Joining takes the person to the class, which says whether they joined now or were already in it. */
function JoinCard({ mine }: { mine: readonly ClassSummary[] }) {
  const router = useRouter();
  const join = useJoinClass();
  const { control, handleSubmit, formState, reset, setError } = useForm<JoinValues>({ resolver: zodResolver(joinClassBody), defaultValues: { code: '' } });
  const submit = handleSubmit(async (v) => {
    try {
      const before = new Set(mine.map((c) => c.id));
      const joined = await join.mutateAsync(v);
      reset({ code: '' });
      router.push({ pathname: '/classes/[id]', params: { id: joined.classId, joined: before.has(joined.classId) ? 'again' : 'new' } });
    } catch (err) {
      const other = showServerError(err, setError, ['code']);
      if (other) setError('root', { message: other });
    }
  });
  return (
    <Card style={{ flexGrow: 1, flexBasis: 280 }}>
      <Heading>Join a class</Heading>
      <FormField control={control} name="code" label="Join code" placeholder="e.g. K7Q2MD" autoCapitalize="characters" error={formState.errors.code?.message} onSubmitEditing={submit} />
      {formState.errors.root ? <ErrorText>{formState.errors.root.message}</ErrorText> : null}
      <Button label="Join" onPress={submit} busy={formState.isSubmitting} />
    </Card>
  );
}

type NewValues = z.input<typeof createClassBody>;
function NewClassCard() {
  const create = useCreateClass();
  const { control, handleSubmit, formState, reset, setError } = useForm<NewValues>({ resolver: zodResolver(createClassBody), defaultValues: { name: '' } });
  const submit = handleSubmit(async (v) => {
    try {
      await create.mutateAsync(v);
      reset({ name: '' });
    } catch (err) {
      const other = showServerError(err, setError, ['name']);
      if (other) setError('root', { message: other });
    }
  });
  return (
    <Card style={{ flexGrow: 1, flexBasis: 280 }}>
      <Heading>Teach a class</Heading>
      <Text style={[s.dim, { marginBottom: space.sm }]}>You become its instructor: build lessons from your setups, invite students, set assignments.</Text>
      <FormField control={control} name="name" label="Class name" placeholder="Portrait lighting, spring term" error={formState.errors.name?.message} onSubmitEditing={submit} />
      {formState.errors.root ? <ErrorText>{formState.errors.root.message}</ErrorText> : null}
      <Button label="Start the class" onPress={submit} busy={formState.isSubmitting} />
    </Card>
  );
}
