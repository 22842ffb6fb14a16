// Every editor command is an action: a name, a label, its shortcuts, when it applies, and a pure perform
// that returns the next state. The toolbar, the keyboard (keymap.ts reads the shortcuts from here), the
// tools and the tests all go through these. Camera, input and view actions change what is seen, never the
// document, and never enter history.
import type { Item, ItemKind, SetupDocument, Shot, Step } from '../../model/document';
import type { Point } from '../../model/geometry';
import { anchorOf, angleTo, createItem, isSegment, moveItem, withAngle, itemsInBox } from '../../model/kinds';
import { itemSchema } from '../../model/document';
import { clampScale, fitStage, panBy, zoomAt, type Camera } from './camera';
import { commit, holdOrCommit, mapItems, nextId, redo, settleDrag, undo, type EditorState, type InputState } from './state';
import { gridStepM, nudgeStepM, snapPoint, tidy } from './snap';
import { cameraSpot, freeSpot, initialAim, viewCentre } from './placement';
import { insetCamera } from './inset';
import { setHeight, setTilt } from './heights';

type Perform<A> = (s: EditorState, arg: A) => EditorState;
type Shortcut<A> = A extends void ? string : { keys: string; arg: A };
export type Action<A = void> = {
  id: string;
  label: string;
  /** Keys that run it: "Mod+Z", "Shift+ArrowUp", "Delete" (Mod is Ctrl, or Cmd on a Mac), each with the
   *  argument it runs with when the action takes one. The one key map (keymap.ts) is built from these. */
  shortcut?: Shortcut<A>[];
  enabled: (s: EditorState) => boolean;
  perform: Perform<A>;
};

const writable = (s: EditorState) => !s.readOnly;
const hasSelection = (s: EditorState) => !s.readOnly && s.selection.length > 0;
/** The snapping grid for the view as it is zoomed (0.1 m with no view yet): see snap.ts. */
const gridOf = (s: EditorState) => gridStepM(s.camera?.scale, s.input.units);
const unlockedSelection = (s: EditorState) =>
  new Set(s.doc.items.filter((i) => s.selection.includes(i.id) && !i.locked).map((i) => i.id));

const tidyItem = (i: Item): Item =>
  isSegment(i)
    ? { ...i, a: { x: tidy(i.a.x), y: tidy(i.a.y) }, b: { x: tidy(i.b.x), y: tidy(i.b.y) } }
    : ({ ...i, x: tidy((i as { x: number }).x), y: tidy((i as { y: number }).y) } as Item);

function define<A = void>(a: Action<A>): Action<A> {
  return a;
}

