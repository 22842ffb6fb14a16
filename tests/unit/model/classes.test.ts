// An assignment's check and a lesson's change line, on plans whose light is known from the usual rules of
// the trade (each named "common practice" where it is used).
import { describe, expect, it } from 'vitest';
import { demoSetups } from '../../../db/seed-setups';
import { checkSchema, describeChange, describeTarget, evaluateCheck, stepChangeLine, stopsChangeText, type Check } from '../../../model/classes';
import { parseDocument, type SetupDocument } from '../../../model/document';
import { computeReadings } from '../../../model/setupReadings';

const subject = { id: 'sub', kind: 'subject', label: 'Sitter', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 };
const camera = { id: 'cam', kind: 'camera', x: 4, y: 5.6, heightM: 1.6, aimDeg: -90, iso: 100, aperture: 8, shutterS: 1 / 200 };
const backdrop = (y = 1) => ({ id: 'bg', kind: 'wall', label: 'Grey paper', surface: 'seamless', a: { x: 2, y }, b: { x: 6, y }, heightM: 2.7, colour: '#808080' });
/** A bare head aimed straight at the subject's face from `d` metres in front of it. */
const light = (id: string, d: number, extra: Record<string, unknown> = {}) => ({
  id, kind: 'light', label: id, x: 4, y: 3 + d, heightM: 1.6, aimDeg: -90, tiltDeg: 0, source: { type: 'strobe', energyWs: 400 }, power: 1 / 4, modifier: 'bare-reflector', ...extra,
});
/**
 * The same head 0.6 m over the face, tilted down onto it (as keys usually stand): the sitter's shadow falls
 * below the face's height on the paper, so the paper beside the sitter is lit (the meter reads the background
 * beside the silhouette, where the lens sees it).
 */
const keyAbove = (id: string, d: number, extra: Record<string, unknown> = {}) =>
  light(id, d, { heightM: 2.2, tiltDeg: (-Math.atan2(0.6, d) * 180) / Math.PI, ...extra });
const doc = (items: unknown[], extra: Record<string, unknown> = {}): SetupDocument =>
  parseDocument({ schemaVersion: 1, stage: { widthM: 8, depthM: 6 }, items, ...extra });
const check = (...criteria: unknown[]): Check => checkSchema.parse({ criteria });
/** A black stage with no ceiling: no room bounce, so a light's own path is all that reaches a point. */
const DARK_STAGE = { meter: { floor: { colour: '#111111', reflectance: 0 }, ceiling: { heightM: null } } };
const only = (c: Check, d: SetupDocument) => evaluateCheck(c, d).criteria[0]!;

describe('the check schema', () => {
  it('accepts targets with a lowest value, a highest value or both, filling the other with null', () => {
    expect(check({ measure: 'background', max: -2 }).criteria[0]).toEqual({ measure: 'background', min: null, max: -2 });
    expect(check({ measure: 'keyFill', min: 2, max: 4 }, { measure: 'lights', max: 1 }).criteria).toHaveLength(2);
  });

  it.each([
    [{ criteria: [] }, 'criteria', 'add at least one target'],
    [{ criteria: [{ measure: 'subject' }] }, 'criteria.0.min', 'give a lowest value, a highest value or both'],
    [{ criteria: [{ measure: 'keyFill', min: 4, max: 2 }] }, 'criteria.0.max', 'the highest value is below the lowest'],
    [{ criteria: [{ measure: 'lights', max: 1.5 }] }, 'criteria.0.max', 'a whole number'],
    [{ criteria: [{ measure: 'keyFill', min: 0.5 }] }, 'criteria.0.min', 'at least 1 (1:1)'],
    [{ criteria: [{ measure: 'loudness', max: 1 }] }, 'criteria.0.measure', 'measure is one of'],
    [{ criteria: [{ measure: 'subject', max: 1, extra: true }] }, 'criteria.0', ''],
  ])('refuses %j, naming %s', (raw, path, message) => {
    const r = checkSchema.safeParse(raw);
    expect(r.success).toBe(false);
    const issue = r.error!.issues.find((i) => i.path.join('.') === path || (i.code === 'unrecognized_keys' && path === 'criteria.0'));
    expect(issue, JSON.stringify(r.error!.issues)).toBeTruthy();
    expect(issue!.message).toContain(message);
  });

  it('describes each target in plain words', () => {
    expect(describeTarget({ measure: 'background', min: null, max: -2 })).toBe('2.0 stops or more under the subject');
    expect(describeTarget({ measure: 'subject', min: -0.3, max: 0.3 })).toBe('between −0.3 and +0.3 stops vs the camera');
    expect(describeTarget({ measure: 'keyFill', min: 2, max: 4 })).toBe('between 2.0:1 and 4.0:1');
    expect(describeTarget({ measure: 'lights', min: null, max: 1 })).toBe('at most 1 light');
    expect(describeTarget({ measure: 'lights', min: 2, max: 2 })).toBe('exactly 2 lights');
    expect(describeTarget({ measure: 'ambient', min: null, max: -3 })).toBe('3.0 stops or more under the camera');
  });
});

