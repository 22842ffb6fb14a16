/**
 * Benchmark of the meter engine. Plain script: `npx tsx tests/bench/calc.bench.ts`.
 * Prints the median of repeated runs for: meter on a 12-light, 6-wall scene with bounce; a full 128 × 128
 * light map for 8 lights, 6 walls and 4 flags; and the cached update after one light moves.
 * Targets (issue 3): meter ≤ 1 ms, full map ≤ 16 ms, one-light update ≤ 4 ms. Scenes are invented demo data.
 */
import { createLightMapCache, meter, parseScene, type LightInput, type LightMapGrid, type SceneInput } from '../../calc/index';

// Piping into `head` closes stdout early; stop quietly then.
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code === 'EPIPE') process.exit(0);
  throw e;
});

const MODS = ['softbox', 'octa', 'strip', 'umbrella-reflective', 'beauty-dish', 'grid-20', 'bare-reflector', 'snoot'] as const;
const GELS = ['none', 'half-cto', 'quarter-ctb', 'none', 'plus-green', 'none', 'full-cto', 'none'] as const;

function demoLights(n: number): LightInput[] {
  const out: LightInput[] = [];
  for (let i = 0; i < n; i++) {
    const a = (i / n) * 2 * Math.PI;
    const r = 1.8 + (i % 3) * 0.6;
    const x = 3 + r * Math.cos(a);
    const y = 2.5 + r * Math.sin(a);
    const aim = (Math.atan2(2.5 - y, 3 - x) * 180) / Math.PI;
    out.push(
      i % 4 === 3
        ? { id: `L${i}`, kind: 'continuous', x, y, heightM: 1.8, aimDeg: aim, tiltDeg: -5, output: { type: 'luxAt1m', lux: 4000 }, modifier: MODS[i % MODS.length]!, gel: GELS[i % GELS.length]! }
        : { id: `L${i}`, kind: 'flash', x, y, heightM: 2.2, aimDeg: aim, tiltDeg: -15, output: { type: 'energy', ratedWs: 400 }, powerFraction: 1 / (1 << (i % 6)), modifier: MODS[i % MODS.length]!, gel: GELS[i % GELS.length]! },
    );
  }
  return out;
}

function demoScene(lights: number, flags: number): SceneInput {
  // A 6 m × 5 m room: four walls, a seamless backdrop and a white v-flat.
  return {
    lights: demoLights(lights),
    surfaces: [
      { id: 'north', x1: 0, y1: 0, x2: 6, y2: 0, colour: '#d8d2c8' },
      { id: 'east', x1: 6, y1: 0, x2: 6, y2: 5, colour: '#c8c8c8' },
      { id: 'south', x1: 6, y1: 5, x2: 0, y2: 5, colour: '#8a9aa8' },
      { id: 'west', x1: 0, y1: 5, x2: 0, y2: 0, colour: '#c0b090' },
      { id: 'paper', kind: 'backdrop', x1: 0.4, y1: 1, x2: 0.4, y2: 4, topM: 2.7, colour: '#707070' },
      { id: 'vflat', kind: 'v-flat', x1: 4.5, y1: 3.6, x2: 5.2, y2: 3.0, topM: 2.4, colour: '#f4f4f4', backColour: '#101010' },
    ],
    flags: Array.from({ length: flags }, (_, i) => ({
      id: `F${i}`,
      x1: 1.5 + i * 0.9,
      y1: 1.2,
      x2: 1.9 + i * 0.9,
      y2: 1.0,
      baseM: 0.5,
      topM: 2.0,
    })),
    subject: { x: 3, y: 2.5, heightM: 1.6, facingDeg: 0 },
    camera: { x: 5.6, y: 2.5, heightM: 1.6, aimDeg: 180, aperture: 8, shutterS: 1 / 160, iso: 100 },
    ambient: { ev100: 5 },
    probes: [{ id: 'hair', x: 3, y: 2.4, z: 1.8 }],
  };
}

function quantile(sorted: number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!;
}

