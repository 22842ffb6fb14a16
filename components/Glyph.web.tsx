// The mark and navigation glyphs on the web: the browser's own SVG elements, so the pages that show them
// (sign-in, the navigation frame) need no react-native-svg. Shapes: components/glyphShapes.ts.
import { createElement } from 'react';
import { markShapes, navShapes, shapeAttributes, type GlyphShape, type NavGlyphName } from './glyphShapes';

export type { NavGlyphName } from './glyphShapes';

const dashed = (k: string) => k.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`);

function svg(size: number, viewBox: number, list: GlyphShape[], colour: string) {
  return createElement(
    'svg',
    { width: size, height: size, viewBox: `0 0 ${viewBox} ${viewBox}`, 'aria-hidden': true, focusable: 'false', style: { display: 'block', flexShrink: 0 } },
    ...list.map((s, i) => {
      const attrs = shapeAttributes(s, colour);
      // React's DOM names: strokeWidth stays camel case; plain SVG attribute names otherwise.
      return createElement(s.kind, { key: i, ...Object.fromEntries(Object.entries(attrs).map(([k, v]) => [k === 'strokeWidth' ? k : dashed(k), v])) });
    }),
  );
}

/** The app mark: a point source with its falloff rings, one ring per stop. */
export function Mark({ size = 28, colour = '#f0b24a' }: { size?: number; colour?: string }) {
  return svg(size, markShapes.viewBox, markShapes.shapes, colour);
}

export function NavGlyph({ name, colour, size = 22 }: { name: NavGlyphName; colour: string; size?: number }) {
  return svg(size, 24, navShapes[name], colour);
}
