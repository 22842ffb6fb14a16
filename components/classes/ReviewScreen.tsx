// Reviewing a submission: the student's plan beside the reference (both read-only, each with its meter),
// the meter check as the server computed it at submission, comments pinned to an item or a spot on the
// plan, and (instructors) marking it reviewed or sharing it with the class. The student sees the same page.
import { useMemo, useState } from 'react';
import { Text, TextInput, View, useWindowDimensions } from 'react-native';
import { WIDE_MIN, colours, space } from '../../constants/theme';
import { useCommentOnSubmission, useReviewSubmission, useSubmission } from '../../hooks/classes';
import { useMe } from '../../hooks/me';
import type { SubmissionComment, SubmissionDetail } from '../../model/api';
import { itemName } from '../../model/classes';
import type { SetupDocument } from '../../model/document';
import type { Units } from '../../model/units';
import { Segmented } from '../Chips';
import { FramePair } from '../frame/FramePair';
import { MeterPanel } from '../editor/MeterPanel';
import { Loading } from '../Loading';
import { Button, Card, ErrorText, Title } from '../ui';
import { CheckResultView } from './Check';
import { BigMeter } from './LessonPlayer';
import { Back, Heading, NotFound, Page, Pill, errorText, s } from './parts';
import { ReadOnlyPlan, usePlanAtStep, useSelectedLight, type Pin, type PinTarget } from './ReadOnlyPlan';
import { formatDateTime } from '../../model/format';

export function ReviewScreen({ submissionId }: { submissionId: string }) {
  const me = useMe();
  const { width } = useWindowDimensions();
  const sub = useSubmission(submissionId);
  const [tab, setTab] = useState<'theirs' | 'reference'>('theirs');
  const [target, setTarget] = useState<PinTarget | null>(null);
  if (sub.isError) return <NotFound what="Submission" back={<Back href="/classes" label="Classes" />} />;
  if (!sub.data || !me.data) return <Loading />;
  const d = sub.data;
  const units = me.data.user.units;
  const wide = width >= WIDE_MIN;
  const pins: Pin[] = d.comments.map((c, k) => ({ n: k + 1, itemId: c.itemId, point: c.point })).filter((p) => p.itemId || p.point);
  const mine = d.student.id === me.data.user.id;

  const theirs = <PlanWithMeter title={mine ? 'Your plan' : `${d.student.name}’s plan`} doc={d.document} units={units} pins={pins} onPin={d.canComment ? setTarget : undefined} testID="submission-plan" />;
  const reference = d.reference ? <PlanWithMeter title={`Reference: ${d.reference.title}`} doc={d.reference.document} units={units} testID="reference-plan" /> : <Text style={s.dim}>This assignment has no reference plan.</Text>;

  return (
    <Page wide>
      <Back href={`/assignments/${d.assignmentId}`} label={d.assignmentTitle} />
      <Title page={`${mine ? 'Your plan' : d.student.name}, attempt ${d.attempt}`}>
        {mine ? 'Your plan' : d.student.name}, attempt {d.attempt}
      </Title>
      <View style={s.row}>
        {d.passed !== null ? <Pill label={d.passed ? 'Passes the meter check' : 'Does not pass the meter check'} tone={d.passed ? 'ok' : 'bad'} /> : null}
        <Pill label={d.status === 'reviewed' ? 'Reviewed' : 'Waiting for review'} tone={d.status === 'reviewed' ? 'accent' : 'dim'} testID="review-state" />
        {d.shared ? <Pill label="Shared with the class" /> : null}
        <Text style={s.dim}>submitted {formatDateTime(d.submittedAt)}</Text>
      </View>
      {d.canReview ? <ReviewActions d={d} /> : null}
      {d.checkResult ? (
        <Card>
          <CheckResultView result={d.checkResult} title="Meter check at submission" testID="review-check" />
        </Card>
      ) : null}
      {d.reference ? (
        <Card style={{ gap: space.sm, padding: space.md }}>
          <Heading>The frames side by side</Heading>
          <FramePair
            left={{ title: mine ? 'Your plan' : `${d.student.name}’s plan`, doc: d.document }}
            right={{ title: `Reference: ${d.reference.title}`, doc: d.reference.document }}
            width={Math.min(wide ? 860 : width - 2 * space.md, 1200) - 2 * space.md}
            testID="review-frames"
          />
        </Card>
      ) : null}
      {wide ? (
        <View style={{ flexDirection: 'row', gap: space.md, alignItems: 'flex-start' }}>
          <View style={{ flex: 1 }}>{theirs}</View>
          <View style={{ flex: 1 }}>{reference}</View>
        </View>
      ) : (
        <>
          <Segmented
            label="Which plan"
            value={tab}
            onChange={setTab}
            options={[
              { value: 'theirs', label: mine ? 'Your plan' : 'Their plan' },
              { value: 'reference', label: 'Reference' },
            ]}
          />
          {tab === 'theirs' ? theirs : reference}
        </>
      )}
      <Comments d={d} target={target} clearTarget={() => setTarget(null)} me={me.data.user} />
    </Page>
  );
}

