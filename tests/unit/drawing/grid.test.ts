// The plan's grid draws the step a drag snaps to at the view's zoom (canvas/editor/snap.ts gridStepM), heavier on
// whole metres, so a finger lands on a line it can see; exports keep the 0.5 m grid.
import { describe, expect, it } from 'vitest';
import { gridStepM } from '../../../canvas/editor/snap';
import { sketchGrid } from '../../../drawing/plan';
import { graphiteTheme } from '../../../drawing/theme';
import type { SvgNode } from '../../../drawing/nodes';

const theme = graphiteTheme;
const stage = { widthM: 8, depthM: 6 };
const lines = (n: SvgNode) => (n.children ?? []).filter((c) => c.tag === 'line');
const verticals = (n: SvgNode) => lines(n).filter((l) => l.attrs.x1 === l.attrs.x2 && l.attrs.y1 === 0).map((l) => ({ x: l.attrs.x1 as number, major: l.attrs.stroke === theme.gridMajor }));

describe('the plan grid', () => {
  it('exports keep 0.5 m lines with whole metres heavier', () => {
    const v = verticals(sketchGrid(stage, theme));
    expect(v.map((l) => l.x)).toEqual(Array.from({ length: 17 }, (_, k) => k * 0.5));
    expect(v.filter((l) => l.major).map((l) => l.x)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8]);
    expect(lines(sketchGrid(stage, theme))).toHaveLength(17 + 13);
  });
  it('draws the snapping step of a wide view (0.25 m), whole metres heavier', () => {
    const step = gridStepM(100); // about a 1440-wide window showing the stage
    expect(step).toBe(0.25);
    const v = verticals(sketchGrid(stage, theme, 'none', step));
    expect(v).toHaveLength(33);
    expect(v[5]).toEqual({ x: 1.25, major: false });
    expect(v[8]).toEqual({ x: 2, major: true });
  });
  it('zoomed far in, draws no finer than 5 cm (at most 160 lines along 8 m)', () => {
    expect(gridStepM(3000)).toBe(0.01);
    expect(verticals(sketchGrid(stage, theme, 'none', gridStepM(3000)))).toHaveLength(161);
  });
  it('zoomed far out, every line is a heavy one', () => {
    const v = verticals(sketchGrid(stage, theme, 'none', gridStepM(12)));
    expect(v.map((l) => l.x)).toEqual([0, 2, 4, 6, 8]);
    expect(v.every((l) => l.major)).toBe(true);
  });
});
