// Reads the better-auth session from the request's cookie; API routes below `requireUser` get `req.user`.
//
// Every request asks the database for its session (requireUser: one query): nothing is remembered in this
// process beyond the request, so a session ended on one server process (sign-out, password change or reset,
// expiry) is refused at once by every other process sharing the database.
//
// better-auth answers "no session" (and, on its own routes, a bare 500 or a 401) when the database cannot be reached;
// both are told apart from a real "signed out" here by asking PostgreSQL once, and become a 503 with
// Retry-After, so a client keeps its session and retries instead of signing its user out.
import { mailOutcome, RESET_PATHS, SIGN_UP_PATH, type MailOutcome } from './mail/mailOutcome';
import { toNodeHandler } from 'better-auth/node';
import { createHmac, timingSafeEqual } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import type { RequestHandler } from 'express';
import { databaseAnswers, type Db } from '../db/client';
import { removeUnconfirmedSignUp, sessionUser } from '../db/sessions';
import type { Auth } from './auth';
import { DB_RETRY_AFTER_S, HttpError, isDatabaseUnavailable } from './errors';
import { addressKey, type Limits } from './limits';

export type SessionUser = { id: string; name: string; email: string; units: 'metric' | 'imperial'; paper: 'a4' | 'letter' };

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: SessionUser;
    }
  }
}

/** The session cookie's value (better-auth names it `…session_token`, with a `__Secure-` prefix on HTTPS). */
function sessionCookie(req: IncomingMessage): string | null {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const i = part.indexOf('=');
    if (i > 0 && part.slice(0, i).trim().endsWith('session_token')) return part.slice(i + 1).trim();
  }
  return null;
}

const unavailable = () => new HttpError(503, 'database_unavailable', `the database cannot be reached just now; try again in ${DB_RETRY_AFTER_S} s`, { retryAfterS: DB_RETRY_AFTER_S });

/**
 * The session token inside a signed session cookie (better-auth signs `token.signature` with HMAC-SHA-256 of the
 * auth secret, base64, URL-encoded), or null when it is not one this server signed.
 */
function verifiedSessionToken(cookieValue: string, secret: string): string | null {
  let value: string;
  try {
    value = decodeURIComponent(cookieValue);
  } catch {
    return null;
  }
  const dot = value.lastIndexOf('.');
  if (dot < 1) return null;
  const token = value.slice(0, dot);
  const given = Buffer.from(value.slice(dot + 1), 'base64');
  const want = createHmac('sha256', secret).update(token).digest();
  return given.length === want.length && timingSafeEqual(given, want) ? token : null;
}

/**
 * API routes below this get `req.user`. The session is read as better-auth writes it — the signed cookie checked
 * here, then one prepared query for the unexpired session and its user — rather than through better-auth's own
 * getSession, which costs several times as much per request (its endpoint machinery, WebCrypto, two queries).
 * Sessions are still asked of the database on every request; better-auth's own routes (sign-in, sign-out,
 * get-session, which also extends a session's life) are untouched. A database that cannot be asked is a 503.
 */
export function requireUser(auth: Auth, db: Db): RequestHandler {
  const secret = auth.options.secret;
  if (!secret) throw new Error('requireUser: the auth instance has no secret');
  return async (req, _res, next) => {
    try {
      const cookie = sessionCookie(req);
      const token = cookie ? verifiedSessionToken(cookie, secret) : null;
      const u = token ? await sessionUser(db, token) : null;
      if (!u) return next(new HttpError(401, 'unauthenticated', 'sign in first'));
      req.user = {
        id: u.id,
        name: u.name,
        email: u.email,
        units: u.units === 'imperial' ? 'imperial' : 'metric',
        paper: u.paper === 'letter' ? 'letter' : 'a4',
      };
      next();
    } catch (err) {
      next(isDatabaseUnavailable(err) ? unavailable() : err);
    }
  };
}

const json = (status: number, body: unknown, headers: Record<string, string> = {}) =>
  new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json', ...headers } });

/** The e-mail in a sign-in or reset body, lower-cased ('' when there is none). */
async function emailOf(request: Request): Promise<string> {
  try {
    const b = (await request.clone().json()) as { email?: unknown };
    return typeof b?.email === 'string' ? b.email.trim().toLowerCase().slice(0, 320) : '';
  } catch {
    return '';
  }
}

/**
 * The limits in front of better-auth's routes (shared by every process, server/limits.ts): sign-in attempts per
 * account and per address (a success gives its points back), sign-ups and reset requests per address, reset
 * e-mails per account. Returns what to give back when the attempt succeeds.
 */
async function limitAuth(limits: Limits, request: Request, address: string): Promise<(() => Promise<void>) | null> {
  if (request.method !== 'POST') return null;
  const path = new URL(request.url).pathname.replace(/^\/api\/auth/, '');
  if (path === '/sign-in/email') {
    const email = await emailOf(request);
    await limits.take('signInAddress', address);
    if (email) await limits.take('signInAccount', email);
    return async () => {
      await limits.giveBack('signInAddress', address);
      if (email) await limits.giveBack('signInAccount', email);
    };
  }
  if (path === '/sign-up/email') await limits.take('signUp', address);
  if (path === '/request-password-reset' || path === '/forget-password') {
    const email = await emailOf(request);
    await limits.take('resetAddress', address);
    if (email) await limits.take('resetAccount', email);
  }
  return null;
}

/** better-auth's own routes (/api/auth/*): rate-limited, and with a lost database answered 503 + Retry-After
 *  instead of a 500, a 401 or "no session". */
