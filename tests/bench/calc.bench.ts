/**
 * Benchmark of the meter engine. Plain script: `npx tsx tests/bench/calc.bench.ts`.
 * Prints the median of repeated runs for: meter on a 12-light, 6-wall scene with bounce; a full 128 × 128
 * light map for 8 lights, 6 walls and 4 flags; and the cached update after one light moves.
 * Targets (issue 10): the room meter ≤ 2 ms, full map ≤ 16 ms, one-light update ≤ 4 ms. Scenes are invented
 * demo data. The figures in brackets are earlier sessions' (the history); a machine shared with other work
 * inflates medians, so the CPU time a call is printed beside them.
 */
import { createLightMapCache, meter, meterParsed, parseScene, type LightInput, type LightMapGrid, type SceneInput } from '../../calc/index';

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
for (let i = 0; i < 100; i++) meter(meterScene);
const tMeter = time(200, () => meter(meterScene), 'meter');
const tParse = time(300, () => parseScene(meterScene));
const m = meter(meterScene);
console.log(`meter, 12 lights, 6 walls, every bounce, flat receptor (incl. schema parse): ${fmt(tMeter)}   [before issue 10: 0.49–0.64 ms]`);
// Issue 10's case: 12 lights, 6 walls, floor and ceiling, all bounces, dome receptor. The room's geometry (patches,
// couplings, the radiosity transfer) is kept while walls stay, and each light's bounce while it stays: the live meter
// case is a drag, where one light moves per call. The cold case (every light new each call) is printed beside it.
const roomScene: SceneInput = { ...meterScene, floor: { x1: 0, y1: 0, x2: 6, y2: 5 }, ceiling: { heightM: 3 }, options: { receptor: 'dome-camera' } };
const roomParsed = parseScene(roomScene);
let dragStep = 0;
const dragged = () => {
  dragStep++;
  return { ...roomParsed, lights: roomParsed.lights.map((l, i) => (i === 5 ? { ...l, x: l.x + 0.01 * Math.sin(dragStep), y: l.y + 0.01 * Math.cos(dragStep) } : l)) };
};
const allMoved = () => {
  dragStep++;
  return { ...roomParsed, lights: roomParsed.lights.map((l, i) => ({ ...l, x: l.x + 0.01 * Math.sin(dragStep + i) })) };
};
for (let i = 0; i < 50; i++) meterParsed(dragged());
const tRoom = time(200, () => meterParsed(dragged()), 'meter-room, one light moved');
const tRoomSame = time(200, () => meterParsed(roomParsed), 'meter-room, nothing moved');
const tRoomCold = time(60, () => meterParsed(allMoved()), 'meter-room, every light new');
const cpuPerCall = (n: number, fn: () => void) => {
  const c0 = process.cpuUsage();
  for (let i = 0; i < n; i++) fn();
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1000 / n;
};
const mr = meterParsed(roomParsed);
console.log(`meter, 12 lights, 6 walls, floor and ceiling, all bounces, dome, one light moved: ${fmt(tRoom)}   [target ≤ 2 ms; before: 52–144 ms under load]  (CPU time ${fmt(cpuPerCall(200, () => meterParsed(dragged())))} a call)`);
console.log(`  same, nothing moved: ${fmt(tRoomSame)}; every light new (room geometry kept): ${fmt(tRoomCold)} (CPU ${fmt(cpuPerCall(40, () => meterParsed(allMoved())))})`);
console.log(`  later bounces: ${mr.bounces.passes === 0 ? 'solved directly' : `${mr.bounces.passes} passes`}, converged ${mr.bounces.converged}`);
console.log(`  of which schema parse: ${fmt(tParse)}; parsed-scene input: ${fmt(time(300, () => meter(parsedMeterScene)))}`);
console.log(`  subject f/${m.subject.aperture?.toFixed(1)}, ${m.subject.stopsVsCamera?.toFixed(2)} stops vs camera; bounce ${(100 * m.subject.bounceLuxSeconds / m.subject.luxSeconds).toFixed(1)} %`);

