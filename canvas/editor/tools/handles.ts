// The aim and height handles of a selected light (or camera) on the plan: the aim handle sits ahead of it
// along its aim, the height handle behind it. Both are placed in screen pixels, so a finger finds them at
// every zoom. Dragging the aim handle turns the head to point at the finger; dragging the height handle up or
// down raises or lowers the head (HEIGHT_PX_PER_M screen pixels to the metre, whatever the zoom), kept under
// the ceiling. Each drag is one undo step. States: idle, aiming, lifting.
import type { Item } from '../../../model/document';
import type { Point } from '../../../model/geometry';
import { angleOf } from '../../../model/kinds';
import { toScreen } from '../camera';
import type { EditorCore } from '../editor';
import { heightOf } from '../heights';
import { MOUSE_TOLERANCE_PX, TOUCH_TOLERANCE_PX } from '../hit';
import { itemById, type EditorState, type PointerKind } from '../state';
import { newGestureKey, type Tool } from './types';

/** How far the handles sit from the head's centre, screen pixels. */
export const AIM_HANDLE_PX = 58;
const HEIGHT_HANDLE_PX = 46;
/** Screen pixels of vertical drag per metre of height. */
export const HEIGHT_PX_PER_M = 80;

export type HandleState = { name: 'idle' } | { name: 'aiming'; id: string; key: string } | { name: 'lifting'; id: string; key: string; startY: number; startH: number };

const hasHandles = (i: Item | undefined): i is Item & { x: number; y: number } => !!i && !i.locked && (i.kind === 'light' || i.kind === 'camera');

/** The screen positions of an item's handles (the camera's view), or null when it has none. */
export function handlesOf(s: EditorState, id: string, item: Item | undefined = itemById(s, id)): { centre: Point; aim: Point; height: Point } | null {
  const i = item;
  if (!s.camera || s.readOnly || !hasHandles(i)) return null;
  const deg = angleOf(i) ?? 0;
  const r = (deg * Math.PI) / 180;
  const c = toScreen(s.camera, { x: i.x, y: i.y });
  return {
    centre: c,
    aim: { x: c.x + Math.cos(r) * AIM_HANDLE_PX, y: c.y + Math.sin(r) * AIM_HANDLE_PX },
    height: { x: c.x - Math.cos(r) * HEIGHT_HANDLE_PX, y: c.y - Math.sin(r) * HEIGHT_HANDLE_PX },
  };
}

/** The handle of the (one) selected light or camera under a screen point. */
function handleAt(s: EditorState, screen: Point, pointer: PointerKind): { id: string; which: 'aim' | 'height' } | null {
  if (s.selection.length !== 1 || s.readOnly) return null;
  const id = s.selection[0]!;
  if (s.visibleIds && !s.visibleIds.has(id)) return null;
  const h = handlesOf(s, id);
  if (!h) return null;
  // A finger is fat, but a press nearer the head than the handle still grabs the head.
  const tol = Math.min(pointer === 'touch' ? TOUCH_TOLERANCE_PX : MOUSE_TOLERANCE_PX, AIM_HANDLE_PX / 2);
  const d = (p: Point) => Math.hypot(p.x - screen.x, p.y - screen.y);
  const dc = d(h.centre);
  if (d(h.aim) <= tol && d(h.aim) < dc) return { id, which: 'aim' };
  if (d(h.height) <= tol && d(h.height) < dc) return { id, which: 'height' };
  return null;
}

export function createHandleTool(): Tool<HandleState> & { claims: (editor: EditorCore, screen: Point, pointer: PointerKind) => boolean } {
  const tool: Tool<HandleState> & { claims: (editor: EditorCore, screen: Point, pointer: PointerKind) => boolean } = {
    id: 'handles',
    state: { name: 'idle' },
    claims: (editor, screen, pointer) => !!handleAt(editor.getState(), screen, pointer),
    down(editor, e) {
      const s = editor.getState();
      const h = handleAt(s, e.screen, e.pointer);
      if (!h) {
        tool.state = { name: 'idle' };
        return;
      }
      const item = itemById(s, h.id)!;
      tool.state = h.which === 'aim' ? { name: 'aiming', id: h.id, key: newGestureKey('aim') } : { name: 'lifting', id: h.id, key: newGestureKey('lift'), startY: e.screen.y, startH: heightOf(item) ?? 1.5 };
      editor.dispatch('setGesture', { gesture: tool.state.key });
    },
    move(editor, e) {
      const st = tool.state;
      const s = editor.getState();
      if (st.name === 'aiming' && s.camera) {
        const at = { x: (e.screen.x - s.camera.tx) / s.camera.scale, y: (e.screen.y - s.camera.ty) / s.camera.scale };
        editor.dispatch('aimAt', { id: st.id, at, gestureKey: st.key, live: true });
      } else if (st.name === 'lifting') {
        editor.dispatch('setHeight', { id: st.id, heightM: st.startH + (st.startY - e.screen.y) / HEIGHT_PX_PER_M, gestureKey: st.key, live: true });
      }
    },
    up(editor) {
      tool.state = { name: 'idle' };
      editor.dispatch('setGesture', { gesture: null });
    },
    cancel(editor) {
      tool.up(editor, { screen: { x: 0, y: 0 }, pointer: 'mouse' });
    },
  };
  return tool;
}
