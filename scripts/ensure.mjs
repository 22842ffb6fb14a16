#!/usr/bin/env node
// Makes a fresh clone ready to run: node modules, PostgreSQL (a private cluster on loopback), the database
// migrated and seeded, and the web app built. Runs before `npm start` and `npm test`; each step is skipped
// when it is already done, so a second start is quick.
//
//   node scripts/ensure.mjs          the app's database (falloff)
//   node scripts/ensure.mjs --test   also a fresh throw-away test database (falloff_test) and Chromium
import { chmodSync, existsSync, readFileSync, readdirSync, renameSync } from 'node:fs';
import { connect } from 'node:net';
import { basename, join } from 'node:path';
import {
  root, dataDir, pgHome, pgHomeRecord, sharedPgRoot, pgDir, pgRunDir, pgStartedMarker, PG_PORT, DB_NAME, TEST_DB_NAME, isRoot,
  log, fail, run, capture, bin, sha256, hashTree, ensureDir, readText, writeText, remove,
  findPgBin, pgOwner, pgExec, pgIsRunning, psql, databaseUrl,
} from './lib.mjs';
import { buildServiceWorker } from './buildServiceWorker.mjs';
import { precompressDir } from './precompress.mjs';

const kb = (n) => `${(n / 1024).toFixed(0)} KB`;

const forTest = process.argv.includes('--test');
const t0 = Date.now();

function aptInstall(pkgs, why) {
  if (!isRoot) {
    fail(`${why} is missing. Install Debian's package(s) first: sudo apt-get install -y ${pkgs.join(' ')}`);
  }
  log(`installing ${pkgs.join(', ')} from Debian (${why})…`);
  const hint = `Debian's package sources must be reachable; install by hand with apt-get install -y ${pkgs.join(' ')} and run the command again.`;
  run('apt-get', ['update', '-qq'], { what: 'apt-get update', hint });
  run('apt-get', ['install', '-y', '-qq', ...pkgs], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' }, what: `installing ${pkgs.join(', ')}`, hint });
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
  run('npm', [fresh ? 'ci' : 'install', '--no-audit', '--no-fund', '--loglevel=error'], {
    what: 'installing node modules',
    hint: 'check the npm messages above: the npm registry must be reachable (or its cache in ~/.npm filled) and Node must be 20.19.4 or newer (`node -v`).',
  });
  writeText(stamp, want);
}

// 2. PostgreSQL: Debian's server binaries, a private cluster (see pgHome in lib.mjs), started on 127.0.0.1:PG_PORT.
function findOrInstallPg() {
  let pgBin = findPgBin();
  if (!pgBin) {
    aptInstall(['postgresql'], "PostgreSQL's server (Debian package postgresql)");
    pgBin = findPgBin();
    if (!pgBin) fail('PostgreSQL was installed but no initdb was found under /usr/lib/postgresql/*/bin.\n[falloff] what to do: check `dpkg -L postgresql-15` (or the installed major) and reinstall the package.');
  }
  return pgBin;
}

/** The cluster's folder, created for its owner; outside the clone when the postgres user cannot enter it. */
function preparePgHome(owner) {
  ensureDir(dataDir);
  if (pgHome !== dataDir) {
    ensureDir(sharedPgRoot); // root-owned, mode 0755: the postgres user may pass through it
    chmodSync(sharedPgRoot, 0o755);
    ensureDir(pgHome, owner);
    chmodSync(pgHome, 0o700);
    writeText(join(pgHome, 'clone'), `${root}\n`); // whose cluster this is, for whoever finds it later
  }
  if (readText(pgHomeRecord)?.trim() !== pgHome) writeText(pgHomeRecord, `${pgHome}\n`);
}

function initCluster(pgBin, owner) {
  if (existsSync(join(pgDir, 'PG_VERSION'))) return;
  log(`creating a private PostgreSQL cluster in ${pgDir}${pgHome !== dataDir ? ' (outside the clone: the postgres user cannot enter its folder)' : ''}…`);
  remove(pgDir); // a half-made cluster from an interrupted run
  ensureDir(pgDir, owner);
  const r = pgExec(pgBin, 'initdb', ['-D', pgDir, '-U', 'falloff', '-A', 'trust', '-E', 'UTF8', '--locale=C.UTF-8'], { quiet: true });
  if (r.status !== 0 || !existsSync(join(pgDir, 'PG_VERSION'))) {
    const who = owner ? 'the postgres user' : 'this user';
    fail(`initdb did not create the cluster in ${pgDir} (running as ${who}):\n${(r.stderr || r.stdout).trim()}\n` +
      `[falloff] what to do: ${who} needs to create and write that folder${owner ? ' and enter every folder above it' : ''}; ` +
      'check the message above (disk full, permissions), then run the command again.');
  }
}

/** Resolves whether something answers on 127.0.0.1:port. */
function portAnswers(port) {
  return new Promise((resolve) => {
    const s = connect({ host: '127.0.0.1', port });
    s.once('connect', () => { s.destroy(); resolve(true); });
    s.once('error', () => resolve(false));
    s.setTimeout(1000, () => { s.destroy(); resolve(false); });
  });
}

async function startCluster(pgBin, owner) {
  ensureDir(pgRunDir, owner);
  if (pgIsRunning(pgBin)) return;
  if (await portAnswers(PG_PORT)) {
    fail(`port ${PG_PORT} on 127.0.0.1 is taken by another program (another clone's PostgreSQL?), so this clone's cluster cannot start there.\n` +
      '[falloff] what to do: give this clone its own port, e.g. FALLOFF_PG_PORT=54340 npm start (and the same for npm test).');
  }
  log(`starting PostgreSQL on 127.0.0.1:${PG_PORT}…`);
  const opts = `-c listen_addresses=127.0.0.1 -p ${PG_PORT} -k ${pgRunDir} -c fsync=${forTest ? 'off' : 'on'}`;
  const r = pgExec(pgBin, 'pg_ctl', ['-D', pgDir, '-o', opts, '-l', join(pgRunDir, 'server.log'), '-w', '-t', '60', 'start'], { quiet: true });
  if (r.status !== 0) {
    const tail = readText(join(pgRunDir, 'server.log'))?.split('\n').slice(-15).join('\n') ?? '';
    fail(`PostgreSQL did not start from ${pgDir}:\n${r.stdout}${r.stderr}\n${tail}\n` +
      `[falloff] what to do: read the server log above (${join(pgRunDir, 'server.log')}); a stale postmaster.pid after a crash can be removed when no postgres process uses that folder.`);
  }
  writeText(pgStartedMarker, forTest ? 'test' : 'start'); // who may stop it: see start.ts and test.mjs
}

async function ensurePostgres() {
  const pgBin = findOrInstallPg();
  const owner = pgOwner();
  preparePgHome(owner);
  initCluster(pgBin, owner);
  await startCluster(pgBin, owner);
  return pgBin;
}

function ensureDatabase(pgBin, name, { fresh }) {
  const exists = psql(pgBin, 'postgres', `select 1 from pg_database where datname = '${name}'`) === '1';
  if (exists && fresh) psql(pgBin, 'postgres', `drop database ${name} with (force)`);
  if (!exists || fresh) psql(pgBin, 'postgres', `create database ${name}`);
  // Migrate, then seed the demo data once (the seed script is idempotent).
  run(bin('tsx'), ['db/migrateAndSeed.ts'], {
    env: { ...process.env, DATABASE_URL: databaseUrl(name) },
    what: `migrating and seeding the ${name} database`,
    hint: 'read the error above; a migration that no longer applies to an old local database can be cleared by dropping it (the demo data is seeded again): ' +
      `psql -h 127.0.0.1 -p ${PG_PORT} -U falloff -d postgres -c 'drop database ${name}'`,
  });
}

// 3. Chromium for the end-to-end tests (Debian's package, driven by playwright-core; never a browser download).
function ensureChromium() {
  if (existsSync('/usr/bin/chromium')) return;
  aptInstall(['chromium'], 'Chromium for the end-to-end tests (Debian package chromium)');
}

/** Moves every .map under `from` into `to` (flat: bundle names carry content hashes), dropping the old ones. */
function moveSourceMaps(from, to) {
  remove(to);
  ensureDir(to);
  const walk = (dir) => {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      const p = join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (e.name.endsWith('.map')) renameSync(p, join(to, e.name));
    }
  };
  walk(from);
}

