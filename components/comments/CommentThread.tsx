// A setup's comments, for every studio member (crew included): threads oldest first, each optionally pinned
// to an item or a spot on the plan (numbered pins on a small read-only plan, the same pins the class review
// uses), replies under their thread, resolve / reopen, and "new" on what others wrote since the last read.
// Opening the thread marks it read, which clears the library's unread count.
import { useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import { Pressable, StyleSheet, Text, TextInput, View } from 'react-native';
import { createEditor } from '../../canvas/editor/editor';
import { colours, fonts, space } from '../../constants/theme';
import { useAddComment, useComments, useMarkCommentsRead, useResolveComment } from '../../hooks/comments';
import type { SetupComment } from '../../model/api';
import { itemName } from '../../model/kinds';
import type { SetupDocument } from '../../model/document';
import type { Units } from '../../model/units';
import { ReadOnlyPlan, type Pin, type PinTarget } from '../classes/ReadOnlyPlan';
import { Button, ErrorText } from '../ui';
import { errorText } from '../errorText';
import { formatWhen } from '../../model/format';

export type Thread = { start: SetupComment; replies: SetupComment[]; pin: number | null };

/** Group comments into threads (a start and its replies, oldest first); pinned open threads are numbered. */
function threadsOf(comments: SetupComment[]): Thread[] {
  const byId = new Map<string, Thread>();
  const out: Thread[] = [];
  for (const c of comments) {
    if (!c.parentId) {
      const t: Thread = { start: c, replies: [], pin: null };
      byId.set(c.id, t);
      out.push(t);
    }
  }
  for (const c of comments) if (c.parentId) byId.get(c.parentId)?.replies.push(c);
  let n = 0;
  for (const t of out) if (t.start.itemId || t.start.point) t.pin = ++n;
  return out;
}

function pinWords(c: Pick<SetupComment, 'itemId' | 'point'>, doc: SetupDocument): string {
  if (c.itemId) {
    const it = doc.items.find((i) => i.id === c.itemId);
    return `on ${it ? itemName(it) : 'an item no longer on the plan'}`;
  }
  return c.point ? `at ${c.point.x.toFixed(1)} m, ${c.point.y.toFixed(1)} m` : 'on the whole setup';
}

const when = (iso: string) => formatWhen(iso);

export function CommentThread({
  setupId,
  doc,
  units,
  me,
  canWrite,
  selectedItem,
  planHeight = 280,
}: {
  setupId: string;
  doc: SetupDocument;
  units: Units;
  me: { id: string; name: string };
  /** The caller may change the setup (owner, editor): they may resolve any thread, not only their own. */
  canWrite: boolean;
  /** The item selected in the editor, offered as the new comment's pin. */
  selectedItem?: { id: string; label: string } | null;
  planHeight?: number;
}) {
  const q = useComments(setupId);
  const add = useAddComment(setupId, me);
  const markRead = useMarkCommentsRead(setupId);
  const [target, setTarget] = useState<PinTarget | null>(null);
  const [body, setBody] = useState('');
  const [showResolved, setShowResolved] = useState(false);
  // What was unread when the thread opened stays marked "new" while it is open.
  const readAt = useRef<string | null | undefined>(undefined);
  if (q.data && readAt.current === undefined) readAt.current = q.data.lastReadAt;
  const newest = q.data?.comments.at(-1)?.createdAt;
  useEffect(() => {
    if (newest) markRead.mutate();
    // Mark read when the newest comment shown changes, not on every render.
  }, [newest]); // eslint-disable-line react-hooks/exhaustive-deps

  const threads = useMemo(() => threadsOf(q.data?.comments ?? []), [q.data]);
  const open = threads.filter((t) => !t.start.resolvedAt);
  const resolved = threads.filter((t) => t.start.resolvedAt);
  const pins: Pin[] = open.filter((t) => t.pin !== null).map((t) => ({ n: t.pin!, itemId: t.start.itemId, point: t.start.point }));

  // The pin plan: its own read-only store, without the light map (it only places pins), following edits lazily.
  // No meter readings are computed for it: they cost a meter run on this thread at every edit (the release of
  // every drag in the editor) and the plan showed none of them.
  const planDoc = useDeferredValue(doc);
  const store = useMemo(() => createEditor(planDoc, { readOnly: true }), [planDoc]);

  const pinned = target ? ('itemId' in target ? { itemId: target.itemId, point: null } : { itemId: null, point: target.point }) : null;
  const send = () => {
    const text = body.trim();
    if (!text) return;
    add.mutate({ body: text, ...(pinned?.itemId ? { itemId: pinned.itemId } : {}), ...(pinned?.point ? { point: pinned.point } : {}) }, { onSuccess: () => setBody('') });
    setTarget(null);
  };
  const isNew = (c: SetupComment) => c.author?.id !== me.id && (readAt.current == null || c.createdAt > readAt.current);

  return (
    <View style={st.root} testID="comments">
      <Text style={st.heading} role="heading" aria-level={2}>
        Comments{open.length ? ` (${open.length} open)` : ''}
      </Text>
      <View style={{ height: planHeight }}>
        <ReadOnlyPlan secondary store={store} readings={null} units={units} pins={pins} onPin={setTarget} testID="comment-plan" />
      </View>
      <Text style={st.dim}>Tap the plan to pin a new comment to the item or spot under your finger.</Text>

      {q.isPending ? <Text style={st.dim}>Loading comments…</Text> : null}
      {q.isError ? <ErrorText>{errorText(q.error)}</ErrorText> : null}
      {q.data && threads.length === 0 ? <Text style={st.dim}>No comments yet. Ask a question or flag a problem on the set.</Text> : null}
      {open.map((t) => (
        <ThreadView key={t.start.id} t={t} doc={doc} setupId={setupId} me={me} canWrite={canWrite} isNew={isNew} />
      ))}
      {resolved.length ? (
        <Pressable accessibilityRole="button" onPress={() => setShowResolved((v) => !v)} style={st.toggle}>
          <Text style={st.link}>
            {showResolved ? 'Hide' : 'Show'} resolved ({resolved.length})
          </Text>
        </Pressable>
      ) : null}
      {showResolved ? resolved.map((t) => <ThreadView key={t.start.id} t={t} doc={doc} setupId={setupId} me={me} canWrite={canWrite} isNew={isNew} />) : null}

      <View style={st.compose}>
        <View style={st.row}>
          <Text style={st.dim} testID="comment-pin-target">
            {pinned ? `Pinned ${pinWords(pinned, doc)}` : 'Not pinned'}
          </Text>
          {pinned ? <Button kind="quiet" label="Unpin" onPress={() => setTarget(null)} /> : null}
          {!pinned && selectedItem ? <Button kind="quiet" label={`Pin to ${selectedItem.label}`} onPress={() => setTarget({ itemId: selectedItem.id, label: selectedItem.label })} /> : null}
        </View>
        <TextInput
          accessibilityLabel="New comment"
          value={body}
          onChangeText={setBody}
          multiline
          placeholder="A question, a change, a problem on the set"
          placeholderTextColor={colours.textFaint}
          style={[st.input, { minHeight: 64 }]}
        />
        {add.error ? <ErrorText>{errorText(add.error)}</ErrorText> : null}
        <Button label="Add the comment" onPress={send} disabled={!body.trim()} busy={add.isPending} testID="add-comment" />
      </View>
    </View>
  );
}

function ThreadView({ t, doc, setupId, me, canWrite, isNew }: { t: Thread; doc: SetupDocument; setupId: string; me: { id: string; name: string }; canWrite: boolean; isNew: (c: SetupComment) => boolean }) {
  const add = useAddComment(setupId, me);
  const resolve = useResolveComment(setupId);
  const [replying, setReplying] = useState(false);
  const [reply, setReply] = useState('');
  const c = t.start;
  const canResolve = canWrite || c.author?.id === me.id;
  const draft = c.id.startsWith('draft-');
  const sendReply = () => {
    const text = reply.trim();
    if (!text) return;
    add.mutate({ body: text, parentId: c.id }, { onSuccess: () => { setReply(''); setReplying(false); } });
  };
  return (
    <View style={[st.thread, c.resolvedAt ? { opacity: 0.7 } : null]} testID="comment-thread" accessibilityLabel={`Comment by ${c.author?.name ?? 'someone'} ${pinWords(c, doc)}`}>
      <Text style={st.meta}>
        {t.pin !== null && !c.resolvedAt ? <Text style={st.pinNo}>{t.pin} · </Text> : null}
        {c.author?.name ?? 'Someone'} · {pinWords(c, doc)} · {when(c.createdAt)}
        {isNew(c) ? <Text style={st.newTag}> · new</Text> : null}
      </Text>
      <Text style={st.body}>{c.body}</Text>
      {t.replies.map((r) => (
        <View key={r.id} style={st.reply} testID="comment-reply">
          <Text style={st.meta}>
            {r.author?.name ?? 'Someone'} · {when(r.createdAt)}
            {isNew(r) ? <Text style={st.newTag}> · new</Text> : null}
          </Text>
          <Text style={st.body}>{r.body}</Text>
        </View>
      ))}
      {c.resolvedAt ? <Text style={st.dim}>Resolved by {c.resolvedBy?.name ?? 'someone'} · {when(c.resolvedAt)}</Text> : null}
      {replying ? (
        <View style={{ gap: space.xs }}>
          <TextInput accessibilityLabel="Your reply" value={reply} onChangeText={setReply} multiline placeholder="Reply" placeholderTextColor={colours.textFaint} style={[st.input, { minHeight: 44 }]} autoFocus />
          {add.error ? <ErrorText>{errorText(add.error)}</ErrorText> : null}
          <View style={st.row}>
            <Button label="Send the reply" onPress={sendReply} disabled={!reply.trim()} busy={add.isPending} />
            <Button kind="quiet" label="Cancel" onPress={() => setReplying(false)} />
          </View>
        </View>
      ) : !draft ? (
        <View style={st.row}>
          <Button kind="quiet" label="Reply" onPress={() => setReplying(true)} />
          {canResolve ? <Button kind="quiet" label={c.resolvedAt ? 'Reopen' : 'Resolve'} onPress={() => resolve.mutate({ id: c.id, resolved: !c.resolvedAt })} busy={resolve.isPending} /> : null}
        </View>
      ) : null}
      {resolve.error ? <ErrorText>{errorText(resolve.error)}</ErrorText> : null}
    </View>
  );
}

const st = StyleSheet.create({
  root: { padding: space.lg, gap: space.sm },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 16 },
  dim: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 13, lineHeight: 18 },
  meta: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 12 },
  pinNo: { color: colours.accent, fontFamily: fonts.monoMedium },
  newTag: { color: colours.cool, fontFamily: fonts.sansMedium },
  body: { color: colours.text, fontFamily: fonts.sans, fontSize: 15, lineHeight: 21 },
  thread: { borderTopWidth: 1, borderTopColor: colours.line, paddingTop: space.sm, gap: 4 },
  reply: { marginLeft: space.lg, paddingLeft: space.sm, borderLeftWidth: 2, borderLeftColor: colours.line, gap: 2 },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  toggle: { paddingVertical: space.sm },
  link: { color: colours.accent, fontFamily: fonts.sansMedium, fontSize: 14 },
  compose: { borderTopWidth: 1, borderTopColor: colours.line, paddingTop: space.sm, gap: space.sm },
  input: { color: colours.text, fontFamily: fonts.sans, fontSize: 15, backgroundColor: colours.graphite, borderWidth: 1, borderColor: colours.line, borderRadius: 10, paddingHorizontal: space.md, paddingVertical: space.sm, textAlignVertical: 'top' },
});
