// The tools, headless: a real editor with its camera at 100 px to the metre, pointer events in screen
// pixels, the tool's state and the editor's state checked after each.
import { describe, expect, it } from 'vitest';
import { createEditor, type Editor } from '../../../canvas/editor/editor';
import { demoSetups } from '../../../db/seed-setups';
import { rotateHandleOf } from '../../../model/kinds';
import { liveDoc, liveItem } from '../../../canvas/editor/state';

type P = { x: number; y: number };
const scr = (p: P) => ({ x: p.x * 100, y: p.y * 100 });
const at = (e: Editor, id: string) => e.getState().doc.items.find((i) => i.id === id) as any;
function fresh(o: { readOnly?: boolean; wide?: boolean } = {}) {
  const e = createEditor(demoSetups[0]!.document, { readOnly: o.readOnly });
  e.dispatch('setCamera', { camera: { scale: 100, tx: 0, ty: 0 } });
  e.dispatch('setInput', { boxSelect: o.wide ?? true });
  return e;
}
const pointer = (e: Editor) => (e.getState().input.boxSelect ? 'mouse' : 'touch') as 'mouse' | 'touch';

/** Press at `from`, move in ten steps to `to`, release; returns the tool state seen mid-gesture. */
function drag(e: Editor, from: P, to: P) {
  e.pointer.down({ screen: scr(from), pointer: pointer(e) });
  const tool = e.activeTool();
  const mid: string[] = [tool.state.name];
  for (let k = 1; k <= 10; k++) {
    e.pointer.move({ screen: scr({ x: from.x + ((to.x - from.x) * k) / 10, y: from.y + ((to.y - from.y) * k) / 10 }), pointer: pointer(e) });
    mid.push(tool.state.name);
  }
  const gestureDuring = e.getState().gesture;
  e.pointer.up({ screen: scr(to), pointer: pointer(e) });
  return { state: mid[0], gestureDuring, after: tool.state.name };
}

describe('the select tool', () => {
  it('a press on an item selects it and a drag moves it, as one undo step; the gesture is open until release', () => {
    const e = fresh();
    const r = drag(e, { x: 4, y: 4.1 }, { x: 5, y: 4.1 });
    expect(r.state).toBe('dragging');
    expect(r.gestureDuring).toMatch(/^drag-/);
    expect(r.after).toBe('idle');
    expect(e.getState().gesture).toBeNull();
    expect(e.getState().selection).toEqual(['key']);
    expect(at(e, 'key').x).toBeCloseTo(5);
    expect(e.getState().past.length).toBe(1);
  });

  it('a drag holds its moves beside the document until release: the dragged item follows, the document, history and revision change once, at release', () => {
    const e = fresh();
    const before = e.getState();
    e.pointer.down({ screen: scr({ x: 4, y: 4.1 }), pointer: 'mouse' });
    const pressed = e.getState();
    for (let k = 1; k <= 10; k++) e.pointer.move({ screen: scr({ x: 4 + k * 0.1, y: 4.1 }), pointer: 'mouse' });
    const mid = e.getState();
    expect(mid.doc).toBe(before.doc); // panels reading the document do not re-render per move
    expect(mid.revision).toBe(pressed.revision);
    expect(mid.past.length).toBe(0);
    expect(liveItem(mid, 'key')).toMatchObject({ x: 5 }); // the glyph, its beam and handles follow
    expect(liveItem(mid, 'rimL')).toBe(mid.doc.items.find((i) => i.id === 'rimL')); // the others are the document's own
    expect(liveDoc(mid).items.find((i) => i.id === 'key')).toMatchObject({ x: 5 }); // what the meter reads
    e.pointer.up({ screen: scr({ x: 5, y: 4.1 }), pointer: 'mouse' });
    const after = e.getState();
    expect(after.drag).toBeNull();
    expect(after.doc).toBe(liveDoc(mid)); // the document the drag showed last, as it was
    expect(at(e, 'key').x).toBeCloseTo(5);
    expect(after.revision).toBe(pressed.revision + 1);
    expect(after.past.length).toBe(1);
  });

  it('a press on the rotate handle of the selected item turns it', () => {
    const e = fresh();
    e.dispatch('select', { ids: ['cam'] });
    const h = rotateHandleOf(at(e, 'cam'))!;
    const r = drag(e, h, { x: 5.4, y: 5.4 });
    // A camera's (and a light's) turn is taken by its aim handle at the same place (tools/handles.ts).
    expect(r.state).toBe('aiming');
    expect(at(e, 'cam').aimDeg).toBe(0);
    expect(e.getState().past.length).toBe(1);
  });

  it('at a small zoom, a press on the selected item itself moves it rather than turning it', () => {
    const e = fresh({ wide: false });
    e.dispatch('setCamera', { camera: { scale: 30, tx: 0, ty: 0 } });
    e.dispatch('select', { ids: ['key'] });
    e.pointer.down({ screen: { x: 4 * 30, y: 4.1 * 30 }, pointer: 'touch' });
    expect(e.activeTool().state.name).toBe('dragging');
    e.pointer.up({ screen: { x: 0, y: 0 }, pointer: 'touch' });
  });

  it('empty space draws a selection box with a mouse on a wide screen', () => {
    const e = fresh();
    const r = drag(e, { x: 3.5, y: 3.0 }, { x: 4.5, y: 4.5 });
    expect(r.state).toBe('boxing');
    expect(e.getState().box).toBeNull();
    expect(new Set(e.getState().selection)).toEqual(new Set(['sitter', 'stool', 'key', 'under']));
  });

  it('empty space pans on touch, moving the camera and not the history', () => {
    const e = fresh({ wide: false });
    const r = drag(e, { x: 0.5, y: 0.5 }, { x: 1.5, y: 0.5 });
    expect(r.state).toBe('panning');
    expect(e.getState().camera!.tx).toBeCloseTo(100);
    expect(e.getState().past.length).toBe(0);
  });

  it('Space held pans even over an item', () => {
    const e = fresh();
    e.keys.down({ key: ' ', shiftKey: false, ctrlKey: false, metaKey: false });
    const r = drag(e, { x: 4, y: 4.1 }, { x: 5, y: 4.1 });
    expect(r.state).toBe('panning');
    expect(at(e, 'key').x).toBe(4);
  });

  it('a tap on empty space clears the selection; a long press adds to it; the topmost item wins', () => {
    const e = fresh();
    e.pointer.tap({ screen: scr({ x: 4, y: 4.1 }), pointer: 'mouse' });
    e.pointer.hold({ screen: scr({ x: 4, y: 5.4 }), pointer: 'touch' });
    expect(e.getState().selection).toEqual(['key', 'cam']);
    e.pointer.tap({ screen: scr({ x: 0.3, y: 0.3 }), pointer: 'mouse' });
    expect(e.getState().selection).toEqual([]);
  });

  it('in a step view a press reaches only the items shown', () => {
    const e = fresh({ wide: false });
    e.dispatch('setVisible', { ids: new Set(e.getState().doc.items.filter((i) => i.id !== 'key').map((i) => i.id)) });
    drag(e, { x: 4, y: 4.1 }, { x: 5, y: 4.1 });
    expect(e.getState().selection).not.toContain('key');
    expect(at(e, 'key').x).toBe(4);
    e.dispatch('clearSelection');
    e.pointer.tap({ screen: scr({ x: 4, y: 4.1 }), pointer: 'mouse' });
    expect(e.getState().selection).not.toContain('key');
  });

  it('crew can select but not move', () => {
    const e = fresh({ readOnly: true });
    drag(e, { x: 4, y: 4.1 }, { x: 5, y: 4.1 });
    expect(at(e, 'key').x).toBe(4);
    expect(e.getState().selection).toEqual(['key']);
  });
});

