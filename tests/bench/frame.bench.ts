/**
 * Benchmark of the frame. Plain script: `npx tsx tests/bench/frame.bench.ts` (or `npm run bench -- frame`).
 * For the three demo setups and look 1 (wash and kicker): the coarse frame a drag gets (128 px, bounce every
 * 4th pixel) and the refined frame when the hand stops (640 px, bounce every 2nd pixel), each the median of
 * repeated renders after a warm-up, wall time and this thread's CPU time (on a loaded machine the CPU time is
 * the better guide to a quiet one). Also: coarse frames per second while one light moves (a new scene every
 * frame, as a drag sends). Targets (issue 13): coarse ≥ 30 updates/s, refined 640 px ≤ 300 ms median.
 * The renderer is timed as the editor's Web Worker runs it: calc/frame bundled and minified by esbuild with the
 * worker's own flags (scripts/ensure.mjs), loaded here from a temporary file. (Run through tsx instead, each
 * imported constant is a getter and each closure is named at creation: slower than what ships.)
 */
import { cpus, loadavg } from 'node:os';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildSync } from 'esbuild';
import { demoSetups } from '../../db/seed-setups';
import type { SetupDocument } from '../../model/document';
import { frameInputFromDocument } from '../../model/frame';
import { washAndKicker } from '../support/frameLooks';
import { COARSE_LATTICE_STEP, REFINED_LATTICE_STEP } from '../../components/frame/useFrame';

process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code === 'EPIPE') process.exit(0);
  throw e;
});

const dir = mkdtempSync(join(tmpdir(), 'falloff-frame-bench-'));
const bundle = join(dir, 'frame.cjs');
buildSync({ entryPoints: ['calc/frame/index.ts'], bundle: true, format: 'cjs', platform: 'node', minify: true, target: 'es2022', outfile: bundle, logLevel: 'warning' });
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { renderFrame } = require(bundle) as typeof import('../../calc/frame');
process.on('exit', () => rmSync(dir, { recursive: true, force: true }));

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

function time(fn: () => void): { wall: number; cpu: number } {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  fn();
  const wall = performance.now() - t0;
  const c = process.cpuUsage(c0);
  return { wall, cpu: (c.user + c.system) / 1000 };
}

const cases: { name: string; doc: SetupDocument }[] = [
  ...demoSetups.map((s) => ({ name: s.title, doc: s.document })),
  { name: 'Look 1: blue wash and a snooted kicker', doc: washAndKicker },
];

console.log(`frame bench — ${cpus().length} cores, load average ${loadavg()[0]!.toFixed(1)}`);
for (const c of cases) {
  const input = frameInputFromDocument(c.doc).input!;
  const runs = (width: number, latticeStep: number, n: number) => {
    renderFrame(input, { width, latticeStep }); // warm-up
    const r = Array.from({ length: n }, () => time(() => renderFrame(input, { width, latticeStep })));
    return { wall: median(r.map((x) => x.wall)), cpu: median(r.map((x) => x.cpu)) };
  };
  const coarse = runs(128, COARSE_LATTICE_STEP, 15);
  const refined = runs(640, REFINED_LATTICE_STEP, 5);
  console.log(`  ${c.name}`);
  console.log(`    coarse 128 px: ${coarse.wall.toFixed(1)} ms wall, ${coarse.cpu.toFixed(1)} ms CPU (${(1000 / coarse.cpu).toFixed(0)} frames/s of CPU)   [≥ 30 updates/s]`);
  console.log(`    refined 640 px: ${refined.wall.toFixed(0)} ms wall, ${refined.cpu.toFixed(0)} ms CPU   [≤ 300 ms median]`);
}

// A drag: the look-1 wash light moves 2 cm a frame; each frame prepares and renders the coarse picture.
{
  const base = washAndKicker;
  const frames = 40;
  const t = time(() => {
    for (let k = 0; k < frames; k++) {
      const doc = { ...base, items: base.items.map((i) => (i.id === 'wash' && i.kind === 'light' ? { ...i, x: i.x - 0.02 * k } : i)) };
      renderFrame(frameInputFromDocument(doc).input!, { width: 128, latticeStep: COARSE_LATTICE_STEP }); // prepared anew each frame
    }
  });
  console.log(`  drag (look 1, the wash light moving, ${frames} coarse frames, scene prepared each time): ${(frames / (t.wall / 1000)).toFixed(1)} frames/s wall, ${(frames / (t.cpu / 1000)).toFixed(1)} frames/s of CPU   [≥ 30]`);
}
