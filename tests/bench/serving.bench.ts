/**
 * What serving costs: `npm run bench -- serving`.
 *
 * 1. Start-up of the production server as `npm start` runs it (package.json's start script, after ensure): time
 *    from spawn until GET / answers, and the resident memory of the process tree then (and after the throughput
 *    after 200 requests).
 * 2. Per-request overhead, each at 50 connections for 5 s on loopback, against the real app (session, logging,
 *    compression, security headers, PostgreSQL) and a bare Express app returning the very same bytes:
 *      library   GET /api/setups (a user with 40 setups; one page of 30)
 *      setup     GET /api/setups/:id of a 40-item setup
 *      index     GET / (the web app's HTML)
 *      bundle    GET of the web bundle with Accept-Encoding: br, gzip
 *    (4 connections: megabytes)
 *    and the ratio to the bare route: target library ≥ 35 %.
 * Measures and prints; the exit code is for a run that broke (errors or non-2xx answers).
 */
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import express from 'express';
import { readFileSync, readdirSync } from 'node:fs';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { cpus, loadavg } from 'node:os';
import { join } from 'node:path';
import { startServer } from '../../server/main';
import { TEST_DATABASE_URL } from '../support/env';
import { Client, freshEmail } from '../support/http';
import { documentWith } from '../api/documents';
import { answerCpu, benchMain, fromChild, runner, startChild, type Row } from './runner';

const CONNECTIONS = 50;
const SECONDS = 5;
const root = join(__dirname, '..', '..');

/** In the child: the real server (as the app runs in production, serving dist/), and a bare one. */
async function serve() {
  // The bench runs with NODE_ENV=production, which asks for AUTH_SECRET and PUBLIC_URL: a free port is picked first.
  const probe = createServer();
  await new Promise<void>((r) => probe.listen(0, '127.0.0.1', r));
  const port = (probe.address() as AddressInfo).port;
  await new Promise((r) => probe.close(r));
  process.env.AUTH_SECRET ??= randomBytes(32).toString('base64url');
  process.env.PUBLIC_URL = `http://127.0.0.1:${port}`;
  const app = await startServer({ databaseUrl: TEST_DATABASE_URL, port, logLevel: 'info' });
  const bodies = new Map<string, { type: string; body: Buffer; headers: Record<string, string> }>();
  const bare = express();
  bare.get('/bare/:name', (req, res) => {
    const b = bodies.get(req.params.name)!;
    res.set(b.headers).type(b.type).send(b.body);
  });
  const bareServer = createServer(bare);
  await new Promise<void>((r) => bareServer.listen(0, '127.0.0.1', r));
  answerCpu();
  process.on('message', (m: { body?: { name: string; type: string; base64: string; headers: Record<string, string> }; stop?: boolean }) => {
    if (m.body) {
      bodies.set(m.body.name, { type: m.body.type, body: Buffer.from(m.body.base64, 'base64'), headers: m.body.headers });
      process.send!({ ready: m.body.name });
    }
    if (m.stop) void app.close().then(() => process.exit(0));
  });
  process.send!({ ports: { app: app.url, bare: `http://127.0.0.1:${(bareServer.address() as AddressInfo).port}` } });
}

