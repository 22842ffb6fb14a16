// Rate limits, counted in PostgreSQL (server/limits.ts): each answers 429 with Retry-After and a message
// naming what was limited. (The same limits across two server processes: tests/api/instances.test.ts.)
import { describe, expect, inject, it } from 'vitest';
import { LIMITS } from '../../server/limits';
import { recordFigure } from '../support/redteam';
import { Client, freshEmail, testAddress, type Res } from '../support/http';
import { FRESH_PASSWORD, fresh, newSetup } from './fixtures';

const base = inject('baseUrl');

function expectLimited(r: Res, what: RegExp) {
  expect(r.status, JSON.stringify(r.body)).toBe(429);
  expect(Number(r.headers.get('retry-after'))).toBeGreaterThan(0);
  expect(r.body.error.code).toBe('rate_limited');
  expect(r.body.error.message).toMatch(what);
  expect(r.body.error.message).toMatch(/try again in \d+ (s|min)/);
}

/** Run `n` calls one after another; the statuses in order. */
async function statuses(n: number, call: (i: number) => Promise<Res>): Promise<Res[]> {
  const out: Res[] = [];
  for (let i = 0; i < n; i++) out.push(await call(i));
  return out;
}

describe('sign-in', () => {
  it('wrong passwords for one account stop after 10, from whatever addresses, and then even the right one waits', async () => {
    const email = freshEmail('target');
    await new Client(base).signUp('Target', email, FRESH_PASSWORD);
    // A fresh address for each try: the account's own limit is what holds.
    const tries = await statuses(14, () => new Client(base).post('/api/auth/sign-in/email', { email, password: 'wrong password here' }));
    expect(tries.slice(0, LIMITS.signInAccount.points).map((r) => r.status)).toEqual(Array(LIMITS.signInAccount.points).fill(401));
    for (const r of tries.slice(LIMITS.signInAccount.points)) expectLimited(r, /sign-in attempts for this account/);
    expectLimited(await new Client(base).post('/api/auth/sign-in/email', { email: email.toUpperCase(), password: FRESH_PASSWORD }), /sign-in attempts/);
  });

  it('a minute-long guessing burst (six at a time, each from its own address) gets 10 passwords checked, the rest 429', async () => {
    const email = freshEmail('burst-target');
    await new Client(base).signUp('Burst Target', email, FRESH_PASSWORD);
    const t0 = Date.now();
    let checked = 0;
    let refused = 0;
    let sent = 0;
    await Promise.all(
      Array.from({ length: 6 }, async () => {
        while (Date.now() - t0 < 60_000 && sent < 300) {
          sent++;
          const r = await new Client(base).post('/api/auth/sign-in/email', { email, password: `guess number ${sent}` });
          if (r.status === 401) checked++;
          else if (r.status === 429) refused++;
          else throw new Error(`unexpected ${r.status} ${JSON.stringify(r.body)}`);
        }
      }),
    );
    const minutes = Math.max(1, (Date.now() - t0) / 60_000);
    recordFigure('wrongPasswords', `${(checked / minutes).toFixed(0)} a minute (${checked} checked, ${refused} refused with 429, of ${sent} sent in ${((Date.now() - t0) / 1000).toFixed(0)} s)`, 'tests/api/limits.test.ts: wrong passwords for one account, six in flight, each from a fresh address');
    expect(checked).toBe(LIMITS.signInAccount.points);
    expect(refused).toBe(sent - checked);
  });

  it('one address trying many accounts stops after 30 failures', async () => {
    const address = testAddress();
    const tries = await statuses(33, () => new Client(base, address).post('/api/auth/sign-in/email', { email: freshEmail('guess'), password: 'guessed password' }));
    expect(tries.filter((r) => r.status === 401)).toHaveLength(LIMITS.signInAddress.points);
    expectLimited(tries.at(-1)!, /failed sign-ins from your network address/);
  });

  it('successful sign-ins do not count', async () => {
    const email = freshEmail('regular');
    const address = testAddress();
    await new Client(base, address).signUp('Regular', email, FRESH_PASSWORD);
    const tries = await statuses(LIMITS.signInAccount.points + 5, () => new Client(base, address).post('/api/auth/sign-in/email', { email, password: FRESH_PASSWORD }));
    expect(tries.map((r) => r.status)).toEqual(Array(tries.length).fill(200));
  });
});