// 2. light map on the meter's transport: 128 × 128, 8 lights, 6 walls, 4 flags, floor and ceiling, the dome,
// the subject's body (as setups have it). The worker meters, then maps, each frame: the room is the meter's.
const mapScene = parseScene({
  ...demoScene(8, 4),
  floor: { x1: 0, y1: 0, x2: 6, y2: 5 },
  ceiling: { heightM: 3 },
  options: { receptor: 'dome-camera' },
  subject: { ...demoScene(8, 4).subject, body: { widthM: 0.45, depthM: 0.25, topM: 1.72 } },
});
const grid: LightMapGrid = { x0: 0, y0: 0, x1: 6, y1: 5, nx: 128, ny: 128 };
const points = grid.nx * grid.ny;
const cpu = (n: number, fn: () => void) => {
  const c0 = process.cpuUsage();
  for (let i = 0; i < n; i++) fn();
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1000 / n;
};
const tCold = time(8, () => createLightMapCache().updateParsed(mapScene, grid), 'map, geometry built');
console.log(`light map 128×128, 8 lights, 6 walls, 4 flags, floor, ceiling, body, dome: new grid and room geometry kept: ${fmt(tCold)} (CPU ${fmt(cpu(4, () => createLightMapCache().updateParsed(mapScene, grid)))})`);
const warm = createLightMapCache();
warm.updateParsed(mapScene, grid);
let gen = 0;
const allNew = () => {
  gen++;
  return { ...mapScene, lights: mapScene.lights.map((l) => ({ ...l, powerFraction: l.powerFraction * (gen % 2 ? 0.999 : 1) })) };
};
const tFull = time(40, () => warm.updateParsed(allNew(), grid), 'map, every light new');
console.log(`  every light new (grid kept), with contours and wall tones: ${fmt(tFull)}   [target ≤ 16 ms; before issue 10's map: 5.2–9.2 ms, 27–49 ms under load, with one bounce and no area faces; before the wall-tone and face-ratio work: CPU 47.8 ms; before the summed bounce: CPU 35.0 ms; before the 2026-12-04 speed work: median 20.8 ms, CPU 21.3 ms; before its second round (quiet machine): median 16.2 ms, CPU 16.3 ms]  (CPU ${fmt(cpu(20, () => warm.updateParsed(allNew(), grid)))})`);

// 3. one light moves: only that light's direct grid (coarse, then refined near a big face), its coarse bounce
// and its wall samples are recomputed.
const cache = createLightMapCache();
cache.updateParsed(mapScene, grid);
let step = 0;
const moved = () => {
  step++;
  const lights = mapScene.lights.map((l, i) => (i === 2 ? { ...l, x: l.x + 0.01 * Math.sin(step), y: l.y + 0.01 * Math.cos(step) } : l));
  return { ...mapScene, lights };
};
const tMove = time(200, () => cache.updateParsed(moved(), grid), 'one light moved');
const cpuMove = cpu(100, () => cache.updateParsed(moved(), grid));
console.log(`light map, one light moved (cached): ${fmt(tMove)}   [target ≤ 4 ms; before the wall-tone and face-ratio work: CPU 5.7 ms, 12–13 ms earlier; before the 2026-12-04 speed work: median 9.4 ms, CPU 6.3 ms; before its second round (quiet machine): median 3.74 ms, CPU 4.07 ms]  CPU ${fmt(cpuMove)} a frame  (recomputed ${cache.stats.lightsRecomputed}, reused ${cache.stats.lightsReused})`);
const both = () => {
  const sc = moved();
  meterParsed(sc);
  cache.updateParsed(sc, grid);
};
console.log(`  meter + map for one drag frame (what the worker does): ${fmt(time(100, both, 'meter + map, one light moved'))} (CPU ${fmt(cpu(60, both))})`);
// What the contours cost: the same frame with and without them, CPU time in alternating batches (two medians
// taken minutes apart on a shared machine can differ by more than the part being measured).
const noContours = { ...grid, skipContours: true };
const withoutContours = createLightMapCache();
withoutContours.updateParsed(mapScene, noContours);
const cpuDiff = (batches: number, per: number, a: () => void, b: () => void) => {
  const ta: number[] = [];
  const tb: number[] = [];
  for (let i = 0; i < batches; i++) {
    ta.push(cpu(per, a));
    tb.push(cpu(per, b));
  }
  ta.sort((x, y) => x - y);
  tb.sort((x, y) => x - y);
  return { a: quantile(ta, 0.5), b: quantile(tb, 0.5) };
};
const contourCost = cpuDiff(7, 20, () => cache.updateParsed(moved(), grid), () => withoutContours.updateParsed(moved(), noContours));
console.log(`  of which contours (and their paths): CPU ${fmt(contourCost.a - contourCost.b)} (${fmt(contourCost.a)} with, ${fmt(contourCost.b)} without)`);

