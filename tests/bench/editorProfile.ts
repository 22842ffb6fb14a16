// A readable CPU profile of a drag in Chromium: `npx tsx tests/bench/editorProfile.ts [phone] [first]` (after
// scripts/ensure.mjs --test built the web app). It drags (the drag of dragDriver.ts) a light across the bench's forty-item plan with the
// DevTools protocol's sampling profiler on, maps every sample of the built bundle back to its source file and
// function through the source maps in dist-maps/, and prints where the main thread's time went: by package or
// project folder, by source file, and the heaviest functions (self time). Not part of `npm run bench` (it
// prints a breakdown, not a figure to track).
import { readFileSync, existsSync } from 'node:fs';
import { basename, join } from 'node:path';
import { TraceMap, originalPositionFor } from '@jridgewell/trace-mapping';
import { fortyItems } from './editorPlan';
import { MOVES, centreOf, drag, openSetup, startBench } from './dragDriver';

type CallFrame = { functionName: string; url: string; lineNumber: number; columnNumber: number };
type ProfileNode = { id: number; callFrame: CallFrame; children?: number[] };
type Profile = { nodes: ProfileNode[]; samples: number[]; timeDeltas: number[]; startTime: number; endTime: number };

const phone = process.argv.includes('phone');
/** `first`: the first drag after the setup opens (CPU slowed from the first byte on the phone, the press 300 ms
 *  after the light shows), profiled from the press, as the editor bench's first-drag figure measures it. */
const first = process.argv.includes('first');

const maps = new Map<string, TraceMap | null>();
function mapFor(url: string): TraceMap | null {
  const file = basename(new URL(url, 'http://x').pathname);
  if (!maps.has(file)) {
    const p = join('dist-maps', `${file}.map`);
    maps.set(file, existsSync(p) ? new TraceMap(readFileSync(p, 'utf8')) : null);
  }
  return maps.get(file)!;
}

/** Where a sampled frame comes from: its source file (shortened to package or project path) and function. */
function place(cf: CallFrame): { file: string; fn: string; group: string } {
  if (!cf.url) return { file: `(${cf.functionName || 'native'})`, fn: cf.functionName || '(anonymous)', group: `(${cf.functionName || 'native'})` };
  const m = cf.url.includes('/_expo/') ? mapFor(cf.url) : null;
  let file = cf.url.replace(/^https?:\/\/[^/]+/, '');
  let fn = cf.functionName || '(anonymous)';
  if (m) {
    const o = originalPositionFor(m, { line: cf.lineNumber + 1, column: cf.columnNumber });
    if (o.source) file = o.source.replace(/^.*?node_modules\//, 'node_modules/').replace(/^(\.\.\/)+/, '');
    if (o.name) fn = o.name;
    fn = `${fn} :${o.line ?? '?'}`;
  }
  const pkg = /node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(file);
  const group = pkg ? pkg[1]! : file.includes('/workers/') ? 'worker bundle' : file.split('/').slice(0, file.startsWith('/') ? 2 : 1).join('/');
  return { file, fn, group };
}

async function main() {
  const bench = await startBench();
  try {
    const viewport = phone ? { width: 390, height: 844 } : { width: 1440, height: 900 };
    const { page, cdp } = await openSetup(bench, { viewport, account: 'demo', title: 'Profile: forty items', document: fortyItems(), ready: 'item-l0', cpuSlowdown: first && phone ? 4 : 1 });
    let start = await centreOf(page, 'item-l0');
    if (first) await page.waitForTimeout(300);
    else {
      await page.getByRole('button', { name: 'Snapping on' }).click();
      await page.waitForTimeout(1500);
      if (phone) await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
      start = await centreOf(page, 'item-l0');
      // A first short drag selects the light (so the profiled drag is of a selected light, as in use).
      await drag(cdp, start, (k) => ({ x: k, y: 0 }), 10);
      await page.waitForTimeout(1500);
      start = { x: start.x + 10, y: start.y };
    }
    await cdp.send('Profiler.enable');
    await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
    await cdp.send('Profiler.start');
    await drag(cdp, start, (k) => ({ x: -k * 3, y: -k * 1.5 }));
    await page.waitForTimeout(1000);
    const { profile } = (await cdp.send('Profiler.stop')) as unknown as { profile: Profile };

    const byId = new Map(profile.nodes.map((n) => [n.id, n]));
    const self = new Map<number, number>();
    profile.samples.forEach((id, k) => self.set(id, (self.get(id) ?? 0) + (profile.timeDeltas[k] ?? 0) / 1000));
    const total = (profile.endTime - profile.startTime) / 1000;
    const groups = new Map<string, number>();
    const files = new Map<string, number>();
    const fns = new Map<string, number>();
    let busy = 0;
    for (const [id, ms] of self) {
      const cf = byId.get(id)!.callFrame;
      if (cf.functionName === '(idle)' || cf.functionName === '(program)') continue;
      busy += ms;
      const p = place(cf);
      groups.set(p.group, (groups.get(p.group) ?? 0) + ms);
      files.set(p.file, (files.get(p.file) ?? 0) + ms);
      fns.set(`${p.fn}  ${p.file}`, (fns.get(`${p.fn}  ${p.file}`) ?? 0) + ms);
    }
    // Inclusive time of the project's own functions (components show up here with all they render).
    const parent = new Map<number, number>();
    for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
    const inclusive = new Map<string, number>();
    for (const [id, ms] of self) {
      const seen = new Set<string>();
      for (let n: number | undefined = id; n !== undefined; n = parent.get(n)) {
        const cf = byId.get(n)!.callFrame;
        if (!cf.url.includes('/_expo/')) continue;
        const p = place(cf);
        if (p.file.includes('node_modules/')) continue;
        const key = `${p.fn}  ${p.file}`;
        if (seen.has(key)) continue;
        seen.add(key);
        inclusive.set(key, (inclusive.get(key) ?? 0) + ms);
      }
    }
    const top = (m: Map<string, number>, n: number) =>
      [...m]
        .sort((a, b) => b[1] - a[1])
        .slice(0, n)
        .map(([k, v]) => `  ${v.toFixed(0).padStart(6)} ms ${((100 * v) / busy).toFixed(1).padStart(5)} %  ${k}`)
        .join('\n');
    console.log(`${phone ? 'phone (CPU 4× slower)' : 'desktop'}${first ? ', the first drag after opening' : ''}: ${MOVES} moves; profile ${total.toFixed(0)} ms, JS busy ${busy.toFixed(0)} ms (${(busy / MOVES).toFixed(1)} ms a move)`);
    console.log(`by package / folder:\n${top(groups, 15)}`);
    console.log(`by file:\n${top(files, 25)}`);
    console.log(`by function (self):\n${top(fns, 40)}`);
    console.log(`project functions (inclusive):\n${top(inclusive, 40)}`);
  } finally {
    await bench.close();
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
