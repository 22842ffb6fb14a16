// Falloff's own mark and navigation glyphs, drawn from geometry (no icon set): components/glyphShapes.ts.
// Phones draw them with react-native-svg; the web with the browser's own SVG (Glyph.web.tsx).
import type { ComponentType } from 'react';
import Svg, { Circle, Line, Path, Rect } from 'react-native-svg';
import { markShapes, navShapes, shapeAttributes, type GlyphShape, type NavGlyphName } from './glyphShapes';

export type { NavGlyphName } from './glyphShapes';

const elements = { circle: Circle, path: Path, rect: Rect, line: Line } as unknown as Record<GlyphShape['kind'], ComponentType<Record<string, unknown>>>;

function shapes(list: GlyphShape[], colour: string) {
  return list.map((s, i) => {
    const El = elements[s.kind];
    return <El key={i} {...shapeAttributes(s, colour)} />;
  });
}

/** The app mark: a point source with its falloff rings, one ring per stop. */
export function Mark({ size = 28, colour = '#f0b24a' }: { size?: number; colour?: string }) {
  return (
    <Svg width={size} height={size} viewBox={`0 0 ${markShapes.viewBox} ${markShapes.viewBox}`} accessibilityElementsHidden aria-hidden>
      {shapes(markShapes.shapes, colour)}
    </Svg>
  );
}

export function NavGlyph({ name, colour, size = 22 }: { name: NavGlyphName; colour: string; size?: number }) {
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" accessibilityElementsHidden aria-hidden>
      <>{shapes(navShapes[name], colour)}</>
    </Svg>
  );
}
