// What each role may do. Routes ask these, never compare role names themselves.
//   owner   everything, members and invitations, marking the studio's own templates
//   editor  create, edit, delete and restore setups
//   crew    read and comment, never write
//   anyone signed in: read (and copy) the templates in the gallery for everyone; everything else of a studio
//   they are not in is a 404, so its existence does not leak.
//   operator (db/schema/operators.ts, above every studio): publishes templates to, and withdraws them from,
//   the gallery for everyone; nothing more (it reads no studio's setups it is not a member of).
import type { Request } from 'express';
import type { Db } from '../db/client';
import { assignmentAccess, submissionAccess, type AssignmentAccess, type SubmissionAccess } from '../db/assignments';
import { classRoleOf } from '../db/classes';
import { lessonAccess, type LessonAccess } from '../db/lessons';
import { isOperator } from '../db/operators';
import { getSetupAccess, type SetupAccess } from '../db/setups';
import { crewMayCopy } from '../db/studios';
import type { ClassRole, StudioRole } from '../model/api';
import { HttpError, notFound } from './errors';
import { userOf } from './session';

export const studioCan = {
  read: (r: StudioRole | null) => r !== null,
  comment: (r: StudioRole | null) => r !== null,
  write: (r: StudioRole | null) => r === 'owner' || r === 'editor',
  publishTemplates: (r: StudioRole | null) => r === 'owner',
  manageMembers: (r: StudioRole | null) => r === 'owner',
};

/** read: the setup itself (the gallery for everyone: anyone); member: what stays inside the studio (history, comments). */
export type SetupNeed = 'read' | 'member' | 'comment' | 'write' | 'publish';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** A path id that is not a UUID names nothing: 404, like an id that does not exist. */
export function pathId(value: unknown, what: string): string {
  if (typeof value !== 'string' || !UUID.test(value)) throw notFound(`no such ${what}`);
  return value.toLowerCase();
}

/** Decide from a setup's access row; throws the HTTP error the caller should get. */
export function checkSetup(a: SetupAccess | null, need: SetupNeed, opts: { deleted?: 'allow' | 'refuse' } = {}): SetupAccess {
  if (!a) throw notFound('no such setup');
  const readable = studioCan.read(a.role) || (a.forEveryone && !a.deletedAt);
  if (!readable) throw notFound('no such setup');
  if (a.deletedAt && opts.deleted !== 'allow') throw new HttpError(410, 'setup_deleted', 'this setup was deleted; restore it from the library first');
  const allowed = {
    read: true,
    member: studioCan.read(a.role),
    comment: studioCan.comment(a.role),
    write: studioCan.write(a.role),
    publish: studioCan.publishTemplates(a.role),
  }[need];
  if (!allowed) {
    const what = { read: 'read', member: 'see the history of', comment: 'comment on', write: 'change', publish: 'publish templates from' }[need];
    throw new HttpError(403, 'forbidden', a.role ? `your role in this studio (${a.role}) cannot ${what} this setup` : `only members of the setup's studio can ${what} it`);
  }
  return a;
}

/**
 * Copying a setup out of its studio (a duplicate, a lesson's snapshot, a submission to a class): crew may only
 * when the studio's `crewMayCopy` setting is on (off by default); templates are made to be copied. Every route
 * that takes a copy of a setup somewhere else asks this, after `checkSetup(…, 'read')`. `field` names the body
 * field that chose the setup, when one did.
 */
export async function checkCopyOut(db: Db, a: SetupAccess, field?: string): Promise<void> {
  if (a.role !== 'crew' || a.isTemplate || a.forEveryone) return;
  if (await crewMayCopy(db, a.studioId)) return;
  throw new HttpError(403, 'crew_copy_off', 'this studio does not let crew copy its setups (the studio setting crewMayCopy is off; an owner can turn it on)', {
    fields: { crewMayCopy: 'off in this studio', ...(field ? { [field]: 'crew may not copy this studio’s setups out' } : {}) },
  });
}

