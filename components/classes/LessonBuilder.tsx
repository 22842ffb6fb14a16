// Building a lesson (instructors): its title and summary, the setups in order (each a snapshot, with a
// refresh when the setup has changed since), the instructor's words for each setup and each of its steps
// (with the change line the class will see), publishing, and the assignments set on it.
import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { Text, TextInput, View } from 'react-native';
import { colours, space } from '../../constants/theme';
import { useAddLessonSetup, useDeleteLesson, useLesson, useRefreshLessonSetup, useRemoveLessonSetup, useUpdateLesson, useUpdateLessonSetup } from '../../hooks/classes';
import { useSetupList } from '../../hooks/setups';
import type { LessonDetail, LessonSetup } from '../../model/api';
import { stepChangeLine } from '../../model/classes';
import { Loading } from '../Loading';
import { Button, Card, ErrorText, Title } from '../ui';
import { AssignmentForm } from './AssignmentForm';
import { Back, CardLink, Heading, NotFound, Page, Pill, SavingText, errorText, s } from './parts';
import { count, formatDateTime } from '../../model/format';

export function LessonBuilder({ lessonId }: { lessonId: string }) {
  const router = useRouter();
  const lesson = useLesson(lessonId);
  const ref = { id: lessonId, classId: lesson.data?.classId ?? '' };
  const update = useUpdateLesson(ref);
  const remove = useDeleteLesson(ref);
  if (lesson.isError) return <NotFound what="Lesson" back={<Back href="/classes" label="Classes" />} />;
  if (!lesson.data) return <Loading />;
  const l = lesson.data;
  if (l.role !== 'instructor') return <NotFound what="Lesson editor" back={<Back href={`/lessons/${l.id}`} label={l.title} />} />;

  return (
    <Page wide>
      <Back href={`/classes/${l.classId}`} label={l.className} />
      <Title>Build the lesson</Title>
      <Card style={{ gap: space.md }}>
        <SavingText label="Lesson title" value={l.title} onSave={(title) => title.trim() && update.mutate({ title: title.trim() })} testID="lesson-title" />
        <SavingText label="What this lesson teaches" value={l.summary} multiline onSave={(summary) => update.mutate({ summary })} />
        <View style={s.row}>
          <Pill label={l.published ? 'Published: students can follow it' : 'Draft: only instructors see it'} tone={l.published ? 'ok' : 'dim'} testID="lesson-state" />
          <Button label={l.published ? 'Back to draft' : 'Publish'} kind={l.published ? 'quiet' : 'primary'} onPress={() => update.mutate({ published: !l.published })} busy={update.isPending} />
          <Button kind="quiet" label="Follow it" onPress={() => router.push(`/lessons/${l.id}`)} />
          <Button kind="quiet" label="Present" onPress={() => router.push(`/present/${l.id}`)} />
        </View>
        {update.error ? <ErrorText>{errorText(update.error)}</ErrorText> : null}
      </Card>

      <Heading>Setups, in the order the class sees them</Heading>
      {l.setups.length === 0 ? <Text style={s.dim}>Add a setup below. Its steps become the lesson’s steps: each places a few items, and the class sees what each one does to the light.</Text> : null}
      {l.setups.map((e, k) => (
        <EntryEditor key={e.id} lesson={l} entry={e} index={k} />
      ))}
      <AddSetup lesson={l} />

      <Heading>Assignments</Heading>
      {l.assignments.map((a) => (
        <CardLink key={a.id} href={`/assignments/${a.id}`} testID="lesson-assignment">
          <Text style={s.heading}>{a.title}</Text>
          <Text style={s.dim}>
            {a.submittedCount ?? 0} submitted · {a.reviewedCount ?? 0} reviewed
          </Text>
        </CardLink>
      ))}
      {l.published ? (
        l.setups.length ? <AssignmentForm lesson={l} /> : <Text style={s.dim}>Add a setup before setting an assignment.</Text>
      ) : (
        <Text style={s.dim}>Publish the lesson to set an assignment on it.</Text>
      )}

      <View style={{ marginTop: space.xl }}>
        <Button kind="quiet" label="Delete this lesson" onPress={() => remove.mutate(undefined, { onSuccess: () => router.replace(`/classes/${l.classId}`) })} busy={remove.isPending} />
      </View>
    </Page>
  );
}

