// PostgreSQL stops during traffic and comes back: the server (its own process) never exits, answers 503 with
// Retry-After and a JSON error meanwhile (never a 500), and serves again within a few seconds of the return.
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { recordFigure } from '../support/redteam';
import { startChildServer, type ChildServer } from '../support/child';
import { Client, freshEmail } from '../support/http';
import { TEST_DATABASE_URL } from '../support/env';
import { clusterRunning, startCluster, startClusterAsync, stopClusterAsync } from '../support/pg';

let server: ChildServer;

beforeAll(async () => {
  startCluster();
  server = await startChildServer();
});

afterAll(async () => {
  // Whatever happened above, the cluster runs again for whatever comes next.
  startCluster();
  await server?.stop();
});

type Hit = { from: number; at: number; what: string; status: number; retryAfter: string | null; json: boolean; code?: string };

test('a database restart during traffic: 503s with Retry-After, no 500, no exit, back within seconds', async () => {
  const user = await new Client(server.url).signUp('Fault Tester', freshEmail('fault'), 'a fine long password');
  const created = await user.post('/api/setups', { title: 'Survives a restart' });
  expect(created.status).toBe(201);
  const anon = new Client(server.url);

  const hits: Hit[] = [];
  const t0 = Date.now();
  const probe = async (what: string, run: () => Promise<{ status: number; body: unknown; headers: Headers }>) => {
    const from = Date.now() - t0;
    try {
      const r = await run();
      const body = r.body as { error?: { code?: string } } | null;
      hits.push({ from, at: Date.now() - t0, what, status: r.status, retryAfter: r.headers.get('retry-after'), json: typeof r.body === 'object' && r.body !== null, code: body?.error?.code });
    } catch {
      hits.push({ from, at: Date.now() - t0, what, status: 0, retryAfter: null, json: false }); // connection refused: the process is gone
    }
  };
  // Each kind of request in a loop of its own, so one slow answer (a password hash on a loaded machine) does
  // not hold back the others.
  let running = true;
  const kinds: [string, () => Promise<{ status: number; body: unknown; headers: Headers }>][] = [
    ['health', () => anon.get('/api/health')],
    ['list', () => user.get('/api/setups')],
    ['read', () => user.get(`/api/setups/${created.body.id}`)],
    ['session', () => user.get('/api/auth/get-session')],
    ['sign-in', () => anon.post('/api/auth/sign-in/email', { email: freshEmail('nobody'), password: 'not the password' })],
    ['sign-up', () => anon.post('/api/auth/sign-up/email', { name: 'Late', email: freshEmail('late'), password: 'a fine long password' })],
  ];
  const traffic = Promise.all(
    kinds.map(async ([what, run]) => {
      while (running) {
        await probe(what, run);
        await new Promise((r) => setTimeout(r, 100));
      }
    }),
  );
  let restartedAt = 0;
  try {
    await new Promise((r) => setTimeout(r, 600));
    const stoppedAt = Date.now() - t0;
    await stopClusterAsync();
    expect(clusterRunning()).toBe(false);
    await new Promise((r) => setTimeout(r, 4_000));
    expect(server.exited(), server.stderr()).toBe(false);
    const downFrom = Date.now() - t0 - 3_000; // the last 3 s with the database surely gone
    const upFrom = Date.now() - t0; // from here on the database may be back
    await startClusterAsync();
    restartedAt = Date.now() - t0;

    // Back: the first moment every kind of request succeeds again.
    let backAt = 0;
    for (let i = 0; i < 300 && !backAt; i++) {
      const [h, l, s] = await Promise.all([anon.get('/api/health'), user.get('/api/setups'), user.get('/api/auth/get-session')]);
      if (h.status === 200 && l.status === 200 && s.status === 200 && s.body?.user) backAt = Date.now() - t0;
      else await new Promise((r) => setTimeout(r, 100));
    }
    running = false;
    await traffic;

    const recovery = (backAt - restartedAt) / 1000;
    console.log(`[faults] database stopped at ${stoppedAt} ms, started at ${restartedAt} ms, serving again ${recovery.toFixed(2)} s after its return; ${hits.length} requests`);
    expect(backAt, 'the server never served again').toBeGreaterThan(0);
    recordFigure('dbRecovery', `${recovery.toFixed(2)} s`, 'tests/faults/database.test.ts: pg_ctl stop -m fast during traffic, start again; first 200 after the start');
    expect(recovery).toBeLessThan(5);

    expect(server.exited(), server.stderr()).toBe(false);
    expect(hits.filter((h) => h.status === 0), 'requests refused: the process went away').toEqual([]);
    expect(hits.filter((h) => h.status >= 500 && h.status !== 503).map((h) => `${h.what} ${h.status} ${h.code ?? ''} at ${h.from}–${h.at} ms`), `a 5xx other than 503; server said: ${server.stderr().slice(-3000)}`).toEqual([]);
    // Asked and answered while the database was surely down: every kind answered, each with a clear 503.
    const down = hits.filter((h) => h.from >= downFrom && h.at < upFrom);
    const seen = `requests (sent–answered ms, what, status): ${hits.map((h) => `${h.from}–${h.at} ${h.what} ${h.status}`).join('; ')}`;
    for (const what of ['health', 'list', 'read', 'session']) expect(down.filter((h) => h.what === what).length, `${what} answered while down; ${seen}`).toBeGreaterThan(2);
    for (const h of down) {
      expect(h, `${h.what} while the database was down`).toMatchObject({ status: 503, json: true });
      expect(Number(h.retryAfter), `${h.what}: Retry-After`).toBeGreaterThan(0);
      if (h.what !== 'health') expect(h.code).toBe('database_unavailable');
    }
    // A signed-in user was never told to sign in again.
    expect(hits.filter((h) => h.what !== 'sign-in' && h.status === 401)).toEqual([]);
  } finally {
    running = false;
    await traffic;
    startCluster();
  }
  // And the data is all there.
  const again = await user.get(`/api/setups/${created.body.id}`);
  expect(again.status).toBe(200);
}, 120_000);

// A pooled connection checked out by a transaction has no 'error' listener of node-postgres's own (the pool takes its
// listener off while the connection is lent out). When PostgreSQL ended such a connection — a restart landing while a
// sign-up's transaction was open — the 'error' event went unhandled and the whole server process exited (seen once in
// CI in the test above). db/client.ts now listens on every connection for its whole life.
test('a connection ended while checked out (inside a transaction) does not end the process', () => {
  const r = spawnSync(process.execPath, ['--import', 'tsx', join(__dirname, '..', 'support', 'checkout-child.ts')], {
    env: { ...process.env, DATABASE_URL: TEST_DATABASE_URL },
    encoding: 'utf8',
    timeout: 60_000,
  });
  expect(r.stderr).not.toMatch(/Unhandled 'error' event|terminating connection/);
  expect(r.status, r.stderr).toBe(0);
  expect(r.stdout).toMatch(/held connection refused: .*; pool again 1; survived/);
}, 90_000);
