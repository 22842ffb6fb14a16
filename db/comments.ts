// Comments on a setup, oldest first (a conversation), with their authors' names in the same query; threads
// (a start and its replies), pins, resolving; and each person's last read, for the library's unread count
// and the e-mail digest (server/mail/commentNotices.ts).
import { aliasedTable, and, asc, eq, gt, isNull, ne, sql, type Placeholder } from 'drizzle-orm';
import type { SetupComment } from '../model/api';
import type { Db } from './client';
import { setupComments, setupReads, studioMembers, setups, user } from './schema';

/** The pool or a transaction on it. */
type DbOrTx = Db | Parameters<Parameters<Db['transaction']>[0]>[0];

type Row = {
  id: string;
  body: string;
  itemId: string | null;
  xM: number | null;
  yM: number | null;
  parentId: string | null;
  resolvedAt: Date | null;
  resolvedById: string | null;
  resolvedByName: string | null;
  createdAt: Date;
  authorId: string | null;
  authorName: string | null;
};
const out = (r: Row): SetupComment => ({
  id: r.id,
  body: r.body,
  itemId: r.itemId,
  point: r.xM !== null && r.yM !== null ? { x: r.xM, y: r.yM } : null,
  parentId: r.parentId,
  resolvedAt: r.resolvedAt?.toISOString() ?? null,
  resolvedBy: r.resolvedById ? { id: r.resolvedById, name: r.resolvedByName ?? '' } : null,
  createdAt: r.createdAt.toISOString(),
  author: r.authorId ? { id: r.authorId, name: r.authorName ?? '' } : null,
});

const resolver = aliasedTable(user, 'resolver');
const columns = {
  id: setupComments.id,
  body: setupComments.body,
  itemId: setupComments.itemId,
  xM: setupComments.xM,
  yM: setupComments.yM,
  parentId: setupComments.parentId,
  resolvedAt: setupComments.resolvedAt,
  resolvedById: setupComments.resolvedBy,
  resolvedByName: resolver.name,
  createdAt: setupComments.createdAt,
  authorId: setupComments.authorId,
  authorName: user.name,
};

/** A setup's comments; a long thread is capped at its first `limit` (the UI pages later if ever needed). */
export async function listComments(db: Db, setupId: string, limit = 500): Promise<SetupComment[]> {
  const rows = await db
    .select(columns)
    .from(setupComments)
    .leftJoin(user, eq(user.id, setupComments.authorId))
    .leftJoin(resolver, eq(resolver.id, setupComments.resolvedBy))
    .where(eq(setupComments.setupId, setupId))
    .orderBy(asc(setupComments.createdAt), asc(setupComments.id))
    .limit(limit);
  return rows.map(out);
}

/** One comment of the setup, or null. */
export async function getComment(db: Db, setupId: string, commentId: string): Promise<SetupComment | null> {
  const [row] = await db
    .select(columns)
    .from(setupComments)
    .leftJoin(user, eq(user.id, setupComments.authorId))
    .leftJoin(resolver, eq(resolver.id, setupComments.resolvedBy))
    .where(and(eq(setupComments.setupId, setupId), eq(setupComments.id, commentId)));
  return row ? out(row) : null;
}

export async function addComment(
  db: DbOrTx,
  v: { setupId: string; author: { id: string; name: string }; body: string; itemId?: string; point?: { x: number; y: number }; parentId?: string },
): Promise<SetupComment> {
  const [row] = await db
    .insert(setupComments)
    .values({ setupId: v.setupId, authorId: v.author.id, body: v.body, itemId: v.itemId ?? null, xM: v.point?.x ?? null, yM: v.point?.y ?? null, parentId: v.parentId ?? null })
    .returning();
  const r = row!;
  // The author has read their own comment.
  await markRead(db, v.author.id, v.setupId, r.createdAt);
  return out({ ...r, resolvedById: null, resolvedByName: null, authorId: v.author.id, authorName: v.author.name });
}

/** Resolve (or reopen) the thread started by `commentId`; null when there is no such thread start. */
export async function setResolved(db: Db, setupId: string, commentId: string, by: string, resolved: boolean): Promise<SetupComment | null> {
  const r = await db
    .update(setupComments)
    .set(resolved ? { resolvedAt: sql`now()`, resolvedBy: by } : { resolvedAt: null, resolvedBy: null })
    .where(and(eq(setupComments.setupId, setupId), eq(setupComments.id, commentId), isNull(setupComments.parentId)))
    .returning({ id: setupComments.id });
  return r.length ? getComment(db, setupId, commentId) : null;
}

