// Assignments on a lesson, students' working copies, submissions (snapshots with the check's result) and
// review comments. Callers (server/routes) have already checked the caller's role.
import { and, asc, desc, eq, inArray, or, sql } from 'drizzle-orm';
import type { AssignmentSummary, AssignmentWork, ClassRole, SubmissionComment, SubmissionSummary } from '../model/api';
import { checkSchema, type Check, type CheckResult } from '../model/classes';
import { parseDocument, type SetupDocument } from '../model/document';
import type { Db } from './client';
import { assignmentWork, assignments, classMembers, classes, lessonSetups, lessons, submissionComments, submissions, user } from './schema';

/** A stored check is parsed again on the way out, so an old or hand-edited row can never reach evaluateCheck unchecked. */
export const checkOf = (raw: unknown): Check | null => {
  const r = checkSchema.safeParse(raw);
  return r.success ? r.data : null;
};

// ---------------------------------------------------------------------------------------------
// Assignments

/** The latest attempt of each student (one row per student). */
const latestAttempts = (assignmentId: unknown) => sql`(
  select distinct on (s.student_id) s.* from ${submissions} s where s.assignment_id = ${assignmentId} order by s.student_id, s.attempt desc)`;
const submittedCount = sql<number>`(select count(*)::int from ${latestAttempts(sql.raw('"assignments"."id"'))} x)`.mapWith(Number);
const reviewedCount = sql<number>`(select count(*)::int from ${latestAttempts(sql.raw('"assignments"."id"'))} x where x.status = 'reviewed')`.mapWith(Number);

const summaryColumns = {
  id: assignments.id,
  lessonId: assignments.lessonId,
  lessonTitle: lessons.title,
  title: assignments.title,
  brief: assignments.brief,
  check: assignments.check,
  referenceId: assignments.referenceId,
  dueAt: assignments.dueAt,
  createdAt: assignments.createdAt,
  submittedCount,
  reviewedCount,
};
type SummaryRow = { [K in keyof typeof summaryColumns]: unknown } & { dueAt: Date | null; createdAt: Date; submittedCount: number; reviewedCount: number };
function summaryOut(r: SummaryRow, teaching: boolean): AssignmentSummary {
  return {
    id: r.id as string,
    lessonId: r.lessonId as string,
    lessonTitle: r.lessonTitle as string,
    title: r.title as string,
    brief: r.brief as string,
    check: checkOf(r.check),
    referenceId: r.referenceId as string | null,
    dueAt: r.dueAt ? r.dueAt.toISOString() : null,
    createdAt: r.createdAt.toISOString(),
    submittedCount: teaching ? r.submittedCount : null,
    reviewedCount: teaching ? r.reviewedCount : null,
  };
}

/** A class's (or one lesson's) assignments, newest first; students see those on published lessons only. */
export async function listAssignments(db: Db, o: { classId: string; lessonId?: string; role: ClassRole; userId: string }): Promise<AssignmentSummary[]> {
  const rows = await db
    .select(summaryColumns)
    .from(assignments)
    .innerJoin(lessons, eq(lessons.id, assignments.lessonId))
    .where(and(eq(lessons.classId, o.classId), o.lessonId ? eq(lessons.id, o.lessonId) : undefined, o.role === 'instructor' ? undefined : eq(lessons.published, true)))
    .orderBy(desc(assignments.createdAt), desc(assignments.id));
  return rows.map((r) => summaryOut(r as SummaryRow, o.role === 'instructor'));
}

export async function assignmentAccess(db: Db, assignmentId: string, userId: string) {
  const [r] = await db
    .select({ id: assignments.id, lessonId: assignments.lessonId, classId: lessons.classId, published: lessons.published, role: classMembers.role })
    .from(assignments)
    .innerJoin(lessons, eq(lessons.id, assignments.lessonId))
    .leftJoin(classMembers, and(eq(classMembers.classId, lessons.classId), eq(classMembers.userId, userId)))
    .where(eq(assignments.id, assignmentId));
  return r ?? null;
}
export type AssignmentAccess = NonNullable<Awaited<ReturnType<typeof assignmentAccess>>>;

