import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lightMap, meter, parseScene, type SceneInput } from '../../../calc';
import { buildOccluders, buildPatches, panelFrame } from '../../../calc/flatScene';
import { castShadows } from '../../../calc/shadows';
import { transmissionAlong } from '../../../calc/transport';

const camera = { x: 5, y: 2.5, heightM: 1.6, aimDeg: 180, aperture: 8, shutterS: 1 / 200, iso: 100 };
const subject = { x: 3, y: 2.5, heightM: 1.6, facingDeg: 0 };
const scene = (over: Partial<SceneInput>): SceneInput => ({ lights: [], subject, camera, ...over });

describe('tilted panels', () => {
  it('a panel tilted 90° lies flat: it blocks a ray from above and passes a level ray across its plan line', () => {
    // A 1 m × 1 m card on the segment (1, 0)–(1, 1), lower edge 1 m up, front facing −x... then tilted face-up.
    const s = parseScene(scene({ flags: [{ id: 'f', x1: 1, y1: 1, x2: 1, y2: 0, baseM: 1, topM: 2, tiltDeg: 90 }] }));
    const f = panelFrame(s.flags[0]! as Required<(typeof s.flags)[number]>);
    // Front on the right walking from (1, 1) to (1, 0) on screen is +x; tilted 90° it faces straight up and lies
    // back, towards −x, from x = 1 to x = 0 at height 1.
    expect(f.nz).toBeCloseTo(1, 12);
    expect(f.vx).toBeCloseTo(-1, 12);
    expect(f.vz).toBeCloseTo(0, 12);
    const o = buildOccluders(s);
    expect(transmissionAlong(o, 0.5, 0.5, 3, 0.5, 0.5, 0)).toBe(0); // straight down through the card
    expect(transmissionAlong(o, 1.5, 0.5, 3, 1.5, 0.5, 0)).toBe(1); // beside it (in front of its lower edge)
    expect(transmissionAlong(o, 2, 0.5, 1.5, 0, 0.5, 1.5)).toBe(1); // level at 1.5 m: an upright card would block this
    expect(transmissionAlong(o, 2, 0.5, 0.8, 0, 0.5, 1.1)).toBe(0); // rising through its plane within it (at x ≈ 0.67)
  });

  it('a tilted panel bounces from its tilted face: patches carry the tilted normal and lean back from the lower edge', () => {
    const s = parseScene(scene({ surfaces: [{ id: 'card', kind: 'reflector', x1: 0, y1: 1, x2: 0, y2: 0, baseM: 1, topM: 1.6, tiltDeg: 45, colour: '#ffffff' }] }));
    const P = buildPatches(s, 0.1, 400);
    const c = Math.SQRT1_2;
    for (let i = 0; i < P.count; i++) {
      expect(P.nx[i]).toBeCloseTo(c, 12);
      expect(P.nz[i]).toBeCloseTo(c, 12);
      // On the plane through the lower edge (x = 0, z = 1) with that normal.
      expect(P.nx[i]! * P.cx[i]! + P.nz[i]! * (P.cz[i]! - 1)).toBeCloseTo(0, 12);
      expect(P.cx[i]).toBeLessThan(0); // leans back, away from the side it faces
    }
    // Its area is its size, tilted or not.
    expect([...P.area].reduce((a, b) => a + b, 0)).toBeCloseTo(0.6, 9);
  });

  it("a tilted panel's shadow on the map is the ray test's answer at every grid point (central projection of the clipped panel)", () => {
    const arb = fc.record({
      lx: fc.double({ min: 0.2, max: 5.8, noNaN: true }),
      ly: fc.double({ min: 0.2, max: 4.8, noNaN: true }),
      // Often exactly at the grid's height, where the rays are level and only the panel's section there counts.
      lz: fc.oneof(fc.constant(1.6), fc.double({ min: 0.3, max: 3.2, noNaN: true })),
      flags: fc.array(
        fc.record({
          x1: fc.double({ min: 0.5, max: 5.5, noNaN: true }),
          y1: fc.double({ min: 0.5, max: 4.5, noNaN: true }),
          dx: fc.double({ min: -1.2, max: 1.2, noNaN: true }),
          dy: fc.double({ min: -1.2, max: 1.2, noNaN: true }),
          base: fc.double({ min: 0, max: 2, noNaN: true }),
          h: fc.double({ min: 0.2, max: 1.5, noNaN: true }),
          tilt: fc.oneof(fc.constantFrom(90, -90, 45, -30), fc.double({ min: -90, max: 90, noNaN: true })),
          transmission: fc.constantFrom(0, 0.5),
        }),
        { minLength: 1, maxLength: 3 },
      ),
    });
    fc.assert(
      fc.property(arb, ({ lx, ly, lz, flags }) => {
        const s = parseScene(
          scene({
            flags: flags
              .filter((f) => Math.hypot(f.dx, f.dy) > 0.05)
              .map((f, i) => ({ id: `f${i}`, x1: f.x1, y1: f.y1, x2: f.x1 + f.dx, y2: f.y1 + f.dy, baseM: f.base, topM: f.base + f.h, tiltDeg: f.tilt, transmission: f.transmission })),
          }),
        );
        const o = buildOccluders(s);
        // A light in a panel's own plane sees it edge-on: which side a ray passes is rounding; not compared.
        for (let i = 0; i < o.count; i++) {
          const f = panelFrame(s.flags[i]! as Required<(typeof s.flags)[number]>);
          if (Math.abs((lx - f.ax) * f.nx + (ly - f.ay) * f.ny + (lz - f.az) * f.nz) < 1e-3) return;
        }
        const frame = { nx: 25, ny: 21, x0: 0, y0: 0, dx: 0.25, dy: 0.25 };
        const t = new Float32Array(frame.nx * frame.ny).fill(1);
        castShadows(o, lx, ly, lz, 1.6, frame, t);
        let mismatches = 0;
        const e = 1e-6;
        for (let j = 0; j < frame.ny; j++) {
          for (let i = 0; i < frame.nx; i++) {
            const x = i * 0.25;
            const y = j * 0.25;
            const ray = transmissionAlong(o, lx, ly, lz, x, y, 1.6);
            const edge = [[e, 0], [-e, 0], [0, e], [0, -e]].some(([a, b]) => transmissionAlong(o, lx, ly, lz, x + a!, y + b!, 1.6) !== ray);
            if (!edge && Math.abs(ray - t[j * frame.nx + i]!) > 1e-6) mismatches++;
          }
        }
        expect(mismatches).toBe(0);
      }),
      { numRuns: 150 },
    );
  });
});

