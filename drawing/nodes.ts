// A plan drawing as plain data: a tree of SVG elements with camelCase attributes. The same tree is drawn
// on screen by react-native-svg (canvas/views/SketchView.tsx) and written out as SVG text for the crew
// sheet and image exports (toSvg.ts), so the plan on paper is the plan on screen.
export type Attrs = Record<string, string | number | undefined>;
export type Tag = 'g' | 'line' | 'circle' | 'ellipse' | 'rect' | 'path' | 'polygon' | 'polyline' | 'text' | 'image';
export type SvgNode = { tag: Tag; attrs: Attrs; children?: SvgNode[]; text?: string };

type Child = SvgNode | null | undefined | false;
const kids = (c: Child[]) => c.filter((x): x is SvgNode => !!x);

export const g = (attrs: Attrs, ...children: Child[]): SvgNode => ({ tag: 'g', attrs, children: kids(children) });
export const line = (attrs: Attrs): SvgNode => ({ tag: 'line', attrs });
export const circle = (attrs: Attrs): SvgNode => ({ tag: 'circle', attrs });
export const ellipse = (attrs: Attrs): SvgNode => ({ tag: 'ellipse', attrs });
export const rect = (attrs: Attrs): SvgNode => ({ tag: 'rect', attrs });
export const path = (attrs: Attrs): SvgNode => ({ tag: 'path', attrs });
export const polygon = (attrs: Attrs): SvgNode => ({ tag: 'polygon', attrs });
export const polyline = (attrs: Attrs): SvgNode => ({ tag: 'polyline', attrs });
export const text = (attrs: Attrs, content: string): SvgNode => ({ tag: 'text', attrs, text: content });

/** transform="translate(x y) rotate(deg)" */
export function place(x: number, y: number, deg = 0): string {
  return deg ? `translate(${x} ${y}) rotate(${deg})` : `translate(${x} ${y})`;
}
