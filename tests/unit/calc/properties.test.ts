import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { GEL_IDS, MODIFIER_IDS, lightMap, meter, safeParseScene, type LightInput, type SceneInput } from '../../../calc';

// A failing property shrinks its counterexample; with a meter and a light map per run that can take minutes,
// so the whole run (shrinking included) is capped and an interrupted run counts as a failure.
fc.configureGlobal({ interruptAfterTimeLimit: 20_000, markInterruptAsFailure: true });

const coord = fc.double({ min: -8, max: 8, noNaN: true });
const height = fc.double({ min: 0, max: 4, noNaN: true });
const angle = fc.double({ min: -360, max: 360, noNaN: true });

const lightArb: fc.Arbitrary<LightInput> = fc
  .record({
    x: coord,
    y: coord,
    heightM: height,
    aimDeg: angle,
    tiltDeg: fc.double({ min: -90, max: 90, noNaN: true }),
    powerFraction: fc.double({ min: 1 / 256, max: 1, noNaN: true }),
    modifier: fc.constantFrom(...MODIFIER_IDS),
    gel: fc.constantFrom(...GEL_IDS),
    role: fc.constantFrom('auto', 'key', 'fill', 'rim', 'hair', 'kicker', 'background', 'other'),
    enabled: fc.boolean(),
    flash: fc.boolean(),
    rating: fc.double({ min: 1, max: 3000, noNaN: true }),
    ratingKind: fc.boolean(),
    calibrate: fc.option(fc.record({ aperture: fc.double({ min: 1, max: 64, noNaN: true }), distanceM: fc.double({ min: 0.2, max: 10, noNaN: true }) })),
  })
  .map((r) => {
    const base = {
      x: r.x,
      y: r.y,
      heightM: r.heightM,
      aimDeg: r.aimDeg,
      tiltDeg: r.tiltDeg,
      powerFraction: r.powerFraction,
      modifier: r.modifier,
      gel: r.gel,
      role: r.role,
      enabled: r.enabled,
      ...(r.calibrate ? { calibration: { ...r.calibrate, iso: 100, shutterS: 1 / 60 } } : {}),
    };
    return r.flash
      ? ({ ...base, id: '', kind: 'flash', output: r.ratingKind ? { type: 'energy', ratedWs: r.rating } : { type: 'guideNumber', guideNumberM: r.rating / 20 } } as LightInput)
      : ({ ...base, id: '', kind: 'continuous', output: r.ratingKind ? { type: 'lumens', lumens: r.rating * 10 } : { type: 'luxAt1m', lux: r.rating } } as LightInput);
  });

const segment = fc
  .record({ x1: coord, y1: coord, len: fc.double({ min: 0.2, max: 6, noNaN: true }), dir: angle })
  .map((s) => ({ x1: s.x1, y1: s.y1, x2: s.x1 + s.len * Math.cos((s.dir * Math.PI) / 180), y2: s.y1 + s.len * Math.sin((s.dir * Math.PI) / 180) }));

const surfaceArb = fc
  .record({ seg: segment, colour: fc.constantFrom('#ffffff', '#808080', '#c03020', '#204080', '#000000'), reflectance: fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: undefined }), topM: fc.double({ min: 0.5, max: 4, noNaN: true }) })
  .map((s) => ({ ...s.seg, colour: s.colour, topM: s.topM, ...(s.reflectance !== undefined ? { reflectance: s.reflectance } : {}) }));

const flagArb = fc.record({ seg: segment, transmission: fc.constantFrom(0, 0.25, 0.5) }).map((f) => ({ ...f.seg, transmission: f.transmission }));

const withIds = <T extends object>(xs: T[], p: string) => xs.map((x, i) => ({ ...x, id: `${p}${i}` }));

const sceneArb: fc.Arbitrary<SceneInput> = fc
  .record({
    lights: fc.array(lightArb, { maxLength: 6 }),
    surfaces: fc.array(surfaceArb, { maxLength: 4 }),
    flags: fc.array(flagArb, { maxLength: 3 }),
    subject: fc.record({ x: coord, y: coord, heightM: height, facingDeg: angle }),
    camera: fc.record({
      x: coord,
      y: coord,
      aimDeg: angle,
      aperture: fc.double({ min: 1, max: 32, noNaN: true }),
      shutterS: fc.double({ min: 1 / 8000, max: 2, noNaN: true }),
      iso: fc.double({ min: 50, max: 12800, noNaN: true }),
      ndStops: fc.double({ min: 0, max: 10, noNaN: true }),
    }),
    ambient: fc.option(fc.record({ ev100: fc.double({ min: -5, max: 16, noNaN: true }) }), { nil: undefined }),
  })
  .map((s) => ({
    ...s,
    lights: withIds(s.lights, 'L'),
    surfaces: withIds(s.surfaces, 'S'),
    flags: withIds(s.flags, 'F'),
    probes: [{ id: 'p', x: s.subject.x + 1, y: s.subject.y, z: 1 }],
    ...(s.ambient ? { ambient: s.ambient } : {}),
  })) as fc.Arbitrary<SceneInput>;

