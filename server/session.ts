// Reads the better-auth session from the request's cookie; API routes below `requireUser` get `req.user`.
import { fromNodeHeaders } from 'better-auth/node';
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

export function requireUser(auth: Auth): RequestHandler {
  return async (req, _res, next) => {
    try {
      const s = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
      if (!s) return next(new HttpError(401, 'unauthenticated', 'sign in first'));
      const u = s.user as typeof s.user & { units?: string; paper?: string };
      req.user = {
        id: u.id,
        name: u.name,
        email: u.email,
        units: u.units === 'imperial' ? 'imperial' : 'metric',
        paper: u.paper === 'letter' ? 'letter' : 'a4',
      };
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
