// What the plan's gestures hand PlanCanvas (planGestures.tsx on phones, planGestures.web.tsx on the web).
import type { Point } from '../model/geometry';

export type PlanGestureHandlers = {
  /** A one-finger drag went past 3 px: where it was pressed, and where the finger is now. */
  dragStart: (from: Point, to: Point) => void;
  dragMove: (to: Point) => void;
  /** The drag's last position before the release (moves waiting for a frame are flushed first). */
  dragRelease: (at: Point) => void;
  /** The drag is over (after dragRelease, or cancelled): the pointer is up at this point. */
  dragEnd: (at: Point) => void;
  tap: (at: Point) => void;
  /** Pressed still for 450 ms. */
  hold: (at: Point) => void;
  /** Two fingers (phones only; the web reads them in webPinch.ts). */
  pinchStart: (focal: Point) => void;
  pinchUpdate: (scale: number, focal: Point) => void;
  pinchEnd: () => void;
  twoFingerPan: (dx: number, dy: number) => void;
};

export const DRAG_MIN_PX = 3;
export const TAP_MAX_PX = 3;
export const HOLD_MS = 450;
