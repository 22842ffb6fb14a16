/**
 * The light map: exposure over a horizontal grid at subject height, in stops relative to the meter's own
 * reading at the subject, with one-stop contour lines (and their SVG paths, ready to draw) and the tone the
 * camera records along each wall. Built for drag frames: a cache keeps one direct-light grid and one coarse
 * bounce grid per light, so moving one light recomputes that light alone.
 *
 * Model: the meter's (room.ts, see README.md) — the same lights (area faces), occluders (the subject's body
 * shades what is behind it), patches on walls, floor and ceiling with every bounce; the receptor is the
 * setup's (a dome pointed at the camera from each point, a flat disc along the face, or pointed at each
 * light). Direct light at every point; bounce on a grid `bounceStep` times coarser (default 4), interpolated.
 */
import { contourLines, type ContourLevel } from './contours';
import { contourLinesD3 } from './contours-d3';
import { luxFromEv100, luxSecondsForAperture } from './exposure';
import { kelvinToLinearRgb, relativeLuminance, type Rgb } from './colour';
import { type Geometry, bounceCoarse, bounceSplit, buildGeometry, directGrid, mapReceptorKind } from './lightmap-grid';
import { DARK_LUX_SECONDS, recordedTone } from './meter';
import type { RecordedTone } from './results';
import { type Room, type RoomLight, buildRoom, directLux, gather, subjectReceptors } from './room';
import { type Scene, type SceneInput, parseScene } from './sceneSchema';

/** Where to compute the map. Grid point (i, j) is at (x0 + i·(x1−x0)/(nx−1), y0 + j·(y1−y0)/(ny−1)). */
export type LightMapGrid = {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
  nx: number;
  ny: number;
  /** Height of the map plane, m; default the subject's height. */
  heightM?: number;
  /**
   * Receptor at each point. Default: the setup's receptor (scene.options.receptor) — a dome pointed at the
   * camera, a flat disc along the subject's facing, or a flat disc pointed at each light — so the map reads the
   * meter's value at the subject. Given: a flat disc facing 'subject' (the subject's facing), 'camera' (each
   * point faces the camera on the plan) or a plan angle in degrees.
   */
  facing?: 'subject' | 'camera' | number;
  /** Bounce is computed every bounceStep points and interpolated (default 4; 1 = every point). */
  bounceStep?: number;
  /** Stops value given to unlit or very dark points (default −10). */
  floorStops?: number;
  /** Contour spacing in stops (default 1). */
  contourStepStops?: number;
  /** Lowest contour level drawn, stops (default −6: darker than that reads as black in a frame). */
  contourMinStops?: number;
  /** Skip contour extraction (default false). */
  skipContours?: boolean;
  /**
   * 'fast' (default): the one-pass line tracer; 'd3': d3-contour (same vertices, slower, about 3 ms more for
   * 128 × 128; closed rings on the border are cut into lines).
   */
  contourEngine?: 'fast' | 'd3';
};

/** One contour level as SVG path data in plan metres (traced where the map is computed; the UI only draws it). */
type ContourPath = {
  stops: number;
  /** "M x,y L x,y …" for every line of the level, coordinates rounded to the millimetre. */
  d: string;
  /** Where the level's label goes (the middle of its longest line), or null for a level too short to label. */
  label: [number, number] | null;
};

/** The tone the camera records along one wall, on the side the camera is on (the meter's recorded tone). */
type WallTone = {
  surfaceId: string;
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  /** Unit normal on the plan towards the camera's side (draw the strip on this side). */
  nx: number;
  ny: number;
  /** Evenly spaced along the wall from end 1 to end 2, at the map's height (clamped to the wall). */
  samples: RecordedTone[];
};

