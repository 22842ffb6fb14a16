// The drag layer: while a pointer gesture moves items, the moved items' glyphs, beams, selection marks and
// handles follow the hand without React. The editor holds the gesture's moves beside the document (the drag
// slice, state.ts); this layer watches that slice and hands each view registered for a moved item what to
// show: a shift of what it already draws (an item that only changed where it stands), or the live item to
// draw afresh. React renders those views from the document only, so a drag re-renders nothing until the
// gesture ends and its moves are committed (one history step, one save); then every view is reset, in the same
// task, before the committed document is painted. Moves reach the editor at most once an animation frame
// (PlanCanvas coalesces them), and this layer writes as they arrive, so the views change at most once a frame
// and in the frame the move arrived. Pure TypeScript: views are callbacks (canvas/dragViews.ts writes the
// web's SVG nodes; elsewhere a view falls back to re-rendering its one component).
import type { Item } from '../model/document';
import { isSegment } from '../model/kinds';
import type { EditorState } from './editor/state';
import { itemById } from './editor/state';

/** A shift in plan metres. */
export type Offset = { dx: number; dy: number };

/** One item's view: `live` is the item as the hand holds it (null: the gesture ended or left it; show the
 *  document again); `offset` is set when the live item differs from the drawn one only by a shift. */
type ItemDragView = (live: Item | null, offset: Offset | null) => void;

/** A view of several moved items at once (the selection marks, the handles): `moved` is the gesture's live
 *  items (null: show the document again); `offset` is set when every one of them moved by the same shift. */
type GroupDragView = (moved: ReadonlyMap<string, Item> | null, offset: Offset | null) => void;

type Watched = { getState: () => EditorState; subscribe: (f: (s: EditorState, prev: EditorState) => void) => () => void };

const EPS = 1e-9;
const keysOf = (i: Item) => Object.keys(i);

/** The shift that takes `settled` to `live` when that is all that changed (a moved point item, a moved wall),
 *  else null (turned, resized, one end moved: it must be drawn afresh). */
export function offsetOf(settled: Item, live: Item): Offset | null {
  if (settled === live) return { dx: 0, dy: 0 };
  const ka = keysOf(settled);
  if (ka.length !== keysOf(live).length) return null;
  const s = settled as Record<string, unknown>;
  const l = live as Record<string, unknown>;
  if (isSegment(settled) && isSegment(live)) {
    for (const k of ka) if (k !== 'a' && k !== 'b' && s[k] !== l[k]) return null;
    const dx = live.a.x - settled.a.x;
    const dy = live.a.y - settled.a.y;
    return Math.abs(live.b.x - settled.b.x - dx) < EPS && Math.abs(live.b.y - settled.b.y - dy) < EPS ? { dx, dy } : null;
  }
  if (isSegment(settled) || isSegment(live)) return null;
  for (const k of ka) if (k !== 'x' && k !== 'y' && s[k] !== l[k]) return null;
  return { dx: (l.x as number) - (s.x as number), dy: (l.y as number) - (s.y as number) };
}

export type DragLayer = {
  /** Register a view for one item; returns its removal. A view registered mid-gesture is brought up to date. */
  item: (id: string, view: ItemDragView) => () => void;
  group: (view: GroupDragView) => () => void;
  dispose: () => void;
};

export function createDragLayer(editor: Watched): DragLayer {
  const views = new Map<string, Set<ItemDragView>>();
  const groups = new Set<GroupDragView>();
  // What each moved item shows now (so a late view can catch up and the end resets exactly those).
  let shown = new Map<string, { live: Item; offset: Offset | null }>();
  let group: { moved: ReadonlyMap<string, Item>; offset: Offset | null } | null = null;

  const apply = (s: EditorState) => {
    const moved = s.drag?.items;
    const next = new Map<string, { live: Item; offset: Offset | null }>();
    let common: Offset | null | undefined;
    if (moved) {
      for (const [id, live] of moved) {
        const settled = itemById(s, id);
        const offset = settled ? offsetOf(settled, live) : null;
        next.set(id, { live, offset });
        views.get(id)?.forEach((v) => v(live, offset));
        common = common === undefined ? offset : common && offset && Math.abs(common.dx - offset.dx) < EPS && Math.abs(common.dy - offset.dy) < EPS ? common : null;
      }
    }
    for (const id of shown.keys()) if (!next.has(id)) views.get(id)?.forEach((v) => v(null, null));
    shown = next;
    if (moved && moved.size) {
      group = { moved, offset: common ?? null };
      groups.forEach((g) => g(moved, common ?? null));
    } else if (group) {
      group = null;
      groups.forEach((g) => g(null, null));
    }
  };

  const unsubscribe = editor.subscribe((s, prev) => {
    if (s.drag !== prev.drag || (s.drag && s.doc !== prev.doc)) apply(s);
  });

  return {
    item(id, view) {
      let set = views.get(id);
      if (!set) views.set(id, (set = new Set()));
      set.add(view);
      const now = shown.get(id);
      if (now) view(now.live, now.offset);
      return () => {
        set.delete(view);
        if (!set.size) views.delete(id);
      };
    },
    group(view) {
      groups.add(view);
      if (group) view(group.moved, group.offset);
      return () => groups.delete(view);
    },
    dispose: unsubscribe,
  };
}
