// Assignments: read, change, delete (instructors); a student starts from a copy of the reference or a blank
// plan (a normal setup in their personal studio) and submits it. The check is evaluated here, on the server,
// with the same evaluateCheck the client shows before submitting.
import { Router } from 'express';
import {
  assignmentBase,
  checkOf,
  createSubmission,
  deleteAssignment,
  getAssignmentDetail,
  listSubmissions,
  referenceDocument,
  setWork,
  updateAssignment,
  workOf,
} from '../../db/assignments';
import { classEmails } from '../../db/classes';
import type { Db } from '../../db/client';
import { lessonSetupOf } from '../../db/lessons';
import { createSetup, getSetupAccess, getSetupDetailObject } from '../../db/setups';
import { studiosOf } from '../../db/studios';
import { startAssignmentBody, submitBody, updateAssignmentBody } from '../../model/api';
import { evaluateCheck } from '../../model/classes';
import { emptyDocument } from '../../model/document';
import { checkCopyOut, classCan, requireAssignment, studioCan } from '../access';
import { HttpError } from '../errors';
import type { Mailer } from '../mail/mailer';
import { parseBody } from '../validate';
import { appLink, classMail, sendAll } from './classMail';
import { submissionDetail } from './submissions';

export function assignmentRoutes(db: Db, mailer?: Mailer) {
  const r = Router();

  r.get('/assignments/:id', async (req, res) => {
    const { user, id, access } = await requireAssignment(db, req, 'read');
    res.json(await getAssignmentDetail(db, id, access.role, user.id));
  });

  r.patch('/assignments/:id', async (req, res) => {
    const { user, id, access } = await requireAssignment(db, req, 'teach');
    const body = parseBody(updateAssignmentBody, req);
    if (body.referenceId && !(await lessonSetupOf(db, access.lessonId, body.referenceId))) {
      throw new HttpError(400, 'invalid_input', 'invalid body: referenceId: not a setup of this lesson', { fields: { referenceId: 'not a setup of this lesson' } });
    }
    await updateAssignment(db, id, body);
    res.json(await getAssignmentDetail(db, id, access.role, user.id));
  });

  r.delete('/assignments/:id', async (req, res) => {
    const { id } = await requireAssignment(db, req, 'teach');
    await deleteAssignment(db, id);
    res.status(204).end();
  });

  // The working copy: made once; asking again returns it while it still exists.
  r.post('/assignments/:id/start', async (req, res) => {
    const { user, id } = await requireAssignment(db, req, 'submit');
    const body = parseBody(startAssignmentBody, req);
    const existing = await workOf(db, id, user.id);
    if (existing?.setupId) {
      const a = await getSetupAccess(db, existing.setupId, user.id);
      if (a && !a.deletedAt && studioCan.write(a.role)) return void res.json(existing);
    }
    const base = (await assignmentBase(db, id))!;
    const reference = body.from === 'reference' ? await referenceDocument(db, id) : null;
    if (body.from === 'reference' && !reference) {
      throw new HttpError(409, 'no_reference', 'this assignment has no reference plan to copy; start from a blank plan', { fields: { from: 'no reference to copy' } });
    }
    const personal = (await studiosOf(db, user.id)).find((s) => s.personal && s.role === 'owner');
    if (!personal) throw new HttpError(409, 'no_personal_studio', 'you have no personal studio to keep the plan in');
    const setup = await createSetup(db, {
      studioId: personal.id,
      ownerId: user.id,
      title: `${base.summary.title as string} — my plan`.slice(0, 200),
      notes: (base.summary.brief as string) ?? '',
      tags: ['assignment'],
      document: reference?.document ?? emptyDocument(),
    });
    await setWork(db, { assignmentId: id, studentId: user.id, setupId: setup.id, startedFrom: body.from });
    res.status(201).json(await workOf(db, id, user.id));
  });

  // Instructors see every attempt; a student sees their own and those shared with the class.
  r.get('/assignments/:id/submissions', async (req, res) => {
    const { user, id, access } = await requireAssignment(db, req, 'read');
    res.json({ submissions: await listSubmissions(db, id, classCan.teach(access.role) ? {} : { visibleTo: user.id }) });
  });

  r.post('/assignments/:id/submissions', async (req, res) => {
    const { user, id, access } = await requireAssignment(db, req, 'submit');
    const body = parseBody(submitBody, req);
    const setupId = body.setupId ?? (await workOf(db, id, user.id))?.setupId;
    if (!setupId) throw new HttpError(409, 'not_started', 'start the assignment first (from the reference or a blank plan)', { fields: { setupId: 'nothing to submit yet' } });
    const sa = await getSetupAccess(db, setupId, user.id);
    if (!sa || !studioCan.read(sa.role) || sa.deletedAt) throw new HttpError(404, 'not_found', 'no such setup of yours', { fields: { setupId: 'not a setup you can read' } });
    // A submission is a copy the class's instructors keep: out of a studio where the student is crew, only
    // when that studio allows it.
    await checkCopyOut(db, sa, 'setupId');
    const setup = (await getSetupDetailObject(db, setupId, user.id))!;
    const base = (await assignmentBase(db, id))!;
    const check = checkOf(base.summary.check);
    const checkResult = check ? evaluateCheck(check, setup.document) : null;
    const submissionId = await createSubmission(db, { assignmentId: id, studentId: user.id, setupId, title: setup.title, document: setup.document, checkResult });
    const detail = (await submissionDetail(db, submissionId, { role: access.role, own: true }))!;
    const link = appLink(req, `/submissions/${submissionId}`);
    const instructors = await classEmails(db, access.classId, 'instructor');
    await sendAll(
      mailer,
      req,
      instructors.map((i) => classMail.submitted({ to: i.email, studentName: user.name, title: base.summary.title as string, attempt: detail.attempt, passed: detail.passed, link })),
    );
    res.status(201).json(detail);
  });

  return r;
}