export type AssignmentFields = { title?: string; brief?: string; check?: Check | null; referenceId?: string | null; dueAt?: string | null };

export async function createAssignment(db: Db, lessonId: string, v: AssignmentFields & { title: string; createdBy: string }): Promise<string> {
  const [row] = await db
    .insert(assignments)
    .values({ lessonId, title: v.title, brief: v.brief ?? '', check: v.check ?? null, referenceId: v.referenceId ?? null, dueAt: v.dueAt ? new Date(v.dueAt) : null, createdBy: v.createdBy })
    .returning({ id: assignments.id });
  return row!.id;
}

export async function updateAssignment(db: Db, id: string, c: AssignmentFields) {
  const { dueAt, ...rest } = c;
  await db
    .update(assignments)
    .set({ ...rest, ...(dueAt !== undefined ? { dueAt: dueAt ? new Date(dueAt) : null } : {}) })
    .where(eq(assignments.id, id));
}

export async function deleteAssignment(db: Db, id: string) {
  await db.delete(assignments).where(eq(assignments.id, id));
}

/** The lesson's first setup, the default reference. */
export async function firstLessonSetupId(db: Db, lessonId: string): Promise<string | null> {
  const [r] = await db.select({ id: lessonSetups.id }).from(lessonSetups).where(eq(lessonSetups.lessonId, lessonId)).orderBy(asc(lessonSetups.position), asc(lessonSetups.id)).limit(1);
  return r?.id ?? null;
}

export async function assignmentBase(db: Db, id: string) {
  const [r] = await db
    .select({ summary: summaryColumns, classId: lessons.classId, className: classes.name })
    .from(assignments)
    .innerJoin(lessons, eq(lessons.id, assignments.lessonId))
    .innerJoin(classes, eq(classes.id, lessons.classId))
    .where(eq(assignments.id, id));
  return r ?? null;
}

/** An assignment as the caller sees it, with the reference's snapshot. */
export async function getAssignmentDetail(db: Db, id: string, role: ClassRole, userId: string) {
  const base = await assignmentBase(db, id);
  if (!base) return null;
  const summary = summaryOut(base.summary as SummaryRow, role === 'instructor');
  const [ref] = summary.referenceId
    ? await db.select({ id: lessonSetups.id, title: lessonSetups.title, document: lessonSetups.document }).from(lessonSetups).where(eq(lessonSetups.id, summary.referenceId))
    : [];
  return {
    ...summary,
    classId: base.classId,
    className: base.className,
    role,
    reference: ref ? { id: ref.id, title: ref.title, document: parseDocument(ref.document) } : null,
    mine: role === 'student' ? await workOf(db, id, userId) : null,
  };
}

export async function referenceDocument(db: Db, assignmentId: string): Promise<{ title: string; document: SetupDocument } | null> {
  const [r] = await db
    .select({ title: lessonSetups.title, document: lessonSetups.document })
    .from(assignments)
    .innerJoin(lessonSetups, eq(lessonSetups.id, assignments.referenceId))
    .where(eq(assignments.id, assignmentId));
  return r ? { title: r.title, document: parseDocument(r.document) } : null;
}

// ---------------------------------------------------------------------------------------------
// Working copies

export async function workOf(db: Db, assignmentId: string, studentId: string): Promise<AssignmentWork | null> {
  const [w] = await db.select().from(assignmentWork).where(and(eq(assignmentWork.assignmentId, assignmentId), eq(assignmentWork.studentId, studentId)));
  if (!w) return null;
  const [latest] = await listSubmissions(db, assignmentId, { studentId, latestOnly: true });
  return { setupId: w.setupId, startedFrom: w.startedFrom === 'blank' ? 'blank' : 'reference', latest: latest ?? null };
}

