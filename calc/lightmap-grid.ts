/**
 * The light map's fixed part, rebuilt only when walls, flags, the grid or the receptor facing change: grid
 * point positions and receptor normals, occluders, bounce patches and the patch → coarse-point bounce kernels;
 * and the per-light direct-light loop over the grid (see lightmap.ts for the model).
 */
import type { GridFrame } from './contours';
import type { LightMapGrid } from './lightmap';
import { PROFILE_LUT_SIZE } from './modifiers';
import {
  type Occluders,
  type Patches,
  type PreparedLight,
  type SurfaceOptics,
  MIN_DISTANCE_SQ_M2,
  buildOccluders,
  buildPatches,
  surfaceOptics,
} from './prepare';
import type { Scene } from './scene';
import { castShadows } from './shadows';
import { DEG } from './vec';

const DEFAULT_BOUNCE_STEP = 4;
const DEFAULT_MAP_PATCH_M = 1;
const MAP_MAX_PATCHES_PER_SURFACE = 24;

/** Everything about the map that does not depend on the lights. */
export type Geometry = {
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

export function buildGeometry(scene: Scene, grid: LightMapGrid, key: string): Geometry {
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
export function directGrid(L: PreparedLight, g: Geometry, out: Float32Array): void {
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
