// The editor's state and history. The document is immutable; every change makes a new one, and undo/redo
// keep whole documents (they share unchanged items, so this costs little). Beside the document the editor
// holds what the screen needs to agree on: the camera, the keys held, the gesture under way, the items shown.
import type { Item, SetupDocument } from '../../model/document';
import type { Point } from '../../model/geometry';
import type { Camera } from './camera';
import type { Units } from '../../model/units';

/** What a pointer is: a finger is fatter than a mouse (hit tolerance), and a mouse on a wide screen draws
 *  selection boxes where a finger pans. */
export type PointerKind = 'mouse' | 'touch';

export type InputState = {
  /** Space held: every drag pans. */
  space: boolean;
  /** Shift held: presses add to the selection. */
  shift: boolean;
  /** Empty-space mouse drags draw a selection box (a wide screen) rather than pan. */
  boxSelect: boolean;
  /** The units the plan is shown in: a drag snaps to a grid of metres, or of feet and inches. */
  units: Units;
};

export type EditorState = {
  doc: SetupDocument;
  /** Selected item ids, in the order they were selected (the first one is the primary). */
  selection: string[];
  past: SetupDocument[];
  future: SetupDocument[];
  /** Changes with the same gesture key (one drag, one slider move) coalesce into one undo step. */
  gestureKey: string | null;
  /** Snap to the 0.1 m grid and to walls while moving. */
  snap: boolean;
  /** Crew and share-link viewers see the plan but cannot change it. */
  readOnly: boolean;
  /** Increments on every document change (autosave and the meter watch it). */
  revision: number;
  /** What a press on empty plan does: select (and move), or draw a wall from press to release. */
  tool: 'select' | 'wall';
  /** Title and notes of the setup (saved with the document, never in the undo history). */
  meta: { title: string; notes: string };
  /** The view onto the plan; null until the plan's box has a size. Camera changes never enter history. */
  camera: Camera | null;
  /** The plan's box on screen, pixels; `insetBottom` is covered by something else (the phone's sheet). */
  viewport: { w: number; h: number; insetBottom: number };
  input: InputState;
  /** The gesture under way (a drag, a rotate), or null when no pointer is down on the plan. */
  gesture: string | null;
  /** The selection box being drawn, plan metres. */
  box: { from: Point; to: Point } | null;
  /** Only these items are on screen and reachable (the plan as it stands at one step); null: all. */
  visibleIds: ReadonlySet<string> | null;
  /** What a pointer gesture under way has moved so far, held beside the document (not in it): the moved
   *  items by id. The glyphs, beams and handles of those items follow it; the document, history, autosave and
   *  the panels that read the document do not change until the gesture ends, when it is committed as one
   *  step (see the setGesture action). */
  drag: Drag | null;
};

type Drag = { key: string; items: ReadonlyMap<string, Item> };

const HISTORY_LIMIT = 200;

export type InitialOptions = { readOnly?: boolean; title?: string; notes?: string };

export function initialState(doc: SetupDocument, opts: InitialOptions = {}): EditorState {
  return {
    doc,
    selection: [],
    past: [],
    future: [],
    gestureKey: null,
    snap: true,
    readOnly: opts.readOnly ?? false,
    revision: 0,
    tool: 'select',
    meta: { title: opts.title ?? '', notes: opts.notes ?? '' },
    camera: null,
    viewport: { w: 0, h: 0, insetBottom: 0 },
    input: { space: false, shift: false, boxSelect: false, units: 'metric' },
    gesture: null,
    box: null,
    visibleIds: null,
    drag: null,
  };
}

/** The items on screen (all, or those of the step shown). */
export function shownItems(s: EditorState): readonly Item[] {
  const v = s.visibleIds;
  return v ? s.doc.items.filter((i) => v.has(i.id)) : s.doc.items;
}

const indexes = new WeakMap<readonly Item[], Map<string, Item>>();
/** An item by id, from an index kept per items array (a drag frame looks up one item, not forty). */
export function itemById(s: EditorState, id: string): Item | undefined {
  let m = indexes.get(s.doc.items);
  if (!m) {
    m = new Map(s.doc.items.map((i) => [i.id, i]));
    indexes.set(s.doc.items, m);
  }
  return m.get(id);
}

