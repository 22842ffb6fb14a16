// What the editor needs to know about each kind of plan item: its name in the kit palette, how a new one
// is made, where it is, how it moves and how near a point it is (hit testing). Pure: no React, no SVG.
import { GELS } from '../calc';
import type { Point } from './geometry';
import { distance, direction } from './geometry';
import type { Item, ItemKind, ItemOf } from './document';
import { itemSchema } from './document';
import { panelEnds } from './scene';

type KindInfo<K extends ItemKind> = {
  /** The name shown in the kit palette and the inspector. */
  label: string;
  group: 'room' | 'people' | 'camera' | 'light' | 'shaper' | 'note';
  /** Radius of the glyph on the plan (point items), metres; used for hit testing and selection. */
  radiusM: number;
  /** Raw fields of a new item dropped at `at` (parsed with the shared schema, which fills the defaults). */
  create: (at: Point) => Record<string, unknown>;
};

const seg = (at: Point, lengthM: number) => ({ a: { x: at.x - lengthM / 2, y: at.y }, b: { x: at.x + lengthM / 2, y: at.y } });

export const kinds: { [K in ItemKind]: KindInfo<K> } = {
  wall: { label: 'Wall', group: 'room', radiusM: 0.15, create: (at) => ({ ...seg(at, 3), surface: 'wall' }) },
  subject: { label: 'Subject', group: 'people', radiusM: 0.3, create: (at) => ({ x: at.x, y: at.y, facingDeg: 90 }) },
  prop: { label: 'Prop', group: 'people', radiusM: 0.25, create: (at) => ({ x: at.x, y: at.y, shape: 'stool' }) },
  camera: { label: 'Camera', group: 'camera', radiusM: 0.25, create: (at) => ({ x: at.x, y: at.y, aimDeg: -90 }) },
  light: {
    label: 'Light',
    group: 'light',
    radiusM: 0.25,
    create: (at) => ({ x: at.x, y: at.y, aimDeg: -90, source: { type: 'strobe', energyWs: 500 }, power: 1 / 4, modifier: 'softbox' }),
  },
  reflector: { label: 'Reflector', group: 'shaper', radiusM: 0.2, create: (at) => ({ x: at.x, y: at.y, rotationDeg: -90 }) },
  flag: { label: 'Flag', group: 'shaper', radiusM: 0.2, create: (at) => ({ x: at.x, y: at.y, rotationDeg: -90 }) },
  vflat: { label: 'V-flat', group: 'shaper', radiusM: 0.2, create: (at) => ({ x: at.x, y: at.y, rotationDeg: -90 }) },
  scrim: { label: 'Scrim', group: 'shaper', radiusM: 0.2, create: (at) => ({ x: at.x, y: at.y, rotationDeg: -90 }) },
  note: { label: 'Note', group: 'note', radiusM: 0.3, create: (at) => ({ x: at.x, y: at.y, text: 'Note' }) },
  tape: { label: 'Distance tape', group: 'note', radiusM: 0.1, create: (at) => seg(at, 2) },
  arrow: { label: 'Arrow', group: 'note', radiusM: 0.1, create: (at) => seg(at, 1.5) },
};

export const kindOrder: ItemKind[] = ['subject', 'camera', 'light', 'reflector', 'flag', 'vflat', 'scrim', 'wall', 'prop', 'note', 'tape', 'arrow'];

/** A new item of `kind` at `at`, with every default filled in by the shared schema. */
export function createItem<K extends ItemKind>(kind: K, id: string, at: Point): ItemOf<K> {
  return itemSchema.parse({ id, kind, ...kinds[kind].create(at) }) as ItemOf<K>;
}

export type SegmentItem = ItemOf<'wall'> | ItemOf<'tape'> | ItemOf<'arrow'>;
export const isSegment = (i: Item): i is SegmentItem => i.kind === 'wall' || i.kind === 'tape' || i.kind === 'arrow';
export type PanelItem = ItemOf<'reflector'> | ItemOf<'flag'> | ItemOf<'vflat'> | ItemOf<'scrim'>;
export const isPanel = (i: Item): i is PanelItem => i.kind === 'reflector' || i.kind === 'flag' || i.kind === 'vflat' || i.kind === 'scrim';

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
  switch (i.kind) {
    case 'light':
    case 'camera':
      return i.aimDeg;
    case 'subject':
      return i.facingDeg;
    case 'prop':
    case 'reflector':
    case 'flag':
    case 'vflat':
    case 'scrim':
      return i.rotationDeg;
    default:
      return null;
  }
}

/** The item turned to point along `deg`. */
export function withAngle<T extends Item>(i: T, deg: number): T {
  const d = Math.round(deg * 10) / 10;
  switch (i.kind) {
    case 'light':
    case 'camera':
      return { ...i, aimDeg: d };
    case 'subject':
      return { ...i, facingDeg: d };
    case 'prop':
    case 'reflector':
    case 'flag':
    case 'vflat':
    case 'scrim':
      return { ...i, rotationDeg: d };
    default:
      return i;
  }
}

export function distanceToSegment(p: Point, a: Point, b: Point): number {
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
