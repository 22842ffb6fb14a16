// React's view of the editor: a context holding the one editor object and selector hooks, so a change
// re-renders only what reads it. During a gesture, panels that do not follow the hand read `useSettled`,
// which holds its value until the gesture ends (a drag re-renders the dragged item, not the inspector).
import { createContext, useCallback, useContext, useRef, useSyncExternalStore } from 'react';
import { useStore, type StoreApi } from 'zustand';
import type { Editor } from './editor';
import type { EditorState } from './state';

export const EditorContext = createContext<Editor | null>(null);

export function useEditorApi(): Editor {
  const e = useContext(EditorContext);
  if (!e) throw new Error('useEditorApi outside an EditorContext');
  return e;
}

export function useEditor<T>(selector: (s: EditorState) => T): T {
  return useStore(useEditorApi(), selector);
}

/** Runs `f` once the frame being prepared now has been painted: in a task after the next animation frame
 *  (a timer where there are no animation frames). Calls asked for before then run together, in one task, so
 *  React commits what they change together. Panels beside the plan catch up on a gesture's end this way: the
 *  frame that shows where the hand let go draws the plan alone, and the panels follow in the next. */
export function afterPaint(f: () => void): () => void {
  afterPaintQueue.add(f);
  if (!afterPaintArmed) {
    afterPaintArmed = true;
    const run = () => {
      afterPaintArmed = false;
      const due = [...afterPaintQueue];
      afterPaintQueue.clear();
      for (const g of due) g();
    };
    if (typeof requestAnimationFrame === 'function') requestAnimationFrame(() => setTimeout(run, 0));
    else setTimeout(run, 0);
  }
  return () => afterPaintQueue.delete(f);
}
const afterPaintQueue = new Set<() => void>();
let afterPaintArmed = false;

/** Like useEditor, but while a gesture is under way the value stays as it was when the gesture began, and
 *  after its end until the frame that shows the plan where the hand let go has been painted (afterPaint). */
export function useSettled<T>(selector: (s: EditorState) => T): T {
  return useHeld(selector, true);
}

/** Like useEditor, but a change that comes with a gesture's end (a drag's release: its moves committed)
 *  shows once the frame that draws the plan where the hand let go has been painted (afterPaint), so panels
 *  beside the plan do not lengthen that frame. During a gesture it follows at once (a side view's own lift). */
export function useEditorLate<T>(selector: (s: EditorState) => T): T {
  return useHeld(selector, false);
}

function useHeld<T>(selector: (s: EditorState) => T, duringGesture: boolean): T {
  const editor = useEditorApi();
  const last = useRef<{ value: T } | null>(null);
  const holding = useRef(false);
  const sel = useRef(selector);
  sel.current = selector;
  const subscribe = useCallback(
    (notify: () => void) => {
      let cancel: (() => void) | null = null;
      const off = editor.subscribe((s, prev) => {
        if (s.gesture) {
          cancel?.();
          cancel = null;
          holding.current = duringGesture;
        } else if (prev.gesture || holding.current) {
          holding.current = true;
          cancel ??= afterPaint(() => {
            cancel = null;
            holding.current = false;
            notify();
          });
          return;
        }
        notify();
      });
      return () => {
        off();
        cancel?.();
        holding.current = false;
      };
    },
    [editor, duringGesture],
  );
  const get = useCallback(() => {
    const s = editor.getState();
    if (((duringGesture && s.gesture) || holding.current) && last.current) return last.current.value;
    const v = sel.current(s);
    if (!last.current || !Object.is(last.current.value, v)) last.current = { value: v };
    return last.current.value;
  }, [editor, duringGesture]);
  return useSyncExternalStore(subscribe, get, get);
}

/** What an outside store (the live meter, or the editor itself) holds, for panels beside the plan: it follows
 *  the store at once while no gesture is under way, and at most once every `everyMs` during one (numbers that
 *  change sixty times a second cannot be read, and each change is a large render beside the dragged glyph); the
 *  newest value is shown as soon as the gesture ends and the frame showing where the hand let go is painted
 *  (afterPaint). Every panel on the same pace catches up on one shared
 *  tick, in one task, so React commits them together (one render of the panels a pace, not one each).
 *  `settled`: whether the store's value is final (the live meter: no job under way). When a gesture ends on a
 *  value that is not, the panel waits for the store's first final value instead of showing it, so the numbers
 *  step once to the result for where the hand stopped rather than through the one before it. `everyMs` null:
 *  the panel holds through a gesture (one out of sight: a phone's sheet lowered to its peek). */
