// The session as API routes read it (server/session.ts `requireUser`: the signed cookie checked, then one query for
// the unexpired session and its user): a good cookie passes, a cookie whose signature was changed or that names
// another token does not, and neither does a session past its end or one deleted (signed out).
import { afterAll, describe, expect, inject, it } from 'vitest';
import { createDb } from '../../db/client';
import { TEST_DATABASE_URL } from '../support/env';
import { fresh } from './fixtures';

const base = inject('baseUrl');
const { pool } = createDb(TEST_DATABASE_URL);
afterAll(() => pool.end());

const me = (cookie: string) => fetch(`${base}/api/me`, { headers: { cookie } }).then((r) => r.status);

/** The session cookie of a fresh account: its name, the token and the signature. */
async function session(name: string) {
  const u = await fresh(base, name);
  const [cookieName, value] = u.client
    .cookieHeader()
    .split('; ')
    .map((c) => [c.slice(0, c.indexOf('=')), c.slice(c.indexOf('=') + 1)] as const)
    .find(([k]) => k.endsWith('session_token'))!;
  const raw = decodeURIComponent(value);
  const dot = raw.lastIndexOf('.');
  return { cookieName, token: raw.slice(0, dot), signature: raw.slice(dot + 1), cookie: `${cookieName}=${value}` };
}

describe('the session cookie on API routes', () => {
  it('passes when signed by this server, and not with a changed signature or another token under it', async () => {
    const s = await session('Cookie Cato');
    expect(await me(s.cookie)).toBe(200);
    const flipped = s.signature.slice(0, 5) + (s.signature[5] === 'A' ? 'B' : 'A') + s.signature.slice(6);
    expect(await me(`${s.cookieName}=${encodeURIComponent(`${s.token}.${flipped}`)}`)).toBe(401);
    const other = await session('Cookie Cleo');
    expect(await me(`${s.cookieName}=${encodeURIComponent(`${other.token}.${s.signature}`)}`)).toBe(401);
    expect(await me(`${s.cookieName}=${encodeURIComponent(s.token)}`)).toBe(401);
    expect(await me(`${s.cookieName}=%E0%A4%A`)).toBe(401);
  });

  it('is refused once the session has ended or is gone', async () => {
    const s = await session('Cookie Cyd');
    expect(await me(s.cookie)).toBe(200);
    await pool.query(`update session set expires_at = now() - interval '1 minute' where token = $1`, [s.token]);
    expect(await me(s.cookie)).toBe(401);
    const t = await session('Cookie Coby');
    await pool.query(`delete from session where token = $1`, [t.token]);
    expect(await me(t.cookie)).toBe(401);
  });
});
