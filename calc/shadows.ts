/**
 * Shadows cast on a grid, by rasterising each occluder's shadow instead of testing every ray.
 *
 * Seen from a source S, the points Q of the plane z = zQ whose ray S→Q crosses the plan segment AB at a
 * fraction t of the way (with the ray's height there inside the occluder's height range, t ∈ [tMin, tMax])
 * are exactly Q = S + (C − S)/t for C on AB: the quadrilateral between the copies of AB scaled about S by
 * 1/tMax and 1/tMin. So one shadow is one convex quadrilateral, filled row by row. This gives the same
 * answer as transport.transmissionAlong for every grid point, at a cost per shadowed cell instead of per
 * (point × occluder) ray test.
 */
import type { GridFrame } from './contours';
import type { Occluders } from './flatScene';

const qu = new Float64Array(8);
const qv = new Float64Array(8);
/** Clipping buffers for a tilted panel's polygon (3-D corners, at most 4 + 2 clips). */
const cx = new Float64Array(8);
const cy = new Float64Array(8);
const cz = new Float64Array(8);
const tx = new Float64Array(8);
const ty = new Float64Array(8);
const tz = new Float64Array(8);
/** Crossings nearer the source than this fraction of the way project beyond any grid (a tilted panel's polygon is clipped there). */
const TILT_NEAR_T = 1e-7;
/** Rows in which the last castShadows changed any cell (rowLo > rowHi: none). */
let rowLo = 0;
let rowHi = -1;
/** Per row, the first and last column the last castShadows changed, when the caller asked for spans (else null). */
let spans: Int32Array | null = null;
/** castShadowsSum's targets while it runs (null otherwise): the running sum, this source's transmission, its stamps. */
let sumOut: Float32Array | null = null;
let sumCur: Float32Array = new Float32Array(0);
let sumStamp: Int32Array = new Int32Array(0);
let sumId = 0;
let sumOpaque = false;
/** castShadowsCount's runs while it runs (countMode): row, first and last column of each, in the order filled. */
let countMode = false;
let runJ = new Int32Array(256);
let runA = new Int32Array(256);
let runB = new Int32Array(256);
let runN = 0;
let rowMark = new Int32Array(0);
let markId = 0;
let runNext = new Int32Array(0);
let rowHead = new Int32Array(0);
let rowList = new Int32Array(0);
let sortA = new Int32Array(16);
let sortB = new Int32Array(16);
const NO_CELLS = new Float32Array(0);

/**
 * Add to `sum` (row-major, frame.nx × frame.ny) what the shadows cast from one source take from each cell:
 * 1 − the product of the transmissions of the occluders shading it (so opaque shadows add exactly 1 per source,
 * however many overlap). For the samples of an area face: one pass per sample over the cells its shadows cover,
 * with no per-sample buffer to reset. `cur` and `stamp` are scratch of the grid's size kept by the caller
 * (`stamp` all different from `id` at the first call with a new id; ids must not repeat while it is kept).
 */
export function castShadowsSum(
  occ: Occluders,
  sx: number,
  sy: number,
  sz: number,
  zQ: number,
  frame: GridFrame,
  sum: Float32Array,
  cur: Float32Array,
  stamp: Int32Array,
  id: number,
): void {
  sumOut = sum;
  sumCur = cur;
  sumStamp = stamp;
  sumId = id;
  // With every occluder opaque (or clear), a cell's transmission for this source is 1 until its first shadow and
  // 0 after: each covered cell adds 1 once, and the stamps alone say which were added.
  sumOpaque = true;
  for (let o = 0; o < occ.count; o++) {
    const t = occ.transmission[o]!;
    if (t !== 0 && t !== 1) sumOpaque = false;
  }
  try {
    castShadows(occ, sx, sy, sz, zQ, frame, cur);
  } finally {
    sumOut = null;
  }
}

