// The camera: pixels per metre and where the plan's origin sits on screen, and the transforms between screen
// pixels and plan metres. Pure math; the editor's camera actions use it.
import type { Point } from '../../model/geometry';

export type Camera = { scale: number; tx: number; ty: number };

export const MIN_SCALE = 8; // px per metre
export const MAX_SCALE = 600;

export const toPlan = (v: Camera, sx: number, sy: number): Point => ({ x: (sx - v.tx) / v.scale, y: (sy - v.ty) / v.scale });
export const toScreen = (v: Camera, p: Point) => ({ x: p.x * v.scale + v.tx, y: p.y * v.scale + v.ty });

/** Fit a stage (with a margin) into a box of w × h pixels. */
export function fitStage(stage: { widthM: number; depthM: number }, w: number, h: number, marginM = 0.6): Camera {
  const scale = clampScale(Math.min(w / (stage.widthM + 2 * marginM), h / (stage.depthM + 2 * marginM)));
  return { scale, tx: (w - stage.widthM * scale) / 2, ty: (h - stage.depthM * scale) / 2 };
}

export const clampScale = (s: number) => Math.min(MAX_SCALE, Math.max(MIN_SCALE, s));

/** Zoom by `factor` keeping the screen point (fx, fy) over the same plan point. */
export function zoomAt(v: Camera, factor: number, fx: number, fy: number): Camera {
  const scale = clampScale(v.scale * factor);
  const k = scale / v.scale;
  return { scale, tx: fx - (fx - v.tx) * k, ty: fy - (fy - v.ty) * k };
}

export const panBy = (v: Camera, dx: number, dy: number): Camera => ({ ...v, tx: v.tx + dx, ty: v.ty + dy });

export { scaleBarLength } from '../../drawing/scaleBar';

/**
 * A pinch: the plan point that was under the fingers' midpoint when the pinch began stays under their
 * midpoint now, at the start zoom times the pinch's scale. Moving both fingers pans with them.
 */
export function pinchCamera(start: Camera, startFocal: { x: number; y: number }, scale: number, focal: { x: number; y: number }): Camera {
  const anchor = toPlan(start, startFocal.x, startFocal.y);
  const s = clampScale(start.scale * scale);
  return { scale: s, tx: focal.x - anchor.x * s, ty: focal.y - anchor.y * s };
}
