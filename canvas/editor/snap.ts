// Snapping while moving: to a grid that follows the zoom, and onto a wall when the point comes within reach of one.
import type { Point } from '../../model/geometry';
import type { Item } from '../../model/document';
import { M_PER_FT, type Units } from '../../model/units';

/** The grid without a view (keys, tests, the program): 0.1 m. */
export const GRID_STEP_M = 0.1;
/** The same in feet and inches: 3 in. */
const GRID_STEP_IMPERIAL_M = 0.25 * M_PER_FT;
const WALL_SNAP_M = 0.2;
const END_SNAP_M = 0.25;

/** The grid steps a drag can snap to, finest first (metres). */
export const GRID_STEPS_M = [0.01, 0.02, 0.05, 0.1, 0.25, 0.5, 1, 2, 5] as const;
/** The same for someone who works in feet and inches: ½, 1, 2, 3 and 6 in, then 1, 2, 5, 10 and 20 ft (in metres). */
export const GRID_STEPS_IMPERIAL_M = [1 / 24, 1 / 12, 1 / 6, 1 / 4, 1 / 2, 1, 2, 5, 10, 20].map((ft) => ft * M_PER_FT);
/** Where the grid's heavier lines fall: whole metres, or whole feet. */
export const gridMajorM = (units: Units = 'metric') => (units === 'imperial' ? M_PER_FT : 1);
/** A step is at least this many screen pixels, so a finger lands on the point it means (and not the next). */
export const GRID_MIN_PX = 20;

/**
 * The snapping grid at a zoom (pixels per metre): the finest step still at least GRID_MIN_PX on screen — 0.5 m
 * on a phone showing the whole 8 × 6 m stage (about 42 px/m), 0.25 m wide, 0.1 m or finer zoomed in, 1–2 m
 * zoomed far out; in feet and inches (`units` imperial) the same from GRID_STEPS_IMPERIAL_M (6 in on that phone,
 * 3 in wide). Without a zoom, GRID_STEP_M (3 in).
 */
export function gridStepM(scale: number | null | undefined, units: Units = 'metric'): number {
  const steps = units === 'imperial' ? GRID_STEPS_IMPERIAL_M : GRID_STEPS_M;
  if (!scale || !Number.isFinite(scale) || scale <= 0) return units === 'imperial' ? GRID_STEP_IMPERIAL_M : GRID_STEP_M;
  return steps.find((step) => step * scale >= GRID_MIN_PX) ?? steps[steps.length - 1]!;
}

/** One press of an arrow key: 10 cm (with Shift 1 m) in metres, 3 in (with Shift 1 ft) in feet and inches, so a
 *  nudged item stays on the grid the plan is drawn in. */
export function nudgeStepM(units: Units, step: 'small' | 'large'): number {
  if (units === 'imperial') return step === 'large' ? M_PER_FT : M_PER_FT / 4;
  return step === 'large' ? 1 : 0.1;
}

/** Round to a step, without binary fractions' dust (0.30000000000000004): to a tenth of a millimetre, so a
 *  step in inches keeps its inch (8 ft is 2.4384 m). */
const snapToGrid = (v: number, step: number) => Math.round(Math.round(v / step) * step * 10000) / 10000;

function projectOnSegment(p: Point, a: Point, b: Point): { point: Point; d: number } {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
  const point = { x: a.x + t * dx, y: a.y + t * dy };
  return { point, d: Math.hypot(p.x - point.x, p.y - point.y) };
}

/**
 * Snap a point: first to a wall's end (so walls join), then onto a wall's line, else to the grid of `stepM`
 * (gridStepM of the view's zoom). `ignore` names items being moved, which must not snap to themselves.
 */
export function snapPoint(p: Point, items: readonly Item[], ignore: ReadonlySet<string>, stepM: number = GRID_STEP_M): Point {
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
  return { x: snapToGrid(p.x, stepM), y: snapToGrid(p.y, stepM) };
}

/** Round to a tidy number of centimetres for storage (no 1.2000000000000002). */
export const tidy = (v: number) => Math.round(v * 1000) / 1000;
