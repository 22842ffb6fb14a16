/**
 * Benchmark of the setups API. Plain script: `npx tsx tests/bench/api.bench.ts` (after
 * `node scripts/ensure.mjs --test`, which makes the test database it writes to).
 *
 * A child process serves the real app (Express, better-auth sessions, PostgreSQL) on a free loopback port,
 * and beside it a bare Express app whose one route returns the same JSON as GET /api/setups/:id. This
 * process drives each with autocannon at 50 connections for 10 s, one after the other:
 *   bare   GET of the same JSON (the ceiling: Express + JSON.stringify, no session, no database)
 *   GET    /api/setups/:id of a setup whose document is ~50 KB
 *   PUT    /api/setups/:id of a ~50 KB document: each connection saves its own setup from the version its
 *          last save returned, so every save is a real one (new version, new history row), never a 409
 * and prints requests/s, p50 and p99 latency, the ratio to the bare route, and the targets:
 *   GET p99 ≤ 20 ms and ≥ 40 % of the bare route's requests/s; PUT p99 ≤ 50 ms.
 * Loopback only; the whole run is bounded (it gives up after 3 minutes). It measures and prints; a missed target
 * is printed as MISSED, not an exit code (the exit code is for a run that broke: errors or non-2xx answers).
 * BENCH_PROF=1 writes a CPU profile of the server process to tests/.artifacts/bench-profile/ (for finding where the time goes).
 */
import express from 'express';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { cpus, loadavg } from 'node:os';
import { startServer } from '../../server/main';
import { TEST_DATABASE_URL } from '../support/env';
import { Client, freshEmail } from '../support/http';
import { documentWith } from '../api/documents';
import { answerCpu, benchMain, fromChild, runner, startChild, type Row } from './runner';

const CONNECTIONS = 50;
const SECONDS = 10;
const MARK = 'BENCH-MARK-0000000000';

type Ports = { app: string; bare: string };

/** In the child: the real server, and the bare one that returns whatever JSON it is handed. */
async function serve() {
  const app = await startServer({ databaseUrl: TEST_DATABASE_URL, port: 0, logLevel: 'silent', webDir: null });
  let body: unknown = null;
  const bare = express();
  bare.get('/bare', (_req, res) => res.json(body));
  const bareServer = createServer(bare);
  await new Promise<void>((r) => bareServer.listen(0, '127.0.0.1', r));
  answerCpu();
  process.on('message', (m: { bareBody?: unknown; stop?: boolean }) => {
    if (m.bareBody !== undefined) {
      body = m.bareBody;
      process.send!({ ready: true });
    }
    if (m.stop) void app.close().then(() => process.exit(0));
  });
  process.send!({ ports: { app: app.url, bare: `http://127.0.0.1:${(bareServer.address() as AddressInfo).port}` } satisfies Ports });
}

