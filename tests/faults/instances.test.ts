// Two Falloff processes on one database behind a loopback round-robin proxy (http-proxy), as several machines
// behind a load balancer: what one instance does, the other sees at once — a sign-out, the rate limits, an
// idempotent save's receipt — and mail queued by either is sent once.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { startFakes, type Fakes } from '../../server/fakes';
import { LIMITS } from '../../server/limits';
import { startChildServer, type ChildServer } from '../support/child';
import { Client, freshEmail, testAddress } from '../support/http';
import { startCluster } from '../support/pg';
import { startProxy } from '../support/server';

let fakes: Fakes;
let a: ChildServer;
let b: ChildServer;
let proxy: Awaited<ReturnType<typeof startProxy>>;
const s3Dir = mkdtempSync(join(tmpdir(), 'falloff-s3-'));
const PASSWORD = 'a fine long password';

beforeAll(async () => {
  startCluster();
  fakes = await startFakes({ s3Dir });
  const env = { FALLOFF_TEST_SMTP_PORT: String(fakes.smtp.port) };
  [a, b] = await Promise.all([startChildServer(env), startChildServer(env)]);
  proxy = await startProxy([a.url, b.url], () => null);
}, 120_000);

afterAll(async () => {
  await proxy?.close();
  await Promise.all([a?.stop(), b?.stop()]);
  await fakes?.close();
  rmSync(s3Dir, { recursive: true, force: true });
});

/** The same person (cookie jar and address) talking to another instance. */
const on = (server: ChildServer, c: Client) => ({
  req: (method: string, path: string, body?: unknown, headers: Record<string, string> = {}) =>
    new Client(server.url, c.address).request(method, path, body, { cookie: c.cookieHeader(), origin: server.url, ...headers }),
});

test('through the proxy a session works on both instances; a sign-out on one is refused on the other at once', async () => {
  const email = freshEmail('two');
  const viaProxy = await new Client(proxy.url).signUp('Two Places', email, PASSWORD);
  // Round robin: consecutive requests land on alternate instances; all see the session.
  for (let i = 0; i < 4; i++) expect((await viaProxy.get('/api/me')).status).toBe(200);

  const c = await new Client(a.url).signIn(email, PASSWORD);
  expect((await on(b, c).req('GET', '/api/me')).status).toBe(200);
  const out = await c.post('/api/auth/sign-out', {});
  expect(out.status).toBe(200);
  const after = await on(b, c).req('GET', '/api/me');
  expect(after.status).toBe(401);
  // A write with the old cookie on the other instance does not go through either.
  expect((await on(b, c).req('POST', '/api/setups', { title: 'After sign-out' })).status).toBe(401);
});

test('rate limits are shared: wrong passwords alternating between the instances stop after the one limit', async () => {
  const email = freshEmail('shared-limit');
  await new Client(a.url).signUp('Shared Limit', email, PASSWORD);
  const statuses: number[] = [];
  for (let i = 0; i < LIMITS.signInAccount.points + 4; i++) {
    const server = i % 2 ? b : a;
    statuses.push((await new Client(server.url, testAddress()).post('/api/auth/sign-in/email', { email, password: `wrong guess ${i}` })).status);
  }
  expect(statuses.filter((s) => s === 401)).toHaveLength(LIMITS.signInAccount.points);
  expect(statuses.slice(LIMITS.signInAccount.points)).toEqual([429, 429, 429, 429]);
});

test('an idempotent save retried on the other instance returns its result (no 409, applied once)', async () => {
  const c = await new Client(a.url).signUp('Saver', freshEmail('saver'), PASSWORD);
  const s = await c.post('/api/setups', { title: 'Retried save' });
  expect(s.status).toBe(201);
  const key = `two-instances-${Date.now().toString(36)}`;
  const first = await on(a, c).req('PUT', `/api/setups/${s.body.id}`, { version: s.body.version, title: 'Saved once' }, { 'idempotency-key': key });
  expect(first.status).toBe(200);
  const retry = await on(b, c).req('PUT', `/api/setups/${s.body.id}`, { version: s.body.version, title: 'Saved once' }, { 'idempotency-key': key });
  expect(retry.status, JSON.stringify(retry.body)).toBe(200);
  expect(retry.headers.get('idempotent-replay')).toBe('true');
  expect(retry.body.version).toBe(first.body.version);
  const now = await on(b, c).req('GET', `/api/setups/${s.body.id}`);
  expect(now.body.version).toBe(s.body.version + 1);
});

test('mail queued through either instance is sent once (both run the queue worker)', async () => {
  const emails = [freshEmail('once-a'), freshEmail('once-b')];
  for (const e of emails) await new Client(a.url).signUp('Once', e, PASSWORD);
  const resets = (to: string) => fakes.inbox.list().filter((m) => m.to.includes(to) && m.subject === 'Reset your Falloff password');
  const r1 = await new Client(a.url).post('/api/auth/request-password-reset', { email: emails[0], redirectTo: '/reset-password' });
  const r2 = await new Client(b.url).post('/api/auth/request-password-reset', { email: emails[1], redirectTo: '/reset-password' });
  expect([r1.status, r2.status]).toEqual([200, 200]);
  await expect.poll(() => resets(emails[0]!).length + resets(emails[1]!).length, { timeout: 30_000, interval: 200 }).toBe(2);
  // Both workers poll the one queue: wait a few polls and see no second copy.
  await new Promise((r) => setTimeout(r, 4_000));
  expect(resets(emails[0]!)).toHaveLength(1);
  expect(resets(emails[1]!)).toHaveLength(1);
});
