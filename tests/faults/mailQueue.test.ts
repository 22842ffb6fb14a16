// The mail queue failing while the database is up (its table gone or locked): a request that would send mail
// answers a clear 503 with Retry-After at once (never a hang, never a 500), undoes what it made, and the same
// request retried once the queue is back makes one thing and delivers one e-mail. The rest of the API keeps
// working meanwhile. The queue is broken for real, in the test database's pg-boss schema.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { startFakes, type Fakes } from '../../server/fakes';
import { startChildServer, type ChildServer } from '../support/child';
import { TEST_DATABASE_URL } from '../support/env';
import { Client, freshEmail, type Res } from '../support/http';
import { startCluster } from '../support/pg';

let fakes: Fakes;
let server: ChildServer;
let sql: pg.Client;
const s3Dir = mkdtempSync(join(tmpdir(), 'falloff-s3-'));

beforeAll(async () => {
  startCluster();
  fakes = await startFakes({ s3Dir });
  server = await startChildServer({ FALLOFF_TEST_SMTP_PORT: String(fakes.smtp.port) });
  sql = new pg.Client({ connectionString: TEST_DATABASE_URL });
  await sql.connect();
}, 90_000);

afterAll(async () => {
  // Whatever happened, leave the queue's table where pg-boss expects it.
  await sql?.query(`do $$ begin if to_regclass('pgboss.job_parked') is not null then alter table pgboss.job_parked rename to job; end if; end $$`).catch(() => undefined);
  await sql?.end().catch(() => undefined);
  await server?.stop();
  await fakes?.close();
  rmSync(s3Dir, { recursive: true, force: true });
});

const mailTo = (to: string) => fakes.inbox.list().filter((m) => m.to.includes(to));

async function confirmed(name: string, email: string): Promise<Client> {
  const c = await new Client(server.url).signUp(name, email, 'a fine long password');
  const until = Date.now() + 30_000;
  let link: string | undefined;
  while (!link && Date.now() < until) {
    link = mailTo(email).map((m) => m.text.match(/https?:\/\/\S*\/api\/auth\/verify-email[^\s"<>]*/)?.[0]).find(Boolean);
    if (!link) await new Promise((r) => setTimeout(r, 100));
  }
  if (!link) throw new Error(`no confirmation mail to ${email}`);
  const v = await c.get(new URL(link).pathname + new URL(link).search);
  expect([200, 302]).toContain(v.status);
  return c;
}

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
    reset: () => new Client(server.url).post('/api/auth/request-password-reset', { email: forgetful, redirectTo: '/reset-password' }),
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
  expect(server.exited()).toBe(false);
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
