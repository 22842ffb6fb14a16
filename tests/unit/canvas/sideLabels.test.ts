// The side view in a narrow pane: labels at 11 px, none overlapping each other or a head, over the demo setups
// cut along the camera's line and along each light's, in a 300 px pane (the wide screen's) and a phone's 390 px;
// beams in the gel's colours, the same the plan draws.
import { describe, expect, it } from 'vitest';
import { GELS } from '../../../calc';
import { sideScene, sideTransform } from '../../../components/side/elevation';
import { SIDE_LABEL_PX, scaleHeights, sideLabels } from '../../../components/side/sideLabels';
import type { SetupDocument } from '../../../model/document';
import { demoSetups } from '../../../db/seed-setups';
import { lightInk } from '../../../drawing/glyphs';
import { overlaps } from '../../../drawing/labels';
import { graphiteTheme } from '../../../drawing/theme';

const cuts = demoSetups.flatMap((d) => [null, ...d.document.items.filter((i) => i.kind === 'light').map((i) => i.id)].map((ref) => [d.title, ref, d.document] as const));

describe.each([
  { w: 300, h: 200 },
  { w: 390, h: 260 },
])('side view labels in a $w × $h pane', (box) => {
  it.each(cuts)('%s along %s: ≥ 11 px, clear of each other and of the heads', (_t, ref, doc) => {
    const scene = sideScene(doc, ref)!;
    const labels = sideLabels(scene, box, 'metric', []);
    expect(labels.length).toBeGreaterThan(0);
    for (const l of labels) expect(l.fontM).toBeGreaterThanOrEqual(11);
    for (let a = 0; a < labels.length; a++) for (let b = a + 1; b < labels.length; b++) expect(overlaps(labels[a]!.box, labels[b]!.box), `${labels[a]!.text} / ${labels[b]!.text}`).toBe(false);
    const t = sideTransform(scene, box);
    for (const l of labels) {
      expect(l.box.cx - l.box.hw).toBeGreaterThanOrEqual(0);
      expect(l.box.cx + l.box.hw).toBeLessThanOrEqual(box.w);
      for (const sh of scene.shapes)
        if (sh.kind === 'light' || sh.kind === 'camera') {
          const c = t.toPx(sh.at);
          expect(overlaps(l.box, { cx: c.x, cy: c.y, hw: 7, hh: 7 }), `${l.text} over ${sh.id}`).toBe(false);
        }
    }
    // The subject is always labelled.
    const subject = scene.shapes.find((s) => s.kind === 'subject');
    if (subject) expect(labels.some((l) => l.id === subject.id)).toBe(true);
  });
});

it('the selected item is labelled first', () => {
  const doc = demoSetups[1]!.document;
  const light = doc.items.find((i) => i.kind === 'light')!;
  const labels = sideLabels(sideScene(doc)!, { w: 300, h: 200 }, 'metric', [light.id]);
  expect(labels[0]!.id).toBe(light.id);
  expect(SIDE_LABEL_PX).toBeGreaterThanOrEqual(11);
});

it('draws each light in its gel’s colours, as the plan does', () => {
  for (const d of demoSetups)
    for (const i of d.document.items) {
      if (i.kind !== 'light') continue;
      const sh = sideScene(d.document, i.id)!.shapes.find((s) => s.id === i.id);
      expect(sh).toMatchObject({ kind: 'light', tint: lightInk(i.gel, graphiteTheme), beam: GELS[i.gel].tint });
    }
  const teal = demoSetups.flatMap((d) => d.document.items).find((i) => i.kind === 'light' && i.gel !== 'none');
  expect(teal).toBeTruthy();
});

it('a head at a scale height keeps its place and label; the scale label moves to the other end or gives way', () => {
  const d = demoSetups[1]!.document;
  const light = d.items.find((i) => i.kind === 'light')!;
  // Cut along a light raised to 2 m: its head sits at the left end of the 2 m line, where the scale names it.
  const doc = { ...d, items: d.items.map((i) => (i.id === light.id ? { ...i, heightM: 2, tiltDeg: -20 } : i)) } as SetupDocument;
  const scene = sideScene(doc, light.id)!;
  expect(scaleHeights(scene)).toContain(2);
  for (const box of [{ w: 300, h: 200 }, { w: 390, h: 260 }]) {
    const labels = sideLabels(scene, box, 'metric', []);
    const head = labels.find((l) => l.id === light.id);
    expect(head?.role).toBe('head');
    // Where the scale's "2 m" used to be drawn (fixed, just above the line's left end): over the head's label.
    const t = sideTransform(scene, box);
    const at = t.toPx({ u: scene.u0, z: 2 });
    const old = { cx: at.x + 2 + 12, cy: at.y - 3 - 4, hw: 12, hh: 6.6 };
    const head0 = scene.shapes.find((sh) => sh.id === light.id);
    if (head0?.kind !== 'light') throw new Error('the light is not in the view');
    const c = t.toPx(head0.at);
    const marks = [...labels.filter((l) => l.role === 'head').map((l) => l.box), { cx: c.x, cy: c.y, hw: 8, hh: 8 }];
    expect(marks.some((m) => overlaps(m, old))).toBe(true);
    const two = labels.find((l) => l.id === 'scale-2');
    if (two) for (const m of marks) expect(overlaps(two.box, m)).toBe(false);
    // The other whole metres are still named.
    expect(labels.some((l) => l.role === 'scale')).toBe(true);
  }
});