/** When `userId` last read the setup's comments, or null. */
export async function lastReadAt(db: Db, userId: string, setupId: string): Promise<Date | null> {
  const [row] = await db.select({ at: setupReads.lastReadAt }).from(setupReads).where(and(eq(setupReads.userId, userId), eq(setupReads.setupId, setupId)));
  return row?.at ?? null;
}

/** Note that `userId` has read the setup's comments up to `at` (now by default); never moves backwards. */
export async function markRead(db: DbOrTx, userId: string, setupId: string, at?: Date): Promise<void> {
  const when = at ? sql`${at.toISOString()}::timestamptz` : sql`now()`;
  await db
    .insert(setupReads)
    .values({ userId, setupId, lastReadAt: sql`${when}` })
    .onConflictDoUpdate({ target: [setupReads.userId, setupReads.setupId], set: { lastReadAt: sql`greatest(${setupReads.lastReadAt}, excluded.last_read_at)` } });
}

/** SQL for the number of comments by others on `setupIdCol`'s setup since `userId` last read it (a list column). */
export function unreadCountSql(userId: string | Placeholder, setupIdCol: typeof setups.id) {
  return sql<number>`(select count(*)::int from ${setupComments} c
    left join ${setupReads} r on r.setup_id = c.setup_id and r.user_id = ${userId}
    where c.setup_id = ${setupIdCol} and c.author_id is distinct from ${userId}
      and (r.last_read_at is null or c.created_at > r.last_read_at))`;
}

export type DigestRecipient = { userId: string; email: string; name: string; comments: { author: string; body: string; at: Date }[] };

/**
 * Who should hear about new comments on a setup now: its studio's owners and editors (not crew) with comments
 * by others that they have neither read nor been told about, and who were last told at least `gapMs` ago.
 */
export async function digestRecipients(db: Db, setupId: string, gapMs: number): Promise<DigestRecipient[]> {
  const editors = await db
    .select({ userId: user.id, email: user.email, name: user.name, lastReadAt: setupReads.lastReadAt, notifiedAt: setupReads.notifiedAt })
    .from(setups)
    .innerJoin(studioMembers, eq(studioMembers.studioId, setups.studioId))
    .innerJoin(user, eq(user.id, studioMembers.userId))
    .leftJoin(setupReads, and(eq(setupReads.setupId, setups.id), eq(setupReads.userId, user.id)))
    .where(and(eq(setups.id, setupId), isNull(setups.deletedAt), sql`${studioMembers.role} in ('owner', 'editor')`));
  const now = Date.now();
  const out: DigestRecipient[] = [];
  for (const e of editors) {
    if (e.notifiedAt && now - e.notifiedAt.getTime() < gapMs) continue;
    const since = [e.lastReadAt, e.notifiedAt].filter((d): d is Date => !!d).sort((a, b) => b.getTime() - a.getTime())[0];
    const rows = await db
      .select({ author: user.name, body: setupComments.body, at: setupComments.createdAt })
      .from(setupComments)
      .leftJoin(user, eq(user.id, setupComments.authorId))
      .where(and(eq(setupComments.setupId, setupId), ne(sql`coalesce(${setupComments.authorId}, '')`, e.userId), since ? gt(setupComments.createdAt, since) : undefined))
      .orderBy(asc(setupComments.createdAt))
      .limit(50);
    if (rows.length) out.push({ userId: e.userId, email: e.email, name: e.name, comments: rows.map((r) => ({ author: r.author ?? 'Someone', body: r.body, at: r.at })) });
  }
  return out;
}

/**
 * Claim the right to e-mail `userId` about the setup's comments now: notes the time and answers true only when
 * they were not e-mailed about it within `gapMs` (so two processes, or a retried job, never both send). Run in
 * the transaction that queues the e-mail, so the claim and the message stand or fall together.
 */
export async function claimNotice(db: DbOrTx, userId: string, setupId: string, gapMs: number): Promise<boolean> {
  const rows = await db
    .insert(setupReads)
    .values({ userId, setupId, notifiedAt: sql`now()` })
    .onConflictDoUpdate({
      target: [setupReads.userId, setupReads.setupId],
      set: { notifiedAt: sql`now()` },
      setWhere: sql`${setupReads.notifiedAt} is null or ${setupReads.notifiedAt} <= now() - ${gapMs}::double precision * interval '1 millisecond'`,
    })
    .returning({ userId: setupReads.userId });
  return rows.length === 1;
}

/** A live setup's title, or null. */
export async function getSetupTitle(db: Db, setupId: string): Promise<string | null> {
  const [row] = await db.select({ title: setups.title }).from(setups).where(and(eq(setups.id, setupId), isNull(setups.deletedAt)));
  return row?.title ?? null;
}
