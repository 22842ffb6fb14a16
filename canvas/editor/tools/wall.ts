// The wall tool: press where the wall starts, drag to where it ends, release. A press that draws out less
// than 10 cm leaves nothing behind. Either way the editor goes back to the select tool. States: idle, drawing.
import { isSegment } from '../../../model/kinds';
import { planAt } from '../hit';
import { liveItem } from '../state';
import { newGestureKey, type Tool } from './types';

export type WallState = { name: 'idle' } | { name: 'drawing'; id: string; key: string };

export function createWallTool(): Tool<WallState> {
  const tool: Tool<WallState> = {
    id: 'wall',
    state: { name: 'idle' },
    down(editor, e) {
      const plan = planAt(editor.getState(), e.screen);
      if (!plan || editor.getState().readOnly) return;
      const key = newGestureKey('wall');
      editor.dispatch('startWall', { at: plan, gestureKey: key });
      editor.dispatch('setGesture', { gesture: key });
      tool.state = { name: 'drawing', id: editor.getState().selection[0]!, key };
    },
    move(editor, e) {
      const st = tool.state;
      const plan = planAt(editor.getState(), e.screen);
      if (st.name !== 'drawing' || !plan) return;
      editor.dispatch('dragEnd', { id: st.id, end: 'b', to: plan, gestureKey: st.key, live: true });
    },
    up(editor) {
      const st = tool.state;
      if (st.name === 'drawing') {
        // The wall as drawn out so far (held by the gesture until release).
        const wall = liveItem(editor.getState(), st.id);
        if (wall && isSegment(wall) && Math.hypot(wall.b.x - wall.a.x, wall.b.y - wall.a.y) < 0.1) {
          // Too short: take the wall back out and drop what was drawn.
          editor.dispatch('undo');
          tool.state = { name: 'idle' };
          editor.dispatch('setTool', { tool: 'select' });
          editor.dispatch('setGesture', { gesture: null, discard: true });
          return;
        }
        editor.dispatch('setTool', { tool: 'select' });
      }
      tool.state = { name: 'idle' };
      editor.dispatch('setGesture', { gesture: null });
    },
    cancel(editor) {
      tool.up(editor, { screen: { x: 0, y: 0 }, pointer: 'mouse' });
    },
  };
  return tool;
}
