/**
 * The one load runner the HTTP benchmarks share (api.bench.ts, serving.bench.ts): the servers under test live in
 * a child process (forked from the bench file with `serve`), this process drives them with autocannon and asks
 * the child for its CPU time around each run, so every row carries server CPU per request beside req/s and
 * latency (on a shared machine it varies less than they do). BENCH_PROF=1 writes a CPU profile of the child to
 * tests/.artifacts/bench-profile/. The child answers `{ cpu: true }` with `{ cpuMs }` (`answerCpu`).
 */
import autocannon from 'autocannon';
import { fork, type ChildProcess } from 'node:child_process';

export type Row = { name: string; rps: number; p50: number; p99: number; bytes: number; cpuMsPerReq: number; errors: number; non2xx: number };

/** The next message from the child that carries `key`, its value. */
export function fromChild<T>(child: ChildProcess, key: string): Promise<T> {
  return new Promise((resolve) => {
    const on = (m: Record<string, unknown>) => {
      if (key in m) {
        child.off('message', on);
        resolve(m[key] as T);
      }
    };
    child.on('message', on);
  });
}

/** In the child: answer the runner's CPU questions. */
export function answerCpu() {
  process.on('message', (m: { cpu?: boolean }) => {
    if (!m?.cpu) return;
    const u = process.cpuUsage();
    process.send!({ cpuMs: (u.user + u.system) / 1000 });
  });
}

/**
 * Forks `file serve` as the server child (stdio as given, IPC always) and bounds the whole bench: after
 * `limitMs` the child is killed and this process exits 2. `done()` lifts the bound.
 */
export function startChild(file: string, o: { stdio?: 'inherit' | 'quiet'; limitMs?: number } = {}) {
  const child = fork(file, ['serve'], {
    stdio: o.stdio === 'quiet' ? ['ignore', 'ignore', 'inherit', 'ipc'] : 'inherit',
    execArgv: [...process.execArgv, ...(process.env.BENCH_PROF ? ['--cpu-prof', '--cpu-prof-dir=tests/.artifacts/bench-profile'] : [])],
  });
  const limitMs = o.limitMs ?? 180_000;
  const guard = setTimeout(() => {
    process.stderr.write(`benchmark took longer than ${limitMs / 60_000} minutes; stopping\n`);
    child.kill();
    process.exit(2);
  }, limitMs);
  return { child, done: () => clearTimeout(guard) };
}

/** A runner against one child: `run(name, autocannon options)` → one row. */
export function runner(child: ChildProcess, defaults: { connections: number; seconds: number }) {
  const serverCpuMs = async () => {
    child.send({ cpu: true });
    return fromChild<number>(child, 'cpuMs');
  };
  return async function run(name: string, opts: autocannon.Options): Promise<Row> {
    const cpu0 = await serverCpuMs();
    const r = await autocannon({ connections: defaults.connections, duration: defaults.seconds, ...opts });
    const cpu = (await serverCpuMs()) - cpu0;
    const n = Math.max(1, r.requests.total);
    return { name, rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, bytes: r.throughput.total / n, cpuMsPerReq: cpu / n, errors: r.errors + r.timeouts, non2xx: r.non2xx };
  };
}

/** Runs `serve` in the child or `main` in the driver, as the bench file was started. */
export function benchMain(serve: () => Promise<void>, main: () => Promise<void>) {
  const fail = (err: unknown) => {
    process.stderr.write(`${(err as Error)?.stack ?? err}\n`);
    process.exit(1);
  };
  if (process.argv[2] === 'serve') serve().catch(fail);
  else main().catch(fail);
}