// 4. A light added (issue 10's "new light" case): a warm meter and map, then a ninth light never seen before (a
// softbox, so its area face, nine shadow casts and bounce are all new) — what the worker does for that frame.
// Before this round the map summed one bounce kernel pass per light; it now sums the lights' patch luminance
// and makes one pass.
{
  const added = createLightMapCache();
  meterParsed(mapScene);
  added.updateParsed(mapScene, grid);
  let a = 0;
  const base = mapScene.lights[0]!;
  const withNew = () => {
    a++;
    return { ...mapScene, lights: [...mapScene.lights, { ...base, id: 'added', x: 1.2 + 1e-5 * a, y: 3.4, modifier: 'softbox' as const }] };
  };
  const frame = () => {
    const sc = withNew();
    meterParsed(sc);
    added.updateParsed(sc, grid);
  };
  const tAdd = time(60, frame, 'meter + map, a light added');
  console.log(`meter + map, a new light added to 8 (never seen before): ${fmt(tAdd)}   [target ≤ 16 ms; before this round (one bounce pass per light, a result object per direct sample): CPU 11.2 ms, median 8.5 ms]  (CPU ${fmt(cpu(30, frame))})`);
  let b = 0;
  const everyNew = () => {
    b++;
    const sc = { ...mapScene, lights: mapScene.lights.map((l) => ({ ...l, powerFraction: l.powerFraction * (1 - 1e-6 * b) })) };
    meterParsed(sc);
    added.updateParsed(sc, grid);
  };
  console.log(`  meter + map, every light never seen before: ${fmt(time(30, everyNew, 'meter + map, every light new'))}   [before this round: CPU 52.9 ms, median 79 ms]  (CPU ${fmt(cpu(20, everyNew))})`);
}

// Cost per (point × light) of one light's direct grid: a warm single-light map (no bounce, no contours) whose
// light changes every call, less the same map where nothing changed (the sums, stops and wall tones every frame
// pays), CPU time in alternating batches. Before, this subtracted two cold maps' medians (each building the map's
// fixed part) of different scenes, and printed noise, negative at times.
for (const modifier of ['bare-reflector', 'softbox'] as const) {
  const base = demoScene(1, 4);
  const one = parseScene({ ...base, lights: [{ ...base.lights[0]!, modifier }], options: { bounce: false } });
  const g1 = { ...grid, skipContours: true };
  const changing = createLightMapCache();
  changing.updateParsed(one, g1);
  const still = createLightMapCache();
  still.updateParsed(one, g1);
  let p = 0;
  const newLight = () => {
    p++;
    changing.updateParsed({ ...one, lights: [{ ...one.lights[0]!, powerFraction: p % 2 ? 0.999 : 1 }] }, g1);
  };
  const d = cpuDiff(7, 20, newLight, () => still.updateParsed(one, g1));
  console.log(`direct light (${modifier}), per (point × light), 10 occluders: ${(((d.a - d.b) * 1e6) / points).toFixed(1)} ns CPU   [a light recomputed ${fmt(d.a)}, nothing changed ${fmt(d.b)}]`);
}
console.log(`full map, per (point × light): ${((tFull * 1e6) / (points * 8)).toFixed(1)} ns; one-light update per point: ${((tMove * 1e6) / points).toFixed(1)} ns`);
console.log('spread (machine noise):');
for (const line of spreads) console.log(line);
