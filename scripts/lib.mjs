// Helpers shared by the project's own scripts (ensure, start, test, bench).
// Dependency-free on purpose: ensure.mjs runs before node_modules exists.
import { spawnSync, spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, statSync, writeFileSync, chownSync, rmSync } from 'node:fs';
import { join, dirname, basename } from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = join(dirname(fileURLToPath(import.meta.url)), '..');
export const dataDir = join(root, '.data');
export const PG_PORT = Number(process.env.FALLOFF_PG_PORT ?? 54329);
export const APP_PORT = Number(process.env.PORT ?? 8080);
export const DB_NAME = 'falloff';
export const TEST_DB_NAME = 'falloff_test';
export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

// Where the private cluster lives. Run as an ordinary user, the cluster is ours, in .data/. Run as root, the
// server must run as the `postgres` user (it refuses root), and that user cannot enter a clone inside a private
// folder (mode 0700: `mktemp -d`, a home folder): then the cluster goes to a folder of this clone's own under
// /var/lib/falloff, keyed by the clone's path. The choice is written to .data/pg-home so it never moves.
export const sharedPgRoot = '/var/lib/falloff';
export const pgHomeRecord = join(dataDir, 'pg-home');

/** Pure: the folder holding pg/ and pg-run/ for a clone at `root`. */
export function choosePgHome({ root: r, dataDir: d, isRoot: asRoot, recorded, hasClusterInData, postgresCanReach }) {
  if (recorded) return recorded;
  if (!asRoot || hasClusterInData) return d;
  if (postgresCanReach()) return d;
  const key = createHash('sha256').update(r).digest('hex').slice(0, 12);
  const name = basename(r).replace(/[^A-Za-z0-9._-]/g, '_') || 'clone';
  return join(sharedPgRoot, `${name}-${key}`);
}

/** Whether the `postgres` OS user can enter a folder (search permission on it and every folder above it). */
export function postgresCanEnter(p) {
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', p], { stdio: 'ignore' }).status === 0;
}

export const pgHome = choosePgHome({
  root,
  dataDir,
  isRoot,
  recorded: existsSync(pgHomeRecord) ? readFileSync(pgHomeRecord, 'utf8').trim() : null,
  hasClusterInData: existsSync(join(dataDir, 'pg', 'PG_VERSION')),
  postgresCanReach: () => postgresCanEnter(root),
});
export const pgDir = join(pgHome, 'pg');
export const pgRunDir = join(pgHome, 'pg-run');
export const pgStartedMarker = join(dataDir, 'pg-started-by-scripts');

export function databaseUrl(db = DB_NAME) {
  return `postgres://falloff@127.0.0.1:${PG_PORT}/${db}`;
}

export function log(msg) {
  process.stdout.write(`[falloff] ${msg}\n`);
}

export function fail(msg) {
  process.stderr.write(`\n[falloff] ${msg}\n\n`);
  process.exit(1);
}

/**
 * Run a command, inheriting stdio; exit the script when it fails. `what` names the step and `hint` says what to
 * do about a failure, so the message is more than an exit code.
 */
export function run(cmd, args, opts = {}) {
  const { what, hint, ...spawnOpts } = opts;
  const r = spawnSync(cmd, args, { stdio: 'inherit', cwd: root, ...spawnOpts });
  if (r.status !== 0) {
    const why = r.error ? r.error.message : `exit ${r.status ?? r.signal}`;
    fail(`${what ?? 'a set-up step'} failed (${why}): ${cmd} ${args.join(' ')}${hint ? `\n[falloff] what to do: ${hint}` : ''}`);
  }
  return r;
}

/** Run a command quietly and return { status, stdout, stderr }. */
export function capture(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { encoding: 'utf8', cwd: root, ...opts });
  return { status: r.status, stdout: r.stdout ?? '', stderr: r.stderr ?? '' };
}

export function bin(name) {
  return join(root, 'node_modules', '.bin', name);
}

/** Spawn a long-running child that shares the terminal. */
export function spawnChild(cmd, args, opts = {}) {
  return spawn(cmd, args, { stdio: 'inherit', cwd: root, ...opts });
}