export function authHandler(auth: Auth, db: Db, limits: Limits, o: { mail: boolean }): RequestHandler {
  return (req, res) =>
    toNodeHandler({ handler: (request: Request) => handleMailing(db, o.mail, request, () => handleAuth(auth, db, limits, request, addressKey(req))) })(req, res);
}

const MAIL_RETRY_AFTER_S = 60;
const mailUnavailable = (what: string, why: string) =>
  json(503, { error: { code: 'mail_unavailable', message: `${what} cannot be sent just now (${why}); nothing was sent, try again later`, retryAfterS: MAIL_RETRY_AFTER_S } }, { 'retry-after': String(MAIL_RETRY_AFTER_S) });

/**
 * A reset answers 200 only once its e-mail is stored in the durable mail queue. Without a mail service every
 * reset gets the same 503 (so the answer never says whether the account exists); a message the queue did not
 * take turns better-auth's 200 into a 503.
 * A sign-up likewise: when its confirmation e-mail (or, for an address that has an account, the notice to its
 * owner) is not queued, the account just made is removed and the answer is a 503 (the same words either way), so
 * the person signs up again later instead of holding an account no mail can confirm. (Without any mail service,
 * the local demo, a sign-up stays unconfirmed as before: nothing could be queued.)
 */
async function handleMailing(db: Db, mail: boolean, request: Request, next: () => Promise<Response>): Promise<Response> {
  if (request.method !== 'POST') return next();
  const path = new URL(request.url).pathname.replace(/^\/api\/auth/, '');
  const reset = RESET_PATHS.has(path);
  if (!reset && path !== SIGN_UP_PATH) return next();
  if (reset && !mail) return mailUnavailable('a password reset e-mail', 'this server has no mail service set up');
  const outcome: MailOutcome = { failed: null };
  const response = await mailOutcome.run(outcome, next);
  if (response.status !== 200 || !outcome.failed) return response;
  if (reset) return mailUnavailable('a password reset e-mail', 'the mail queue did not take the message');
  if (outcome.createdUserId) {
    // Better the account gone than one that can never be confirmed; should the database refuse this too, the
    // person can still sign in and ask for a new confirmation mail once the queue is back.
    await removeUnconfirmedSignUp(db, outcome.createdUserId).catch(() => undefined);
  }
  return mailUnavailable('the e-mail that confirms a new account', 'the mail queue did not take the message');
}

/** A password change always ends the account's other sessions (better-auth does so only when asked). */
async function endOtherSessionsOnChange(request: Request): Promise<Request> {
  if (request.method !== 'POST' || !new URL(request.url).pathname.endsWith('/change-password')) return request;
  let body: Record<string, unknown>;
  try {
    body = (await request.clone().json()) as Record<string, unknown>;
  } catch {
    return request; // better-auth answers the bad body
  }
  if (!body || typeof body !== 'object' || Array.isArray(body)) return request;
  const headers = new Headers(request.headers);
  headers.delete('content-length');
  return new Request(request.url, { method: 'POST', headers, body: JSON.stringify({ ...body, revokeOtherSessions: true }) });
}

/** When this process last found the database unreachable from an auth request (ms since the epoch). */
let lastUnreachableAt = 0;
const RECENTLY_DOWN_MS = 2 * DB_RETRY_AFTER_S * 1000;

async function handleAuth(auth: Auth, db: Db, limits: Limits, incoming: Request, address: string): Promise<Response> {
  const request = await endOtherSessionsOnChange(incoming);
  let onSuccess: (() => Promise<void>) | null;
  try {
    onSuccess = await limitAuth(limits, request, address);
  } catch (err) {
    if (err instanceof HttpError) {
      return json(err.status, { error: { code: err.code, message: err.message, ...err.extra } }, err.extra.retryAfterS ? { 'retry-after': String(err.extra.retryAfterS) } : {});
    }
    if (isDatabaseUnavailable(err)) {
      lastUnreachableAt = Date.now();
      return json(503, { error: { code: 'database_unavailable', message: unavailable().message, retryAfterS: DB_RETRY_AFTER_S } }, { 'retry-after': String(DB_RETRY_AFTER_S) });
    }
    throw err;
  }
  const response = await auth.handler(request);
  if (onSuccess && response.status === 200) await onSuccess().catch(() => undefined);
  // A failed lookup can surface as a 500, as "invalid e-mail or password" or as "no session".
  const maybeDown =
    response.status >= 400 || (request.method === 'GET' && new URL(request.url).pathname.endsWith('/get-session') && !!request.headers.get('cookie')?.includes('session_token') && (await response.clone().text()) === 'null');
  // better-auth answers a failed query with a 500 of its own. When the database is back by the time we ask (a
  // restart's first moment: "the database system is starting up"), a 5xx within a few seconds of it being
  // unreachable is that outage too, not a fault of the request.
  if (maybeDown && (!(await databaseAnswers(db)) ? ((lastUnreachableAt = Date.now()), true) : response.status >= 500 && Date.now() - lastUnreachableAt < RECENTLY_DOWN_MS)) {
    return json(503, { error: { code: 'database_unavailable', message: unavailable().message, retryAfterS: DB_RETRY_AFTER_S } }, { 'retry-after': String(DB_RETRY_AFTER_S) });
  }
  return response;
}

/** The signed-in user of a request that passed `requireUser`. */
export function userOf(req: Express.Request): SessionUser {
  if (!req.user) throw new HttpError(401, 'unauthenticated', 'sign in first');
  return req.user;
}