async function main() {
  const { child, done } = startChild(__filename);
  const run = runner(child, { connections: CONNECTIONS, seconds: SECONDS });
  const ports = await fromChild<Ports>(child, 'ports');

  // A user with one ~50 KB setup to read, and one setup per connection to save.
  const email = freshEmail('bench');
  const c = await new Client(ports.app).signUp('Bench Runner', email, 'bench-password-1');
  const doc = documentWith(110, 420);
  const docJson = JSON.stringify(doc);
  const made = await c.post('/api/setups', { title: 'Bench read', document: doc });
  if (made.status !== 201) throw new Error(`could not create the bench setup: ${made.status} ${JSON.stringify(made.body)}`);
  const detail = await c.get(`/api/setups/${made.body.id}`);
  const cookie = (c as unknown as { cookies: Map<string, string> }).cookies;
  const cookieHeader = [...cookie].map(([k, v]) => `${k}=${v}`).join('; ');
  child.send({ bareBody: detail.body });
  await fromChild(child, 'ready');

  // Setups to save, twice as many as connections. A request takes a setup no other request is saving and
  // hands it back with its new version (autocannon's per-request context does not outlive one request).
  const versions = new Map<string, number>();
  for (let i = 0; i < 2 * CONNECTIONS; i++) versions.set((await c.post('/api/setups', { title: `Bench write ${i}`, document: doc })).body.id, 1);
  const free = [...versions.keys()];
  // One PUT body per save, ~50 KB: the document with one note's text changed, so the save is a real change.
  const putBody = (version: number) => `{"version":${version},"document":${docJson.replace('"text":"', `"text":"${MARK}${version} `)}}`;
  const putBytes = Buffer.byteLength(putBody(1));

  const rows: Row[] = [];
  rows.push(await run('bare GET (same JSON)', { url: `${ports.bare}/bare` }));
  rows.push(await run('GET /api/setups/:id', { url: `${ports.app}/api/setups/${made.body.id}`, headers: { cookie: cookieHeader } }));
  rows.push(
    await run('PUT /api/setups/:id (50 KB)', {
      url: ports.app,
      headers: { cookie: cookieHeader, 'content-type': 'application/json', origin: ports.app },
      requests: [
        {
          method: 'PUT',
          setupRequest: (req) => {
            const id = free.shift()!;
            return { ...req, path: `/api/setups/${id}`, body: putBody(versions.get(id)!) };
          },
          onResponse: (status, body) => {
            const r = JSON.parse(body) as { id?: string; version?: number; error?: { current?: { id: string; version: number } } };
            const saved = status === 200 ? { id: r.id!, version: r.version! } : r.error?.current;
            if (saved) {
              versions.set(saved.id, saved.version);
              free.push(saved.id);
            }
          },
        },
      ],
    }),
  );

  // Let the last answers drain before the server goes.
  await new Promise((r) => setTimeout(r, 300));
  child.send({ stop: true });
  done();

  const bare = rows[0]!;
  const get = rows[1]!;
  const put = rows[2]!;
  const detailBytes = Buffer.byteLength(JSON.stringify(detail.body));
  console.log(`\nsetups API, ${CONNECTIONS} connections × ${SECONDS} s each, loopback; GET body ${(detailBytes / 1024).toFixed(1)} KB, PUT body ${(putBytes / 1024).toFixed(1)} KB\n`);
  // Server CPU per request (user + system time of the server process over the run / requests answered)
  // is printed beside the wall-clock figures: on a shared machine it varies less than they do.
  console.log('route                          req/s     p50 ms   p99 ms   vs bare   server CPU ms/req   errors  non-2xx');
  for (const r of rows) {
    console.log(
      `${r.name.padEnd(30)} ${r.rps.toFixed(0).padStart(6)}   ${r.p50.toFixed(1).padStart(6)}   ${r.p99.toFixed(1).padStart(6)}   ${((100 * r.rps) / bare.rps).toFixed(0).padStart(5)} %   ${r.cpuMsPerReq.toFixed(3).padStart(17)}   ${String(r.errors).padStart(6)}  ${String(r.non2xx).padStart(7)}`,
    );
  }
  const [la1] = loadavg();
  console.log(`\nmachine: ${cpus().length} CPUs, load average ${la1!.toFixed(1)} at the end of the run`);
  const checks = [
    { what: 'GET p99 ≤ 20 ms', ok: get.p99 <= 20 },
    { what: 'GET ≥ 40 % of the bare route', ok: get.rps >= 0.4 * bare.rps },
    { what: 'PUT p99 ≤ 50 ms', ok: put.p99 <= 50 },
    { what: 'no errors or non-2xx answers', ok: rows.every((r) => r.errors === 0 && r.non2xx === 0) },
  ];
  console.log('');
  for (const k of checks) console.log(`${k.ok ? 'met   ' : 'MISSED'}  ${k.what}`);
  process.exitCode = checks[checks.length - 1]!.ok ? 0 : 1;
}

benchMain(serve, main);
