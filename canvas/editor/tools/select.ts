// The select tool: a press on a handle of a selected item rotates it or moves a segment's end; a press on an
// item (the topmost under the pointer) selects it and drags the selection; a press on empty space pans
// (touch) or draws a selection box (a mouse on a wide screen; Space held pans). States: idle, dragging,
// rotating, end (moving a segment's end), panning, boxing.
import type { Item } from '../../../model/document';
import type { Point } from '../../../model/geometry';
import { distanceToItem, isSegment, rotateHandleOf } from '../../../model/kinds';
import type { EditorCore } from '../editor';
import { itemAt, near, planAt, toleranceM } from '../hit';
import { shownItems } from '../state';
import { movePan, startPan, type Panning } from './pan';
import { newGestureKey, type PointerInput, type Tool } from './types';

export type SelectState =
  | { name: 'idle' }
  | { name: 'dragging'; origin: Item[]; start: Point; key: string }
  | { name: 'rotating'; id: string; key: string }
  | { name: 'end'; id: string; end: 'a' | 'b'; key: string }
  | Panning
  | { name: 'boxing'; from: Point; to: Point; additive: boolean };

/** A handle of a selected item under the pointer: a rotate handle or a segment's end. */
function handleAt(items: readonly Item[], selection: readonly string[], p: Point, tol: number): Extract<SelectState, { key: string }> | null {
  for (const it of items) {
    if (!selection.includes(it.id) || it.locked) continue;
    if (isSegment(it)) {
      if (near(it.a, p, tol)) return { name: 'end', id: it.id, end: 'a', key: newGestureKey('end') };
      if (near(it.b, p, tol)) return { name: 'end', id: it.id, end: 'b', key: newGestureKey('end') };
    } else {
      // At a small zoom the handle's reach covers the item itself: a press nearer the item moves it.
      const h = rotateHandleOf(it);
      if (h && near(h, p, tol) && Math.hypot(h.x - p.x, h.y - p.y) < distanceToItem(it, p)) return { name: 'rotating', id: it.id, key: newGestureKey('rotate') };
    }
  }
  return null;
}

export function createSelectTool(): Tool<SelectState> {
  const tool: Tool<SelectState> = {
    id: 'select',
    state: { name: 'idle' },
    down(editor, e) {
      const s = editor.getState();
      const plan = planAt(s, e.screen);
      if (!plan) return;
      if (s.input.space) {
        tool.state = startPan(editor, e.screen) ?? { name: 'idle' };
        return;
      }
      const tol = toleranceM(s, e.pointer);
      if (!s.readOnly) {
        const handle = handleAt(shownItems(s), s.selection, plan, tol);
        if (handle) {
          tool.state = handle;
          editor.dispatch('setGesture', { gesture: handle.key });
          return;
        }
      }
      const hit = itemAt(s, e.screen, e.pointer);
      if (hit) {
        if (s.readOnly) {
          if (!s.selection.includes(hit.id)) editor.dispatch('select', { ids: [hit.id], additive: s.input.shift });
          tool.state = { name: 'idle' };
          return;
        }
        // The gesture starts before the selection changes, so the panels that hold during a gesture (the
        // inspector, the meter's selected light) take the new item when the hand lets go, not in the press's
        // frame: a press that starts a drag does not wait on the inspector's render.
        const key = newGestureKey('drag');
        editor.dispatch('setGesture', { gesture: key });
        if (!s.selection.includes(hit.id)) editor.dispatch('select', { ids: [hit.id], additive: s.input.shift });
        const sel = new Set(editor.getState().selection);
        tool.state = { name: 'dragging', origin: editor.getState().doc.items.filter((i) => sel.has(i.id)), start: plan, key };
        return;
      }
      if (s.input.boxSelect && e.pointer === 'mouse') {
        tool.state = { name: 'boxing', from: plan, to: plan, additive: s.input.shift };
        editor.dispatch('setGesture', { gesture: 'box', box: { from: plan, to: plan } });
        return;
      }
      tool.state = startPan(editor, e.screen) ?? { name: 'idle' };
    },
    move(editor, e) {
      const st = tool.state;
      const plan = planAt(editor.getState(), e.screen);
      if (!plan) return;
      switch (st.name) {
        case 'dragging':
          editor.dispatch('dragItems', { origin: st.origin, dx: plan.x - st.start.x, dy: plan.y - st.start.y, gestureKey: st.key, live: true });
          break;
        case 'rotating':
          editor.dispatch('aimAt', { id: st.id, at: plan, gestureKey: st.key, live: true });
          break;
        case 'end':
          editor.dispatch('dragEnd', { id: st.id, end: st.end, to: plan, gestureKey: st.key, live: true });
          break;
        case 'panning':
          movePan(editor, st, e.screen);
          break;
        case 'boxing':
          tool.state = { ...st, to: plan };
          editor.dispatch('setGesture', { gesture: 'box', box: { from: st.from, to: plan } });
          break;
      }
    },
    up(editor) {
      const st = tool.state;
      if (st.name === 'boxing') editor.dispatch('selectInBox', { from: st.from, to: st.to, additive: st.additive });
      tool.state = { name: 'idle' };
      editor.dispatch('setGesture', { gesture: null });
    },
    cancel(editor) {
      tool.up(editor, { screen: { x: 0, y: 0 }, pointer: 'mouse' });
    },
  };
  return tool;
}

/** A tap (no movement): select what is under it (the topmost), or clear the selection on empty space.
 *  Returns the id of the item tapped, if any. */
export function tapAt(editor: EditorCore, e: PointerInput, additive = editor.getState().input.shift): string | null {
  const hit = itemAt(editor.getState(), e.screen, e.pointer);
  if (hit) editor.dispatch('select', { ids: [hit.id], additive });
  else if (!additive) editor.dispatch('clearSelection');
  return hit?.id ?? null;
}