/** The setup named by `req.params.id`, checked for the caller and `need`. */
export async function requireSetup(db: Db, req: Request, need: SetupNeed, opts: { deleted?: 'allow' | 'refuse' } = {}) {
  const user = userOf(req);
  const id = pathId(req.params.id, 'setup');
  return { user, id, access: checkSetup(await getSetupAccess(db, id, user.id), need, opts) };
}

// ---------------------------------------------------------------------------------------------
// Classes
//   instructor  everything of the class: roster, invitations, lessons (drafts too), assignments, review
//   student     published lessons and their assignments; starts, submits and reads their own work and the
//               review of it; sees a classmate's submission only when an instructor shared it with the class
//   anyone else: 404 for everything of the class, so its existence does not leak.

export const classCan = {
  read: (r: ClassRole | null) => r !== null,
  teach: (r: ClassRole | null) => r === 'instructor',
  submit: (r: ClassRole | null) => r === 'student',
};

const teachOnly = (r: ClassRole | null, what: string) => {
  if (!classCan.teach(r)) throw new HttpError(403, 'forbidden', `only the class's instructors can ${what}`);
};

/** The class named by `req.params.id`, for a member; `teach` also needs an instructor. */
export async function requireClass(db: Db, req: Request, need: 'read' | 'teach', what = 'do that') {
  const user = userOf(req);
  const id = pathId(req.params.id, 'class');
  const role = await classRoleOf(db, user.id, id);
  if (!classCan.read(role)) throw notFound('no such class');
  if (need === 'teach') teachOnly(role, what);
  return { user, id, role: role! };
}

/** A lesson: members read it once published (instructors always); `teach` changes it. */
export async function requireLesson(db: Db, req: Request, need: 'read' | 'teach', what = 'change this lesson') {
  const user = userOf(req);
  const id = pathId(req.params.id, 'lesson');
  const a = await lessonAccess(db, id, user.id);
  if (!a || !classCan.read(a.role) || (!a.published && !classCan.teach(a.role))) throw notFound('no such lesson');
  if (need === 'teach') teachOnly(a.role, what);
  return { user, id, access: a as LessonAccess & { role: ClassRole } };
}

/** An assignment: readable as its lesson is; `teach` changes it, `submit` is a student's work on it. */
export async function requireAssignment(db: Db, req: Request, need: 'read' | 'teach' | 'submit') {
  const user = userOf(req);
  const id = pathId(req.params.id, 'assignment');
  const a = await assignmentAccess(db, id, user.id);
  if (!a || !classCan.read(a.role) || (!a.published && !classCan.teach(a.role))) throw notFound('no such assignment');
  if (need === 'teach') teachOnly(a.role, 'change assignments');
  if (need === 'submit' && !classCan.submit(a.role)) throw new HttpError(403, 'forbidden', 'only students of the class work on its assignments');
  return { user, id, access: a as AssignmentAccess & { role: ClassRole } };
}

/**
 * A submission: its student and the class's instructors see it, the rest of the class only once shared.
 * `comment`: the instructors and the student who submitted it; `review`: instructors.
 */
export async function requireSubmission(db: Db, req: Request, need: 'read' | 'comment' | 'review') {
  const user = userOf(req);
  const id = pathId(req.params.id, 'submission');
  const a = await submissionAccess(db, id, user.id);
  const own = a?.studentId === user.id;
  if (!a || !classCan.read(a.role) || !(classCan.teach(a.role) || own || a.shared)) throw notFound('no such submission');
  if (need === 'review') teachOnly(a.role, 'review submissions');
  if (need === 'comment' && !(classCan.teach(a.role) || own)) throw new HttpError(403, 'forbidden', 'only the instructors and the student who submitted it can comment');
  return { user, id, own, access: a as SubmissionAccess & { role: ClassRole } };
}

/** Publishing to or withdrawing from the gallery for everyone: operators only, a 403 saying so for anyone else. */
export async function requireOperator(db: Db, req: Request, what: string) {
  const user = userOf(req);
  if (!(await isOperator(db, user.id))) {
    throw new HttpError(403, 'operator_only', `only an operator of this Falloff can ${what}; studio owners keep templates for their own studio`);
  }
  return user;
}
