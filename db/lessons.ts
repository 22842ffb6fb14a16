// Lessons: ordered setups (document snapshots) with the instructor's words for each setup and step.
// Callers (server/routes) have already checked the caller's role.
import { and, asc, eq, sql } from 'drizzle-orm';
import type { ClassRole, LessonDetail, LessonSetup, LessonSummary } from '../model/api';
import { parseDocument, type SetupDocument } from '../model/document';
import { listAssignments } from './assignments';
import type { Db } from './client';
import { assignments, classMembers, classes, lessonSetups, lessons, setups } from './schema';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

// The outer table is named in full: Drizzle leaves a column unqualified in a one-table select, where it would
// bind to the subquery's own table.
const setupCount = sql<number>`(select count(*)::int from ${lessonSetups} e where e.lesson_id = "lessons"."id")`.mapWith(Number);
const assignmentCount = sql<number>`(select count(*)::int from ${assignments} a where a.lesson_id = "lessons"."id")`.mapWith(Number);
const summaryColumns = {
  id: lessons.id,
  classId: lessons.classId,
  title: lessons.title,
  summary: lessons.summary,
  position: lessons.position,
  published: lessons.published,
  setupCount,
  assignmentCount,
  updatedAt: lessons.updatedAt,
};
const summaryOut = (r: Omit<LessonSummary, 'updatedAt'> & { updatedAt: Date }): LessonSummary => ({ ...r, updatedAt: r.updatedAt.toISOString() });

/** A class's lessons in order; drafts only for instructors. */
export async function listLessons(db: Db, classId: string, withDrafts: boolean): Promise<LessonSummary[]> {
  const rows = await db
    .select(summaryColumns)
    .from(lessons)
    .where(and(eq(lessons.classId, classId), withDrafts ? undefined : eq(lessons.published, true)))
    .orderBy(asc(lessons.position), asc(lessons.createdAt));
  return rows.map(summaryOut);
}

export async function createLesson(db: Db, v: { classId: string; title: string; summary?: string; createdBy: string }): Promise<LessonSummary> {
  const [row] = await db
    .insert(lessons)
    .values({
      classId: v.classId,
      title: v.title,
      summary: v.summary ?? '',
      createdBy: v.createdBy,
      position: sql`(select coalesce(max(position) + 1, 0) from ${lessons} where class_id = ${v.classId})`,
    })
    .returning();
  return summaryOut({ ...row!, setupCount: 0, assignmentCount: 0 });
}

/** What a route decides access to a lesson from: its class, whether it is published, the caller's role. */
export async function lessonAccess(db: Db, lessonId: string, userId: string) {
  const [r] = await db
    .select({ id: lessons.id, classId: lessons.classId, published: lessons.published, role: classMembers.role })
    .from(lessons)
    .leftJoin(classMembers, and(eq(classMembers.classId, lessons.classId), eq(classMembers.userId, userId)))
    .where(eq(lessons.id, lessonId));
  return r ?? null;
}
export type LessonAccess = NonNullable<Awaited<ReturnType<typeof lessonAccess>>>;

type EntryRow = typeof lessonSetups.$inferSelect;
function entryOut(r: EntryRow, currentVersion: number | null): LessonSetup {
  return {
    id: r.id,
    position: r.position,
    setupId: r.setupId,
    title: r.title,
    document: parseDocument(r.document),
    sourceVersion: r.sourceVersion,
    snapshotAt: r.snapshotAt.toISOString(),
    note: r.note,
    stepNotes: r.stepNotes,
    newerVersion: currentVersion !== null && currentVersion !== r.sourceVersion ? currentVersion : null,
  };
}

export async function getLessonDetail(db: Db, lessonId: string, role: ClassRole, userId: string): Promise<LessonDetail | null> {
  const [l] = await db.select({ ...summaryColumns, className: classes.name }).from(lessons).innerJoin(classes, eq(classes.id, lessons.classId)).where(eq(lessons.id, lessonId));
  if (!l) return null;
  const entries = await db
    .select({ e: lessonSetups, current: sql<number | null>`case when ${setups.deletedAt} is null then ${setups.version} end` })
    .from(lessonSetups)
    .leftJoin(setups, eq(setups.id, lessonSetups.setupId))
    .where(eq(lessonSetups.lessonId, lessonId))
    .orderBy(asc(lessonSetups.position), asc(lessonSetups.id));
  const teaching = role === 'instructor';
  const { className, ...summary } = l;
  return {
    ...summaryOut(summary),
    className,
    role,
    setups: entries.map((r) => entryOut(r.e, teaching ? r.current : null)),
    assignments: await listAssignments(db, { classId: l.classId, lessonId, role, userId }),
  };
}

