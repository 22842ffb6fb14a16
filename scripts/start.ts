// `npm start` (after scripts/ensure.mjs): serves the app and the API from one process, prints the URL and the
// demo sign-ins. Ctrl-C stops the server and the PostgreSQL that the scripts started.
import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO_PASSWORD, demoUsers } from '../db/demo';
import { fakeServices, startFakes } from '../server/fakes';
import { startServer } from '../server/main';
import { APP_PORT, DB_NAME, dataDir, databaseUrl, findPgBin, log, pgStartedMarker, pgStop } from './lib.mjs';

/**
 * `npm start` runs as production (NODE_ENV=production), which asks for AUTH_SECRET and PUBLIC_URL. On this
 * machine, with neither set, the server gets a random secret of its own kept in .data/auth-secret (so sessions
 * survive a restart) and its loopback address as PUBLIC_URL. Set both for a server other people reach.
 */
function localAuthSettings() {
  if (process.env.AUTH_SECRET || process.env.PUBLIC_URL) return;
  const file = join(dataDir, 'auth-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  process.env.AUTH_SECRET = readFileSync(file, 'utf8').trim();
  process.env.PUBLIC_URL = `http://127.0.0.1:${APP_PORT}`;
}

async function main() {
  localAuthSettings();
  // Local stand-ins for mail and object storage, unless the environment names real ones.
  const useFakes = !process.env.SMTP_URL && !process.env.S3_ENDPOINT;
  const fakes = useFakes ? await startFakes({ s3Dir: join(dataDir, 's3') }) : null;
  const app = await startServer({ databaseUrl: databaseUrl(DB_NAME), port: APP_PORT, logLevel: process.env.LOG_LEVEL ?? 'warn', ...(fakes ? fakeServices(fakes) : {}) });
  log(`Falloff is running at ${app.url}`);
  if (fakes) log(`e-mail stays on this machine: the dev inbox is ${app.url}/dev/inbox (photos are kept in .data/s3)`);
  log(`demo sign-ins, password "${DEMO_PASSWORD}" for each:`);
  for (const [role, u] of Object.entries(demoUsers)) log(`  ${role.padEnd(11)} ${u.email.padEnd(26)} ${u.name}`);
  log('Ctrl-C stops the server and its database.');

  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    await app.close().catch(() => {});
    await fakes?.close().catch(() => {});
    if (existsSync(pgStartedMarker)) {
      pgStop(findPgBin());
      log('PostgreSQL stopped.');
    }
    process.exit(0);
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  process.stderr.write(`[falloff] the server did not start: ${err?.stack ?? err}\n`);
  process.exit(1);
});
