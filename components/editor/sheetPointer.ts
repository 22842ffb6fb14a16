// The bottom sheet's drag on the web, from the page's own pointer events (mouse, pen, one finger), so the
// editor's page loads no gesture handler (the phones use its pan: sheetDrag.tsx). A press on the handle row
// becomes a drag once it has moved SHEET_DRAG_MIN_PX vertically; the speed at release is the last
// SHEET_VELOCITY_WINDOW_MS of movement. The click that ends a drag (the next within 300 ms, unless another
// press comes first) does not reach the button under the pointer.
import { SHEET_DRAG_MIN_PX, SHEET_VELOCITY_WINDOW_MS, type SheetDragHandlers } from './sheetDragTypes';

type Sample = { t: number; y: number };
type Press = { id: number; y0: number; dragging: boolean; samples: Sample[] };

/** Speed in px/s over the samples of the last `windowMs` before the newest (0 with fewer than two). */
export function releaseVelocity(samples: Sample[], windowMs = SHEET_VELOCITY_WINDOW_MS): number {
  const last = samples[samples.length - 1];
  if (!last) return 0;
  let first = last;
  for (let i = samples.length - 2; i >= 0 && last.t - samples[i]!.t <= windowMs; i--) first = samples[i]!;
  const dt = last.t - first.t;
  return dt > 0 ? ((last.y - first.y) * 1000) / dt : 0;
}

/** Wires pointer events on `el` (the handle row) to the handlers; returns the detach. */
export function attachSheetPointer(el: HTMLElement, handlers: () => SheetDragHandlers, now: () => number = () => performance.now()): () => void {
  let press: Press | null = null;
  let swallowUntil = -Infinity;

  const onDown = (e: PointerEvent) => {
    if (press || e.isPrimary === false) return; // one finger drags; a second is ignored
    if (e.pointerType === 'mouse' && e.button !== 0) return;
    press = { id: e.pointerId, y0: e.clientY, dragging: false, samples: [{ t: now(), y: e.clientY }] };
  };
  const onMove = (e: PointerEvent) => {
    const p = press;
    if (!p || e.pointerId !== p.id) return;
    const t = now();
    p.samples.push({ t, y: e.clientY });
    while (p.samples.length > 2 && t - p.samples[0]!.t > 2 * SHEET_VELOCITY_WINDOW_MS) p.samples.shift();
    const dy = e.clientY - p.y0;
    if (!p.dragging) {
      if (Math.abs(dy) < SHEET_DRAG_MIN_PX) return;
      p.dragging = true;
      handlers().start();
    }
    handlers().move(dy);
  };
  const onUp = (e: PointerEvent) => {
    const p = press;
    if (!p || e.pointerId !== p.id) return;
    press = null;
    if (!p.dragging) return;
    if (e.type === 'pointerup') {
      p.samples.push({ t: now(), y: e.clientY });
      // The click that follows this release ends a drag, not a press on the button under it.
      swallowUntil = now() + 300;
      handlers().end(releaseVelocity(p.samples));
    } else handlers().end(0);
  };
  // A new press anywhere ends that: its own click is a click, however soon it comes.
  const onAnyDown = () => {
    swallowUntil = -Infinity;
  };
  const onClick = (e: Event) => {
    if (now() > swallowUntil) return;
    swallowUntil = -Infinity;
    e.stopImmediatePropagation();
    e.preventDefault();
  };

  window.addEventListener('pointerdown', onAnyDown, { capture: true, passive: true });
  el.addEventListener('pointerdown', onDown);
  el.addEventListener('click', onClick, true);
  window.addEventListener('pointermove', onMove, { passive: true });
  window.addEventListener('pointerup', onUp, { passive: true });
  window.addEventListener('pointercancel', onUp, { passive: true });
  return () => {
    window.removeEventListener('pointerdown', onAnyDown, { capture: true });
    el.removeEventListener('pointerdown', onDown);
    el.removeEventListener('click', onClick, true);
    window.removeEventListener('pointermove', onMove);
    window.removeEventListener('pointerup', onUp);
    window.removeEventListener('pointercancel', onUp);
  };
}
