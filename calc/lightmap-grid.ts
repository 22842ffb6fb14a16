/**
 * The light map's fixed part and its per-light loops, on the meter's own light transport (room.ts): the same
 * lights (area faces for big modifiers, lights on a wall line), the same occluders (the subject's body
 * included), and the same bounce patches with their first and later bounces. Rebuilt only when the room's
 * geometry, the grid or the receptor change: grid points and receptor normals, the bounce kernel (room patch →
 * coarse grid point) and the sample points along the walls.
 */
import type { GridFrame } from './contours';
import { type Occluders, MIN_DISTANCE_SQ_M2, panelFrame, panelSectionAt } from './flatScene';
import type { LightMapGrid } from './lightmap';
import { PROFILE_LUT_SIZE } from './modifiers';
import { type FieldReceptor, type Room, type RoomLight, type Weights, areaUnshaded, behindOwnWall, bodyPanels, faceSamplePoints, patchResponse, patchWeights } from './room';
import type { Scene } from './sceneSchema';
import { castShadows, castShadowsCount, castShadowsSum } from './shadows';
import { DEG } from './vec';

const DEFAULT_BOUNCE_STEP = 4;
/** Wall tone samples: at most this far apart along a wall, and at most this many on one wall. */
const WALL_SAMPLE_M = 0.2;
const WALL_MAX_SAMPLES = 48;
/** Area sources: points nearer the light than this many face radii are computed exactly, not interpolated. */
const AREA_REFINE_RADII = 2;
/** Area sources: a coarse cell whose corner ratios (exact / point form) differ by more than this factor is computed exactly. */
const AREA_RATIO_SPREAD = 2;
/** Area sources: the exact / point-form ratio is found every this many bounce cells and interpolated. */
const AREA_RATIO_STEP = 2;

/**
 * What each map point reads, as the meter's receptors: 'dome' — an ideal hemisphere pointed at the camera (3-D,
 * from each point); 'flat' — a flat disc with the horizontal normal of the grid's facing; 'pointed' — a flat
 * disc pointed at each light in turn (direct light; its bounce is read by the dome, an approximation).
 */
export type MapReceptorKind = 'dome' | 'flat' | 'pointed';

/** Points along one wall where its tone is shown, on the side the camera is on. */
type WallStrip = {
  surfaceIndex: number;
  surfaceId: string;
  /** The strip's receptors (1 mm off the wall, facing the camera's side), at the map's height. */
  receptors: FieldReceptor[];
  /** Each receptor's weights on the room's coarse patches (its later-bounce gather), kept with the fixed part. */
  bounce: Weights[];
  /** The wall's ends on the plan (the drawn strip). */
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  /** Unit normal on the plan, towards the camera's side. */
  nx: number;
  ny: number;
};

/** Everything about the map that does not depend on the lights. */
export type Geometry = {
  key: string;
  frame: GridFrame;
  n: number;
  z: number;
  kind: MapReceptorKind;
  px: Float64Array;
  py: Float64Array;
  /** Receptor normal of each point (3-D unit, in float32: half the bytes the direct loop streams; for 'pointed' the dome's, used for the bounce). */
  nxs: Float32Array;
  nys: Float32Array;
  nzs: Float32Array;
  /** Occluders without the subject's body, and the body alone (it does not shade points inside it). */
  occ: Occluders;
  /** Every occluder in `occ` opaque (or clear): a big face's shadows are counted by runs (castShadowsCount). */
  occOpaque: boolean;
  body: Occluders | null;
  inBody: Uint8Array | null;
  /** Coarse bounce grid: every `step`-th point; kernel[p·nK + k] = response of coarse point k to room patch p, signed by side. */
  step: number;
  kx: number;
  ky: number;
  coarseFrame: GridFrame;
  kernel: Float32Array;
  /**
   * Sign of each patch's kernel row: 1 all ≥ 0 (the points see its front), −1 all ≤ 0 (its back), 0 all zero,
   * 2 mixed. A row of one sign needs no test per point in the bounce pass.
   */
  rowSign: Int8Array;
  /**
   * The kernel summed over each coarse patch's fine patches, by the side seen: [(2p + side)·nK + k], side 0 the
   * front (positive entries), 1 the back (the negative entries' magnitudes). A light's later bounces are one
   * value per coarse patch and side (room.lumLater), so they need only these rows (bounceSplit).
   */
  coarseKernel: Float64Array;
  /**
   * Interpolation of the coarse bounce at each point: the coarse cell's first corner (b·kx + a) and the four
   * corner weights [4k … 4k+3] for (a, b), (a+1, b), (a, b+1), (a+1, b+1). Bilinear, except that corners lying on
   * a surface, or across one from the point, are left out and the rest renormalised (see interpolationWeights).
   */
  cell: Int32Array;
  weights: Float32Array;
  walls: WallStrip[];
};

/** Occluders of the body's panels (torso, then head). */
function bodyOccluders(scene: Scene): Occluders | null {
  const panels = bodyPanels(scene);
  if (panels.length === 0) return null;
  const n = panels.length;
  return {
    count: n,
    ax: Float64Array.from(panels, (p) => p.ax),
    ay: Float64Array.from(panels, (p) => p.ay),
    ex: Float64Array.from(panels, (p) => p.ex),
    ey: Float64Array.from(panels, (p) => p.ey),
    zLo: Float64Array.from(panels, (p) => p.zLo),
    zHi: Float64Array.from(panels, (p) => p.zHi),
    transmission: new Float64Array(n),
    surface: new Int32Array(n).fill(-2),
  };
}