describe('the wall tool', () => {
  it('a drag draws a wall and goes back to selecting', () => {
    const e = fresh();
    e.dispatch('setTool', { tool: 'wall' });
    const n = e.getState().doc.items.length;
    const r = drag(e, { x: 1, y: 1 }, { x: 1, y: 5 });
    expect(r.state).toBe('drawing');
    const wall = e.getState().doc.items[n] as any;
    expect(wall.kind).toBe('wall');
    expect(wall.a).toEqual({ x: 1, y: 1 });
    expect(wall.b).toEqual({ x: 1, y: 5 });
    expect(e.getState().tool).toBe('select');
    e.dispatch('undo');
    expect(e.getState().doc.items.length).toBe(n);
  });

  it('the wall follows the hand while the document keeps its start until release', () => {
    const e = fresh();
    e.dispatch('setTool', { tool: 'wall' });
    const n = e.getState().doc.items.length;
    e.pointer.down({ screen: scr({ x: 1, y: 1 }), pointer: 'mouse' });
    for (let k = 1; k <= 4; k++) e.pointer.move({ screen: scr({ x: 1, y: 1 + k }), pointer: 'mouse' });
    const s = e.getState();
    const id = s.selection[0]!;
    expect((s.doc.items[n] as any).b).toEqual({ x: 1, y: 1 });
    expect((liveItem(s, id) as any).b).toEqual({ x: 1, y: 5 });
    e.pointer.up({ screen: scr({ x: 1, y: 5 }), pointer: 'mouse' });
    expect((e.getState().doc.items[n] as any).b).toEqual({ x: 1, y: 5 });
    expect(e.getState().past.length).toBe(1); // the start and the drawing out: one step
  });

  it('a press without a drag leaves nothing', () => {
    const e = fresh();
    e.dispatch('setTool', { tool: 'wall' });
    const n = e.getState().doc.items.length;
    drag(e, { x: 1, y: 1 }, { x: 1.02, y: 1 });
    expect(e.getState().doc.items.length).toBe(n);
    expect(e.getState().drag).toBeNull();
    expect(e.getState().past.length).toBe(0);
  });
});

describe('the camera', () => {
  it('fits the stage on the first size, zooms about a point, and loading a document keeps it', () => {
    const e = createEditor(demoSetups[0]!.document);
    expect(e.getState().camera).toBeNull();
    e.dispatch('setViewport', { w: 800, h: 600 });
    const fitted = e.getState().camera!;
    expect(fitted.scale).toBeGreaterThan(0);
    e.dispatch('zoom', { factor: 2, at: { x: 100, y: 100 } });
    const z = e.getState().camera!;
    expect(z.scale).toBeCloseTo(fitted.scale * 2);
    // The plan point under (100, 100) stays there.
    expect((100 - z.tx) / z.scale).toBeCloseTo((100 - fitted.tx) / fitted.scale);
    e.load(demoSetups[0]!.document);
    expect(e.getState().camera).toEqual(z);
    expect(e.getState().past.length).toBe(0);
  });
});