// 4. The web app: `expo export` only when something it is built from changed.
async function ensureWebBuild() {
  // Everything the bundle is built from (the client imports app/, components/, hooks/, constants/, canvas/, drawing/,
  // model/ and calc/).
  const want = hashTree(['app', 'components', 'hooks', 'constants', 'canvas', 'drawing', 'calc', 'model', 'assets', 'package-lock.json', 'package.json', 'entry.js', 'entry.web.js', 'app.json', 'babel.config.js', 'metro.config.js', 'scripts/precompress.mjs', 'web', 'public', 'scripts/buildServiceWorker.mjs', 'scripts/webfonts.mjs', 'scripts/chunkTiers.cjs', 'scripts/routePreloads.mjs', 'scripts/staticPages.mjs', 'scripts/workerBundles.mjs']);
  const stamp = join(root, 'dist', '.falloff-build.sha256');
  if (readText(stamp) === want && existsSync(join(root, 'dist', 'index.html'))) return;
  log('building the web app (expo export -p web)…');
  const b0 = Date.now();
  // With source maps, moved out of dist/ to dist-maps/ (not served; the load bench reads them for its breakdown).
  run(bin('expo'), ['export', '-p', 'web', '--output-dir', 'dist', '--source-maps'], {
    env: { ...process.env, CI: '1', EXPO_NO_TELEMETRY: '1' },
    what: 'building the web app',
    hint: 'the bundler names the file and line above; fix it (npx tsc --noEmit -p . helps) and run the command again.',
  });
  moveSourceMaps(join(root, 'dist'), join(root, 'dist-maps'));
  // The app shell and the pages that paint before any script (the signed-out forms, the read-only link's shell)
  // from the export's HTML; every other page it wrote is dropped.
  const { staticPages } = await import('./staticPages.mjs');
  log(`pages rendered at build time: ${Object.keys(staticPages({ webDir: join(root, 'dist') })).join(', ')}`);
  // Which scripts each route needs, for the server to preload in that page's HTML (server/web.ts, appPage).
  const { routePreloads } = await import('./routePreloads.mjs');
  log(`route preloads: ${routePreloads({ root, webDir: join(root, 'dist'), mapsDir: join(root, 'dist-maps') }).routes} routes`);
  // Fonts: WOFF2 subsets, declared and preloaded in index.html (scripts/webfonts.mjs); expo-font's TTFs are not used on the web.
  // Imported here, not at the top: it needs subset-font, which a fresh clone has only after the install step.
  const { buildWebFonts } = await import('./webfonts.mjs');
  const fonts = await buildWebFonts(root, join(root, 'dist'));
  log(`fonts: ${fonts.faces.map((f) => `${f.family} ${kb(f.bytes)}`).join(', ')} (${fonts.characters} characters)`);
  // The meter's and the frame's Web Workers, bundles of their own (Metro bundles no workers), served at
  // /workers/meter.js and /workers/frame.js, with the pages' zod stand-ins (scripts/workerBundles.mjs).
  const { bundleWorker } = await import('./workerBundles.mjs');
  const meterBytes = await bundleWorker({ root, entry: 'canvas/meter/worker.ts', outfile: join(root, 'dist', 'workers', 'meter.js') });
  const frameBytes = await bundleWorker({ root, entry: 'components/frame/frame.worker.ts', outfile: join(root, 'dist', 'workers', 'frame.js') });
  log(`workers: meter ${kb(meterBytes)}, frame ${kb(frameBytes)}`);
  // The installable app: manifest, icons and the service worker (last: it lists every file of the build).
  const sw = await buildServiceWorker({ root, webDir: join(root, 'dist') });
  log(`service worker precaches ${sw.count} files (${kb(sw.size)})`);
  const z = await precompressDir(join(root, 'dist'));
  log(`compressed ${z.files} files: ${kb(z.bytes)} → ${kb(z.brBytes)} Brotli, ${kb(z.gzBytes)} gzip`);
  writeText(stamp, want);
  log(`web app built in ${((Date.now() - b0) / 1000).toFixed(1)} s`);
}

