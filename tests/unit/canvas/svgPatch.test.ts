// @vitest-environment jsdom
// The light map's direct writer (canvas/views/svgPatch.ts): after any sequence of sketches, the group's DOM is
// what writing the last sketch afresh as SVG markup gives, and a sketch that changed one attribute touches one.
import { describe, expect, it } from 'vitest';
import { g, line, path, text, type SvgNode } from '../../../drawing/nodes';
import { nodeToSvg } from '../../../drawing/toSvg';
import { patchChildren } from '../../../canvas/views/svgPatch';

const NS = 'http://www.w3.org/2000/svg';
const group = () => document.createElementNS(NS, 'g');
/** What the markup of `nodes` parses to, as the browser serialises it. */
const fresh = (nodes: SvgNode[]) => {
  const el = group();
  el.innerHTML = nodes.map(nodeToSvg).join('');
  return el.innerHTML;
};

const map = (k: number): SvgNode =>
  g(
    {},
    g({}, ...Array.from({ length: 3 + (k % 3) }, (_, j) => line({ x1: j, y1: 0, x2: j + 1, y2: 0, stroke: j === k % 4 ? '#ff0000' : '#808080', strokeWidth: 0.08 }))),
    ...Array.from({ length: 1 + (k % 4) }, (_, j) => g({}, path({ d: `M0 ${j + k}L1 ${j}`, fill: 'none', stroke: '#fff', strokeWidth: j === 0 ? 0.018 : 0.01, strokeOpacity: k % 2 ? 0.8 : undefined }))),
    k % 2 ? text({ x: k, y: 1, fontSize: 0.13 }, `+${k}`) : line({ x1: 0, y1: 0, x2: k, y2: k }),
  );

describe('patchChildren', () => {
  it('leaves the DOM as a fresh write of the last sketch, through growing, shrinking and changed tags', () => {
    const el = group();
    let drawn: SvgNode[] | undefined;
    for (let k = 0; k < 12; k++) {
      const next = [map(k)];
      patchChildren(el, drawn, next);
      drawn = next;
      expect(el.innerHTML).toBe(fresh(next));
    }
  });

  it('touches only the attribute that changed', () => {
    const el = group();
    const a = [g({}, line({ x1: 0, y1: 0, x2: 1, y2: 1, stroke: '#111' }), line({ x1: 1, y1: 1, x2: 2, y2: 2, stroke: '#222' }))];
    patchChildren(el, undefined, a);
    const first = el.firstElementChild!.children[0]!;
    const second = el.firstElementChild!.children[1]!;
    const calls: string[] = [];
    for (const e of [first, second]) {
      const set = e.setAttribute.bind(e);
      e.setAttribute = (n: string, v: string) => {
        calls.push(`${n}=${v}`);
        set(n, v);
      };
    }
    const b = [g({}, a[0]!.children![0]!, line({ x1: 1, y1: 1, x2: 2, y2: 2, stroke: '#333' }))];
    patchChildren(el, a, b);
    expect(calls).toEqual(['stroke=#333']);
    // The same elements, kept.
    expect(el.firstElementChild!.children[0]).toBe(first);
    expect(el.firstElementChild!.children[1]).toBe(second);
  });
});