/** Inside the body's footprint (the torso's convex quad, its first four panels; it holds the head's)? */
function insideBody(body: Occluders, x: number, y: number): boolean {
  let sign = 0;
  for (let i = 0; i < Math.min(4, body.count); i++) {
    const c = (x - body.ax[i]!) * body.ey[i]! - (y - body.ay[i]!) * body.ex[i]!;
    const s = c > 0 ? 1 : c < 0 ? -1 : 0;
    if (s === 0) continue;
    if (sign === 0) sign = s;
    else if (s !== sign) return false;
  }
  return true;
}

/** Receptor normal at a point: dome (and the pointed kind's bounce) towards the camera in 3-D; flat horizontal. */
function normalAt(kind: MapReceptorKind, facing: LightMapGrid['facing'], scene: Scene, x: number, y: number, z: number): [number, number, number] {
  if (kind !== 'flat') {
    const dx = scene.camera.x - x;
    const dy = scene.camera.y - y;
    const dz = scene.camera.heightM - z;
    const l = Math.hypot(dx, dy, dz);
    return l > 0 ? [dx / l, dy / l, dz / l] : [1, 0, 0];
  }
  if (facing === 'camera') {
    const dx = scene.camera.x - x;
    const dy = scene.camera.y - y;
    const l = Math.hypot(dx, dy);
    return l > 0 ? [dx / l, dy / l, 0] : [1, 0, 0];
  }
  const deg = typeof facing === 'number' ? facing : scene.subject.facingDeg;
  return [Math.cos(deg * DEG), Math.sin(deg * DEG), 0];
}

/** The map's receptor: a facing given in the grid means a flat disc (as before); otherwise the setup's receptor. */
export function mapReceptorKind(scene: Scene, grid: LightMapGrid): MapReceptorKind {
  if (grid.facing !== undefined) return 'flat';
  const r = scene.options.receptor;
  return r === 'dome-camera' ? 'dome' : r === 'flat-light' ? 'pointed' : 'flat';
}

function wallStrips(room: Room, z: number): WallStrip[] {
  const scene = room.scene;
  const out: WallStrip[] = [];
  const cam = scene.camera;
  scene.surfaces.forEach((surface, i) => {
    if (surface.tiltDeg) {
      // A tilted panel: its strip runs where it crosses the map's height (clamped to its lower or upper edge),
      // read 1 mm off its face by a flat disc along its tilted normal, on the camera's side.
      const f = panelFrame(surface);
      const w = f.vz > 0 ? Math.min(1, Math.max(0, (z - f.az) / f.vz)) : 0.5;
      const ox = f.ax + f.vx * w;
      const oy = f.ay + f.vy * w;
      const oz = f.az + f.vz * w;
      const len = Math.hypot(f.ex, f.ey);
      if (len === 0) return;
      const sg = (cam.x - ox) * f.nx + (cam.y - oy) * f.ny + (cam.heightM - oz) * f.nz < 0 ? -1 : 1;
      const count = Math.min(WALL_MAX_SAMPLES, Math.max(2, Math.ceil(len / WALL_SAMPLE_M)));
      const receptors: FieldReceptor[] = [];
      for (let k = 0; k < count; k++) {
        const t = (k + 0.5) / count;
        receptors.push({ x: ox + f.ex * t + sg * f.nx * 1e-3, y: oy + f.ey * t + sg * f.ny * 1e-3, z: oz + sg * f.nz * 1e-3, nx: sg * f.nx, ny: sg * f.ny, nz: sg * f.nz, kind: 'flat' });
      }
      // The strip's plan normal says which side it shows (a panel lying flat: its front's plan direction).
      const hl = Math.hypot(f.nx, f.ny);
      const pnx = hl > 1e-9 ? (sg * f.nx) / hl : (-sg * f.ey) / len;
      const pny = hl > 1e-9 ? (sg * f.ny) / hl : (sg * f.ex) / len;
      const bounce = receptors.map((r) => patchWeights(room, room.coarse, r, false, 2));
      out.push({ surfaceIndex: i, surfaceId: surface.id, receptors, bounce, x1: ox, y1: oy, x2: ox + f.ex, y2: oy + f.ey, nx: pnx, ny: pny });
      return;
    }
    const s = surface;
    const ex = s.x2 - s.x1;
    const ey = s.y2 - s.y1;
    const len = Math.hypot(ex, ey);
    if (len === 0) return;
    let nx = -ey / len;
    let ny = ex / len;
    if ((cam.x - s.x1) * nx + (cam.y - s.y1) * ny < 0) {
      nx = -nx;
      ny = -ny;
    }
    const count = Math.min(WALL_MAX_SAMPLES, Math.max(2, Math.ceil(len / WALL_SAMPLE_M)));
    const h = Math.min(s.topM, Math.max(s.baseM, z));
    const receptors: FieldReceptor[] = [];
    for (let k = 0; k < count; k++) {
      const t = (k + 0.5) / count;
      receptors.push({ x: s.x1 + ex * t + nx * 1e-3, y: s.y1 + ey * t + ny * 1e-3, z: h, nx, ny, nz: 0, kind: 'flat' });
    }
    const bounce = receptors.map((r) => patchWeights(room, room.coarse, r, false, 2));
    out.push({ surfaceIndex: i, surfaceId: s.id, receptors, bounce, x1: s.x1, y1: s.y1, x2: s.x2, y2: s.y2, nx, ny });
  });
  return out;
}

/** Corners nearer a surface's line than this (m) count as on it. */
const ON_SURFACE_M = 1e-3;

