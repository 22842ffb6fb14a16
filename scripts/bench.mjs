#!/usr/bin/env node
// `npm run bench`: runs each benchmark in tests/bench/ in turn (after ensure.mjs --test) and prints figures.
// Benchmarks measure; they assert nothing and never run inside `npm test`.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { TEST_DB_NAME, bin, databaseUrl, log, root } from './lib.mjs';

const only = process.argv.slice(2);
const files = readdirSync(join(root, 'tests', 'bench'))
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => !only.length || only.some((o) => f.includes(o)))
  .sort();
let failed = 0;
for (const f of files) {
  log(`bench: ${f}`);
  const r = spawnSync(bin('tsx'), [join('tests', 'bench', f)], {
    cwd: root,
    stdio: 'inherit',
    // The serving bench measures the production server (it names its own AUTH_SECRET and PUBLIC_URL); the
    // others start a local test server, which a production NODE_ENV would refuse without them.
    env: { ...process.env, NODE_ENV: f.startsWith('serving') ? 'production' : 'test', TEST_DATABASE_URL: databaseUrl(TEST_DB_NAME) },
  });
  if (r.status !== 0) failed++;
}
process.exit(failed ? 1 : 0);
