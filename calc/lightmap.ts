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
import { contourLines, type ContourLevel } from './contours';
import { contourLinesD3 } from './contours-d3';
import { type Geometry, buildGeometry, directGrid } from './lightmap-grid';
import { DARK_LUX_SECONDS } from './meter';
import { type PreparedLight, prepareLight } from './prepare';
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

type LightEntry = {
  key: string;
  prepared: PreparedLight;
  direct: Float32Array;
  /** Luminance of each patch lit by this light (cd·s/m²), for receptors on its front and its back. */
  lumFront: Float64Array;
  lumBack: Float64Array;
};

const DEFAULT_CONTOUR_MIN_STOPS = -6;
/** Points far brighter than a barely lit subject are clamped here, which keeps the contour count bounded. */
const MAP_CEILING_STOPS = 30;

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