export async function setWork(db: Db, v: { assignmentId: string; studentId: string; setupId: string; startedFrom: 'reference' | 'blank' }) {
  await db
    .insert(assignmentWork)
    .values(v)
    .onConflictDoUpdate({ target: [assignmentWork.assignmentId, assignmentWork.studentId], set: { setupId: v.setupId, startedFrom: v.startedFrom, createdAt: sql`now()` } });
}

// ---------------------------------------------------------------------------------------------
// Submissions

const commentCount = sql<number>`(select count(*)::int from ${submissionComments} c where c.submission_id = "submissions"."id")`.mapWith(Number);
const submissionColumns = {
  id: submissions.id,
  assignmentId: submissions.assignmentId,
  studentId: submissions.studentId,
  studentName: user.name,
  attempt: submissions.attempt,
  title: submissions.title,
  passed: submissions.passed,
  status: submissions.status,
  shared: submissions.shared,
  submittedAt: submissions.submittedAt,
  reviewedAt: submissions.reviewedAt,
  commentCount,
};
type SubmissionRow = { id: string; assignmentId: string; studentId: string; studentName: string; attempt: number; title: string; passed: boolean | null; status: 'submitted' | 'reviewed'; shared: boolean; submittedAt: Date; reviewedAt: Date | null; commentCount: number };
const submissionOut = ({ studentId, studentName, ...r }: SubmissionRow): SubmissionSummary => ({
  ...r,
  student: { id: studentId, name: studentName },
  submittedAt: r.submittedAt.toISOString(),
  reviewedAt: r.reviewedAt ? r.reviewedAt.toISOString() : null,
});

/**
 * Submissions of an assignment, newest first: all of them (instructors), or one student's together with
 * those the instructor shared with the class (`visibleTo`), or one student's only.
 */
export async function listSubmissions(db: Db, assignmentId: string, o: { studentId?: string; visibleTo?: string; latestOnly?: boolean } = {}): Promise<SubmissionSummary[]> {
  const who = o.visibleTo ? or(eq(submissions.studentId, o.visibleTo), eq(submissions.shared, true)) : o.studentId ? eq(submissions.studentId, o.studentId) : undefined;
  const rows = await db
    .select(submissionColumns)
    .from(submissions)
    .innerJoin(user, eq(user.id, submissions.studentId))
    .where(and(eq(submissions.assignmentId, assignmentId), who))
    .orderBy(desc(submissions.submittedAt), desc(submissions.attempt))
    .limit(o.latestOnly ? 1 : 1000);
  return rows.map(submissionOut);
}

/** A new attempt: numbered after the student's last one (a concurrent double submit gets the next number). */
export async function createSubmission(
  db: Db,
  v: { assignmentId: string; studentId: string; setupId: string; title: string; document: SetupDocument; checkResult: CheckResult | null },
): Promise<string> {
  for (let k = 0; ; k++) {
    try {
      const [row] = await db
        .insert(submissions)
        .values({
          assignmentId: v.assignmentId,
          studentId: v.studentId,
          setupId: v.setupId,
          title: v.title,
          document: v.document,
          schemaVersion: v.document.schemaVersion,
          checkResult: v.checkResult,
          passed: v.checkResult ? v.checkResult.pass : null,
          attempt: sql`(select coalesce(max(attempt) + 1, 1) from ${submissions} where assignment_id = ${v.assignmentId} and student_id = ${v.studentId})`,
        })
        .returning({ id: submissions.id });
      return row!.id;
    } catch (e) {
      const code = (e as { code?: string; cause?: { code?: string } }).code ?? (e as { cause?: { code?: string } }).cause?.code;
      if (code !== '23505' || k >= 3) throw e;
    }
  }
}

export async function submissionAccess(db: Db, id: string, userId: string) {
  const [r] = await db
    .select({ id: submissions.id, assignmentId: submissions.assignmentId, studentId: submissions.studentId, shared: submissions.shared, classId: lessons.classId, role: classMembers.role })
    .from(submissions)
    .innerJoin(assignments, eq(assignments.id, submissions.assignmentId))
    .innerJoin(lessons, eq(lessons.id, assignments.lessonId))
    .leftJoin(classMembers, and(eq(classMembers.classId, lessons.classId), eq(classMembers.userId, userId)))
    .where(eq(submissions.id, id));
  return r ?? null;
}
export type SubmissionAccess = NonNullable<Awaited<ReturnType<typeof submissionAccess>>>;

