/**
 * The light map: exposure over a horizontal grid at subject height, in stops relative to the subject, with
 * one-stop contour lines. Built for drag frames: a cache keeps one direct-light grid per light and the
 * bounce kernels of the room, so moving one light recomputes that light's grid and a small bounce sum.
 *
 * Model (coarser than the meter, documented in README.md):
 * - direct light: exactly as the meter (beam profile, cosine on the receptor, near-field term, plan
 *   occlusion with height ranges), at every grid point;
 * - bounce: surfaces split into patches of `patchSizeM` (default 1 m), patch → point by the point form
 *   A·cosθe·cosθr/(r² + A/π) with occlusion tested from the patch centre, evaluated on a grid `bounceStep`
 *   times coarser (default 4) and interpolated bilinearly. Bounce varies slowly, except right at walls and
 *   behind flags, where the interpolation blurs it over one coarse cell.
 */
import { contourLines, type ContourLevel, type GridFrame } from './contours';
import { contourLinesD3 } from './contours-d3';
import { PROFILE_LUT_SIZE } from './modifiers';
import { castShadows } from './shadows';
import {
  type Occluders,
  type Patches,
  type PreparedLight,
  type SurfaceOptics,
  MIN_DISTANCE_SQ_M2,
  buildOccluders,
  buildPatches,
  prepareLight,
  surfaceOptics,
} from './prepare';
import { DARK_LUX_SECONDS } from './meter';
import { type Scene, type SceneInput, parseScene } from './scene';
import { directAt, patchFormFactor, patchIncident, reflectedLuminance, transmissionAlong } from './transport';
import { DEG } from './vec';

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
   * Receptor facing at each point: 'subject' (default: the subject's facing, as if the subject stood there),
   * 'camera' (each point faces the camera on the plan), or a plan angle in degrees.
   */
  facing?: 'subject' | 'camera' | number;
  /** Bounce is computed every bounceStep points and interpolated (default 4; 1 = every point). */
  bounceStep?: number;
  /** Bounce patch size for the map, m (default 1). */
  patchSizeM?: number;
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
  /** Stops relative to the reference, row-major (index j·nx + i), clamped to [floorStops, +30]. */
  stops: Float32Array;
  /** Luminous exposure from all lights, lux·s, same layout. */
  luxSeconds: Float32Array;
  /** Exposure the stops are relative to, lux·s. */
  referenceLuxSeconds: number;
  /** 'subject': the subject's exposure under the map's model; 'brightest': the subject is unlit, so the brightest point. */
  reference: 'subject' | 'brightest';
  floorStops: number;
  minStops: number;
  maxStops: number;
  contours: ContourLevel[];
};

/** What the last update recomputed, for tests and the benchmark. */
export type LightMapStats = { geometryRebuilt: boolean; lightsRecomputed: number; lightsReused: number };

export type LightMapCache = {
  /** Compute the map for this scene, reusing everything that did not change since the last call. */
  update(scene: SceneInput | Scene, grid: LightMapGrid): LightMapResult;
  /** Like update, for a scene already validated by sceneSchema (skips parsing; saves ~0.1 ms a frame). */
  updateParsed(scene: Scene, grid: LightMapGrid): LightMapResult;
  readonly stats: LightMapStats;
  clear(): void;
};

type Geometry = {
  key: string;
  frame: GridFrame;
  n: number;
  z: number;
  px: Float64Array; // plan x of each point
  py: Float64Array;
  nxs: Float64Array; // receptor normal of each point (horizontal)
  nys: Float64Array;
  occ: Occluders;
  patches: Patches;
  optics: SurfaceOptics;
  // Coarse bounce grid
  step: number;
  kx: number;
  ky: number;
  kernel: Float64Array; // [patch * nK + k], signed by side
};

type LightEntry = {
  key: string;
  prepared: PreparedLight;
  direct: Float32Array;
  /** Luminance of each patch lit by this light (cd·s/m²), for receptors on its front and its back. */
  lumFront: Float64Array;
  lumBack: Float64Array;
};

const DEFAULT_BOUNCE_STEP = 4;
const DEFAULT_CONTOUR_MIN_STOPS = -6;
/** Points far brighter than a barely lit subject are clamped here, which keeps the contour count bounded. */
const MAP_CEILING_STOPS = 30;
const DEFAULT_MAP_PATCH_M = 1;
const MAP_MAX_PATCHES_PER_SURFACE = 24;

