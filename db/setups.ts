// Setup queries. Callers (server/routes) have already checked the caller's role. Every list is one query.
import { isDeepStrictEqual } from 'node:util';
import { and, arrayContains, asc, desc, eq, gt, ilike, inArray, isNotNull, isNull, or, sql, type Placeholder, type SQL } from 'drizzle-orm';
import type { SetupDetail, SetupSaved, SetupSort, SetupSummary, TagCount } from '../model/api';
import { CURRENT_SCHEMA_VERSION, parseDocument, type SetupDocument } from '../model/document';
import type { Db } from './client';
import { unreadCountSql } from './comments';
import { setups, setupVersions, studioMembers, studios, user } from './schema';

export type SetupRow = typeof setups.$inferSelect;
type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Conn = Db | Tx;

/** A deleted setup can be restored for this many days; after that only an explicit purge removes it. */
const RESTORE_DAYS = 30;
const restoreWindow = sql`now() - make_interval(days => ${RESTORE_DAYS})`;

/**
 * The hot paths (read one setup, check access, save) run as named prepared statements: PostgreSQL plans
 * them once per connection and Drizzle builds their SQL once per process, not on every request.
 */
const preparedByDb = new WeakMap<object, Map<string, unknown>>();
function prepared<T>(db: Db, name: string, build: () => T): T {
  let m = preparedByDb.get(db);
  if (!m) preparedByDb.set(db, (m = new Map()));
  if (!m.has(name)) m.set(name, build());
  return m.get(name) as T;
}

// ---------------------------------------------------------------------------------------------
// Lists

type ListMode = 'library' | 'templates' | 'deleted';
export type ListOptions = { mode: ListMode; sort: SetupSort; studio?: string; q?: string; tag?: string; cursor?: string; limit: number };

/** A page boundary: the last row's sort key (as PostgreSQL text, so timestamps keep their microseconds) and id. */
type Cursor = { o: string; k: string; id: string };
/** timestamptz as PostgreSQL prints it, e.g. 2026-12-01 18:26:03.188123+00 */
const PG_TIMESTAMPTZ = /^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}(\.\d{1,6})?[+-]\d{2}(:\d{2}){0,2}$/;
const encodeCursor = (c: Cursor) => Buffer.from(JSON.stringify(c)).toString('base64url');
function decodeCursor(s: string, order: string): Cursor | null {
  try {
    const c = JSON.parse(Buffer.from(s, 'base64url').toString('utf8')) as Partial<Cursor>;
    if (c.o !== order || typeof c.k !== 'string' || typeof c.id !== 'string' || !/^[0-9a-f-]{36}$/.test(c.id)) return null;
    if (c.o !== 'title' && !PG_TIMESTAMPTZ.test(c.k)) return null;
    return c as Cursor;
  } catch {
    return null;
  }
}
export class BadCursor extends Error {}

const orders = {
  updated: { key: setups.updatedAt, text: sql`${setups.updatedAt}::text`, cast: 'timestamptz', dir: 'desc' },
  created: { key: setups.createdAt, text: sql`${setups.createdAt}::text`, cast: 'timestamptz', dir: 'desc' },
  title: { key: sql`lower(${setups.title})`, text: sql`lower(${setups.title})`, cast: 'text', dir: 'asc' },
  deleted: { key: setups.deletedAt, text: sql`${setups.deletedAt}::text`, cast: 'timestamptz', dir: 'desc' },
} as const;

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (m) => `\\${m}`);
const iso = (d: Date | null) => (d ? d.toISOString() : null);

/**
 * The list's query. `userId` and `limit` may be placeholders: a first page without search, tag or studio (what
 * opening the library asks for, by far the most common list) is one prepared statement per mode and order.
 */
