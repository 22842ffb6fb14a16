// The meter engine hands the page a light map with its contours already traced as SVG paths (and the wall
// tones), so the page only draws them.
import { describe, expect, it } from 'vitest';
import { defaultEngine } from '../../../canvas/meter/engine';
import { lightMapNodes } from '../../../canvas/meter/mapNodes';
import { demoSetups } from '../../../db/seed-setups';

describe('the light map reaches the page ready to draw', () => {
  it('carries contour paths and wall tones; the layer draws those paths as they are', async () => {
    const engine = defaultEngine();
    const doc = demoSetups.find((d) => d.title.startsWith('Teal'))!.document;
    const r = await engine.compute({ doc, lightMap: true });
    engine.dispose();
    const map = r.map!;
    expect(map.contourPaths.length).toBeGreaterThan(2);
    expect(map.contourPaths.every((p) => /^M[-\d.]+,[-\d.]+(?:[LM][-\d.]+,[-\d.]+)*$/.test(p.d))).toBe(true);
    expect(map.contourPaths.map((p) => p.stops)).toContain(0);
    expect(map.walls.length).toBeGreaterThan(0);
    const node = lightMapNodes(map, '#fff');
    const ds: string[] = [];
    const walk = (n: { tag: string; attrs: Record<string, unknown>; children?: unknown[] }) => {
      if (n.tag === 'path') ds.push(String(n.attrs.d));
      expect(n.tag).not.toBe('polyline');
      for (const c of n.children ?? []) walk(c as never);
    };
    walk(node);
    expect(ds).toEqual(map.contourPaths.map((p) => p.d));
  });
});
