// Setup queries. Callers (server/routes) have already checked the caller's role.
import { and, desc, eq, ilike, isNull, lt, or, sql, inArray, arrayContains } from 'drizzle-orm';
import type { SetupSummary } from '../model/api';
import type { SetupDocument } from '../model/document';
import type { Db } from './client';
import { setups, studioMembers, studios } from './schema';

export type SetupRow = typeof setups.$inferSelect;

type Cursor = { updatedAt: string; id: string };
export function encodeCursor(c: Cursor): string {
  return Buffer.from(`${c.updatedAt}|${c.id}`).toString('base64url');
}
export function decodeCursor(s: string): Cursor | null {
  const [updatedAt, id] = Buffer.from(s, 'base64url').toString('utf8').split('|');
  if (!updatedAt || !id || Number.isNaN(Date.parse(updatedAt)) || !/^[0-9a-f-]{36}$/.test(id)) return null;
  return { updatedAt, id };
}

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (m) => `\\${m}`);

/** The setups a user may read (member of the studio), newest first, one page. One query. */
export async function listSetups(
  db: Db,
  userId: string,
  q: { studio?: string; q?: string; tag?: string; cursor?: Cursor | null; limit: number },
): Promise<{ setups: SetupSummary[]; nextCursor: string | null }> {
  const memberOf = db.select({ id: studioMembers.studioId }).from(studioMembers).where(eq(studioMembers.userId, userId));
  const conds = [isNull(setups.deletedAt), inArray(setups.studioId, memberOf)];
  if (q.studio) conds.push(eq(setups.studioId, q.studio));
  if (q.q) {
    const pat = `%${escapeLike(q.q)}%`;
    conds.push(or(ilike(setups.title, pat), ilike(setups.notes, pat))!);
  }
  if (q.tag) conds.push(arrayContains(setups.tags, [q.tag]));
  if (q.cursor) {
    const at = new Date(q.cursor.updatedAt);
    conds.push(or(lt(setups.updatedAt, at), and(eq(setups.updatedAt, at), lt(setups.id, q.cursor.id)))!);
  }
  const rows = await db
    .select({
      id: setups.id,
      studioId: setups.studioId,
      studioName: studios.name,
      title: setups.title,
      tags: setups.tags,
      version: setups.version,
      isTemplate: setups.isTemplate,
      itemCount: sql<number>`coalesce(jsonb_array_length(${setups.document}->'items'), 0)`.mapWith(Number),
      updatedAt: setups.updatedAt,
    })
    .from(setups)
    .innerJoin(studios, eq(studios.id, setups.studioId))
    .where(and(...conds))
    .orderBy(desc(setups.updatedAt), desc(setups.id))
    .limit(q.limit + 1);
  const page = rows.slice(0, q.limit);
  const last = page[page.length - 1];
  return {
    setups: page.map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() })),
    nextCursor: rows.length > q.limit && last ? encodeCursor({ updatedAt: last.updatedAt.toISOString(), id: last.id }) : null,
  };
}

export async function createSetup(
  db: Db,
  v: { studioId: string; ownerId: string; title: string; document: SetupDocument; notes?: string; tags?: string[]; isTemplate?: boolean },
): Promise<SetupRow> {
  const [row] = await db
    .insert(setups)
    .values({
      studioId: v.studioId,
      ownerId: v.ownerId,
      title: v.title,
      notes: v.notes ?? '',
      tags: v.tags ?? [],
      document: v.document,
      schemaVersion: v.document.schemaVersion,
      isTemplate: v.isTemplate ?? false,
    })
    .returning();
  return row!;
}

/** A setup (not deleted) with the caller's role in its studio (null when not a member). One query. */
export async function getSetupWithRole(db: Db, id: string, userId: string) {
  const [row] = await db
    .select({ setup: setups, role: studioMembers.role })
    .from(setups)
    .leftJoin(studioMembers, and(eq(studioMembers.studioId, setups.studioId), eq(studioMembers.userId, userId)))
    .where(and(eq(setups.id, id), isNull(setups.deletedAt)));
  return row ?? null;
}
