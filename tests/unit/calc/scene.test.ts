import { describe, expect, it } from 'vitest';
import { DEFAULT_SYNC_SPEED_S, parseScene, safeParseScene, sceneSchema, type SceneInput } from '../../../calc';

const minimal = (): SceneInput => ({
  lights: [{ id: 'key', kind: 'flash', x: 2, y: 0, heightM: 1.6, aimDeg: 180, output: { type: 'energy', ratedWs: 400 } }],
  subject: { x: 0, y: 0, heightM: 1.6, facingDeg: 0 },
  camera: { x: 3, y: 0, aimDeg: 180, aperture: 8, shutterS: 1 / 125, iso: 100 },
});

describe('sceneSchema', () => {
  it('fills the documented defaults', () => {
    const s = parseScene(minimal());
    const l = s.lights[0]!;
    expect(l.modifier).toBe('bare-reflector');
    expect(l.gel).toBe('none');
    expect(l.powerFraction).toBe(1);
    expect(l.tiltDeg).toBe(0);
    expect(l.role).toBe('auto');
    expect(s.camera.syncSpeedS).toBe(DEFAULT_SYNC_SPEED_S);
    expect(DEFAULT_SYNC_SPEED_S).toBe(1 / 200); // common practice
    expect(s.camera.ndStops).toBe(0);
    expect(s.options.calibrationC).toBe(250);
    expect(s.surfaces).toEqual([]);
  });

  it.each([
    { name: 'a height given as text', patch: (s: any) => (s.lights[0].heightM = '2'), path: 'lights[0].heightM' },
    { name: 'an unknown modifier', patch: (s: any) => (s.lights[0].modifier = 'magic-box'), path: 'lights[0].modifier' },
    { name: 'power above full', patch: (s: any) => (s.lights[0].powerFraction = 2), path: 'lights[0].powerFraction' },
    { name: 'zero power', patch: (s: any) => (s.lights[0].powerFraction = 0), path: 'lights[0].powerFraction' },
    { name: 'an infinite coordinate', patch: (s: any) => (s.subject.x = Infinity), path: 'subject.x' },
    { name: 'NaN aperture', patch: (s: any) => (s.camera.aperture = Number.NaN), path: 'camera.aperture' },
    { name: 'a negative shutter', patch: (s: any) => (s.camera.shutterS = -1), path: 'camera.shutterS' },
    { name: 'flash with a lumen rating', patch: (s: any) => (s.lights[0].output = { type: 'lumens', lumens: 1000 }), path: 'lights[0].output' },
    { name: 'an unreadable wall colour', patch: (s: any) => (s.surfaces = [{ id: 'w', x1: 0, y1: 0, x2: 1, y2: 0, colour: 'not-a-colour' }]), path: 'surfaces[0].colour' },
    { name: 'a wall top below its base', patch: (s: any) => (s.surfaces = [{ id: 'w', x1: 0, y1: 0, x2: 1, y2: 0, baseM: 2, topM: 1, colour: '#fff' }]), path: 'surfaces[0].topM' },
    { name: 'a duplicate light id', patch: (s: any) => s.lights.push({ ...s.lights[0] }), path: 'lights[1].id' },
    {
      name: 'a continuous calibration without shutter',
      patch: (s: any) =>
        (s.lights[0] = { id: 'led', kind: 'continuous', x: 1, y: 0, heightM: 1.6, aimDeg: 180, output: { type: 'luxAt1m', lux: 2000 }, calibration: { aperture: 4, distanceM: 1, iso: 100 } }),
      path: 'lights[0].calibration.shutterS',
    },
  ])('rejects $name, naming $path', ({ patch, path }) => {
    const s = minimal();
    patch(s);
    const r = safeParseScene(s);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain(path);
    expect(() => parseScene(s)).toThrow(path);
    expect(sceneSchema.safeParse(s).success).toBe(false);
  });
});