function listQuery(db: Db, o: { mode: ListMode; orderName: keyof typeof orders; userId: string | Placeholder; limit: number | Placeholder; extra: (SQL | undefined)[] }) {
  const order = orders[o.orderName];
  const member = and(eq(studioMembers.studioId, setups.studioId), eq(studioMembers.userId, o.userId));
  const conds: (SQL | undefined)[] = [];
  // Templates: the gallery for everyone, and the caller's own studios' templates.
  if (o.mode === 'templates') conds.push(eq(setups.isTemplate, true), isNull(setups.deletedAt), or(eq(setups.forEveryone, true), isNotNull(studioMembers.role)));
  else if (o.mode === 'deleted') conds.push(isNotNull(setups.deletedAt), gt(setups.deletedAt, restoreWindow), inArray(studioMembers.role, ['owner', 'editor']));
  else conds.push(isNull(setups.deletedAt));
  conds.push(...o.extra);
  const base = db
    .select({
      id: setups.id,
      studioId: setups.studioId,
      studioName: studios.name,
      ownerName: user.name,
      title: setups.title,
      tags: setups.tags,
      version: setups.version,
      isTemplate: setups.isTemplate,
      forEveryone: setups.forEveryone,
      itemCount: setups.itemCount,
      createdAt: setups.createdAt,
      updatedAt: setups.updatedAt,
      deletedAt: setups.deletedAt,
      role: studioMembers.role,
      // Comments stay inside the studio: another studio's template shows none.
      unreadComments: sql<number>`case when ${studioMembers.role} is null then 0 else ${unreadCountSql(o.userId, setups.id)} end`,
      sortKey: sql<string>`${order.text}`,
    })
    .from(setups)
    .innerJoin(studios, eq(studios.id, setups.studioId))
    .leftJoin(user, eq(user.id, setups.ownerId));
  const joined = o.mode === 'templates' ? base.leftJoin(studioMembers, member) : base.innerJoin(studioMembers, member);
  const dir = order.dir === 'desc' ? desc : asc;
  return joined
    .where(and(...conds))
    .orderBy(dir(order.key), dir(setups.id))
    .limit(o.limit);
}

/** One page of setups for a user: their studios' setups, the templates they may use (the gallery for everyone and their studios' own), or their restorable deletions. */
export async function listSetups(db: Db, userId: string, o: ListOptions): Promise<{ setups: SetupSummary[]; nextCursor: string | null }> {
  const orderName = o.mode === 'deleted' ? 'deleted' : o.sort;
  const order = orders[orderName];
  const cursor = o.cursor ? decodeCursor(o.cursor, orderName) : null;
  if (o.cursor && !cursor) throw new BadCursor();

  const extra: (SQL | undefined)[] = [];
  if (o.studio) extra.push(eq(setups.studioId, o.studio));
  if (o.q) {
    const pat = `%${escapeLike(o.q.trim())}%`;
    extra.push(or(ilike(setups.title, pat), ilike(setups.notes, pat), arrayContains(setups.tags, [o.q.trim().toLowerCase()])));
  }
  if (o.tag) extra.push(arrayContains(setups.tags, [o.tag]));
  if (cursor) {
    const k = sql`${cursor.k}::${sql.raw(order.cast)}`;
    extra.push(order.dir === 'desc' ? sql`(${order.key}, ${setups.id}) < (${k}, ${cursor.id}::uuid)` : sql`(${order.key}, ${setups.id}) > (${k}, ${cursor.id}::uuid)`);
  }

  const rows = extra.length
    ? await listQuery(db, { mode: o.mode, orderName, userId, limit: o.limit + 1, extra })
    : await prepared(db, `list_${o.mode}_${orderName}`, () =>
        listQuery(db, { mode: o.mode, orderName, userId: sql.placeholder('userId'), limit: sql.placeholder('limit'), extra: [] }).prepare(`list_${o.mode}_${orderName}`),
      ).execute({ userId, limit: o.limit + 1 });

  const page = rows.slice(0, o.limit);
  const last = page[page.length - 1];
  return {
    setups: page.map((r) => ({
      id: r.id,
      studioId: r.studioId,
      studioName: r.studioName,
      ownerName: r.ownerName,
      title: r.title,
      tags: r.tags,
      version: r.version,
      isTemplate: r.isTemplate,
      forEveryone: r.forEveryone,
      itemCount: r.itemCount,
      createdAt: r.createdAt.toISOString(),
      updatedAt: r.updatedAt.toISOString(),
      deletedAt: iso(r.deletedAt),
      role: r.role,
      unreadComments: r.unreadComments,
      restorableUntil: r.deletedAt ? new Date(r.deletedAt.getTime() + RESTORE_DAYS * 86_400_000).toISOString() : null,
    })),
    nextCursor: rows.length > o.limit && last ? encodeCursor({ o: orderName, k: last.sortKey, id: last.id }) : null,
  };
}

/** The tags in use on the setups a user may read, most used first. One query. */
export async function tagsInUse(db: Db, userId: string, studio?: string): Promise<TagCount[]> {
  const r = await db.execute<{ tag: string; count: number }>(sql`
    select t.tag, count(*)::int as count
    from ${setups} s
    join ${studioMembers} m on m.studio_id = s.studio_id and m.user_id = ${userId}
    cross join lateral unnest(s.tags) as t(tag)
    where s.deleted_at is null ${studio ? sql`and s.studio_id = ${studio}` : sql``}
    group by t.tag order by count(*) desc, t.tag limit 60`);
  return r.rows.map((x) => ({ tag: x.tag, count: Number(x.count) }));
}

