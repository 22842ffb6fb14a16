// A point item's glyph drawn at the origin, to be placed with a translate (ItemView): kept while only the
// item's position changes, so a drag rewrites one transform rather than every element of the glyph.
import { sketchItem } from '../../drawing/glyphs';
import type { SvgNode } from '../../drawing/nodes';
import type { PlanTheme } from '../../drawing/theme';
import type { Item } from '../../model/document';
import type { Units } from '../../model/units';

/** `placed`: the glyph is drawn about the item's position (its sketch opens with a translate to it), so the
 *  origin drawing placed by a translate is the same picture; otherwise it is drawn in place each time. */
export type Shape = { item: Item; theme: PlanTheme; units: Units; node: SvgNode; placed: boolean };

/** True when two versions of an item differ at most in where they stand (x and y). */
export function sameButPosition(a: Item, b: Item): boolean {
  if (a === b) return true;
  const ka = Object.keys(a);
  if (ka.length !== Object.keys(b).length) return false;
  for (const k of ka) if (k !== 'x' && k !== 'y' && (a as Record<string, unknown>)[k] !== (b as Record<string, unknown>)[k]) return false;
  return true;
}

/** The glyph of a point item drawn at the origin, reused while only its position changes. */
export function shapeAtOrigin(prev: Shape | null, item: Item, theme: PlanTheme, units: Units): Shape {
  if (prev && prev.placed && prev.theme === theme && prev.units === units && sameButPosition(prev.item, item)) return prev;
  if (prev && !prev.placed && prev.item === item && prev.theme === theme && prev.units === units) return prev;
  const node = sketchItem({ ...item, x: 0, y: 0 } as Item, { theme, units });
  if (/^translate\(0 0\)/.test(String(node.attrs?.transform ?? ''))) return { item, theme, units, node, placed: true };
  return { item, theme, units, node: sketchItem(item, { theme, units }), placed: false };
}

