// One origin rule for every state-changing request, ours and better-auth's: a browser request that changes
// something (POST, PUT, PATCH, DELETE) must come from a page of this app's own origin. A page on another
// origin of the same site (another port, another subdomain) gets a 403, even though SameSite=Lax would send
// the cookie along.
//
// Trusted origins: PUBLIC_URL (or the address the server listens on), plus TRUSTED_ORIGINS (comma-separated,
// e.g. the Metro dev server of `npm run dev`). A request with no Origin header is judged by Sec-Fetch-Site
// (browsers send one or the other); a request with neither comes from a program, not a page, and carries no
// ambient cookie to abuse.
import type { RequestHandler } from 'express';
import { HttpError } from './errors';

function originOf(url: string): string | null {
  try {
    const u = new URL(url);
    return u.protocol === 'http:' || u.protocol === 'https:' ? u.origin : null;
  } catch {
    return null;
  }
}

/** The origins allowed to change things: the app's own URL and TRUSTED_ORIGINS. */
export function trustedOrigins(appUrl: string, extra = process.env.TRUSTED_ORIGINS ?? ''): string[] {
  const list = [appUrl, ...extra.split(',')].map((s) => s.trim()).filter(Boolean).map(originOf);
  return [...new Set(list.filter((o): o is string => !!o))];
}

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

export function requireSameOrigin(trusted: string[]): RequestHandler {
  const allowed = new Set(trusted);
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const origin = req.get('origin');
    if (origin !== undefined) {
      // The origin the request was addressed to (Host, or X-Forwarded-Host/Proto from a trusted proxy).
      if (allowed.has(origin) || origin === `${req.protocol}://${req.get('host')}`) return next();
      return next(new HttpError(403, 'cross_origin', `requests that change something must come from ${[...allowed][0] ?? 'this app'}, not from ${origin.slice(0, 200)}`));
    }
    const site = req.get('sec-fetch-site');
    if (site === undefined || site === 'same-origin' || site === 'none') return next();
    next(new HttpError(403, 'cross_origin', 'requests that change something must come from this app’s own pages'));
  };
}