describe('evaluateCheck', () => {
  it('measures the subject against the camera; doubling the distance costs two stops (inverse-square, common practice)', () => {
    const c = check({ measure: 'subject', min: -0.5, max: 0.5 });
    const near = only(c, doc([subject, camera, light('key', 1)]));
    const far = only(c, doc([subject, camera, light('key', 2)]));
    expect(near.measured).not.toBeNull();
    expect(near.measured! - far.measured!).toBeCloseTo(2, 1);
    // The measured value is the Meter panel's.
    expect(near.measured).toBeCloseTo(computeReadings(doc([subject, camera, light('key', 1)])).meter!.subject.stopsVsCamera!, 9);
    expect(near.measuredText).toMatch(/^[+−±]\d+\.\d stops$/);
  });

  it('passes a plan on target and fails one off it, by the same measured value', () => {
    const d = doc([subject, camera, light('key', 1)]);
    const v = only(check({ measure: 'subject', min: -20 }), d).measured!;
    const r = Math.round(v * 10) / 10;
    expect(only(check({ measure: 'subject', min: r - 0.3, max: r + 0.3 }), d).pass).toBe(true);
    expect(only(check({ measure: 'subject', min: r + 0.2 }), d).pass).toBe(false);
  });

  it('a subject target may name its receptor: a light beside the face reads 1 stop more pointed at it than on the dome, and nothing flat along the face', () => {
    // Projected area of a hemisphere: a light 90° off the dome's axis gives (1 + cos 90°)/2 = ½ of its frontal reading.
    const side = { ...light('side', 0), x: 6, y: 3, aimDeg: 180 };
    const d = doc([subject, camera, side], DARK_STAGE);
    const dome = only(check({ measure: 'subject', min: -20 }), d).measured!;
    const pointed = only(check({ measure: 'subject', min: -20, receptor: 'flat-light' }), d).measured!;
    expect(pointed - dome).toBeCloseTo(1, 1);
    const face = only(check({ measure: 'subject', min: -20, receptor: 'flat-face' }), d);
    expect(face.measured).toBeNull();
    expect(face.pass).toBe(false);
    expect(face.note).toMatch(/^no light on /);
  });

  it('compares at the precision the meter shows (one decimal): a target equal to the shown value passes', () => {
    const d = doc([subject, camera, backdrop(1), light('key', 1)]);
    const v = only(check({ measure: 'background', max: 20 }), d).measured!;
    const shown = Math.round(v * 10) / 10;
    expect(only(check({ measure: 'background', max: shown }), d).pass).toBe(true);
    expect(only(check({ measure: 'background', max: shown - 0.1 }), d).pass).toBe(false);
  });

  it('measures the background relative to the subject: a light 1 m from the face and 3 m from the paper puts it about 3.2 stops under (inverse-square, common practice)', () => {
    const c = check({ measure: 'background', max: -2 });
    const far = only(c, doc([subject, camera, backdrop(1), keyAbove('key', 1)]));
    expect(far.measured).toBeCloseTo(Math.log2(1 / 9), 0);
    expect(far.pass).toBe(true);
    // Paper 0.5 m behind the sitter: 1.5 m from the light, about 1.2 stops under; the target fails.
    const near = only(c, doc([subject, camera, backdrop(2.5), keyAbove('key', 1)]));
    expect(near.measured).toBeGreaterThan(-1.5);
    expect(near.pass).toBe(false);
  });

  it('says why a background cannot be measured when nothing stands behind the subject', () => {
    const r = only(check({ measure: 'background', max: -2 }), doc([subject, camera, light('key', 1)]));
    expect(r).toMatchObject({ measured: null, pass: false, note: 'no wall or backdrop behind the subject', measuredText: '—' });
  });

  it('reads key:fill as x:1; the same head at twice the distance is a 4:1 fill (two stops, common practice)', () => {
    const d = doc([subject, camera, light('key', 1), light('fill', 2, { role: 'fill' })]);
    const r = only(check({ measure: 'keyFill', min: 3, max: 5 }), d);
    expect(r.measured).toBeCloseTo(4, 0);
    expect(r.measuredText).toMatch(/^\d\.\d:1$/);
    expect(r.pass).toBe(true);
    // A card across from the key (beside the face, 79° around the subject from it) is on the fill side: key:fill is
    // the key over the card's return of it — a weak fill here, the bare head's beam barely reaching the card.
    const withPanel = doc([subject, camera, light('key', 1), { id: 'card', kind: 'reflector', x: 4.8, y: 3.2, rotationDeg: 180 }]);
    const panel = only(check({ measure: 'keyFill', min: 2 }), withPanel);
    expect(panel).toMatchObject({ pass: true, note: null });
    expect(panel.measured).toBeGreaterThan(100);
    // With no light and no panel on the fill side there is nothing to compare.
    expect(only(check({ measure: 'keyFill', min: 2 }), doc([subject, camera, light('key', 1)]))).toMatchObject({ measured: null, pass: false, note: 'needs a key and a fill light' });
  });

  it('counts the lights that are on, in every step', () => {
    const d = doc([subject, camera, light('key', 1), light('spare', 2, { on: false }), { id: 'card', kind: 'reflector', x: 4.8, y: 3.2 }], {
      steps: [{ id: 's1', itemIds: ['sub', 'cam'] }, { id: 's2', itemIds: ['key', 'spare'] }],
    });
    expect(only(check({ measure: 'lights', max: 1 }), d)).toMatchObject({ measured: 1, pass: true, measuredText: '1' });
    expect(only(check({ measure: 'lights', min: 2 }), d).pass).toBe(false);
  });

  it('measures the room light; stopping down two stops takes it two stops further under (common practice)', () => {
    const open = doc([subject, { ...camera, aperture: 4 }, light('key', 1)], { ambientEv100: 8 });
    const shut = doc([subject, camera, light('key', 1)], { ambientEv100: 8 });
    const c = check({ measure: 'ambient', max: -5 });
    const a = only(c, open);
    const b = only(c, shut);
    expect(a.measured! - b.measured!).toBeCloseTo(2, 5);
    expect([a.pass, b.pass]).toEqual([false, true]);
    expect(only(c, doc([subject, camera, light('key', 1)]))).toMatchObject({ measured: null, pass: false });
  });

  it('fails every metered target on a plan the meter cannot read, and lists what is missing', () => {
    const r = evaluateCheck(check({ measure: 'subject', min: -1 }, { measure: 'lights', max: 1 }), doc([camera, light('key', 1)]));
    expect(r.pass).toBe(false);
    expect(r.missing).toEqual(['a subject']);
    expect(r.criteria.map((c) => c.pass)).toEqual([false, true]);
    expect(r.criteria[0]!.note).toBe('no light reaches the subject');
  });

  it('passes only when every criterion passes', () => {
    const d = doc([subject, camera, backdrop(1), keyAbove('key', 1)]);
    expect(evaluateCheck(check({ measure: 'lights', max: 1 }, { measure: 'background', max: -2 }), d).pass).toBe(true);
    expect(evaluateCheck(check({ measure: 'lights', max: 1 }, { measure: 'background', max: -4 }), d).pass).toBe(false);
  });
});

