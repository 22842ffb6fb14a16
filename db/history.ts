// A setup's history: every distinct saved state (see setupVersions in db/schema/setups.ts).
import { and, desc, eq, isNull, lt, sql } from 'drizzle-orm';
import type { HistoryEntry, HistoryVersion, SetupSaved } from '../model/api';
import { parseDocument } from '../model/document';
import type { Db } from './client';
import { setups, setupVersions, user } from './schema';
import { recordVersion, savedColumns } from './setups';

const entryColumns = {
  id: setupVersions.id,
  version: setupVersions.version,
  title: setupVersions.title,
  itemCount: setupVersions.itemCount,
  savedAt: setupVersions.savedAt,
  savedById: setupVersions.savedBy,
  savedByName: user.name,
};
type EntryRow = { id: string; version: number; title: string; itemCount: number; savedAt: Date; savedById: string | null; savedByName: string | null };
const entryOut = ({ savedById, savedByName, ...r }: EntryRow): HistoryEntry => ({
  ...r,
  savedAt: r.savedAt.toISOString(),
  savedBy: savedById ? { id: savedById, name: savedByName ?? '' } : null,
});

/** Newest first, one page (versions below `before`). One query. */
export async function listHistory(db: Db, setupId: string, o: { before?: number; limit: number }): Promise<{ versions: HistoryEntry[]; nextBefore: number | null }> {
  const rows = await db
    .select(entryColumns)
    .from(setupVersions)
    .leftJoin(user, eq(user.id, setupVersions.savedBy))
    .where(and(eq(setupVersions.setupId, setupId), o.before ? lt(setupVersions.version, o.before) : undefined))
    .orderBy(desc(setupVersions.version))
    .limit(o.limit + 1);
  const page = rows.slice(0, o.limit);
  return { versions: page.map(entryOut), nextBefore: rows.length > o.limit ? page[page.length - 1]!.version : null };
}

export async function getVersion(db: Db, setupId: string, versionId: string): Promise<HistoryVersion | null> {
  const [row] = await db
    .select({ ...entryColumns, notes: setupVersions.notes, tags: setupVersions.tags, document: setupVersions.document })
    .from(setupVersions)
    .leftJoin(user, eq(user.id, setupVersions.savedBy))
    .where(and(eq(setupVersions.setupId, setupId), eq(setupVersions.id, versionId)));
  if (!row) return null;
  const { notes, tags, document, ...entry } = row;
  return { ...entryOut(entry), notes, tags, document: parseDocument(document) };
}

/**
 * Make an earlier version the current state again, as a new version (nothing in between is lost). With
 * `fromVersion`, only while that is still the stored version. Null when nothing was restored.
 */
export async function restoreVersion(db: Db, setupId: string, versionId: string, userId: string, fromVersion?: number): Promise<SetupSaved | null> {
  return db.transaction(async (tx) => {
    const r = await tx.execute<Record<string, unknown>>(sql`
      update ${setups} s set
        title = v.title, notes = v.notes, tags = v.tags, document = v.document, schema_version = v.schema_version,
        item_count = v.item_count, version = s.version + 1, updated_at = now()
      from ${setupVersions} v
      where s.id = ${setupId} and v.id = ${versionId} and v.setup_id = s.id and s.deleted_at is null
        ${fromVersion !== undefined ? sql`and s.version = ${fromVersion}` : sql``}
      returning s.id`);
    if (!r.rows.length) return null;
    await recordVersion(tx, setupId, userId);
    const [row] = await tx
      .select(savedColumns)
      .from(setups)
      .where(and(eq(setups.id, setupId), isNull(setups.deletedAt)));
    return { ...row!, createdAt: row!.createdAt.toISOString(), updatedAt: row!.updatedAt.toISOString() };
  });
}

/**
 * The explicit pruning policy (no save ever prunes): keep each setup's newest `keepLatest` versions (at least
 * one, so the current state stays recorded) and everything saved in the last `keepDays` days; delete the rest.
 * Returns how many rows went. Meant for an operator's job, one setup or all.
 */
export async function pruneHistory(db: Db, policy: { keepLatest: number; keepDays: number; setupId?: string }): Promise<number> {
  const keepLatest = Math.max(1, Math.floor(policy.keepLatest));
  const r = await db.execute(sql`
    delete from ${setupVersions} where id in (
      select id from (
        select id, saved_at, row_number() over (partition by setup_id order by version desc) as rank
        from ${setupVersions} ${policy.setupId ? sql`where setup_id = ${policy.setupId}` : sql``}
      ) ranked
      where ranked.rank > ${keepLatest} and ranked.saved_at < now() - make_interval(days => ${Math.max(0, policy.keepDays)})
    )`);
  return r.rowCount ?? 0;
}