/**
 * castShadowsSum for opaque occluders (every transmission 0 or 1; others are not for this), by runs: for each row,
 * the cells the shadows cast from one source cover, as runs of columns (overlapping shadows merged, so a cell
 * counts once), added to `diff` as +1 at a run's first column and −1 after its last. `diff` has ny rows of nx + 1
 * (row j at j·(nx + 1)); the running sum along a row (countsFromDiff) is the number of sources shading each cell
 * — castShadowsSum's sum, with no work per covered cell (tested equal).
 */
export function castShadowsCount(occ: Occluders, sx: number, sy: number, sz: number, zQ: number, frame: GridFrame, diff: Int32Array): void {
  runN = 0;
  countMode = true;
  try {
    castShadows(occ, sx, sy, sz, zQ, frame, NO_CELLS);
  } finally {
    countMode = false;
  }
  const n = runN;
  if (n === 0) return;
  const w = frame.nx + 1;
  const ny = frame.ny;
  if (rowMark.length < ny) {
    rowMark = new Int32Array(ny);
    markId = 0;
  }
  if (markId >= 0x7ffffff0) {
    rowMark.fill(0);
    markId = 0;
  }
  const mark = ++markId;
  // Runs of one shadow are one per row; a row may hold runs of several shadows (a flag's, and a wall's along the
  // grid's edge), which may overlap: each row's runs are chained (rowHead, runNext) and merged there.
  if (runNext.length < runJ.length) runNext = new Int32Array(runJ.length);
  if (rowHead.length < ny) {
    rowHead = new Int32Array(ny);
    rowList = new Int32Array(ny);
  }
  let rows = 0;
  for (let r = 0; r < n; r++) {
    const j = runJ[r]!;
    if (rowMark[j] !== mark) {
      rowMark[j] = mark;
      rowHead[j] = -1;
      rowList[rows++] = j;
    }
    runNext[r] = rowHead[j]!;
    rowHead[j] = r;
  }
  for (let q = 0; q < rows; q++) {
    const j = rowList[q]!;
    const base = j * w;
    let r = rowHead[j]!;
    if (runNext[r] === -1) {
      diff[base + runA[r]!]! += 1;
      diff[base + runB[r]! + 1]! -= 1;
      continue;
    }
    // Several runs: sorted by first column (few: insertion), then merged.
    let m = 0;
    for (; r !== -1; r = runNext[r]!) {
      if (m === sortA.length) {
        sortA = grow(sortA);
        sortB = grow(sortB);
      }
      const a = runA[r]!;
      const b = runB[r]!;
      let k = m++;
      while (k > 0 && sortA[k - 1]! > a) {
        sortA[k] = sortA[k - 1]!;
        sortB[k] = sortB[k - 1]!;
        k--;
      }
      sortA[k] = a;
      sortB[k] = b;
    }
    let a0 = sortA[0]!;
    let b0 = sortB[0]!;
    for (let k = 1; k < m; k++) {
      const a = sortA[k]!;
      const b = sortB[k]!;
      if (a <= b0 + 1) {
        if (b > b0) b0 = b;
        continue;
      }
      diff[base + a0]! += 1;
      diff[base + b0 + 1]! -= 1;
      a0 = a;
      b0 = b;
    }
    diff[base + a0]! += 1;
    diff[base + b0 + 1]! -= 1;
  }
}

function grow(a: Int32Array<ArrayBuffer>): Int32Array<ArrayBuffer> {
  const b = new Int32Array(2 * a.length);
  b.set(a);
  return b;
}

/**
 * Multiply into `trans` (row-major, frame.nx × frame.ny) the transmission of every occluder's shadow cast
 * from source (sx, sy, sz) onto the grid plane at height zQ. skipSurface: a surface index that casts nothing
 * (the surface a bounce patch sits on). `rows`, if given, gets the first and last row in which any cell changed
 * (first > last: none), so a caller can undo or sum just those rows; `colSpans` (2 per row), the first and last
 * changed column of each row (first > last: none), to sum just those cells.
 */
