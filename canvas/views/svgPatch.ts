// Brings an SVG element's children from one sketch to the next by touching only what changed: an attribute
// set where its value differs, an element made or removed where the count of children differs, an element
// replaced where its tag does. For a drawing that changes wholesale many times a second (the light map's lines
// and wall strips while a hand drags), this costs a few setAttribute calls, where writing the markup anew
// costs a parse of the whole string and new nodes every time.
import type { SvgNode } from '../../drawing/nodes';
import { svgAttrName, svgAttrValue } from '../../drawing/toSvg';

const SVG_NS = 'http://www.w3.org/2000/svg';

/** What the patch uses of the DOM (the browser's, or jsdom's in tests). */
type El = Element;

function make(doc: Document, n: SvgNode): El {
  const el = doc.createElementNS(SVG_NS, n.tag);
  update(el, undefined, n);
  return el;
}

function update(el: El, prev: SvgNode | undefined, next: SvgNode) {
  const pa = prev?.attrs;
  for (const k in next.attrs) {
    const v = next.attrs[k];
    if (v === undefined) {
      if (pa?.[k] !== undefined) el.removeAttribute(svgAttrName(k));
    } else if (!pa || pa[k] !== v) el.setAttribute(svgAttrName(k), svgAttrValue(v));
  }
  if (pa) for (const k in pa) if (pa[k] !== undefined && !(k in next.attrs)) el.removeAttribute(svgAttrName(k));
  if (next.text !== undefined) {
    if (prev?.text !== next.text) el.textContent = next.text;
  } else patchChildren(el, prev?.children ?? (prev ? [] : undefined), next.children ?? []);
}

/**
 * Make `parent`'s children draw `next`, given that they now draw `prev` (undefined: unknown, so they are made
 * afresh).
 */
export function patchChildren(parent: El, prev: SvgNode[] | undefined, next: SvgNode[]) {
  const doc = parent.ownerDocument;
  if (!prev) {
    while (parent.firstChild) parent.removeChild(parent.firstChild);
    for (const n of next) parent.appendChild(make(doc, n));
    return;
  }
  const kids = parent.children;
  const common = Math.min(prev.length, next.length);
  for (let k = 0; k < common; k++) {
    const p = prev[k]!;
    const n = next[k]!;
    if (p === n) continue;
    const el = kids[k]!;
    if (p.tag === n.tag && (p.text === undefined) === (n.text === undefined)) update(el, p, n);
    else parent.replaceChild(make(doc, n), el);
  }
  for (let k = prev.length - 1; k >= next.length; k--) parent.removeChild(kids[k]!);
  for (let k = prev.length; k < next.length; k++) parent.appendChild(make(doc, next[k]!));
}
