// Stopping and starting the worktree's private PostgreSQL cluster (.data/pg) for fault tests, with the same
// options scripts/ensure.mjs starts it with. As root pg_ctl runs as `postgres` (scripts/lib.mjs, pgExec).
import { execFile } from 'node:child_process';
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

/** pg_ctl without blocking this process: a test's own traffic keeps going while the cluster stops or starts
 *  (the synchronous versions above hold the test's event loop for as long as pg_ctl takes, seconds on a loaded
 *  machine, so no request of the test's is sent or read meanwhile). */
function pgCtl(args: string[]): Promise<void> {
  const full = join(pgBin(), 'pg_ctl');
  const root = process.getuid?.() === 0;
  const [cmd, argv] = root ? ['runuser', ['-u', 'postgres', '--', full, ...args]] : [full, args];
  return new Promise((resolve, reject) =>
    execFile(cmd, argv, root ? { cwd: '/' } : {}, (err, stdout, stderr) => (err ? reject(new Error(`pg_ctl ${args.at(-1)} failed: ${stdout}${stderr}`)) : resolve())),
  );
}

export const stopClusterAsync = () => pgCtl(['-D', pgDir, '-m', 'fast', '-w', '-t', '60', 'stop']);

export const startClusterAsync = () =>
  pgCtl(['-D', pgDir, '-o', `-c listen_addresses=127.0.0.1 -p ${PG_PORT} -k ${pgRunDir} -c fsync=off`, '-l', join(pgRunDir, 'server.log'), '-w', '-t', '60', 'start']);

/** Start it again with ensure.mjs's test options; a no-op when it is running. */
export function startCluster() {
  if (clusterRunning()) return;
  const opts = `-c listen_addresses=127.0.0.1 -p ${PG_PORT} -k ${pgRunDir} -c fsync=off`;
  const r = pgExec(pgBin(), 'pg_ctl', ['-D', pgDir, '-o', opts, '-l', join(pgRunDir, 'server.log'), '-w', '-t', '60', 'start'], { quiet: true });
  if (r.status !== 0) throw new Error(`pg_ctl start failed: ${r.stdout}${r.stderr}`);
}
