// The side view, headless: the cut along the camera's (or a light's) line, heights and tilts where they are,
// the ceiling, and a drag in the view changing a height or a tilt through the editor (one undo each).
import { describe, expect, it } from 'vitest';
import { createEditor } from '../../../canvas/editor/editor';
import { demoSetups } from '../../../db/seed-setups';
import { beamEdges, sideScene, sideTransform, tiltHandle, tiltToward } from '../../../components/side/elevation';
import { parseDocument } from '../../../model/document';
import { createSideDrag, sideHit } from '../../../components/side/sideDrag';
import { suggestedPower } from '../../../components/editor/suggestedPower';

const doc = () => demoSetups[0]!.document;
const box = { w: 600, h: 300 };

describe('the cut along the camera', () => {
  it('puts the camera at the start, the subject 2.2 m along, each at its height, and the ceiling', () => {
    const sc = sideScene(doc())!;
    const cam = sc.shapes.find((s) => s.id === 'cam')!;
    const sitter = sc.shapes.find((s) => s.id === 'sitter')!;
    const key = sc.shapes.find((s) => s.id === 'key')!;
    expect(cam.kind === 'camera' && cam.at).toEqual({ u: 0, z: 1.3 });
    expect(sitter.kind === 'subject' && sitter.at.u).toBeCloseTo(2.2, 9); // camera (4, 5.4) → sitter (4, 3.2)
    expect(sitter.kind === 'subject' && sitter.at.z).toBe(1.25);
    // The key (4, 4.1) hangs between them at 2.1 m, tilted 40° down, aimed away from the camera.
    expect(key.kind === 'light' && key).toMatchObject({ at: { u: expect.closeTo(1.3, 9), z: 2.1 }, tiltDeg: -40, facing: 1 });
    expect(sc.ceiling).toBe(3);
    // The backdrop wall crosses the line behind the sitter.
    expect(sc.shapes.find((s) => s.id === 'backdrop')).toMatchObject({ kind: 'wall', u: expect.closeTo(4.2, 9) });
  });

  it('leans a tilted panel: the card under the chin, turned 45° face up, leans back towards the camera from its lower edge', () => {
    const base = doc();
    const items = base.items.map((i) => (i.id === 'under' && i.kind === 'reflector' ? { ...i, tiltDeg: 45, baseM: 0.75 } : i));
    const card = sideScene({ ...base, items }, 'cam')!.shapes.find((s) => s.id === 'under')!;
    // The card (4, 3.75) is 1.65 m along the camera's line; it faces the sitter (away from the camera), so its top
    // leans 0.6·sin 45° back towards the camera and sits 0.6·cos 45° over its lower edge.
    expect(card).toMatchObject({ kind: 'panel', bottom: { u: expect.closeTo(1.65, 9), z: 0.75 }, top: { u: expect.closeTo(1.65 - 0.6 * Math.SQRT1_2, 9), z: expect.closeTo(0.75 + 0.6 * Math.SQRT1_2, 9) } });
    const upright = sideScene({ ...base, items: base.items.map((i) => (i.id === 'under' && i.kind === 'reflector' ? { ...i, tiltDeg: 0 } : i)) }, 'cam')!.shapes.find((s) => s.id === 'under')!;
    expect(upright.kind === 'panel' && upright.top.u).toBeCloseTo(upright.kind === 'panel' ? upright.bottom.u : NaN, 9);
  });

  it('cuts along a chosen light instead', () => {
    const sc = sideScene(doc(), 'key')!;
    expect(sc.line.fromId).toBe('key');
    expect(sc.shapes.find((s) => s.id === 'key')).toMatchObject({ at: { u: 0 } });
  });

  it('names unlabelled items as people do ("Light 2"), never by their internal id', () => {
    const base = doc();
    const key = base.items.find((i) => i.id === 'key')! as Extract<(typeof base.items)[number], { kind: 'light' }>;
    const items = [...base.items, { ...key, id: 'light-9', x: key.x + 0.5 }].map((i) => ({ ...i, label: '' }));
    const unlabelled = { ...base, items };
    const sc = sideScene(unlabelled)!;
    const lights = sc.shapes.filter((s) => s.kind === 'light').map((s) => s.label);
    expect(lights.length).toBeGreaterThan(1);
    for (const s of sc.shapes) expect(s.label, s.id).not.toBe(s.id);
    expect(lights).toContain('Light 1');
  });

  it('draws nothing without a subject and a camera', () => {
    expect(sideScene({ ...doc(), items: doc().items.filter((i) => i.kind !== 'camera') })).toBeNull();
  });

  it('keeps one scale for both axes (a room is not stretched)', () => {
    const sc = sideScene(doc())!;
    const t = sideTransform(sc, box);
    const a = t.toPx({ u: 0, z: 0 });
    const b = t.toPx({ u: 1, z: 1 });
    expect(b.x - a.x).toBeCloseTo(a.y - b.y, 9);
    expect(t.toM(b.x, b.y).u).toBeCloseTo(1, 9);
  });

  it('turns a handle position into a tilt and back', () => {
    const at = { u: 1, z: 2 };
    expect(tiltToward(at, tiltHandle(at, -30, 1))).toBeCloseTo(-30, 6);
    expect(tiltToward(at, tiltHandle(at, 20, -1))).toBeCloseTo(20, 6);
  });
});

