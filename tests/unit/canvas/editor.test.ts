// Editor commands, headless: each one changes the document as the user expects and undoes exactly.
import { describe, expect, it } from 'vitest';
import { demoSetups } from '../../../db/seed-setups';
import { parseDocument, type SetupDocument } from '../../../model/document';
import { actions, run, viewActions, type ActionName } from '../../../canvas/editor/actions';
import { createEditor } from '../../../canvas/editor/editor';
import { keymap, type KeyInput } from '../../../canvas/editor/keymap';
import { snapPoint } from '../../../canvas/editor/snap';
import { initialState, type EditorState } from '../../../canvas/editor/state';

const base = (): SetupDocument => demoSetups[0]!.document;
const item = (s: EditorState, id: string) => s.doc.items.find((i) => i.id === id)!;
const withSel = (s: EditorState, ...ids: string[]) => run(s, 'select', { ids });

describe('every command that changes the plan is undone by one undo and redone by one redo', () => {
  const start = withSel(initialState(base()), 'key');
  const cases: [string, (s: EditorState) => EditorState][] = [
    ['addItem', (s) => run(s, 'addItem', { kind: 'light', at: { x: 1, y: 1 } })],
    ['dragItems', (s) => run(s, 'dragItems', { origin: [item(s, 'key')], dx: 1, dy: 0.5, gestureKey: 'g1' })],
    ['dragEnd', (s) => run(s, 'dragEnd', { id: 'backdrop', end: 'a', to: { x: 1.5, y: 1 }, gestureKey: 'g2' })],
    ['aimAt', (s) => run(s, 'aimAt', { id: 'key', at: { x: 0, y: 0 }, gestureKey: 'g3' })],
    ['updateItem', (s) => run(s, 'updateItem', { id: 'key', patch: { power: 1 / 2 } })],
    ['updateDocument', (s) => run(s, 'updateDocument', { patch: { ambientEv100: 9 } })],
    ['nudge', (s) => run(s, 'nudge', { dx: 0.1, dy: 0 })],
    ['deleteSelection', (s) => run(s, 'deleteSelection')],
    ['duplicateSelection', (s) => run(s, 'duplicateSelection')],
    ['toggleLock', (s) => run(s, 'toggleLock')],
    ['setSteps', (s) => run(s, 'setSteps', { steps: [] })],
    ['setShots', (s) => run(s, 'setShots', { shots: [] })],
    ['startWall', (s) => run(s, 'startWall', { at: { x: 1, y: 1 }, gestureKey: 'w1' })],
    ['placeItem', (s) => run(s, 'placeItem', { kind: 'camera' })],
    ['setHeight', (s) => run(s, 'setHeight', { id: 'key', heightM: 1.2, gestureKey: 'h1' })],
    ['setTilt', (s) => run(s, 'setTilt', { id: 'key', tiltDeg: 10, gestureKey: 't1' })],
  ];
  it.each(cases)('%s', (_name, change) => {
    const after = change(start);
    expect(after.doc).not.toEqual(start.doc);
    const undone = run(after, 'undo');
    expect(undone.doc).toEqual(start.doc);
    expect(run(undone, 'redo').doc).toEqual(after.doc);
  });

  it('covers every document-changing action', () => {
    const named = new Set(cases.map(([n]) => n));
    for (const name of Object.keys(actions) as ActionName[]) if (!viewActions.includes(name)) expect(named, name).toContain(name);
  });
});

describe('dragging', () => {
  it('one drag is one undo step, however many frames it took', () => {
    let s = withSel(initialState(base()), 'key');
    const origin = [item(s, 'key')];
    for (let f = 1; f <= 30; f++) s = run(s, 'dragItems', { origin, dx: f * 0.05, dy: 0, gestureKey: 'drag-1' });
    expect(item(s, 'key')).toMatchObject({ x: 5.5 });
    expect(s.past.length).toBe(1);
    expect(item(run(s, 'undo'), 'key')).toMatchObject({ x: 4 });
  });

  it('snaps to the 0.1 m grid, and not when snapping is off', () => {
    const s = withSel(initialState(base()), 'key');
    const origin = [item(s, 'key')];
    expect(item(run(s, 'dragItems', { origin, dx: 0.234, dy: 0.0, gestureKey: 'g' }), 'key')).toMatchObject({ x: 4.2 });
    const free = run(s, 'toggleSnap');
    expect(item(run(free, 'dragItems', { origin, dx: 0.234, dy: 0, gestureKey: 'g' }), 'key')).toMatchObject({ x: 4.234 });
  });

  it('snaps onto a wall when within 0.2 m of it', () => {
    const doc = base();
    const p = snapPoint({ x: 3.03, y: 1.33 }, doc.items, new Set());
    expect(p.y).toBeCloseTo(1.2); // the backdrop runs along y = 1.2
    expect(p.x).toBeCloseTo(3.03);
  });

  it('moves a multi-selection together and leaves locked items where they are', () => {
    let s = withSel(initialState(base()), 'key', 'under');
    s = run(s, 'updateItem', { id: 'under', patch: { locked: true } });
    s = run(s, 'dragItems', { origin: [item(s, 'key'), item(s, 'under')], dx: 1, dy: 0, gestureKey: 'g' });
    expect(item(s, 'key')).toMatchObject({ x: 5 });
    expect(item(s, 'under')).toMatchObject({ x: 4 });
  });
});