export const actions = {
  addItem: define<{ kind: ItemKind; at: Point }>({
    id: 'add-item',
    label: 'Add to plan',
    enabled: writable,
    perform: (s, { kind, at }) => {
      const item = createItem(kind, nextId(s.doc, kind), { x: tidy(at.x), y: tidy(at.y) });
      const next = commit(s, { ...s.doc, items: [...s.doc.items, item] });
      return { ...next, selection: [item.id] };
    },
  }),

  /** Add an item from the kit: in a free spot near the middle of the view, a camera or light aimed at the
   *  subject; a camera in front of the subject at its face height when there is room (placement.ts). */
  placeItem: define<{ kind: ItemKind }>({
    id: 'place-item',
    label: 'Add to plan',
    enabled: writable,
    perform: (s, { kind }) => {
      const inFront = kind === 'camera' ? cameraSpot(s.doc.items, s.doc.stage) : null;
      const at = inFront?.at ?? freeSpot(s.doc.items, s.doc.stage, viewCentre(s.camera, s.viewport, s.doc.stage));
      let item = createItem(kind, nextId(s.doc, kind), at);
      if (inFront && item.kind === 'camera') item = { ...item, heightM: inFront.heightM };
      const aim = initialAim(kind, at, s.doc.items);
      if (aim !== null) item = withAngle(item, aim);
      const next = commit(s, { ...s.doc, items: [...s.doc.items, item] });
      return { ...next, selection: [item.id] };
    },
  }),

  /** A light's or camera's height (the plan's height handle, the side view), kept under the ceiling. */
  setHeight: define<{ id: string; heightM: number; gestureKey?: string; live?: boolean }>({
    id: 'set-height',
    label: 'Raise or lower',
    enabled: writable,
    perform: (s, { id, heightM, gestureKey, live }) => {
      const doc = mapItems(s.doc, new Set([id]), (i) => setHeight(i, heightM, s.doc, s.snap));
      return gestureKey && live ? holdOrCommit(s, doc, gestureKey, true) : commit(s, doc, gestureKey ?? null);
    },
  }),

  /** A light's or camera's tilt, degrees (down is negative): the side view's tilt handle. */
  setTilt: define<{ id: string; tiltDeg: number; gestureKey?: string }>({
    id: 'set-tilt',
    label: 'Tilt',
    enabled: writable,
    perform: (s, { id, tiltDeg, gestureKey }) => commit(s, mapItems(s.doc, new Set([id]), (i) => setTilt(i, tiltDeg, s.snap)), gestureKey ?? null),
  }),

  /** Start drawing a wall at a point; dragEnd on its end 'b' with the same gesture key draws it out. */
  startWall: define<{ at: Point; gestureKey: string }>({
    id: 'start-wall',
    label: 'Draw a wall',
    enabled: writable,
    perform: (s, { at, gestureKey }) => {
      const p = s.snap ? snapPoint(at, s.doc.items, new Set(), gridOf(s)) : at;
      const end = { x: tidy(p.x), y: tidy(p.y) };
      const wall = createItem('wall', nextId(s.doc, 'wall'), end);
      const next = commit(s, { ...s.doc, items: [...s.doc.items, { ...wall, a: end, b: end }] }, gestureKey);
      return { ...next, selection: [wall.id] };
    },
  }),

  setTool: define<{ tool: EditorState['tool'] }>({
    id: 'set-tool',
    label: 'Choose a tool',
    enabled: () => true,
    perform: (s, { tool }) => ({ ...s, tool: s.readOnly ? 'select' : tool }),
  }),

  /** Move the given items to where they were at the gesture's start plus (dx, dy), snapping the first.
   *  `live`: a pointer gesture under way — the move is held beside the document until the gesture ends
   *  (the same for dragEnd and aimAt). */
  dragItems: define<{ origin: Item[]; dx: number; dy: number; gestureKey: string; live?: boolean }>({
    id: 'drag-items',
    label: 'Move',
    enabled: hasSelection,
    perform: (s, { origin, dx, dy, gestureKey, live }) => {
      const movable = origin.filter((i) => !i.locked);
      const first = movable[0];
      if (!first) return s;
      const ids = new Set(movable.map((i) => i.id));
      const a = anchorOf(first);
      const target = { x: a.x + dx, y: a.y + dy };
      const snapped = s.snap ? snapPoint(target, s.doc.items, ids, gridOf(s)) : target;
      const ddx = snapped.x - a.x;
      const ddy = snapped.y - a.y;
      const byId = new Map(movable.map((i) => [i.id, i]));
      return holdOrCommit(s, mapItems(s.doc, ids, (i) => tidyItem(moveItem(byId.get(i.id)!, ddx, ddy))), gestureKey, live);
    },
  }),

  /** Move one end of a wall, tape or arrow. */
  dragEnd: define<{ id: string; end: 'a' | 'b'; to: Point; gestureKey: string; live?: boolean }>({
    id: 'drag-end',
    label: 'Move end',
    enabled: writable,
    perform: (s, { id, end, to, gestureKey, live }) => {
      const p = s.snap ? snapPoint(to, s.doc.items, new Set([id]), gridOf(s)) : to;
      return holdOrCommit(
        s,
        mapItems(s.doc, new Set([id]), (i) => (isSegment(i) && !i.locked ? { ...i, [end]: { x: tidy(p.x), y: tidy(p.y) } } : i)),
        gestureKey,
        live,
      );
    },
  }),

  /** Turn an item to point at a plan point (the rotate handle); snaps to 5° steps while snapping is on. */
  aimAt: define<{ id: string; at: Point; gestureKey: string; live?: boolean }>({
    id: 'aim-at',
    label: 'Rotate',
    enabled: writable,
    perform: (s, { id, at, gestureKey, live }) =>
      holdOrCommit(
        s,
        mapItems(s.doc, new Set([id]), (i) => {
          if (i.locked) return i;
          const deg = angleTo(anchorOf(i), at);
          return withAngle(i, s.snap ? Math.round(deg / 5) * 5 : deg);
        }),
        gestureKey,
        live,
      ),
  }),

  /** Change fields of one item from the inspector; the result must pass the shared schema. A function patch
   *  is given the item as it is now (so a nested field merges into the current value, never a stale one). */
  updateItem: define<{ id: string; patch: Record<string, unknown> | ((item: Item) => Record<string, unknown>); gestureKey?: string }>({
    id: 'update-item',
    label: 'Change',
    enabled: writable,
    perform: (s, { id, patch, gestureKey }) =>
      commit(
        s,
        mapItems(s.doc, new Set([id]), (i) => {
          const r = itemSchema.safeParse({ ...i, ...(typeof patch === 'function' ? patch(i) : patch), id: i.id, kind: i.kind });
          return r.success ? r.data : i;
        }),
        gestureKey ?? null,
      ),
  }),

  /** Change plan-wide fields (ambient EV, target aperture, stage). */
  updateDocument: define<{ patch: Partial<Pick<SetupDocument, 'ambientEv100' | 'targetAperture' | 'stage' | 'meter'>>; gestureKey?: string }>({
    id: 'update-document',
    label: 'Change plan',
    enabled: writable,
    perform: (s, { patch, gestureKey }) => commit(s, { ...s.doc, ...patch }, gestureKey ?? null),
  }),

  /** Move the selection by `dx`, `dy` metres; with `step`, by that many nudge steps in the plan's units
   *  (`nudgeStepM`: 10 cm or 3 in, with Shift 1 m or 1 ft), as the arrow keys do. */
  nudge: define<{ dx: number; dy: number; step?: 'small' | 'large' }>({
    id: 'nudge',
    label: 'Nudge',
    shortcut: [
      { keys: 'ArrowUp', arg: { dx: 0, dy: -1, step: 'small' } },
      { keys: 'ArrowDown', arg: { dx: 0, dy: 1, step: 'small' } },
      { keys: 'ArrowLeft', arg: { dx: -1, dy: 0, step: 'small' } },
      { keys: 'ArrowRight', arg: { dx: 1, dy: 0, step: 'small' } },
      { keys: 'Shift+ArrowUp', arg: { dx: 0, dy: -1, step: 'large' } },
      { keys: 'Shift+ArrowDown', arg: { dx: 0, dy: 1, step: 'large' } },
      { keys: 'Shift+ArrowLeft', arg: { dx: -1, dy: 0, step: 'large' } },
      { keys: 'Shift+ArrowRight', arg: { dx: 1, dy: 0, step: 'large' } },
    ],
    enabled: hasSelection,
    perform: (s, { dx, dy, step }) => {
      const k = step ? nudgeStepM(s.input.units, step) : 1;
      return commit(s, mapItems(s.doc, unlockedSelection(s), (i) => tidyItem(moveItem(i, dx * k, dy * k))));
    },
  }),

  deleteSelection: define({
    id: 'delete',
    label: 'Delete',
    shortcut: ['Delete', 'Backspace'],
    enabled: hasSelection,
    perform: (s) => {
      const gone = unlockedSelection(s);
      if (!gone.size) return s;
      const items = s.doc.items.filter((i) => !gone.has(i.id));
      const steps = s.doc.steps.map((st) => ({ ...st, itemIds: st.itemIds.filter((id) => !gone.has(id)) }));
      return commit(s, { ...s.doc, items, steps });
    },
  }),

  duplicateSelection: define({
    id: 'duplicate',
    label: 'Duplicate',
    shortcut: ['Mod+D'],
    enabled: hasSelection,
    perform: (s) => {
      let doc = s.doc;
      const copies: Item[] = [];
      for (const i of s.doc.items.filter((it) => s.selection.includes(it.id))) {
        const copy = tidyItem(moveItem({ ...i, id: nextId(doc, i.kind), locked: false }, 0.5, 0.5));
        copies.push(copy);
        doc = { ...doc, items: [...doc.items, copy] };
      }
      return { ...commit(s, doc), selection: copies.map((c) => c.id) };
    },
  }),

  toggleLock: define({
    id: 'lock',
    label: 'Lock or unlock',
    shortcut: ['Mod+L'],
    enabled: hasSelection,
    perform: (s) => {
      const sel = new Set(s.selection);
      const lock = s.doc.items.some((i) => sel.has(i.id) && !i.locked);
      return commit(s, mapItems(s.doc, sel, (i) => (i.locked === lock ? i : { ...i, locked: lock })));
    },
  }),

  undo: define({ id: 'undo', label: 'Undo', shortcut: ['Mod+Z'], enabled: (s) => !s.readOnly && s.past.length > 0, perform: (s) => undo(s) }),
  redo: define({ id: 'redo', label: 'Redo', shortcut: ['Mod+Shift+Z', 'Mod+Y'], enabled: (s) => !s.readOnly && s.future.length > 0, perform: (s) => redo(s) }),

  select: define<{ ids: string[]; additive?: boolean }>({
    id: 'select',
    label: 'Select',
    enabled: () => true,
    perform: (s, { ids, additive }) => {
      if (!additive) return { ...s, selection: ids };
      const set = new Set(s.selection);
      for (const id of ids) {
        if (set.has(id)) set.delete(id);
        else set.add(id);
      }
      return { ...s, selection: [...set] };
    },
  }),

  selectInBox: define<{ from: Point; to: Point; additive?: boolean }>({
    id: 'select-box',
    label: 'Select in box',
    enabled: () => true,
    perform: (s, { from, to, additive }) => {
      const ids = itemsInBox(s.doc.items, from, to).map((i) => i.id);
      return { ...s, selection: additive ? [...new Set([...s.selection, ...ids])] : ids };
    },
  }),

  selectAll: define({ id: 'select-all', label: 'Select all', shortcut: ['Mod+A'], enabled: () => true, perform: (s) => ({ ...s, selection: s.doc.items.map((i) => i.id) }) }),
  clearSelection: define({ id: 'clear-selection', label: 'Clear selection', shortcut: ['Escape'], enabled: () => true, perform: (s) => ({ ...s, selection: [] }) }),
  toggleSnap: define({ id: 'snap', label: 'Snap to grid and walls', enabled: () => true, perform: (s) => ({ ...s, snap: !s.snap }) }),

  // Steps and shot list.
  setSteps: define<{ steps: Step[]; gestureKey?: string }>({
    id: 'set-steps',
    label: 'Change steps',
    enabled: writable,
    perform: (s, { steps, gestureKey }) => commit(s, { ...s.doc, steps }, gestureKey ?? null),
  }),
  setShots: define<{ shots: Shot[]; gestureKey?: string }>({
    id: 'set-shots',
    label: 'Change shot list',
    enabled: writable,
    perform: (s, { shots, gestureKey }) => commit(s, { ...s.doc, shots }, gestureKey ?? null),
  }),

  /** Title and notes: saved with the setup, not part of the plan's undo history. */
  setMeta: define<Partial<EditorState['meta']>>({
    id: 'set-meta',
    label: 'Rename or change notes',
    enabled: writable,
    perform: (s, patch) => ({ ...s, meta: { ...s.meta, ...patch } }),
  }),

  // The camera: none of these enter history.
  /** The plan's box changed size; the first size fits the stage into it. */
  setViewport: define<{ w: number; h: number; insetBottom?: number }>({
    id: 'set-viewport',
    label: 'Resize the plan',
    enabled: () => true,
    perform: (s, { w, h, insetBottom = s.viewport.insetBottom }) => {
      if (s.viewport.w === w && s.viewport.h === h && s.viewport.insetBottom === insetBottom) return s;
      const viewport = { w, h, insetBottom };
      const camera = s.camera ? insetCamera(s, viewport) : w > 0 && h > insetBottom ? fitStage(s.doc.stage, w, h - insetBottom) : null;
      return { ...s, viewport, camera };
    },
  }),
  fit: define({
    id: 'fit',
    label: 'Fit the stage',
    shortcut: ['0'],
    enabled: (s) => s.viewport.w > 0,
    perform: (s) => ({ ...s, camera: fitStage(s.doc.stage, s.viewport.w, s.viewport.h - s.viewport.insetBottom) }),
  }),
  /** Zoom by a factor about a screen point (default: the middle of the plan's box). */
  zoom: define<{ factor: number; at?: { x: number; y: number } }>({
    id: 'zoom',
    label: 'Zoom',
    shortcut: [
      { keys: '=', arg: { factor: 1.25 } },
      { keys: '+', arg: { factor: 1.25 } },
      { keys: '-', arg: { factor: 0.8 } },
    ],
    enabled: (s) => !!s.camera,
    perform: (s, { factor, at }) => (s.camera ? { ...s, camera: zoomAt(s.camera, factor, at?.x ?? s.viewport.w / 2, at?.y ?? s.viewport.h / 2) } : s),
  }),
  pan: define<{ dx: number; dy: number }>({
    id: 'pan',
    label: 'Pan',
    enabled: (s) => !!s.camera,
    perform: (s, { dx, dy }) => (s.camera ? { ...s, camera: panBy(s.camera, dx, dy) } : s),
  }),
  setCamera: define<{ camera: Camera }>({
    id: 'set-camera',
    label: 'Move the view',
    enabled: () => true,
    perform: (s, { camera }) => ({ ...s, camera: { ...camera, scale: clampScale(camera.scale) } }),
  }),

  // Input and view state.
  setInput: define<Partial<InputState>>({
    id: 'set-input',
    label: 'Keys held',
    enabled: () => true,
    perform: (s, patch) => (Object.entries(patch).every(([k, v]) => s.input[k as keyof InputState] === v) ? s : { ...s, input: { ...s.input, ...patch } }),
  }),
  /** Show only some items (a step of the build); presses reach only those. */
  setVisible: define<{ ids: ReadonlySet<string> | null }>({
    id: 'set-visible',
    label: 'Show a step',
    enabled: () => true,
    perform: (s, { ids }) => ({ ...s, visibleIds: ids, selection: ids ? s.selection.filter((id) => ids.has(id)) : s.selection }),
  }),
  /** A pointer gesture starts or ends (autosave saves as soon as one ends); `box` is the selection box.
   *  When it ends, what the gesture moved goes into the document as one undo step; `discard` drops it. */
  setGesture: define<{ gesture: string | null; box?: EditorState['box']; discard?: boolean }>({
    id: 'set-gesture',
    label: 'Gesture',
    enabled: () => true,
    perform: (s, { gesture, box = null, discard = false }) => {
      const held = gesture === null && s.drag ? (discard ? { ...s, drag: null } : settleDrag(s)) : s;
      return held.gesture === gesture && held.box === box ? held : { ...held, gesture, box };
    },
  }),
};

/** Actions that change only what is seen (selection, camera, input): never the document, never history. */
export const viewActions: readonly ActionName[] = ['undo', 'redo', 'select', 'selectInBox', 'selectAll', 'clearSelection', 'toggleSnap', 'setTool', 'setMeta', 'setViewport', 'fit', 'zoom', 'pan', 'setCamera', 'setInput', 'setVisible', 'setGesture'];

type Actions = typeof actions;
export type ActionName = keyof Actions;
type ActionArg<N extends ActionName> = Actions[N] extends Action<infer A> ? A : never;

/** Run an action if it applies; otherwise the state is returned unchanged. */
export type ArgList<N extends ActionName> = ActionArg<N> extends void ? [] : [ActionArg<N>];

export function run<N extends ActionName>(s: EditorState, name: N, ...arg: ArgList<N>): EditorState {
  const a = actions[name] as unknown as Action<ActionArg<N>>;
  return a.enabled(s) ? a.perform(s, arg[0] as ActionArg<N>) : s;
}
