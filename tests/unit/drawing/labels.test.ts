// Plan labels on a phone: at the fit zoom on a 390 px wide view (the editor above its sheet's peek), every label
// is at least 11 px on screen and no two overlap, over the demo setups and the everyday looks (our own invented
// plans); the most important labels (subject, camera, key) always find a spot; a crowded plan leaves the minor
// ones off rather than overlapping them; the exports place them the same way.
import { describe, expect, it } from 'vitest';
import { createEditor } from '../../../canvas/editor/editor';
import { demoSetups } from '../../../db/seed-setups';
import { LABEL_PX, overlaps, placeLabels, labelBounds, type PlacedLabel } from '../../../drawing/labels';
import { sketchPlan } from '../../../drawing/plan';
import { paperTheme } from '../../../drawing/theme';
import { nodeToSvg } from '../../../drawing/toSvg';
import { emptyDocument, type Item, type SetupDocument } from '../../../model/document';
import { createItem } from '../../../model/kinds';

const make = (kind: Item['kind'], id: string, at: { x: number; y: number }, extra: Record<string, unknown> = {}) => ({ ...createItem(kind, id, at), ...extra }) as Item;
const doc = (items: Item[], stage = { widthM: 8, depthM: 6 }): SetupDocument => ({ ...emptyDocument(), stage, items });

// The everyday looks, as plans of our own.
const looks: [string, SetupDocument][] = [
  [
    'coloured wash and a kicker',
    doc([
      make('wall', 'wall', { x: 0, y: 0 }, { a: { x: 1, y: 1 }, b: { x: 7, y: 1 }, colour: '#d8d4cc' }),
      make('subject', 'sitter', { x: 4, y: 3 }, { label: 'Sitter', facingDeg: 90 }),
      make('camera', 'cam', { x: 4, y: 6 }, { label: 'Camera', aimDeg: -90 }),
      make('light', 'wash', { x: 2.9, y: 2.2 }, { label: 'Blue wash', role: 'background', gel: 'blue', aimDeg: -60 }),
      make('light', 'kick', { x: 5.1, y: 2.4 }, { label: 'Kicker', role: 'kicker', modifier: 'snoot', aimDeg: 150 }),
      make('prop', 'stool', { x: 4, y: 3.2 }, { label: 'Stool' }),
    ]),
  ],
  [
    'two edges on black, then a key',
    doc([
      make('wall', 'black', { x: 0, y: 0 }, { a: { x: 1.5, y: 0.8 }, b: { x: 6.5, y: 0.8 }, surface: 'seamless', colour: '#111111', label: 'Black paper' }),
      make('subject', 'runner', { x: 4, y: 2.6 }, { label: 'Runner', facingDeg: 90 }),
      make('light', 'rimL', { x: 2.8, y: 1.8 }, { label: 'Strip left', role: 'rim', modifier: 'strip', aimDeg: 40 }),
      make('light', 'rimR', { x: 5.2, y: 1.8 }, { label: 'Strip right', role: 'rim', modifier: 'strip', aimDeg: 140 }),
      make('flag', 'flagL', { x: 3.1, y: 2.6 }, { label: 'Flag', rotationDeg: 90 }),
      make('light', 'dish', { x: 2.9, y: 3.6 }, { label: 'Dish key', role: 'key', modifier: 'beauty-dish', aimDeg: -40 }),
      make('camera', 'cam', { x: 4, y: 5.4 }, { label: 'Camera', aimDeg: -90 }),
    ]),
  ],
  [
    'a small white room',
    doc(
      [
        make('wall', 'w1', { x: 0, y: 0 }, { a: { x: 0.3, y: 0.3 }, b: { x: 3.7, y: 0.3 } }),
        make('wall', 'w2', { x: 0, y: 0 }, { a: { x: 0.3, y: 0.3 }, b: { x: 0.3, y: 3.7 } }),
        make('wall', 'w3', { x: 0, y: 0 }, { a: { x: 3.7, y: 0.3 }, b: { x: 3.7, y: 3.7 } }),
        make('subject', 'sub', { x: 2, y: 1.3 }, { label: 'Subject', facingDeg: 90 }),
        make('camera', 'cam', { x: 2, y: 3 }, { label: 'Camera', aimDeg: -90 }),
        make('light', 'bounce', { x: 2.1, y: 2.9 }, { label: 'Speedlight bounce', role: 'fill', aimDeg: -90 }),
        make('light', 'box', { x: 1.2, y: 1.9 }, { label: 'Softbox 45°', role: 'key', modifier: 'softbox', aimDeg: -35 }),
        make('tape', 't', { x: 0, y: 0 }, { a: { x: 2, y: 1.3 }, b: { x: 1.2, y: 1.9 } }),
      ],
      { widthM: 4, depthM: 4 },
    ),
  ],
];