describe('inspector changes', () => {
  it('refuse a value the schema does not allow (the item stays as it was)', () => {
    const s = initialState(base());
    expect(run(s, 'updateItem', { id: 'key', patch: { power: 7 } }).doc).toBe(s.doc);
    expect(run(s, 'updateItem', { id: 'key', patch: { modifier: 'no-such-thing' } }).doc).toBe(s.doc);
  });
  it('deleting an item takes it out of the steps too', () => {
    const s = run(withSel(initialState(base()), 'key'), 'deleteSelection');
    expect(s.doc.steps.flatMap((st) => st.itemIds)).not.toContain('key');
  });
});

describe('read-only (crew)', () => {
  it('changes nothing', () => {
    const s = withSel(initialState(base(), { readOnly: true }), 'key');
    for (const next of [run(s, 'nudge', { dx: 1, dy: 0 }), run(s, 'deleteSelection'), run(s, 'addItem', { kind: 'flag', at: { x: 0, y: 0 } })]) {
      expect(next.doc).toBe(s.doc);
    }
  });
});

describe('keyboard', () => {
  const press = (key: string, mods: Partial<{ shiftKey: boolean; ctrlKey: boolean; metaKey: boolean }> = {}) => ({ key, shiftKey: false, ctrlKey: false, metaKey: false, ...mods });
  const handleKey = (e: ReturnType<typeof createEditor>, k: KeyInput) => e.keys.down(k);
  it('arrows nudge 0.1 m, Shift 1 m; Ctrl+Z undoes, Ctrl+Shift+Z redoes; Ctrl+D duplicates; Delete deletes', () => {
    const store = createEditor(parseDocument(base()));
    store.dispatch('select', { ids: ['key'] });
    const at = () => store.getState().doc.items.find((i) => i.id === 'key') as { x: number; y: number };
    handleKey(store, press('ArrowRight'));
    expect(at().x).toBeCloseTo(4.1);
    handleKey(store, press('ArrowDown', { shiftKey: true }));
    expect(at().y).toBeCloseTo(5.1);
    handleKey(store, press('z', { ctrlKey: true }));
    expect(at().y).toBeCloseTo(4.1);
    handleKey(store, press('Z', { ctrlKey: true, shiftKey: true }));
    expect(at().y).toBeCloseTo(5.1);
    const n = store.getState().doc.items.length;
    handleKey(store, press('d', { metaKey: true }));
    expect(store.getState().doc.items.length).toBe(n + 1);
    handleKey(store, press('Delete'));
    expect(store.getState().doc.items.length).toBe(n);
    expect(handleKey(store, press('q'))).toBe(false);
  });
  it('in feet and inches, arrows nudge 3 in and Shift 1 ft', () => {
    const store = createEditor(parseDocument(base()));
    store.dispatch('setInput', { units: 'imperial' });
    store.dispatch('select', { ids: ['key'] });
    const at = () => store.getState().doc.items.find((i) => i.id === 'key') as { x: number; y: number };
    const x0 = at().x;
    const y0 = at().y;
    // (Positions are kept to the millimetre: 3 in is 76.2 mm.)
    handleKey(store, press('ArrowRight'));
    expect(Math.abs(at().x - x0 - 0.0762)).toBeLessThan(0.0006);
    handleKey(store, press('ArrowUp', { shiftKey: true }));
    expect(Math.abs(at().y - y0 + 0.3048)).toBeLessThan(0.0006);
    // A direct dispatch without a step still moves by metres.
    store.dispatch('nudge', { dx: 0.5, dy: 0 });
    expect(Math.abs(at().x - x0 - 0.5762)).toBeLessThan(0.0011);
  });
});

describe('the key map comes from the actions', () => {
  it('every action shortcut is in the one map, bound to its action', () => {
    for (const [name, a] of Object.entries(actions)) {
      for (const sc of (a as { shortcut?: (string | { keys: string })[] }).shortcut ?? []) {
        const keys = typeof sc === 'string' ? sc : sc.keys;
        expect([...keymap.values()].some((b) => b.action === name), `${name} ${keys}`).toBe(true);
      }
    }
    expect(keymap.get('Mod+z')?.action).toBe('undo');
    expect(keymap.get('Mod+Shift+z')?.action).toBe('redo');
    expect(keymap.get('Shift+ArrowLeft')).toEqual({ action: 'nudge', arg: { dx: -1, dy: 0, step: 'large' } });
  });

  it('camera keys zoom and fit without entering history', () => {
    const e = createEditor(parseDocument(base()));
    e.dispatch('setViewport', { w: 1000, h: 800 });
    const fitted = e.getState().camera!;
    const press = (key: string, mods: Partial<KeyInput> = {}) => e.keys.down({ key, shiftKey: false, ctrlKey: false, metaKey: false, ...mods });
    expect(press('+', { shiftKey: true })).toBe(true);
    expect(e.getState().camera!.scale).toBeCloseTo(fitted.scale * 1.25);
    press('0');
    expect(e.getState().camera).toEqual(fitted);
    expect(e.getState().past.length).toBe(0);
    expect(e.getState().revision).toBe(0);
  });

  it('Space held is input state the select tool reads (it pans)', () => {
    const e = createEditor(parseDocument(base()));
    e.keys.down({ key: ' ', shiftKey: false, ctrlKey: false, metaKey: false });
    expect(e.getState().input.space).toBe(true);
    e.keys.up({ key: ' ', shiftKey: false, ctrlKey: false, metaKey: false });
    expect(e.getState().input.space).toBe(false);
  });
});
