// The plan's pointer gestures on the web (canvas/planPointer.ts): the same thresholds as the phones'
// gesture handler — a drag from 3 px, a tap within 3 px, a hold after 450 ms — read from plain pointer events.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { PlanGestureHandlers } from '../../../canvas/planGestureTypes';
import { attachPlanPointer } from '../../../canvas/planPointer';

type Call = [keyof PlanGestureHandlers, ...unknown[]];

function setup() {
  const calls: Call[] = [];
  const record = new Proxy({} as PlanGestureHandlers, { get: (_t, name) => (...args: unknown[]) => calls.push([name as keyof PlanGestureHandlers, ...args]) });
  const el = Object.assign(new EventTarget(), { getBoundingClientRect: () => ({ left: 100, top: 50 }) as DOMRect });
  const detach = attachPlanPointer(el as unknown as HTMLElement, () => record);
  const fire = (target: EventTarget, type: string, x: number, y: number, more: Partial<PointerEvent> = {}) =>
    target.dispatchEvent(Object.assign(new Event(type), { pointerId: 1, pointerType: 'mouse', button: 0, clientX: x + 100, clientY: y + 50, ...more }));
  return {
    calls,
    detach,
    down: (x: number, y: number, more?: Partial<PointerEvent>) => fire(el, 'pointerdown', x, y, more),
    move: (x: number, y: number, more?: Partial<PointerEvent>) => fire(window, 'pointermove', x, y, more),
    up: (x: number, y: number, more?: Partial<PointerEvent>) => fire(window, 'pointerup', x, y, more),
  };
}

beforeEach(() => {
  vi.useFakeTimers();
  (globalThis as { window?: EventTarget }).window = new EventTarget();
});
afterEach(() => {
  vi.useRealTimers();
  delete (globalThis as { window?: EventTarget }).window;
});

describe('plan pointer gestures on the web', () => {
  it('a press released where it went down is a tap, in the plan box’s pixels', () => {
    const g = setup();
    g.down(10, 20);
    g.move(11, 21);
    g.up(11, 21);
    expect(g.calls).toEqual([['tap', { x: 11, y: 21 }]]);
  });

  it('a drag starts past 3 px from the press point, follows the pointer and ends where it was let go', () => {
    const g = setup();
    g.down(10, 20);
    g.move(12, 20);
    expect(g.calls).toEqual([]);
    g.move(14, 20);
    g.move(40, 60);
    g.up(41, 61);
    expect(g.calls).toEqual([
      ['dragStart', { x: 10, y: 20 }, { x: 14, y: 20 }],
      ['dragMove', { x: 40, y: 60 }],
      ['dragRelease', { x: 41, y: 61 }],
      ['dragEnd', { x: 41, y: 61 }],
    ]);
    vi.advanceTimersByTime(1000);
    expect(g.calls.some(([n]) => n === 'hold' || n === 'tap')).toBe(false);
  });

  it('a press held still for 450 ms is a hold, and neither a tap nor a drag follows', () => {
    const g = setup();
    g.down(30, 30, { pointerType: 'touch' });
    vi.advanceTimersByTime(449);
    expect(g.calls).toEqual([]);
    vi.advanceTimersByTime(1);
    g.move(60, 60, { pointerType: 'touch' });
    g.up(60, 60, { pointerType: 'touch' });
    expect(g.calls).toEqual([['hold', { x: 30, y: 30 }]]);
  });

  it('a second finger ends a drag where it stood and nothing more happens until both are up', () => {
    const g = setup();
    g.down(10, 10, { pointerType: 'touch' });
    g.move(30, 10, { pointerType: 'touch' });
    g.down(80, 80, { pointerType: 'touch', pointerId: 2 });
    g.move(50, 10, { pointerType: 'touch' });
    g.up(50, 10, { pointerType: 'touch' });
    g.up(80, 80, { pointerType: 'touch', pointerId: 2 });
    expect(g.calls).toEqual([
      ['dragStart', { x: 10, y: 10 }, { x: 30, y: 10 }],
      ['dragEnd', { x: 30, y: 10 }],
    ]);
    g.down(5, 5);
    g.up(5, 5);
    expect(g.calls.at(-1)).toEqual(['tap', { x: 5, y: 5 }]);
  });

  it('ignores the mouse’s other buttons, a cancelled press and everything after detaching', () => {
    const g = setup();
    g.down(10, 10, { button: 2 });
    g.up(10, 10, { button: 2 });
    g.down(10, 10);
    window.dispatchEvent(Object.assign(new Event('pointercancel'), { pointerId: 1, clientX: 110, clientY: 60 }));
    expect(g.calls).toEqual([]);
    g.detach();
    g.down(10, 10);
    g.up(10, 10);
    expect(g.calls).toEqual([]);
  });
});