/** Do the open segments p→q and a→a+e cross (strictly)? */
function crosses(px: number, py: number, qx: number, qy: number, ax: number, ay: number, ex: number, ey: number): boolean {
  const dx = qx - px;
  const dy = qy - py;
  const den = dx * ey - dy * ex;
  if (den === 0) return false;
  const t = ((ax - px) * ey - (ay - py) * ex) / den;
  const u = ((ax - px) * dy - (ay - py) * dx) / den;
  return t > 1e-9 && t < 1 - 1e-9 && u > 1e-9 && u < 1 - 1e-9;
}

/** Distance from (x, y) to the segment a→a+e. */
function segmentDistance(x: number, y: number, ax: number, ay: number, ex: number, ey: number): number {
  const l2 = ex * ex + ey * ey;
  const t = l2 > 0 ? Math.max(0, Math.min(1, ((x - ax) * ex + (y - ay) * ey) / l2)) : 0;
  const dx = ax + ex * t - x;
  const dy = ay + ey * t - y;
  return Math.sqrt(dx * dx + dy * dy);
}

/**
 * The coarse bounce is interpolated between coarse points every `step` points. Near a wall that is wrong two
 * ways: a coarse point on the wall's line sees the wall edge-on (no bounce from it), and one across the wall
 * sees the other room. Such corners are left out of the point's interpolation and the others renormalised; a
 * point whose corners are all left out keeps plain bilinear weights.
 */
function interpolationWeights(scene: Scene, frame: GridFrame, coarse: GridFrame, step: number, z: number, cell: Int32Array, weights: Float32Array): void {
  const segs = scene.surfaces.flatMap((s) => {
    const c = panelSectionAt(s, z);
    return c ? [[c.x1, c.y1, c.x2 - c.x1, c.y2 - c.y1] as const] : [];
  });
  const { nx, ny } = frame;
  const kx = coarse.nx;
  const ky = coarse.ny;
  const cb = ky > 1 ? ky - 2 : 0;
  const ca = kx > 1 ? kx - 2 : 0;
  const onWall = new Uint8Array(kx * ky);
  for (let b = 0; b < ky; b++) {
    for (let a = 0; a < kx; a++) {
      const x = coarse.x0 + a * coarse.dx;
      const y = coarse.y0 + b * coarse.dy;
      if (segs.some(([ax, ay, ex, ey]) => segmentDistance(x, y, ax, ay, ex, ey) < ON_SURFACE_M)) onWall[b * kx + a] = 1;
    }
  }
  const w = [0, 0, 0, 0];
  for (let j = 0; j < ny; j++) {
    const b = Math.min(Math.floor(j / step), cb);
    const j1 = Math.min(ny - 1, (b + 1) * step);
    const fy = j1 > b * step ? (j - b * step) / (j1 - b * step) : 0;
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      const a = Math.min(Math.floor(i / step), ca);
      const i1 = Math.min(nx - 1, (a + 1) * step);
      const fx = i1 > a * step ? (i - a * step) / (i1 - a * step) : 0;
      w[0] = (1 - fx) * (1 - fy);
      w[1] = fx * (1 - fy);
      w[2] = (1 - fx) * fy;
      w[3] = fx * fy;
      cell[k] = b * kx + a;
      if (segs.length > 0) {
        const x = frame.x0 + i * frame.dx;
        const y = frame.y0 + j * frame.dy;
        let kept = 0;
        let dropped = false;
        for (let c = 0; c < 4; c++) {
          if (w[c] === 0) continue;
          const ca2 = Math.min(kx - 1, a + (c & 1));
          const cb2 = Math.min(ky - 1, b + (c >> 1));
          const cx = coarse.x0 + ca2 * coarse.dx;
          const cy = coarse.y0 + cb2 * coarse.dy;
          if (onWall[cb2 * kx + ca2] === 1 || segs.some(([ax, ay, ex, ey]) => crosses(x, y, cx, cy, ax, ay, ex, ey))) {
            dropped = true;
            continue;
          }
          kept += w[c]!;
        }
        if (dropped && kept > 0) {
          for (let c = 0; c < 4; c++) {
            const ca2 = Math.min(kx - 1, a + (c & 1));
            const cb2 = Math.min(ky - 1, b + (c >> 1));
            const cx = coarse.x0 + ca2 * coarse.dx;
            const cy = coarse.y0 + cb2 * coarse.dy;
            const out = w[c] === 0 || onWall[cb2 * kx + ca2] === 1 || segs.some(([ax, ay, ex, ey]) => crosses(x, y, cx, cy, ax, ay, ex, ey));
            w[c] = out ? 0 : w[c]! / kept;
          }
        }
      }
      weights[4 * k] = w[0]!;
      weights[4 * k + 1] = w[1]!;
      weights[4 * k + 2] = w[2]!;
      weights[4 * k + 3] = w[3]!;
    }
  }
}

