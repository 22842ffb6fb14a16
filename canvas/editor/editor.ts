// The editor: one object per open plan that owns the document, the selection, the history, the camera, the
// keys held and the tools. Everything that changes it is a dispatched action (actions.ts); React reads it
// through selectors (react.ts) and PlanCanvas only renders what it says. `createEditor(doc, { readOnly })`
// works headless: the tests drive its pointer and keys without rendering anything.
import { createStore, type StoreApi } from 'zustand';
import type { SetupDocument } from '../../model/document';
import { run, type ActionName, type ArgList } from './actions';
import { bindingFor, type KeyInput } from './keymap';
import { initialState, type EditorState, type InitialOptions } from './state';
import { createSelectTool, tapAt, type SelectState } from './tools/select';
import type { PointerInput, Tool } from './tools/types';
import { createWallTool, type WallState } from './tools/wall';
import { createHandleTool, type HandleState } from './tools/handles';
import { createOpenRequests, type OpenRequests } from './open';

/** What tools see: the state and dispatch. */
export type EditorCore = {
  getState: () => EditorState;
  dispatch: <N extends ActionName>(name: N, ...arg: ArgList<N>) => void;
};

export type Editor = StoreApi<EditorState> &
  EditorCore & {
    /** Replace the document from outside (a reload, "load theirs"): clears history, keeps the camera. */
    load: (doc: SetupDocument, opts?: InitialOptions) => void;
    tools: { select: Tool<SelectState>; wall: Tool<WallState>; handles: Tool<HandleState> };
    /** The tool the pointer drives now (Space or a pan in progress may still pan). */
    activeTool: () => Tool;
    pointer: {
      down: (e: PointerInput) => void;
      move: (e: PointerInput) => void;
      up: (e: PointerInput) => void;
      cancel: () => void;
      /** A press without movement: select the topmost item under it (and ask to open it), or clear. */
      tap: (e: PointerInput) => void;
      /** A long press: add the item under it to the selection (multi-select on touch). */
      hold: (e: PointerInput) => void;
    };
    /** Requests to open one item's settings: a tap on it or a choice by name, never a drag, undo or box. */
    opens: OpenRequests;
    keys: {
      /** A key went down; true when it was an editor shortcut (the caller then prevents the default). */
      down: (e: KeyInput) => boolean;
      up: (e: KeyInput) => void;
    };
  };

export function createEditor(doc: SetupDocument, opts: InitialOptions = {}): Editor {
  const store = createStore<EditorState>(() => initialState(doc, opts));
  const dispatch = ((name: ActionName, ...arg: unknown[]) => {
    const s = store.getState();
    const next = (run as (s: EditorState, n: ActionName, ...a: unknown[]) => EditorState)(s, name, ...arg);
    if (next !== s) store.setState(next, true);
  }) as EditorCore['dispatch'];
  const core: EditorCore = { getState: store.getState, dispatch };
  const handles = createHandleTool();
  const tools = { select: createSelectTool(), wall: createWallTool(), handles };
  // The tool that took the press keeps the gesture to its release, even if the tool changes meanwhile.
  let pressed: Tool | null = null;
  const activeTool = (): Tool => (pressed === handles ? handles : tools[store.getState().tool]);
  const opens = createOpenRequests();

  return Object.assign(store, {
    dispatch,
    load: (d: SetupDocument, o: InitialOptions = {}) => {
      const s = store.getState();
      const fresh = initialState(d, { readOnly: o.readOnly ?? s.readOnly, title: o.title ?? s.meta.title, notes: o.notes ?? s.meta.notes });
      store.setState({ ...fresh, camera: s.camera, viewport: s.viewport, input: s.input, visibleIds: s.visibleIds, revision: s.revision + 1 }, true);
    },
    tools,
    activeTool,
    pointer: {
      down: (e: PointerInput) => {
        // A selected light's aim and height handles come before the tool (they sit over the plan beside it).
        const s = store.getState();
        pressed = s.tool === 'select' && !s.input.space && handles.claims(core, e.screen, e.pointer) ? handles : tools[s.tool];
        pressed.down(core, e);
      },
      move: (e: PointerInput) => pressed?.move(core, e),
      up: (e: PointerInput) => {
        pressed?.up(core, e);
        pressed = null;
      },
      cancel: () => {
        pressed?.cancel(core);
        pressed = null;
      },
      tap: (e: PointerInput) => {
        const hit = tapAt(core, e);
        const sel = store.getState().selection;
        if (hit && sel.length === 1 && sel[0] === hit) opens.request(hit);
      },
      hold: (e: PointerInput) => tapAt(core, e, true),
    },
    opens,
    keys: {
      down: (e: KeyInput) => {
        if (e.key === ' ') {
          dispatch('setInput', { space: true, shift: e.shiftKey });
          return true;
        }
        dispatch('setInput', { shift: e.shiftKey });
        const b = bindingFor(e);
        if (!b) return false;
        (dispatch as (n: ActionName, a?: unknown) => void)(b.action, b.arg);
        return true;
      },
      up: (e: KeyInput) => dispatch('setInput', e.key === ' ' ? { space: false, shift: e.shiftKey } : { shift: e.shiftKey }),
    },
  });
}
