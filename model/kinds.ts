// What the editor needs to know about each kind of plan item, derived from the kinds' own modules
// (model/items/): the kinds' map, making an item, where it is, how it moves and turns, how near a point it is
// (hit testing) and the inspector's full field list. Pure: no React, no SVG.
import type { z } from 'zod';
import { GELS } from '../calc';
import type { Point } from './geometry';
import { distance, direction } from './geometry';
import type { Item, ItemKind, ItemOf } from './document';
import { itemSchema } from './document';
import { numberField, textField, lengthField, switchField, type FieldSpec } from './fields';
import { kindList } from './items';
import type { KindDef } from './items/kind';
import { panelEnds } from './items/shaper';

type KindOf<K extends ItemKind> = KindDef<Extract<(typeof kindList)[number], { kind: K }>['schema']>;

/** Kind → its definition (schema, label, group, geometry, defaults, meter part, crew line, fields). */
export const kinds = Object.fromEntries(kindList.map((k) => [k.kind, k])) as unknown as { [K in ItemKind]: KindOf<K> };

/** The kinds in kit-palette order. */
export const kindOrder: ItemKind[] = kindList.map((k) => k.kind);

/** A kind's definition for an item, typed for that item (the map's values differ by kind). */
export const kindOf = <T extends Item>(i: T) => kinds[i.kind] as unknown as KindDef<z.ZodType<T>>;

/** A new item of `kind` at `at`, with every default filled in by the shared schema. */
export function createItem<K extends ItemKind>(kind: K, id: string, at: Point): ItemOf<K> {
  return itemSchema.parse({ id, kind, ...kinds[kind].create(at) }) as ItemOf<K>;
}

export type SegmentItem = ItemOf<'wall'> | ItemOf<'tape'> | ItemOf<'arrow'>;
export const isSegment = (i: Item): i is SegmentItem => kinds[i.kind].shape === 'segment';
type PanelItem = ItemOf<'reflector'> | ItemOf<'flag'> | ItemOf<'vflat'> | ItemOf<'scrim'>;
const isPanel = (i: Item): i is PanelItem => kinds[i.kind].shape === 'panel';

/** The item's anchor: centre of a point item or panel, midpoint of a segment. */
export function anchorOf(i: Item): Point {
  if (isSegment(i)) return { x: (i.a.x + i.b.x) / 2, y: (i.a.y + i.b.y) / 2 };
  return { x: i.x, y: i.y };
}

/** The item moved by (dx, dy) metres. */
export function moveItem<T extends Item>(i: T, dx: number, dy: number): T {
  if (isSegment(i)) return { ...i, a: { x: i.a.x + dx, y: i.a.y + dy }, b: { x: i.b.x + dx, y: i.b.y + dy } };
  return { ...i, x: (i as { x: number }).x + dx, y: (i as { y: number }).y + dy };
}

/** The plan angle an item points along (aim, facing or rotation), or null for items without one. */
export function angleOf(i: Item): number | null {
  const key = kinds[i.kind].angle?.key;
  return key ? ((i as Record<string, unknown>)[key] as number) : null;
}

/** The item turned to point along `deg`. */
export function withAngle<T extends Item>(i: T, deg: number): T {
  const key = kinds[i.kind].angle?.key;
  return key ? { ...i, [key]: Math.round(deg * 10) / 10 } : i;
}

function distanceToSegment(p: Point, a: Point, b: Point): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
  return Math.hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy));
}

/** How far a plan point is from the item's drawn shape, metres (0 inside a point item's glyph). */
export function distanceToItem(i: Item, p: Point): number {
  if (isSegment(i)) return distanceToSegment(p, i.a, i.b);
  if (isPanel(i)) {
    const { a, b } = panelEnds(i);
    return Math.min(distanceToSegment(p, a, b), Math.max(0, distance(p, i) - kinds[i.kind].radiusM));
  }
  return Math.max(0, distance(p, { x: i.x, y: i.y }) - kinds[i.kind].radiusM);
}

/** The topmost item within `toleranceM` of p (later items are drawn on top), or null. */
export function hitTest(items: readonly Item[], p: Point, toleranceM: number): Item | null {
  let best: Item | null = null;
  let bestD = Infinity;
  for (let k = items.length - 1; k >= 0; k--) {
    const it = items[k]!;
    const d = distanceToItem(it, p);
    if (d <= toleranceM && d < bestD - 1e-9) {
      best = it;
      bestD = d;
      if (d === 0) break;
    }
  }
  return best;
}

