// Where a light map's one-stop contours get their labels: at most one per level, where the line runs long and
// straight enough to carry the words, as far as it can from the lights and other items, clear of their labels
// and of each other. Near a light the contours are small tight rings; a label there would crowd the glyph and
// say little, so a label stays a clear distance from every light.
import type { ContourLevel } from '../calc';
import { LABEL_PX, overlaps, textBox, type Box } from './labels';

/** A contour label: its centre and angle (degrees, kept upright) in plan metres, font size in metres. */
export type ContourLabel = { stops: number; text: string; x: number; y: number; angleDeg: number; fontM: number; box: Box };

/** How far a contour label keeps from any light, metres. */
export const CONTOUR_LABEL_CLEAR_M = 0.6;
/** A stretch counts as straight when its chord is at least this share of its length along the line. */
const STRAIGHT = 0.97;

type Point = { x: number; y: number };

/** The axis-aligned box around a text box of half sizes (hw, hh) turned by `deg` about (x, y). */
export function turnedBox(x: number, y: number, hw: number, hh: number, deg: number): Box {
  const a = (deg * Math.PI) / 180;
  const c = Math.abs(Math.cos(a));
  const s = Math.abs(Math.sin(a));
  return { cx: x, cy: y, hw: hw * c + hh * s, hh: hw * s + hh * c };
}

/**
 * One label per contour level. `lights`: where the lights stand; `avoid`: boxes the labels must keep off (item
 * bodies and item labels); `format`: the level's words.
 */
export function placeContourLabels(levels: readonly ContourLevel[], o: { pxPerM: number; lights: readonly Point[]; avoid: readonly Box[]; format: (stops: number) => string; fontPx?: number; clearM?: number }): ContourLabel[] {
  const fontM = (o.fontPx ?? LABEL_PX - 1) / o.pxPerM;
  const clear = o.clearM ?? CONTOUR_LABEL_CLEAR_M;
  const pad = 3 / o.pxPerM;
  // Room kept from item labels and bodies, so a stop figure never reads as part of an item's words.
  const apart = 8 / o.pxPerM;
  const placed: ContourLabel[] = [];
  const nearestLight = (p: Point) => o.lights.reduce((m, l) => Math.min(m, Math.hypot(l.x - p.x, l.y - p.y)), Infinity);
  // The subject's level (0) first, then by nearness to it: the levels a photographer reads first.
  const order = [...levels].sort((a, b) => Math.abs(a.stops) - Math.abs(b.stops) || a.stops - b.stops);
  for (const level of order) {
    const words = o.format(level.stops);
    const size = textBox(words, fontM, true);
    const need = 2 * size.hw + 2 * pad; // the stretch of line the words sit along
    let best: { score: number; label: ContourLabel } | null = null;
    for (const line of level.lines) {
      if (line.length < 2) continue;
      // Cumulative length along the line, for windows of `need` metres.
      const along = [0];
      for (let k = 1; k < line.length; k++) along.push(along[k - 1]! + Math.hypot(line[k]![0] - line[k - 1]![0], line[k]![1] - line[k - 1]![1]));
      if (along[along.length - 1]! < need) continue;
      const stride = Math.max(1, Math.floor(line.length / 60));
      let j = 0;
      for (let i = 0; i < line.length; i += stride) {
        if (j < i) j = i;
        while (j < line.length - 1 && along[j]! - along[i]! < need) j++;
        const len = along[j]! - along[i]!;
        if (len < need) break;
        const [x0, y0] = line[i]!;
        const [x1, y1] = line[j]!;
        const chord = Math.hypot(x1 - x0, y1 - y0);
        const straight = chord / len;
        if (straight < STRAIGHT) continue;
        // On the line itself, halfway along the stretch (the chord's midpoint would float off a bowed line).
        const half = along[i]! + len / 2;
        let m = i;
        while (m < j - 1 && along[m + 1]! < half) m++;
        const seg = along[m + 1]! - along[m]!;
        const t = seg > 0 ? (half - along[m]!) / seg : 0;
        const c = { x: line[m]![0] + (line[m + 1]![0] - line[m]![0]) * t, y: line[m]![1] + (line[m + 1]![1] - line[m]![1]) * t };
        const away = nearestLight(c);
        if (away < clear) continue;
        let deg = (Math.atan2(y1 - y0, x1 - x0) * 180) / Math.PI;
        if (deg > 90) deg -= 180;
        if (deg < -90) deg += 180;
        const box = turnedBox(c.x, c.y, size.hw + pad, size.hh + pad, deg);
        const wide = { ...box, hw: box.hw + apart, hh: box.hh + apart };
        if (o.avoid.some((b) => overlaps(wide, b)) || placed.some((p) => overlaps(wide, p.box))) continue;
        // Prefer the spot farthest from the lights and from other contour labels, then the straightest.
        const fromLabels = placed.reduce((m, p) => Math.min(m, Math.hypot(p.x - c.x, p.y - c.y)), Infinity);
        const score = Math.min(away, 3) + Math.min(fromLabels, 2) + straight;
        if (!best || score > best.score) best = { score, label: { stops: level.stops, text: words, x: c.x, y: c.y, angleDeg: deg, fontM, box } };
      }
    }
    if (best) placed.push(best.label);
  }
  return placed;
}
