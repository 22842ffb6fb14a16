// A point item's glyph is drawn once at the origin and placed with a translate (a drag rewrites one
// transform): that must draw exactly what the glyph drawn in place draws, for every point kind.
import { describe, expect, it } from 'vitest';
import { sameButPosition, shapeAtOrigin } from '../../../canvas/views/placed';
import { graphiteTheme } from '../../../drawing/theme';
import { demoSetups } from '../../../db/seed-setups';
import { sketchItem } from '../../../drawing/glyphs';
import type { SvgNode } from '../../../drawing/nodes';
import type { Item } from '../../../model/document';
import { createItem, isSegment, kinds, moveItem } from '../../../model/kinds';

const ctx = { theme: graphiteTheme, units: 'metric' as const };
/** The sketch with its outer translate taken off (what is left must not depend on where the item stands). */
function inner(n: SvgNode) {
  const t = String(n.attrs?.transform ?? '');
  const rest = t.replace(/^translate\([^)]*\)\s*/, '');
  return { ...n, attrs: { ...n.attrs, transform: rest || undefined } };
}

const pointItems: Item[] = [
  ...demoSetups.flatMap((d) => d.document.items).filter((i) => !isSegment(i)),
  ...(Object.keys(kinds) as (keyof typeof kinds)[]).map((k) => createItem(k, `new-${k}`, { x: 3.3, y: 2.7 })).filter((i) => !isSegment(i)),
];

describe('a glyph placed by translate', () => {
  it.each(pointItems.map((i) => [`${i.kind} ${i.id}`, i] as const))('%s draws the same at the origin as in place, or is drawn in place', (_n, item) => {
    const inPlace = sketchItem(item, ctx);
    const shape = shapeAtOrigin(null, item, ctx.theme, ctx.units);
    const norm = (n: SvgNode) => JSON.parse(JSON.stringify(n));
    if (!shape.placed) {
      expect(norm(shape.node)).toEqual(norm(inPlace));
      return;
    }
    const { x, y } = item as { x: number; y: number };
    expect(String(inPlace.attrs?.transform)).toMatch(new RegExp(`^translate\\(${x} ${y}\\)`));
    expect(norm(inner(shape.node))).toEqual(norm(inner(inPlace)));
  });

  it('places the glyphs of the kinds drawn about their position (lights among them)', () => {
    const placed = new Set(pointItems.filter((i) => shapeAtOrigin(null, i, ctx.theme, ctx.units).placed).map((i) => i.kind));
    for (const k of ['light', 'subject', 'camera', 'prop', 'note']) expect(placed).toContain(k);
  });

  it('keeps its shape while only the position changes, and redraws it when anything else does', () => {
    const light = demoSetups[0]!.document.items.find((i) => i.kind === 'light')!;
    const first = shapeAtOrigin(null, light, ctx.theme, ctx.units);
    const moved = moveItem(light, 0.5, -0.25);
    expect(sameButPosition(light, moved)).toBe(true);
    expect(shapeAtOrigin(first, moved, ctx.theme, ctx.units)).toBe(first);
    const turned = { ...moved, aimDeg: (moved as { aimDeg: number }).aimDeg + 10 } as Item;
    expect(sameButPosition(moved, turned)).toBe(false);
    expect(shapeAtOrigin(first, turned, ctx.theme, ctx.units)).not.toBe(first);
    expect(shapeAtOrigin(first, { ...moved, label: 'Other' } as Item, ctx.theme, ctx.units)).not.toBe(first);
  });
});
