/**
 * What makes the long tasks at start: `npm run bench -- startProfile` (PROFILE_PAGES=share,library,… picks the
 * pages; PROFILE_RUNS runs each, 1 unless set).
 *
 * Loads each page once on the same phone profile as load.bench.ts (tests/bench/loadPages.ts) with V8's sampling
 * profiler on (DevTools protocol, a sample every 200 µs of wall time) and the Long Tasks API watching, until
 * 1.5 s after the page is usable. Each long task (over 50 ms) is then matched with the samples taken during it
 * (the page's clock and the profiler's are aligned by a marker function run in the page at the end) and
 * attributed through the build's source maps (dist-maps/):
 *   - self time by package or folder of ours (where the time is spent),
 *   - self time by function (original name, file and line),
 *   - inclusive time by our own functions on the stack (which of our code caused it: a component, a hook);
 *   - which of the start's steps (entry.web.js marks each) ended in it.
 * Prints the longest tasks of each page, largest first. Measures and prints; the exit code is for a run that broke.
 */
import { existsSync, readFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { TraceMap, originalPositionFor } from '@jridgewell/trace-mapping';
import { chromium } from 'playwright-core';
import { appPages, launchChromium, ownerOf, phonePage } from './loadPages';

const root = join(__dirname, '..', '..');
const SETTLE_MS = 1500;
const USABLE_TIMEOUT_MS = 90_000;
const SAMPLE_US = 200;
const SHOW_TASKS = Number(process.env.PROFILE_TASKS ?? 3);
const PAGES = (process.env.PROFILE_PAGES ?? 'share,library,sign-in').split(',').filter(Boolean);
const RUNS = Number(process.env.PROFILE_RUNS ?? 1);

type CallFrame = { functionName: string; url: string; lineNumber: number; columnNumber: number };
type ProfileNode = { id: number; callFrame: CallFrame; parent?: number; children?: number[] };
type Profile = { nodes: ProfileNode[]; startTime: number; endTime: number; samples: number[]; timeDeltas: number[] };

const watcher = (usable: string) => `
(() => {
  window.__tasks = [];
  try {
    new PerformanceObserver((l) => { for (const e of l.getEntries()) window.__tasks.push({ start: e.startTime, duration: e.duration }); }).observe({ type: 'longtask', buffered: true });
  } catch {}
  const check = () => { try { return Boolean((${usable})()); } catch { return false; } };
  const tick = () => { if (check()) window.__usableAt = performance.now(); else requestAnimationFrame(tick); };
  requestAnimationFrame(tick);
  // Runs for 30 ms of the page's clock: its samples tie the profiler's clock to performance.now().
  window.__falloffClockMarker = function falloffClockMarker() {
    const t0 = performance.now();
    while (performance.now() - t0 < 30) {}
    return t0;
  };
})();`;

// ——— source maps ———

const maps = new Map<string, TraceMap | null>();
function mapFor(url: string): TraceMap | null {
  const name = basename(new URL(url).pathname);
  if (!maps.has(name)) {
    const p = join(root, 'dist-maps', `${name}.map`);
    maps.set(name, existsSync(p) ? new TraceMap(readFileSync(p, 'utf8')) : null);
  }
  return maps.get(name)!;
}

type Where = { fn: string; source: string; owner: string; ours: boolean };
const whereCache = new Map<number, Where>();
/** The original function name, source file and line of a profile node, and who owns that file. */
function whereOf(node: ProfileNode): Where {
  const hit = whereCache.get(node.id);
  if (hit) return hit;
  const f = node.callFrame;
  let w: Where;
  if (!f.url) w = { fn: f.functionName || '(native)', source: '', owner: f.functionName.startsWith('(') ? f.functionName : '(browser)', ours: false };
  else {
    const map = /^https?:/.test(f.url) ? mapFor(f.url) : null;
    const pos = map ? originalPositionFor(map, { line: f.lineNumber + 1, column: f.columnNumber }) : null;
    if (pos?.source) {
      const source = pos.source.replace(/^(\.\.\/|\.\/|\/)+/, '').replace(/^.*node_modules\//, 'node_modules/');
      const owner = ownerOf(pos.source);
      w = { fn: `${pos.name ?? f.functionName ?? '(anonymous)'}`, source: `${source}:${pos.line}`, owner, ours: owner.endsWith('(ours)') };
    } else {
      const path = new URL(f.url).pathname;
      w = { fn: f.functionName || '(anonymous)', source: `${path}:${f.lineNumber + 1}`, owner: path.startsWith('/workers/') ? `worker ${path}` : path, ours: false };
    }
  }
  whereCache.set(node.id, w);
  return w;
}

// ——— one profiled load ———

async function profileOnce(browser: Awaited<ReturnType<typeof launchChromium>>, spec: Parameters<typeof phonePage>[1], cookies: Parameters<typeof phonePage>[2]) {
  const { context, page, cdp } = await phonePage(browser, spec, cookies);
  try {
    await page.addInitScript(watcher(spec.usable));
    await cdp.send('Profiler.enable');
    await cdp.send('Profiler.setSamplingInterval', { interval: SAMPLE_US });
    await cdp.send('Profiler.start');
    await page.goto(spec.url, { waitUntil: 'commit', timeout: USABLE_TIMEOUT_MS });
    const usable = await page
      .waitForFunction(() => (window as unknown as { __usableAt?: number }).__usableAt, undefined, { timeout: USABLE_TIMEOUT_MS, polling: 250 })
      .then((h) => h.jsonValue() as Promise<number>, () => null);
    await page.waitForTimeout(SETTLE_MS);
    const markerAt = await page.evaluate(() => (window as unknown as { __falloffClockMarker: () => number }).__falloffClockMarker());
    const tasks = await page.evaluate(() => (window as unknown as { __tasks: { start: number; duration: number }[] }).__tasks.slice());
    // The start's steps (entry.web.js marks each one's end).
    const marks = await page.evaluate(() => performance.getEntriesByType('mark').filter((m) => m.name.startsWith('falloff:')).map((m) => ({ name: m.name, at: m.startTime })));
    const { profile } = (await cdp.send('Profiler.stop')) as unknown as { profile: Profile };
    return { usable, tasks, profile, markerAt, marks };
  } finally {
    await context.close();
  }
}

/** Sample times (µs on the profiler's clock) and their nodes. */
function samplesOf(p: Profile) {
  const out: { t: number; node: number }[] = [];
  let t = p.startTime;
  for (let i = 0; i < p.samples.length; i++) {
    t += p.timeDeltas[i] ?? 0;
    out.push({ t, node: p.samples[i]! });
  }
  return out;
}

type Attribution = { byOwner: Map<string, number>; byFn: Map<string, number>; oursInclusive: Map<string, number>; sampled: number };

function attribute(p: Profile, from: number, to: number, byId: Map<number, ProfileNode>, samples: { t: number; node: number }[]): Attribution {
  const a: Attribution = { byOwner: new Map(), byFn: new Map(), oursInclusive: new Map(), sampled: 0 };
  const add = (m: Map<string, number>, k: string, v: number) => m.set(k, (m.get(k) ?? 0) + v);
  for (let i = 0; i < samples.length; i++) {
    const s = samples[i]!;
    if (s.t < from || s.t > to) continue;
    const dt = ((samples[i + 1]?.t ?? s.t) - s.t) / 1000;
    const node = byId.get(s.node)!;
    const w = whereOf(node);
    if (w.fn === '(idle)') continue;
    a.sampled += dt;
    add(a.byOwner, w.owner, dt);
    add(a.byFn, `${w.fn}  ${w.source}`, dt);
    // Each of our functions on the stack once per sample.
    const seen = new Set<string>();
    for (let n: ProfileNode | undefined = node; n; n = n.parent !== undefined ? byId.get(n.parent) : undefined) {
      const wn = whereOf(n);
      if (!wn.ours) continue;
      const k = `${wn.fn}  ${wn.source.replace(/:\d+$/, '')}`;
      if (!seen.has(k)) {
        seen.add(k);
        add(a.oursInclusive, k, dt);
      }
    }
  }
  return a;
}

const top = (m: Map<string, number>, n: number) => [...m].sort((x, y) => y[1] - x[1]).slice(0, n);
const ms = (x: number) => `${x.toFixed(0)} ms`.padStart(8);

async function main() {
  const app = await appPages();
  const browser = await launchChromium(chromium);
  let broken = 0;
  try {
    for (const name of PAGES) {
      const spec = app.specs.find((s) => s.name === name);
      if (!spec) throw new Error(`no page named ${name} (pages: ${app.specs.map((s) => s.name).join(', ')})`);
      for (let r = 0; r < RUNS; r++) {
        const run = await profileOnce(browser, spec, app.cookies);
        if (run.usable === null) broken++;
        const byId = new Map(run.profile.nodes.map((n) => [n.id, n]));
        for (const n of run.profile.nodes) for (const c of n.children ?? []) byId.get(c)!.parent = n.id;
        const samples = samplesOf(run.profile);
        // The clocks: the first sample inside the marker function is (about) when it started.
        const markerSample = samples.find((s) => byId.get(s.node)!.callFrame.functionName === 'falloffClockMarker');
        if (!markerSample) throw new Error('the clock marker left no sample');
        const offsetUs = markerSample.t - run.markerAt * 1000;
        const tasks = [...run.tasks].sort((x, y) => y.duration - x.duration);
        const total = tasks.reduce((s, t) => s + t.duration, 0);
        console.log(`\n${spec.name} (run ${r + 1}): usable ${run.usable === null ? 'never' : `${(run.usable / 1000).toFixed(2)} s`}; ${tasks.length} long task(s), ${total.toFixed(0)} ms in all, longest ${(tasks[0]?.duration ?? 0).toFixed(0)} ms`);
        for (const t of tasks.slice(0, SHOW_TASKS)) {
          const a = attribute(run.profile, t.start * 1000 + offsetUs, (t.start + t.duration) * 1000 + offsetUs, byId, samples);
          const ended = run.marks.filter((m) => m.at >= t.start && m.at <= t.start + t.duration).map((m) => m.name);
          console.log(`  task at ${(t.start / 1000).toFixed(2)} s, ${t.duration.toFixed(0)} ms (${a.sampled.toFixed(0)} ms sampled)${ended.length ? `; ends ${ended.join(', ')}` : ''}`);
          console.log('    self time by package or folder:');
          for (const [k, v] of top(a.byOwner, 6)) console.log(`    ${ms(v)}  ${k}`);
          console.log('    self time by function:');
          for (const [k, v] of top(a.byFn, 8)) console.log(`    ${ms(v)}  ${k}`);
          console.log('    our functions on the stack (inclusive):');
          for (const [k, v] of top(a.oursInclusive, 8)) console.log(`    ${ms(v)}  ${k}`);
        }
      }
    }
  } finally {
    await browser.close();
    await app.close();
  }
  process.exit(broken ? 1 : 0);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