/** Resident memory (MB) of a process and all its descendants, from /proc. */
function treeRssMb(pid: number): number {
  const parent = new Map<number, number>();
  for (const d of readdirSync('/proc')) {
    if (!/^\d+$/.test(d)) continue;
    try {
      const stat = readFileSync(`/proc/${d}/stat`, 'utf8');
      parent.set(Number(d), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
    } catch {
      /* gone */
    }
  }
  const tree = new Set([pid]);
  for (let grew = true; grew; ) {
    grew = false;
    for (const [p, pp] of parent) {
      if (!tree.has(p) && tree.has(pp)) {
        tree.add(p);
        grew = true;
      }
    }
  }
  let kb = 0;
  for (const p of tree) {
    try {
      kb += Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${p}/status`, 'utf8'))?.[1] ?? 0);
    } catch {
      /* gone */
    }
  }
  return kb / 1024;
}

/** Start the server the way `npm start` does (its script from package.json), time it, weigh it, stop it. */
async function startup(): Promise<{ command: string; ms: number; rssMb: number; rssWarmMb: number } | null> {
  const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { scripts: Record<string, string> };
  const command = pkg.scripts.start!;
  const port = 20_000 + Math.floor(Math.random() * 20_000);
  const t0 = performance.now();
  const p = spawn('sh', ['-c', command], {
    cwd: root,
    env: { ...process.env, PORT: String(port), PATH: `${join(root, 'node_modules/.bin')}:${process.env.PATH}` },
    stdio: 'ignore',
    detached: true,
  });
  try {
    for (;;) {
      if (performance.now() - t0 > 60_000 || p.exitCode !== null) return null;
      const ok = await fetch(`http://127.0.0.1:${port}/`).then((r) => r.ok, () => false);
      if (ok) break;
      await new Promise((r) => setTimeout(r, 25));
    }
    const ms = performance.now() - t0;
    const rssMb = treeRssMb(p.pid!);
    await autocannon({ url: `http://127.0.0.1:${port}/api/health`, connections: 4, amount: 200 });
    return { command, ms, rssMb, rssWarmMb: treeRssMb(p.pid!) };
  } finally {
    // SIGKILL: the start script stops PostgreSQL on a clean exit, and the bench shares that cluster.
    try {
      process.kill(-p.pid!, 'SIGKILL');
    } catch {
      /* already gone */
    }
  }
}

async function main() {
  const started = process.env.BENCH_ONLY ? null : await startup();
  // Request logs are written (level info) to the child's stdout, which goes nowhere: logging is on and paid for.
  const { child, done } = startChild(__filename, { stdio: 'quiet' });
  const run = runner(child, { connections: CONNECTIONS, seconds: SECONDS });
  const ports = await fromChild<{ app: string; bare: string }>(child, 'ports');

  const c = await new Client(ports.app).signUp('Bench Library', freshEmail('bench-serving'), 'bench-password-1');
  const doc40 = documentWith(37, 40);
  let setupId = '';
  for (let i = 0; i < 40; i++) {
    const made = await c.post('/api/setups', { title: `Bench setup ${i}`, document: doc40, tags: ['bench', `t${i % 4}`] });
    if (made.status !== 201) throw new Error(`could not create a bench setup: ${made.status} ${JSON.stringify(made.body)}`);
    setupId = made.body.id;
  }
  const cookies = (c as unknown as { cookies: Map<string, string> }).cookies;
  const cookie = [...cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  const html = await fetch(`${ports.app}/`);
  const htmlText = await html.text();
  const bundlePath = /src="(\/_expo\/static\/js\/web\/[^"]+\.js)"/.exec(htmlText)?.[1];

  // The bare twins answer with the same bytes (and, for the bundle, the same encoding) as the app did.
  // The bundle is megabytes: a few connections, or nothing completes within the run while it is compressed per request.
  const targets: { name: string; path: string; headers: Record<string, string>; connections?: number }[] = [
    { name: 'library GET /api/setups', path: '/api/setups', headers: { cookie } },
    { name: 'setup GET /api/setups/:id', path: `/api/setups/${setupId}`, headers: { cookie } },
    { name: 'index GET /', path: '/', headers: { 'accept-encoding': 'br, gzip' } },
    ...(bundlePath ? [{ name: 'bundle GET (br, gzip)', path: bundlePath, headers: { 'accept-encoding': 'br, gzip' }, connections: 4 }] : []),
  ];
  const rows: { app: Row; bare: Row; encoding: string }[] = [];
  // BENCH_ONLY=library runs only the routes whose name contains that word (for a profile of one route).
  for (const [i, t] of targets.entries()) {
    if (process.env.BENCH_ONLY && !t.name.includes(process.env.BENCH_ONLY)) continue;
    // fetch would decode the body: node:http hands over the bytes as sent.
    const raw = await rawGet(`${ports.app}${t.path}`, t.headers);
    if (raw.status !== 200) throw new Error(`${t.name}: ${raw.status}`);
    const headers: Record<string, string> = {};
    if (raw.headers['content-encoding']) headers['content-encoding'] = String(raw.headers['content-encoding']);
    child.send({ body: { name: String(i), type: String(raw.headers['content-type'] ?? 'application/octet-stream'), base64: raw.body.toString('base64'), headers } });
    await fromChild(child, 'ready');
    const bareRow = await run(`bare ${t.name}`, { url: `${ports.bare}/bare/${i}`, connections: t.connections ?? CONNECTIONS });
    const appRow = await run(t.name, { url: `${ports.app}${t.path}`, headers: t.headers, connections: t.connections ?? CONNECTIONS });
    rows.push({ app: appRow, bare: bareRow, encoding: headers['content-encoding'] ?? 'identity' });
  }

  await new Promise((r) => setTimeout(r, 300));
  child.send({ stop: true });
  done();

  if (started) {
    console.log(`\nstart-up (\`${started.command}\`): answering after ${(started.ms / 1000).toFixed(2)} s; memory ${started.rssMb.toFixed(0)} MB, ${started.rssWarmMb.toFixed(0)} MB after 200 requests`);
  } else {
    console.log('\nstart-up: the start script did not answer within 60 s');
  }
  console.log(`\nper request, ${CONNECTIONS} connections × ${SECONDS} s each, loopback\n`);
  console.log('route                          bytes   encoding   req/s   p50 ms   p99 ms   CPU ms/req   bare req/s   bare CPU ms   vs bare   errors  non-2xx');
  for (const { app, bare, encoding } of rows) {
    console.log(
      `${app.name.padEnd(30)} ${app.bytes.toFixed(0).padStart(6)}   ${encoding.padEnd(8)} ${app.rps.toFixed(0).padStart(6)}   ${app.p50.toFixed(1).padStart(6)}   ${app.p99.toFixed(1).padStart(6)}   ${app.cpuMsPerReq.toFixed(3).padStart(10)}   ${bare.rps.toFixed(0).padStart(10)}   ${bare.cpuMsPerReq.toFixed(3).padStart(11)}   ${((100 * app.rps) / bare.rps).toFixed(0).padStart(5)} %   ${String(app.errors + bare.errors).padStart(6)}  ${String(app.non2xx + bare.non2xx).padStart(7)}`,
    );
  }
  console.log('(vs bare: req/s ratio; on a loaded machine the CPU ratio bare/app says the same with less noise)');
  const [la1] = loadavg();
  console.log(`\nmachine: ${cpus().length} CPUs, load average ${la1!.toFixed(1)} at the end of the run`);
  const lib = rows[0]!;
  if (lib) console.log(`${lib.app.rps >= 0.35 * lib.bare.rps ? 'met   ' : 'MISSED'}  library ≥ 35 % of the bare route`);
  process.exitCode = rows.every((r) => r.app.errors + r.bare.errors === 0 && r.app.non2xx + r.bare.non2xx === 0) ? 0 : 1;
}

function rawGet(url: string, headers: Record<string, string>): Promise<{ status: number; headers: Record<string, string | string[] | undefined>; body: Buffer }> {
  return new Promise((resolve, reject) => {
    void import('node:http').then(({ get }) =>
      get(url, { headers }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (d: Buffer) => chunks.push(d));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
        res.on('error', reject);
      }).on('error', reject),
    );
  });
}

benchMain(serve, main);