/** Items whose anchor lies inside the box spanned by two plan points. */
export function itemsInBox(items: readonly Item[], p: Point, q: Point): Item[] {
  const [x0, x1] = [Math.min(p.x, q.x), Math.max(p.x, q.x)];
  const [y0, y1] = [Math.min(p.y, q.y), Math.max(p.y, q.y)];
  return items.filter((i) => {
    const a = anchorOf(i);
    return a.x >= x0 && a.x <= x1 && a.y >= y0 && a.y <= y1;
  });
}

/** Where an item's rotate handle sits on the plan (ahead of it along its angle), or null. */
export function rotateHandleOf(i: Item, distanceM = 0.6): Point | null {
  const deg = angleOf(i);
  if (deg === null) return null;
  const d = direction(deg);
  const c = anchorOf(i);
  return { x: c.x + d.x * distanceM, y: c.y + d.y * distanceM };
}

/** Plan angle from one point to another, degrees. */
export function angleTo(from: Point, to: Point): number {
  return (Math.atan2(to.y - from.y, to.x - from.x) * 180) / Math.PI;
}

/** A short description a screen reader reads for an item ("Light: Key — octa above"). */
export function accessibleName(i: Item): string {
  const kind = kinds[i.kind].label;
  if (i.label) return `${kind}: ${i.label}`;
  if (i.kind === 'note') return `${kind}: ${i.text}`;
  if (i.kind === 'light' && i.gel !== 'none') return `${kind} with ${GELS[i.gel].label}`;
  return kind;
}

/**
 * Every inspector field of an item, in order: the kind's fields changed most (`lead`: a light's power, modifier,
 * grid and gel), its label, position (items placed at a point), the angle it points along (in steps of 5°), the
 * kind's other fields, and the lock.
 */
export function fieldsOf<T extends Item>(item: T): readonly FieldSpec<T>[] {
  const kind = kindOf(item);
  const out: FieldSpec<T>[] = [...((kind.lead ?? []) as readonly FieldSpec<T>[]), textField<T>('Label', 'label')];
  if (kind.shape !== 'segment') {
    // Positions stay on the stage: a value off it is refused (with the stage's extent in the message), and the
    // steppers stop at its edge, so "fit" always finds the item.
    out.push(
      lengthField<T>('Across', 'x' as keyof T & string, 0.1, ({ stage }) => ({ min: 0, max: stage.widthM }), 'field-x'),
      lengthField<T>('Down', 'y' as keyof T & string, 0.1, ({ stage }) => ({ min: 0, max: stage.depthM }), 'field-y'),
    );
  }
  if (kind.angle) out.push({ ...numberField<T>(kind.angle.label, kind.angle.key as keyof T & string, { by: 5, min: -360, max: 360 }) });
  out.push(...kind.fields, switchField<T>('Locked', 'locked'));
  return out;
}

/**
 * What a person calls each item: its label, or its kind numbered among the unlabelled items of that kind
 * ("Light 2") when there is more than one, or the kind alone ("Camera"). Never the internal id.
 */
export function itemNames(items: readonly Item[]): ReadonlyMap<string, string> {
  const hit = namesOf.get(items);
  if (hit) return hit;
  const count = new Map<ItemKind, number>();
  for (const i of items) if (!i.label) count.set(i.kind, (count.get(i.kind) ?? 0) + 1);
  const seen = new Map<ItemKind, number>();
  const out = new Map<string, string>();
  for (const i of items) {
    if (i.label) out.set(i.id, i.label);
    else {
      const n = (seen.get(i.kind) ?? 0) + 1;
      seen.set(i.kind, n);
      out.set(i.id, count.get(i.kind)! > 1 ? `${kinds[i.kind].label} ${n}` : kinds[i.kind].label);
    }
  }
  namesOf.set(items, out);
  return out;
}
/** Names by items array: the panels ask for the same document's names on every change of the editor. */
const namesOf = new WeakMap<readonly Item[], Map<string, string>>();

/** A meter warning as a person reads it: the light's name where the meter wrote its id. */
export function warningText(w: { message: string; lightId?: string }, names: ReadonlyMap<string, string>): string {
  return w.lightId && names.has(w.lightId) ? w.message.split(w.lightId).join(names.get(w.lightId)!) : w.message;
}

/** How an item is named in a sentence: its label, else its kind ("the reflector"). */
export function itemName(i: Item): string {
  if (i.label) return i.label;
  if (i.kind === 'note') return 'a note';
  return `the ${kinds[i.kind].label.toLowerCase()}`;
}
