// What a pointer does on the plan, as a small state machine: press on a handle rotates or moves an end,
// press on an item drags the selection, press on empty space pans (touch) or draws a selection box (mouse on
// a wide screen; hold Space to pan instead). Pure: it reads the store and dispatches actions; tests drive it
// headless with plan coordinates.
import type { Item } from '../model/document';
import type { Point } from '../model/geometry';
import { hitTest, isSegment, rotateHandleOf } from '../model/kinds';
import type { EditorStore } from './state/store';
import { panBy, type Viewport } from './viewport';

export type Press =
  | { mode: 'idle' }
  | { mode: 'drag'; origin: Item[]; start: Point; key: string }
  | { mode: 'rotate'; id: string; key: string }
  | { mode: 'end'; id: string; end: 'a' | 'b'; key: string; drawing?: boolean }
  | { mode: 'pan'; startView: Viewport; startScreen: Point }
  | { mode: 'box'; from: Point; to: Point; additive: boolean };

export type PressOptions = {
  /** Hit tolerance in metres (a finger is fatter than a mouse). */
  toleranceM: number;
  /** Empty-space drags draw a selection box (mouse on a wide screen). */
  boxSelect: boolean;
  /** Space is held: always pan. */
  panKey: boolean;
  /** Shift is held: add to the selection. */
  additive: boolean;
  /** The items on screen, when the canvas shows only some (a step of the build); default: all. */
  items?: readonly Item[];
};

let gestureCounter = 0;
const newKey = (what: string) => `${what}-${++gestureCounter}`;

const near = (a: Point, b: Point, tol: number) => Math.hypot(a.x - b.x, a.y - b.y) <= tol;

/** A handle of a selected item under the pointer: a rotate handle or a segment's end. */
function handleAt(items: readonly Item[], selection: readonly string[], p: Point, tol: number): Press | null {
  for (const it of items) {
    if (!selection.includes(it.id) || it.locked) continue;
    if (isSegment(it)) {
      if (near(it.a, p, tol)) return { mode: 'end', id: it.id, end: 'a', key: newKey('end') };
      if (near(it.b, p, tol)) return { mode: 'end', id: it.id, end: 'b', key: newKey('end') };
    } else {
      const h = rotateHandleOf(it);
      if (h && near(h, p, tol)) return { mode: 'rotate', id: it.id, key: newKey('rotate') };
    }
  }
  return null;
}

export function pressDown(store: EditorStore, view: Viewport, plan: Point, screen: Point, o: PressOptions): Press {
  const s = store.getState();
  if (o.panKey) return { mode: 'pan', startView: view, startScreen: screen };
  if (s.tool === 'wall' && !s.readOnly) {
    const key = newKey('wall');
    store.dispatch('startWall', { at: plan, gestureKey: key });
    return { mode: 'end', id: store.getState().selection[0]!, end: 'b', key, drawing: true };
  }
  const shown = o.items ?? s.doc.items;
  if (!s.readOnly) {
    const handle = handleAt(shown, s.selection, plan, o.toleranceM);
    if (handle) return handle;
  }
  const hit = hitTest(shown, plan, o.toleranceM);
  if (hit) {
    if (!s.selection.includes(hit.id)) store.dispatch('select', { ids: [hit.id], additive: o.additive });
    if (s.readOnly) return { mode: 'idle' };
    const sel = new Set(store.getState().selection);
    return { mode: 'drag', origin: store.getState().doc.items.filter((i) => sel.has(i.id)), start: plan, key: newKey('drag') };
  }
  if (o.boxSelect) return { mode: 'box', from: plan, to: plan, additive: o.additive };
  return { mode: 'pan', startView: view, startScreen: screen };
}

/** Returns the press as it continues (a box grows) and, when panning, the new viewport. */
export function pressMove(store: EditorStore, press: Press, plan: Point, screen: Point): { press: Press; view?: Viewport } {
  switch (press.mode) {
    case 'drag':
      store.dispatch('dragItems', { origin: press.origin, dx: plan.x - press.start.x, dy: plan.y - press.start.y, gestureKey: press.key });
      return { press };
    case 'rotate':
      store.dispatch('aimAt', { id: press.id, at: plan, gestureKey: press.key });
      return { press };
    case 'end':
      store.dispatch('dragEnd', { id: press.id, end: press.end, to: plan, gestureKey: press.key });
      return { press };
    case 'pan':
      return { press, view: panBy(press.startView, screen.x - press.startScreen.x, screen.y - press.startScreen.y) };
    case 'box':
      return { press: { ...press, to: plan } };
    default:
      return { press };
  }
}

export function pressUp(store: EditorStore, press: Press): Press {
  if (press.mode === 'box') store.dispatch('selectInBox', { from: press.from, to: press.to, additive: press.additive });
  if (press.mode === 'end' && press.drawing) {
    // A wall is drawn once; a press that did not draw one out leaves nothing behind.
    const wall = store.getState().doc.items.find((i) => i.id === press.id);
    if (wall && isSegment(wall) && Math.hypot(wall.b.x - wall.a.x, wall.b.y - wall.a.y) < 0.1) store.dispatch('undo');
    store.dispatch('setTool', { tool: 'select' });
  }
  return { mode: 'idle' };
}

/** A tap (no movement): select what is under it, or clear the selection on empty space. */
export function tap(store: EditorStore, plan: Point, o: Pick<PressOptions, 'toleranceM' | 'additive' | 'items'>) {
  const hit = hitTest(o.items ?? store.getState().doc.items, plan, o.toleranceM);
  if (hit) store.dispatch('select', { ids: [hit.id], additive: o.additive });
  else if (!o.additive) store.dispatch('clearSelection');
}