/** An item as it stands on screen: moved by the gesture under way, or as in the document. */
export function liveItem(s: EditorState, id: string): Item | undefined {
  return s.drag?.items.get(id) ?? itemById(s, id);
}

const liveDocs = new WeakMap<Drag, { base: SetupDocument; doc: SetupDocument }>();
/** The document as it stands on screen: with the gesture's moves applied (what the meter follows). */
export function liveDoc(s: EditorState): SetupDocument {
  const d = s.drag;
  if (!d || d.items.size === 0) return s.doc;
  const hit = liveDocs.get(d);
  if (hit && hit.base === s.doc) return hit.doc;
  const doc = mapItems(s.doc, new Set(d.items.keys()), (i) => d.items.get(i.id) ?? i);
  liveDocs.set(d, { base: s.doc, doc });
  return doc;
}

/** A change made by a pointer gesture under way: held in the drag slice (the items that differ from the
 *  document), or committed at once when `live` is false (a change made in one go, or a test). */
export function holdOrCommit(s: EditorState, doc: SetupDocument, gestureKey: string, live: boolean | undefined): EditorState {
  if (!live) return commit(s, doc, gestureKey);
  if (s.readOnly) return s;
  const items = new Map<string, Item>();
  if (doc !== s.doc) {
    const before = s.doc.items;
    doc.items.forEach((i, k) => {
      if (before[k] !== i) items.set(i.id, i);
    });
  }
  return { ...s, drag: { key: gestureKey, items } };
}

/** End the gesture's hold: its moves go into the document as one undo step (joining the step its key
 *  began, e.g. a wall's start). */
export function settleDrag(s: EditorState): EditorState {
  if (!s.drag) return s;
  const doc = liveDoc(s);
  return { ...commit(s, doc, s.drag.key), drag: null };
}

/** Apply a new document, recording history (one step per gesture key). */
export function commit(s: EditorState, doc: SetupDocument, gestureKey: string | null = null): EditorState {
  if (doc === s.doc || s.readOnly) return s;
  const coalesce = gestureKey !== null && gestureKey === s.gestureKey;
  const past = coalesce ? s.past : [...s.past, s.doc].slice(-HISTORY_LIMIT);
  const ids = new Set(doc.items.map((i) => i.id));
  return { ...s, doc, past, future: [], gestureKey, selection: s.selection.filter((id) => ids.has(id)), revision: s.revision + 1 };
}

export function undo(s: EditorState): EditorState {
  const prev = s.past[s.past.length - 1];
  if (!prev || s.readOnly) return s;
  return { ...s, doc: prev, past: s.past.slice(0, -1), future: [s.doc, ...s.future], gestureKey: null, revision: s.revision + 1, selection: keep(s.selection, prev) };
}

export function redo(s: EditorState): EditorState {
  const next = s.future[0];
  if (!next || s.readOnly) return s;
  return { ...s, doc: next, past: [...s.past, s.doc], future: s.future.slice(1), gestureKey: null, revision: s.revision + 1, selection: keep(s.selection, next) };
}

function keep(selection: string[], doc: SetupDocument) {
  const ids = new Set(doc.items.map((i) => i.id));
  return selection.filter((id) => ids.has(id));
}

/** A copy of the document with the items for which `change` returns a new item replaced. */
export function mapItems(doc: SetupDocument, ids: ReadonlySet<string>, change: (i: Item) => Item): SetupDocument {
  let changed = false;
  const items = doc.items.map((i) => {
    if (!ids.has(i.id)) return i;
    const n = change(i);
    if (n !== i) changed = true;
    return n;
  });
  return changed ? { ...doc, items } : doc;
}

/** A new item id not used in the document: kind plus a short counter ("light-3"). */
export function nextId(doc: SetupDocument, kind: string): string {
  const used = new Set(doc.items.map((i) => i.id));
  for (let n = 1; ; n++) {
    const id = `${kind}-${n}`;
    if (!used.has(id)) return id;
  }
}
