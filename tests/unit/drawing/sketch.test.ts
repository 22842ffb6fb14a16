// Plan sketches: every kind draws, with no NaN, and writes out as well-formed SVG.
import { describe, expect, it } from 'vitest';
import { graphiteTheme, paperTheme } from '../../../drawing/theme';
import { sketchItem } from '../../../drawing/glyphs';
import { sketchPlan } from '../../../drawing/plan';
import { nodeToSvg, svgDocument } from '../../../drawing/toSvg';
import { demoSetups } from '../../../db/seed-setups';
import { createItem, kindOrder } from '../../../model/kinds';

describe('sketches', () => {
  it.each(kindOrder)('%s draws in both themes (its label is not part of the glyph: drawing/labels.ts places it)', (kind) => {
    for (const theme of [graphiteTheme, paperTheme]) {
      const svg = nodeToSvg(sketchItem({ ...createItem(kind, 'x', { x: 1, y: 2 }), label: 'A & B <c>' } as never, { theme, units: 'imperial' }));
      expect(svg).not.toMatch(/NaN|undefined|Infinity/);
      expect(svg.startsWith('<g')).toBe(true);
      expect(svg).not.toContain('A &amp; B &lt;c&gt;');
    }
  });

  it('writes a whole plan as an SVG document with balanced tags', () => {
    const doc = demoSetups[1]!.document;
    const { root, viewBox } = sketchPlan(doc, { theme: paperTheme, units: 'metric', pxPerM: 100 });
    const svg = svgDocument(root, { width: 900, height: 700, viewBox, background: '#fff' });
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg" width="900" height="700"')).toBe(true);
    const opens = (svg.match(/<g[ >]/g) ?? []).length;
    const closes = (svg.match(/<\/g>/g) ?? []).length;
    expect(opens).toBe(closes);
    expect(svg).toContain('stroke-width=');
    expect(svg).toContain('viewBox="-0.5 -0.5 9 7"');
    for (const l of doc.items.filter((i) => i.kind === 'light')) expect(svg).toContain(l.label);
  });
});

describe('light ink', () => {
  it('draws colour-correction and pale gels in the theme ink on paper, strong gels in their colour', async () => {
    const { lightInk } = await import('../../../drawing/glyphs');
    expect(lightInk('quarter-cto', paperTheme)).toBe(paperTheme.light);
    expect(lightInk('half-plus-green', paperTheme)).toBe(paperTheme.light);
    expect(lightInk('teal', paperTheme)).toBe('#2ae6d2');
    expect(lightInk('none', graphiteTheme)).toBe(graphiteTheme.light);
    expect(lightInk('half-plus-green', graphiteTheme)).toBe('#eaffe3');
  });
});
