// Stopping and starting the worktree's private PostgreSQL cluster (.data/pg) for fault tests, with the same
// options scripts/ensure.mjs starts it with. As root pg_ctl runs as `postgres` (scripts/lib.mjs, pgExec).
import { join } from 'node:path';
import { findPgBin, pgDir, pgExec, pgIsRunning, pgRunDir, PG_PORT } from '../../scripts/lib.mjs';

const pgBin = (): string => {
  const b = findPgBin();
  if (!b) throw new Error('no PostgreSQL binaries found');
  return b;
};

export function clusterRunning(): boolean {
  return pgIsRunning(pgBin());
}

/** Stop the cluster now (fast shutdown: open connections are ended, as in a restart or failover). */
export function stopCluster() {
  const r = pgExec(pgBin(), 'pg_ctl', ['-D', pgDir, '-m', 'fast', '-w', '-t', '60', 'stop'], { quiet: true });
  if (r.status !== 0) throw new Error(`pg_ctl stop failed: ${r.stdout}${r.stderr}`);
}

/** Start it again with ensure.mjs's test options; a no-op when it is running. */
export function startCluster() {
  if (clusterRunning()) return;
  const opts = `-c listen_addresses=127.0.0.1 -p ${PG_PORT} -k ${pgRunDir} -c fsync=off`;
  const r = pgExec(pgBin(), 'pg_ctl', ['-D', pgDir, '-o', opts, '-l', join(pgRunDir, 'server.log'), '-w', '-t', '60', 'start'], { quiet: true });
  if (r.status !== 0) throw new Error(`pg_ctl start failed: ${r.stdout}${r.stderr}`);
}
