// Item labels placed as a layer of their own, at a size fixed on screen (or on paper), so they read at any zoom:
// each label tries spots around its item and takes the first where it overlaps no other label and no item's
// body; a label with no free spot is left off. Labels go in order of importance (subject, camera, then the
// lights by role, …), so on a small screen the minor ones give way first. The editor's plan, the share page and
// the exports all place labels here.
import type { Item, ItemOf } from '../model/document';
import { panelEnds } from '../model/items/shaper';
import { formatLength, type Units } from '../model/units';
import { g, text, type SvgNode } from './nodes';
import { textWidthEm } from './textWidth';
import type { PlanTheme } from './theme';

/** A plan label's size on screen, px (at least 11 px reads on a phone held at arm's length: common practice). */
export const LABEL_PX = 12;

/** Plan-metre box, centre and half sizes. */
export type Box = { cx: number; cy: number; hw: number; hh: number };
type Point = { x: number; y: number };

/** One label to place: where it may go, around what. `dirs` are the unit directions to try, best first. */
export type LabelSpec = { id: string; text: string; priority: number; mono: boolean; spots: { at: Point; dir: Point }[]; body: Box | null };

/** A placed label: its box in plan metres and its font size in metres. */
export type PlacedLabel = { id: string; text: string; mono: boolean; box: Box; fontM: number };

// The order in which labels claim their spots (lower first).
const lightRank: Record<ItemOf<'light'>['role'], number> = { key: 2, fill: 3, rim: 4, hair: 5, kicker: 5, background: 6, accent: 7 };

/** Labels under this rank (subject, camera, key) may cover another item's body when nothing else is free. */
const MUST_LABEL = 3;

const rad = (d: number) => (d * Math.PI) / 180;
const SQ = Math.SQRT1_2;
const EIGHT: Point[] = [
  { x: 0, y: 1 },
  { x: 0, y: -1 },
  { x: 1, y: 0 },
  { x: -1, y: 0 },
  { x: SQ, y: SQ },
  { x: -SQ, y: SQ },
  { x: SQ, y: -SQ },
  { x: -SQ, y: -SQ },
];

/** Eight directions around a point item at `r` metres, those facing away from `awayDeg` (a light's or a
 *  camera's aim, where its modifier and beam are drawn) first; then the same a little further out. */
export function around(p: Point, r: number, awayDeg?: number): LabelSpec['spots'] {
  let dirs = EIGHT;
  if (awayDeg !== undefined) {
    const a = { x: Math.cos(rad(awayDeg)), y: Math.sin(rad(awayDeg)) };
    dirs = [...EIGHT].sort((u, v) => u.x * a.x + u.y * a.y - (v.x * a.x + v.y * a.y));
  }
  const ring = (k: number) => dirs.map((d) => ({ at: { x: p.x + d.x * r * k, y: p.y + d.y * r * k }, dir: d }));
  return [...ring(1), ...ring(1.8)];
}

const bodyOf = (p: Point, r: number): Box => ({ cx: p.x, cy: p.y, hw: r, hh: r });

/** The label each item carries on the plan (the same words the glyphs used to draw), with where it may go. */
function labelSpec(i: Item, units: Units, order: number): LabelSpec | null {
  const tie = order / 10_000; // keeps the document's order within one rank
  switch (i.kind) {
    case 'subject':
      return i.label ? { id: i.id, text: i.label, priority: 0 + tie, mono: false, spots: around(i, 0.3, i.facingDeg), body: bodyOf(i, 0.22) } : null;
    case 'camera':
      return { id: i.id, text: i.label || `${i.focalMm} mm`, priority: 1 + tie, mono: false, spots: around(i, 0.24, i.aimDeg), body: bodyOf(i, 0.18) };
    case 'light':
      return i.label ? { id: i.id, text: i.label, priority: lightRank[i.role] + tie, mono: false, spots: around(i, 0.3, i.aimDeg), body: bodyOf(i, 0.2) } : null;
    case 'note':
      return i.text ? { id: i.id, text: i.text, priority: 6.5 + tie, mono: false, spots: around(i, 0.08), body: bodyOf(i, 0.06) } : null;
    case 'reflector':
    case 'flag':
    case 'vflat':
    case 'scrim': {
      if (!i.label) return null;
      const { a, b } = panelEnds(i);
      const n = { x: Math.cos(rad(i.rotationDeg)), y: Math.sin(rad(i.rotationDeg)) };
      const t = { x: (b.x - a.x) / (i.widthM || 1), y: (b.y - a.y) / (i.widthM || 1) };
      const spots = [
        { at: { x: i.x - n.x * 0.12, y: i.y - n.y * 0.12 }, dir: { x: -n.x, y: -n.y } },
        { at: { x: i.x + n.x * 0.12, y: i.y + n.y * 0.12 }, dir: n },
        { at: { x: b.x + t.x * 0.08, y: b.y + t.y * 0.08 }, dir: t },
        { at: { x: a.x - t.x * 0.08, y: a.y - t.y * 0.08 }, dir: { x: -t.x, y: -t.y } },
        { at: { x: i.x - n.x * 0.35, y: i.y - n.y * 0.35 }, dir: { x: -n.x, y: -n.y } },
      ];
      return { id: i.id, text: i.label, priority: 8 + tie, mono: false, spots, body: null };
    }
    case 'prop':
      return i.label ? { id: i.id, text: i.label, priority: 10 + tie, mono: false, spots: around(i, i.shape === 'table' ? 0.5 : 0.26), body: bodyOf(i, i.shape === 'table' ? 0.45 : 0.2) } : null;
    case 'wall':
    case 'tape': {
      const len = Math.hypot(i.b.x - i.a.x, i.b.y - i.a.y);
      const words = i.kind === 'tape' ? formatLength(len, units) : i.label || (len > 0.5 ? formatLength(len, units, 1) : '');
      if (!words || len < 1e-6) return null;
      const n = { x: -(i.b.y - i.a.y) / len, y: (i.b.x - i.a.x) / len };
      const off = i.kind === 'wall' ? 0.1 : 0.05;
      // Either side of the middle, then either side a quarter along.
      const spots = [0.5, 0.25, 0.75].flatMap((f) => {
        const p = { x: i.a.x + (i.b.x - i.a.x) * f, y: i.a.y + (i.b.y - i.a.y) * f };
        return [
          { at: { x: p.x - n.x * off, y: p.y - n.y * off }, dir: { x: -n.x, y: -n.y } },
          { at: { x: p.x + n.x * off, y: p.y + n.y * off }, dir: n },
        ];
      });
      return { id: i.id, text: words, priority: (i.kind === 'wall' ? 9 : 7.5) + tie, mono: i.kind === 'tape', spots, body: null };
    }
    default:
      return null;
  }
}

