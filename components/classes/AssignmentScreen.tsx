// An assignment. Students start from a copy of the reference or a blank plan (a normal setup, edited in the
// editor), see the meter check computed here before submitting, submit, and see the server's result at
// once. Instructors see the submissions, latest attempt per student, and open one to review it.
import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { Text, View, useWindowDimensions } from 'react-native';
import { TABLET_MIN, space } from '../../constants/theme';
import { useAssignment, useStartAssignment, useSubmissions, useSubmit, useUpdateAssignment, useWorkingCopy } from '../../hooks/classes';
import { dueDateText, parseDueDate } from '../../model/dueDate';
import { DueField } from './AssignmentForm';
import { useMe } from '../../hooks/me';
import type { AssignmentDetail, SubmissionSummary } from '../../model/api';
import { evaluateCheck } from '../../model/classes';
import type { SetupDocument } from '../../model/document';
import type { Units } from '../../model/units';
import { Loading } from '../Loading';
import { Button, Card, ErrorText, Title } from '../ui';
import { CheckResultView, CheckTargets } from './Check';
import { BigMeter } from './LessonPlayer';
import { Back, CardLink, Heading, NotFound, Page, Pill, errorText, s } from './parts';
import { ReadOnlyPlan, usePlanAtStep } from './ReadOnlyPlan';
import { count, formatDateTime } from '../../model/format';

/** The instructor moves or clears the due date (the students see it on the assignment and in the class). */
function DueEditor({ a }: { a: AssignmentDetail }) {
  const update = useUpdateAssignment(a);
  const [text, setText] = useState(dueDateText(a.dueAt));
  const [error, setError] = useState<string | undefined>();
  const save = () => {
    const r = parseDueDate(text);
    if (!r.ok) return setError(r.message);
    setError(undefined);
    update.mutate({ dueAt: r.value }, { onError: (e) => setError(errorText(e)) });
  };
  return (
    <View style={{ gap: space.sm }}>
      <DueField value={text} onChange={setText} error={error} onSubmit={save} />
      <Button kind="quiet" label={text.trim() ? 'Save the due date' : 'Save: no due date'} onPress={save} busy={update.isPending} testID="save-due" />
    </View>
  );
}

export function AssignmentScreen({ assignmentId }: { assignmentId: string }) {
  const me = useMe();
  const assignment = useAssignment(assignmentId);
  if (assignment.isError) return <NotFound what="Assignment" back={<Back href="/classes" label="Classes" />} />;
  if (!assignment.data) return <Loading />;
  const a = assignment.data;
  const units = me.data?.user.units ?? 'metric';
  return (
    <Page wide>
      <Back href={`/classes/${a.classId}`} label={a.className} />
      <Title>{a.title}</Title>
      <CardLink href={`/lessons/${a.lessonId}`}>
        <Text style={s.dim}>From the lesson</Text>
        <Text style={s.link}>{a.lessonTitle} →</Text>
      </CardLink>
      <Card style={{ gap: space.sm }}>
        {a.brief ? <Text style={s.text}>{a.brief}</Text> : null}
        {a.dueAt ? <Text style={s.dim} testID="due-shown">Due {formatDateTime(a.dueAt)}</Text> : null}
        {a.role === 'instructor' ? <DueEditor a={a} /> : null}
        {a.check ? (
          <>
            <Text style={s.label}>The meter checks</Text>
            <CheckTargets check={a.check} />
          </>
        ) : (
          <Text style={s.dim}>No meter check: your instructor reviews the plan by eye.</Text>
        )}
      </Card>
      {a.reference ? <Reference title={a.reference.title} doc={a.reference.document} units={units} /> : null}
      {a.role === 'student' ? <StudentWork a={a} /> : <Submissions a={a} />}
    </Page>
  );
}

function Reference({ title, doc, units }: { title: string; doc: SetupDocument; units: Units }) {
  const { store, readings } = usePlanAtStep(doc, undefined);
  return (
    <Card style={{ gap: space.sm }}>
      <Heading>The look to reproduce: {title}</Heading>
      <View style={{ height: 260 }}>
        <ReadOnlyPlan store={store} readings={readings} units={units} testID="reference-plan" />
      </View>
      <BigMeter readings={readings} compact />
    </Card>
  );
}