// ---------------------------------------------------------------------------------------------
// One setup

/** What a route needs to decide access, without reading the document. Deleted setups included. */
export async function getSetupAccess(db: Db, id: string, userId: string) {
  const q = prepared(db, 'setup_access', () =>
    db
      .select({ id: setups.id, studioId: setups.studioId, isTemplate: setups.isTemplate, forEveryone: setups.forEveryone, deletedAt: setups.deletedAt, version: setups.version, role: studioMembers.role })
      .from(setups)
      .leftJoin(studioMembers, and(eq(studioMembers.studioId, setups.studioId), eq(studioMembers.userId, sql.placeholder('userId'))))
      .where(eq(setups.id, sql.placeholder('id')))
      .prepare('setup_access'),
  );
  const [row] = await q.execute({ id, userId });
  return row ?? null;
}
export type SetupAccess = NonNullable<Awaited<ReturnType<typeof getSetupAccess>>>;

/**
 * A setup with its document, for the caller (their role included), and what access is decided from. The
 * document comes back as the JSON text PostgreSQL stores when it is at the current schema version, so the
 * route can send it without parsing and re-serialising it; older documents are migrated and parsed here.
 * One query.
 */
/** The columns of a setup as a save answers with it (SetupSaved, before dates become strings). */
export const savedColumns = {
  id: setups.id,
  studioId: setups.studioId,
  ownerId: setups.ownerId,
  title: setups.title,
  notes: setups.notes,
  tags: setups.tags,
  schemaVersion: setups.schemaVersion,
  version: setups.version,
  isTemplate: setups.isTemplate,
  forEveryone: setups.forEveryone,
  createdAt: setups.createdAt,
  updatedAt: setups.updatedAt,
};

export async function getSetupDetail(db: Db, id: string, userId: string) {
  const q = prepared(db, 'setup_detail', () =>
    db
      .select({
        ...savedColumns,
        studioName: studios.name,
        ownerName: user.name,
        role: studioMembers.role,
        deletedAt: setups.deletedAt,
        documentJson: sql<string>`${setups.document}::text`,
      })
      .from(setups)
      .innerJoin(studios, eq(studios.id, setups.studioId))
      .leftJoin(user, eq(user.id, setups.ownerId))
      .leftJoin(studioMembers, and(eq(studioMembers.studioId, setups.studioId), eq(studioMembers.userId, sql.placeholder('userId'))))
      .where(eq(setups.id, sql.placeholder('id')))
      .prepare('setup_detail'),
  );
  const [row] = await q.execute({ id, userId });
  if (!row) return null;
  const { documentJson, deletedAt, ...meta } = row;
  const current = meta.schemaVersion === CURRENT_SCHEMA_VERSION;
  return {
    access: { id: meta.id, studioId: meta.studioId, isTemplate: meta.isTemplate, forEveryone: meta.forEveryone, deletedAt, version: meta.version, role: meta.role } satisfies SetupAccess,
    meta: { ...meta, schemaVersion: CURRENT_SCHEMA_VERSION, createdAt: meta.createdAt.toISOString(), updatedAt: meta.updatedAt.toISOString() } satisfies Omit<SetupDetail, 'document'>,
    documentJson: current ? documentJson : JSON.stringify(parseDocument(JSON.parse(documentJson))),
  };
}

/** The detail as a plain object (tests, the 409 body). */
export async function getSetupDetailObject(db: Db, id: string, userId: string): Promise<SetupDetail | null> {
  const d = await getSetupDetail(db, id, userId);
  return d ? { ...d.meta, document: JSON.parse(d.documentJson) as SetupDocument } : null;
}

// ---------------------------------------------------------------------------------------------
// Writes

/**
 * Record the setup's current state as a history row, unless it equals the latest recorded one (a save that
 * changed nothing, or only the template flag). Runs inside the writing transaction; copies inside PostgreSQL,
 * so the document is not sent twice.
 */
