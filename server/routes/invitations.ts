// Joining a studio from an invitation link (/studios/join/<token>).
//
// The link's page may be opened signed out: the server then remembers the token in an httpOnly cookie
// (rememberInvitation, mounted on the page's path), the visitor signs up or in, and the library asks
// GET /api/invitations for the invitation this browser carries and offers to join. Accepting needs the token
// and a signed-in user whose e-mail is the invited one.
import type { Request, RequestHandler } from 'express';
import { Router } from 'express';
import type { Db } from '../../db/client';
import { acceptInvitation, previewInvitation } from '../../db/studios';
import { HttpError, notFound } from '../errors';
import { userOf } from '../session';
import { requireVerifiedEmail } from '../verified';

const COOKIE = 'falloff_invite';
const COOKIE_PATH = '/api/invitations';
const TOKEN = /^[A-Za-z0-9_-]{20,100}$/;

export function invitationLink(req: Request, token: string): string {
  const origin = process.env.PUBLIC_URL ?? `${req.protocol}://${req.get('host')}`;
  return `${origin}/studios/join/${token}`;
}

function tokenParam(value: unknown): string {
  if (typeof value !== 'string' || !TOKEN.test(value)) throw notFound('no such invitation');
  return value;
}

function carriedToken(req: Request): string | null {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const [k, v] = part.trim().split('=');
    if (k === COOKIE && v && TOKEN.test(v)) return v;
  }
  return null;
}

/** On the link's page: remember the token for after sign-up / sign-in. */
export const rememberInvitation: RequestHandler = (req, res, next) => {
  const token = req.params.token;
  if (typeof token === 'string' && TOKEN.test(token)) {
    res.cookie(COOKIE, token, { httpOnly: true, sameSite: 'lax', path: COOKIE_PATH, maxAge: 14 * 86_400_000, secure: req.secure });
  }
  next();
};

/** Readable without an account: what the link invites to (the token is the secret). */
export function publicInvitationRoutes(db: Db) {
  const r = Router();
  r.get('/invitations/:token', async (req, res) => {
    const p = await previewInvitation(db, tokenParam(req.params.token));
    if (!p) throw notFound('no such invitation');
    const { studioId: _hidden, ...preview } = p;
    res.json(preview);
  });
  return r;
}

export function invitationRoutes(db: Db) {
  const r = Router();

  r.get('/invitations', async (req, res) => {
    const token = carriedToken(req);
    const p = token ? await previewInvitation(db, token) : null;
    const { studioId: _hidden, ...preview } = p ?? { studioId: '' };
    res.json({ invitation: p && p.status === 'open' ? { ...preview, token } : null });
  });

  r.delete('/invitations', (_req, res) => {
    res.clearCookie(COOKIE, { path: COOKIE_PATH });
    res.status(204).end();
  });

  r.post('/invitations/:token/accept', async (req, res) => {
    const user = userOf(req);
    await requireVerifiedEmail(db, user, 'accept an invitation');
    const result = await acceptInvitation(db, tokenParam(req.params.token), user);
    if (!result.ok) {
      if (result.reason === 'unknown') throw notFound('no such invitation');
      if (result.reason === 'not_open') throw new HttpError(410, 'invitation_closed', 'this invitation was already used, withdrawn or has expired; ask for a new one');
      throw new HttpError(403, 'wrong_email', `this invitation is for another e-mail address; sign in with the invited address`);
    }
    res.clearCookie(COOKIE, { path: COOKIE_PATH });
    res.json({ studioId: result.studioId, role: result.role });
  });

  return r;
}
