/**
 * Contour lines (isolines) of a light map, traced in one pass over the grid for all levels and returned as
 * polylines in plan metres.
 *
 * Marching squares with the same conventions as d3-contour (a value v is inside a level t when v ≥ t; the
 * crossing on a cell edge is interpolated linearly), so the vertices are the ones d3-contour produces for the
 * same grid (tested). d3-contour builds filled polygons, one full scan per level, and its ring stitching cost
 * about 3 ms for a 128 × 128 map with ten levels, most of a drag frame; lines are all the canvas needs.
 * A saddle cell is split by the value at its centre (the mean of its corners).
 */

/** Grid placement: value (i, j) sits at plan point (x0 + i·dx, y0 + j·dy). */
export type GridFrame = { nx: number; ny: number; x0: number; y0: number; dx: number; dy: number };

/** Points [x, y] in plan metres. A closed line repeats its first point at the end. */
export type Polyline = [number, number][];

export type ContourLevel = { stops: number; lines: Polyline[] };

/** Each edge's first and second segment of the level being linked (−1: none); see contourLines. */
let linkA = new Int32Array(0);
let linkB = new Int32Array(0);

/**
 * Contours of `values` (row-major, nx × ny) at every multiple of stepStops above max(floorStops, minStops)
 * that the data crosses. floorStops is the clamp given to unlit points; it has no real isoline.
 */
