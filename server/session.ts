// Reads the better-auth session from the request's cookie; API routes below `requireUser` get `req.user`.
//
// A session that better-auth has just confirmed is remembered in this process for a few seconds, keyed by
// the exact signed cookie value, so a busy client (autosave, the library's pages) does not cost a session
// lookup per request. Signing out through this server forgets it at once (forgetSession, mounted before
// better-auth's sign-out); a session ended any other way (expiry in the database, another server process)
// is still honoured here for at most SESSION_CACHE_MS.
import { fromNodeHeaders } from 'better-auth/node';
import type { IncomingMessage } from 'node:http';
import type { RequestHandler } from 'express';
import type { Auth } from './auth';
import { HttpError } from './errors';

export type SessionUser = { id: string; name: string; email: string; units: 'metric' | 'imperial'; paper: 'a4' | 'letter' };

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: SessionUser;
    }
  }
}

export const SESSION_CACHE_MS = 10_000;
const MAX_CACHED = 5_000;
const cache = new Map<string, { user: SessionUser; until: number }>();

/** The session cookie's value (better-auth names it `…session_token`, with a `__Secure-` prefix on HTTPS). */
function sessionCookie(req: IncomingMessage): string | null {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const i = part.indexOf('=');
    if (i > 0 && part.slice(0, i).trim().endsWith('session_token')) return part.slice(i + 1).trim();
  }
  return null;
}

/** Before better-auth handles a sign-out: drop the session from the cache. */
export const forgetSession: RequestHandler = (req, _res, next) => {
  const key = sessionCookie(req);
  if (key) cache.delete(key);
  next();
};

export function requireUser(auth: Auth): RequestHandler {
  return async (req, _res, next) => {
    try {
      const key = sessionCookie(req);
      if (!key) return next(new HttpError(401, 'unauthenticated', 'sign in first'));
      const hit = cache.get(key);
      if (hit && hit.until > Date.now()) {
        req.user = hit.user;
        return next();
      }
      const s = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
      if (!s) {
        cache.delete(key);
        return next(new HttpError(401, 'unauthenticated', 'sign in first'));
      }
      const u = s.user as typeof s.user & { units?: string; paper?: string };
      req.user = {
        id: u.id,
        name: u.name,
        email: u.email,
        units: u.units === 'imperial' ? 'imperial' : 'metric',
        paper: u.paper === 'letter' ? 'letter' : 'a4',
      };
      if (cache.size >= MAX_CACHED) cache.delete(cache.keys().next().value!);
      cache.set(key, { user: req.user, until: Math.min(Date.now() + SESSION_CACHE_MS, new Date(s.session.expiresAt).getTime()) });
      next();
    } catch (err) {
      next(err);
    }
  };
}

/** The signed-in user of a request that passed `requireUser`. */
export function userOf(req: Express.Request): SessionUser {
  if (!req.user) throw new HttpError(401, 'unauthenticated', 'sign in first');
  return req.user;
}
