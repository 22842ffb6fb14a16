// The web's glyphs (components/Glyph.web.tsx) draw the same shapes as the phones' (glyphShapes.ts) with the
// browser's own SVG elements.
import { createRequire } from 'node:module';
import { createElement, type ReactElement } from 'react';
import { describe, expect, it } from 'vitest';
import { Mark, NavGlyph } from '../../../components/Glyph.web';
import { markShapes, navShapes } from '../../../components/glyphShapes';

// react-dom has no types installed here: its server renderer's one function, typed by hand.
const { renderToStaticMarkup } = createRequire(__filename)('react-dom/server') as { renderToStaticMarkup: (el: ReactElement) => string };

describe('web glyphs', () => {
  it('draws the mark as plain SVG: the source filled, the rings stroked and fading', () => {
    const html = renderToStaticMarkup(createElement(Mark, { size: 40, colour: '#123456' }));
    expect(html).toMatch(/^<svg width="40" height="40" viewBox="0 0 32 32" aria-hidden="true"/);
    expect(html).toContain('<circle cx="8" cy="16" r="3.5" fill="#123456"></circle>');
    const rings = [...html.matchAll(/<path d="([^"]+)" stroke-width="2" opacity="([\d.]+)" stroke="#123456" fill="none">/g)];
    expect(rings.map((r) => r[1])).toEqual(markShapes.shapes.filter((s) => s.kind === 'path').map((s) => (s as { d: string }).d));
    const opacities = rings.map((r) => Number(r[2]));
    expect(opacities).toEqual([...opacities].sort((a, b) => b - a));
  });

  it.each(Object.keys(navShapes) as (keyof typeof navShapes)[])('draws the %s glyph with its shapes in order', (name) => {
    const html = renderToStaticMarkup(createElement(NavGlyph, { name, colour: '#ffffff', size: 24 }));
    const tags = [...html.matchAll(/<(circle|path|rect|line)\b/g)].map((m) => m[1]);
    expect(tags).toEqual(navShapes[name].map((s) => s.kind));
    expect(html).not.toContain('undefined');
  });
});
