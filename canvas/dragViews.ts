// The views of the drag layer (dragLayer.ts) for the plan's React components. On the web a view writes the
// SVG nodes directly: each item's drawing sits in a "shell" group that a shift moves with one transform
// attribute, beside an empty "preview" group (React never renders into it) where a changed drawing is written
// as SVG text while the shell is hidden. Where there is no DOM (native, the component tests) the view falls
// back to a state of the one component, which then re-renders alone.
import { createContext, useContext, useEffect, useRef, useState } from 'react';
import type { Item } from '../model/document';
import type { SvgNode } from '../drawing/nodes';
import { nodeToSvg } from '../drawing/toSvg';
import type { DragLayer, Offset } from './dragLayer';
import { domOf, type DomLike } from './views/dom';
import { patchChildren } from './views/svgPatch';

export type { DomLike } from './views/dom';

/** The drag layer of the plan being drawn (PlanCanvas makes one). */
export const DragLayerContext = createContext<DragLayer | null>(null);

/** What each preview group draws now, where the preview is a real DOM element (patched, not re-parsed). */
const drawnPreview = new WeakMap<object, SvgNode[]>();
const isElement = (d: DomLike): d is DomLike & Element => typeof (d as Partial<Element>).appendChild === 'function';

/** Draw `node` (null: nothing) in the preview: on a DOM element only what changed since the last drawing
 *  (svgPatch.ts: a beam that swings redraws one polygon's points, not a parse of its markup each move). */
function writePreview(preview: DomLike, node: SvgNode | null) {
  const next = node ? [node] : [];
  if (isElement(preview)) {
    const before = drawnPreview.get(preview);
    if (!before && !next.length && !preview.firstChild) return;
    patchChildren(preview, before, next);
    drawnPreview.set(preview, next);
  } else {
    const markup = node ? nodeToSvg(node) : '';
    if (preview.innerHTML !== markup) preview.innerHTML = markup;
  }
}

/** Show `live` on the web: shift the shell's drawing by `offset`, or hide it and draw `live` in the preview;
 *  `live` null puts the shell back as React drew it. */
export function writeItem(shell: DomLike, preview: DomLike, live: Item | null, offset: Offset | null, draw: (i: Item) => SvgNode | null) {
  if (!live) {
    shell.removeAttribute('transform');
    shell.removeAttribute('display');
    writePreview(preview, null);
  } else if (offset) {
    shell.setAttribute('transform', `translate(${offset.dx} ${offset.dy})`);
    shell.removeAttribute('display');
    writePreview(preview, null);
  } else {
    shell.setAttribute('display', 'none');
    writePreview(preview, draw(live));
  }
}

/**
 * One item's drawing following a drag. Returns the refs for the shell and preview groups and, where there is
 * no DOM, the live item to draw instead of the document's (null on the web: the DOM is written directly).
 * `shifts`: whether a shifted item may be shown by shifting the old drawing (false for a beam, which the
 * walls clip differently wherever it stands).
 */
export function useItemDrag(id: string, draw: (i: Item) => SvgNode | null, shifts = true) {
  const layer = useContext(DragLayerContext);
  const shell = useRef<unknown>(null);
  const preview = useRef<unknown>(null);
  const [live, setLive] = useState<Item | null>(null);
  const drawRef = useRef(draw);
  drawRef.current = draw;
  useEffect(() => {
    if (!layer) return;
    const off = layer.item(id, (item, offset) => {
      const s = domOf(shell.current);
      const p = domOf(preview.current);
      if (s && p) writeItem(s, p, item, shifts ? offset : null, drawRef.current);
      else setLive(item);
    });
    // The nodes as they stand now, put back as React drew them when the view goes.
    const shellNode = shell.current;
    const previewNode = preview.current;
    return () => {
      off();
      const s = domOf(shellNode);
      const p = domOf(previewNode);
      if (s && p) writeItem(s, p, null, null, drawRef.current);
    };
  }, [layer, id, shifts]);
  return { shell, preview, live };
}

/**
 * A view of all the moved items at once (selection marks, handles). On the web a common shift is written to
 * the shell as a transform (`transform(offset)` gives its text: plan metres or screen pixels); anything else,
 * and everything where there is no DOM, re-renders the component with `moved` (the live items).
 */
export function useGroupDrag(transform: (o: Offset) => string) {
  const layer = useContext(DragLayerContext);
  const shell = useRef<unknown>(null);
  const [moved, setMoved] = useState<ReadonlyMap<string, Item> | null>(null);
  const transformRef = useRef(transform);
  transformRef.current = transform;
  useEffect(() => {
    if (!layer) return;
    // Set only on a change: a shifted drag must not schedule renders (nor React's bail-out work) each frame.
    let current: ReadonlyMap<string, Item> | null = null;
    const show = (m: ReadonlyMap<string, Item> | null) => {
      if (m !== current) setMoved((current = m));
    };
    const off = layer.group((items, offset) => {
      const s = domOf(shell.current);
      if (s && items && offset) {
        s.setAttribute('transform', transformRef.current(offset));
        show(null);
        return;
      }
      s?.removeAttribute('transform');
      show(items);
    });
    const shellNode = shell.current;
    return () => {
      off();
      domOf(shellNode)?.removeAttribute('transform');
    };
  }, [layer]);
  return { shell, moved };
}
