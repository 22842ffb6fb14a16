// What the bottom sheet hears from a vertical drag on its handle row, on phones (gesture handler's pan:
// sheetDrag.tsx) and on the web (pointer events: sheetPointer.ts, sheetDrag.web.tsx).
export type SheetDragHandlers = {
  /** The drag has begun (past SHEET_DRAG_MIN_PX from the press). */
  start: () => void;
  /** The pointer is `dy` px below where it was pressed (negative: above). */
  move: (dy: number) => void;
  /** Let go (or cancelled: speed 0), moving at `velocityY` px/s (positive: downwards). */
  end: (velocityY: number) => void;
};

/** How far the pointer moves before the sheet follows it (taps on the row's buttons stay taps). */
export const SHEET_DRAG_MIN_PX = 10;
/** The speed at release is read over the last this many ms of movement. */
export const SHEET_VELOCITY_WINDOW_MS = 100;
