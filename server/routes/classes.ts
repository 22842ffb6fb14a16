// Classes: create (the creator teaches it), the roster, join codes, invitations by e-mail, and the class's
// lessons and assignments lists. Roles from server/access.ts; a non-member gets 404 for everything of a class.
import { Router } from 'express';
import { listAssignments } from '../../db/assignments';
import {
  acceptClassInvitation,
  classSummariesOf,
  classView,
  createClass,
  createClassInvitation,
  invitationsFor,
  isClassMemberByEmail,
  joinByCode,
  listClassInvitations,
  listClassMembers,
  regenerateJoinCode,
  removeClassMember,
  renameClass,
  revokeClassInvitation,
  setInvitationDelivery,
} from '../../db/classes';
import type { Db } from '../../db/client';
import { createLesson, listLessons } from '../../db/lessons';
import { createClassBody, createLessonBody, inviteToClassBody, joinClassBody, updateClassBody, type ClassListResponse } from '../../model/api';
import { classCan, pathId, requireClass } from '../access';
import { HttpError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { userOf } from '../session';
import { parseBody } from '../validate';
import { requireVerifiedEmail } from '../verified';
import { appLink, classMail, sendAll } from './classMail';

export function classRoutes(db: Db, mailer?: Mailer) {
  const r = Router();

  r.get('/classes', async (req, res) => {
    const user = userOf(req);
    const [mine, invitations] = await Promise.all([classSummariesOf(db, user.id), invitationsFor(db, user)]);
    const body: ClassListResponse = { classes: mine.map(({ joinCode: _c, createdAt: _t, ...c }) => c), invitations };
    res.json(body);
  });

  // Anyone signed in may start a class, and teaches it.
  r.post('/classes', async (req, res) => {
    const body = parseBody(createClassBody, req);
    res.status(201).json(await createClass(db, userOf(req), body.name));
  });

  r.post('/classes/join', async (req, res) => {
    const body = parseBody(joinClassBody, req);
    const joined = await joinByCode(db, userOf(req), body.code);
    if (!joined) throw new HttpError(404, 'not_found', 'no class has that join code; check it with your instructor', { fields: { code: 'no class has this code' } });
    res.json(joined);
  });

  r.get('/classes/:id', async (req, res) => {
    const { user, id } = await requireClass(db, req, 'read');
    res.json(await classView(db, user.id, id));
  });

  r.patch('/classes/:id', async (req, res) => {
    const { user, id } = await requireClass(db, req, 'teach', 'rename the class');
    await renameClass(db, id, parseBody(updateClassBody, req).name);
    res.json(await classView(db, user.id, id));
  });

  r.post('/classes/:id/join-code', async (req, res) => {
    const { id } = await requireClass(db, req, 'teach', 'change the join code');
    res.json({ joinCode: await regenerateJoinCode(db, id) });
  });

  // Someone invited by e-mail joins from their own Classes screen, signed in with that address.
  r.post('/classes/:id/accept', async (req, res) => {
    const user = userOf(req);
    await requireVerifiedEmail(db, user, 'join a class by invitation');
    const joined = await acceptClassInvitation(db, pathId(req.params.id, 'class'), user);
    if (!joined) throw notFound('no such class');
    res.json(joined);
  });

  // Everyone in the class sees who is in it; only instructors see addresses.
  r.get('/classes/:id/members', async (req, res) => {
    const { id, role } = await requireClass(db, req, 'read');
    res.json({ members: await listClassMembers(db, id, classCan.teach(role)) });
  });

  // An instructor removes anyone; any member may leave. The last instructor cannot go.
  r.delete('/classes/:id/members/:userId', async (req, res) => {
    const userId = String(req.params.userId);
    const leaving = userId === userOf(req).id;
    const { id } = await requireClass(db, req, leaving ? 'read' : 'teach', 'remove members');
    const result = await removeClassMember(db, id, userId);
    if (result === 'not_member') throw notFound('no such member of this class');
    if (result === 'last_instructor') throw new HttpError(409, 'last_instructor', 'a class needs an instructor: invite another one first');
    res.status(204).end();
  });

  r.get('/classes/:id/invitations', async (req, res) => {
    const { id } = await requireClass(db, req, 'teach', 'see invitations');
    res.json({ invitations: await listClassInvitations(db, id) });
  });

  r.post('/classes/:id/invitations', async (req, res) => {
    const { user, id } = await requireClass(db, req, 'teach', 'invite people');
    const body = parseBody(inviteToClassBody, req);
    await requireVerifiedEmail(db, user, 'invite people');
    if (await isClassMemberByEmail(db, id, body.email)) {
      throw new HttpError(409, 'already_member', `${body.email} is already in this class`, { fields: { email: 'already in the class' } });
    }
    const invitation = await createClassInvitation(db, { classId: id, email: body.email, role: body.role, invitedBy: user });
    const view = (await classView(db, user.id, id))!;
    // As a studio's invitation: a mail queue that cannot take the message withdraws the invitation (503).
    const { sent } = await sendAll(mailer, req, [
      classMail.invitation({ to: body.email, className: view.name, role: body.role, inviterName: user.name, code: view.joinCode!, link: appLink(req, '/classes') }),
    ], { throwIfQueueDown: true }).catch(async (err: unknown) => {
      await revokeClassInvitation(db, id, invitation.id);
      throw err;
    });
    if (mailer) {
      await setInvitationDelivery(db, invitation.id, sent ? 'email' : 'failed', sent ? null : 'the mail server did not take it');
      invitation.delivery = sent ? 'email' : 'failed';
    }
    res.status(201).json(invitation);
  });

  r.delete('/classes/:id/invitations/:invitationId', async (req, res) => {
    const { id } = await requireClass(db, req, 'teach', 'withdraw invitations');
    if (!(await revokeClassInvitation(db, id, pathId(req.params.invitationId, 'invitation')))) throw notFound('no such open invitation');
    res.status(204).end();
  });

  r.get('/classes/:id/lessons', async (req, res) => {
    const { id, role } = await requireClass(db, req, 'read');
    res.json({ lessons: await listLessons(db, id, classCan.teach(role)) });
  });

  r.post('/classes/:id/lessons', async (req, res) => {
    const { user, id } = await requireClass(db, req, 'teach', 'add lessons');
    const body = parseBody(createLessonBody, req);
    res.status(201).json(await createLesson(db, { classId: id, title: body.title, summary: body.summary, createdBy: user.id }));
  });

  r.get('/classes/:id/assignments', async (req, res) => {
    const { user, id, role } = await requireClass(db, req, 'read');
    res.json({ assignments: await listAssignments(db, { classId: id, role, userId: user.id }) });
  });

  return r;
}