/** Median time of `runs` calls after a warm-up, in ms; the 10th–90th percentile spread is kept for the report. */
const spreads: string[] = [];
function time(runs: number, fn: () => void, label?: string): number {
  for (let i = 0; i < Math.min(100, runs); i++) fn(); // warm up the JIT
  const ts: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    ts.push(performance.now() - t0);
  }
  ts.sort((a, b) => a - b);
  if (label) spreads.push(`  ${label}: p10 ${quantile(ts, 0.1).toFixed(3)} ms, p90 ${quantile(ts, 0.9).toFixed(3)} ms`);
  return quantile(ts, 0.5);
}

const fmt = (ms: number) => `${ms.toFixed(3)} ms`;

// 1. meter: 12 lights, 6 walls, bounce on.
const meterScene = demoScene(12, 0);
const parsedMeterScene = parseScene(meterScene);
// Warm every path first, so the first figure is not paying for JIT tiers the later ones already got.
for (let i = 0; i < 1000; i++) meter(meterScene);
const tMeter = time(500, () => meter(meterScene), 'meter');
const tParse = time(300, () => parseScene(meterScene));
const m = meter(meterScene);
console.log(`meter, 12 lights, 6 walls, bounce (incl. schema parse): ${fmt(tMeter)}   [target ≤ 1 ms]`);
console.log(`  of which schema parse: ${fmt(tParse)}; parsed-scene input: ${fmt(time(300, () => meter(parsedMeterScene)))}`);
console.log(`  subject f/${m.subject.aperture?.toFixed(1)}, ${m.subject.stopsVsCamera?.toFixed(2)} stops vs camera; bounce ${(100 * m.subject.bounceLuxSeconds / m.subject.luxSeconds).toFixed(1)} %`);

// 2. full light map: 128 × 128, 8 lights, 6 walls, 4 flags.
const mapScene = parseScene(demoScene(8, 4));
const grid: LightMapGrid = { x0: 0, y0: 0, x1: 6, y1: 5, nx: 128, ny: 128 };
const points = grid.nx * grid.ny;
const tFull = time(60, () => createLightMapCache().updateParsed(mapScene, grid), 'full map');
const tFullNoContours = time(40, () => createLightMapCache().updateParsed(mapScene, { ...grid, skipContours: true }));
console.log(`light map 128×128, 8 lights, 6 walls, 4 flags, full: ${fmt(tFull)}   [target ≤ 16 ms]`);
console.log(`  without contours: ${fmt(tFullNoContours)}; contours: ${fmt(tFull - tFullNoContours)}`);

// 3. one light moves: cached update.
const cache = createLightMapCache();
cache.updateParsed(mapScene, grid);
let step = 0;
const moved = () => {
  step++;
  const lights = mapScene.lights.map((l, i) => (i === 2 ? { ...l, x: l.x + 0.01 * Math.sin(step), y: l.y + 0.01 * Math.cos(step) } : l));
  return { ...mapScene, lights };
};
const tMove = time(300, () => cache.updateParsed(moved(), grid), 'one light moved');
console.log(`light map, one light moved (cached): ${fmt(tMove)}   [target ≤ 4 ms]  (recomputed ${cache.stats.lightsRecomputed}, reused ${cache.stats.lightsReused})`);
const tMoveParse = time(200, () => cache.update(moved(), grid));
console.log(`  same through update() with schema parse: ${fmt(tMoveParse)}`);

// Cost per (point × light) of the direct-light loop alone: a single-light map without bounce or contours.
const oneLight = parseScene({ ...demoScene(1, 4), options: { bounce: false } });
const tOne = time(100, () => createLightMapCache().updateParsed(oneLight, { ...grid, skipContours: true }));
const noLights = parseScene({ ...demoScene(0, 4), options: { bounce: false } });
const tZero = time(100, () => createLightMapCache().updateParsed(noLights, { ...grid, skipContours: true }));
console.log(`direct light, per (point × light), 10 occluders: ${(((tOne - tZero) * 1e6) / points).toFixed(1)} ns`);
console.log(`full map, per (point × light): ${((tFull * 1e6) / (points * 8)).toFixed(1)} ns; one-light update per point: ${((tMove * 1e6) / points).toFixed(1)} ns`);
console.log('spread (machine noise):');
for (const line of spreads) console.log(line);