function StudentWork({ a }: { a: AssignmentDetail }) {
  const router = useRouter();
  const start = useStartAssignment(a.id);
  const submit = useSubmit(a.id);
  const mine = useSubmissions(a.id);
  const work = useWorkingCopy(a.mine?.setupId ?? null);
  const local = useMemo(() => (a.check && work.data ? evaluateCheck(a.check, work.data.document) : null), [a.check, work.data]);
  const me = useMe();
  // The list also holds classmates' attempts the instructor shared with the class.
  const own = (mine.data ?? []).filter((x) => x.student.id === me.data?.user.id);
  const shared = (mine.data ?? []).filter((x) => x.student.id !== me.data?.user.id);
  const result = submit.data;

  if (!a.mine?.setupId) {
    return (
      <Card style={{ gap: space.sm }}>
        <Heading>Your plan</Heading>
        <Text style={s.dim}>Start from a copy of the reference look, or from an empty plan. It is kept in your own studio and opens in the editor.</Text>
        <View style={s.row}>
          {a.reference ? <Button label="Start from the reference" onPress={() => start.mutate('reference')} busy={start.isPending} /> : null}
          <Button kind={a.reference ? 'quiet' : 'primary'} label="Start from a blank plan" onPress={() => start.mutate('blank')} busy={start.isPending} />
        </View>
        {start.error ? <ErrorText>{errorText(start.error)}</ErrorText> : null}
      </Card>
    );
  }
  return (
    <Card style={{ gap: space.md }}>
      <Heading right={<Button kind="quiet" label="Open my plan" onPress={() => router.push(`/setups/${a.mine!.setupId}`)} testID="open-my-plan" />}>Your plan</Heading>
      {work.data ? <Text style={s.dim}>“{work.data.title}”, saved {formatDateTime(work.data.updatedAt)}</Text> : null}
      {local ? <CheckResultView result={local} title="Check before you submit" testID="local-check" /> : null}
      <Button label="Submit my plan" onPress={() => submit.mutate()} busy={submit.isPending} testID="submit-plan" />
      {submit.error ? <ErrorText>{errorText(submit.error)}</ErrorText> : null}
      {result ? (
        <View style={[s.item, { gap: space.sm }]} testID="submitted">
          <Text style={s.text}>Submitted as attempt {result.attempt}. Your instructor has been told.</Text>
          {result.checkResult ? <CheckResultView result={result.checkResult} title="The meter check" testID="server-check" /> : null}
        </View>
      ) : null}
      <Attempts list={own} title="Your attempts" />
      <Attempts list={shared} title="Shared with the class" />
    </Card>
  );
}

function Attempts({ list, title }: { list: SubmissionSummary[]; title: string }) {
  if (!list.length) return null;
  return (
    <View style={{ gap: space.sm }}>
      <Text style={s.label}>{title}</Text>
      {list.map((x) => (
        <CardLink key={x.id} href={`/submissions/${x.id}`} testID="attempt">
          <View style={s.row}>
            <Text style={s.text}>{title === 'Your attempts' ? `Attempt ${x.attempt}` : `${x.student.name}, attempt ${x.attempt}`}</Text>
            {x.passed !== null ? <Pill label={x.passed ? 'Passes' : 'Not yet'} tone={x.passed ? 'ok' : 'bad'} /> : null}
            <Pill label={x.status === 'reviewed' ? 'Reviewed' : 'Waiting for review'} tone={x.status === 'reviewed' ? 'accent' : 'dim'} />
            {x.commentCount ? <Text style={s.dim}>{count(x.commentCount, 'comment')}</Text> : null}
          </View>
          <Text style={s.dim}>{formatDateTime(x.submittedAt)}</Text>
        </CardLink>
      ))}
    </View>
  );
}

/** Instructors: each student's latest attempt first, with how many they made. */
function Submissions({ a }: { a: AssignmentDetail }) {
  const { width } = useWindowDimensions();
  const list = useSubmissions(a.id);
  const byStudent = useMemo(() => {
    const m = new Map<string, SubmissionSummary[]>();
    for (const x of list.data ?? []) m.set(x.student.id, [...(m.get(x.student.id) ?? []), x]);
    return [...m.values()].map((xs) => ({ latest: xs.reduce((p, q) => (q.attempt > p.attempt ? q : p)), count: xs.length }));
  }, [list.data]);
  return (
    <Card style={{ gap: space.sm }}>
      <Heading>Submissions</Heading>
      <Text style={s.dim}>
        {count(a.submittedCount ?? 0, 'student')} submitted · {a.reviewedCount ?? 0} reviewed
      </Text>
      {byStudent.length === 0 ? <Text style={s.dim}>Nothing submitted yet. You get an e-mail when a student submits.</Text> : null}
      {byStudent.map(({ latest, count }) => (
        <CardLink key={latest.id} href={`/submissions/${latest.id}`} testID="submission-row">
          <View style={[s.row, width < TABLET_MIN ? null : { justifyContent: 'space-between' }]}>
            <Text style={s.heading}>{latest.student.name}</Text>
            <View style={s.row}>
              {latest.passed !== null ? <Pill label={latest.passed ? 'Passes' : 'Not yet'} tone={latest.passed ? 'ok' : 'bad'} /> : null}
              <Pill label={latest.status === 'reviewed' ? 'Reviewed' : 'To review'} tone={latest.status === 'reviewed' ? 'dim' : 'accent'} />
            </View>
          </View>
          <Text style={s.dim}>
            attempt {latest.attempt}
            {count > 1 ? ` (of ${count} shown)` : ''} · {formatDateTime(latest.submittedAt)}
            {latest.shared ? ' · shared with the class' : ''}
          </Text>
        </CardLink>
      ))}
    </Card>
  );
}
