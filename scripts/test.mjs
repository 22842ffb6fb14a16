#!/usr/bin/env node
// `npm test` (after ensure.mjs --test made a fresh test database): typecheck and lint, then the vitest projects in
// order — unit, components, api (real HTTP, real PostgreSQL), e2e (real Chromium) — and one closing line.
//   npm test                       everything
//   npm test -- tests/unit/calc    only files matching a filter (passed on to vitest)
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { root, bin, log, readText, findPgBin, pgStartedMarker, pgStop, TEST_DB_NAME, databaseUrl, remove } from './lib.mjs';

const filters = process.argv.slice(2);
const phases = [
  { name: 'unit + components', projects: ['unit', 'components'] },
  { name: 'api', projects: ['api'] },
  { name: 'e2e', projects: ['e2e'] },
  // Last: these stop and start the test cluster (and start it again whatever happens).
  { name: 'faults', projects: ['faults'] },
];
const totals = { passed: 0, failed: 0, skipped: 0 };
const t0 = Date.now();
const env = { ...process.env, NODE_ENV: 'test', TEST_DATABASE_URL: databaseUrl(TEST_DB_NAME), FORCE_COLOR: process.env.FORCE_COLOR ?? '1', VITE_CONFIG_NATIVE_IGNORE_WARNING: 'true' };

if (!filters.length) {
  log('typecheck (tsc --noEmit)…');
  const tc = spawnSync(bin('tsc'), ['--noEmit', '-p', '.'], { cwd: root, stdio: 'inherit' });
  if (tc.status === 0) totals.passed += 1;
  else totals.failed += 1;
  // Lint: ESLint (TypeScript, React hooks and layer rules; eslint.config.mjs) and knip for files nothing uses.
  log('lint (eslint, knip)…');
  const es = spawnSync(bin('eslint'), ['.'], { cwd: root, stdio: 'inherit' });
  const kn = spawnSync(bin('knip'), ['--no-progress', '--include', 'files'], { cwd: root, stdio: 'inherit' });
  if (es.status === 0 && kn.status === 0) totals.passed += 1;
  else totals.failed += 1;
}

for (const phase of phases) {
  const out = join(root, 'tests', '.artifacts', `vitest-${phase.projects.join('-')}.json`);
  remove(out);
  log(`tests: ${phase.name}…`);
  const args = ['run', ...phase.projects.flatMap((p) => ['--project', p]), '--reporter=default', '--reporter=json', `--outputFile.json=${out}`, '--passWithNoTests', ...filters];
  const r = spawnSync(bin('vitest'), args, { cwd: root, stdio: 'inherit', env });
  if (existsSync(out)) {
    const j = JSON.parse(readFileSync(out, 'utf8'));
    totals.passed += j.numPassedTests;
    totals.failed += j.numFailedTests;
    totals.skipped += j.numPendingTests + (j.numTodoTests ?? 0);
    // A file that failed to load has no tests to count: count it as a failure.
    if (r.status !== 0 && j.numFailedTests === 0) totals.failed += Math.max(1, j.numFailedTestSuites);
  } else if (r.status !== 0) {
    totals.failed += 1;
  }
}

// Stop PostgreSQL only when this test run started it (not when `npm start` is using it).
if (readText(pgStartedMarker) === 'test' && !process.env.FALLOFF_KEEP_PG) {
  pgStop(findPgBin());
}
log(`npm test took ${((Date.now() - t0) / 1000).toFixed(0)} s`);
console.log(`${totals.passed} passed, ${totals.failed} failed${totals.skipped ? `, ${totals.skipped} skipped` : ''}`);
process.exit(totals.failed ? 1 : 0);
