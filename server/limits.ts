// Rate limits shared by every server process: the counters live in PostgreSQL (table rate_limits, through
// rate-limiter-flexible's Drizzle store, one atomic upsert per use), so two instances allow what one would.
// Over a limit the API answers 429 with Retry-After and says what was limited and for how long.
import type { Request, RequestHandler } from 'express';
import { isIP } from 'node:net';
import { RateLimiterDrizzle, RateLimiterRes } from 'rate-limiter-flexible';
import type { Db } from '../db/client';
import { rateLimits } from '../db/schema';
import { HttpError } from './errors';

export type LimitRule = { points: number; durationS: number; what: string };

/** Each limit: how many uses per window, and how the 429 names it. */
export const LIMITS = {
  /** Sign-in attempts per account; a successful sign-in gives its point back, so failures are what count. */
  signInAccount: { points: 10, durationS: 15 * 60, what: 'sign-in attempts for this account' },
  /** Sign-in attempts per network address (failures, as above), whichever accounts they try. */
  signInAddress: { points: 30, durationS: 15 * 60, what: 'failed sign-ins from your network address' },
  signUp: { points: 20, durationS: 60 * 60, what: 'accounts made from your network address' },
  resetAddress: { points: 10, durationS: 60 * 60, what: 'password reset requests from your network address' },
  resetAccount: { points: 3, durationS: 60 * 60, what: 'password reset e-mails for this address' },
  /** Studio and class invitations sent by one user. */
  invite: { points: 100, durationS: 60 * 60, what: 'invitations' },
  /** Join-code tries by one user. */
  join: { points: 10, durationS: 10 * 60, what: 'join code tries' },
  /** Crew-sheet e-mails sent by one user. */
  mail: { points: 10, durationS: 10 * 60, what: 'e-mails' },
  upload: { points: 100, durationS: 60 * 60, what: 'photo uploads' },
  /** PNG / SVG / PDF exports per user, or per network address for share links. */
  export: { points: 120, durationS: 10 * 60, what: 'exports' },
} satisfies Record<string, LimitRule>;

export type LimitName = keyof typeof LIMITS;
export type Limits = ReturnType<typeof createLimits>;

const minutes = (s: number) => (s < 90 ? `${s} s` : `${Math.ceil(s / 60)} min`);

/** The key for a network address: IPv4 as is, IPv6 by its /64 (one subscriber's usual allocation). */
export function addressKey(req: Request | { ip?: string }): string {
  const ip = (req.ip ?? 'unknown').replace(/^::ffff:/, '');
  if (isIP(ip) !== 6) return ip;
  const full = ip.includes('::') ? expand(ip) : ip.split(':');
  return `${full.slice(0, 4).join(':')}::/64`;
}
function expand(ip: string): string[] {
  const [head, tail] = ip.split('::') as [string, string];
  const h = head ? head.split(':') : [];
  const t = tail ? tail.split(':') : [];
  return [...h, ...Array(8 - h.length - t.length).fill('0'), ...t];
}

export function createLimits(db: Db, overrides: Partial<Record<LimitName, Partial<LimitRule>>> = {}) {
  const rules = Object.fromEntries(Object.entries(LIMITS).map(([k, v]) => [k, { ...v, ...overrides[k as LimitName] }])) as Record<LimitName, LimitRule>;
  const limiters = Object.fromEntries(
    Object.entries(rules).map(([name, rule]) => [
      name,
      new RateLimiterDrizzle({ storeClient: db, schema: rateLimits, keyPrefix: name, points: rule.points, duration: rule.durationS, clearExpiredByTimeout: false }),
    ]),
  ) as Record<LimitName, RateLimiterDrizzle>;

  const tooMany = (name: LimitName, res: RateLimiterRes) => {
    const rule = rules[name];
    const retryAfterS = Math.max(1, Math.ceil(res.msBeforeNext / 1000));
    return new HttpError(429, 'rate_limited', `too many ${rule.what}: at most ${rule.points} in ${minutes(rule.durationS)}; try again in ${minutes(retryAfterS)}`, { limit: name, retryAfterS });
  };

  /** Count `points` uses of `name` for `key`; throws a 429 HttpError when over the limit. */
  const take = async (name: LimitName, key: string, points = 1): Promise<void> => {
    try {
      await limiters[name].consume(key, points);
    } catch (err) {
      if (err instanceof RateLimiterRes) throw tooMany(name, err);
      throw err;
    }
  };
  /** Give back a use (a successful sign-in does not count against the account). */
  const giveBack = async (name: LimitName, key: string, points = 1): Promise<void> => {
    await limiters[name].reward(key, points);
  };
  /** Express middleware: count one use per request, keyed by the signed-in user (or the address without one). */
  const perRequest =
    (name: LimitName, keyOf: (req: Request) => string = (req) => req.user?.id ?? addressKey(req)): RequestHandler =>
    async (req, _res, next) => {
      try {
        await take(name, keyOf(req));
        next();
      } catch (err) {
        next(err);
      }
    };
  return { rules, take, giveBack, perRequest };
}