/** A text's box at `fontM` metres: as wide as the face's own advances add up to (drawing/textWidth.ts), the
 *  line 1.2 em tall. */
export function textBox(words: string, fontM: number, mono: boolean): { hw: number; hh: number } {
  return { hw: (textWidthEm(words, mono) * fontM) / 2, hh: (fontM * 1.2) / 2 };
}

export const overlaps = (a: Box, b: Box) => Math.abs(a.cx - b.cx) < a.hw + b.hw && Math.abs(a.cy - b.cy) < a.hh + b.hh;

const sgn = (v: number) => (v > 0.3 ? 1 : v < -0.3 ? -1 : 0);

/**
 * Places labels for `items` drawn at `pxPerM`: each at `fontPx` on screen, `gapPx` clear of the others,
 * inside `bounds` (plan metres) when given. Returns the labels that found a spot, most important first.
 */
export function placeLabels(items: readonly Item[], o: { pxPerM: number; units: Units; fontPx?: number; gapPx?: number; bounds?: { x0: number; y0: number; x1: number; y1: number } }): PlacedLabel[] {
  const specs = items.map((i, k) => labelSpec(i, o.units, k)).filter((s): s is LabelSpec => !!s);
  return placeSpecs(specs, { fontM: (o.fontPx ?? LABEL_PX) / o.pxPerM, gap: (o.gapPx ?? 2) / o.pxPerM, bounds: o.bounds });
}

/** The placement itself, for any drawing (the plan in metres, the side view in pixels): labels in order of
 *  `priority`, each at the first of its spots clear of the others and of every spec's `body` (and of `keepOff`). */
export function placeSpecs(specs: readonly LabelSpec[], o: { fontM: number; gap: number; bounds?: { x0: number; y0: number; x1: number; y1: number }; keepOff?: readonly Box[] }): PlacedLabel[] {
  const { fontM, gap } = o;
  const sorted = [...specs].sort((a, b) => a.priority - b.priority);
  // What labels must not cover: the bodies of the point items (a label over a wall or a beam is fine).
  const bodies = [...sorted.map((s) => s.body).filter((b): b is Box => !!b), ...(o.keepOff ?? [])];
  const placed: PlacedLabel[] = [];
  const inside = (b: Box) => !o.bounds || (b.cx - b.hw >= o.bounds.x0 && b.cx + b.hw <= o.bounds.x1 && b.cy - b.hh >= o.bounds.y0 && b.cy + b.hh <= o.bounds.y1);
  const tryPlace = (s: LabelSpec, clearOfBodies: boolean) => {
    const size = textBox(s.text, fontM, s.mono);
    for (const { at, dir } of s.spots) {
      const box = { cx: at.x + sgn(dir.x) * (size.hw + gap), cy: at.y + sgn(dir.y) * (size.hh + gap), hw: size.hw, hh: size.hh };
      const padded = { ...box, hw: box.hw + gap / 2, hh: box.hh + gap / 2 };
      if (!inside(box)) continue;
      if (clearOfBodies && bodies.some((b) => overlaps(padded, b))) continue;
      if (placed.some((p) => overlaps(padded, { ...p.box, hw: p.box.hw + gap / 2, hh: p.box.hh + gap / 2 }))) continue;
      placed.push({ id: s.id, text: s.text, mono: s.mono, box, fontM });
      return true;
    }
    return false;
  };
  // The subject, the camera and the key keep their labels in a crowd: over another item's body if they must
  // (never over another label).
  for (const s of sorted) if (!tryPlace(s, true) && s.priority < MUST_LABEL) tryPlace(s, false);
  return placed;
}

/** The bodies of the point items (lights, subject, camera…), which other marks keep off. */
export function itemBodies(items: readonly Item[], units: Units): Box[] {
  return items.map((i, k) => labelSpec(i, units, k)?.body).filter((b): b is Box => !!b);
}

/** The stage with the margin the views keep around it: where labels may go. */
export const labelBounds = (stage: { widthM: number; depthM: number }, marginM = 0.5) => ({ x0: -marginM, y0: -marginM, x1: stage.widthM + marginM, y1: stage.depthM + marginM });

/** The placed labels as a sketch: each text centred in its box (the baseline a third of an em under the middle). */
export function sketchLabels(placed: readonly PlacedLabel[], theme: PlanTheme): SvgNode {
  return g(
    {},
    ...placed.map((p) =>
      text(
        { x: p.box.cx, y: p.box.cy + p.fontM * 0.35, fontSize: p.fontM, fill: theme.label, textAnchor: 'middle', fontFamily: p.mono ? 'IBMPlexMono_400Regular' : 'IBMPlexSans_500Medium'},
        p.text,
      ),
    ),
  );
}
