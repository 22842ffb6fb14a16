// The document → meter scene mapping: every drawn thing reaches the meter the way a photographer expects.
import { describe, expect, it } from 'vitest';
import { meter } from '../../../calc';
import { demoSetups } from '../../../db/seed-setups';
import { parseDocument, type SetupDocument } from '../../../model/document';
import { itemsAtStep, sceneFromDocument } from '../../../model/documentToScene';
import { panelEnds } from '../../../model/items/shaper';
import { kindOf } from '../../../model/kinds';

function doc(items: unknown[], extra: Record<string, unknown> = {}): SetupDocument {
  return parseDocument({ schemaVersion: 1, stage: { widthM: 8, depthM: 6 }, items, ...extra });
}
const subject = { id: 'sub', kind: 'subject', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 };
const camera = { id: 'cam', kind: 'camera', x: 4, y: 6, heightM: 1.6, aimDeg: -90, iso: 100, aperture: 8, shutterS: 1 / 200 };
const keyAt = (y: number, extra: Record<string, unknown> = {}) => ({
  id: 'key', kind: 'light', x: 4, y, heightM: 1.6, aimDeg: -90, tiltDeg: 0, source: { type: 'strobe', energyWs: 500 }, power: 1 / 4, ...extra,
});
const subjectStops = (d: SetupDocument) => meter(sceneFromDocument(d).scene!).subject.stopsVsCamera!;