export function castShadows(
  occ: Occluders,
  sx: number,
  sy: number,
  sz: number,
  zQ: number,
  frame: GridFrame,
  trans: Float32Array,
  skipSurface = -1,
  rows?: Int32Array,
  colSpans?: Int32Array,
): void {
  const { nx, ny, x0, y0, dx, dy } = frame;
  rowLo = ny;
  rowHi = -1;
  spans = colSpans ?? null;
  if (spans) for (let j = 0; j < ny; j++) {
    spans[2 * j] = nx;
    spans[2 * j + 1] = -1;
  }
  // Bounds of the grid's reach (Math.sqrt: V8's variadic Math.hypot is several times slower where not inlined).
  const gx = (nx - 1) * dx;
  const gy = (ny - 1) * dy;
  const gridSpan = Math.sqrt(gx * gx + gy * gy);
  const cx0 = x0 + gx / 2 - sx;
  const cy0 = y0 + gy / 2 - sy;
  const toGrid = Math.sqrt(cx0 * cx0 + cy0 * cy0);
  const dzQ = zQ - sz;
  for (let o = 0; o < occ.count; o++) {
    if (skipSurface >= 0 && occ.surface[o] === skipSurface) continue;
    const T = occ.transmission[o]!;
    if (T === 1) continue;
    if (occ.tilted !== undefined && occ.tilted[o] === 1) {
      castTilted(occ, o, sx, sy, sz, zQ, frame, trans, T);
      continue;
    }
    // Range of the crossing fraction t for which the ray's height is inside the occluder.
    let tMin: number;
    let tMax: number;
    const lo = occ.zLo[o]!;
    const hi = occ.zHi[o]!;
    if (dzQ === 0) {
      if (sz < lo || sz > hi) continue;
      tMin = 0;
      tMax = 1;
    } else {
      const ta = (lo - sz) / dzQ;
      const tb = (hi - sz) / dzQ;
      tMin = Math.max(0, Math.min(ta, tb));
      tMax = Math.min(1 - 1e-9, Math.max(ta, tb));
    }
    if (!(tMax > tMin) || tMax <= 1e-9) continue;
    const ax = occ.ax[o]! - sx;
    const ay = occ.ay[o]! - sy;
    const bx = ax + occ.ex[o]!;
    const by = ay + occ.ey[o]!;
    const cr = ax * by - ay * bx;
    const segLen = Math.sqrt(occ.ex[o]! * occ.ex[o]! + occ.ey[o]! * occ.ey[o]!);
    if (Math.abs(cr) < 1e-12 || segLen === 0) continue; // source on the occluder's line: no area in shadow
    const h = Math.abs(cr) / segLen; // distance from the source to the occluder's line
    const kNear = 1 / tMax;
    // Crossings nearer the source than t = 1e-9 do not count, as in the ray test.
    const kFar = Math.min(tMin > 1e-9 ? 1 / tMin : 1e9, (gridSpan + toGrid + 1) / h);
    if (!(kFar > kNear)) continue;
    // Quadrilateral in grid index space (u, v), convex.
    qu[0] = (sx + ax * kNear - x0) / dx;
    qv[0] = (sy + ay * kNear - y0) / dy;
    qu[1] = (sx + bx * kNear - x0) / dx;
    qv[1] = (sy + by * kNear - y0) / dy;
    qu[2] = (sx + bx * kFar - x0) / dx;
    qv[2] = (sy + by * kFar - y0) / dy;
    qu[3] = (sx + ax * kFar - x0) / dx;
    qv[3] = (sy + ay * kFar - y0) / dy;
    fillConvexQuad(trans, nx, ny, T);
  }
  if (rows) {
    rows[0] = rowLo;
    rows[1] = rowHi;
  }
}

