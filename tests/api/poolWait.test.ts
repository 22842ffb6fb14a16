// The connection pool's wait for a free connection (db/client.ts CONNECT_TIMEOUT_MS, 10 s): a burst that holds
// every connection for a few seconds makes the next request wait and succeed, not fail with a 503 (a 3 s wait
// did); a database that is not there still fails at once. An app of this file's own, on its own pool, so the
// test can hold that pool's connections itself.
import { createHmac } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import { createServer as netServer, type AddressInfo } from 'node:net';
import type { PoolClient } from 'pg';
import { pino } from 'pino';
import { afterEach, expect, test } from 'vitest';
import { createDb } from '../../db/client';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { TEST_DATABASE_URL } from '../support/env';

const POOL_MAX = 3;
const HOLD_MS = 5_000;
const open: { server: Server; end: () => Promise<void> }[] = [];

afterEach(async () => {
  for (const o of open.splice(0)) {
    await new Promise<void>((r) => o.server.close(() => r()));
    await o.end();
  }
});

const SECRET = 'pool-wait-test-secret-0123456789abcdef';
/** A session cookie this server signed (so the API must ask the database about it: a bad signature is a 401 at once). */
const signedCookie = (token: string) => `better-auth.session_token=${encodeURIComponent(`${token}.${createHmac('sha256', SECRET).update(token).digest('base64')}`)}`;

async function appOn(url: string) {
  const before = process.env.PG_POOL_MAX;
  process.env.PG_POOL_MAX = String(POOL_MAX);
  const { db, pool } = createDb(url);
  if (before === undefined) delete process.env.PG_POOL_MAX;
  else process.env.PG_POOL_MAX = before;
  pool.on('error', () => undefined);
  const server = createServer();
  const base = await new Promise<string>((r) => server.listen(0, '127.0.0.1', () => r(`http://127.0.0.1:${(server.address() as AddressInfo).port}`)));
  server.on('request', createApp({ db, auth: createAuth(db, { baseURL: base, secret: SECRET }), logger: pino({ level: 'silent' }), publicUrl: base }));
  open.push({ server, end: () => pool.end() });
  return { base, pool };
}

test(`every connection held for ${HOLD_MS / 1000} s: a request waits for one and succeeds`, async () => {
  const { base, pool } = await appOn(TEST_DATABASE_URL);
  expect((await fetch(`${base}/api/health`)).status).toBe(200);
  const held: PoolClient[] = await Promise.all(Array.from({ length: POOL_MAX }, () => pool.connect()));
  expect(pool.totalCount).toBe(POOL_MAX);
  expect(pool.idleCount).toBe(0);
  const t0 = Date.now();
  const release = setTimeout(() => held.forEach((c) => c.release()), HOLD_MS);
  try {
    const r = await fetch(`${base}/api/health`);
    const waited = Date.now() - t0;
    expect(r.status, await r.clone().text()).toBe(200);
    expect(await r.json()).toEqual({ ok: true, db: 'up' });
    // It really waited for a held connection (not a fresh one past the pool's size)…
    expect(waited).toBeGreaterThanOrEqual(HOLD_MS - 200);
    expect(pool.totalCount).toBe(POOL_MAX);
  } finally {
    clearTimeout(release);
    for (const c of held) {
      try {
        c.release();
      } catch {
        /* already released */
      }
    }
  }
}, 60_000);

test('no database listening: a 503 with Retry-After at once, not after the pool wait', async () => {
  const free = netServer();
  const port = await new Promise<number>((r) => free.listen(0, '127.0.0.1', () => r((free.address() as AddressInfo).port)));
  await new Promise<void>((r) => free.close(() => r()));
  const { base } = await appOn(`postgres://falloff@127.0.0.1:${port}/falloff_test`);
  for (const path of ['/api/health', '/api/setups']) {
    const t0 = Date.now();
    const r = await fetch(`${base}${path}`, { headers: { cookie: signedCookie('not-a-real-session') } });
    const ms = Date.now() - t0;
    expect(r.status, `${path}: ${await r.clone().text()}`).toBe(503);
    expect(r.headers.get('retry-after'), path).toBe('5');
    expect(ms, path).toBeLessThan(2_000);
  }
}, 60_000);
