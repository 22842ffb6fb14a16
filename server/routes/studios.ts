// Studios, their members and invitations. Owners manage members; every member sees who is in the studio;
// a non-member gets 404 for everything of a studio.
import type { Request } from 'express';
import { Router } from 'express';
import type { Db } from '../../db/client';
import {
  changeMember,
  createInvitation,
  createStudio,
  isMemberByEmail,
  isPersonalStudio,
  listInvitations,
  listMembers,
  updateStudio,
  revokeInvitation,
  studioRoleOf,
  studioViewsOf,
} from '../../db/studios';
import { createStudioBody, inviteMemberBody, updateMemberBody, updateStudioBody, type InvitationCreated, type StudioRole } from '../../model/api';
import { pathId, studioCan } from '../access';
import { HttpError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { MailQueueUnavailable } from '../mail/queue';
import { invitationMessage } from '../mail/messages';
import { userOf } from '../session';
import { parseBody } from '../validate';
import { requireVerifiedEmail } from '../verified';
import { invitationLink } from './invitations';

type StudioNeed = 'read' | 'manage';

export function studioRoutes(db: Db, mailer?: Mailer) {
  const r = Router();

  /** The studio named in the path, for a caller whose role allows `need`. */
  async function requireStudio(req: Request, need: StudioNeed) {
    const user = userOf(req);
    const id = pathId(req.params.id, 'studio');
    const role = await studioRoleOf(db, user.id, id);
    if (!studioCan.read(role)) throw notFound('no such studio');
    if (need === 'manage' && !studioCan.manageMembers(role)) throw new HttpError(403, 'forbidden', `your role in this studio (${role}) cannot manage it`);
    return { user, id, role: role as StudioRole };
  }

  r.get('/studios', async (req, res) => {
    res.json({ studios: await studioViewsOf(db, userOf(req).id) });
  });

  r.post('/studios', async (req, res) => {
    const body = parseBody(createStudioBody, req);
    res.status(201).json(await createStudio(db, userOf(req).id, body.name));
  });

  r.get('/studios/:id', async (req, res) => {
    const { user, id } = await requireStudio(req, 'read');
    const [view] = await studioViewsOf(db, user.id, id);
    res.json(view);
  });

  r.patch('/studios/:id', async (req, res) => {
    const { user, id } = await requireStudio(req, 'manage');
    const body = parseBody(updateStudioBody, req);
    await updateStudio(db, id, body);
    const [view] = await studioViewsOf(db, user.id, id);
    res.json(view);
  });

  r.get('/studios/:id/members', async (req, res) => {
    const { id } = await requireStudio(req, 'read');
    res.json({ members: await listMembers(db, id) });
  });

  // Adding a member is inviting them: the link signs them up or in and joins them (they must accept).
  r.post('/studios/:id/members', async (req, res) => {
    const { user, id } = await requireStudio(req, 'manage');
    const body = parseBody(inviteMemberBody, req);
    await requireVerifiedEmail(db, user, 'invite people');
    if (body.role === 'owner' && (await isPersonalStudio(db, id))) {
      throw new HttpError(409, 'personal_studio', 'a personal studio has one owner; invite them as editor or crew, or make a shared studio', { fields: { role: 'not owner in a personal studio' } });
    }
    if (await isMemberByEmail(db, id, body.email)) {
      throw new HttpError(409, 'already_member', `${body.email} is already a member; change their role instead`, { fields: { email: 'already a member' } });
    }
    const { invitation, token } = await createInvitation(db, { studioId: id, email: body.email, role: body.role, invitedBy: user });
    const created: InvitationCreated = { invitation, link: invitationLink(req, token) };
    req.log?.info({ studioId: id, invitationId: invitation.id, email: body.email }, 'studio invitation created (link handed to the inviter)');
    // The link is in the answer and the mail queue retries delivery. When the queue itself cannot take the
    // message the invitation is withdrawn again and the answer is a 503 with Retry-After, so the inviter's retry
    // makes one invitation and one e-mail (nothing half-made, nothing silently unsent).
    if (mailer) {
      const [studio] = await studioViewsOf(db, user.id, id);
      try {
        await mailer.send(invitationMessage({ to: body.email, studioName: studio?.name ?? 'a studio', role: body.role, inviterName: user.name, link: created.link, expiresAt: invitation.expiresAt }));
      } catch (err) {
        if (err instanceof MailQueueUnavailable) {
          await revokeInvitation(db, id, invitation.id);
          throw err;
        }
        req.log?.warn({ err, invitationId: invitation.id }, 'invitation e-mail not sent');
      }
    }
    res.status(201).json(created);
  });

  r.patch('/studios/:id/members/:userId', async (req, res) => {
    const { id } = await requireStudio(req, 'manage');
    const body = parseBody(updateMemberBody, req);
    const userId = String(req.params.userId);
    if (body.role === 'owner' && (await isPersonalStudio(db, id))) {
      throw new HttpError(409, 'personal_studio', 'a personal studio has one owner', { fields: { role: 'not owner in a personal studio' } });
    }
    const result = await changeMember(db, id, userId, body.role);
    if (result === 'not_member') throw notFound('no such member of this studio');
    if (result === 'last_owner') throw new HttpError(409, 'last_owner', 'a studio needs an owner: make someone else owner first');
    res.json({ members: await listMembers(db, id) });
  });

  // An owner removes anyone; any member may remove themselves (leave).
  r.delete('/studios/:id/members/:userId', async (req, res) => {
    const userId = String(req.params.userId);
    const leaving = userId === userOf(req).id;
    const { id } = await requireStudio(req, leaving ? 'read' : 'manage');
    const result = await changeMember(db, id, userId, null);
    if (result === 'not_member') throw notFound('no such member of this studio');
    if (result === 'last_owner') throw new HttpError(409, 'last_owner', 'a studio needs an owner: make someone else owner first');
    res.status(204).end();
  });

  r.get('/studios/:id/invitations', async (req, res) => {
    const { id } = await requireStudio(req, 'manage');
    res.json({ invitations: await listInvitations(db, id) });
  });

  r.delete('/studios/:id/invitations/:invitationId', async (req, res) => {
    const { id } = await requireStudio(req, 'manage');
    if (!(await revokeInvitation(db, id, pathId(req.params.invitationId, 'invitation')))) throw notFound('no such open invitation');
    res.status(204).end();
  });

  return r;
}