/**
 * A tilted panel's shadow on the plane z = zQ: the points Q whose ray from S crosses the panel are the central
 * projections Q = S + (C − S)/t of its points C with t = (C.z − S.z)/(zQ − S.z) in (0, 1) — the panel's
 * parallelogram clipped to that slab of heights, then projected corner by corner (a projection from a point on
 * one side of the plane keeps a convex polygon convex). With the grid at the source's height the rays are
 * level and cross the panel only along its section at that height: the shadow of that segment.
 */
function castTilted(occ: Occluders, o: number, sx: number, sy: number, sz: number, zQ: number, frame: GridFrame, trans: Float32Array, T: number): void {
  const { nx, ny, x0, y0, dx, dy } = frame;
  const ax = occ.ax[o]!;
  const ay = occ.ay[o]!;
  const az = occ.zLo[o]!;
  const ex = occ.ex[o]!;
  const ey = occ.ey[o]!;
  const vx = occ.vx![o]!;
  const vy = occ.vy![o]!;
  const vz = occ.vz![o]!;
  const dzQ = zQ - sz;
  if (dzQ === 0) {
    if (!(vz > 0) || sz < az || sz > az + vz) return;
    const w = (sz - az) / vz;
    const px = ax + vx * w - sx;
    const py = ay + vy * w - sy;
    const segLen = Math.hypot(ex, ey);
    const cr = px * (py + ey) - py * (px + ex);
    if (Math.abs(cr) < 1e-12 || segLen === 0) return;
    const h = Math.abs(cr) / segLen;
    const gridSpan = Math.hypot((nx - 1) * dx, (ny - 1) * dy);
    const toGrid = Math.hypot(x0 + ((nx - 1) * dx) / 2 - sx, y0 + ((ny - 1) * dy) / 2 - sy);
    const kFar = Math.max(1, (gridSpan + toGrid + 1) / h);
    qu[0] = (sx + px - x0) / dx;
    qv[0] = (sy + py - y0) / dy;
    qu[1] = (sx + px + ex - x0) / dx;
    qv[1] = (sy + py + ey - y0) / dy;
    qu[2] = (sx + (px + ex) * kFar - x0) / dx;
    qv[2] = (sy + (py + ey) * kFar - y0) / dy;
    qu[3] = (sx + px * kFar - x0) / dx;
    qv[3] = (sy + py * kFar - y0) / dy;
    fillConvexQuad(trans, nx, ny, T, 4);
    return;
  }
  // Corners A, A + E, A + E + V, A + V; clip to TILT_NEAR_T ≤ t ≤ 1 − 1e-9 (t linear in the height).
  cx[0] = ax; cy[0] = ay; cz[0] = az;
  cx[1] = ax + ex; cy[1] = ay + ey; cz[1] = az;
  cx[2] = ax + ex + vx; cy[2] = ay + ey + vy; cz[2] = az + vz;
  cx[3] = ax + vx; cy[3] = ay + vy; cz[3] = az + vz;
  let m = clipByT(4, sz, dzQ, TILT_NEAR_T, 1, cx, cy, cz, tx, ty, tz);
  m = clipByT(m, sz, dzQ, 1 - 1e-9, -1, tx, ty, tz, cx, cy, cz);
  if (m < 3) return;
  for (let k = 0; k < m; k++) {
    const k1 = dzQ / (cz[k]! - sz);
    qu[k] = (sx + (cx[k]! - sx) * k1 - x0) / dx;
    qv[k] = (sy + (cy[k]! - sy) * k1 - y0) / dy;
  }
  fillConvexQuad(trans, nx, ny, T, m);
}

/**
 * Sutherland–Hodgman against one bound on t = (z − sz)/dzQ: keep t ≥ bound (sign 1) or t ≤ bound (sign −1).
 * Writes the clipped polygon into (ox, oy, oz) and returns its corner count.
 */