export async function recordVersion(tx: Conn, setupId: string, userId: string | null) {
  await tx.execute(sql`
    insert into ${setupVersions} (setup_id, version, title, notes, tags, document, schema_version, item_count, saved_by, saved_at)
    select s.id, s.version, s.title, s.notes, s.tags, s.document, s.schema_version, s.item_count, ${userId}, s.updated_at
    from ${setups} s
    where s.id = ${setupId}
      and not exists (
        select 1 from (select * from ${setupVersions} v where v.setup_id = s.id order by v.version desc limit 1) last
        where last.document = s.document and last.title = s.title and last.notes = s.notes and last.tags = s.tags)`);
}

export async function createSetup(
  db: Conn,
  v: { studioId: string; ownerId: string; title: string; document: SetupDocument; notes?: string; tags?: string[]; isTemplate?: boolean; forEveryone?: boolean },
): Promise<SetupRow> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(setups)
      .values({
        studioId: v.studioId,
        ownerId: v.ownerId,
        title: v.title,
        notes: v.notes ?? '',
        tags: v.tags ?? [],
        document: v.document,
        schemaVersion: v.document.schemaVersion,
        itemCount: v.document.items.length,
        isTemplate: (v.isTemplate || v.forEveryone) ?? false,
        forEveryone: v.forEveryone ?? false,
      })
      .returning();
    await recordVersion(tx, row!.id, v.ownerId);
    return row!;
  });
}

export type SetupChanges = { title?: string; notes?: string; tags?: string[]; document?: SetupDocument; isTemplate?: boolean };

/**
 * Whether a save refused for its version asked for nothing new: the state recorded at `fromVersion` with these
 * changes applied is the current state (title, notes, tags and document; a template mark is never judged so).
 * Then the sender's copy, once it takes the current version, matches the server's in full and nothing of anyone's
 * is lost — e.g. the same queued change sent by two senders of one device after a reconnect. False when the
 * version's state is not recorded (history pruned) or anything differs.
 */
export async function alreadyApplied(db: Db, id: string, fromVersion: number, c: SetupChanges, current: SetupDetail): Promise<boolean> {
  if (c.isTemplate !== undefined && c.isTemplate !== current.isTemplate) return false;
  const [base] = await db
    .select({ title: setupVersions.title, notes: setupVersions.notes, tags: setupVersions.tags, document: setupVersions.document })
    .from(setupVersions)
    .where(and(eq(setupVersions.setupId, id), eq(setupVersions.version, fromVersion)));
  if (!base) return false;
  const wanted = { title: c.title ?? base.title, notes: c.notes ?? base.notes, tags: c.tags ?? base.tags, document: c.document ?? base.document };
  const now = { title: current.title, notes: current.notes, tags: current.tags, document: current.document };
  // Through JSON both sides: the stored document went through jsonb (key order, no undefined).
  return isDeepStrictEqual(JSON.parse(JSON.stringify(wanted)), JSON.parse(JSON.stringify(now)));
}

/**
 * Save changes made from version `fromVersion`, atomically, in one statement: the UPDATE matches only while
 * that version is the stored one (a concurrent save holding the row makes this one wait, then not match),
 * and the history row is inserted by the same statement, unless the new state equals the latest recorded
 * one. Returns null when nothing was saved (wrong version, deleted, missing).
 */
export async function saveSetup(db: Db, id: string, fromVersion: number, c: SetupChanges, userId: string, idempotencyKey: string | null = null): Promise<SetupSaved | null> {
  const r = await db.$client.query<SavedRow>({
    name: 'setup_save',
    text: `
      with upd as (
        update setups set
          title = coalesce($3, title),
          notes = coalesce($4, notes),
          tags = coalesce($5::text[], tags),
          is_template = coalesce($6, is_template),
          -- a setup that stops being a template leaves the gallery for everyone too (the route lets only an
          -- operator do that to a setup in the gallery)
          for_everyone = for_everyone and coalesce($6, is_template),
          document = coalesce($7::jsonb, document),
          schema_version = coalesce($8, schema_version),
          item_count = coalesce($9, item_count),
          version = version + 1,
          updated_at = now()
        where id = $1 and version = $2 and deleted_at is null
        returning *
      ), latest as (
        select v.document, v.title, v.notes, v.tags from setup_versions v where v.setup_id = $1 order by v.version desc limit 1
      ), recorded as (
        insert into setup_versions (setup_id, version, title, notes, tags, document, schema_version, item_count, saved_by, saved_at)
        select u.id, u.version, u.title, u.notes, u.tags, u.document, u.schema_version, u.item_count, $10, u.updated_at
        from upd u
        where not exists (select 1 from latest l where l.document = u.document and l.title = u.title and l.notes = u.notes and l.tags = u.tags)
      ), receipt as (
        insert into save_receipts (user_id, key, setup_id, result)
        select $10, $11, u.id, to_jsonb(u) - 'document' from upd u where $11::text is not null
        on conflict do nothing
      )
      select id, studio_id, owner_id, title, notes, tags, schema_version, version, is_template, for_everyone, created_at, updated_at from upd`,
    values: [
      id,
      fromVersion,
      c.title ?? null,
      c.notes ?? null,
      c.tags ?? null,
      c.isTemplate ?? null,
      c.document ? JSON.stringify(c.document) : null,
      c.document?.schemaVersion ?? null,
      c.document?.items.length ?? null,
      userId,
      idempotencyKey,
    ],
  });
  const row = r.rows[0];
  if (!row) return null;
  return savedOf(row);
}

