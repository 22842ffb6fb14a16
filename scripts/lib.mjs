// Helpers shared by the project's own scripts (ensure, start, test, bench).
// Dependency-free on purpose: ensure.mjs runs before node_modules exists.
import { spawnSync, spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, statSync, writeFileSync, chownSync, rmSync } from 'node:fs';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = join(dirname(fileURLToPath(import.meta.url)), '..');
export const dataDir = join(root, '.data');
export const pgDir = join(dataDir, 'pg');
export const pgRunDir = join(dataDir, 'pg-run');
export const pgStartedMarker = join(dataDir, 'pg-started-by-scripts');
export const PG_PORT = Number(process.env.FALLOFF_PG_PORT ?? 54329);
export const APP_PORT = Number(process.env.PORT ?? 8080);
export const DB_NAME = 'falloff';
export const TEST_DB_NAME = 'falloff_test';
export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

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

/** Run a command, inheriting stdio; exit the script when it fails. */
export function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', cwd: root, ...opts });
  if (r.status !== 0) fail(`command failed (${r.status ?? r.signal}): ${cmd} ${args.join(' ')}`);
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
  if (r.status !== 0) fail('running as root but there is no `postgres` OS user; install Debian\'s postgresql package.');
  return { uid: Number(r.stdout.trim()), gid: Number(g.stdout.trim()) };
}

/** Run a PostgreSQL binary as the cluster's owner. */
export function pgExec(pgBin, tool, args, { quiet = false } = {}) {
  const full = join(pgBin, tool);
  const [cmd, argv] = isRoot ? ['runuser', ['-u', 'postgres', '--', full, ...args]] : [full, args];
  return quiet ? capture(cmd, argv) : run(cmd, argv);
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
  if (r.status !== 0) fail(`psql failed: ${r.stderr.trim()}`);
  return r.stdout.trim();
}