function clipByT(n: number, sz: number, dzQ: number, bound: number, sign: number, ix: Float64Array, iy: Float64Array, iz: Float64Array, ox: Float64Array, oy: Float64Array, oz: Float64Array): number {
  let m = 0;
  for (let k = 0; k < n; k++) {
    const k1 = k + 1 === n ? 0 : k + 1;
    const fa = sign * ((iz[k]! - sz) / dzQ - bound);
    const fb = sign * ((iz[k1]! - sz) / dzQ - bound);
    if (fa >= 0) {
      ox[m] = ix[k]!;
      oy[m] = iy[k]!;
      oz[m] = iz[k]!;
      m++;
    }
    if ((fa >= 0) !== (fb >= 0)) {
      const u = fa / (fa - fb);
      ox[m] = ix[k]! + (ix[k1]! - ix[k]!) * u;
      oy[m] = iy[k]! + (iy[k1]! - iy[k]!) * u;
      oz[m] = iz[k]! + (iz[k1]! - iz[k]!) * u;
      m++;
    }
  }
  return m;
}

/** Multiply cells (i, j) inside the convex polygon (qu, qv) of `count` corners by T, edges included. */
function fillConvexQuad(trans: Float32Array, nx: number, ny: number, T: number, count = 4): void {
  let vMin = Infinity;
  let vMax = -Infinity;
  for (let k = 0; k < count; k++) {
    const v = qv[k]!;
    if (v < vMin) vMin = v;
    if (v > vMax) vMax = v;
  }
  const j0 = Math.max(0, Math.ceil(vMin - 1e-9));
  const j1 = Math.min(ny - 1, Math.floor(vMax + 1e-9));
  for (let j = j0; j <= j1; j++) {
    let uMin = Infinity;
    let uMax = -Infinity;
    for (let k = 0; k < count; k++) {
      const k1 = k + 1 === count ? 0 : k + 1;
      const ua = qu[k]!;
      const va = qv[k]!;
      const ub = qu[k1]!;
      const vb = qv[k1]!;
      if ((va > j && vb > j) || (va < j && vb < j)) continue; // edge does not reach this row (compared, not multiplied: tiny products underflow)
      let u: number;
      if (va === vb) {
        // horizontal edge on this row: both ends count
        if (ua < uMin) uMin = ua;
        if (ua > uMax) uMax = ua;
        u = ub;
      } else {
        u = ua + ((j - va) * (ub - ua)) / (vb - va);
      }
      if (u < uMin) uMin = u;
      if (u > uMax) uMax = u;
    }
    if (!(uMax >= uMin)) continue;
    const i0 = Math.max(0, Math.ceil(uMin - 1e-9));
    const i1 = Math.min(nx - 1, Math.floor(uMax + 1e-9));
    if (i0 > i1) continue;
    if (j < rowLo) rowLo = j;
    if (j > rowHi) rowHi = j;
    if (spans) {
      if (i0 < spans[2 * j]!) spans[2 * j] = i0;
      if (i1 > spans[2 * j + 1]!) spans[2 * j + 1] = i1;
    }
    if (countMode) {
      if (runN === runJ.length) {
        runJ = grow(runJ);
        runA = grow(runA);
        runB = grow(runB);
      }
      runJ[runN] = j;
      runA[runN] = i0;
      runB[runN] = i1;
      runN++;
      continue;
    }
    const row = j * nx;
    if (sumOut) {
      // castShadowsSum: this source's transmission so far (1 before its first shadow here), times T; the sum
      // takes the difference.
      const acc = sumOut;
      const cur = sumCur;
      const st = sumStamp;
      const id = sumId;
      if (sumOpaque) {
        for (let k = row + i0; k <= row + i1; k++) {
          if (st[k] === id) continue;
          acc[k]! += 1;
          st[k] = id;
        }
        continue;
      }
      for (let k = row + i0; k <= row + i1; k++) {
        const old = st[k] === id ? cur[k]! : 1;
        const now = old * T;
        acc[k]! += old - now;
        cur[k] = now;
        st[k] = id;
      }
      continue;
    }
    for (let i = i0; i <= i1; i++) trans[row + i]! *= T;
  }
}