export type LightMapResult = {
  nx: number;
  ny: number;
  x0: number;
  y0: number;
  x1: number;
  y1: number;
  dxM: number;
  dyM: number;
  heightM: number;
  /** What each point reads: 'dome' pointed at the camera, 'flat' disc (along the face or the given facing), or 'pointed' at each light. */
  receptor: 'dome' | 'flat' | 'pointed';
  /** Stops relative to the reference, row-major (index j·nx + i), clamped to [floorStops, +30]. */
  stops: Float32Array;
  /** Luminous exposure from all lights, lux·s, same layout. */
  luxSeconds: Float32Array;
  /** Exposure the stops are relative to, lux·s. */
  referenceLuxSeconds: number;
  /** 'subject': the meter's exposure reading at the subject (its receptor); 'brightest': the subject is unlit, so the brightest point. */
  reference: 'subject' | 'brightest';
  floorStops: number;
  minStops: number;
  maxStops: number;
  contours: ContourLevel[];
  contourPaths: ContourPath[];
  walls: WallTone[];
};

/** What the last update recomputed, for tests and the benchmark. */
type LightMapStats = { geometryRebuilt: boolean; lightsRecomputed: number; lightsReused: number };

export type LightMapCache = {
  /** Compute the map for this scene, reusing everything that did not change since the last call. */
  update(scene: SceneInput | Scene, grid: LightMapGrid): LightMapResult;
  /** Like update, for a scene already validated by sceneSchema (skips parsing; saves ~0.1 ms a frame). */
  updateParsed(scene: Scene, grid: LightMapGrid): LightMapResult;
  readonly stats: LightMapStats;
  clear(): void;
};

type LightEntry = {
  key: string;
  direct: Float32Array;
  /** Direct light at each wall sample, linear sRGB lux·s, [3·sample + c] over the walls in order. */
  walls: Float64Array;
};

const DEFAULT_CONTOUR_MIN_STOPS = -6;
/** Points far brighter than a barely lit subject are clamped here, which keeps the contour count bounded. */
const MAP_CEILING_STOPS = 30;

/** One light's grids. `reuse`: the replaced entry's direct grid of the same size (no one else holds it). */
function lightEntry(room: Room, L: RoomLight, g: Geometry, tmp: Float32Array, reuse?: Float32Array): LightEntry {
  const direct = reuse && reuse.length === g.n ? reuse : new Float32Array(g.n);
  directGrid(L, g, direct, tmp);
  let count = 0;
  for (const w of g.walls) count += w.receptors.length;
  const walls = new Float64Array(3 * count);
  let m = 0;
  for (const w of g.walls) {
    for (const r of w.receptors) {
      const h = directLux(L, room.occ, r);
      walls[m++] = h * L.rgb[0];
      walls[m++] = h * L.rgb[1];
      walls[m++] = h * L.rgb[2];
    }
  }
  return { key: L.key, direct, walls };
}

/** The meter's exposure reading at the subject (its receptor; the room's caches answer it after the meter ran). */
function subjectReading(room: Room): number {
  const scene = room.scene;
  const at = subjectReceptors(scene);
  const sum = (gs: { direct: number; bounce: number }[]) => gs.reduce((s, x) => s + x.direct + x.bounce, 0);
  switch (scene.options.receptor) {
    case 'dome-camera':
      return sum(gather(room, at.dome, true));
    case 'flat-light':
      return room.lights.reduce((s, L, i) => s + sum(gather(room, at.pointedAt(L), true, i)), 0);
    default:
      return sum(gather(room, at.face, true));
  }
}

/**
 * A coordinate rounded to the millimetre, as `String(Math.round(v · 1000) / 1000)` writes it (shortest form, no
 * trailing zeros), but from whole numbers: V8 writes a fraction with its shortest-digits search, which was most
 * of the paths' cost (tested equal on random and edge values). The paths write the same characters straight into
 * a byte buffer (putMillimetres), so a frame's paths are a few strings, not one per coordinate.
 */
export function millimetres(v: number): string {
  pathLen = 0;
  putMillimetres(v);
  return pathString(0, pathLen);
}