export function usePaced<S, T>(store: StoreApi<S>, selector: (s: S) => T, everyMs: number | null = PANEL_PACE_MS, settled?: (s: S) => boolean): T {
  const settledRef = useRef(settled);
  settledRef.current = settled;
  const editor = useEditorApi();
  const sel = useRef(selector);
  sel.current = selector;
  const shown = useRef<{ value: T } | null>(null);
  const subscribe = useCallback(
    (notify: () => void) => {
      const update = () => {
        const value = sel.current(store.getState());
        if (shown.current && Object.is(shown.current.value, value)) return;
        shown.current = { value };
        notify();
      };
      // A gesture ended on a value that is not final: only the final one shows next (not a value the pace held
      // back during the gesture, which a change of the store's other fields — a job starting — would let out).
      let awaitingFinal = false;
      // The gesture as this panel last saw it: the store (the meter, subscribed to the editor first) may change
      // in the very update that ends the gesture, before this panel's editor listener hears of the end.
      let inGesture = !!editor.getState().gesture;
      const isSettled = () => settledRef.current?.(store.getState()) !== false;
      let cancelCatchUp: (() => void) | null = null;
      const ended = () => {
        inGesture = false;
        unpace(everyMs, update);
        awaitingFinal = !isSettled();
        // The newest value, once the frame showing where the hand let go is painted (afterPaint).
        if (!awaitingFinal)
          cancelCatchUp ??= afterPaint(() => {
            cancelCatchUp = null;
            update();
          });
      };
      const changed = () => {
        if (editor.getState().gesture) {
          inGesture = true;
          if (everyMs !== null) pace(everyMs, update);
        } else if (inGesture) ended();
        else if (!cancelCatchUp) {
          unpace(everyMs, update);
          if (awaitingFinal && !isSettled()) return;
          awaitingFinal = false;
          update();
        }
      };
      const offStore = store.subscribe(changed);
      const offEditor = editor.subscribe((s) => {
        if (s.gesture && !inGesture) {
          inGesture = true;
          awaitingFinal = false;
        } else if (!s.gesture && inGesture) ended();
      });
      // A change between the render that read the store and this subscription (React subscribes after it has
      // painted; the live meter's first answer can come in between) would otherwise never show: `get` keeps
      // what the render read. Taken now, as a change would be.
      if (shown.current && !Object.is(shown.current.value, sel.current(store.getState()))) changed();
      return () => {
        offStore();
        offEditor();
        unpace(everyMs, update);
        cancelCatchUp?.();
      };
    },
    [editor, store, everyMs],
  );
  const get = useCallback(() => {
    shown.current ??= { value: sel.current(store.getState()) };
    return shown.current.value;
  }, [store]);
  return useSyncExternalStore(subscribe, get, get);
}

/** One clock per pace: the updates waiting for it, and when it last ran them. */
type PaceClock = { last: number; timer: ReturnType<typeof setTimeout> | null; dueAt: number; waiting: Set<() => void> };
const clocks = new Map<number, PaceClock>();

/** Run `update` on the next tick of the `everyMs` clock: at once (after this task) when the clock last ran at
 *  least `everyMs` ago, else when that much time has passed. */
function pace(everyMs: number, update: () => void) {
  let clock = clocks.get(everyMs);
  if (!clock) clocks.set(everyMs, (clock = { last: -Infinity, timer: null, dueAt: 0, waiting: new Set() }));
  clock.waiting.add(update);
  const now = Date.now();
  // A tick is set and not long overdue (one far off its time was lost: timers faked and dropped by a test).
  if (clock.timer && Math.abs(now - clock.dueAt) <= everyMs) return;
  if (clock.timer) clearTimeout(clock.timer);
  const c = clock;
  const wait = Math.min(everyMs, Math.max(0, c.last + everyMs - now));
  c.dueAt = now + wait;
  c.timer = setTimeout(() => {
    c.timer = null;
    c.last = Date.now();
    const due = [...c.waiting];
    c.waiting.clear();
    for (const f of due) f();
  }, wait);
}

function unpace(everyMs: number | null, update: () => void) {
  if (everyMs !== null) clocks.get(everyMs)?.waiting.delete(update);
}

/** How often a text panel follows an outside store during a gesture. */
export const PANEL_PACE_MS = 250;
/** How often the frame view takes the plan as the hand holds it during a gesture (a new draft picture each time). */
export const FRAME_PACE_MS = 100;
