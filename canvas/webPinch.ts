// A two-finger pinch on the web, read from the page's own touch pointers: the plan point first under the
// fingers' midpoint stays under it (pinchCamera), and moving both fingers pans with them. The gesture library's
// pinch never heard two touch points on the web build (a real two-finger pinch through the browser's touch
// input left the plan still: tests/e2e/pinch.test.ts), so on the web the plan reads the touches itself.
import type { Editor } from './editor/editor';
import { pinchCamera, type Camera } from './editor/camera';

type Point = { x: number; y: number };

/** Listens on `el` (the plan's box) for two touch points; returns the detach. */
export function attachWebPinch(el: HTMLElement, editor: Editor): () => void {
  const touches = new Map<number, Point>();
  let start: { camera: Camera; focal: Point; span: number } | null = null;
  const local = (e: PointerEvent): Point => {
    const r = el.getBoundingClientRect();
    return { x: e.clientX - r.left, y: e.clientY - r.top };
  };
  const pair = () => {
    const [a, b] = [...touches.values()] as [Point, Point];
    return { focal: { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 }, span: Math.hypot(a.x - b.x, a.y - b.y) };
  };
  const onDown = (e: PointerEvent) => {
    if (e.pointerType !== 'touch') return;
    touches.set(e.pointerId, local(e));
    start = null;
    const camera = editor.getState().camera;
    if (touches.size === 2 && camera) {
      const p = pair();
      if (p.span > 4) start = { camera, ...p };
    }
  };
  const onMove = (e: PointerEvent) => {
    if (!touches.has(e.pointerId)) return;
    touches.set(e.pointerId, local(e));
    if (!start || touches.size !== 2) return;
    const p = pair();
    editor.dispatch('setCamera', { camera: pinchCamera(start.camera, start.focal, p.span / start.span, p.focal) });
  };
  const onUp = (e: PointerEvent) => {
    if (!touches.delete(e.pointerId)) return;
    start = null;
  };
  el.addEventListener('pointerdown', onDown, { capture: true, passive: true });
  window.addEventListener('pointermove', onMove, { capture: true, passive: true });
  window.addEventListener('pointerup', onUp, { capture: true, passive: true });
  window.addEventListener('pointercancel', onUp, { capture: true, passive: true });
  return () => {
    el.removeEventListener('pointerdown', onDown, { capture: true });
    window.removeEventListener('pointermove', onMove, { capture: true });
    window.removeEventListener('pointerup', onUp, { capture: true });
    window.removeEventListener('pointercancel', onUp, { capture: true });
  };
}
