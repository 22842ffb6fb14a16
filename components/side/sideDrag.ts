// Dragging in the side view, as a small state machine (down / move / up in the view's pixels): a press on a
// head's tilt handle turns it up or down; a press on a head, the camera or the subject's face lifts or lowers
// it. Every change goes through the editor's actions, one undo step per drag. States: idle, lifting, tilting.
import type { EditorCore } from '../../canvas/editor/editor';
import { newGestureKey } from '../../canvas/editor/tools/types';
import { sideTransform, tiltHandle, tiltToward, type SideBox, type SidePoint, type SideScene } from './elevation';

type SideDragState = { name: 'idle' } | { name: 'lifting'; id: string; key: string; dz: number } | { name: 'tilting'; id: string; key: string; at: SidePoint };

/** Reach of a press, pixels (a finger). */
const SIDE_HIT_PX = 22;

type Hit = { id: string; what: 'head' | 'tilt'; at: SidePoint };

export function sideHit(scene: SideScene, box: SideBox, x: number, y: number): Hit | null {
  const t = sideTransform(scene, box);
  let best: (Hit & { d: number }) | null = null;
  const consider = (h: Hit, p: SidePoint, bonus = 0) => {
    const q = t.toPx(p);
    const d = Math.hypot(q.x - x, q.y - y) - bonus;
    if (d <= SIDE_HIT_PX && (!best || d < best.d)) best = { ...h, d };
  };
  for (const s of scene.shapes) {
    if (s.kind === 'light' || s.kind === 'camera') {
      consider({ id: s.id, what: 'head', at: s.at }, s.at);
      // The tilt handle wins a close call: it is the smaller target.
      consider({ id: s.id, what: 'tilt', at: s.at }, tiltHandle(s.at, s.tiltDeg, s.facing), 4);
    } else if (s.kind === 'subject') consider({ id: s.id, what: 'head', at: s.at }, s.at);
  }
  if (!best) return null;
  const { d: _d, ...hit } = best as Hit & { d: number };
  return hit;
}

export function createSideDrag() {
  const drag = {
    state: { name: 'idle' } as SideDragState,
    down(editor: EditorCore, scene: SideScene, box: SideBox, x: number, y: number): boolean {
      if (editor.getState().readOnly) return false;
      const hit = sideHit(scene, box, x, y);
      if (!hit) return false;
      editor.dispatch('select', { ids: [hit.id] });
      const t = sideTransform(scene, box);
      if (hit.what === 'tilt') drag.state = { name: 'tilting', id: hit.id, key: newGestureKey('tilt'), at: hit.at };
      else drag.state = { name: 'lifting', id: hit.id, key: newGestureKey('lift'), dz: hit.at.z - t.toM(x, y).z };
      editor.dispatch('setGesture', { gesture: drag.state.key });
      return true;
    },
    move(editor: EditorCore, scene: SideScene, box: SideBox, x: number, y: number) {
      const st = drag.state;
      const t = sideTransform(scene, box);
      const p = t.toM(x, y);
      if (st.name === 'lifting') editor.dispatch('setHeight', { id: st.id, heightM: p.z + st.dz, gestureKey: st.key });
      else if (st.name === 'tilting') editor.dispatch('setTilt', { id: st.id, tiltDeg: tiltToward(st.at, p), gestureKey: st.key });
    },
    up(editor: EditorCore) {
      if (drag.state.name !== 'idle') editor.dispatch('setGesture', { gesture: null });
      drag.state = { name: 'idle' };
    },
  };
  return drag;
}
