// The drag layer, headless: a real editor, its autosave with a scripted client, and views that record what
// they were told. A drag reaches the moved item's views (a shift, or the live item to draw afresh) and no
// other item's; the document, history and autosave change once, at release, when every view is reset; the web
// writer turns that into one transform attribute or a fresh drawing in the preview group.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createDragLayer, offsetOf, type Offset } from '../../../canvas/dragLayer';
import { writeItem, type DomLike } from '../../../canvas/dragViews';
import { createEditor, type Editor } from '../../../canvas/editor/editor';
import { AUTOSAVE_DELAY_MS, createPersist, type PersistClient, type SaveBody } from '../../../canvas/editor/persist';
import { itemById } from '../../../canvas/editor/state';
import { demoSetups } from '../../../db/seed-setups';
import type { Item } from '../../../model/document';
import { sketchItem } from '../../../drawing/glyphs';
import { graphiteTheme } from '../../../drawing/theme';

const doc = demoSetups[0]!.document;
const setup = { id: 's1', version: 1, studioId: 'st1', title: 'Twin rims', notes: '', document: doc };
const item = (e: Editor, id: string) => itemById(e.getState(), id)!;

function fresh() {
  const e = createEditor(doc);
  e.dispatch('setCamera', { camera: { scale: 100, tx: 0, ty: 0 } });
  e.dispatch('setInput', { boxSelect: true });
  e.dispatch('toggleSnap');
  return e;
}

function savingClient() {
  const calls: SaveBody[] = [];
  let version = 1;
  const c: PersistClient = {
    save: async (_id, body) => {
      calls.push(body);
      return { version: ++version };
    },
    createCopy: async () => ({ id: 'copy' }),
  };
  return { c, calls };
}

beforeEach(() => vi.useFakeTimers());
afterEach(() => vi.useRealTimers());

describe('offsetOf', () => {
  const key = doc.items.find((i) => i.id === 'key')! as Item & { x: number; y: number; aimDeg: number };
  const as = (o: object) => o as Item;
  it('is the shift of an item that only moved', () => {
    expect(offsetOf(key, as({ ...key, x: key.x + 0.5, y: key.y - 0.25 }))).toEqual({ dx: 0.5, dy: -0.25 });
  });
  it('is null when the item turned or changed beside moving', () => {
    expect(offsetOf(key, as({ ...key, aimDeg: key.aimDeg + 10 }))).toBeNull();
    expect(offsetOf(key, as({ ...key, x: key.x + 1, label: 'Moved and renamed' }))).toBeNull();
  });
  it('shifts a segment only when both ends moved alike', () => {
    const wall = { id: 'w', kind: 'wall', a: { x: 0, y: 0 }, b: { x: 2, y: 0 }, colour: '#ffffff' } as unknown as Item;
    const shifted = { ...wall, a: { x: 1, y: 1 }, b: { x: 3, y: 1 } } as Item;
    const stretched = { ...wall, b: { x: 3, y: 0 } } as Item;
    expect(offsetOf(wall, shifted)).toEqual({ dx: 1, dy: 1 });
    expect(offsetOf(wall, stretched)).toBeNull();
  });
});