export function buildGeometry(room: Room, grid: LightMapGrid, key: string): Geometry {
  const scene = room.scene;
  const kind = mapReceptorKind(scene, grid);
  const nx = grid.nx;
  const ny = grid.ny;
  const dx = (grid.x1 - grid.x0) / (nx - 1);
  const dy = (grid.y1 - grid.y0) / (ny - 1);
  const z = grid.heightM ?? scene.subject.heightM;
  const n = nx * ny;
  const px = new Float64Array(n);
  const py = new Float64Array(n);
  const nxs = new Float32Array(n);
  const nys = new Float32Array(n);
  const nzs = new Float32Array(n);
  const body = bodyOccluders(scene);
  const inBody = body ? new Uint8Array(n) : null;
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      const x = grid.x0 + i * dx;
      const y = grid.y0 + j * dy;
      px[k] = x;
      py[k] = y;
      const nrm = normalAt(kind, grid.facing, scene, x, y, z);
      nxs[k] = nrm[0];
      nys[k] = nrm[1];
      nzs[k] = nrm[2];
      if (body && inBody && z <= scene.subject.body!.topM && insideBody(body, x, y)) inBody[k] = 1;
    }
  }
  const step = Math.max(1, Math.floor(grid.bounceStep ?? DEFAULT_BOUNCE_STEP));
  const kx = Math.ceil((nx - 1) / step) + 1;
  const ky = Math.ceil((ny - 1) / step) + 1;
  const nK = kx * ky;
  const coarseFrame: GridFrame = { nx: kx, ny: ky, x0: grid.x0, y0: grid.y0, dx: dx * step, dy: dy * step };
  const coarseR: FieldReceptor[] = [];
  const coarseIn = new Uint8Array(nK);
  for (let b = 0; b < ky; b++) {
    for (let a = 0; a < kx; a++) {
      const x = grid.x0 + a * coarseFrame.dx;
      const y = grid.y0 + b * coarseFrame.dy;
      const nrm = normalAt(kind, grid.facing, scene, x, y, z);
      coarseR.push({ x, y, z, nx: nrm[0], ny: nrm[1], nz: nrm[2], kind: kind === 'flat' ? 'flat' : 'dome' });
      // Bounce is interpolated between coarse points: those within a coarse cell of the body take the subject's
      // own view (no body in the way), so the subject's point is not blended with points in its shadow.
      if (body && z <= scene.subject.body!.topM) {
        for (const [ox, oy] of [[0, 0], [1, 0], [-1, 0], [0, 1], [0, -1], [1, 1], [1, -1], [-1, 1], [-1, -1]] as const) {
          if (insideBody(body, x + ox * coarseFrame.dx, y + oy * coarseFrame.dy)) coarseIn[b * kx + a] = 1;
        }
      }
    }
  }
  // Bounce kernel on the meter's own fine patches: each patch's response at each coarse point (the meter's
  // patch response, exact near the patch), times the shadows cast from the patch centre.
  const P = room.patches;
  const kernel = new Float32Array(P.count * nK);
  const shade = new Float32Array(nK);
  const shadeBody = new Float32Array(nK);
  for (let p = 0; p < P.count; p++) {
    shade.fill(1);
    castShadows(room.occFree, P.cx[p]!, P.cy[p]!, P.cz[p]!, z, coarseFrame, shade, P.surface[p]!);
    if (body) {
      shadeBody.fill(1);
      castShadows(body, P.cx[p]!, P.cy[p]!, P.cz[p]!, z, coarseFrame, shadeBody);
    }
    const base = p * nK;
    for (let k = 0; k < nK; k++) {
      const t = shade[k]! * (body && coarseIn[k] === 0 ? shadeBody[k]! : 1);
      if (t === 0) continue;
      const f = patchResponse(P, p, coarseR[k]!, 2);
      if (f !== 0) kernel[base + k] = f * t;
    }
  }
  const rowSign = new Int8Array(P.count);
  for (let p = 0; p < P.count; p++) {
    let pos = false;
    let neg = false;
    const base = p * nK;
    for (let k = 0; k < nK; k++) {
      const f = kernel[base + k]!;
      if (f > 0) pos = true;
      else if (f < 0) neg = true;
    }
    rowSign[p] = pos && neg ? 2 : pos ? 1 : neg ? -1 : 0;
  }
  const nC = room.coarse.count;
  const coarseKernel = new Float64Array(2 * nC * nK);
  for (let p = 0; p < P.count; p++) {
    const c = room.parent[p]!;
    if (c < 0 || rowSign[p] === 0) continue;
    const base = p * nK;
    const front = 2 * c * nK;
    const back = front + nK;
    for (let k = 0; k < nK; k++) {
      const f = kernel[base + k]!;
      if (f > 0) coarseKernel[front + k]! += f;
      else if (f < 0) coarseKernel[back + k]! -= f;
    }
  }
  const frame: GridFrame = { nx, ny, x0: grid.x0, y0: grid.y0, dx, dy };
  const cell = new Int32Array(n);
  const weights = new Float32Array(4 * n);
  interpolationWeights(scene, frame, coarseFrame, step, z, cell, weights);
  return {
    key,
    frame,
    n,
    z,
    kind,
    px,
    py,
    nxs,
    nys,
    nzs,
    occ: room.occFree,
    occOpaque: room.occFree.transmission.every((t) => t === 0 || t === 1),
    body,
    inBody,
    step,
    kx,
    ky,
    coarseFrame,
    kernel,
    rowSign,
    coarseKernel,
    cell,
    weights,
    walls: wallStrips(room, z),
  };
}

let shadowCur = new Float32Array(0);
let shadowStamp = new Int32Array(0);
let shadowId = 0;
let shadowDiff = new Int32Array(0);

