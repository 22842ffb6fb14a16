// Hit testing in screen terms, the one place every view asks "what is under this pointer": the editor's
// tools, the read-only plan's taps and the comment pins. Tolerance is in screen pixels (a finger is fatter
// than a mouse) turned into metres by the camera, so it feels the same at every zoom.
import type { Item } from '../../model/document';
import type { Point } from '../../model/geometry';
import { hitTest } from '../../model/kinds';
import { toPlan } from './camera';
import { shownItems, type EditorState, type PointerKind } from './state';

export const TOUCH_TOLERANCE_PX = 22;
export const MOUSE_TOLERANCE_PX = 10;

export const near = (a: Point, b: Point, tol: number) => Math.hypot(a.x - b.x, a.y - b.y) <= tol;

export function toleranceM(s: EditorState, pointer: PointerKind): number {
  return (pointer === 'touch' ? TOUCH_TOLERANCE_PX : MOUSE_TOLERANCE_PX) / (s.camera?.scale ?? 80);
}

/** The plan point under a screen point, or null before the camera exists. */
export function planAt(s: EditorState, screen: Point): Point | null {
  return s.camera ? toPlan(s.camera, screen.x, screen.y) : null;
}

/** The topmost shown item under a screen point. */
export function itemAt(s: EditorState, screen: Point, pointer: PointerKind): Item | null {
  const p = planAt(s, screen);
  return p ? hitTest(shownItems(s), p, toleranceM(s, pointer)) : null;
}