export function contourLines(
  values: ArrayLike<number>,
  frame: GridFrame,
  stepStops: number,
  floorStops: number,
  minStops = -Infinity,
): ContourLevel[] {
  const { nx, ny } = frame;
  const lowest = Math.max(floorStops, minStops);
  let vMin = Infinity;
  let vMax = -Infinity;
  for (let k = 0; k < nx * ny; k++) {
    const v = values[k]!;
    if (v < vMin) vMin = v;
    if (v > vMax) vMax = v;
  }
  if (!(vMax > vMin)) return [];
  const kLo = Math.max(Math.floor(vMin / stepStops) + 1, Math.floor(lowest / stepStops + 1e-9) + 1);
  // At most 256 levels: a guard against a tiny step on a wide range, not a limit met in practice.
  const kHi = Math.min(Math.floor(vMax / stepStops), kLo + 255);
  if (kHi < kLo) return [];
  const nLevels = kHi - kLo + 1;
  // Segments per level as pairs of edge ids. Horizontal edge (i, j)–(i+1, j): j·(nx−1) + i;
  // vertical edge (i, j)–(i, j+1): H + j·nx + i.
  const H = ny * (nx - 1);
  const segs: number[][] = Array.from({ length: nLevels }, () => []);
  for (let j = 0; j < ny - 1; j++) {
    const r0 = j * nx;
    const r1 = r0 + nx;
    for (let i = 0; i < nx - 1; i++) {
      const a = values[r0 + i]!; // (i, j)
      const b = values[r0 + i + 1]!; // (i+1, j)
      const c = values[r1 + i]!; // (i, j+1)
      const d = values[r1 + i + 1]!; // (i+1, j+1)
      let lo = a < b ? a : b;
      if (c < lo) lo = c;
      if (d < lo) lo = d;
      let hi = a > b ? a : b;
      if (c > hi) hi = c;
      if (d > hi) hi = d;
      if (hi === lo) continue;
      let k0 = Math.floor(lo / stepStops) + 1;
      if (k0 < kLo) k0 = kLo;
      for (let k = k0; k <= kHi && k * stepStops <= hi; k++) {
        const t = k * stepStops;
        const ia = a >= t;
        const ib = b >= t;
        const ic = c >= t;
        const id = d >= t;
        const top = j * (nx - 1) + i;
        const bottom = top + (nx - 1);
        const left = H + j * nx + i;
        const right = left + 1;
        const list = segs[k - kLo]!;
        const crossings = (ia !== ib ? 1 : 0) + (ic !== id ? 1 : 0) + (ia !== ic ? 1 : 0) + (ib !== id ? 1 : 0);
        if (crossings === 2) {
          let e0 = -1;
          let e1 = -1;
          if (ia !== ib) e0 = top;
          if (ic !== id) {
            if (e0 < 0) e0 = bottom;
            else e1 = bottom;
          }
          if (ia !== ic) {
            if (e0 < 0) e0 = left;
            else e1 = left;
          }
          if (ib !== id) e1 = right;
          list.push(e0, e1);
        } else {
          // Saddle: cut off the corners whose side differs from the centre's.
          const centre = (a + b + c + d) * 0.25 >= t;
          if (ia !== centre) list.push(top, left);
          if (ib !== centre) list.push(top, right);
          if (id !== centre) list.push(right, bottom);
          if (ic !== centre) list.push(left, bottom);
        }
      }
    }
  }

  const nEdges = H + nx * (ny - 1);
  // Kept between calls (all −1 between levels and after a call: each level puts back the entries it set).
  if (linkA.length !== nEdges) {
    linkA = new Int32Array(nEdges).fill(-1);
    linkB = new Int32Array(nEdges).fill(-1);
  }
  const link0 = linkA;
  const link1 = linkB;
  const out: ContourLevel[] = [];
  for (let L = 0; L < nLevels; L++) {
    const list = segs[L]!;
    const nSeg = list.length >> 1;
    if (nSeg === 0) continue;
    const t = (kLo + L) * stepStops;
    for (let s = 0; s < nSeg; s++) {
      const ea = list[2 * s]!;
      const eb = list[2 * s + 1]!;
      if (link0[ea] === -1) link0[ea] = s;
      else link1[ea] = s;
      if (link0[eb] === -1) link0[eb] = s;
      else link1[eb] = s;
    }
    const seen = new Uint8Array(nSeg);
    const lines: Polyline[] = [];
    const walk = (s0: number, e0: number) => {
      const line: Polyline = [edgePoint(e0, t, values, frame, H)];
      let s = s0;
      let e = e0;
      while (s >= 0 && !seen[s]) {
        seen[s] = 1;
        const ea = list[2 * s]!;
        const eb = list[2 * s + 1]!;
        const next = ea === e ? eb : ea;
        line.push(edgePoint(next, t, values, frame, H));
        const n0 = link0[next]!;
        const n1 = link1[next]!;
        s = n0 === s ? n1 : n0;
        e = next;
      }
      lines.push(line);
    };
    // Open lines first (they end on the grid border, at an edge used by one segment), then closed loops.
    for (let s = 0; s < nSeg; s++) {
      if (seen[s]) continue;
      const ea = list[2 * s]!;
      const eb = list[2 * s + 1]!;
      if (link1[ea] === -1) walk(s, ea);
      else if (link1[eb] === -1) walk(s, eb);
    }
    for (let s = 0; s < nSeg; s++) if (!seen[s]) walk(s, list[2 * s]!);
    for (let s = 0; s < list.length; s++) {
      link0[list[s]!] = -1;
      link1[list[s]!] = -1;
    }
    out.push({ stops: t, lines });
  }
  return out;
}

/** Plan point where level t crosses edge e (linear interpolation between the edge's two values). */
function edgePoint(e: number, t: number, values: ArrayLike<number>, f: GridFrame, H: number): [number, number] {
  if (e < H) {
    const j = Math.floor(e / (f.nx - 1));
    const i = e - j * (f.nx - 1);
    const va = values[j * f.nx + i]!;
    const vb = values[j * f.nx + i + 1]!;
    const u = i + (t - va) / (vb - va);
    return [f.x0 + u * f.dx, f.y0 + j * f.dy];
  }
  const r = e - H;
  const j = Math.floor(r / f.nx);
  const i = r - j * f.nx;
  const va = values[j * f.nx + i]!;
  const vb = values[(j + 1) * f.nx + i]!;
  const v = j + (t - va) / (vb - va);
  return [f.x0 + i * f.dx, f.y0 + v * f.dy];
}
