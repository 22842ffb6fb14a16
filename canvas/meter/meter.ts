// The live meter: follows the editor's document at its own pace, including a drag under way (the moves a
// gesture holds beside the document). One job at a time; while it runs, later
// changes wait and only the newest is sent next, so a drag never queues work and the glyph never waits.
// When the hand stops (no change for a little while), a result for an older document is not shown: the
// next one, for the document as it stands, is — so the meter is at most one update behind the glyph.
// While a hand drags on the plan, jobs start at most every GESTURE_GAP_MS: the glyph moves every frame, and the
// light map and panels that each result redraws (contours, tint, meter text) follow at about half
// that rate, so their drawing does not take the frames the glyph needs. Where showing a result costs this thread
// more (a slow phone), the gap grows with it: a result's showing (the store's listeners, then React's render and
// commit of what reads it, which run before the next microtask) takes at most 1 / SHOW_SHARE of the time.
// The meter opens with no readings (`readings: null`, "still reading": panels say so, never "no light"), and
// computes nothing while it is made (that is the editor's first render). Its first job goes when the screen
// calls start() — at once where the engine is a worker, after the first paint where it computes in the page —
// or at the first change; readFirst() computes the numbers alone in the page, in short tasks after the first
// paint, for the case (a cold page on a slow line) where the worker's script is still on its way.
import { createStore, type StoreApi } from 'zustand';
import type { SetupDocument } from '../../model/document';
import { computeReadings, warmReadings, type Readings } from '../../model/setupReadings';
import type { Editor } from '../editor/editor';
import { liveDoc } from '../editor/state';
import { defaultEngine, type MeterEngine } from './engine';

/** `readings`: null until the first job's answer (the meter is still reading the plan); `doc`: the document
 *  they were computed for (the opening document until then). */
type MeterState = { readings: Readings | null; doc: SetupDocument; computing: boolean };

/** Whether the meter's readings are final: no job is under way for a newer document. */
export const meterSettled = (m: MeterState) => !m.computing;
export type MeterOptions = { lightMap: boolean; stepIndex?: number };
export type Meter = StoreApi<MeterState> & {
  setOptions: (o: Partial<MeterOptions>) => void;
  /** Sends the first job unless one has gone (a change sends one too). */
  start: () => void;
  /** While nothing has been shown yet: computes the meter's numbers (no light map) for the plan as it stands,
   *  in this thread, in two short tasks from now, and shows them (a worker's answer, light map and all,
   *  replaces them when it comes). */
  readFirst: () => void;
  dispose: () => void;
  engine: MeterEngine;
};

/** A change younger than this means the hand is still moving. */
const SETTLE_MS = 40;
/** During a pointer gesture, the least time between the starts of two jobs (about 30 results a second). */
export const GESTURE_GAP_MS = 33;
/** During a gesture, showing results may take at most one part in SHOW_SHARE of this thread's time. */
export const SHOW_SHARE = 4;

export function createMeter(editor: Editor, opts: MeterOptions, engine: MeterEngine = defaultEngine(), now: () => number = () => Date.now()): Meter {
  let options = opts;
  const first = liveDoc(editor.getState());
  // No reading is computed here: this runs in the editor's first render, and the first reading (the room built
  // cold for the bounce light: 0.2–0.27 s on a phone) was that render's longest part. The engine computes it.
  const store = createStore<MeterState>(() => ({ readings: null, doc: first, computing: false }));
  let started = false;
  let running = false;
  let dirty = false;
  let lastChange = now();
  let disposed = false;
  let sentAt = -Infinity;
  let paced: ReturnType<typeof setTimeout> | null = null;
  // What showing a result cost this thread, ms (smoothed over the last few).
  let showMs = 0;
  const gap = () => Math.max(GESTURE_GAP_MS, SHOW_SHARE * showMs);
  const show = (state: Partial<MeterState>) => {
    const t = now();
    store.setState(state);
    // React renders and commits what the change re-renders in a microtask queued by the listeners just called.
    queueMicrotask(() => {
      showMs = 0.6 * showMs + 0.4 * (now() - t);
    });
  };

  const send = () => {
    if (disposed) return;
    const wait = editor.getState().drag ? sentAt + gap() - now() : 0;
    if (wait > 0) {
      // Too soon after the last job while a hand drags: the newest document goes when the gap is over. The
      // readings shown are not final meanwhile (a gesture ending now must not show them as the result).
      running = true;
      if (!store.getState().computing) store.setState({ computing: true });
      paced ??= setTimeout(sendWaiting, wait);
      return;
    }
    sentAt = now();
    started = true;
    running = true;
    dirty = false;
    const doc = liveDoc(editor.getState());
    const sent = { options };
    store.setState({ computing: true });
    void engine.compute({ doc, lightMap: options.lightMap, stepIndex: options.stepIndex }).then((readings) => {
      if (disposed) return;
      running = false;
      const stale = dirty || sent.options !== options;
      // A result for an older document shows only while the hand is still moving (the map following it); once
      // it has stopped or let go, the numbers step once, to the result for where it is.
      const handStopped = now() - lastChange >= SETTLE_MS;
      if (!stale || !handStopped) show({ readings, doc, computing: stale });
      if (stale) send();
      else store.setState({ computing: false });
    });
  };
  const sendWaiting = () => {
    if (paced) clearTimeout(paced);
    paced = null;
    sentAt = -Infinity;
    send();
  };
  const changed = () => {
    lastChange = now();
    if (running) dirty = true;
    else send();
  };
  const unsubscribe = editor.subscribe((s, prev) => {
    // A drag's release commits the very document the drag showed last: nothing new to compute — but a job
    // waiting out the gap goes at once, the hand being off the plan.
    if ((s.doc !== prev.doc || s.drag !== prev.drag) && liveDoc(s) !== liveDoc(prev)) changed();
    else if (prev.drag && !s.drag && paced) sendWaiting();
    // Letting go is the hand stopping.
    if (prev.gesture && !s.gesture) lastChange = -Infinity;
  });
  return Object.assign(store, {
    engine,
    setOptions: (o: Partial<MeterOptions>) => {
      // The same options again (a screen's effects on mount) change nothing: no job (before, each such call
      // made the first job's answer stale and the first light map was computed twice).
      if ((Object.keys(o) as (keyof MeterOptions)[]).every((k) => Object.is(o[k], options[k]))) return;
      options = { ...options, ...o };
      changed();
    },
    start: () => {
      if (!started && !disposed) send();
    },
    readFirst: () => {
      // In two tasks (a slow phone's thread is never held long): the room's geometry, then the numbers and
      // their showing (the panels' render), for the plan as it stands then. Each first checks that they are
      // still wanted: nothing shown yet (an engine's answer comes first and wins).
      const wanted = () => !disposed && !store.getState().readings;
      const mark = (m: string) => typeof performance !== 'undefined' && typeof performance.mark === 'function' && performance.mark(m);
      if (!wanted()) return;
      mark('falloff:first-reading 1/2');
      warmReadings(liveDoc(editor.getState()), { stepIndex: options.stepIndex });
      setTimeout(() => {
        if (!wanted()) return;
        mark('falloff:first-reading 2/2');
        const doc = liveDoc(editor.getState());
        // Final for this document unless a job (the light map's, or a newer plan's) is still out.
        show({ readings: computeReadings(doc, { stepIndex: options.stepIndex, lightMap: false }), doc, computing: running });
      }, 0);
    },
    dispose: () => {
      disposed = true;
      if (paced) clearTimeout(paced);
      unsubscribe();
      engine.dispose();
    },
  });
}