describe('a flag over part of a big source', () => {
  // A 90 cm softbox 2 m in front of the face, aimed at it; the flag stands halfway, its edge on the line from the
  // face to the box's middle, so it hides the half of the face on one side (seen from the subject).
  const box = { id: 'box', kind: 'flash' as const, x: 2, y: 0, heightM: 1.6, aimDeg: 180, output: { type: 'energy' as const, ratedWs: 400 }, modifier: 'softbox' as const };
  const half = { id: 'flag', x1: 1, y1: -1, x2: 1, y2: 0, baseM: 0, topM: 3 };
  const at = (flags: SceneInput['flags'], receptor: 'flat-face' | 'dome-camera' | 'flat-light') =>
    meter({ lights: [box], flags, subject: { x: 0, y: 0, heightM: 1.6, facingDeg: 0 }, camera: { ...camera, x: 3, y: 0.5 }, options: { bounce: false, receptor } });

  it.each(['flat-face', 'dome-camera', 'flat-light'] as const)('a flag over half of a softbox (seen from the subject) cuts one stop of that light (%s)', (receptor) => {
    const open = at([], receptor).lights[0]!.luxSeconds;
    const flagged = at([half], receptor).lights[0]!.luxSeconds;
    expect(Math.log2(flagged / open)).toBeCloseTo(-1, 2);
    // A quarter of the face hidden (the flag's edge a quarter of the way across, seen from the face): a quarter off.
    const quarter = at([{ ...half, y2: -0.45 / 2 / 2 }], receptor).lights[0]!.luxSeconds;
    expect(Math.log2(quarter / open)).toBeCloseTo(Math.log2(0.75), 2);
  });

  it('the light map at the subject reads the flagged softbox as the meter does', () => {
    const sc = { lights: [box], flags: [half], subject: { x: 0, y: 0, heightM: 1.6, facingDeg: 0 }, camera: { ...camera, x: 3, y: 0.5 }, options: { bounce: false } };
    const m = meter(sc);
    const map = lightMap(sc, { x0: -1, y0: -1, x1: 1, y1: 1, nx: 21, ny: 21 });
    expect(map.luxSeconds[10 * 21 + 10]! / m.subject.luxSeconds).toBeCloseTo(1, 2);
  });
});
