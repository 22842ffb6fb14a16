// The pointer state machine, headless: presses in plan metres, the store's state checked after each.
import { describe, expect, it } from 'vitest';
import { pressDown, pressMove, pressUp, tap, type PressOptions } from '../../../canvas/gestures';
import { createEditorStore } from '../../../canvas/state/store';
import { demoSetups } from '../../../db/seed-setups';
import { rotateHandleOf } from '../../../model/kinds';

const view = { scale: 100, tx: 0, ty: 0 };
const opts: PressOptions = { toleranceM: 0.1, boxSelect: true, panKey: false, additive: false };
const scr = (p: { x: number; y: number }) => ({ x: p.x * 100, y: p.y * 100 });
const at = (store: ReturnType<typeof createEditorStore>, id: string) => store.getState().doc.items.find((i) => i.id === id) as any;
const fresh = () => createEditorStore(demoSetups[0]!.document);

function drag(store: ReturnType<typeof createEditorStore>, from: { x: number; y: number }, to: { x: number; y: number }, o = opts, v = view) {
  let press = pressDown(store, v, from, scr(from), o);
  const mode = press.mode;
  for (let k = 1; k <= 10; k++) {
    const p = { x: from.x + ((to.x - from.x) * k) / 10, y: from.y + ((to.y - from.y) * k) / 10 };
    const r = pressMove(store, press, p, scr(p));
    press = r.press;
    if (r.view) v = r.view;
  }
  pressUp(store, press);
  return { mode, view: v };
}

describe('pressing on the plan', () => {
  it('a press on an item selects it and a drag moves it, as one undo step', () => {
    const store = fresh();
    const r = drag(store, { x: 4, y: 4.1 }, { x: 5, y: 4.1 });
    expect(r.mode).toBe('drag');
    expect(store.getState().selection).toEqual(['key']);
    expect(at(store, 'key').x).toBeCloseTo(5);
    expect(store.getState().past.length).toBe(1);
  });

  it('a press on the rotate handle of the selected item turns it', () => {
    const store = fresh();
    store.dispatch('select', { ids: ['cam'] });
    const h = rotateHandleOf(at(store, 'cam'))!;
    const r = drag(store, h, { x: 5.4, y: 5.4 });
    expect(r.mode).toBe('rotate');
    expect(at(store, 'cam').aimDeg).toBe(0);
  });

  it('empty space draws a selection box on a wide screen', () => {
    const store = fresh();
    drag(store, { x: 3.5, y: 3.0 }, { x: 4.5, y: 4.5 });
    expect(new Set(store.getState().selection)).toEqual(new Set(['sitter', 'stool', 'key', 'under']));
  });

  it('empty space pans on touch', () => {
    const store = fresh();
    const r = drag(store, { x: 0.5, y: 0.5 }, { x: 1.5, y: 0.5 }, { ...opts, boxSelect: false });
    expect(r.mode).toBe('pan');
    expect(r.view.tx).toBeCloseTo(100);
  });

  it('with the wall tool, a drag draws a wall and goes back to selecting', () => {
    const store = fresh();
    store.dispatch('setTool', { tool: 'wall' });
    const n = store.getState().doc.items.length;
    drag(store, { x: 1, y: 1 }, { x: 1, y: 5 });
    const wall = store.getState().doc.items[n] as any;
    expect(wall.kind).toBe('wall');
    expect(wall.a).toEqual({ x: 1, y: 1 });
    expect(wall.b).toEqual({ x: 1, y: 5 });
    expect(store.getState().tool).toBe('select');
    store.dispatch('undo');
    expect(store.getState().doc.items.length).toBe(n);
  });

  it('a wall tool press without a drag leaves nothing', () => {
    const store = fresh();
    store.dispatch('setTool', { tool: 'wall' });
    const n = store.getState().doc.items.length;
    drag(store, { x: 1, y: 1 }, { x: 1.02, y: 1 });
    expect(store.getState().doc.items.length).toBe(n);
  });

  it('a tap on empty space clears the selection; a long press adds to it', () => {
    const store = fresh();
    tap(store, { x: 4, y: 4.1 }, opts);
    tap(store, { x: 4, y: 5.4 }, { ...opts, additive: true });
    expect(store.getState().selection).toEqual(['key', 'cam']);
    tap(store, { x: 0.3, y: 0.3 }, opts);
    expect(store.getState().selection).toEqual([]);
  });

  it('in a step view a press reaches only the items shown', () => {
    const store = fresh();
    const shown = store.getState().doc.items.filter((i) => i.id !== 'key');
    const r = drag(store, { x: 4, y: 4.1 }, { x: 5, y: 4.1 }, { ...opts, boxSelect: false, items: shown });
    expect(r.mode).toBe('pan');
    expect(at(store, 'key').x).toBe(4);
    tap(store, { x: 4, y: 4.1 }, { ...opts, items: shown });
    expect(store.getState().selection).toEqual([]);
  });

  it('crew can select but not move', () => {
    const store = createEditorStore(demoSetups[0]!.document, { readOnly: true });
    drag(store, { x: 4, y: 4.1 }, { x: 5, y: 4.1 });
    expect(at(store, 'key').x).toBe(4);
    expect(store.getState().selection).toEqual(['key']);
  });
});