/** Shadows of one light on the grid: walls and flags from the light (or the 16 points of a big face), then the body. */
function shadowGrid(L: RoomLight, g: Geometry, out: Float32Array): void {
  if (L.face && g.occOpaque) {
    // Opaque occluders: each sample's shadows as runs of cells per row (castShadowsCount), counted in one
    // difference row; the running sum is how many samples see a cell shaded, and the mean transmission is
    // (count − shaded)/count — castShadowsSum's numbers (whole counts, so exactly) with no work per covered cell.
    const { nx, ny } = g.frame;
    const w = nx + 1;
    if (shadowDiff.length !== ny * w) shadowDiff = new Int32Array(ny * w);
    else shadowDiff.fill(0);
    const diff = shadowDiff;
    const pts = faceSamplePoints(L, L.face);
    for (const [sx, sy, sz] of pts) castShadowsCount(g.occ, sx, sy, sz, g.z, g.frame, diff);
    const m = pts.length;
    const inv = 1 / m;
    for (let j = 0; j < ny; j++) {
      const row = j * nx;
      const drow = j * w;
      let c = 0;
      for (let i = 0; i < nx; i++) {
        c += diff[drow + i]!;
        out[row + i] = (m - c) * inv;
      }
    }
  } else if (L.face) {
    // Mean transmission over the face's points: out sums what each point's shadows take (1 − t, each point's
    // shadows once, over the cells they cover), then becomes (count − sum)/count. Opaque shadows sum whole
    // numbers, so a point every sample sees shaded is exactly 0, as the mean of the samples.
    out.fill(0);
    if (shadowStamp.length !== g.n) {
      shadowCur = new Float32Array(g.n);
      shadowStamp = new Int32Array(g.n);
      shadowId = 0;
    }
    const pts = faceSamplePoints(L, L.face);
    for (const [sx, sy, sz] of pts) {
      if (shadowId >= 0x7ffffff0) {
        shadowStamp.fill(0);
        shadowId = 0;
      }
      castShadowsSum(g.occ, sx, sy, sz, g.z, g.frame, out, shadowCur, shadowStamp, ++shadowId);
    }
    const m = pts.length;
    const inv = 1 / m;
    for (let k = 0; k < g.n; k++) out[k] = (m - out[k]!) * inv;
  } else {
    out.fill(1);
    castShadows(g.occ, L.px, L.py, L.pz, g.z, g.frame, out);
  }
  if (g.body && g.inBody) {
    // The body's shadow, multiplied in over the cells it covers alone (castShadows reports its rows and each
    // row's columns), in a buffer kept all 1 between calls (those cells are put back): before, a fill and a
    // multiply over the whole grid per light, for a shadow of a few hundred cells. Cells outside it were × 1.
    const { nx, ny } = g.frame;
    if (bodyShade.length !== g.n) bodyShade = new Float32Array(g.n).fill(1);
    if (bodySpans.length !== 2 * ny) bodySpans = new Int32Array(2 * ny);
    const shade = bodyShade;
    const spans = bodySpans;
    castShadows(g.body, L.px, L.py, L.pz, g.z, g.frame, shade, -1, bodyRows, spans);
    const inB = g.inBody;
    for (let j = bodyRows[0]!; j <= bodyRows[1]!; j++) {
      const row = j * nx;
      for (let k = row + spans[2 * j]!; k <= row + spans[2 * j + 1]!; k++) {
        if (inB[k] === 0) out[k]! *= shade[k]!;
        shade[k] = 1;
      }
    }
  }
}

let bodyShade = new Float32Array(0);
let bodySpans = new Int32Array(0);
const bodyRows = new Int32Array(2);

const rBuf: FieldReceptor = { x: 0, y: 0, z: 0, nx: 1, ny: 0, nz: 0, kind: 'flat' };

/** The exact area-source light at grid point k before shadows (the meter's polygon integral). */
function areaAt(L: RoomLight, g: Geometry, k: number): number {
  const x = g.px[k]!;
  const y = g.py[k]!;
  const dx = x - L.px;
  const dy = y - L.py;
  const dz = g.z - L.pz;
  // Math.sqrt, not Math.hypot: V8's variadic hypot is several times slower (and allocates) where it is not inlined.
  const d = Math.sqrt(dx * dx + dy * dy + dz * dz);
  const cosOff = d > 1e-6 ? (dx * L.ax + dy * L.ay + dz * L.az) / d : 1;
  if (cosOff <= 1e-9 && L.modifier.backSpill <= 0) return 0;
  rBuf.x = x;
  rBuf.y = y;
  rBuf.z = g.z;
  if (g.kind === 'pointed') {
    rBuf.nx = d > 1e-6 ? -dx / d : 1;
    rBuf.ny = d > 1e-6 ? -dy / d : 0;
    rBuf.nz = d > 1e-6 ? -dz / d : 0;
    rBuf.kind = 'flat';
  } else {
    rBuf.nx = g.nxs[k]!;
    rBuf.ny = g.nys[k]!;
    rBuf.nz = g.nzs[k]!;
    rBuf.kind = g.kind === 'dome' ? 'dome' : 'flat';
  }
  return areaUnshaded(L, L.face!, rBuf, cosOff);
}

/**
 * Direct exposure of one light at every grid point, lux·s, as the meter's directLight: beam profile, the
 * receptor's response (flat: cos i; dome: (1 + cos i)/2; pointed: 1), near-field term, shadows (soft from
 * a big face's 16 points). Big faces: the exact polygon integral on the coarse grid and near the light,
 * its ratio to the point form interpolated between (coarse, then refined where it changes fast).
 */
