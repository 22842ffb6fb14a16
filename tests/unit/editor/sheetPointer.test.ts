// The bottom sheet's drag on the web (components/editor/sheetPointer.ts): plain pointer events on the handle row,
// the same calls gesture handler's pan gives the phones (start, the move from the press, the speed at release).
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { attachSheetPointer, releaseVelocity } from '../../../components/editor/sheetPointer';
import type { SheetDragHandlers } from '../../../components/editor/sheetDragTypes';

type Call = [keyof SheetDragHandlers, ...unknown[]];

function setup() {
  const calls: Call[] = [];
  const record: SheetDragHandlers = {
    start: () => calls.push(['start']),
    move: (dy) => calls.push(['move', dy]),
    end: (v) => calls.push(['end', Math.round(v)]),
  };
  let t = 0;
  const el = new EventTarget();
  const detach = attachSheetPointer(el as unknown as HTMLElement, () => record, () => t);
  const fire = (target: EventTarget, type: string, y: number, more: Partial<PointerEvent> = {}) =>
    target.dispatchEvent(Object.assign(new Event(type, { cancelable: true }), { pointerId: 1, pointerType: 'touch', isPrimary: true, button: 0, clientX: 20, clientY: y, ...more }));
  return {
    calls,
    detach,
    el,
    at: (ms: number) => (t = ms),
    down: (y: number, more?: Partial<PointerEvent>) => fire(el, 'pointerdown', y, more),
    move: (y: number, more?: Partial<PointerEvent>) => fire(window, 'pointermove', y, more),
    up: (y: number, more?: Partial<PointerEvent>) => fire(window, 'pointerup', y, more),
    cancel: (y: number) => fire(window, 'pointercancel', y),
    click: () => el.dispatchEvent(new Event('click', { cancelable: true })),
  };
}

beforeEach(() => {
  (globalThis as { window?: EventTarget }).window = new EventTarget();
});
afterEach(() => {
  delete (globalThis as { window?: EventTarget }).window;
});

describe('the bottom sheet’s drag on the web', () => {
  it('starts past 10 px, reports the move from the press and the speed at release', () => {
    const g = setup();
    g.at(0);
    g.down(700);
    g.at(16);
    g.move(695);
    expect(g.calls).toEqual([]);
    g.at(32);
    g.move(680);
    g.at(48);
    g.move(600);
    g.at(64);
    g.up(520);
    // 700 → 520 is 180 px up; the last 100 ms (0…64 ms) moved from 700 to 520: −2812.5 px/s.
    expect(g.calls).toEqual([['start'], ['move', -20], ['move', -100], ['end', -2812]]);
  });

  it('a press that stays within 10 px is no drag, and its click goes through', () => {
    const g = setup();
    g.down(700);
    g.move(706);
    g.up(706);
    expect(g.calls).toEqual([]);
    let clicked = 0;
    g.el.addEventListener('click', () => clicked++);
    g.click();
    expect(clicked).toBe(1);
  });

  it('the click that ends a drag does not reach the button it began on', () => {
    const g = setup();
    g.at(0);
    g.down(700);
    g.at(20);
    g.move(640);
    g.at(40);
    g.up(600);
    let clicked = 0;
    g.el.addEventListener('click', () => clicked++);
    g.click();
    expect(clicked).toBe(0);
    // Only that one: the next press’s click is a click.
    g.click();
    expect(clicked).toBe(1);
  });

  it('a tap soon after a drag is still a tap', () => {
    const g = setup();
    g.at(0);
    g.down(700);
    g.at(20);
    g.move(640);
    g.at(40);
    g.up(600);
    let clicked = 0;
    g.el.addEventListener('click', () => clicked++);
    // A new press 100 ms after the release (within the 300 ms the drag's own click is waited for).
    g.at(140);
    (window as EventTarget).dispatchEvent(Object.assign(new Event('pointerdown'), { pointerId: 2, pointerType: 'touch', isPrimary: true, button: 0, clientX: 20, clientY: 820 }));
    g.up(820, { pointerId: 2 });
    g.click();
    expect(clicked).toBe(1);
  });

  it('a cancelled drag ends with no speed; other pointers and the right button are ignored', () => {
    const g = setup();
    g.at(0);
    g.down(700);
    g.move(600, { pointerId: 2 });
    g.down(650, { pointerId: 2, isPrimary: false });
    g.at(10);
    g.move(650);
    g.cancel(650);
    expect(g.calls).toEqual([['start'], ['move', -50], ['end', 0]]);
    g.calls.length = 0;
    g.down(700, { pointerType: 'mouse', button: 2 });
    g.move(600);
    g.up(600);
    expect(g.calls).toEqual([]);
  });

  it('reads the speed over the last 100 ms only', () => {
    // A slow start then a quick flick: only the flick counts.
    const samples = [
      { t: 0, y: 800 },
      { t: 400, y: 790 },
      { t: 450, y: 740 },
      { t: 500, y: 690 },
    ];
    expect(releaseVelocity(samples)).toBe(-1000);
    expect(releaseVelocity(samples.slice(0, 1))).toBe(0);
    expect(releaseVelocity([])).toBe(0);
  });

  it('detaches', () => {
    const g = setup();
    g.detach();
    g.down(700);
    g.move(600);
    g.up(600);
    expect(g.calls).toEqual([]);
  });
});