export async function updateLesson(db: Db, lessonId: string, c: { title?: string; summary?: string; published?: boolean; position?: number }) {
  await db.transaction(async (tx) => {
    const { position, ...rest } = c;
    await tx.update(lessons).set({ ...rest, updatedAt: sql`now()` }).where(eq(lessons.id, lessonId));
    if (position !== undefined) {
      const [l] = await tx.select({ classId: lessons.classId }).from(lessons).where(eq(lessons.id, lessonId));
      const all = await tx.select({ id: lessons.id }).from(lessons).where(eq(lessons.classId, l!.classId)).orderBy(asc(lessons.position), asc(lessons.createdAt)).for('update');
      await reorder(tx, lessons, all.map((x) => x.id), lessonId, position);
    }
  });
}

/** Rewrite positions 0…n−1 with `id` moved to `to` (clamped). */
async function reorder(tx: Tx, table: typeof lessons | typeof lessonSetups, ids: string[], id: string, to: number) {
  const rest = ids.filter((x) => x !== id);
  rest.splice(Math.min(to, rest.length), 0, id);
  for (const [k, x] of rest.entries()) await tx.update(table).set({ position: k }).where(eq(table.id, x));
}

export async function deleteLesson(db: Db, lessonId: string) {
  await db.delete(lessons).where(eq(lessons.id, lessonId));
}

export async function hasAssignments(db: Db, lessonId: string): Promise<boolean> {
  const [r] = await db.select({ n: sql<number>`count(*)::int`.mapWith(Number) }).from(assignments).where(eq(assignments.lessonId, lessonId));
  return (r?.n ?? 0) > 0;
}

// ---------------------------------------------------------------------------------------------
// The setups of a lesson

export type SetupSnapshot = { id: string; title: string; document: SetupDocument; version: number };

export async function addLessonSetup(db: Db, lessonId: string, s: SetupSnapshot, note = ''): Promise<LessonSetup> {
  const [row] = await db.transaction(async (tx) => {
    await tx.update(lessons).set({ updatedAt: sql`now()` }).where(eq(lessons.id, lessonId));
    return tx
      .insert(lessonSetups)
      .values({
        lessonId,
        setupId: s.id,
        title: s.title,
        document: s.document,
        schemaVersion: s.document.schemaVersion,
        sourceVersion: s.version,
        note,
        position: sql`(select coalesce(max(position) + 1, 0) from ${lessonSetups} where lesson_id = ${lessonId})`,
      })
      .returning();
  });
  return entryOut(row!, null);
}

export async function lessonSetupOf(db: Db, lessonId: string, entryId: string): Promise<EntryRow | null> {
  const [r] = await db.select().from(lessonSetups).where(and(eq(lessonSetups.id, entryId), eq(lessonSetups.lessonId, lessonId)));
  return r ?? null;
}

export async function updateLessonSetup(db: Db, entry: EntryRow, c: { note?: string; stepNotes?: Record<string, string>; position?: number }): Promise<void> {
  await db.transaction(async (tx) => {
    const stepNotes = c.stepNotes ? mergeNotes(entry.stepNotes, c.stepNotes) : undefined;
    const fields = { ...(c.note !== undefined ? { note: c.note } : {}), ...(stepNotes ? { stepNotes } : {}) };
    if (Object.keys(fields).length) await tx.update(lessonSetups).set(fields).where(eq(lessonSetups.id, entry.id));
    await tx.update(lessons).set({ updatedAt: sql`now()` }).where(eq(lessons.id, entry.lessonId));
    if (c.position !== undefined) {
      const all = await tx.select({ id: lessonSetups.id }).from(lessonSetups).where(eq(lessonSetups.lessonId, entry.lessonId)).orderBy(asc(lessonSetups.position), asc(lessonSetups.id)).for('update');
      await reorder(tx, lessonSetups, all.map((x) => x.id), entry.id, c.position);
    }
  });
}

/** Step notes sent are merged into the stored ones; an empty text removes that step's note. */
function mergeNotes(stored: Record<string, string>, sent: Record<string, string>): Record<string, string> {
  const out = new Map(Object.entries(stored));
  for (const [k, v] of Object.entries(sent)) {
    if (v.trim()) out.set(k, v);
    else out.delete(k);
  }
  return Object.fromEntries(out);
}

/** Take the setup's current document into the lesson; the instructor's words stay, keyed by step id. */
export async function refreshLessonSetup(db: Db, entryId: string, s: SetupSnapshot): Promise<void> {
  await db
    .update(lessonSetups)
    .set({ title: s.title, document: s.document, schemaVersion: s.document.schemaVersion, sourceVersion: s.version, snapshotAt: sql`now()` })
    .where(eq(lessonSetups.id, entryId));
}

export async function removeLessonSetup(db: Db, entryId: string): Promise<void> {
  await db.delete(lessonSetups).where(eq(lessonSetups.id, entryId));
}

export async function getLessonSetup(db: Db, lessonId: string, entryId: string): Promise<LessonSetup | null> {
  const [r] = await db
    .select({ e: lessonSetups, current: sql<number | null>`case when ${setups.deletedAt} is null then ${setups.version} end` })
    .from(lessonSetups)
    .leftJoin(setups, eq(setups.id, lessonSetups.setupId))
    .where(and(eq(lessonSetups.id, entryId), eq(lessonSetups.lessonId, lessonId)));
  return r ? entryOut(r.e, r.current) : null;
}
