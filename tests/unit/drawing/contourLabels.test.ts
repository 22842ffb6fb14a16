// One-stop contour labels that do not crowd near a light: over the demo setups' light maps at a phone's fit
// zoom, at most one label a level, each ≥ 11 px, on a long straight stretch of its line, a clear distance from
// every light, and clear of the items, their labels and each other.
import { describe, expect, it } from 'vitest';
import { createEditor } from '../../../canvas/editor/editor';
import { demoSetups } from '../../../db/seed-setups';
import { CONTOUR_LABEL_CLEAR_M, placeContourLabels, turnedBox } from '../../../drawing/contourLabels';
import { itemBodies, labelBounds, overlaps, placeLabels } from '../../../drawing/labels';
import { sketchContours } from '../../../drawing/plan';
import { nodeToSvg } from '../../../drawing/toSvg';
import { computeReadings } from '../../../model/setupReadings';
import { formatStops } from '../../../model/units';

function phoneFitScale(d: (typeof demoSetups)[number]['document']): number {
  const e = createEditor(d);
  e.dispatch('setViewport', { w: 390, h: 790, insetBottom: 132 });
  return e.getState().camera!.scale;
}

/** Distance from (x, y) to the segment a–b. */
function toSegment(x: number, y: number, a: [number, number], b: [number, number]): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const l2 = dx * dx + dy * dy;
  const t = l2 > 0 ? Math.max(0, Math.min(1, ((x - a[0]) * dx + (y - a[1]) * dy) / l2)) : 0;
  return Math.hypot(x - a[0] - t * dx, y - a[1] - t * dy);
}

describe.each(demoSetups.map((d) => [d.title, d.document] as const))('contour labels on %s', (_title, doc) => {
  const map = computeReadings(doc, { lightMap: true }).map!;
  const pxPerM = phoneFitScale(doc);
  const itemLabels = placeLabels(doc.items, { pxPerM, units: 'metric', bounds: labelBounds(doc.stage) });
  const lights = doc.items.filter((i) => i.kind === 'light') as { x: number; y: number }[];
  const avoid = [...itemBodies(doc.items, 'metric'), ...itemLabels.map((l) => l.box)];
  const labels = placeContourLabels(map.contours, { pxPerM, lights, avoid, format: formatStops });

  it('labels some levels, at most once each, at ≥ 11 px', () => {
    expect(map.contours.length).toBeGreaterThan(1);
    expect(labels.length).toBeGreaterThan(0);
    const levels = labels.map((l) => l.stops);
    expect(new Set(levels).size).toBe(levels.length);
    for (const l of labels) expect(l.fontM * pxPerM).toBeGreaterThanOrEqual(11);
  });

  it('keeps each label clear of every light, the items, their labels and the other contour labels', () => {
    for (const l of labels) {
      for (const p of lights) expect(Math.hypot(p.x - l.x, p.y - l.y)).toBeGreaterThanOrEqual(CONTOUR_LABEL_CLEAR_M);
      for (const b of avoid) expect(overlaps(l.box, b)).toBe(false);
    }
    for (let a = 0; a < labels.length; a++) for (let b = a + 1; b < labels.length; b++) expect(overlaps(labels[a]!.box, labels[b]!.box)).toBe(false);
  });

  it('sits on a straight stretch of its own line, along it', () => {
    for (const l of labels) {
      const level = map.contours.find((c) => c.stops === l.stops)!;
      // The label's centre is on one of the level's lines (within a few mm of a segment).
      const d = Math.min(...level.lines.flatMap((pts) => pts.slice(1).map((b, k) => toSegment(l.x, l.y, pts[k]!, b))));
      expect(d).toBeLessThan(0.01);
      expect(l.angleDeg).toBeGreaterThanOrEqual(-90);
      expect(l.angleDeg).toBeLessThanOrEqual(90);
    }
  });

  it('draws the labels it placed, and no more', () => {
    const svg = nodeToSvg(sketchContours(map, '#000', { pxPerM, items: doc.items, itemLabels, units: 'metric' }));
    expect((svg.match(/<text/g) ?? []).length).toBe(labels.length);
  });
});

describe('a contour ring tight around a light', () => {
  it('gets no label', () => {
    const ring: [number, number][] = Array.from({ length: 64 }, (_, k) => [4 + 0.4 * Math.cos((k / 63) * 2 * Math.PI), 3 + 0.4 * Math.sin((k / 63) * 2 * Math.PI)]);
    const straight: [number, number][] = Array.from({ length: 40 }, (_, k) => [1 + k * 0.1, 5]);
    const out = placeContourLabels([{ stops: 2, lines: [ring] }, { stops: -1, lines: [straight] }], { pxPerM: 45, lights: [{ x: 4, y: 3 }], avoid: [], format: formatStops });
    expect(out.map((l) => l.stops)).toEqual([-1]);
    expect(out[0]!.angleDeg).toBeCloseTo(0);
    expect(turnedBox(0, 0, 1, 0.1, 90).hw).toBeCloseTo(0.1);
  });
});