function PlanWithMeter({ title, doc, units, pins, onPin, testID }: { title: string; doc: SetupDocument; units: Units; pins?: Pin[]; onPin?: (t: PinTarget) => void; testID: string }) {
  const { store, readings } = usePlanAtStep(doc, undefined);
  const selectedLight = useSelectedLight(store);
  return (
    <Card style={{ gap: space.sm, padding: space.md }}>
      <Heading>{title}</Heading>
      <View style={{ height: 380 }}>
        <ReadOnlyPlan store={store} readings={readings} units={units} pins={pins} onPin={onPin} testID={testID} />
      </View>
      {onPin ? <Text style={s.dim}>Tap the plan to pin your comment to the item or spot under it.</Text> : null}
      <BigMeter readings={readings} compact />
      <MeterPanel readings={readings} doc={doc} selectedLight={selectedLight} units={units} />
    </Card>
  );
}

function ReviewActions({ d }: { d: SubmissionDetail }) {
  const review = useReviewSubmission({ id: d.id, assignmentId: d.assignmentId });
  return (
    <View style={s.row}>
      {d.status === 'reviewed' ? (
        <Button kind="quiet" label="Mark as not reviewed" onPress={() => review.mutate({ reviewed: false })} busy={review.isPending} />
      ) : (
        <Button label="Mark reviewed" onPress={() => review.mutate({ reviewed: true })} busy={review.isPending} testID="mark-reviewed" />
      )}
      <Button kind="quiet" label={d.shared ? 'Stop sharing with the class' : 'Share with the class'} onPress={() => review.mutate({ shared: !d.shared })} />
      {review.error ? <ErrorText>{errorText(review.error)}</ErrorText> : null}
    </View>
  );
}

function pinWords(c: Pick<SubmissionComment, 'itemId' | 'point'>, doc: SetupDocument): string {
  if (c.itemId) {
    const it = doc.items.find((i) => i.id === c.itemId);
    return `on ${it ? itemName(it) : c.itemId}`;
  }
  return c.point ? `at ${c.point.x.toFixed(1)} m, ${c.point.y.toFixed(1)} m` : 'on the whole plan';
}

function Comments({ d, target, clearTarget, me }: { d: SubmissionDetail; target: PinTarget | null; clearTarget: () => void; me: { id: string; name: string } }) {
  const add = useCommentOnSubmission(d.id, me);
  const [body, setBody] = useState('');
  const pinned = useMemo(() => (target ? ('itemId' in target ? { itemId: target.itemId, point: null } : { itemId: null, point: target.point }) : null), [target]);
  const send = () => {
    if (!body.trim()) return;
    add.mutate({ body: body.trim(), ...(pinned?.itemId ? { itemId: pinned.itemId } : {}), ...(pinned?.point ? { point: pinned.point } : {}) }, { onSuccess: () => setBody('') });
    clearTarget();
  };
  return (
    <Card style={{ gap: space.sm }}>
      <Heading>Comments</Heading>
      {d.comments.length === 0 ? <Text style={s.dim}>No comments yet.</Text> : null}
      {d.comments.map((c, k) => (
        <View key={c.id} style={s.item} testID="review-comment">
          <Text style={s.dim}>
            <Text style={{ color: colours.accent }}>{c.itemId || c.point ? `${k + 1} · ` : ''}</Text>
            {c.author?.name ?? 'Someone'} · {pinWords(c, d.document)} · {formatDateTime(c.createdAt)}
          </Text>
          <Text style={s.text}>{c.body}</Text>
        </View>
      ))}
      {d.canComment ? (
        <View style={[s.item, { gap: space.sm }]}>
          <View style={s.row}>
            <Text style={s.dim} testID="pin-target">
              {pinned ? `Pinned ${pinWords(pinned, d.document)}` : 'Not pinned: tap the plan to pin it to an item or a spot'}
            </Text>
            {pinned ? <Button kind="quiet" label="Unpin" onPress={clearTarget} /> : null}
          </View>
          <TextInput
            accessibilityLabel="Your comment"
            value={body}
            onChangeText={setBody}
            multiline
            placeholder="What to change, and why"
            placeholderTextColor={colours.textFaint}
            style={[s.input, { minHeight: 72, textAlignVertical: 'top' }]}
          />
          {add.error ? <ErrorText>{errorText(add.error)}</ErrorText> : null}
          <Button label="Add the comment" onPress={send} disabled={!body.trim()} busy={add.isPending} testID="add-comment" />
        </View>
      ) : null}
    </Card>
  );
}
