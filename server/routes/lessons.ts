// Lessons: an instructor's ordered setups (snapshots, refreshable from the setup) with words per setup and
// per step; students read published lessons. Assignments are set on a lesson.
import type { Request } from 'express';
import { Router } from 'express';
import { createAssignment, firstLessonSetupId, getAssignmentDetail } from '../../db/assignments';
import { classEmails, classView } from '../../db/classes';
import type { Db } from '../../db/client';
import {
  addLessonSetup,
  deleteLesson,
  getLessonDetail,
  getLessonSetup,
  hasAssignments,
  lessonSetupOf,
  refreshLessonSetup,
  removeLessonSetup,
  updateLesson,
  updateLessonSetup,
  type SetupSnapshot,
} from '../../db/lessons';
import { getSetupAccess, getSetupDetailObject, type SetupAccess } from '../../db/setups';
import { addLessonSetupBody, createAssignmentBody, updateLessonBody, updateLessonSetupBody } from '../../model/api';
import { checkCopyOut, checkSetup, pathId, requireLesson } from '../access';
import { HttpError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { parseBody } from '../validate';
import { appLink, classMail, sendAll } from './classMail';

/** The setup as the instructor can read it now (their studios' setups, or any template). */
async function snapshotFor(db: Db, userId: string, setupId: string, field: string): Promise<SetupSnapshot> {
  let access: SetupAccess;
  try {
    access = checkSetup(await getSetupAccess(db, setupId, userId), 'read');
  } catch (e) {
    if (e instanceof HttpError && e.status === 404) throw new HttpError(404, 'not_found', 'no such setup, or not one you can read', { fields: { [field]: 'no setup you can read' } });
    throw e;
  }
  // A lesson keeps its own copy: taking one out of a studio where the caller is crew is the studio's call.
  await checkCopyOut(db, access, field);
  const s = (await getSetupDetailObject(db, setupId, userId))!;
  return { id: s.id, title: s.title, document: s.document, version: s.version };
}

export function lessonRoutes(db: Db, mailer?: Mailer) {
  const r = Router();

  async function entryOf(req: Request, lessonId: string) {
    const entry = await lessonSetupOf(db, lessonId, pathId(req.params.entryId, 'lesson setup'));
    if (!entry) throw notFound('no such setup in this lesson');
    return entry;
  }

  r.get('/lessons/:id', async (req, res) => {
    const { user, id, access } = await requireLesson(db, req, 'read');
    res.json(await getLessonDetail(db, id, access.role, user.id));
  });

  r.patch('/lessons/:id', async (req, res) => {
    const { user, id, access } = await requireLesson(db, req, 'teach');
    const body = parseBody(updateLessonBody, req);
    if (body.published === false && access.published && (await hasAssignments(db, id))) {
      throw new HttpError(409, 'has_assignments', 'students have assignments on this lesson; remove them before taking it back to a draft', { fields: { published: 'the lesson has assignments' } });
    }
    await updateLesson(db, id, body);
    res.json(await getLessonDetail(db, id, access.role, user.id));
  });

  r.delete('/lessons/:id', async (req, res) => {
    const { id } = await requireLesson(db, req, 'teach', 'delete lessons');
    await deleteLesson(db, id);
    res.status(204).end();
  });

  r.post('/lessons/:id/setups', async (req, res) => {
    const { user, id } = await requireLesson(db, req, 'teach');
    const body = parseBody(addLessonSetupBody, req);
    const snap = await snapshotFor(db, user.id, body.setupId, 'setupId');
    res.status(201).json(await addLessonSetup(db, id, snap, body.note));
  });

  r.patch('/lessons/:id/setups/:entryId', async (req, res) => {
    const { id } = await requireLesson(db, req, 'teach');
    const entry = await entryOf(req, id);
    const body = parseBody(updateLessonSetupBody, req);
    const stepIds = new Set(((entry.document as { steps?: { id: string }[] }).steps ?? []).map((s) => s.id));
    const unknown = Object.keys(body.stepNotes ?? {}).filter((k) => !stepIds.has(k));
    if (unknown.length) {
      throw new HttpError(400, 'invalid_input', `invalid body: stepNotes.${unknown[0]}: no such step in this setup`, { fields: Object.fromEntries(unknown.map((k) => [`stepNotes.${k}`, 'no such step in this setup'])) });
    }
    await updateLessonSetup(db, entry, body);
    res.json(await getLessonSetup(db, id, entry.id));
  });

  // Take the setup's current version into the lesson (the words per step stay, by step id).
  r.post('/lessons/:id/setups/:entryId/refresh', async (req, res) => {
    const { user, id } = await requireLesson(db, req, 'teach');
    const entry = await entryOf(req, id);
    if (!entry.setupId) throw new HttpError(409, 'source_gone', 'the setup this was taken from no longer exists; the lesson keeps its copy');
    let snap: SetupSnapshot;
    try {
      snap = await snapshotFor(db, user.id, entry.setupId, 'setupId');
    } catch (e) {
      if (e instanceof HttpError && (e.status === 404 || e.status === 410)) throw new HttpError(409, 'source_unreadable', 'you can no longer read the setup this was taken from (deleted, or you left its studio); the lesson keeps its copy');
      throw e;
    }
    await refreshLessonSetup(db, entry.id, snap);
    res.json(await getLessonSetup(db, id, entry.id));
  });

  r.delete('/lessons/:id/setups/:entryId', async (req, res) => {
    const { id } = await requireLesson(db, req, 'teach');
    const entry = await entryOf(req, id);
    await removeLessonSetup(db, entry.id);
    res.status(204).end();
  });

  // Setting an assignment e-mails the class's students.
  r.post('/lessons/:id/assignments', async (req, res) => {
    const { user, id, access } = await requireLesson(db, req, 'teach', 'set assignments');
    const body = parseBody(createAssignmentBody, req);
    if (!access.published) throw new HttpError(409, 'lesson_draft', 'publish the lesson before setting an assignment on it, so students can follow it', { fields: { lesson: 'still a draft' } });
    if (body.referenceId && !(await lessonSetupOf(db, id, body.referenceId))) {
      throw new HttpError(400, 'invalid_input', 'invalid body: referenceId: not a setup of this lesson', { fields: { referenceId: 'not a setup of this lesson' } });
    }
    const referenceId = body.referenceId === undefined ? await firstLessonSetupId(db, id) : body.referenceId;
    const assignmentId = await createAssignment(db, id, { ...body, referenceId, createdBy: user.id });
    const detail = (await getAssignmentDetail(db, assignmentId, access.role, user.id))!;
    const [view, students] = await Promise.all([classView(db, user.id, access.classId), classEmails(db, access.classId, 'student')]);
    const link = appLink(req, `/assignments/${assignmentId}`);
    await sendAll(
      mailer,
      req,
      students.map((s) => classMail.assignmentSet({ to: s.email, className: view!.name, title: detail.title, brief: detail.brief, instructorName: user.name, dueAt: detail.dueAt, link })),
    );
    res.status(201).json(detail);
  });

  return r;
}