const plans: [string, SetupDocument][] = [...demoSetups.map((d) => [d.title, d.document] as [string, SetupDocument]), ...looks];

/** The plan's scale at fit on a phone: 390 px wide, the screen under the top bar, the sheet at its peek. */
function phoneFitScale(d: SetupDocument): number {
  const e = createEditor(d);
  e.dispatch('setViewport', { w: 390, h: 790, insetBottom: 132 });
  return e.getState().camera!.scale;
}

function expectClear(placed: PlacedLabel[], pxPerM: number) {
  for (const p of placed) expect(p.fontM * pxPerM).toBeGreaterThanOrEqual(11);
  for (let a = 0; a < placed.length; a++) for (let b = a + 1; b < placed.length; b++) expect(overlaps(placed[a]!.box, placed[b]!.box), `${placed[a]!.text} over ${placed[b]!.text}`).toBe(false);
}

describe('plan labels at the fit zoom on a phone', () => {
  it.each(plans)('%s: every label ≥ 11 px, none overlapping, the subject, camera and key labelled', (_title, d) => {
    const pxPerM = phoneFitScale(d);
    if (d.stage.widthM >= 8) expect(0.17 * pxPerM).toBeLessThan(11); // (the old labels, 0.17 m, were under 11 px here)
    const placed = placeLabels(d.items, { pxPerM, units: 'metric', bounds: labelBounds(d.stage) });
    expectClear(placed, pxPerM);
    const ids = new Set(placed.map((p) => p.id));
    for (const i of d.items) {
      const important = i.kind === 'subject' || i.kind === 'camera' || (i.kind === 'light' && i.role === 'key');
      if (important && (i.kind === 'camera' || i.label)) expect(ids.has(i.id), `${i.kind} ${i.id} labelled`).toBe(true);
    }
    // No label covers an item's body (a light, the subject, the camera).
    for (const p of placed)
      for (const i of d.items)
        if (i.kind === 'light' || i.kind === 'subject' || i.kind === 'camera') expect(overlaps(p.box, { cx: i.x, cy: i.y, hw: 0.12, hh: 0.12 }), `${p.text} over ${i.id}`).toBe(false);
  });

  it('in imperial too', () => {
    for (const [, d] of plans) {
      const pxPerM = phoneFitScale(d);
      expectClear(placeLabels(d.items, { pxPerM, units: 'imperial', bounds: labelBounds(d.stage) }), pxPerM);
    }
  });

  it('a crowded plan leaves the minor labels off, never overlapping, and keeps the subject, camera and key', () => {
    const items: Item[] = [make('subject', 's', { x: 4, y: 3 }, { label: 'Subject' }), make('camera', 'c', { x: 4, y: 4.2 }, { label: 'Camera', aimDeg: -90 }), make('light', 'k', { x: 3.4, y: 3.4 }, { label: 'Key light', role: 'key' })];
    for (let k = 0; k < 12; k++) items.push(make('light', `a${k}`, { x: 3 + (k % 4) * 0.6, y: 2.4 + Math.floor(k / 4) * 0.5 }, { label: `Accent number ${k}`, role: 'accent' }));
    const pxPerM = 45;
    const placed = placeLabels(items, { pxPerM, units: 'metric', bounds: labelBounds({ widthM: 8, depthM: 6 }) });
    expectClear(placed, pxPerM);
    expect(placed.slice(0, 3).map((p) => p.id)).toEqual(['s', 'c', 'k']);
    expect(placed.length).toBeLessThan(items.length);
  });

  it('a light label steps away from the side its beam points to', () => {
    const l = make('light', 'l', { x: 4, y: 3 }, { label: 'Key', aimDeg: 90 });
    const [p] = placeLabels([l], { pxPerM: 45, units: 'metric' });
    expect(p!.box.cy).toBeLessThan(3); // aimed down the plan: the label goes above
  });

  it('the exports place the same labels, at the drawing scale', () => {
    const d = demoSetups[1]!.document;
    const svg = nodeToSvg(sketchPlan(d, { theme: paperTheme, units: 'metric', pxPerM: 80 }).root);
    const placed = placeLabels(d.items, { pxPerM: 80, units: 'metric', bounds: labelBounds(d.stage) });
    expect(placed.length).toBeGreaterThan(3);
    for (const p of placed) expect(svg).toContain(`>${p.text}</text>`);
    expect(svg).toContain(`font-size="${Math.round((LABEL_PX / 80) * 10000) / 10000}"`);
  });
});