/** The answer of an earlier save by `userId` with this Idempotency-Key, if it committed (within a day). */
export async function savedByKey(db: Db, userId: string, key: string, setupId: string): Promise<SetupSaved | null> {
  const r = await db.$client.query<{ result: SavedRow }>(`select result from save_receipts where user_id = $1 and key = $2 and setup_id = $3 and created_at > now() - interval '1 day'`, [userId, key, setupId]);
  return r.rows[0] ? savedOf(r.rows[0].result) : null;
}

/** Forget receipts older than a day. */
export async function pruneSaveReceipts(db: Db): Promise<void> {
  await db.$client.query(`delete from save_receipts where created_at < now() - interval '1 day'`);
}

function savedOf(row: SavedRow): SetupSaved {
  return {
    id: row.id,
    studioId: row.studio_id,
    ownerId: row.owner_id,
    title: row.title,
    notes: row.notes,
    tags: row.tags,
    schemaVersion: row.schema_version,
    version: row.version,
    isTemplate: row.is_template,
    forEveryone: row.for_everyone ?? false,
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}
type SavedRow = {
  id: string;
  studio_id: string;
  owner_id: string | null;
  title: string;
  notes: string;
  tags: string[];
  schema_version: number;
  version: number;
  is_template: boolean;
  /** Missing in receipts written before the gallery for everyone existed. */
  for_everyone?: boolean;
  created_at: Date | string;
  updated_at: Date | string;
};

/** Soft delete; false when it was not live. */
export async function softDeleteSetup(db: Db, id: string): Promise<boolean> {
  const r = await db.update(setups).set({ deletedAt: sql`now()` }).where(and(eq(setups.id, id), isNull(setups.deletedAt))).returning({ id: setups.id });
  return r.length > 0;
}

/** Undo a soft delete within the restore window; false when it is live, past the window or missing. */
export async function restoreDeletedSetup(db: Db, id: string): Promise<boolean> {
  const r = await db
    .update(setups)
    .set({ deletedAt: null })
    .where(and(eq(setups.id, id), isNotNull(setups.deletedAt), gt(setups.deletedAt, restoreWindow)))
    .returning({ id: setups.id });
  return r.length > 0;
}

/** Copy a setup (its current state, never its history or comments) into a studio, owned by the caller. */
export async function duplicateSetup(db: Db, sourceId: string, to: { studioId: string; ownerId: string; title?: string }): Promise<string | null> {
  return db.transaction(async (tx) => {
    const r = await tx.execute<{ id: string }>(sql`
      insert into ${setups} (studio_id, owner_id, title, notes, tags, document, schema_version, item_count, is_template)
      select ${to.studioId}, ${to.ownerId}, ${to.title ?? sql`left(title, 193) || ' (copy)'`}, notes, tags, document, schema_version, item_count, false
      from ${setups} where id = ${sourceId}
      returning id`);
    const id = r.rows[0]?.id;
    if (!id) return null;
    await recordVersion(tx, id, to.ownerId);
    return id;
  });
}

/**
 * Publish a template to, or withdraw it from, the gallery for everyone (the route has checked the caller is an
 * operator). Publishing makes it a template of its studio too; withdrawing leaves it one. Not a save: the
 * version and the document stay as they are. Null when the setup is not live.
 */
export async function setForEveryone(db: Db, id: string, forEveryone: boolean): Promise<{ id: string; isTemplate: boolean; forEveryone: boolean } | null> {
  const [row] = await db
    .update(setups)
    .set(forEveryone ? { forEveryone: true, isTemplate: true } : { forEveryone: false })
    .where(and(eq(setups.id, id), isNull(setups.deletedAt)))
    .returning({ id: setups.id, isTemplate: setups.isTemplate, forEveryone: setups.forEveryone });
  return row ?? null;
}
