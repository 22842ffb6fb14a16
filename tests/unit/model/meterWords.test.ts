// The new readings where a crew or a class reads them: the change line's kicker against the key, a subject target
// read by a named receptor, and the crew sheet's rows for a kicker, a wall wash and the background's range.
// Plans are invented; the stops follow from the inverse-square law (common practice).
import { describe, expect, it } from 'vitest';
import { checkSchema, evaluateCheck, stepChangeLine } from '../../../model/classes';
import { crewSheet } from '../../../model/crewSheet';
import { demoSetups } from '../../../db/seed-setups';
import { parseDocument, type SetupDocument } from '../../../model/document';

const subject = { id: 'sub', kind: 'subject', label: 'Sitter', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 };
const camera = { id: 'cam', kind: 'camera', x: 4, y: 5.6, heightM: 1.6, aimDeg: -90, iso: 100, aperture: 8, shutterS: 1 / 200 };
/** A bare head at (x, y), face height, aimed at the subject. */
const head = (id: string, x: number, y: number, extra: Record<string, unknown> = {}) => ({
  id, kind: 'light', label: id, x, y, heightM: 1.6, aimDeg: (Math.atan2(3 - y, 4 - x) * 180) / Math.PI, tiltDeg: 0,
  source: { type: 'strobe', energyWs: 400 }, power: 1 / 4, modifier: 'bare-reflector', ...extra,
});
/** No room bounce: black floor, no ceiling. */
const DARK_STAGE = { meter: { floor: { colour: '#111111', reflectance: 0 }, ceiling: { heightM: null } } };
const doc = (items: unknown[], extra: Record<string, unknown> = {}): SetupDocument =>
  parseDocument({ schemaVersion: 1, stage: { widthM: 8, depthM: 6 }, items, ...DARK_STAGE, ...extra });
const r2 = Math.SQRT2;
// Key 2 m away at front left; kicker √2 m away behind on the right, aimed forward at the face.
const key = head('Key', 4 - r2, 3 + r2, { role: 'key' });
const kicker = head('Kicker', 5, 2, { role: 'kicker' });

describe('the change line reads a kicker against the key', () => {
  it('adding the kicker: +1.0 stop over the key (half the distance squared, read pointed at each light) on the shadow side', () => {
    const d = doc([subject, camera, key, kicker], { steps: [{ id: 'a', title: 'Key', itemIds: ['sub', 'cam', 'Key'] }, { id: 'b', title: 'Kicker', itemIds: ['Kicker'] }] });
    expect(stepChangeLine(d, 1)).toMatch(/^adding Kicker: .*\+1\.0 stop over the key on the shadow side$/);
  });

  it('on the key side when it stands on the key side of the camera line', () => {
    const same = head('Kicker', 3, 2, { role: 'kicker' });
    const d = doc([subject, camera, key, same], { steps: [{ id: 'a', title: 'Key', itemIds: ['sub', 'cam', 'Key'] }, { id: 'b', title: 'Kicker', itemIds: ['Kicker'] }] });
    expect(stepChangeLine(d, 1)).toMatch(/over the key on the key side$/);
  });
});

describe('a subject target may name the receptor', () => {
  // A light from the side (90° from the face and from the camera line): flat along the face reads nothing,
  // the dome to the camera half its frontal response ((1 + cos 90°)/2), the disc pointed at the light all of it.
  const side = head('Side', 6, 3);
  const d = doc([subject, camera, side]);
  const measured = (receptor?: string) =>
    evaluateCheck(checkSchema.parse({ criteria: [{ measure: 'subject', min: -20, ...(receptor ? { receptor } : {}) }] }), d).criteria[0]!;

  it('pointed at the light reads one stop over the dome (its projected area halves at 90°)', () => {
    expect(measured('flat-light').measured! - measured().measured!).toBeCloseTo(1, 6);
    expect(measured('dome-camera').measured).toBeCloseTo(measured().measured!, 9);
  });

  it('flat along the face reads no light, and says so', () => {
    const c = measured('flat-face');
    expect(c.measured).toBeNull();
    expect(c.note).toBe('no light on a flat disc along the face');
    expect(c.target).toContain('read by a flat disc along the face');
  });

  it('refuses a receptor it does not know, naming the field', () => {
    const r = checkSchema.safeParse({ criteria: [{ measure: 'subject', min: 0, receptor: 'sphere' }] });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path.join('.')).toBe('criteria.0.receptor');
  });
});

