// The view onto the plan: pixels per metre and where the plan's origin sits on screen. Pure math.
import type { Point } from '../model/geometry';

export type Viewport = { scale: number; tx: number; ty: number };

export const MIN_SCALE = 8; // px per metre
export const MAX_SCALE = 600;

export const toPlan = (v: Viewport, sx: number, sy: number): Point => ({ x: (sx - v.tx) / v.scale, y: (sy - v.ty) / v.scale });
export const toScreen = (v: Viewport, p: Point) => ({ x: p.x * v.scale + v.tx, y: p.y * v.scale + v.ty });

/** Fit a stage (with a margin) into a box of w × h pixels. */
export function fitStage(stage: { widthM: number; depthM: number }, w: number, h: number, marginM = 0.6): Viewport {
  const scale = clampScale(Math.min(w / (stage.widthM + 2 * marginM), h / (stage.depthM + 2 * marginM)));
  return { scale, tx: (w - stage.widthM * scale) / 2, ty: (h - stage.depthM * scale) / 2 };
}

export const clampScale = (s: number) => Math.min(MAX_SCALE, Math.max(MIN_SCALE, s));

/** Zoom by `factor` keeping the screen point (fx, fy) over the same plan point. */
export function zoomAt(v: Viewport, factor: number, fx: number, fy: number): Viewport {
  const scale = clampScale(v.scale * factor);
  const k = scale / v.scale;
  return { scale, tx: fx - (fx - v.tx) * k, ty: fy - (fy - v.ty) * k };
}

export const panBy = (v: Viewport, dx: number, dy: number): Viewport => ({ ...v, tx: v.tx + dx, ty: v.ty + dy });

/** A round length for a scale bar about `targetPx` long: 0.5, 1, 2 or 5 × 10ⁿ of the unit. */
export function scaleBarLength(scale: number, unitM: number, targetPx = 100): number {
  const raw = targetPx / scale / unitM;
  const p = 10 ** Math.floor(Math.log10(raw));
  const n = [1, 2, 5, 10].find((m) => m * p >= raw * 0.7) ?? 10;
  return n * p;
}
