// Start tests/support/serve-child.ts as its own process (tsx) and wait until it listens.
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { TEST_DATABASE_URL } from './env';

const root = join(__dirname, '..', '..');

export type ChildServer = { url: string; proc: ChildProcess; exited: () => boolean; stderr: () => string; stop: (signal?: NodeJS.Signals) => Promise<void> };

export async function startChildServer(env: Record<string, string> = {}): Promise<ChildServer> {
  // node itself with tsx's loader (not the tsx command, which runs node as a child of its own): a signal sent
  // to proc, SIGKILL included, reaches the server.
  const proc = spawn(process.execPath, ['--import', 'tsx', join(root, 'tests', 'support', 'serve-child.ts')], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: TEST_DATABASE_URL, PORT: '0', NODE_ENV: 'test', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  let err = '';
  let exited = false;
  const gone = new Promise<void>((r) => proc.once('exit', () => ((exited = true), r())));
  proc.stderr!.on('data', (d) => (err = (err + d).slice(-20_000)));
  const url = await new Promise<string>((resolve, reject) => {
    const t = setTimeout(() => reject(new Error(`server did not start in 60 s: ${err}`)), 60_000);
    proc.stdout!.on('data', (d) => {
      out += d;
      const m = /listening (\S+)/.exec(out);
      if (m) {
        clearTimeout(t);
        resolve(m[1]!);
      }
    });
    proc.once('exit', (code) => {
      clearTimeout(t);
      reject(new Error(`server exited (${code}) before listening: ${err}`));
    });
  });
  return {
    url,
    proc,
    exited: () => exited,
    stderr: () => err,
    async stop(signal = 'SIGTERM') {
      if (!exited) proc.kill(signal);
      await gone;
    },
  };
}
