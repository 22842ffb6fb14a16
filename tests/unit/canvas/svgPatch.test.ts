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

describe('writeItem on DOM elements (the drag layer on the web)', () => {
  it('draws a changed item in the preview by patching it, and puts the shell back at the end', async () => {
    const { writeItem } = await import('../../../canvas/dragViews');
    const shell = group();
    const preview = group();
    type Light = { id: string; kind: 'light'; x: number; y: number; aimDeg: number };
    const draw = (i: unknown) => {
      const l = i as Light;
      return g({ transform: `translate(${l.x} ${l.y}) rotate(${l.aimDeg})` }, path({ d: 'M0 0L1 0.2L1 -0.2Z', fill: '#fff' }));
    };
    const light: Light = { id: 'l', kind: 'light', x: 1, y: 2, aimDeg: 0 };
    writeItem(shell, preview, light as never, null, draw as never);
    expect(shell.getAttribute('display')).toBe('none');
    expect(preview.innerHTML).toBe(fresh([draw(light)]));
    const drawnGroup = preview.firstElementChild;
    // Turned: the same elements, one attribute changed.
    writeItem(shell, preview, { ...light, aimDeg: 30 } as never, null, draw as never);
    expect(preview.firstElementChild).toBe(drawnGroup);
    expect(preview.innerHTML).toBe(fresh([draw({ ...light, aimDeg: 30 })]));
    // Only moved: the shell shifts and the preview empties; at the end the shell is as React drew it.
    writeItem(shell, preview, { ...light, x: 2 } as never, { dx: 1, dy: 0 }, draw as never);
    expect(preview.childNodes.length).toBe(0);
    expect(shell.getAttribute('transform')).toBe('translate(1 0)');
    writeItem(shell, preview, null, null, draw as never);
    expect(shell.hasAttribute('transform')).toBe(false);
    expect(shell.hasAttribute('display')).toBe(false);
    expect(preview.childNodes.length).toBe(0);
  });
});