describe('the crew sheet prints the new readings', () => {
  const wall = { id: 'bg', kind: 'wall', label: 'Grey wall', surface: 'wall', a: { x: 1, y: 1 }, b: { x: 7, y: 1 }, heightM: 2.7, colour: '#808080' };
  const wash = head('Wash', 4.8, 2, { role: 'background', aimDeg: -100, tiltDeg: 5, gel: 'full-cto', power: 1 });

  it('a kicker as stops over the key read pointed at it, with the wanted level', () => {
    const s = crewSheet(doc([subject, camera, key, kicker]), { title: 'Kick', units: 'metric' });
    const row = s.readings.find((r) => r.label === 'Kicker')!;
    expect(row.value).toBe('+1.0 vs key');
    expect(row.detail).toMatch(/^pointed at the light, f\/\d+(\.\d)?; wanted \+\d\.\d/);
    expect(s.readings[0]!.detail).toContain('dome at the face pointed at the camera');
  });

  it('a kicker in a look with no key still reads: pointed at it, against the camera (never a blank)', () => {
    // Bare 400 Ws head at 1/4, √2 m from the face, no bounce: I = 400 × 24 cd·s/Ws × ¼ = 2400 cd·s (the meter's
    // stated efficiency), H = I/(d² + R²) = 2400/(2 + 0.09²) = 1195 lx·s by the inverse-square law, so
    // N = √(H·S/C) = √(1195 × 100/250) = f/22 (ISO 2720 flash form) and log2(1195/160) = +2.9 stops over f/8.
    const s = crewSheet(doc([subject, camera, kicker]), { title: 'Kicker alone', units: 'metric' });
    const row = s.readings.find((r) => r.label === 'Kicker')!;
    expect(row.value).toBe('f/22');
    expect(row.detail).toBe('pointed at the light, +2.9 stops vs the camera; no key to compare with');
  });

  it("key:fill names the fill-side panel that returns the key (the clamshell's card under the chin)", () => {
    const clam = demoSetups[0]!.document;
    const s = crewSheet(clam, { title: 'Clamshell', units: 'metric' });
    const row = s.readings.find((r) => r.label === 'Key : fill')!;
    expect(row.value).toMatch(/^\d+\.\d:1$/);
    expect(row.detail).toMatch(/^\d+\.\d stops; fill side with the key off Silver under the chin$/);
  });

  it('a wall wash as the tone the camera records per channel, and the background range across the frame', () => {
    const s = crewSheet(doc([subject, camera, key, wall, wash]), { title: 'Wash', units: 'metric' });
    const row = s.readings.find((r) => r.label === 'Wash')!;
    expect(row.value).toMatch(/^[+−±]\d+\.\d vs grey$/);
    expect(row.detail).toMatch(/^on the background, R [+−±]\d+\.\d · G [+−±]\d+\.\d · B [+−±]\d+\.\d vs mid-grey/);
    // A full CTO wash: red over blue on the wall.
    const [rs, , bs] = row.detail!.match(/[+−±]\d+\.\d/g)!.map((v) => Number(v.replace('−', '-').replace('±', '')));
    expect(rs!).toBeGreaterThan(bs!);
    const bg = s.readings.find((r) => r.label === 'Background')!;
    expect(bg.detail).toMatch(/across the frame [+−±]\d+\.\d to [+−±]\d+\.\d vs mid-grey$/);
    expect(s.readings.some((r) => r.detail?.includes('above full power'))).toBe(false);
  });
});
