// Snapping while moving: to the 0.1 m grid, and onto a wall when the point comes within reach of one.
import type { Point } from '../../model/geometry';
import type { Item } from '../../model/document';

const GRID_STEP_M = 0.1;
const WALL_SNAP_M = 0.2;
const END_SNAP_M = 0.25;

const snapToGrid = (v: number, step = GRID_STEP_M) => Math.round(v / step) * step;

function projectOnSegment(p: Point, a: Point, b: Point): { point: Point; d: number } {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
  const point = { x: a.x + t * dx, y: a.y + t * dy };
  return { point, d: Math.hypot(p.x - point.x, p.y - point.y) };
}

/**
 * Snap a point: first to a wall's end (so walls join), then onto a wall's line, else to the grid.
 * `ignore` names items being moved, which must not snap to themselves.
 */
export function snapPoint(p: Point, items: readonly Item[], ignore: ReadonlySet<string>): Point {
  let best: { point: Point; d: number } | null = null;
  for (const it of items) {
    if (it.kind !== 'wall' || ignore.has(it.id)) continue;
    for (const end of [it.a, it.b]) {
      const d = Math.hypot(p.x - end.x, p.y - end.y);
      if (d <= END_SNAP_M && (!best || d < best.d)) best = { point: end, d: d - END_SNAP_M }; // ends win over lines
    }
    const on = projectOnSegment(p, it.a, it.b);
    if (on.d <= WALL_SNAP_M && (!best || on.d < best.d)) best = on;
  }
  if (best) return best.point;
  return { x: snapToGrid(p.x), y: snapToGrid(p.y) };
}

/** Round to a tidy number of centimetres for storage (no 1.2000000000000002). */
export const tidy = (v: number) => Math.round(v * 1000) / 1000;