it('sign-ups from one address stop after 20 an hour', async () => {
  const address = testAddress();
  const tries = await statuses(LIMITS.signUp.points + 1, () => new Client(base, address).post('/api/auth/sign-up/email', { name: 'Bulk', email: freshEmail('bulk'), password: FRESH_PASSWORD }));
  expect(tries.slice(0, -1).map((r) => r.status)).toEqual(Array(LIMITS.signUp.points).fill(200));
  expectLimited(tries.at(-1)!, /accounts made from your network address/);
});

it('password reset e-mails for one address stop after 3 an hour', async () => {
  const u = await fresh(base, 'Forgetful Fen');
  const tries = await statuses(4, () => new Client(base).post('/api/auth/request-password-reset', { email: u.email, redirectTo: '/reset-password' }));
  expect(tries.slice(0, 3).map((r) => r.status)).toEqual([200, 200, 200]);
  expectLimited(tries[3]!, /password reset e-mails for this address/);
});

it('join codes: 10 tries in 10 minutes per user', async () => {
  const u = await fresh(base, 'Code Guesser');
  const tries = await statuses(11, (i) => u.client.post('/api/classes/join', { code: `ZZZZ${(1000 + i).toString(36).toUpperCase()}` }));
  expect(tries.slice(0, 10).map((r) => r.status)).toEqual(Array(10).fill(404));
  expectLimited(tries[10]!, /join code tries/);
});

it('invitations: 100 an hour per user, studio and class invitations together', async () => {
  const u = await fresh(base, 'Eager Inviter');
  const studio = await u.client.post('/api/studios', { name: 'Invites galore' });
  expect(studio.status).toBe(201);
  const cls = await u.client.post('/api/classes', { name: 'Invites class' });
  expect(cls.status).toBe(201);
  const tries = await statuses(LIMITS.invite.points + 1, (i) =>
    i % 2 ? u.client.post(`/api/classes/${cls.body.id}/invitations`, { email: freshEmail('student'), role: 'student' }) : u.client.post(`/api/studios/${studio.body.id}/members`, { email: freshEmail('crew'), role: 'crew' }),
  );
  expect(tries.slice(0, -1).every((r) => r.status === 201), JSON.stringify(tries.find((r) => r.status !== 201)?.body)).toBe(true);
  expectLimited(tries.at(-1)!, /invitations/);
}, 120_000);

it('exports: 120 in 10 minutes per user', async () => {
  const u = await fresh(base, 'Export Hoarder');
  const s = await newSetup(u.client, { title: 'Exported often' });
  const tries = await statuses(LIMITS.export.points + 1, () => u.client.get(`/api/setups/${s.id}/plan.svg`));
  expect(tries.slice(0, -1).every((r) => r.status === 200)).toBe(true);
  expectLimited(tries.at(-1)!, /exports/);
}, 120_000);

it('uploads: 100 an hour per user (counted before the file is read)', async () => {
  const u = await fresh(base, 'Upload Flood');
  const s = await newSetup(u.client, { title: 'Photos galore' });
  const tries = await statuses(LIMITS.upload.points + 1, () => u.client.post(`/api/setups/${s.id}/photos`, {}));
  expect(tries.slice(0, -1).every((r) => r.status === 400 || r.status === 415), JSON.stringify(tries[0]!.body)).toBe(true);
  expectLimited(tries.at(-1)!, /photo uploads/);
}, 120_000);
