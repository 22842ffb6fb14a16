// Falloff's own mark and navigation glyphs as data: shapes in a viewBox, drawn by components/Glyph.tsx
// (react-native-svg, phones) and components/Glyph.web.tsx (the browser's own SVG, so the signed-out pages
// do not download react-native-svg).

export type GlyphShape =
  | { kind: 'circle'; cx: number; cy: number; r: number; filled?: boolean; opacity?: number; strokeWidth?: number }
  | { kind: 'path'; d: string; filled?: boolean; opacity?: number; strokeWidth?: number }
  | { kind: 'rect'; x: number; y: number; width: number; height: number; rx: number; strokeWidth: number }
  | { kind: 'line'; x1: number; y1: number; x2: number; y2: number; strokeWidth: number };

export type NavGlyphName = 'setups' | 'classes' | 'account';

/** The app mark: a point source with its falloff rings, one ring per stop (rings fade with distance). */
export const markShapes: { viewBox: number; shapes: GlyphShape[] } = {
  viewBox: 32,
  shapes: [
    { kind: 'circle', cx: 8, cy: 16, r: 3.5, filled: true },
    { kind: 'path', d: 'M14 8 A11 11 0 0 1 14 24', strokeWidth: 2, opacity: 0.85 },
    { kind: 'path', d: 'M20 5 A15 15 0 0 1 20 27', strokeWidth: 2, opacity: 0.55 },
    { kind: 'path', d: 'M26 3 A18 18 0 0 1 26 29', strokeWidth: 2, opacity: 0.3 },
  ],
};

export const navShapes: Record<NavGlyphName, GlyphShape[]> = {
  setups: [
    { kind: 'rect', x: 3, y: 4, width: 18, height: 16, rx: 2, strokeWidth: 1.8 },
    { kind: 'circle', cx: 9, cy: 12, r: 2.2, filled: true },
    { kind: 'path', d: 'M11.5 9.5 L17 7 L17 17 L11.5 14.5 Z', filled: true, opacity: 0.5 },
  ],
  classes: [
    { kind: 'rect', x: 3, y: 5, width: 18, height: 11, rx: 1.5, strokeWidth: 1.8 },
    { kind: 'line', x1: 12, y1: 16, x2: 8, y2: 21, strokeWidth: 1.8 },
    { kind: 'line', x1: 12, y1: 16, x2: 16, y2: 21, strokeWidth: 1.8 },
    { kind: 'line', x1: 7, y1: 9.5, x2: 14, y2: 9.5, strokeWidth: 1.8 },
    { kind: 'line', x1: 7, y1: 12.5, x2: 11, y2: 12.5, strokeWidth: 1.8 },
  ],
  account: [
    { kind: 'circle', cx: 12, cy: 8.5, r: 4, strokeWidth: 1.8 },
    { kind: 'path', d: 'M4.5 20.5 C5.5 15.5 18.5 15.5 19.5 20.5', strokeWidth: 1.8 },
  ],
};

/** One shape's SVG attributes in the given colour: filled shapes take it as fill, the others as stroke. */
export function shapeAttributes(s: GlyphShape, colour: string): Record<string, string | number> {
  const { kind: _kind, filled, ...geometry } = s as GlyphShape & { filled?: boolean };
  return filled ? { ...geometry, fill: colour } : { ...geometry, stroke: colour, fill: 'none' };
}