export async function getSubmission(db: Db, id: string) {
  const [r] = await db
    .select({ summary: submissionColumns, document: submissions.document, checkResult: submissions.checkResult, assignmentTitle: assignments.title, brief: assignments.brief, check: assignments.check, classId: lessons.classId })
    .from(submissions)
    .innerJoin(user, eq(user.id, submissions.studentId))
    .innerJoin(assignments, eq(assignments.id, submissions.assignmentId))
    .innerJoin(lessons, eq(lessons.id, assignments.lessonId))
    .where(eq(submissions.id, id));
  if (!r) return null;
  return {
    ...submissionOut(r.summary as SubmissionRow),
    classId: r.classId,
    assignmentTitle: r.assignmentTitle,
    brief: r.brief,
    check: checkOf(r.check),
    checkResult: (r.checkResult as CheckResult | null) ?? null,
    document: parseDocument(r.document),
  };
}

export async function setSubmissionState(db: Db, id: string, c: { reviewed?: boolean; shared?: boolean }, by: string) {
  await db
    .update(submissions)
    .set({
      ...(c.shared !== undefined ? { shared: c.shared } : {}),
      ...(c.reviewed === true ? { status: 'reviewed' as const, reviewedAt: sql`now()`, reviewedBy: by } : {}),
      ...(c.reviewed === false ? { status: 'submitted' as const, reviewedAt: null, reviewedBy: null } : {}),
    })
    .where(eq(submissions.id, id));
}

/** The student a submission notifies, with the assignment it answers. */
export async function submissionNotice(db: Db, id: string) {
  const [r] = await db
    .select({ email: user.email, name: user.name, assignmentTitle: assignments.title, attempt: submissions.attempt, passed: submissions.passed })
    .from(submissions)
    .innerJoin(user, eq(user.id, submissions.studentId))
    .innerJoin(assignments, eq(assignments.id, submissions.assignmentId))
    .where(eq(submissions.id, id));
  return r ?? null;
}

// ---------------------------------------------------------------------------------------------
// Review comments

type CommentRow = { id: string; body: string; itemId: string | null; xM: number | null; yM: number | null; createdAt: Date; authorId: string | null; authorName: string | null };
const commentOut = ({ authorId, authorName, xM, yM, ...r }: CommentRow): SubmissionComment => ({
  ...r,
  point: xM !== null && yM !== null ? { x: xM, y: yM } : null,
  createdAt: r.createdAt.toISOString(),
  author: authorId ? { id: authorId, name: authorName ?? '' } : null,
});

export async function listSubmissionComments(db: Db, submissionIds: string[]): Promise<SubmissionComment[]> {
  if (!submissionIds.length) return [];
  const rows = await db
    .select({ id: submissionComments.id, body: submissionComments.body, itemId: submissionComments.itemId, xM: submissionComments.xM, yM: submissionComments.yM, createdAt: submissionComments.createdAt, authorId: submissionComments.authorId, authorName: user.name })
    .from(submissionComments)
    .leftJoin(user, eq(user.id, submissionComments.authorId))
    .where(inArray(submissionComments.submissionId, submissionIds))
    .orderBy(asc(submissionComments.createdAt), asc(submissionComments.id))
    .limit(1000);
  return rows.map(commentOut);
}

export async function addSubmissionComment(db: Db, v: { submissionId: string; author: { id: string; name: string }; body: string; itemId?: string; point?: { x: number; y: number } }): Promise<SubmissionComment> {
  const [row] = await db
    .insert(submissionComments)
    .values({ submissionId: v.submissionId, authorId: v.author.id, body: v.body, itemId: v.itemId ?? null, xM: v.point?.x ?? null, yM: v.point?.y ?? null })
    .returning();
  return commentOut({ ...row!, authorId: v.author.id, authorName: v.author.name });
}
