/**
 * Contour lines of a light map through d3-contour (the `contourEngine: 'd3'` option of the light map, and the
 * reference the fast tracer in contours.ts is tested against), returned as open polylines in plan metres. d3-contour returns filled regions whose rings are closed along the grid border; those border edges
 * are not isolines, so the rings are cut there.
 *
 * Speed: d3-contour scans the whole grid once per level. One cheap pass first finds, for every level, the
 * box of cells it crosses; each level is then traced on that box (plus a one-cell margin) only.
 */
import { contours as d3Contours } from 'd3-contour';

import type { ContourLevel, GridFrame, Polyline } from './contours';

/**
 * Contours of `values` (row-major, nx × ny) at every multiple of stepStops above max(floorStops, minStops)
 * that the data crosses. floorStops is the clamp given to unlit points; it has no real isoline.
 */
export function contourLinesD3(
  values: ArrayLike<number>,
  frame: GridFrame,
  stepStops: number,
  floorStops: number,
  minStops = -Infinity,
): ContourLevel[] {
  const { nx, ny, x0, y0, dx, dy } = frame;
  const lowest = Math.max(floorStops, minStops);
  // Pass 1: the box of cells each level crosses (a cell crosses t when min < t ≤ max of its corners).
  const boxes = new Map<number, [number, number, number, number]>(); // k → [i0, j0, i1, j1]
  for (let j = 0; j < ny - 1; j++) {
    const r0 = j * nx;
    const r1 = r0 + nx;
    for (let i = 0; i < nx - 1; i++) {
      const a = values[r0 + i]!;
      const b = values[r0 + i + 1]!;
      const c = values[r1 + i]!;
      const d = values[r1 + i + 1]!;
      const lo = Math.min(a, b, c, d);
      const hi = Math.max(a, b, c, d);
      if (hi - lo < 1e-12) continue;
      for (let k = Math.floor(lo / stepStops) + 1; k * stepStops <= hi; k++) {
        if (k * stepStops <= lowest + 1e-9) continue;
        const box = boxes.get(k);
        if (!box) boxes.set(k, [i, j, i, j]);
        else {
          if (i < box[0]) box[0] = i;
          if (j < box[1]) box[1] = j;
          if (i > box[2]) box[2] = i;
          if (j > box[3]) box[3] = j;
        }
      }
    }
  }
  const xMax = x0 + (nx - 1) * dx;
  const yMax = y0 + (ny - 1) * dy;
  const clampX = (x: number) => Math.min(Math.max(x, Math.min(x0, xMax)), Math.max(x0, xMax));
  const clampY = (y: number) => Math.min(Math.max(y, Math.min(y0, yMax)), Math.max(y0, yMax));
  const levels = [...boxes.keys()].sort((p, q) => p - q);
  const out: ContourLevel[] = [];
  for (const k of levels) {
    const [bi0, bj0, bi1, bj1] = boxes.get(k)!;
    const t = k * stepStops;
    const ci0 = Math.max(0, bi0 - 1);
    const cj0 = Math.max(0, bj0 - 1);
    const ci1 = Math.min(nx - 1, bi1 + 2);
    const cj1 = Math.min(ny - 1, bj1 + 2);
    const w = ci1 - ci0 + 1;
    const h = cj1 - cj0 + 1;
    const sub = new Float64Array(w * h);
    for (let j = 0; j < h; j++) {
      const src = (cj0 + j) * nx + ci0;
      for (let i = 0; i < w; i++) sub[j * w + i] = values[src + i]!;
    }
    const [mp] = d3Contours().size([w, h]).thresholds([t])(sub as unknown as number[]);
    if (!mp) continue;
    // d3-contour puts value i at coordinate i + 0.5; the crop starts at value (ci0, cj0).
    const toPlan = (p: number[]): [number, number] => [
      clampX(x0 + (ci0 + (p[0] ?? 0) - 0.5) * dx),
      clampY(y0 + (cj0 + (p[1] ?? 0) - 0.5) * dy),
    ];
    const onBorder = (p: number[]): boolean => {
      const x = p[0] ?? 0;
      const y = p[1] ?? 0;
      return x <= 0 || x >= w || y <= 0 || y >= h;
    };
    const lines: Polyline[] = [];
    for (const polygon of mp.coordinates) {
      for (const ring of polygon) {
        // The ring is closed (first point = last). Keep the segments that do not run along the border.
        const m = ring.length - 1;
        if (m < 2) continue;
        const keep: boolean[] = [];
        for (let i = 0; i < m; i++) keep.push(!(onBorder(ring[i]!) && onBorder(ring[i + 1]!)));
        const firstDrop = keep.indexOf(false);
        if (firstDrop < 0) {
          lines.push(ring.map(toPlan));
          continue;
        }
        let current: Polyline | null = null;
        for (let s = 1; s <= m; s++) {
          const i = (firstDrop + s) % m;
          if (keep[i]) {
            if (!current) current = [toPlan(ring[i]!)];
            current.push(toPlan(ring[i + 1]!));
          } else if (current) {
            lines.push(current);
            current = null;
          }
        }
        if (current) lines.push(current);
      }
    }
    if (lines.length > 0) out.push({ stops: t, lines });
  }
  return out;
}