// 5. The server, compiled once with esbuild (npm start runs plain JavaScript, not TypeScript compiled at start),
// rebuilt when its sources change. Our code is bundled; packages stay in node_modules. An entry added here (a
// worker file) is built beside start.cjs.
const serverEntries = ['scripts/start.ts'];
function ensureServerBuild() {
  const want = hashTree(['server', 'db', 'model', 'calc', 'drawing', 'scripts/start.ts', 'scripts/lib.mjs', 'package-lock.json', 'tsconfig.json']);
  const out = join(root, 'dist-server');
  const stamp = join(out, '.falloff-build.sha256');
  if (readText(stamp) === want && serverEntries.every((e) => existsSync(join(out, `${basename(e, '.ts')}.cjs`)))) return;
  const b0 = Date.now();
  remove(out);
  run(bin('esbuild'), [
    ...serverEntries, '--bundle', '--platform=node', '--target=node20', '--format=cjs', '--packages=external',
    `--outdir=${out}`, '--out-extension:.js=.cjs', '--sourcemap', '--log-level=warning',
    // scripts/lib.mjs finds the project root from its own URL; in the bundle that is dist-server/start.cjs.
    '--define:import.meta.url=__import_meta_url', "--banner:js=const __import_meta_url = require('node:url').pathToFileURL(__filename).href;",
  ], {
    what: 'compiling the server (esbuild)',
    hint: 'esbuild names the file and line above; fix it (npx tsc --noEmit -p . helps) and run the command again.',
  });
  writeText(stamp, want);
  log(`server compiled in ${((Date.now() - b0) / 1000).toFixed(1)} s`);
}

ensureNodeModules();
const pgBin = await ensurePostgres();
ensureDatabase(pgBin, DB_NAME, { fresh: false });
if (forTest) {
  ensureDatabase(pgBin, TEST_DB_NAME, { fresh: true });
  ensureChromium();
}
await ensureWebBuild();
ensureServerBuild();
const probe = capture(join(pgBin, 'pg_isready'), ['-h', '127.0.0.1', '-p', String(PG_PORT)]);
if (probe.status !== 0) fail(`PostgreSQL is not answering on 127.0.0.1:${PG_PORT}: ${probe.stdout}\n[falloff] what to do: see its log in ${join(pgRunDir, 'server.log')}, then run the command again.`);
log(`ready in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