let pathBuf = new Uint8Array(1 << 14);
let pathLen = 0;
const CH_0 = 48;
const CH_DOT = 46;
const CH_MINUS = 45;

function pathRoom(extra: number): void {
  if (pathLen + extra <= pathBuf.length) return;
  const b = new Uint8Array(Math.max(2 * pathBuf.length, pathLen + extra));
  b.set(pathBuf.subarray(0, pathLen));
  pathBuf = b;
}

/** Append a whole number 0 ≤ n < 1e12 in decimal. */
function putWhole(n: number): void {
  if (n < 10) {
    pathBuf[pathLen++] = CH_0 + n;
    return;
  }
  let start = pathLen;
  do {
    const q = Math.floor(n / 10);
    pathBuf[pathLen++] = CH_0 + (n - q * 10);
    n = q;
  } while (n > 0);
  for (let e = pathLen - 1; start < e; start++, e--) {
    const c = pathBuf[start]!;
    pathBuf[start] = pathBuf[e]!;
    pathBuf[e] = c;
  }
}

function putMillimetres(v: number): void {
  pathRoom(32);
  const m = Math.round(v * 1000);
  if (!(Math.abs(m) < 1e12)) {
    const str = String(m / 1000);
    pathRoom(str.length);
    for (let q = 0; q < str.length; q++) pathBuf[pathLen++] = str.charCodeAt(q);
    return;
  }
  const a = m < 0 ? -m : m;
  if (a === 0) {
    pathBuf[pathLen++] = CH_0;
    return;
  }
  if (m < 0) pathBuf[pathLen++] = CH_MINUS;
  const whole = Math.floor(a / 1000);
  putWhole(whole);
  let f = a - whole * 1000;
  if (f === 0) return;
  pathBuf[pathLen++] = CH_DOT;
  // Up to three digits, without trailing zeros.
  const d1 = Math.floor(f / 100);
  f -= d1 * 100;
  const d2 = Math.floor(f / 10);
  const d3 = f - d2 * 10;
  pathBuf[pathLen++] = CH_0 + d1;
  if (d2 === 0 && d3 === 0) return;
  pathBuf[pathLen++] = CH_0 + d2;
  if (d3 !== 0) pathBuf[pathLen++] = CH_0 + d3;
}

/** Decodes the buffer where the platform has a TextDecoder (browsers, Node); the same ASCII either way. */
const asciiDecoder: { decode(b: Uint8Array): string } | null =
  typeof (globalThis as { TextDecoder?: unknown }).TextDecoder === 'function' ? new (globalThis as unknown as { TextDecoder: new () => { decode(b: Uint8Array): string } }).TextDecoder() : null;

/** The buffer's characters [from, to) as a string (ASCII; without a decoder in chunks, as apply takes a bounded argument count). */
function pathString(from: number, to: number): string {
  if (asciiDecoder) return asciiDecoder.decode(pathBuf.subarray(from, to));
  let out = '';
  for (let q = from; q < to; q += 8192) out += String.fromCharCode.apply(null, pathBuf.subarray(q, Math.min(to, q + 8192)) as unknown as number[]);
  return out;
}

/** SVG path data of each contour level, with a label point on its longest line. */
function contourPaths(levels: ContourLevel[]): ContourPath[] {
  const r = (v: number) => Math.round(v * 1000) / 1000;
  return levels.map((level) => {
    pathLen = 0;
    let longest: [number, number][] | null = null;
    for (const line of level.lines) {
      if (line.length < 2) continue;
      for (let k = 0; k < line.length; k++) {
        pathRoom(1);
        pathBuf[pathLen++] = k === 0 ? 77 /* M */ : 76 /* L */;
        putMillimetres(line[k]![0]);
        pathRoom(1);
        pathBuf[pathLen++] = 44; // ,
        putMillimetres(line[k]![1]);
      }
      if (!longest || line.length > longest.length) longest = line;
    }
    const d = pathString(0, pathLen);
    const mid = longest && longest.length > 12 ? longest[Math.floor(longest.length / 2)]! : null;
    return { stops: level.stops, d, label: mid ? [r(mid[0]), r(mid[1])] : null };
  });
}

