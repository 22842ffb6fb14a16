// The mail queue failing while the database is up (its table gone or locked): a request that would send mail
// answers a clear 503 with Retry-After at once (never a hang, never a 500), undoes what it made, and the same
// request retried once the queue is back makes one thing and delivers one e-mail. The rest of the API keeps
// working meanwhile. The queue is broken for real, in the test database's pg-boss schema.
import pg from 'pg';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { TEST_DATABASE_URL } from '../support/env';
import { Client, freshEmail, type Res } from '../support/http';
import { startMailFaults, type MailFaults } from '../support/mailFaults';

let m: MailFaults;
let sql: pg.Client;

beforeAll(async () => {
  m = await startMailFaults();
  sql = new pg.Client({ connectionString: TEST_DATABASE_URL });
  await sql.connect();
}, 90_000);

afterAll(async () => {
  // Whatever happened, leave the queue's table where pg-boss expects it.
  await sql?.query(`do $$ begin if to_regclass('pgboss.job_parked') is not null then alter table pgboss.job_parked rename to job; end if; end $$`).catch(() => undefined);
  await sql?.end().catch(() => undefined);
  await m?.close();
});

const mailTo = (to: string) => m.mailTo(to);
const confirmed = (name: string, email: string) => m.confirmed(name, email);

function expectQueue503(r: Res, what: string) {
  expect(r.status, `${what}: ${JSON.stringify(r.body)}`).toBe(503);
  expect(r.headers.get('retry-after'), what).toMatch(/^\d+$/);
  expect(r.body.error.code, what).toBe('mail_unavailable');
  expect(r.body.error.message, what).toMatch(/try again/);
}

test('queue table gone, database up: 503s with Retry-After, nothing half-made; retried after, one of each arrives', async () => {
  const ownerEmail = freshEmail('qowner');
  const forgetful = freshEmail('qforgetful');
  const invitee = freshEmail('qinvitee');
  const student = freshEmail('qstudent');
  const crew = freshEmail('qcrew');
  const c = await confirmed('Queue Owner', ownerEmail);
  await confirmed('Queue Forgetful', forgetful);
  const studio = (await c.post('/api/studios', { name: 'Queue fault studio' })).body.id as string;
  const klass = (await c.post('/api/classes', { name: 'Queue fault class' })).body.id as string;
  const setup = (await c.post('/api/setups', { studioId: studio, title: 'Queue fault setup' })).body.id as string;
  expect(studio && klass && setup).toBeTruthy();

  await sql.query('alter table pgboss.job rename to job_parked');
  let t0 = Date.now();
  const attempts = {
    invite: () => c.post(`/api/studios/${studio}/members`, { email: invitee, role: 'crew' }),
    classInvite: () => c.post(`/api/classes/${klass}/invitations`, { email: student, role: 'student' }),
    crewMail: () => c.post(`/api/setups/${setup}/send`, { to: [crew], attachPdf: false }),
    reset: () => new Client(m.server.url).post('/api/auth/request-password-reset', { email: forgetful, redirectTo: '/reset-password' }),
  };
  for (const [what, call] of Object.entries(attempts)) expectQueue503(await call(), what);
  const tookMs = Date.now() - t0;
  // The database itself is fine: health says so and ordinary routes answer.
  expect((await c.get('/api/health')).status).toBe(200);
  expect((await c.get(`/api/setups/${setup}`)).status).toBe(200);
  // Nothing half-made: no open invitation, no link made for the unsent crew mail.
  expect((await c.get(`/api/studios/${studio}/invitations`)).body.invitations).toEqual([]);
  expect((await c.get(`/api/classes/${klass}/invitations`)).body.invitations).toEqual([]);
  expect((await c.get(`/api/setups/${setup}/shares`)).body.shares).toEqual([]);

  await sql.query('alter table pgboss.job_parked rename to job');
  t0 = Date.now();
  const again: Record<string, Res> = {};
  for (const [what, call] of Object.entries(attempts)) {
    again[what] = await call();
    expect(again[what]!.status, `${what} retried: ${JSON.stringify(again[what]!.body)}`).toBe(what === 'reset' ? 200 : 201);
  }
  await expect.poll(() => [invitee, student, crew].every((a) => mailTo(a).length === 1) && mailTo(forgetful).some((m) => /reset/i.test(m.subject)), { timeout: 60_000, interval: 250 }).toBe(true);
  const deliveredS = (Date.now() - t0) / 1000;
  await new Promise((r) => setTimeout(r, 3_000));
  for (const a of [invitee, student, crew]) expect(mailTo(a), a).toHaveLength(1);
  expect(mailTo(forgetful).filter((m) => /reset/i.test(m.subject))).toHaveLength(1);
  expect((await c.get(`/api/studios/${studio}/invitations`)).body.invitations).toHaveLength(1);
  expect((await c.get(`/api/classes/${klass}/invitations`)).body.invitations).toHaveLength(1);
  expect((await c.get(`/api/setups/${setup}/shares`)).body.shares).toHaveLength(1);
  expect(m.server.exited()).toBe(false);
  console.log(`[faults] queue gone: four 503s in ${tookMs} ms; after its return the retried mail arrived in ${deliveredS.toFixed(1)} s`);
}, 180_000);