/** Every number in a result is finite (nulls mark "no light", documented on the result types). */
function allFinite(v: unknown, path = 'result'): string | null {
  if (typeof v === 'number') return Number.isFinite(v) ? null : path;
  if (Array.isArray(v) || ArrayBuffer.isView(v)) {
    const arr = v as ArrayLike<unknown>;
    for (let i = 0; i < arr.length; i++) {
      const bad = allFinite(arr[i], `${path}[${i}]`);
      if (bad) return bad;
    }
    return null;
  }
  if (v && typeof v === 'object') {
    for (const [k, x] of Object.entries(v)) {
      const bad = allFinite(x, `${path}.${k}`);
      if (bad) return bad;
    }
  }
  return null;
}

describe('properties (fast-check)', () => {
  it('results are finite for any valid scene — meter and light map', () => {
    fc.assert(
      fc.property(sceneArb, (s) => {
        const m = meter(s);
        expect(allFinite(m)).toBeNull();
        const map = lightMap(s, { x0: -6, y0: -5, x1: 6, y1: 5, nx: 13, ny: 11 });
        expect(allFinite({ stops: map.stops, lux: map.luxSeconds, ref: map.referenceLuxSeconds, c: map.contours })).toBeNull();
      }),
      { numRuns: 150 },
    );
    // A generous bound for a loaded machine (150 scenes, each metered by three receptors with every bounce).
  }, 60_000);

  it('moving a light away from the subject (along the line between them) never brightens the subject', () => {
    // Walls are left out: moving a light can bring it nearer a wall and so raise the bounce, which is physical.
    fc.assert(
      fc.property(sceneArb, fc.nat({ max: 5 }), fc.double({ min: 1, max: 4, noNaN: true }), (s, pick, k) => {
        const scene = { ...s, surfaces: [] };
        if (scene.lights.length === 0) return;
        const i = pick % scene.lights.length;
        const l = scene.lights[i]!;
        const sub = scene.subject;
        const moved = {
          ...l,
          x: sub.x + (l.x - sub.x) * k,
          y: sub.y + (l.y - sub.y) * k,
          heightM: Math.min(100, Math.max(0, sub.heightM + (l.heightM - sub.heightM) * k)),
        };
        // Keep the ray direction: skip when clamping the height changed it.
        if (moved.heightM !== sub.heightM + (l.heightM - sub.heightM) * k) return;
        const before = meter(scene).lights[i]!.luxSeconds;
        const after = meter({ ...scene, lights: scene.lights.map((x, j) => (j === i ? moved : x)) }).lights[i]!.luxSeconds;
        expect(after).toBeLessThanOrEqual(before * (1 + 1e-9) + 1e-300);
      }),
      { numRuns: 200 },
    );
  }, 60_000);

  it('adding a light never darkens the subject, background or any point', () => {
    fc.assert(
      fc.property(sceneArb, lightArb, (s, extra) => {
        const a = meter(s);
        const b = meter({ ...s, lights: [...s.lights, { ...extra, id: 'extra' }] });
        expect(b.subject.luxSeconds).toBeGreaterThanOrEqual(a.subject.luxSeconds * (1 - 1e-12));
        expect(b.probes[0]!.luxSeconds).toBeGreaterThanOrEqual(a.probes[0]!.luxSeconds * (1 - 1e-12));
        if (a.background && b.background) expect(b.background.luxSeconds).toBeGreaterThanOrEqual(a.background.luxSeconds * (1 - 1e-12));
      }),
      { numRuns: 150 },
    );
  }, 60_000);

  it('an invalid scene is rejected by the schema with a message naming the field', () => {
    const fields: [string, (s: any, v: unknown) => void][] = [
      ['lights[0].heightM', (s, v) => (s.lights[0].heightM = v)],
      ['lights[0].aimDeg', (s, v) => (s.lights[0].aimDeg = v)],
      ['lights[0].powerFraction', (s, v) => (s.lights[0].powerFraction = v)],
      ['camera.iso', (s, v) => (s.camera.iso = v)],
      ['camera.shutterS', (s, v) => (s.camera.shutterS = v)],
      ['subject.facingDeg', (s, v) => (s.subject.facingDeg = v)],
      ['surfaces[0].x2', (s, v) => (s.surfaces[0].x2 = v)],
    ];
    fc.assert(
      fc.property(sceneArb, fc.constantFrom(...fields), fc.constantFrom<unknown>(Number.NaN, Infinity, -Infinity, 'text', null, {}), (s, [path, set], bad) => {
        const copy = structuredClone(s) as any;
        if (copy.lights.length === 0) copy.lights.push({ id: 'x', kind: 'flash', x: 0, y: 1, heightM: 1, aimDeg: 0, output: { type: 'energy', ratedWs: 100 } });
        if (copy.surfaces.length === 0) copy.surfaces.push({ id: 'w', x1: 0, y1: 0, x2: 1, y2: 0, colour: '#fff' });
        set(copy, bad);
        const r = safeParseScene(copy);
        expect(r.ok).toBe(false);
        if (!r.ok) expect(r.message).toContain(path);
      }),
      { numRuns: 150 },
    );
  }, 60_000);
});