export function sha256(...parts) {
  const h = createHash('sha256');
  for (const p of parts) h.update(p);
  return h.digest('hex');
}

/** A content hash of every file under the given paths (files or folders), skipping ignored folders. */
export function hashTree(paths) {
  const h = createHash('sha256');
  const walk = (p) => {
    if (!existsSync(p)) return;
    const st = statSync(p);
    if (st.isDirectory()) {
      for (const name of readdirSync(p).sort()) {
        if (name === 'node_modules' || name.startsWith('.')) continue;
        walk(join(p, name));
      }
    } else {
      h.update(p.slice(root.length));
      h.update(readFileSync(p));
    }
  };
  for (const p of paths) walk(join(root, p));
  return h.digest('hex');
}

export function ensureDir(p, owner) {
  mkdirSync(p, { recursive: true });
  if (owner) chownSync(p, owner.uid, owner.gid);
}

export function readText(p) {
  return existsSync(p) ? readFileSync(p, 'utf8') : null;
}

export function writeText(p, text) {
  mkdirSync(dirname(p), { recursive: true });
  writeFileSync(p, text);
}

export function remove(p) {
  rmSync(p, { recursive: true, force: true });
}

// ---------------------------------------------------------------------------------------------
// PostgreSQL: a private cluster under .data/pg, on loopback only, on the project's own port.

/** The folder holding Debian's PostgreSQL server binaries (newest major), or null. */
export function findPgBin() {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const majors = readdirSync(base)
    .filter((v) => existsSync(join(base, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return majors.length ? join(base, majors[0], 'bin') : null;
}

/** The OS user the server runs as: ourselves, or `postgres` when we are root (the server refuses root). */
export function pgOwner() {
  if (!isRoot) return null;
  const r = capture('id', ['-u', 'postgres']);
  const g = capture('id', ['-g', 'postgres']);
  if (r.status !== 0) fail('running as root but there is no `postgres` OS user to run PostgreSQL as (the server refuses root).\n[falloff] what to do: install Debian\'s postgresql package (apt-get install -y postgresql), or run as an ordinary user.');
  return { uid: Number(r.stdout.trim()), gid: Number(g.stdout.trim()) };
}

/** Run a PostgreSQL binary as the cluster's owner. */
export function pgExec(pgBin, tool, args, { quiet = false } = {}) {
  const full = join(pgBin, tool);
  const [cmd, argv] = isRoot ? ['runuser', ['-u', 'postgres', '--', full, ...args]] : [full, args];
  // As postgres, start from a folder that user can enter (the clone's may be private).
  const opts = isRoot ? { cwd: '/' } : {};
  return quiet ? capture(cmd, argv, opts) : run(cmd, argv, opts);
}

export function pgIsRunning(pgBin) {
  if (!existsSync(join(pgDir, 'PG_VERSION'))) return false;
  return pgExec(pgBin, 'pg_ctl', ['-D', pgDir, 'status'], { quiet: true }).status === 0;
}

export function pgStop(pgBin) {
  if (pgIsRunning(pgBin)) {
    pgExec(pgBin, 'pg_ctl', ['-D', pgDir, '-m', 'fast', '-w', 'stop'], { quiet: true });
  }
  remove(pgStartedMarker);
}

/** psql against the private cluster; returns stdout (throws the script on error). */
export function psql(pgBin, db, sql) {
  const r = capture(join(pgBin, 'psql'), ['-h', '127.0.0.1', '-p', String(PG_PORT), '-U', 'falloff', '-d', db, '-v', 'ON_ERROR_STOP=1', '-tAc', sql]);
  if (r.status !== 0) {
    fail(`psql on 127.0.0.1:${PG_PORT} (database ${db}) failed: ${r.stderr.trim()}\n[falloff] what to do: check that the PostgreSQL on that port is this clone's (cluster in ${pgDir}); set FALLOFF_PG_PORT to a free port if another program answers there.`);
  }
  return r.stdout.trim();
}
