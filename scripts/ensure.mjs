#!/usr/bin/env node
// Makes a fresh clone ready to run: node modules, PostgreSQL (a private cluster on loopback), the database
// migrated and seeded, and the web app built. Runs before `npm start` and `npm test`; each step is skipped
// when it is already done, so a second start is quick.
//
//   node scripts/ensure.mjs          the app's database (falloff)
//   node scripts/ensure.mjs --test   also a fresh throw-away test database (falloff_test) and Chromium
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  root, dataDir, pgDir, pgRunDir, pgStartedMarker, PG_PORT, DB_NAME, TEST_DB_NAME, isRoot,
  log, fail, run, capture, bin, sha256, hashTree, ensureDir, readText, writeText,
  findPgBin, pgOwner, pgExec, pgIsRunning, psql, databaseUrl,
} from './lib.mjs';

const forTest = process.argv.includes('--test');
const t0 = Date.now();

function aptInstall(pkgs, why) {
  if (!isRoot) {
    fail(`${why} is missing. Install Debian's package(s) first: sudo apt-get install -y ${pkgs.join(' ')}`);
  }
  log(`installing ${pkgs.join(', ')} from Debian (${why})…`);
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', ...pkgs], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
}

// 1. Node modules: `npm ci` on a fresh clone; when package-lock.json changed since the last install, an
// incremental `npm install` (it adds what is missing without wiping node_modules and its caches).
function ensureNodeModules() {
  const lock = readFileSync(join(root, 'package-lock.json'));
  const want = sha256(lock);
  const stamp = join(root, 'node_modules', '.falloff-lock.sha256');
  if (readText(stamp) === want && existsSync(bin('tsx'))) return;
  const fresh = !existsSync(join(root, 'node_modules', '.package-lock.json'));
  log(fresh ? 'installing node modules (npm ci)…' : 'package-lock.json changed: updating node modules (npm install)…');
  run('npm', [fresh ? 'ci' : 'install', '--no-audit', '--no-fund', '--loglevel=error']);
  writeText(stamp, want);
}

// 2. PostgreSQL: Debian's server binaries, a private cluster under .data/pg, started on 127.0.0.1:PG_PORT.
function ensurePostgres() {
  let pgBin = findPgBin();
  if (!pgBin) {
    aptInstall(['postgresql'], "PostgreSQL's server (Debian package postgresql)");
    pgBin = findPgBin();
    if (!pgBin) fail('PostgreSQL was installed but no initdb was found under /usr/lib/postgresql/*/bin.');
  }
  const owner = pgOwner();
  ensureDir(dataDir);
  if (!existsSync(join(pgDir, 'PG_VERSION'))) {
    log(`creating a private PostgreSQL cluster in ${pgDir}…`);
    ensureDir(pgDir, owner);
    pgExec(pgBin, 'initdb', ['-D', pgDir, '-U', 'falloff', '-A', 'trust', '-E', 'UTF8', '--locale=C.UTF-8'], { quiet: true });
    if (!existsSync(join(pgDir, 'PG_VERSION'))) fail('initdb did not create the cluster.');
  }
  ensureDir(pgRunDir, owner);
  if (!pgIsRunning(pgBin)) {
    log(`starting PostgreSQL on 127.0.0.1:${PG_PORT}…`);
    const opts = `-c listen_addresses=127.0.0.1 -p ${PG_PORT} -k ${pgRunDir} -c fsync=${forTest ? 'off' : 'on'}`;
    const r = pgExec(pgBin, 'pg_ctl', ['-D', pgDir, '-o', opts, '-l', join(pgRunDir, 'server.log'), '-w', '-t', '60', 'start'], { quiet: true });
    if (r.status !== 0) {
      const tail = readText(join(pgRunDir, 'server.log'))?.split('\n').slice(-15).join('\n') ?? '';
      fail(`PostgreSQL did not start:\n${r.stdout}${r.stderr}\n${tail}`);
    }
    writeText(pgStartedMarker, forTest ? 'test' : 'start'); // who may stop it: see start.ts and test.mjs
  }
  return pgBin;
}

function ensureDatabase(pgBin, name, { fresh }) {
  const exists = psql(pgBin, 'postgres', `select 1 from pg_database where datname = '${name}'`) === '1';
  if (exists && fresh) psql(pgBin, 'postgres', `drop database ${name} with (force)`);
  if (!exists || fresh) psql(pgBin, 'postgres', `create database ${name}`);
  // Migrate, then seed the demo data once (the seed script is idempotent).
  run(bin('tsx'), ['db/prepare.ts'], { env: { ...process.env, DATABASE_URL: databaseUrl(name) } });
}

// 3. Chromium for the end-to-end tests (Debian's package, driven by playwright-core; never a browser download).
function ensureChromium() {
  if (existsSync('/usr/bin/chromium')) return;
  aptInstall(['chromium'], 'Chromium for the end-to-end tests (Debian package chromium)');
}

// 4. The web app: `expo export` only when something it is built from changed.
function ensureWebBuild() {
  // Everything the bundle is built from (the client imports app/, components/, hooks/, constants/, canvas/,
  // model/ and calc/).
  const want = hashTree(['app', 'components', 'hooks', 'constants', 'canvas', 'calc', 'model', 'assets', 'package-lock.json', 'app.json', 'babel.config.js', 'metro.config.js']);
  const stamp = join(root, 'dist', '.falloff-build.sha256');
  if (readText(stamp) === want && existsSync(join(root, 'dist', 'index.html'))) return;
  log('building the web app (expo export -p web)…');
  const b0 = Date.now();
  run(bin('expo'), ['export', '-p', 'web', '--output-dir', 'dist'], { env: { ...process.env, CI: '1', EXPO_NO_TELEMETRY: '1' } });
  writeText(stamp, want);
  log(`web app built in ${((Date.now() - b0) / 1000).toFixed(1)} s`);
}

ensureNodeModules();
const pgBin = ensurePostgres();
ensureDatabase(pgBin, DB_NAME, { fresh: false });
if (forTest) {
  ensureDatabase(pgBin, TEST_DB_NAME, { fresh: true });
  ensureChromium();
}
ensureWebBuild();
const probe = capture(join(pgBin, 'pg_isready'), ['-h', '127.0.0.1', '-p', String(PG_PORT)]);
if (probe.status !== 0) fail(`PostgreSQL is not answering on 127.0.0.1:${PG_PORT}: ${probe.stdout}`);
log(`ready in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