/** Writes the receptor normal at (x, y) into nxs[k], nys[k] (horizontal, unit). */
function receptorNormal(
  facing: LightMapGrid['facing'],
  scene: Scene,
  x: number,
  y: number,
  nxs: Float64Array,
  nys: Float64Array,
  k: number,
): void {
  if (facing === 'camera') {
    const dx = scene.camera.x - x;
    const dy = scene.camera.y - y;
    const l = Math.hypot(dx, dy);
    nxs[k] = l > 0 ? dx / l : 1;
    nys[k] = l > 0 ? dy / l : 0;
    return;
  }
  const deg = typeof facing === 'number' ? facing : scene.subject.facingDeg;
  nxs[k] = Math.cos(deg * DEG);
  nys[k] = Math.sin(deg * DEG);
}

function buildGeometry(scene: Scene, grid: LightMapGrid, key: string): Geometry {
  const nx = grid.nx;
  const ny = grid.ny;
  const dx = (grid.x1 - grid.x0) / (nx - 1);
  const dy = (grid.y1 - grid.y0) / (ny - 1);
  const z = grid.heightM ?? scene.subject.heightM;
  const n = nx * ny;
  const px = new Float64Array(n);
  const py = new Float64Array(n);
  const nxs = new Float64Array(n);
  const nys = new Float64Array(n);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      px[k] = grid.x0 + i * dx;
      py[k] = grid.y0 + j * dy;
      receptorNormal(grid.facing, scene, px[k]!, py[k]!, nxs, nys, k);
    }
  }
  const occ = buildOccluders(scene);
  const bounceOn = scene.options.bounce;
  const patches = buildPatches(bounceOn ? scene : { ...scene, surfaces: [] }, grid.patchSizeM ?? DEFAULT_MAP_PATCH_M, MAP_MAX_PATCHES_PER_SURFACE);
  const step = Math.max(1, Math.floor(grid.bounceStep ?? DEFAULT_BOUNCE_STEP));
  const kx = Math.ceil((nx - 1) / step) + 1;
  const ky = Math.ceil((ny - 1) / step) + 1;
  const nK = kx * ky;
  const coarseFrame: GridFrame = { nx: kx, ny: ky, x0: grid.x0, y0: grid.y0, dx: dx * step, dy: dy * step };
  const cx = new Float64Array(nK);
  const cy = new Float64Array(nK);
  const cnx = new Float64Array(nK);
  const cny = new Float64Array(nK);
  for (let b = 0; b < ky; b++) {
    for (let a = 0; a < kx; a++) {
      const k = b * kx + a;
      cx[k] = grid.x0 + a * coarseFrame.dx;
      cy[k] = grid.y0 + b * coarseFrame.dy;
      receptorNormal(grid.facing, scene, cx[k]!, cy[k]!, cnx, cny, k);
    }
  }
  const kernel = new Float64Array(patches.count * nK);
  const shade = new Float32Array(nK);
  for (let p = 0; p < patches.count; p++) {
    const pcx = patches.cx[p]!;
    const pcy = patches.cy[p]!;
    const pnx = patches.nx[p]!;
    const pny = patches.ny[p]!;
    const area = patches.area[p]!;
    const soft = area / Math.PI;
    const vz = z - patches.cz[p]!;
    const vz2 = vz * vz;
    shade.fill(1);
    castShadows(occ, pcx, pcy, patches.cz[p]!, z, coarseFrame, shade, patches.surface[p]!);
    const base = p * nK;
    for (let k = 0; k < nK; k++) {
      // Point form A·cosθe·cosθr/(r² + A/π), signed by the side of the patch the point is on.
      const vx = cx[k]! - pcx;
      const vy = cy[k]! - pcy;
      const nd = vx * pnx + vy * pny;
      if (nd === 0) continue;
      const cosRr = -(vx * cnx[k]! + vy * cny[k]!); // × r
      if (cosRr <= 0) continue;
      const r2 = vx * vx + vy * vy + vz2;
      kernel[base + k] = (nd * cosRr * area * shade[k]!) / (r2 * (r2 + soft));
    }
  }
  return {
    key,
    frame: { nx, ny, x0: grid.x0, y0: grid.y0, dx, dy },
    n,
    z,
    px,
    py,
    nxs,
    nys,
    occ,
    patches,
    optics: surfaceOptics(scene),
    step,
    kx,
    ky,
    kernel,
  };
}