describe('a drag through the drag layer', () => {
  it('reaches the dragged item’s views every move and no other; history and autosave change once, at release', async () => {
    const e = fresh();
    const { c, calls } = savingClient();
    const persist = createPersist(e, { setup, client: c });
    const layer = createDragLayer(e);
    const seen = new Map<string, { live: Item | null; offset: Offset | null }[]>();
    for (const i of doc.items)
      layer.item(i.id, (live, offset) => {
        if (!seen.has(i.id)) seen.set(i.id, []);
        seen.get(i.id)!.push({ live, offset });
      });
    const groups: { ids: string[] | null; offset: Offset | null }[] = [];
    layer.group((moved, offset) => groups.push({ ids: moved ? [...moved.keys()] : null, offset }));
    const before = item(e, 'key') as Item & { x: number; y: number };
    const pastBefore = e.getState().past.length;

    const from = { x: before.x * 100, y: before.y * 100 };
    e.pointer.down({ screen: from, pointer: 'mouse' });
    const MOVES = 30;
    for (let k = 1; k <= MOVES; k++) e.pointer.move({ screen: { x: from.x + 4 * k, y: from.y + 2 * k }, pointer: 'mouse' });
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 3);
    // While the hand is down: the key's views heard every move, as a shift; the document, history and the
    // server did not change.
    const keyViews = seen.get('key')!;
    expect(keyViews).toHaveLength(MOVES);
    expect(keyViews.at(-1)!.offset!.dx).toBeCloseTo(1.2);
    expect(keyViews.at(-1)!.offset!.dy).toBeCloseTo(0.6);
    expect([...seen.keys()]).toEqual(['key']);
    expect(groups.at(-1)).toEqual({ ids: ['key'], offset: keyViews.at(-1)!.offset });
    expect(item(e, 'key')).toBe(before);
    expect(e.getState().past.length).toBe(pastBefore);
    expect(calls).toHaveLength(0);

    e.pointer.up({ screen: { x: from.x + 4 * MOVES, y: from.y + 2 * MOVES }, pointer: 'mouse' });
    // At release: the views are told to show the document again, which now has the move, as one history step,
    // saved at once (not after the debounce).
    expect(keyViews.at(-1)).toEqual({ live: null, offset: null });
    expect(groups.at(-1)).toEqual({ ids: null, offset: null });
    expect((item(e, 'key') as unknown as { x: number }).x).toBeCloseTo(before.x + 1.2);
    expect(e.getState().past.length).toBe(pastBefore + 1);
    await vi.advanceTimersByTimeAsync(1);
    expect(calls).toHaveLength(1);
    expect((calls[0]!.document!.items.find((i) => i.id === 'key') as unknown as { x: number }).x).toBeCloseTo(before.x + 1.2);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 3);
    expect(calls).toHaveLength(1);
    expect(seen.get('key')).toHaveLength(MOVES + 1);

    // Undo takes the whole drag back in one step.
    e.dispatch('undo');
    expect(item(e, 'key')).toBe(before);
    persist.dispose();
    layer.dispose();
  });

  it('hands a turned light to its views to draw afresh, and a view registered mid-drag catches up', () => {
    const e = fresh();
    const layer = createDragLayer(e);
    e.dispatch('select', { ids: ['key'] });
    const key = item(e, 'key') as Item & { x: number; y: number };
    e.dispatch('setGesture', { gesture: 'aim-test' });
    e.dispatch('aimAt', { id: 'key', at: { x: key.x, y: key.y + 2 }, gestureKey: 'aim-test', live: true });
    const heard: { live: Item | null; offset: Offset | null }[] = [];
    layer.item('key', (live, offset) => heard.push({ live, offset }));
    expect(heard).toHaveLength(1);
    expect(heard[0]!.offset).toBeNull();
    expect((heard[0]!.live as unknown as { aimDeg: number }).aimDeg).toBeCloseTo(90);
    e.dispatch('setGesture', { gesture: null });
    expect(heard.at(-1)).toEqual({ live: null, offset: null });
    expect((item(e, 'key') as unknown as { aimDeg: number }).aimDeg).toBeCloseTo(90);
    layer.dispose();
  });
});

describe('the web writer', () => {
  const node = () => {
    const attrs = new Map<string, string>();
    const el: DomLike & { attrs: Map<string, string> } = { attrs, innerHTML: '', setAttribute: (k, v) => void attrs.set(k, v), removeAttribute: (k) => void attrs.delete(k) };
    return el;
  };
  const key = doc.items.find((i) => i.id === 'key')!;
  const draw = (i: Item) => sketchItem(i, { theme: graphiteTheme, units: 'metric' });

  it('shifts the drawing with one transform, draws a changed item in the preview, and puts it all back', () => {
    const shell = node();
    const preview = node();
    writeItem(shell, preview, key, { dx: 0.5, dy: 0.25 }, draw);
    expect(shell.attrs.get('transform')).toBe('translate(0.5 0.25)');
    expect(preview.innerHTML).toBe('');
    writeItem(shell, preview, { ...key, aimDeg: 10 } as Item, null, draw);
    expect(shell.attrs.get('display')).toBe('none');
    expect(preview.innerHTML).toMatch(/^<g transform="translate\([\d.]+ [\d.]+\)/);
    writeItem(shell, preview, null, null, draw);
    expect(shell.attrs.size).toBe(0);
    expect(preview.innerHTML).toBe('');
  });
});