function validateGrid(grid: LightMapGrid): void {
  const ok =
    Number.isInteger(grid.nx) && Number.isInteger(grid.ny) && grid.nx >= 2 && grid.ny >= 2 && grid.nx <= 2048 && grid.ny <= 2048 &&
    [grid.x0, grid.x1, grid.y0, grid.y1].every(Number.isFinite) && grid.x1 !== grid.x0 && grid.y1 !== grid.y0;
  if (!ok) throw new Error('invalid light map grid: nx, ny must be integers 2–2048 and x0 ≠ x1, y0 ≠ y1 finite');
}

/** Per-channel white-balance gains of the camera (as the meter's recorded tones). */
function whiteBalanceGains(scene: Scene): Rgb {
  const w = kelvinToLinearRgb(scene.camera.whiteBalanceK);
  const y = relativeLuminance(w);
  return [y / w[0], y / w[1], y / w[2]];
}

export function createLightMapCache(): LightMapCache {
  let geometry: Geometry | null = null;
  let entries = new Map<string, LightEntry>();
  let tmp = new Float32Array(0);
  // The coarse bounce grid of all lights, and the lights (their keys) it was summed for.
  let bounceSum = new Float64Array(0);
  let bounceKey = '';
  // The lights' summed exposure (kept between frames: only read inside one update).
  let sumBuf = new Float64Array(0);
  // A drag: the lights that did not change (their ids and keys), their summed direct grid and coarse bounce, kept
  // while the same lights stay unchanged, so a frame adds only the moved light's grids to them.
  let stableKey = '';
  let stableDirect = new Float64Array(0);
  let stableBounce = new Float64Array(0);
  let changedBounce = new Float64Array(0);
  const stats: LightMapStats = { geometryRebuilt: false, lightsRecomputed: 0, lightsReused: 0 };

  function updateParsed(scene: Scene, grid: LightMapGrid): LightMapResult {
    validateGrid(grid);
    stats.geometryRebuilt = false;
    stats.lightsRecomputed = 0;
    stats.lightsReused = 0;
    // The meter's room: after meterParsed on the same scene, its geometry, bounces and subject readings are cached.
    const room = buildRoom(scene);
    const { skipContours: _s, floorStops: _f, contourStepStops: _c, contourMinStops: _m, contourEngine: _e, ...gridGeom } = grid;
    const kind = mapReceptorKind(scene, grid);
    const gKey = JSON.stringify([
      room.geometryKey,
      gridGeom,
      kind,
      kind !== 'flat' || grid.facing === 'camera' ? [scene.camera.x, scene.camera.y, scene.camera.heightM] : 0,
      [scene.camera.x, scene.camera.y],
    ]);
    if (!geometry || geometry.key !== gKey) {
      geometry = buildGeometry(room, grid, gKey);
      entries = new Map();
      bounceKey = '';
      stableKey = '';
      stats.geometryRebuilt = true;
    }
    const g = geometry;
    if (tmp.length !== g.n) tmp = new Float32Array(g.n);
    const next = new Map<string, LightEntry>();
    const list: LightEntry[] = [];
    const reused: RoomLight[] = [];
    const reusedEntries: LightEntry[] = [];
    const changed: RoomLight[] = [];
    const changedEntries: LightEntry[] = [];
    for (const L of room.lights) {
      const old = entries.get(L.light.id);
      let e: LightEntry;
      if (old && old.key === L.key) {
        e = old;
        stats.lightsReused++;
      } else {
        // The light's old grid is dropped with its entry: fill it again rather than allocate (less garbage a frame).
        e = lightEntry(room, L, g, tmp, next.has(L.light.id) ? undefined : old?.direct);
        stats.lightsRecomputed++;
      }
      if (e === old) {
        reused.push(L);
        reusedEntries.push(e);
      } else {
        changed.push(L);
        changedEntries.push(e);
      }
      next.set(L.light.id, e);
      list.push(e);
    }
    entries = next;

    // Sum of the lights: direct grids, and the coarse bounce interpolated once.
    const n = g.n;
    if (sumBuf.length !== n) sumBuf = new Float64Array(n);
    const H = sumBuf;
    const nK = g.kx * g.ky;
    const bKey = room.lights.map((L) => L.key).join('|');
    if (bounceSum.length !== nK) {
      bounceSum = new Float64Array(nK);
      bounceKey = '';
    }
    if (changed.length > 0 && changed.length <= reused.length) {
      // Few lights changed (a drag, a light added): the unchanged ones' sums are kept while they stay unchanged
      // (the first such frame pays for them once), and this frame adds the changed lights' direct grids and
      // their bounce from its parts (bounceSplit: only the patches their first bounce reaches, and the coarse
      // patches). The same sums as below in another order: equal to rounding (tested against a fresh map).
      const sKey = reused.map((L) => `${L.light.id}\u0000${L.key}`).join('\u0001');
      if (sKey !== stableKey || stableDirect.length !== n || stableBounce.length !== nK) {
        if (stableDirect.length !== n) stableDirect = new Float64Array(n);
        if (stableBounce.length !== nK) stableBounce = new Float64Array(nK);
        stableDirect.fill(0);
        for (const e of reusedEntries) {
          const d = e.direct;
          for (let k = 0; k < n; k++) stableDirect[k]! += d[k]!;
        }
        bounceCoarse(room, reused, g, stableBounce);
        stableKey = sKey;
      }
      H.set(stableDirect);
      for (const e of changedEntries) {
        const d = e.direct;
        for (let k = 0; k < n; k++) H[k]! += d[k]!;
      }
      if (changedBounce.length !== nK) changedBounce = new Float64Array(nK);
      bounceSplit(room, changed, g, changedBounce);
      for (let k = 0; k < nK; k++) bounceSum[k] = stableBounce[k]! + changedBounce[k]!;
      bounceKey = bKey;
    } else {
      if (list.length > 0) H.set(list[0]!.direct);
      else H.fill(0);
      for (let q = 1; q < list.length; q++) {
        const e = list[q]!;
        const d = e.direct;
        for (let k = 0; k < n; k++) H[k]! += d[k]!;
      }
      // Bounce: one kernel pass over the lights' summed patch luminance, redone only when a light changed.
      if (bKey !== bounceKey) {
        bounceCoarse(room, room.lights, g, bounceSum);
        bounceKey = bKey;
      }
    }
    const coarse = bounceSum;
    const { nx, ny } = g.frame;
    const kx = g.kx;
    const ky = g.ky;
    const cell = g.cell;
    const W = g.weights;
    const dx1 = kx > 1 ? 1 : 0;
    const dy1 = ky > 1 ? kx : 0;
    for (let k = 0; k < n; k++) {
      const c = cell[k]!;
      const q = 4 * k;
      H[k]! += W[q]! * coarse[c]! + W[q + 1]! * coarse[c + dx1]! + W[q + 2]! * coarse[c + dy1]! + W[q + 3]! * coarse[c + dx1 + dy1]!;
    }

    let ref = subjectReading(room);
    let reference: LightMapResult['reference'] = 'subject';
    if (!(ref > DARK_LUX_SECONDS)) {
      ref = 0;
      for (let k = 0; k < n; k++) if (H[k]! > ref) ref = H[k]!;
      reference = 'brightest';
    }
    const floorStops = grid.floorStops ?? -10;
    const stops = new Float32Array(n);
    const lux = new Float32Array(n);
    let minS = Infinity;
    let maxS = -Infinity;
    const invRef = ref > 0 ? 1 / ref : 0;
    for (let k = 0; k < n; k++) {
      const h = H[k]!;
      lux[k] = h;
      const v = h > 0 && invRef > 0 ? Math.min(MAP_CEILING_STOPS, Math.max(floorStops, Math.log2(h * invRef))) : floorStops;
      stops[k] = v;
      if (v < minS) minS = v;
      if (v > maxS) maxS = v;
    }
    const contours = grid.skipContours
      ? []
      : (grid.contourEngine === 'd3' ? contourLinesD3 : contourLines)(
          stops,
          g.frame,
          grid.contourStepStops ?? 1,
          floorStops,
          grid.contourMinStops ?? DEFAULT_CONTOUR_MIN_STOPS,
        );
    return {
      nx,
      ny,
      x0: grid.x0,
      y0: grid.y0,
      x1: grid.x1,
      y1: grid.y1,
      dxM: g.frame.dx,
      dyM: g.frame.dy,
      heightM: g.z,
      receptor: g.kind,
      stops,
      luxSeconds: lux,
      referenceLuxSeconds: ref,
      reference,
      floorStops,
      minStops: minS,
      maxStops: maxS,
      contours,
      contourPaths: contourPaths(contours),
      walls: wallTones(room, g, list),
    };
  }

  return {
    update: (scene, grid) => updateParsed(parseScene(scene), grid),
    updateParsed,
    stats,
    clear() {
      geometry = null;
      entries = new Map();
      bounceKey = '';
      stableKey = '';
    },
  };
}

