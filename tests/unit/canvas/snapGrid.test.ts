// The snapping grid follows the zoom: a step never under GRID_MIN_PX on screen, so a finger lands where it
// means at any zoom — 0.5 m on a phone showing the whole stage, finer zoomed in, coarser zoomed out.
import { describe, expect, it } from 'vitest';
import { createEditor } from '../../../canvas/editor/editor';
import { fitStage, MAX_SCALE, MIN_SCALE } from '../../../canvas/editor/camera';
import { GRID_MIN_PX, GRID_STEP_M, GRID_STEPS_M, gridStepM, snapPoint } from '../../../canvas/editor/snap';
import { emptyDocument } from '../../../model/document';
import { createItem } from '../../../model/kinds';

const onGrid = (v: number, step: number) => Math.abs(v / step - Math.round(v / step)) < 1e-6;

/** An editor on an empty 8 × 6 m stage with one light, its view at the given zoom. */
function editorAt(scale: number) {
  const doc = emptyDocument();
  const e = createEditor({ ...doc, items: [createItem('light', 'key', { x: 2.13, y: 2.21 })] });
  e.dispatch('setCamera', { camera: { scale, tx: 0, ty: 0 } });
  return e;
}
/** Drag from one plan point to another by touch in ten moves. */
function drag(e: ReturnType<typeof editorAt>, from: { x: number; y: number }, to: { x: number; y: number }) {
  const k = e.getState().camera!.scale;
  e.pointer.down({ screen: { x: from.x * k, y: from.y * k }, pointer: 'touch' });
  for (let n = 1; n <= 10; n++) e.pointer.move({ screen: { x: (from.x + ((to.x - from.x) * n) / 10) * k, y: (from.y + ((to.y - from.y) * n) / 10) * k }, pointer: 'touch' });
  e.pointer.up({ screen: { x: to.x * k, y: to.y * k }, pointer: 'touch' });
}

describe('the snapping grid', () => {
  it('is 0.5 m on a phone at "fit", finer zoomed in and coarser zoomed out', () => {
    const phoneFit = fitStage({ widthM: 8, depthM: 6 }, 390, 844 - 132 - 60).scale;
    expect(gridStepM(phoneFit)).toBe(0.5);
    expect(gridStepM(phoneFit * 2)).toBe(0.25);
    expect(gridStepM(phoneFit * 5)).toBe(0.1);
    expect(gridStepM(phoneFit / 2)).toBe(1);
    expect(gridStepM(MAX_SCALE)).toBe(0.05);
    expect(gridStepM(null)).toBe(GRID_STEP_M);
  });

  it('never shrinks as the view zooms out, and a step stays at least GRID_MIN_PX on screen', () => {
    let last = 0;
    for (let scale = MIN_SCALE; scale <= MAX_SCALE; scale *= 1.07) {
      const step = gridStepM(scale);
      expect(step).toBeGreaterThan(0);
      if (last) expect(step).toBeLessThanOrEqual(last + 1e-9);
      else last = step;
      last = step;
      if (step !== 5) expect(step * scale).toBeGreaterThanOrEqual(GRID_MIN_PX);
      // The next finer step would be under a finger's reach.
      const finer = GRID_STEPS_M[GRID_STEPS_M.indexOf(step as (typeof GRID_STEPS_M)[number]) - 1];
      if (finer) expect(finer * scale).toBeLessThan(GRID_MIN_PX);
    }
  });

  it('snaps a point to the step it is given, without float dust', () => {
    expect(snapPoint({ x: 2.13, y: 2.38 }, [], new Set(), 0.5)).toEqual({ x: 2, y: 2.5 });
    expect(snapPoint({ x: 0.29, y: 0.31 }, [], new Set(), 0.1)).toEqual({ x: 0.3, y: 0.3 });
  });

  it('a drag on the plan lands on the grid of the zoom it was made at', () => {
    const coarse = editorAt(42);
    drag(coarse, { x: 2.13, y: 2.21 }, { x: 3.37, y: 3.61 });
    const a = coarse.getState().doc.items[0] as { x: number; y: number };
    expect(a).toMatchObject({ x: 3.5, y: 3.5 });
    const fine = editorAt(220);
    drag(fine, { x: 2.13, y: 2.21 }, { x: 3.37, y: 3.61 });
    const b = fine.getState().doc.items[0] as { x: number; y: number };
    expect(onGrid(b.x, 0.1) && onGrid(b.y, 0.1)).toBe(true);
    expect(b).toMatchObject({ x: 3.4, y: 3.6 });
  });

  it('a wall drawn at the phone\'s zoom has both ends on its grid', () => {
    const e = editorAt(42);
    e.dispatch('setTool', { tool: 'wall' });
    drag(e, { x: 1.2, y: 0.9 }, { x: 6.1, y: 1.15 });
    const wall = e.getState().doc.items.find((i) => i.kind === 'wall') as unknown as { a: { x: number; y: number }; b: { x: number; y: number } };
    expect(wall.a).toEqual({ x: 1, y: 1 });
    expect(wall.b).toEqual({ x: 6, y: 1 });
  });
});