describe('dragging in the side view', () => {
  function setup() {
    const e = createEditor(doc());
    const sc = sideScene(e.getState().doc)!;
    return { e, sc, t: sideTransform(sc, box), drag: createSideDrag() };
  }

  it('a head dragged up is raised (snapped to 5 cm), as one undo step, and selected', () => {
    const { e, sc, t, drag } = setup();
    const p = t.toPx({ u: 1.3, z: 2.1 });
    expect(drag.down(e, sc, box, p.x, p.y)).toBe(true);
    expect(drag.state.name).toBe('lifting');
    for (let k = 1; k <= 5; k++) drag.move(e, sc, box, p.x, p.y - (k * 0.1 * t.scale) / 1);
    drag.up(e);
    const key = e.getState().doc.items.find((i) => i.id === 'key') as { heightM: number };
    expect(key.heightM).toBeCloseTo(2.6, 6);
    expect(e.getState().selection).toEqual(['key']);
    expect(e.getState().past).toHaveLength(1);
    e.dispatch('undo');
    expect((e.getState().doc.items.find((i) => i.id === 'key') as { heightM: number }).heightM).toBe(2.1);
  });

  it('the tilt handle turns the head up or down', () => {
    const { e, sc, t, drag } = setup();
    const key = sc.shapes.find((s) => s.id === 'key')!;
    if (key.kind !== 'light') throw new Error('the key is a light');
    const h = t.toPx(tiltHandle(key.at, key.tiltDeg, key.facing));
    expect(sideHit(sc, box, h.x, h.y)).toMatchObject({ id: 'key', what: 'tilt' });
    drag.down(e, sc, box, h.x, h.y);
    const level = t.toPx({ u: key.at.u + 0.8, z: key.at.z });
    drag.move(e, sc, box, level.x, level.y);
    drag.up(e);
    expect((e.getState().doc.items.find((i) => i.id === 'key') as { tiltDeg: number }).tiltDeg).toBe(0);
  });

  it('a press on empty space takes nothing; a read-only plan takes nothing', () => {
    const { e, sc, drag } = setup();
    expect(drag.down(e, sc, box, 2, 2)).toBe(false);
    const ro = createEditor(doc(), { readOnly: true });
    const t = sideTransform(sc, box);
    const p = t.toPx({ u: 1.3, z: 2.1 });
    expect(drag.down(ro, sc, box, p.x, p.y)).toBe(false);
  });
});

describe('the suggested power', () => {
  const light = (o: object) => ({ id: 'k', enabled: true, role: 'key', powerFraction: 1 / 8, minPowerFraction: 1 / 256, vsKey: null, backgroundTone: null, forTarget: { fraction: 1 / 4, beyondFull: false, belowMinimum: false }, ...o });
  const result = (l: object) => ({ lights: [light(l)] }) as never;

  it('offers the power for the target aperture, rounded to a tenth of a stop', () => {
    expect(suggestedPower(result({}), 'k')).toEqual({ lightId: 'k', fraction: 0.25, why: 'target-aperture' });
    expect(suggestedPower(result({ forTarget: { fraction: 0.3, beyondFull: false, belowMinimum: false } }), 'k')!.fraction).toBeCloseTo(2 ** (Math.round(Math.log2(0.3) * 10) / 10), 9);
  });

  it('offers nothing when already there, beyond full power, or for a light that is off', () => {
    expect(suggestedPower(result({ powerFraction: 0.25 }), 'k')).toBeNull();
    expect(suggestedPower(result({ forTarget: { fraction: 2, beyondFull: true, belowMinimum: false } }), 'k')).toBeNull();
    expect(suggestedPower(result({ enabled: false }), 'k')).toBeNull();
  });

  it('a rim is set to its level over the key', () => {
    expect(suggestedPower(result({ role: 'rim', vsKey: { fraction: 1 / 2, beyondFull: false, belowMinimum: false } }), 'k')).toMatchObject({ fraction: 0.5, why: 'level-over-key' });
  });
});

describe('beams stop at the ceiling and the floor', () => {
  // Look 3 of the everyday looks: a speedlight on the camera turned straight up to bounce off a 2.6 m ceiling.
  const bounce = parseDocument({
    schemaVersion: 1,
    stage: { widthM: 8, depthM: 6 },
    meter: { ceiling: { heightM: 2.6 } },
    items: [
      { id: 'sub', kind: 'subject', x: 4, y: 1.8, facingDeg: 90, faceHeightM: 1.6 },
      { id: 'cam', kind: 'camera', x: 4, y: 4.2, heightM: 1.6, aimDeg: -90 },
      { id: 'flash', kind: 'light', x: 4.15, y: 4.2, heightM: 1.75, aimDeg: -90, tiltDeg: 90, source: { type: 'speedlight', guideNumberM: 45 }, modifier: 'bare-reflector' },
    ],
  });

  it('draws a bounce flash up to the ceiling, not through it', () => {
    const sc = sideScene(bounce)!;
    const flash = sc.shapes.find((s) => s.id === 'flash')!;
    if (flash.kind !== 'light') throw new Error('not a light');
    const [a, b] = beamEdges(flash, sc.ceiling);
    expect(sc.ceiling).toBe(2.6);
    expect(a.z).toBeCloseTo(2.6, 9);
    expect(b.z).toBeCloseTo(2.6, 9);
  });

  it('keeps a beam under the ceiling its full length, and stops one aimed down at the floor', () => {
    const level = beamEdges({ at: { u: 0, z: 1.5 }, tiltDeg: 0, halfDeg: 10, facing: 1 }, 2.6);
    expect(Math.hypot(level[0].u, level[0].z - 1.5)).toBeCloseTo(2.2, 9);
    const down = beamEdges({ at: { u: 0, z: 1 }, tiltDeg: -60, halfDeg: 20, facing: 1 }, 2.6);
    expect(down[1].z).toBeCloseTo(0, 9);
    expect(down[1].u).toBeCloseTo(1 / Math.tan((80 * Math.PI) / 180), 9);
  });
});

