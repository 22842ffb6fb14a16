// Only a deliberate choice opens an item's settings (the phone's sheet switches to the item on it): a tap on
// the item, again on one already selected, or a choice by name. A drag, an undo or redo, a box, a long press
// and a selection made by the program change the selection but open nothing.
import { describe, expect, it } from 'vitest';
import { createEditor, type Editor } from '../../../canvas/editor/editor';
import { demoSetups } from '../../../db/seed-setups';

type P = { x: number; y: number };
const scr = (p: P) => ({ x: p.x * 100, y: p.y * 100 });
function fresh(wide = false) {
  const e = createEditor(demoSetups[0]!.document);
  e.dispatch('setCamera', { camera: { scale: 100, tx: 0, ty: 0 } });
  e.dispatch('setInput', { boxSelect: wide });
  const opened: string[] = [];
  e.opens.subscribe((id) => opened.push(id));
  return { e, opened };
}
const keyAt = (e: Editor) => {
  const k = e.getState().doc.items.find((i) => i.id === 'key') as { x: number; y: number };
  return { x: k.x, y: k.y + 0.1 };
};
function drag(e: Editor, from: P, to: P, pointer: 'mouse' | 'touch' = 'touch') {
  e.pointer.down({ screen: scr(from), pointer });
  for (let k = 1; k <= 5; k++) e.pointer.move({ screen: scr({ x: from.x + ((to.x - from.x) * k) / 5, y: from.y + ((to.y - from.y) * k) / 5 }), pointer });
  e.pointer.up({ screen: scr(to), pointer });
}

describe('requests to open an item', () => {
  it('a tap on an item asks to open it, and a tap on it again asks again', () => {
    const { e, opened } = fresh();
    e.pointer.tap({ screen: scr(keyAt(e)), pointer: 'touch' });
    expect(e.getState().selection).toEqual(['key']);
    expect(opened).toEqual(['key']);
    e.pointer.tap({ screen: scr(keyAt(e)), pointer: 'touch' });
    expect(opened).toEqual(['key', 'key']);
  });

  it('a tap on empty space clears the selection and opens nothing', () => {
    const { e, opened } = fresh();
    e.pointer.tap({ screen: scr({ x: 0.2, y: 0.2 }), pointer: 'touch' });
    expect(e.getState().selection).toEqual([]);
    expect(opened).toEqual([]);
  });

  it('a drag selects and moves the item but opens nothing; neither do undo and redo', () => {
    const { e, opened } = fresh();
    const from = keyAt(e);
    drag(e, from, { x: from.x + 1, y: from.y });
    expect(e.getState().selection).toEqual(['key']);
    e.dispatch('clearSelection');
    e.dispatch('undo');
    e.dispatch('redo');
    e.dispatch('undo');
    expect(opened).toEqual([]);
  });

  it('a box, a long press and a programmatic selection open nothing', () => {
    const { e, opened } = fresh(true);
    drag(e, { x: 0.1, y: 0.1 }, { x: 7.9, y: 5.9 }, 'mouse');
    expect(e.getState().selection.length).toBeGreaterThan(1);
    e.dispatch('clearSelection');
    e.pointer.hold({ screen: scr(keyAt(e)), pointer: 'touch' });
    expect(e.getState().selection).toEqual(['key']);
    e.dispatch('select', { ids: ['key'] });
    e.dispatch('placeItem', { kind: 'light' });
    expect(opened).toEqual([]);
  });

  it('a long press that adds a second item to the selection opens neither', () => {
    const { e, opened } = fresh();
    e.pointer.tap({ screen: scr(keyAt(e)), pointer: 'touch' });
    opened.length = 0;
    const other = e.getState().doc.items.find((i) => i.kind === 'subject') as { x: number; y: number };
    e.pointer.hold({ screen: scr(other), pointer: 'touch' });
    expect(e.getState().selection.length).toBe(2);
    expect(opened).toEqual([]);
  });
});
