// Writes a sketch out as SVG markup (for the crew sheet, the plan.svg and plan.png exports).
import type { Attrs, SvgNode } from './nodes';

const keepCase = new Set(['viewBox', 'preserveAspectRatio']);
const kebab = (k: string) => (keepCase.has(k) ? k : k.replace(/[A-Z]/g, (m) => `-${m.toLowerCase()}`));
const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** An attribute as SVG writes it: its name (kebab-case) and its value (numbers to 4 decimals). */
export const svgAttrName = kebab;
export const svgAttrValue = (v: string | number): string => (typeof v === 'number' ? String(Math.round(v * 10000) / 10000) : v);

function attrs(a: Attrs): string {
  let out = '';
  for (const [k, v] of Object.entries(a)) {
    if (v === undefined) continue;
    out += ` ${kebab(k)}="${esc(svgAttrValue(v))}"`;
  }
  return out;
}

export function nodeToSvg(n: SvgNode): string {
  const tag = n.tag;
  if (n.text !== undefined) return `<${tag}${attrs(n.attrs)}>${esc(n.text)}</${tag}>`;
  if (!n.children?.length) return `<${tag}${attrs(n.attrs)}/>`;
  return `<${tag}${attrs(n.attrs)}>${n.children.map(nodeToSvg).join('')}</${tag}>`;
}

/** A whole SVG document of `width` × `height` pixels showing `viewBox` (plan metres). */
export function svgDocument(root: SvgNode, o: { width: number; height: number; viewBox: [number, number, number, number]; background?: string; fontCss?: string }): string {
  const [x, y, w, h] = o.viewBox;
  const bg = o.background ? `<rect x="${x}" y="${y}" width="${w}" height="${h}" fill="${o.background}"/>` : '';
  const style = o.fontCss ? `<style>${o.fontCss}</style>` : '';
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${o.width}" height="${o.height}" viewBox="${x} ${y} ${w} ${h}">${style}${bg}${nodeToSvg(root)}</svg>`;
}
