// Comments on a setup, oldest first (a conversation), with their authors' names in the same query.
import { asc, eq } from 'drizzle-orm';
import type { SetupComment } from '../model/api';
import type { Db } from './client';
import { setupComments, user } from './schema';

type Row = { id: string; body: string; itemId: string | null; createdAt: Date; authorId: string | null; authorName: string | null };
const out = ({ authorId, authorName, ...r }: Row): SetupComment => ({
  ...r,
  createdAt: r.createdAt.toISOString(),
  author: authorId ? { id: authorId, name: authorName ?? '' } : null,
});

/** A setup's comments; a long thread is capped at its first `limit` (the UI pages later if ever needed). */
export async function listComments(db: Db, setupId: string, limit = 500): Promise<SetupComment[]> {
  const rows = await db
    .select({
      id: setupComments.id,
      body: setupComments.body,
      itemId: setupComments.itemId,
      createdAt: setupComments.createdAt,
      authorId: setupComments.authorId,
      authorName: user.name,
    })
    .from(setupComments)
    .leftJoin(user, eq(user.id, setupComments.authorId))
    .where(eq(setupComments.setupId, setupId))
    .orderBy(asc(setupComments.createdAt), asc(setupComments.id))
    .limit(limit);
  return rows.map(out);
}

export async function addComment(db: Db, v: { setupId: string; author: { id: string; name: string }; body: string; itemId?: string }): Promise<SetupComment> {
  const [row] = await db
    .insert(setupComments)
    .values({ setupId: v.setupId, authorId: v.author.id, body: v.body, itemId: v.itemId ?? null })
    .returning();
  return out({ id: row!.id, body: row!.body, itemId: row!.itemId, createdAt: row!.createdAt, authorId: v.author.id, authorName: v.author.name });
}