export function directGrid(L: RoomLight, g: Geometry, out: Float32Array, tmp: Float32Array): void {
  const I = L.axialCdS;
  if (I <= 0) {
    out.fill(0);
    return;
  }
  shadowGrid(L, g, out);
  const { nxs, nys, nzs } = g;
  const { nx, ny, x0, y0, dx: gdx, dy: gdy } = g.frame;
  const lpx = L.px;
  const lpy = L.py;
  const lax = L.ax;
  const lay = L.ay;
  const dz = g.z - L.pz;
  const dz2 = dz * dz;
  const azdz = L.az * dz;
  const R2 = L.faceR2;
  // Imported constants read once: a module's binding may be a getter (CommonJS builds), called per point otherwise.
  const minD2 = MIN_DISTANCE_SQ_M2;
  const lut = L.lut;
  const last = PROFILE_LUT_SIZE - 1;
  const kind = g.kind === 'dome' ? 1 : g.kind === 'pointed' ? 2 : 0;
  const onWall = L.onWalls.length > 0;
  const face = L.face;
  // For big faces keep the point form (with shadows) to scale by the exact/point ratio below.
  const pf = face ? tmp : null;
  // Point (i, j) at (x0 + i·dx, y0 + j·dy), as buildGeometry placed it (the same doubles), computed rather than
  // read: two fewer arrays streamed per point.
  for (let j = 0, k = 0; j < ny; j++) {
    const y = y0 + j * gdy;
    const dy = y - lpy;
    for (let i = 0; i < nx; i++, k++) {
      const t = out[k]!;
      if (pf) pf[k] = 0;
      // Shaded points of a big face keep their point form (pf): the exact/point ratio stays defined through shadows.
      if (t === 0 && !pf) continue;
      const x = x0 + i * gdx;
      const dx = x - lpx;
      const d2 = dx * dx + dy * dy + dz2;
      // A grid point on the light itself: directions are undefined; the clamp keeps every cosine in [−1, 1].
      const invD = 1 / Math.sqrt(d2 > 1e-12 ? d2 : 1e-12);
      const cosInc = -(dx * nxs[k]! + dy * nys[k]! + dz * nzs[k]!) * invD;
      const resp = kind === 0 ? cosInc : kind === 1 ? (1 + cosInc) * 0.5 : 1;
      if (!(resp > 1e-9) || (onWall && behindOwnWall(L, x, y))) {
        out[k] = 0;
        continue;
      }
      // Beam profile from the table indexed by sin(θ/2) (see modifiers.profileLut), inlined.
      const u2 = (1 - (dx * lax + dy * lay + azdz) * invD) * 0.5;
      const f = (u2 > 0 ? Math.sqrt(u2) : 0) * last;
      const q = f | 0;
      const a = lut[q]!;
      const prof = a + (lut[q + 1]! - a) * (f - q);
      const e2 = d2 + R2;
      // Math.max, not a ternary: a ternary between the clamp and e2 made the optimised loop box e2 as a heap number
      // at every point (garbage a frame); equal for e2 ≥ 0.
      const w = (I * prof * resp) / Math.max(e2, minD2);
      // A big face keeps the shadows' transmission in out and the point form in pf (areaCorrection multiplies them
      // by the face's ratio); a point source is done here.
      if (pf) pf[k] = w;
      else out[k] = w * t;
    }
  }
  if (face && pf) areaCorrection(L, g, out, pf);
}

/** Area sources: near the light and where the coarse ratio changes fast, the ratio is found every this many points. */
const AREA_FINE_STRIDE = 2;
/** Area sources: a fine cell whose corner ratios differ by more than this factor (or a face's horizon) is computed exactly. */
const AREA_FINE_SPREAD = 1.2;

let ratioBuf = new Float64Array(0);
let ratioDone = new Uint8Array(0);

/**
 * Big faces: out holds the shadows' transmission, pf the point form. The exact value's ratio to the point
 * form varies smoothly except where the face crosses a point's horizon; it is found on a coarse grid and
 * interpolated. Coarse cells near the light, or whose corners disagree by over a factor of two, get the ratio
 * every AREA_FINE_STRIDE points; within them, a fine cell whose corners still disagree (by over
 * AREA_FINE_SPREAD, or an undefined ratio) is computed exactly point by point.
 */