test('queue table locked, database up: the request ends in a 503 within seconds instead of hanging', async () => {
  const c = await confirmed('Lock Owner', freshEmail('lowner'));
  const studio = (await c.post('/api/studios', { name: 'Locked queue studio' })).body.id as string;
  const invitee = freshEmail('linvitee');
  const locker = new pg.Client({ connectionString: TEST_DATABASE_URL });
  await locker.connect();
  try {
    await locker.query('begin');
    await locker.query('lock table pgboss.job in access exclusive mode');
    const t0 = Date.now();
    const r = await c.post(`/api/studios/${studio}/members`, { email: invitee, role: 'editor' });
    const ms = Date.now() - t0;
    expectQueue503(r, 'invitation while the queue is locked');
    expect(ms).toBeLessThan(30_000);
    console.log(`[faults] queue locked: the invitation answered 503 after ${ms} ms`);
    expect((await c.get(`/api/studios/${studio}`)).status).toBe(200);
  } finally {
    await locker.query('rollback').catch(() => undefined);
    await locker.end();
  }
  const retry = await c.post(`/api/studios/${studio}/members`, { email: invitee, role: 'editor' });
  expect(retry.status, JSON.stringify(retry.body)).toBe(201);
  await expect.poll(() => mailTo(invitee).length, { timeout: 60_000, interval: 250 }).toBe(1);
  expect((await c.get(`/api/studios/${studio}/invitations`)).body.invitations).toHaveLength(1);
}, 180_000);

test('sign-up while the queue refuses: a 503 (the same for a taken address), no account left behind; later the same sign-up works', async () => {
  const taken = freshEmail('qtaken');
  await confirmed('Queue Taken', taken);
  const email = freshEmail('qsignup');
  const first = `Refused${Date.now().toString(36)}`;
  const signUp = (address: string) => new Client(m.server.url).post('/api/auth/sign-up/email', { name: `${first} Person`, email: address, password: 'a fine long password' });

  await sql.query('alter table pgboss.job rename to job_parked');
  let fresh: Res;
  let existing: Res;
  try {
    fresh = await signUp(email);
    existing = await signUp(taken);
  } finally {
    await sql.query('alter table pgboss.job_parked rename to job');
  }
  for (const [what, r] of [['new address', fresh], ['taken address', existing]] as const) {
    expect(r.status, `${what}: ${JSON.stringify(r.body)}`).toBe(503);
    expect(r.headers.get('retry-after'), what).toMatch(/^\d+$/);
    expect(r.body.error.code, what).toBe('mail_unavailable');
  }
  // Who has an account is not told, even now.
  expect(existing.body).toEqual(fresh.body);
  // Nothing is left of the refused account: no user, no personal studio, no way to sign in.
  expect((await sql.query('select count(*)::int as n from "user" where email = $1', [email])).rows[0].n).toBe(0);
  expect((await sql.query('select count(*)::int as n from studios where name = $1', [`${first}'s studio`])).rows[0].n).toBe(0);
  expect((await new Client(m.server.url).post('/api/auth/sign-in/email', { email, password: 'a fine long password' })).status).toBe(401);

  // With the queue back the same sign-up goes through and its confirmation arrives (one).
  const again = await signUp(email);
  expect(again.status, JSON.stringify(again.body)).toBe(200);
  await expect.poll(() => mailTo(email).length, { timeout: 60_000, interval: 250 }).toBe(1);
  const c = new Client(m.server.url);
  const link = new URL(mailTo(email)[0]!.text.match(/https?:\/\/\S*\/api\/auth\/verify-email[^\s"<>]*/)![0]);
  expect([200, 302]).toContain((await c.get(link.pathname + link.search)).status);
  expect((await sql.query('select email_verified from "user" where email = $1', [email])).rows[0].email_verified).toBe(true);
  expect(m.server.exited()).toBe(false);
}, 180_000);
