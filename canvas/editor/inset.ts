// The view when part of the plan's box gets covered or uncovered (the phone's sheet moving): a plan shown
// whole ("fit") is fitted again to the space left; a plan zoomed in by hand keeps its zoom, keeps the middle of
// the uncovered part where it was, and brings the selected item back into view if the sheet would hide it.
import { anchorOf } from '../../model/kinds';
import { fitStage, toScreen, type Camera } from './camera';
import { itemById, type EditorState } from './state';

type Viewport = EditorState['viewport'];

/** Pixels kept between the selected item and the edge of the uncovered part. */
const KEEP_PX = 48;

/** Whether the camera shows the stage as "fit" does in this viewport (within half a pixel). */
export function isFitted(camera: Camera, stage: EditorState['doc']['stage'], v: Viewport): boolean {
  if (v.w <= 0 || v.h - v.insetBottom <= 0) return false;
  const f = fitStage(stage, v.w, v.h - v.insetBottom);
  return Math.abs(f.scale - camera.scale) < 0.01 && Math.abs(f.tx - camera.tx) < 0.5 && Math.abs(f.ty - camera.ty) < 0.5;
}

export function insetCamera(s: EditorState, next: Viewport): Camera | null {
  const cam = s.camera;
  if (!cam) return null;
  const free = next.h - next.insetBottom;
  if (next.w <= 0 || free <= 0) return cam;
  if (isFitted(cam, s.doc.stage, s.viewport)) return fitStage(s.doc.stage, next.w, free);
  // Keep the middle of the uncovered part over the same plan point.
  const oldMid = { x: s.viewport.w / 2, y: (s.viewport.h - s.viewport.insetBottom) / 2 };
  let moved: Camera = { ...cam, tx: cam.tx + (next.w / 2 - oldMid.x), ty: cam.ty + (free / 2 - oldMid.y) };
  // The selected item stays on screen above the sheet.
  const sel = s.selection[0] ? itemById(s, s.selection[0]) : undefined;
  if (sel) {
    const p = toScreen(moved, anchorOf(sel));
    const keep = Math.min(KEEP_PX, free / 2);
    const dy = p.y > free - keep ? free - keep - p.y : p.y < keep ? keep - p.y : 0;
    const dx = p.x > next.w - keep ? next.w - keep - p.x : p.x < keep ? keep - p.x : 0;
    moved = { ...moved, tx: moved.tx + dx, ty: moved.ty + dy };
  }
  return moved;
}
