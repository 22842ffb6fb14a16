import { describe, expect, it } from 'vitest';
import { createEditor } from '../../../canvas/editor/editor';
import { GRID_MIN_PX, gridMajorM, gridStepM, snapPoint } from '../../../canvas/editor/snap';
import { demoSetups } from '../../../db/seed-setups';
import { sketchGrid } from '../../../drawing/plan';
import { graphiteTheme } from '../../../drawing/theme';
import { M_PER_FT } from '../../../model/units';

const IN = M_PER_FT / 12;

describe('a grid in feet and inches', () => {
  it('snaps to inches and feet at the zoom, the finest step still a finger wide', () => {
    // A phone showing the whole 8 m stage (about 42 px/m): 2 ft (metric: 0.5 m); a wide screen (about 90 px/m):
    // 1 ft (metric 0.25 m); zoomed in (300 px/m): 3 in.
    expect(gridStepM(42, 'imperial')).toBeCloseTo(2 * M_PER_FT, 12);
    expect(gridStepM(90, 'imperial')).toBeCloseTo(M_PER_FT, 12);
    expect(gridStepM(300, 'imperial')).toBeCloseTo(3 * IN, 12);
    expect(gridStepM(42, 'metric')).toBe(0.5);
    for (const scale of [5, 20, 42, 90, 300, 2000]) expect(gridStepM(scale, 'imperial') * scale).toBeGreaterThanOrEqual(scale > 5 ? GRID_MIN_PX : 0);
    const p = snapPoint({ x: 2.45, y: 1.0 }, [], new Set(), gridStepM(90, 'imperial'));
    // 2.45 m is 8.04 ft: the nearest foot is 8 ft exactly (2.4384 m); 1.0 m is 3.28 ft: 3 ft (0.9144 m).
    expect(p.x).toBeCloseTo(8 * M_PER_FT, 4);
    expect(p.y).toBeCloseTo(3 * M_PER_FT, 4);
  });

  it('a drag in an editor set to feet lands on whole feet at that zoom', () => {
    const e = createEditor(demoSetups[0]!.document);
    e.dispatch('setCamera', { camera: { scale: 90, tx: 0, ty: 0 } });
    e.dispatch('setInput', { units: 'imperial' });
    const key = e.getState().doc.items.find((i) => i.id === 'key') as unknown as { x: number; y: number };
    e.pointer.down({ screen: { x: key.x * 90, y: key.y * 90 }, pointer: 'mouse' });
    e.pointer.move({ screen: { x: key.x * 90 + 37, y: key.y * 90 + 11 }, pointer: 'mouse' });
    e.pointer.up({ screen: { x: key.x * 90 + 37, y: key.y * 90 + 11 }, pointer: 'mouse' });
    const moved = e.getState().doc.items.find((i) => i.id === 'key') as unknown as { x: number; y: number };
    expect(moved.x).not.toBeCloseTo(key.x, 3);
    for (const v of [moved.x, moved.y]) expect(Math.abs(v / M_PER_FT - Math.round(v / M_PER_FT))).toBeLessThan(1e-3);
  });

  it('draws its lines on the snapping steps, heavier on whole feet', () => {
    const stage = { widthM: 8 * M_PER_FT, depthM: 6 * M_PER_FT } as Parameters<typeof sketchGrid>[0];
    const node = sketchGrid(stage, graphiteTheme, 'none', 6 * IN, gridMajorM('imperial'));
    const lines = node.children!.slice(1).map((c) => c.attrs).filter((p) => p.y1 === 0 && p.y2 !== 0);
    expect(lines.length).toBe(17); // 0 to 8 ft every 6 in
    const heavy = lines.filter((p) => p.stroke === graphiteTheme.gridMajor).map((p) => Number(p.x1) / M_PER_FT);
    expect(heavy.map((f) => Math.round(f * 1000) / 1000)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8]);
  });
});