/** The recorded tone along each wall: every light's direct light (cached per light), the room's coarse bounce and the ambient, × the wall's colour × white balance, vs a correctly exposed mid-grey. */
function wallTones(room: Room, g: Geometry, list: LightEntry[]): WallTone[] {
  const scene = room.scene;
  const cam = scene.camera;
  const correctH = luxSecondsForAperture(cam.aperture, cam.iso, scene.options.calibrationC) * Math.pow(2, cam.ndStops);
  const gains = whiteBalanceGains(scene);
  const amb = scene.ambient ? kelvinToLinearRgb(scene.ambient.kelvin) : null;
  const ambH = scene.ambient ? luxFromEv100(scene.ambient.ev100, scene.options.calibrationC) * cam.shutterS : 0;
  let m = 0;
  return g.walls.map((w) => {
    const s = scene.surfaces[w.surfaceIndex]!;
    const front = -(s.y2 - s.y1) * w.nx + (s.x2 - s.x1) * w.ny > 0;
    const o = room.optics[w.surfaceIndex]!;
    const rho = front ? o.front.rgb : o.back.rgb;
    const C = room.coarseLum;
    const samples = w.bounce.map((W) => {
      const rgb: [number, number, number] = [0, 0, 0];
      for (const e of list) {
        rgb[0] += e.walls[m]!;
        rgb[1] += e.walls[m + 1]!;
        rgb[2] += e.walls[m + 2]!;
      }
      m += 3;
      for (let q = 0; q < W.n; q++) {
        const b = W.off[q]!;
        const x = W.w[q]!;
        rgb[0] += C[b]! * x;
        rgb[1] += C[b + 1]! * x;
        rgb[2] += C[b + 2]! * x;
      }
      if (amb) for (let c = 0; c < 3; c++) rgb[c] = rgb[c]! + ambH * amb[c]!;
      return recordedTone(rgb, rho, gains, correctH);
    });
    return { surfaceId: w.surfaceId, x1: w.x1, y1: w.y1, x2: w.x2, y2: w.y2, nx: w.nx, ny: w.ny, samples };
  });
}

/** One-off light map (no reuse between calls). */
export function lightMap(scene: SceneInput | Scene, grid: LightMapGrid): LightMapResult {
  return createLightMapCache().update(scene, grid);
}