describe('the change line', () => {
  const steps = (...ids: string[][]) => ({ steps: ids.map((itemIds, k) => ({ id: `s${k}`, title: `Step ${k + 1}`, itemIds })) });

  it('opens with the light the first step places (the rest is the set) and what the subject reads', () => {
    const d = doc([subject, camera, light('Key', 1)], steps(['sub', 'cam', 'Key']));
    expect(stepChangeLine(d, 0)).toMatch(/^starting with Key and the set: the subject reads f\/\d+(\.\d)? \([+−±]\d\.\d vs the camera\)$/);
  });

  it('a second light like the first, as far away, adds one stop (twice the light, common practice)', () => {
    const twin = { ...light('Twin', 1), x: 4, y: 4, id: 'Twin' };
    const d = doc([subject, camera, backdrop(1), light('Key', 1), twin], steps(['sub', 'cam', 'bg', 'Key'], ['Twin']));
    expect(stepChangeLine(d, 1)).toBe('adding Twin: +1.0 stop on the subject, background +1.0 stop');
  });

  it('a light behind the subject leaves the reading at the face unchanged and lifts only the background', () => {
    const hair = { id: 'hair', kind: 'light', label: 'Background light', x: 4, y: 2.2, heightM: 0.5, aimDeg: -90, tiltDeg: 10, source: { type: 'speedlight', guideNumberM: 40 }, power: 1 / 8, role: 'background' };
    const d = doc([subject, camera, backdrop(1), light('Key', 1), hair], steps(['sub', 'cam', 'bg', 'Key'], ['hair']));
    const line = stepChangeLine(d, 1);
    expect(line).toMatch(/^adding Background light: unchanged on the subject, background \+\d+\.\d stops?$/);
  });

  it('names key:fill when a fill arrives; at twice the key distance it is 4:1 (two stops, common practice)', () => {
    const d = doc([subject, camera, light('Key', 1), light('Fill', 2, { role: 'fill' })], steps(['sub', 'cam', 'Key'], ['Fill']));
    expect(stepChangeLine(d, 1)).toMatch(/^adding Fill: \+0\.3 stop on the subject, key:fill now 4\.0:1$/);
  });

  it('a flag between the key and the paper takes the light off the background and leaves the face alone', () => {
    const key = { ...keyAbove('Key', 1), x: 3, y: 4, aimDeg: -45, modifier: 'softbox' };
    // Across the lines from the key to the paper beside the sitter, clear of the line to the face.
    const flag = { id: 'flag', kind: 'flag', x: 3.8, y: 2.1, rotationDeg: -90, widthM: 1.4, heightM: 2.4 };
    const before = doc([subject, camera, backdrop(1.6), key], { ...steps(['sub', 'cam', 'bg', 'Key']), ...DARK_STAGE });
    const after = doc([subject, camera, backdrop(1.6), key, flag], { ...steps(['sub', 'cam', 'bg', 'Key'], ['flag']), ...DARK_STAGE });
    const bgBefore = computeReadings(before).meter!.background!.luxSeconds;
    const bgAfter = computeReadings(after).meter!.background!.luxSeconds;
    expect(bgAfter).toBeLessThan(bgBefore);
    expect(stepChangeLine(after, 1)).toBe('adding the flag: unchanged on the subject, the background goes dark');
  });

  it('a background lit before the subject is read against the camera; a trace of light is no light (more than 8 stops under)', () => {
    const bgLight = { id: 'bgl', kind: 'light', label: 'Paper light', x: 4, y: 2.2, heightM: 0.5, aimDeg: -90, tiltDeg: 10, source: { type: 'speedlight', guideNumberM: 40 }, power: 1 / 8, role: 'background' };
    // Read flat along the face: a dome pointed at the camera would see the lit paper behind the sitter (−6 stops).
    const d = doc([subject, camera, backdrop(1), bgLight, keyAbove('Key', 1)], { ...steps(['sub', 'cam', 'bg'], ['bgl'], ['Key']), meter: { ...DARK_STAGE.meter, receptor: 'flat-face' } });
    expect(stepChangeLine(d, 0)).toBe('starting with Sitter, the camera and Grey paper: nothing to meter yet (needs a light)');
    expect(stepChangeLine(d, 1)).toMatch(/^adding Paper light: no light on the subject yet, background [+−±]\d+\.\d vs the camera$/);
    expect(stepChangeLine(d, 2)).toMatch(/^adding Key: the subject reads f\/[\d.]+ \([+−±]\d\.\d vs the camera\), background [+−]\d\.\d stops?$/);
  });

  it('says so when a step places nothing, and when there is nothing to meter yet', () => {
    const d = doc([subject, camera, light('Key', 1), { id: 'n', kind: 'note', x: 1, y: 1, text: 'Blinds down' }], steps(['cam'], ['Key'], [], ['sub', 'n']));
    expect(stepChangeLine(d, 0)).toBe('starting with the camera: nothing to meter yet (needs a subject and a light)');
    expect(stepChangeLine(d, 1)).toBe('adding Key: nothing to meter yet (needs a subject)');
    expect(stepChangeLine(d, 2)).toBe('this step places nothing new: nothing to meter yet (needs a subject)');
    expect(stepChangeLine(d, 3)).toMatch(/^adding Sitter and a note: the subject reads f\//);
    expect(stepChangeLine(d, 9)).toBe('');
  });

  it('describeChange is a pure function of the two readings', () => {
    const a = computeReadings(doc([subject, camera, light('Key', 1)])).meter!;
    const b = computeReadings(doc([subject, camera, light('Key', 1), light('Two', 1, { x: 4.01 })])).meter!;
    const added = [parseDocument({ schemaVersion: 1, stage: { widthM: 8, depthM: 6 }, items: [light('Two', 1)] }).items[0]!];
    const line = describeChange({ added, before: a, after: b, missingAfter: [], first: false });
    expect(line).toBe(describeChange({ added, before: a, after: b, missingAfter: [], first: false }));
    expect(line).toMatch(/^adding Two: \+1\.0 stop on the subject$/);
  });

  it('writes stop changes as a meter would', () => {
    expect(stopsChangeText(0.04)).toBe('unchanged');
    expect(stopsChangeText(0.31)).toBe('+0.3 stop');
    expect(stopsChangeText(-1)).toBe('−1.0 stop');
    expect(stopsChangeText(-2.26)).toBe('−2.3 stops');
  });

  it('before any light is drawn, only the room light is read (stopping down is what takes it under)', () => {
    const teal = demoSetups.find((d) => d.document.ambientEv100 !== null)!;
    expect(stepChangeLine(teal.document, 0)).toMatch(/: nothing to meter yet \(needs a light\), room light \d+\.\d stops under$/);
  });

  it('has a line for every step of every demo setup', () => {
    for (const s of demoSetups) {
      s.document.steps.forEach((_st, k) => {
        const line = stepChangeLine(s.document, k);
        expect(line, `${s.title} step ${k + 1}`).toMatch(/^(starting with|adding) .+: .+/);
        expect(line).not.toMatch(/NaN|undefined|null/);
      });
    }
  });
});