function areaCorrection(L: RoomLight, g: Geometry, out: Float32Array, pf: Float32Array): void {
  const { nx, ny } = g.frame;
  const n = g.n;
  if (ratioBuf.length !== n) {
    ratioBuf = new Float64Array(n);
    ratioDone = new Uint8Array(n);
  } else ratioDone.fill(0);
  const rb = ratioBuf;
  const done = ratioDone;
  const ratioAt = (k: number): number => {
    if (done[k] === 1) return rb[k]!;
    const p = pf[k]!;
    const e = areaAt(L, g, k);
    const r = p > 0 ? e / p : e > 0 ? NaN : 1;
    rb[k] = r;
    done[k] = 1;
    return r;
  };
  // The ratio varies slowly away from the face: found every AREA_RATIO_STEP bounce cells.
  const st = g.step * AREA_RATIO_STEP;
  const kx = Math.ceil((nx - 1) / st) + 1;
  const ky = Math.ceil((ny - 1) / st) + 1;
  const ratio = new Float64Array(kx * ky);
  const idx = (a: number, b: number) => Math.min(ny - 1, b * st) * nx + Math.min(nx - 1, a * st);
  for (let b = 0; b < ky; b++) for (let a = 0; a < kx; a++) ratio[b * kx + a] = ratioAt(idx(a, b));
  const near = AREA_REFINE_RADII * Math.sqrt(L.faceR2);
  const dz2 = (g.z - L.pz) * (g.z - L.pz);
  const cb = ky > 1 ? ky - 2 : 0;
  const ca = kx > 1 ? kx - 2 : 0;
  const at = (a: number, b: number) => ratio[Math.min(b, ky - 1) * kx + Math.min(a, kx - 1)]!;
  // Coarse cells near the light, or whose corner ratios disagree by over AREA_RATIO_SPREAD (or are undefined), are refined.
  const fine = new Uint8Array(kx * ky);
  const cellHalf = 0.5 * Math.hypot(st * g.frame.dx, st * g.frame.dy);
  for (let b = 0; b <= cb; b++) {
    for (let a = 0; a <= ca; a++) {
      const r00 = at(a, b);
      const r10 = at(a + 1, b);
      const r01 = at(a, b + 1);
      const r11 = at(a + 1, b + 1);
      const lo = Math.min(r00, r10, r01, r11);
      const hi = Math.max(r00, r10, r01, r11);
      const cx = g.frame.x0 + (a + 0.5) * st * g.frame.dx - L.px;
      const cy = g.frame.y0 + (b + 0.5) * st * g.frame.dy - L.py;
      const reach = near + cellHalf;
      if (Number.isNaN(lo + hi) || hi > lo * AREA_RATIO_SPREAD || cx * cx + cy * cy + dz2 < reach * reach) fine[b * kx + a] = 1;
    }
  }
  const fs = AREA_FINE_STRIDE;
  // Points this close to the face's plane (the face at their horizon) are computed exactly.
  const band = 1.5 * fs * Math.max(g.frame.dx, g.frame.dy);
  const planeZ = (g.z - L.pz) * L.az;
  // Per column, what the loop below needs (the same arithmetic, done once per column, not per point): the coarse
  // cell a and its next column, the weight fx, and the fine stride's corners ia, ib and weight gx.
  if (colA.length < nx) {
    colA = new Int32Array(nx);
    colA1 = new Int32Array(nx);
    colIa = new Int32Array(nx);
    colIb = new Int32Array(nx);
    colFx = new Float64Array(nx);
    colGx = new Float64Array(nx);
  }
  for (let i = 0; i < nx; i++) {
    const a = Math.min(Math.floor(i / st), ca);
    const i0 = a * st;
    const i1 = Math.min(nx - 1, (a + 1) * st);
    const ia = Math.min(i0 + fs * Math.floor((i - i0) / fs), i1);
    const ib = Math.min(ia + fs, i1);
    colA[i] = a;
    colA1[i] = Math.min(a + 1, kx - 1);
    colFx[i] = i1 > i0 ? (i - i0) / (i1 - i0) : 0;
    colIa[i] = ia;
    colIb[i] = ib;
    colGx[i] = ib > ia ? (i - ia) / (ib - ia) : 0;
  }
  for (let j = 0; j < ny; j++) {
    const b = Math.min(Math.floor(j / st), cb);
    const j0 = b * st;
    const j1 = Math.min(ny - 1, (b + 1) * st);
    const fy = j1 > j0 ? (j - j0) / (j1 - j0) : 0;
    const ja = Math.min(j0 + fs * Math.floor((j - j0) / fs), j1);
    const jb = Math.min(ja + fs, j1);
    const gy = jb > ja ? (j - ja) / (jb - ja) : 0;
    const rb0 = Math.min(b, ky - 1) * kx;
    const rb1 = Math.min(b + 1, ky - 1) * kx;
    const fineRow = b * kx;
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      const p = pf[k]!;
      // out holds the shadows' transmission here. Fully shaded points stay dark (their ratio is still defined, as a
      // corner for their neighbours); so do points with no point-form light.
      const t = out[k]!;
      if (!(p > 0)) {
        out[k] = 0;
        continue;
      }
      if (t === 0) continue;
      const a = colA[i]!;
      if (fine[fineRow + a] === 1) {
        const ia = colIa[i]!;
        const ib = colIb[i]!;
        const gx = colGx[i]!;
        const r00 = ratioAt(ja * nx + ia);
        const r10 = ratioAt(ja * nx + ib);
        const r01 = ratioAt(jb * nx + ia);
        const r11 = ratioAt(jb * nx + ib);
        const lo = Math.min(r00, r10, r01, r11);
        const hi = Math.max(r00, r10, r01, r11);
        const plane = (g.px[k]! - L.px) * L.ax + (g.py[k]! - L.py) * L.ay + planeZ;
        if (Number.isNaN(lo + hi) || hi > lo * AREA_FINE_SPREAD || (lo <= 0 && hi > 0) || Math.abs(plane) < band) {
          out[k] = ratioAt(k) * p * t;
          continue;
        }
        out[k] = p * t * ((r00 * (1 - gx) + r10 * gx) * (1 - gy) + (r01 * (1 - gx) + r11 * gx) * gy);
        continue;
      }
      const fx = colFx[i]!;
      const a1 = colA1[i]!;
      const r = (ratio[rb0 + a]! * (1 - fx) + ratio[rb0 + a1]! * fx) * (1 - fy) + (ratio[rb1 + a]! * (1 - fx) + ratio[rb1 + a1]! * fx) * fy;
      out[k] = p * r * t;
    }
  }
}

let colA = new Int32Array(0);
let colA1 = new Int32Array(0);
let colIa = new Int32Array(0);
let colIb = new Int32Array(0);
let colFx = new Float64Array(0);
let colGx = new Float64Array(0);

/** out[k] += Σ_r K[base_r + k] · coef_r over the m rows listed, four rows at a time. */
function addRows(K: Float32Array, base: Int32Array, coef: Float64Array, m: number, nK: number, out: Float64Array): void {
  let r = 0;
  for (; r + 4 <= m; r += 4) {
    const b0 = base[r]!;
    const b1 = base[r + 1]!;
    const b2 = base[r + 2]!;
    const b3 = base[r + 3]!;
    const c0 = coef[r]!;
    const c1 = coef[r + 1]!;
    const c2 = coef[r + 2]!;
    const c3 = coef[r + 3]!;
    for (let k = 0; k < nK; k++) out[k]! += K[b0 + k]! * c0 + K[b1 + k]! * c1 + K[b2 + k]! * c2 + K[b3 + k]! * c3;
  }
  for (; r < m; r++) {
    const b0 = base[r]!;
    const c0 = coef[r]!;
    for (let k = 0; k < nK; k++) out[k]! += K[b0 + k]! * c0;
  }
}

let yFront = new Float64Array(0);
let yBack = new Float64Array(0);
let rowBase = new Int32Array(0);
let rowCoef = new Float64Array(0);