/** Direct exposure of one light at every grid point (hot loop: no allocation, no acos/pow, no ray tests). */
function directGrid(L: PreparedLight, g: Geometry, out: Float32Array): void {
  const I = L.axialCdS;
  if (I <= 0) {
    out.fill(0);
    return;
  }
  // Shadows first, as a transmission grid; then the geometry per point.
  out.fill(1);
  castShadows(g.occ, L.px, L.py, L.pz, g.z, g.frame, out);
  const { px, py, nxs, nys, n } = g;
  const lpx = L.px;
  const lpy = L.py;
  const lax = L.ax;
  const lay = L.ay;
  const dz = g.z - L.pz;
  const dz2 = dz * dz;
  const azdz = L.az * dz;
  const R2 = L.faceR2;
  const lut = L.lut;
  const last = PROFILE_LUT_SIZE - 1;
  for (let k = 0; k < n; k++) {
    const t = out[k]!;
    if (t === 0) continue;
    const dx = px[k]! - lpx;
    const dy = py[k]! - lpy;
    const d2 = dx * dx + dy * dy + dz2;
    // A grid point on the light itself: directions are undefined; the clamp keeps every cosine in [−1, 1].
    const invD = 1 / Math.sqrt(d2 > 1e-12 ? d2 : 1e-12);
    const cosInc = -(dx * nxs[k]! + dy * nys[k]!) * invD;
    if (!(cosInc > 0)) {
      out[k] = 0;
      continue;
    }
    // Beam profile from the table indexed by sin(θ/2) (see modifiers.profileLut), inlined.
    const u2 = (1 - (dx * lax + dy * lay + azdz) * invD) * 0.5;
    const f = (u2 > 0 ? Math.sqrt(u2) : 0) * last;
    const j = f | 0;
    const a = lut[j]!;
    const prof = a + (lut[j + 1]! - a) * (f - j);
    const e2 = d2 + R2;
    out[k] = (I * prof * cosInc * t) / (e2 > MIN_DISTANCE_SQ_M2 ? e2 : MIN_DISTANCE_SQ_M2);
  }
}

function lightEntry(L: PreparedLight, key: string, g: Geometry): LightEntry {
  const direct = new Float32Array(g.n);
  directGrid(L, g, direct);
  const P = g.patches;
  const incident = new Float64Array(P.count);
  const lumFront = new Float64Array(P.count);
  const lumBack = new Float64Array(P.count);
  if (P.count > 0) {
    patchIncident(L, P, g.occ, incident);
    for (let p = 0; p < P.count; p++) {
      const e = incident[p]!;
      if (e === 0) continue;
      const o = g.optics[P.surface[p]!]!;
      if (e > 0) lumFront[p] = (e * reflectedLuminance(L.rgb, o.front.rgb)) / Math.PI;
      else lumBack[p] = (-e * reflectedLuminance(L.rgb, o.back.rgb)) / Math.PI;
    }
  }
  return { key, prepared: L, direct, lumFront, lumBack };
}

/** The same model at one receptor (used for the subject reference). */
function modelAt(
  entries: LightEntry[],
  g: Geometry,
  x: number,
  y: number,
  z: number,
  nx: number,
  ny: number,
  sumFront: Float64Array,
  sumBack: Float64Array,
): number {
  let h = 0;
  for (const e of entries) h += directAt(e.prepared, g.occ, x, y, z, nx, ny, 0).luxSeconds;
  const P = g.patches;
  const r = { x, y, z, nx, ny, nz: 0 };
  for (let p = 0; p < P.count; p++) {
    const f = patchFormFactor(P, p, r, 0);
    if (f === 0) continue;
    const lum = f > 0 ? sumFront[p]! : sumBack[p]!;
    if (lum === 0) continue;
    h += lum * Math.abs(f) * transmissionAlong(g.occ, P.cx[p]!, P.cy[p]!, P.cz[p]!, x, y, z, P.surface[p]!);
  }
  return h;
}

function validateGrid(grid: LightMapGrid): void {
  const ok =
    Number.isInteger(grid.nx) && Number.isInteger(grid.ny) && grid.nx >= 2 && grid.ny >= 2 && grid.nx <= 2048 && grid.ny <= 2048 &&
    [grid.x0, grid.x1, grid.y0, grid.y1].every(Number.isFinite) && grid.x1 !== grid.x0 && grid.y1 !== grid.y0;
  if (!ok) throw new Error('invalid light map grid: nx, ny must be integers 2–2048 and x0 ≠ x1, y0 ≠ y1 finite');
}

