// Editor state and history. The document is immutable; every change makes a new one, and undo/redo
// keep whole documents (they share unchanged items, so this costs little).
import type { Item, SetupDocument } from '../../model/document';

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
};

export const HISTORY_LIMIT = 200;

export function initialState(doc: SetupDocument, opts: { readOnly?: boolean } = {}): EditorState {
  return { doc, selection: [], past: [], future: [], gestureKey: null, snap: true, readOnly: opts.readOnly ?? false, revision: 0, tool: 'select' };
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

export function selectedItems(s: EditorState): Item[] {
  const ids = new Set(s.selection);
  return s.doc.items.filter((i) => ids.has(i.id));
}

/** A new item id not used in the document: kind plus a short counter ("light-3"). */
export function nextId(doc: SetupDocument, kind: string): string {
  const used = new Set(doc.items.map((i) => i.id));
  for (let n = 1; ; n++) {
    const id = `${kind}-${n}`;
    if (!used.has(id)) return id;
  }
}
