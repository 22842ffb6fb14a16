// One class: its lessons (instructors also see drafts and add lessons), its assignments, and the roster.
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Text, TextInput, View, useWindowDimensions } from 'react-native';
import { WIDE_MIN, colours, space } from '../../constants/theme';
import { useClass, useClassAssignments, useCreateLesson, useLessons } from '../../hooks/classes';
import { Button, Card, ErrorText, Title } from '../ui';
import { Back, CardLink, Heading, NotFound, Page, Pill, errorText, s } from './parts';
import { Roster } from './Roster';
import { count, formatDateTime } from '../../model/format';

/** joined: the person just joined with a code ('new'), or gave the code of a class they were already in ('again'). */
export function ClassScreen({ classId, joined }: { classId: string; joined?: 'new' | 'again' }) {
  const { width } = useWindowDimensions();
  const klass = useClass(classId);
  const lessons = useLessons(classId);
  const assignments = useClassAssignments(classId);
  if (klass.isError) return <NotFound what="Class" back={<Back href="/classes" label="Classes" />} />;
  const c = klass.data;
  const teaching = c?.role === 'instructor';
  const wide = width >= WIDE_MIN;

  const lessonList = (
    <Card style={{ gap: space.sm }}>
      <Heading>Lessons</Heading>
      {lessons.data?.length === 0 ? <Text style={s.dim}>{teaching ? 'No lessons yet. Build one from your setups, step by step.' : 'No lessons yet.'}</Text> : null}
      {(lessons.data ?? []).map((l) => (
        <CardLink key={l.id} href={teaching ? `/lessons/${l.id}/edit` : `/lessons/${l.id}`} testID="lesson-row">
          <View style={s.headingRow}>
            <Text style={[s.heading, { flex: 1 }]}>{l.title}</Text>
            {teaching ? <Pill label={l.published ? 'Published' : 'Draft'} tone={l.published ? 'ok' : 'dim'} /> : null}
          </View>
          <Text style={s.dim}>
            {l.setupCount} {l.setupCount === 1 ? 'setup' : 'setups'}
            {l.assignmentCount ? ` · ${l.assignmentCount} ${l.assignmentCount === 1 ? 'assignment' : 'assignments'}` : ''}
            {l.summary ? ` · ${l.summary}` : ''}
          </Text>
        </CardLink>
      ))}
      {teaching ? <NewLesson classId={classId} /> : null}
    </Card>
  );

  const assignmentList = (
    <Card style={{ gap: space.sm }}>
      <Heading>Assignments</Heading>
      {assignments.data?.length === 0 ? <Text style={s.dim}>{teaching ? 'Set an assignment from a published lesson.' : 'Nothing to do yet.'}</Text> : null}
      {(assignments.data ?? []).map((a) => (
        <CardLink key={a.id} href={`/assignments/${a.id}`} testID="assignment-row">
          <Text style={s.heading}>{a.title}</Text>
          <Text style={s.dim}>
            from {a.lessonTitle}
            {a.dueAt ? ` · due ${formatDateTime(a.dueAt)}` : ''}
            {teaching && a.submittedCount !== null ? ` · ${a.submittedCount} submitted, ${a.reviewedCount} reviewed` : ''}
          </Text>
        </CardLink>
      ))}
    </Card>
  );

  return (
    <Page wide={wide}>
      <Back href="/classes" label="Classes" />
      <Title>{c?.name ?? ' '}</Title>
      {c && joined ? (
        <Text role="status" style={[s.text, { color: colours.ok }]} testID="joined-notice">
          {joined === 'again' ? `You are already in ${c.name}.` : `You joined ${c.name}.`}
        </Text>
      ) : null}
      {c ? (
        <Text style={s.dim}>
          {teaching ? 'You teach this class' : `Taught by ${c.instructors.join(', ')}`} · {count(c.studentCount, 'student')}
        </Text>
      ) : null}
      {wide ? (
        <View style={{ flexDirection: 'row', gap: space.md, alignItems: 'flex-start' }}>
          <View style={{ flex: 3, gap: space.md }}>
            {lessonList}
            {assignmentList}
          </View>
          <View style={{ flex: 2 }}>{c ? <Roster klass={c} /> : null}</View>
        </View>
      ) : (
        <>
          {lessonList}
          {assignmentList}
          {c ? <Roster klass={c} /> : null}
        </>
      )}
    </Page>
  );
}

function NewLesson({ classId }: { classId: string }) {
  const router = useRouter();
  const create = useCreateLesson(classId);
  const [title, setTitle] = useState('');
  const submit = () => {
    if (!title.trim()) return;
    create.mutate({ title: title.trim() }, { onSuccess: (l) => router.push(`/lessons/${l.id}/edit`) });
  };
  return (
    <View style={[s.item, { gap: space.sm }]}>
      <Text style={s.label}>New lesson</Text>
      <TextInput
        accessibilityLabel="New lesson title"
        value={title}
        onChangeText={setTitle}
        onSubmitEditing={submit}
        placeholder="e.g. Moving the key behind the subject"
        placeholderTextColor={colours.textFaint}
        style={s.input}
      />
      {create.error ? <ErrorText>{errorText(create.error)}</ErrorText> : null}
      <Button label="Add the lesson" onPress={submit} busy={create.isPending} disabled={!title.trim()} />
    </View>
  );
}
