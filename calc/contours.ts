/**
 * One-stop contour lines of a light map, via d3-contour's marching squares, returned as open polylines in
 * plan metres (the rings d3 closes along the grid border are cut there, since those edges are not isolines).
 */
import { contours as d3Contours } from 'd3-contour';

/** Grid placement: value (i, j) sits at plan point (x0 + i·dx, y0 + j·dy). */
export type GridFrame = { nx: number; ny: number; x0: number; y0: number; dx: number; dy: number };

/** Points [x, y] in plan metres. */
export type Polyline = [number, number][];

export type ContourLevel = { stops: number; lines: Polyline[] };

/**
 * Contours of `values` (row-major, nx × ny) at every multiple of stepStops from the data's minimum to its
 * maximum, skipping levels at or below floorStops (the clamp for unlit points, which has no real isoline).
 */
export function contourLines(values: ArrayLike<number>, frame: GridFrame, stepStops: number, floorStops: number): ContourLevel[] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  const thresholds: number[] = [];
  for (let k = Math.ceil(lo / stepStops); k * stepStops <= hi; k++) {
    const t = k * stepStops;
    if (t > floorStops + 1e-9 && t > lo) thresholds.push(t);
  }
  if (thresholds.length === 0) return [];
  const gen = d3Contours().size([frame.nx, frame.ny]).thresholds(thresholds);
  const polys = gen(values as unknown as number[]);
  const { nx, ny, x0, y0, dx, dy } = frame;
  const xMax = x0 + (nx - 1) * dx;
  const yMax = y0 + (ny - 1) * dy;
  const toPlan = (p: number[]): [number, number] => {
    // d3-contour puts value i at coordinate i + 0.5.
    const x = x0 + ((p[0] ?? 0) - 0.5) * dx;
    const y = y0 + ((p[1] ?? 0) - 0.5) * dy;
    return [Math.min(Math.max(x, Math.min(x0, xMax)), Math.max(x0, xMax)), Math.min(Math.max(y, Math.min(y0, yMax)), Math.max(y0, yMax))];
  };
  const onBorder = (p: number[]): boolean => {
    const x = p[0] ?? 0;
    const y = p[1] ?? 0;
    return x <= 0 || x >= nx || y <= 0 || y >= ny;
  };
  return polys.map((mp) => {
    const lines: Polyline[] = [];
    for (const polygon of mp.coordinates) {
      for (const ring of polygon) {
        // ring is closed: ring[0] equals ring[last]. Keep segments not lying along the border.
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
        for (let k = 1; k <= m; k++) {
          const i = (firstDrop + k) % m;
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
    return { stops: mp.value, lines };
  });
}