describe('sceneFromDocument', () => {
  it.each(demoSetups.map((s) => [s.title, s.document] as const))('meters the demo setup "%s"', (_t, d) => {
    const built = sceneFromDocument(d);
    expect(built.missing).toEqual([]);
    const r = meter(built.scene!);
    expect(Number.isFinite(r.subject.aperture)).toBe(true);
    expect(r.lights.length).toBeGreaterThan(0);
  });

  it('more lights than the meter takes is an error to show, not a silent cut (64 metered, 65 refused)', () => {
    const lights = (n: number) => Array.from({ length: n }, (_, i) => keyAt(0.5 + (i % 8) * 0.3, { id: `l${i}`, x: 1 + Math.floor(i / 8) * 0.8 }));
    const ok = sceneFromDocument(doc([subject, camera, ...lights(64)]));
    expect(ok.error).toBeUndefined();
    expect(meter(ok.scene!).lights).toHaveLength(64);
    const over = sceneFromDocument(doc([subject, camera, ...lights(65)]));
    expect(over.scene).toBeNull();
    expect(over.error).toBe('The meter takes at most 64 lights; this plan has 65. Remove or merge some to read the light.');
  });

  it('a tilted card reaches the meter tilted: under a key from above, a card turned 45° face up returns more to the face than an upright one; the crew sheet names the tilt', () => {
    const key = keyAt(4.2, { heightM: 2.4, tiltDeg: -50, aimDeg: -90 });
    const card = (tiltDeg: number) => ({ id: 'card', kind: 'reflector', x: 4, y: 3.45, rotationDeg: -90, widthM: 0.6, heightM: 0.5, baseM: 1.1, tiltDeg });
    const upright = sceneFromDocument(doc([subject, camera, key, card(0)])).scene!;
    const tilted = sceneFromDocument(doc([subject, camera, key, card(45)])).scene!;
    expect(tilted.surfaces!.find((s) => s.id === 'card')!.tiltDeg).toBe(45);
    const bounce = (sc: typeof upright) => meter(sc).subject.bounceLuxSeconds;
    expect(bounce(tilted)).toBeGreaterThan(1.5 * bounce(upright));
    const parsed = doc([subject, camera, key, card(45)]).items.find((i) => i.id === 'card')!;
    expect(kindOf(parsed).gear?.(parsed, 'metric')).toContain('tilted 45° face up');
    expect(kindOf(doc([card(0)]).items[0]!).gear?.(doc([card(0)]).items[0]!, 'metric')).not.toContain('tilted');
  });

  it('says what is missing before a plan can be metered', () => {
    expect(sceneFromDocument(doc([])).missing).toEqual(['a subject', 'a light']);
    expect(sceneFromDocument(doc([subject])).missing).toEqual(['a light']);
    expect(sceneFromDocument(doc([])).scene).toBeNull();
  });

  it('doubling the key light distance costs two stops (inverse-square law)', () => {
    const near = subjectStops(doc([subject, camera, keyAt(4)]));
    const far = subjectStops(doc([subject, camera, keyAt(5)]));
    expect(near - far).toBeCloseTo(2, 1);
  });

  it('each halving of power is one stop (common practice)', () => {
    const full = subjectStops(doc([subject, camera, keyAt(4, { power: 1 / 2 })]));
    const half = subjectStops(doc([subject, camera, keyAt(4, { power: 1 / 4 })]));
    expect(full - half).toBeCloseTo(1, 5);
  });

  it('a one-stop scrim between light and subject costs one stop', () => {
    const open = subjectStops(doc([subject, camera, keyAt(4.5)]));
    const scrim = { id: 'scrim', kind: 'scrim', x: 4, y: 4, rotationDeg: 90, widthM: 1.2, heightM: 1.2, baseM: 0.8, lossStops: 1 };
    expect(open - subjectStops(doc([subject, camera, keyAt(4.5), scrim]))).toBeCloseTo(1, 1);
  });

  it('a flag between light and subject blocks it', () => {
    const flag = { id: 'flag', kind: 'flag', x: 4, y: 4, rotationDeg: 90, widthM: 1, heightM: 1.5, baseM: 1 };
    const r = meter(sceneFromDocument(doc([subject, camera, keyAt(4.5), flag])).scene!);
    expect(r.subject.directLuxSeconds).toBe(0);
  });

  it('a white reflector near the subject adds light; a v-flat adds more with its white face than its black one', () => {
    const light = keyAt(4, { x: 2.5, aimDeg: -33.7 }); // 45° to camera left, aimed at the subject
    const towardSubject = (Math.atan2(3 - 3.8, 4 - 5) * 180) / Math.PI;
    const panel = { x: 5, y: 3.8, rotationDeg: towardSubject, widthM: 1.2, heightM: 2, baseM: 0.5 };
    const without = subjectStops(doc([subject, camera, light]));
    const reflector = subjectStops(doc([subject, camera, light, { ...panel, id: 'ref', kind: 'reflector', finish: 'white' }]));
    const white = subjectStops(doc([subject, camera, light, { ...panel, id: 'vf', kind: 'vflat', face: 'white' }]));
    const black = subjectStops(doc([subject, camera, light, { ...panel, id: 'vf', kind: 'vflat', face: 'black' }]));
    expect(reflector).toBeGreaterThan(without);
    expect(white).toBeGreaterThan(black);
  });

  it('a lamp that is off adds nothing', () => {
    const r = meter(sceneFromDocument(doc([subject, camera, keyAt(4, { on: false })])).scene!);
    expect(r.subject.luxSeconds).toBe(0);
  });

  it('uses a stand-in camera in front of the subject when none is drawn', () => {
    const built = sceneFromDocument(doc([subject, keyAt(4)]));
    expect(built.assumedCamera).toBe(true);
    expect(built.scene!.camera.y).toBeCloseTo(6);
  });
});

describe('itemsAtStep', () => {
  const d = doc([subject, camera, keyAt(4), { id: 'n', kind: 'note', x: 1, y: 1, text: 'hi' }], {
    steps: [
      { id: 's1', itemIds: ['sub', 'cam'] },
      { id: 's2', itemIds: ['key'] },
    ],
  });
  it('adds items as the steps go on; items in no step are always there', () => {
    expect(itemsAtStep(d, 0).map((i) => i.id)).toEqual(['sub', 'cam', 'n']);
    expect(itemsAtStep(d, 1).map((i) => i.id)).toEqual(['sub', 'cam', 'key', 'n']);
    expect(itemsAtStep(d).length).toBe(4);
  });
});

describe('panelEnds', () => {
  it('puts the working face on the right of the walk from a to b (y down the screen)', () => {
    // Facing +y (down the screen): the walk from a to b goes along +x, and the right hand of an eastward walk
    // on a y-down screen points down the screen.
    const { a, b } = panelEnds({ x: 0, y: 0, rotationDeg: 90, widthM: 2 });
    expect(a.x).toBeCloseTo(-1);
    expect(b.x).toBeCloseTo(1);
    expect(a.y).toBeCloseTo(0);
  });
});