/**
 * The lights' bounce on the coarse grid: Σ patches kernel × the patch luminance (Y) on the side seen, summed
 * over the given lights first. The kernel is linear in the luminance, so one pass over the summed patches equals
 * the sum of one pass per light (to rounding) at the cost of one. Rows of one sign (a wall or the floor, seen
 * from one side by every point) are summed four at a time with no test per point; mixed rows (a free-standing
 * panel with points on both sides) pick the side per point.
 */
export function bounceCoarse(room: Room, lights: readonly RoomLight[], g: Geometry, out: Float64Array): void {
  out.fill(0);
  const P = room.patches;
  const nP = P.count;
  if (yFront.length < nP) {
    yFront = new Float64Array(nP);
    yBack = new Float64Array(nP);
    rowBase = new Int32Array(nP);
    rowCoef = new Float64Array(nP);
  }
  const yf = yFront;
  const yb = yBack;
  yf.fill(0, 0, nP);
  yb.fill(0, 0, nP);
  let any = false;
  for (const L of lights) {
    const lum = room.lum[L.index];
    if (!lum || L.axialCdS <= 0) continue;
    for (let p = 0; p < nP; p++) {
      const o = 6 * p;
      yf[p]! += 0.2126 * lum[o]! + 0.7152 * lum[o + 1]! + 0.0722 * lum[o + 2]!;
      yb[p]! += 0.2126 * lum[o + 3]! + 0.7152 * lum[o + 4]! + 0.0722 * lum[o + 5]!;
    }
    any = true;
  }
  if (!any) return;
  finePass(g, nP, yf, yb, out);
}

/** The fine patches' pass: out += Σ patches kernel × the luminance of the side each point sees (yf front, yb back). */
function finePass(g: Geometry, nP: number, yf: Float64Array, yb: Float64Array, out: Float64Array): void {
  const nK = g.kx * g.ky;
  const K = g.kernel;
  const sign = g.rowSign;
  // Rows of one sign: the coefficient of the side seen (a back row's kernel is negative: −Y_back keeps it positive).
  let m = 0;
  for (let p = 0; p < nP; p++) {
    const sg = sign[p]!;
    if (sg === 0 || sg === 2) continue;
    const c = sg === 1 ? yf[p]! : -yb[p]!;
    if (c === 0) continue;
    rowBase[m] = p * nK;
    rowCoef[m] = c;
    m++;
  }
  addRows(K, rowBase, rowCoef, m, nK, out);
  for (let p = 0; p < nP; p++) {
    if (sign[p] !== 2) continue;
    const f0 = yf[p]!;
    const b0 = yb[p]!;
    if (f0 === 0 && b0 === 0) continue;
    const base = p * nK;
    for (let k = 0; k < nK; k++) {
      const f = K[base + k]!;
      if (f > 0) out[k]! += f * f0;
      else if (f < 0) out[k]! -= f * b0;
    }
  }
}

let yCoarseF = new Float64Array(0);
let yCoarseB = new Float64Array(0);

/**
 * The same bounce as bounceCoarse, from its two parts: the lights' first bounce on the fine patches (rows of
 * patches no light reaches are skipped: a gridded head or a strip lights a fraction of the room) and their later
 * bounces, one value per coarse patch and side, through the coarse kernel. Equal to bounceCoarse to rounding
 * (tested); cheaper for one light, dearer for many (bounceCoarse's one pass over the summed luminance then wins).
 */
export function bounceSplit(room: Room, lights: readonly RoomLight[], g: Geometry, out: Float64Array): void {
  out.fill(0);
  const P = room.patches;
  const nP = P.count;
  const nC = room.coarse.count;
  if (yFront.length < nP) {
    yFront = new Float64Array(nP);
    yBack = new Float64Array(nP);
    rowBase = new Int32Array(nP);
    rowCoef = new Float64Array(nP);
  }
  if (yCoarseF.length < nC) {
    yCoarseF = new Float64Array(nC);
    yCoarseB = new Float64Array(nC);
  }
  const yf = yFront;
  const yb = yBack;
  const cf = yCoarseF;
  const cb = yCoarseB;
  yf.fill(0, 0, nP);
  yb.fill(0, 0, nP);
  cf.fill(0, 0, nC);
  cb.fill(0, 0, nC);
  let any = false;
  for (const L of lights) {
    const first = room.lumFirst[L.index];
    const later = room.lumLater[L.index];
    if (!first || !later || L.axialCdS <= 0) continue;
    for (let p = 0; p < nP; p++) {
      const o = 6 * p;
      yf[p]! += 0.2126 * first[o]! + 0.7152 * first[o + 1]! + 0.0722 * first[o + 2]!;
      yb[p]! += 0.2126 * first[o + 3]! + 0.7152 * first[o + 4]! + 0.0722 * first[o + 5]!;
    }
    for (let p = 0; p < nC; p++) {
      const o = 6 * p;
      cf[p]! += 0.2126 * later[o]! + 0.7152 * later[o + 1]! + 0.0722 * later[o + 2]!;
      cb[p]! += 0.2126 * later[o + 3]! + 0.7152 * later[o + 4]! + 0.0722 * later[o + 5]!;
    }
    any = true;
  }
  if (!any) return;
  finePass(g, nP, yf, yb, out);
  const nK = g.kx * g.ky;
  const KC = g.coarseKernel;
  for (let p = 0; p < nC; p++) {
    for (let sd = 0; sd < 2; sd++) {
      const c = sd === 0 ? cf[p]! : cb[p]!;
      if (c === 0) continue;
      const base = (2 * p + sd) * nK;
      for (let k = 0; k < nK; k++) out[k]! += KC[base + k]! * c;
    }
  }
}
