// Heavy work off the request thread: exports (PNG, PDF), photo decoding and the frame render run in one pool
// of worker threads (piscina) with a bounded number of threads and a bounded queue. A full queue is a 503 with
// Retry-After naming the reason, never an ever-growing backlog.
//
// The task interface is a module and a function: runTask('server/export/tasks.ts', 'planPngTask', arg) runs
// that module's exported function with arg (structured-cloned) on a worker and resolves with its result. The
// module (a path from the project root, TypeScript or not) is bundled once per process with esbuild into
// node_modules/.cache/falloff-pool/ (packages stay external, so sharp, resvg and pdfkit load from node_modules
// as usual) — whatever runs the server (tsx, vitest, or the compiled dist-server) runs the same code there.
import { buildSync } from 'esbuild';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { dirname, join } from 'node:path';
import { Piscina } from 'piscina';
import { HttpError } from './errors';

/** Seconds a client is told to wait when the pool's queue is full. */
const POOL_RETRY_AFTER_S = 5;

type PoolSettings = { threads: number; queue: number };

/** From POOL_THREADS (default: the cores but one, 1 to 4, so the request thread keeps a core) and POOL_QUEUE (tasks waiting beyond the running ones, default 16). */
function poolSettings(env: Record<string, string | undefined> = process.env): PoolSettings {
  const n = (v: string | undefined, d: number, min: number) => {
    const x = Number(v);
    return v !== undefined && v !== '' && Number.isInteger(x) && x >= min ? x : d;
  };
  return { threads: n(env.POOL_THREADS, Math.max(1, Math.min(4, availableParallelism() - 1)), 1), queue: n(env.POOL_QUEUE, 16, 0) };
}

/** The project root: the nearest folder above this file with package.json (server/ in source, dist-server/ compiled). */
function projectRoot(): string {
  for (let d = __dirname; ; d = dirname(d)) {
    if (existsSync(join(d, 'package.json')) && existsSync(join(d, 'node_modules'))) return d;
    if (dirname(d) === d) throw new Error('worker pool: no project root above ' + __dirname);
  }
}

const RUNNER = `'use strict';
// Written by server/pool.ts: runs one exported function of a bundled task module. The thread lowers its own
// priority (on Linux a thread's nice value is its own), so requests on the main thread go first on a busy machine.
try { require('node:os').setPriority(0, 10); } catch {}
module.exports = async function run({ file, fn, arg }) {
  const m = require(file);
  if (typeof m[fn] !== 'function') throw new Error('worker pool: ' + file + ' exports no function ' + fn);
  return m[fn](arg);
};
`;

/** Write `text` to `dir/name` unless there, atomically (two server processes may do it at once). */
function writeOnce(dir: string, name: string, text: string): string {
  const file = join(dir, name);
  if (existsSync(file)) return file;
  mkdirSync(dir, { recursive: true });
  const tmp = `${file}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
  writeFileSync(tmp, text);
  renameSync(tmp, file);
  return file;
}

const hash = (s: string) => createHash('sha256').update(s).digest('hex').slice(0, 16);

let root: string | null = null;
const bundles = new Map<string, string>();

function cacheDir() {
  root ??= projectRoot();
  return join(root, 'node_modules', '.cache', 'falloff-pool');
}

/** The bundled file of a task module (built once per process). */
function bundleOf(modulePath: string): string {
  const known = bundles.get(modulePath);
  if (known) return known;
  const dir = cacheDir();
  const code = buildSync({
    entryPoints: [join(root!, modulePath)],
    bundle: true,
    write: false,
    platform: 'node',
    format: 'cjs',
    target: 'node20',
    packages: 'external',
    logLevel: 'silent',
  }).outputFiles[0]!.text;
  const base = modulePath.replace(/[^A-Za-z0-9]+/g, '-').replace(/-(ts|tsx|js)$/, '');
  const file = writeOnce(dir, `${base}-${hash(code)}.cjs`, code);
  bundles.set(modulePath, file);
  return file;
}

let pool: Piscina | null = null;
let settings: PoolSettings | null = null;

function thePool(): Piscina {
  if (pool) return pool;
  settings = poolSettings();
  const runner = writeOnce(cacheDir(), `runner-${hash(RUNNER)}.cjs`, RUNNER);
  pool = new Piscina({ filename: runner, minThreads: 0, maxThreads: settings.threads, maxQueue: settings.queue, idleTimeout: 30_000 });
  return pool;
}

class PoolBusyError extends HttpError {
  constructor(what: string) {
    super(503, 'busy', `the server is busy with other exports and photos just now (its queue is full); ${what} was not started: try again in ${POOL_RETRY_AFTER_S} s`, { retryAfterS: POOL_RETRY_AFTER_S, reason: 'work_queue_full' });
  }
}

/**
 * Run `fn` of `modulePath` (from the project root) on a pool thread with `arg`. `what` names the work in the
 * 503 a full queue gives ("the plan PNG").
 */
export async function runTask<T>(modulePath: string, fn: string, arg: unknown, what = 'this task'): Promise<T> {
  const p = thePool();
  const file = bundleOf(modulePath);
  try {
    return (await p.run({ file, fn, arg })) as T;
  } catch (err) {
    if (err instanceof Error && /queue is at limit/i.test(err.message)) throw new PoolBusyError(what);
    throw err;
  }
}

/** Stop the pool's threads (tests that run tasks in process end with this, so vitest can exit). */
export async function closePool() {
  const p = pool;
  pool = null;
  await p?.destroy();
}

/** A Buffer view of bytes that came back from a thread (structured clone gives a Uint8Array). */
export const asBuffer = (u: Uint8Array): Buffer => Buffer.from(u.buffer, u.byteOffset, u.byteLength);