function EntryEditor({ lesson, entry, index }: { lesson: LessonDetail; entry: LessonSetup; index: number }) {
  const ref = { id: lesson.id, classId: lesson.classId };
  const update = useUpdateLessonSetup(ref);
  const refresh = useRefreshLessonSetup(ref);
  const remove = useRemoveLessonSetup(ref);
  const doc = entry.document;
  const lines = useMemo(() => doc.steps.map((_s, k) => stepChangeLine(doc, k)), [doc]);
  const last = index === lesson.setups.length - 1;
  return (
    <Card style={{ gap: space.md }}>
      <View style={s.headingRow}>
        <Text style={[s.heading, { flex: 1 }]} testID="lesson-setup-title">
          {index + 1}. {entry.title}
        </Text>
        <View style={s.row}>
          <Button kind="quiet" label="Move up" disabled={index === 0} onPress={() => update.mutate({ entryId: entry.id, position: index - 1 })} />
          <Button kind="quiet" label="Move down" disabled={last} onPress={() => update.mutate({ entryId: entry.id, position: index + 1 })} />
          <Button kind="quiet" label="Remove" onPress={() => remove.mutate(entry.id)} />
        </View>
      </View>
      <Text style={s.dim}>
        Copy of version {entry.sourceVersion}, taken {formatDateTime(entry.snapshotAt)}
        {entry.setupId ? '' : ' · the setup it came from is gone'}
      </Text>
      {entry.newerVersion !== null ? (
        <View style={s.row}>
          <Text style={[s.text, { color: colours.accent }]}>The setup has changed since (version {entry.newerVersion}).</Text>
          <Button label="Take the new version" onPress={() => refresh.mutate(entry.id)} busy={refresh.isPending} />
        </View>
      ) : null}
      {refresh.error ? <ErrorText>{errorText(refresh.error)}</ErrorText> : null}
      <SavingText label="Your words for this setup" value={entry.note} multiline onSave={(note) => update.mutate({ entryId: entry.id, note })} placeholder="What to look for before the first light goes on" />
      {doc.steps.length === 0 ? <Text style={s.dim}>This setup has no steps: the class sees the whole plan at once. Add steps in the editor to build it up light by light.</Text> : null}
      {doc.steps.map((st, k) => (
        <View key={st.id} style={[s.item, { gap: space.sm }]}>
          <Text style={s.text}>
            Step {k + 1}
            {st.title ? `: ${st.title}` : ''}
          </Text>
          <Text style={[s.mono, { color: colours.cool, fontSize: 13 }]}>{lines[k]}</Text>
          {st.note ? <Text style={s.dim}>From the setup: {st.note}</Text> : null}
          <SavingText
            label={`Your words for step ${k + 1}`}
            value={entry.stepNotes[st.id] ?? ''}
            multiline
            onSave={(text) => update.mutate({ entryId: entry.id, stepNotes: { [st.id]: text } })}
            placeholder="Why this step, what to notice in the light"
          />
        </View>
      ))}
      {update.error ? <ErrorText>{errorText(update.error)}</ErrorText> : null}
    </Card>
  );
}

/** Pick a setup from your studios or the templates. */
function AddSetup({ lesson }: { lesson: LessonDetail }) {
  const add = useAddLessonSetup({ id: lesson.id, classId: lesson.classId });
  const [q, setQ] = useState('');
  const [section, setSection] = useState<'library' | 'templates'>('library');
  const list = useSetupList({ ...(q.trim() ? { q: q.trim() } : {}), ...(section === 'templates' ? { section } : {}) });
  const setups = list.data?.pages.flatMap((p) => p.setups) ?? [];
  return (
    <Card style={{ gap: space.sm }}>
      <Heading
        right={
          <View style={s.row}>
            <Button kind={section === 'library' ? 'primary' : 'quiet'} label="My setups" onPress={() => setSection('library')} />
            <Button kind={section === 'templates' ? 'primary' : 'quiet'} label="Templates" onPress={() => setSection('templates')} />
          </View>
        }
      >
        Add a setup
      </Heading>
      <TextInput accessibilityLabel="Find a setup" value={q} onChangeText={setQ} placeholder="Search by title, notes or tag" placeholderTextColor={colours.textFaint} style={s.input} />
      {add.error ? <ErrorText>{errorText(add.error)}</ErrorText> : null}
      {setups.slice(0, 12).map((x) => (
        <View key={x.id} style={[s.item, s.row]} testID="pick-setup">
          <View style={{ flex: 1, minWidth: 180 }}>
            <Text style={s.text}>{x.title}</Text>
            <Text style={s.dim}>
              {x.studioName} · {count(x.itemCount, 'item')}
            </Text>
          </View>
          <Button label="Add" onPress={() => add.mutate({ setupId: x.id })} disabled={add.isPending} testID={`add-${x.title}`} />
        </View>
      ))}
      {list.isSuccess && setups.length === 0 ? <Text style={s.dim}>No setup matches.</Text> : null}
    </Card>
  );
}