export function createLightMapCache(): LightMapCache {
  let geometry: Geometry | null = null;
  let commonKey = '';
  let entries = new Map<string, LightEntry>();
  const stats: LightMapStats = { geometryRebuilt: false, lightsRecomputed: 0, lightsReused: 0 };

  function updateParsed(scene: Scene, grid: LightMapGrid): LightMapResult {
    validateGrid(grid);
    stats.geometryRebuilt = false;
    stats.lightsRecomputed = 0;
    stats.lightsReused = 0;
    const { skipContours: _s, floorStops: _f, contourStepStops: _c, contourMinStops: _m, contourEngine: _e, ...gridGeom } = grid;
    const gKey = JSON.stringify([
      scene.surfaces,
      scene.flags,
      gridGeom,
      scene.options.bounce,
      grid.facing === 'camera' ? [scene.camera.x, scene.camera.y] : 0,
      grid.facing === undefined || grid.facing === 'subject' ? scene.subject.facingDeg : 0,
      grid.heightM ?? scene.subject.heightM,
    ]);
    if (!geometry || geometry.key !== gKey) {
      geometry = buildGeometry(scene, grid, gKey);
      entries = new Map();
      stats.geometryRebuilt = true;
    }
    const g = geometry;
    // Inputs every light depends on: continuous lights scale with the shutter; C and efficiency with options.
    const cKey = JSON.stringify([scene.camera.shutterS, scene.options.calibrationC, scene.options.flashCdSPerWs]);
    if (cKey !== commonKey) {
      entries = new Map();
      commonKey = cKey;
    }
    const next = new Map<string, LightEntry>();
    const list: LightEntry[] = [];
    scene.lights.forEach((l, i) => {
      const key = JSON.stringify(l);
      const old = entries.get(l.id);
      let e: LightEntry;
      if (old && old.key === key) {
        e = old;
        stats.lightsReused++;
      } else {
        e = lightEntry(prepareLight(l, i, scene), key, g);
        stats.lightsRecomputed++;
      }
      next.set(l.id, e);
      list.push(e);
    });
    entries = next;

    // Sum of the lights: direct grids, and patch luminances for the bounce kernel.
    const n = g.n;
    const P = g.patches;
    const H = new Float64Array(n);
    for (const e of list) {
      const d = e.direct;
      for (let k = 0; k < n; k++) H[k]! += d[k]!;
    }
    const sumFront = new Float64Array(P.count);
    const sumBack = new Float64Array(P.count);
    for (const e of list) {
      for (let p = 0; p < P.count; p++) {
        sumFront[p]! += e.lumFront[p]!;
        sumBack[p]! += e.lumBack[p]!;
      }
    }
    if (P.count > 0) {
      const nK = g.kx * g.ky;
      const coarse = new Float64Array(nK);
      for (let p = 0; p < P.count; p++) {
        const lf = sumFront[p]!;
        const lb = sumBack[p]!;
        if (lf === 0 && lb === 0) continue;
        const base = p * nK;
        for (let k = 0; k < nK; k++) {
          const f = g.kernel[base + k]!;
          if (f > 0) coarse[k]! += f * lf;
          else if (f < 0) coarse[k]! -= f * lb;
        }
      }
      // Bilinear interpolation of the coarse bounce onto the grid.
      const { nx, ny } = g.frame;
      const st = g.step;
      const kx = g.kx;
      for (let j = 0; j < ny; j++) {
        const b = Math.min(Math.floor(j / st), g.ky - 2 < 0 ? 0 : g.ky - 2);
        const fy = g.ky > 1 ? (j - b * st) / st : 0;
        for (let i = 0; i < nx; i++) {
          const a = Math.min(Math.floor(i / st), kx - 2 < 0 ? 0 : kx - 2);
          const fx = kx > 1 ? (i - a * st) / st : 0;
          const c00 = coarse[b * kx + a]!;
          const c10 = coarse[b * kx + a + 1] ?? c00;
          const c01 = coarse[(b + 1) * kx + a] ?? c00;
          const c11 = coarse[(b + 1) * kx + a + 1] ?? c00;
          H[j * nx + i]! += (c00 * (1 - fx) + c10 * fx) * (1 - fy) + (c01 * (1 - fx) + c11 * fx) * fy;
        }
      }
    }

    const s = scene.subject;
    const sn: [number, number] = [Math.cos(s.facingDeg * DEG), Math.sin(s.facingDeg * DEG)];
    let ref = modelAt(list, g, s.x, s.y, s.heightM, sn[0], sn[1], sumFront, sumBack);
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
      nx: g.frame.nx,
      ny: g.frame.ny,
      x0: grid.x0,
      y0: grid.y0,
      x1: grid.x1,
      y1: grid.y1,
      dxM: g.frame.dx,
      dyM: g.frame.dy,
      heightM: g.z,
      stops,
      luxSeconds: lux,
      referenceLuxSeconds: ref,
      reference,
      floorStops,
      minStops: minS,
      maxStops: maxS,
      contours,
    };
  }

  return {
    update: (scene, grid) => updateParsed(parseScene(scene), grid),
    updateParsed,
    stats,
    clear() {
      geometry = null;
      entries = new Map();
      commonKey = '';
    },
  };
}

/** One-off light map (no reuse between calls). */
export function lightMap(scene: SceneInput | Scene, grid: LightMapGrid): LightMapResult {
  return createLightMapCache().update(scene, grid);
}
