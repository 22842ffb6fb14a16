// The plan's press, drag, hold and tap on the web, from the page's own pointer events (mouse, pen, one
// finger): the same calls and thresholds as gesture handler gives the phones (planGestures.tsx), without
// loading it. A second finger ends a drag and is left to the pinch (webPinch.ts, wired by PlanCanvas).
import type { Point } from '../model/geometry';
import { DRAG_MIN_PX, HOLD_MS, TAP_MAX_PX, type PlanGestureHandlers } from './planGestureTypes';

type Press = { id: number; box: DOMRect; from: Point; last: Point; dragging: boolean; held: boolean; timer: ReturnType<typeof setTimeout> | null };

/** Wires pointer events on `el` to the handlers; returns the detach. */
export function attachPlanPointer(el: HTMLElement, handlers: () => PlanGestureHandlers): () => void {
  let press: Press | null = null;
  // Once a second pointer came down, nothing more until every pointer is up.
  let spoiled = false;
  const down = new Set<number>();
  const at = (p: Press, e: PointerEvent): Point => ({ x: e.clientX - p.box.left, y: e.clientY - p.box.top });
  const stopTimer = (p: Press) => {
    if (p.timer !== null) clearTimeout(p.timer);
    p.timer = null;
  };
  const finish = (p: Press, point: Point, released: boolean) => {
    stopTimer(p);
    press = null;
    if (p.dragging) {
      if (released) handlers().dragRelease(point);
      handlers().dragEnd(point);
    }
  };

  const onDown = (e: PointerEvent) => {
    down.add(e.pointerId);
    if (press || spoiled) {
      // A second finger: the one-finger gesture ends where it stood.
      if (press) finish(press, press.last, false);
      spoiled = true;
      return;
    }
    if (e.pointerType === 'mouse' && e.button !== 0) return;
    const box = el.getBoundingClientRect();
    const p: Press = { id: e.pointerId, box, from: { x: 0, y: 0 }, last: { x: 0, y: 0 }, dragging: false, held: false, timer: null };
    p.from = p.last = at(p, e);
    p.timer = setTimeout(() => {
      p.timer = null;
      if (press !== p || p.dragging) return;
      p.held = true;
      handlers().hold(p.from);
    }, HOLD_MS);
    press = p;
  };
  const onMove = (e: PointerEvent) => {
    const p = press;
    if (!p || e.pointerId !== p.id || p.held) return;
    p.last = at(p, e);
    if (p.dragging) return handlers().dragMove(p.last);
    if (Math.hypot(p.last.x - p.from.x, p.last.y - p.from.y) >= DRAG_MIN_PX) {
      stopTimer(p);
      p.dragging = true;
      handlers().dragStart(p.from, p.last);
    }
  };
  const onUp = (e: PointerEvent) => {
    down.delete(e.pointerId);
    if (!down.size) spoiled = false;
    const p = press;
    if (!p || e.pointerId !== p.id) return;
    const point = at(p, e);
    const tap = !p.dragging && !p.held && e.type === 'pointerup' && Math.hypot(point.x - p.from.x, point.y - p.from.y) <= TAP_MAX_PX;
    finish(p, point, e.type === 'pointerup');
    if (tap) handlers().tap(point);
  };

  el.addEventListener('pointerdown', onDown);
  window.addEventListener('pointermove', onMove, { passive: true });
  window.addEventListener('pointerup', onUp, { passive: true });
  window.addEventListener('pointercancel', onUp, { passive: true });
  return () => {
    if (press) stopTimer(press);
    el.removeEventListener('pointerdown', onDown);
    window.removeEventListener('pointermove', onMove);
    window.removeEventListener('pointerup', onUp);
    window.removeEventListener('pointercancel', onUp);
  };
}

