import { contours as d3Contours } from 'd3-contour';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createLightMapCache, lightMap, meter, parseScene, type LightInput, type LightMapGrid, type SceneInput } from '../../../calc';
import { contourLines } from '../../../calc/contours';
import { buildOccluders } from '../../../calc/flatScene';
import { castShadows } from '../../../calc/shadows';
import { buildRoom, gather, unitVector } from '../../../calc/room';
import { transmissionAlong } from '../../../calc/transport';

const flash = (id: string, x: number, y: number, aimDeg: number, over: Partial<LightInput> = {}): LightInput =>
  ({ id, kind: 'flash', x, y, heightM: 1.6, aimDeg, output: { type: 'guideNumber', guideNumberM: 32 }, modifierOverride: { faceRadiusM: 0 }, ...over }) as LightInput;

const room = (lights: LightInput[], over: Partial<SceneInput> = {}): SceneInput => ({
  lights,
  surfaces: [
    { id: 'n', x1: 0, y1: 0, x2: 6, y2: 0, colour: '#d0d0d0' },
    { id: 'e', x1: 6, y1: 0, x2: 6, y2: 5, colour: '#b0a090' },
    { id: 's', x1: 6, y1: 5, x2: 0, y2: 5, colour: '#808890' },
    { id: 'w', x1: 0, y1: 5, x2: 0, y2: 0, colour: '#707070' },
  ],
  flags: [{ id: 'f', x1: 2, y1: 1.4, x2: 2.6, y2: 1.1 }],
  subject: { x: 3, y: 2.5, heightM: 1.6, facingDeg: 0 },
  camera: { x: 5.5, y: 2.5, aimDeg: 180, aperture: 8, shutterS: 1 / 125, iso: 100 },
  ...over,
});

const grid: LightMapGrid = { x0: 0.05, y0: 0.05, x1: 5.95, y1: 4.95, nx: 60, ny: 50 };

describe('lightMap', () => {
  it('reads 0 stops at the subject and agrees with the meter there (bounce sampled more coarsely)', () => {
    const s = room([flash('a', 5, 1.5, 150), flash('b', 4.5, 4, -120, { powerFraction: 0.5 })]);
    const m = meter(s);
    const map = lightMap(s, { ...grid, x0: 0, y0: 0, x1: 6, y1: 5, nx: 61, ny: 51 }); // subject on a grid point
    const k = 25 * 61 + 30;
    expect(map.reference).toBe('subject');
    expect(map.stops[k]!).toBeCloseTo(0, 1);
    // Within 5 % of the meter, whose bounce uses finer patches and exact polygons.
    expect(Math.abs(map.referenceLuxSeconds / m.subject.luxSeconds - 1)).toBeLessThan(0.05);
  });

  it('direct light equals the meter at grid points (bounce off) — inverse-square and cosine law in the hot loop', () => {
    const s = room([flash('a', 5, 1.5, 150, { modifier: 'grid-30', modifierOverride: {} })], { options: { bounce: false } });
    const map = lightMap(s, grid);
    const parsed = parseScene(s);
    for (const [i, j] of [[10, 10], [30, 25], [45, 40], [55, 5], [20, 30]] as const) {
      const x = grid.x0 + (i * (grid.x1 - grid.x0)) / (grid.nx - 1);
      const y = grid.y0 + (j * (grid.y1 - grid.y0)) / (grid.ny - 1);
      const m = meter({ ...parsed, probes: [{ id: 'p', x, y, z: 1.6 }] });
      expect(map.luxSeconds[j * grid.nx + i]!).toBeCloseTo(m.probes[0]!.luxSeconds, 3);
    }
  });

  it('common practice: doubling the distance costs two stops, on the map too', () => {
    const s = room([flash('a', 1, 2.5, 0, { modifier: 'umbrella-shoot-through' })], { surfaces: [], flags: [], subject: { x: 2, y: 2.5, heightM: 1.6, facingDeg: 180 } });
    const map = lightMap(s, { x0: 1, y0: 2.5, x1: 5, y1: 3.5, nx: 5, ny: 2, facing: 180 });
    // points at 1, 2, 4 m from the light on its axis (indices 1, 2, 4 on the first row)
    expect(map.stops[2]! - map.stops[1]!).toBeCloseTo(inverse(1, 2), 6);
    expect(map.stops[4]! - map.stops[2]!).toBeCloseTo(-2, 6);
  });

  it('walls and flags shade the map: a point behind the flag gets no direct light', () => {
    const s = room([flash('a', 3, 0.6, 90)], { options: { bounce: false } });
    const map = lightMap(s, { x0: 1.6, y0: 1.9, x1: 1.7, y1: 3, nx: 2, ny: 2 });
    // The ray from (3, 0.6) to (1.6, 1.9) crosses the flag (2, 1.4)–(2.6, 1.1) at its middle.
    const o = buildOccluders(parseScene(s));
    expect(transmissionAlong(o, 3, 0.6, 1.6, 1.6, 1.9, 1.6)).toBe(0);
    expect(map.luxSeconds[0]).toBe(0);
    expect(lightMap({ ...s, flags: [] }, { x0: 1.6, y0: 1.9, x1: 1.7, y1: 3, nx: 2, ny: 2 }).luxSeconds[0]!).toBeGreaterThan(0);
  });

  it('rasterised shadows equal the per-ray test at every grid point (property, random flags and lights)', () => {
    const arb = fc.record({
      lx: fc.double({ min: 0, max: 6, noNaN: true }),
      ly: fc.double({ min: 0, max: 5, noNaN: true }),
      lz: fc.double({ min: 0.2, max: 4, noNaN: true }),
      flags: fc.array(
        fc.record({
          x1: fc.double({ min: -1, max: 7, noNaN: true }),
          y1: fc.double({ min: -1, max: 6, noNaN: true }),
          dx: fc.double({ min: -2, max: 2, noNaN: true }),
          dy: fc.double({ min: -2, max: 2, noNaN: true }),
          base: fc.double({ min: 0, max: 2, noNaN: true }),
          h: fc.double({ min: 0.1, max: 3, noNaN: true }),
          transmission: fc.constantFrom(0, 0.5),
        }),
        { minLength: 1, maxLength: 4 },
      ),
    });
    fc.assert(
      fc.property(arb, ({ lx, ly, lz, flags }) => {
        const s = parseScene(
          room([], {
            surfaces: [],
            flags: flags
              .filter((f) => Math.hypot(f.dx, f.dy) > 0.05)
              .map((f, i) => ({ id: `f${i}`, x1: f.x1, y1: f.y1, x2: f.x1 + f.dx, y2: f.y1 + f.dy, baseM: f.base, topM: f.base + f.h, transmission: f.transmission })),
          }),
        );
        // A light on the line of a flag sees it edge-on: its shadow has no width and which side a ray passes is
        // rounding. Such degenerate cases are not compared.
        const distToLine = (f: (typeof s.flags)[number]) => {
          const ex = f.x2 - f.x1;
          const ey = f.y2 - f.y1;
          return Math.abs((lx - f.x1) * ey - (ly - f.y1) * ex) / Math.hypot(ex, ey);
        };
        if (s.flags.some((f) => distToLine(f) < 1e-3)) return;
        const o = buildOccluders(s);
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
            // A point on a shadow edge may fall either way: compare only where nudging it does not change the ray test.
            const edge = [[e, 0], [-e, 0], [0, e], [0, -e]].some(([a, b]) => transmissionAlong(o, lx, ly, lz, x + a!, y + b!, 1.6) !== ray);
            if (!edge && Math.abs(ray - t[j * frame.nx + i]!) > 1e-6) mismatches++;
          }
        }
        expect(mismatches).toBe(0);
      }),
      { numRuns: 100 },
    );
  });

  it('the cache recomputes only the light that moved, and gives the same map as a fresh computation', () => {
    const lights = [flash('a', 5, 1.5, 150), flash('b', 4.5, 4, -120), flash('c', 1, 1, 45, { modifier: 'softbox', modifierOverride: {} })];
    const s = parseScene(room(lights));
    const cache = createLightMapCache();
    cache.updateParsed(s, grid);
    expect(cache.stats.geometryRebuilt).toBe(true);
    expect(cache.stats.lightsRecomputed).toBe(3);
    const moved = { ...s, lights: s.lights.map((l) => (l.id === 'b' ? { ...l, x: 4.2, y: 3.8 } : l)) };
    const inc = cache.updateParsed(moved, grid);
    expect(cache.stats.geometryRebuilt).toBe(false);
    expect(cache.stats.lightsRecomputed).toBe(1);
    expect(cache.stats.lightsReused).toBe(2);
    const fresh = lightMap(moved, grid);
    for (let k = 0; k < fresh.luxSeconds.length; k += 7) expect(inc.luxSeconds[k]!).toBeCloseTo(fresh.luxSeconds[k]!, 6);
    // moving a subject without a body only changes the reference (with a body, its shadow moves: the room is rebuilt)
    const subj = cache.updateParsed({ ...moved, subject: { ...moved.subject, y: 2.2 } }, grid);
    expect(cache.stats.lightsRecomputed).toBe(0);
    expect(subj.referenceLuxSeconds).not.toBe(inc.referenceLuxSeconds);
    // moving a wall rebuilds the geometry
    cache.updateParsed({ ...moved, surfaces: moved.surfaces.map((w, i) => (i === 0 ? { ...w, y1: 0.2 } : w)) }, grid);
    expect(cache.stats.geometryRebuilt).toBe(true);
  });

  it('falls back to the brightest point when the subject is unlit, and stays finite', () => {
    const s = room([flash('a', 1, 2.5, 180)], { options: { bounce: false } }); // behind the subject's facing, aimed away, no bounce
    const map = lightMap(s, grid);
    expect(map.reference).toBe('brightest');
    expect(Math.max(...map.stops)).toBeCloseTo(0, 6);
    for (const v of map.stops) expect(Number.isFinite(v)).toBe(true);
    const dark = lightMap(room([]), grid);
    expect(dark.stops.every((v) => v === dark.floorStops)).toBe(true);
    expect(dark.contours).toEqual([]);
  });
});

describe('contour lines', () => {
  it('vertices match d3-contour (reference marching squares) for the same grid and levels', () => {
    const s = room([flash('a', 5, 1.5, 150), flash('b', 1.5, 4, -40, { modifier: 'grid-20', modifierOverride: {} })]);
    const map = lightMap(s, { ...grid, contourMinStops: -8 });
    const key = (p: [number, number] | number[]) => `${p[0]!.toFixed(6)},${p[1]!.toFixed(6)}`;
    const frame = { nx: map.nx, ny: map.ny, x0: map.x0, y0: map.y0, dx: map.dxM, dy: map.dyM };
    expect(map.contours.length).toBeGreaterThan(3);
    for (const level of map.contours) {
      const [mp] = d3Contours().size([map.nx, map.ny]).thresholds([level.stops])(Array.from(map.stops));
      const d3Points = new Set<string>();
      for (const poly of mp!.coordinates)
        for (const ring of poly)
          for (const p of ring) {
            const onBorder = p[0]! <= 0 || p[0]! >= map.nx || p[1]! <= 0 || p[1]! >= map.ny;
            if (!onBorder) d3Points.add(key([frame.x0 + (p[0]! - 0.5) * frame.dx, frame.y0 + (p[1]! - 0.5) * frame.dy]));
          }
      const ours = new Set(level.lines.flat().map(key));
      for (const p of d3Points) expect(ours.has(p)).toBe(true);
      for (const p of ours) expect(d3Points.has(p)).toBe(true);
    }
  });

  it('every vertex of a level lies on the interpolated isoline (value within 1e-9 of the level)', () => {
    // A radial field in stops: −2·log2(r) (an inverse-square falloff around the origin)
    const nx = 41;
    const ny = 31;
    const f = { nx, ny, x0: -2, y0: -1.5, dx: 0.1, dy: 0.1 };
    const vals = new Float64Array(nx * ny);
    for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) vals[j * nx + i] = -2 * Math.log2(Math.max(0.05, Math.hypot(f.x0 + i * f.dx, f.y0 + j * f.dy)));
    const levels = contourLines(vals, f, 1, -10);
    expect(levels.map((l) => l.stops)).toContain(0);
    const bilinear = (x: number, y: number) => {
      const u = (x - f.x0) / f.dx;
      const v = (y - f.y0) / f.dy;
      const i = Math.min(nx - 2, Math.floor(u));
      const j = Math.min(ny - 2, Math.floor(v));
      const a = u - i;
      const b = v - j;
      const g = (ii: number, jj: number) => vals[jj * nx + ii]!;
      return (g(i, j) * (1 - a) + g(i + 1, j) * a) * (1 - b) + (g(i, j + 1) * (1 - a) + g(i + 1, j + 1) * a) * b;
    };
    for (const l of levels) for (const line of l.lines) for (const [x, y] of line) expect(bilinear(x, y)).toBeCloseTo(l.stops, 9);
    // The 0-stop isoline of −2·log2 r is the unit circle (to grid accuracy).
    const zero = levels.find((l) => l.stops === 0)!;
    expect(zero.lines).toHaveLength(1);
    for (const [x, y] of zero.lines[0]!) expect(Math.hypot(x, y)).toBeCloseTo(1, 1);
    const line = zero.lines[0]!;
    expect(line[0]).toEqual(line[line.length - 1]); // closed
  });
});

function inverse(from: number, to: number) {
  return 2 * Math.log2(from / to);
}

describe('the map on the meter\'s transport', () => {
  it('a small white room with a ceiling and a softbox close by: the map reads the meter\'s probes within 0.1 stop (floor, ceiling, every bounce, area face)', () => {
    const white = '#f2f2f2';
    const s: SceneInput = {
      lights: [{ id: 'box', kind: 'flash', x: 2.2, y: 1.2, heightM: 1.7, aimDeg: 135, tiltDeg: -10, output: { type: 'energy', ratedWs: 200 }, powerFraction: 1 / 8, modifier: 'softbox' }],
      surfaces: [
        { id: 'n', x1: 0, y1: 0, x2: 3, y2: 0, colour: white, topM: 2.6 },
        { id: 'e', x1: 3, y1: 0, x2: 3, y2: 3, colour: white, topM: 2.6 },
        { id: 's', x1: 3, y1: 3, x2: 0, y2: 3, colour: white, topM: 2.6 },
        { id: 'w', x1: 0, y1: 3, x2: 0, y2: 0, colour: white, topM: 2.6 },
      ],
      floor: { x1: 0, y1: 0, x2: 3, y2: 3, colour: white },
      ceiling: { heightM: 2.6, colour: white },
      subject: { x: 1.5, y: 1.5, heightM: 1.6, facingDeg: 0 },
      camera: { x: 2.8, y: 1.5, aimDeg: 180, aperture: 8, shutterS: 1 / 125, iso: 100 },
      probes: [
        { id: 'near', x: 1.8, y: 1.5, z: 1.6, facingDeg: 0 },
        { id: 'corner', x: 0.4, y: 2.6, z: 1.6, facingDeg: 0 },
        { id: 'behind', x: 2.6, y: 0.4, z: 1.6, facingDeg: 0 },
      ],
    };
    const m = meter(s);
    const map = lightMap(s, { x0: 0.05, y0: 0.05, x1: 2.95, y1: 2.95, nx: 59, ny: 59, facing: 0 });
    const at = (x: number, y: number) => {
      const i = Math.round((x - 0.05) / map.dxM);
      const j = Math.round((y - 0.05) / map.dyM);
      return map.luxSeconds[j * map.nx + i]!;
    };
    for (const p of m.probes) {
      // The probes sit on grid points (0.05 m steps); the bounce is a large part in the corner and behind the box.
      expect(Math.abs(Math.log2(at(p.point.x, p.point.y) / p.luxSeconds)), p.id).toBeLessThan(0.1);
    }
    // Behind the box (its back is closed) all the light is bounce, and it is well above nothing.
    const behind = m.probes.find((p) => p.id === 'behind')!;
    expect(behind.bounceLuxSeconds / behind.luxSeconds).toBeGreaterThan(0.9);
  });

  it('posts contour paths ready to draw: one path per level through the traced vertices, with a label point on the level', () => {
    const map = lightMap(room([flash('a', 5, 1.5, 150), flash('b', 1, 4, -30)]), grid);
    expect(map.contourPaths.map((p) => p.stops)).toEqual(map.contours.map((c) => c.stops));
    map.contours.forEach((level, k) => {
      const d = map.contourPaths[k]!.d;
      const moves = (d.match(/M/g) ?? []).length;
      expect(moves).toBe(level.lines.filter((l) => l.length >= 2).length);
      const first = level.lines[0]![0]!;
      expect(d.startsWith(`M${Math.round(first[0] * 1000) / 1000},${Math.round(first[1] * 1000) / 1000}`)).toBe(true);
      const label = map.contourPaths[k]!.label;
      if (label) expect(level.lines.some((l) => l.some(([x, y]) => Math.abs(x - label[0]) < 1e-3 && Math.abs(y - label[1]) < 1e-3))).toBe(true);
    });
  });
});


describe('the map near walls', () => {
  // An invented portrait room: a softbox key and a bare head washing the pale wall behind the subject.
  const s: SceneInput = {
    lights: [
      { id: 'key', kind: 'flash', x: 3.6, y: 1.6, heightM: 1.9, aimDeg: 145, tiltDeg: -10, output: { type: 'energy', ratedWs: 400 }, powerFraction: 1 / 4, modifier: 'softbox' },
      { id: 'wash', kind: 'flash', x: 1.4, y: 3.2, heightM: 1.2, aimDeg: 200, output: { type: 'energy', ratedWs: 400 }, powerFraction: 1 / 2, modifier: 'bare-reflector' },
    ],
    surfaces: [
      { id: 'n', x1: 0, y1: 0, x2: 6, y2: 0, colour: '#d8d2c8' },
      { id: 'e', x1: 6, y1: 0, x2: 6, y2: 5, colour: '#c8c8c8' },
      { id: 's', x1: 6, y1: 5, x2: 0, y2: 5, colour: '#8a9aa8' },
      { id: 'w', x1: 0, y1: 5, x2: 0, y2: 0, colour: '#e0ddd5' },
    ],
    floor: { x1: 0, y1: 0, x2: 6, y2: 5, colour: '#606060' },
    ceiling: { heightM: 3, colour: '#f0f0f0' },
    subject: { x: 2, y: 2.5, heightM: 1.3, facingDeg: 0 },
    camera: { x: 5, y: 2.5, heightM: 1.3, aimDeg: 180, aperture: 8, shutterS: 1 / 160, iso: 100 },
  };
  const grid = { x0: 0, y0: 0, x1: 6, y1: 5, nx: 121, ny: 101 };
  const cellAt = (x: number, y: number) => Math.round(y / 0.05) * grid.nx + Math.round(x / 0.05);
  const points: [number, number, number][] = [];
  for (const d of [0.1, 0.3, 1]) {
    for (const t of [1, 2.5, 4]) points.push([d, t, d], [6 - d, t, d]);
    for (const t of [1, 3, 5]) points.push([t, d, d], [t, 5 - d, d]);
  }
  // Bounds: the bounce is interpolated between points 0.2 m apart; the wall's light changes fastest within a
  // few centimetres of it (the wash's hot spot), so 0.1 m from a wall gets the looser bound.
  const bound = (d: number) => (d < 0.2 ? 0.4 : 0.1);

  it('a flat receptor facing towards, away from and along the walls reads the meter\'s probes at 0.1, 0.3 and 1 m from them', () => {
    const parsed = parseScene(s);
    for (const facing of [0, 90, 180, 270]) {
      const map = lightMap(parsed, { ...grid, facing });
      const m = meter({ ...parsed, probes: points.map(([x, y], i) => ({ id: `p${i}`, x, y, z: 1.3, facingDeg: facing })) });
      points.forEach(([x, y, d], i) => {
        const err = Math.log2(map.luxSeconds[cellAt(x, y)]! / m.probes[i]!.luxSeconds);
        expect(Math.abs(err), `facing ${facing}° at (${x}, ${y}), ${d} m from a wall`).toBeLessThan(bound(d));
      });
    }
  });

  it('the dome pointed at the camera reads the meter\'s own dome at the same points', () => {
    const parsed = parseScene({ ...s, options: { receptor: 'dome-camera' } });
    const map = lightMap(parsed, grid);
    expect(map.receptor).toBe('dome');
    meter(parsed);
    const r = buildRoom(parsed);
    for (const [x, y, d] of points) {
      const dome = { x, y, z: 1.3, ...unitVector(5 - x, 2.5 - y, 0), kind: 'dome' as const };
      const total = gather(r, dome, false).reduce((acc, g) => acc + g.direct + g.bounce, 0);
      expect(Math.abs(Math.log2(map.luxSeconds[cellAt(x, y)]! / total)), `(${x}, ${y}), ${d} m from a wall`).toBeLessThan(bound(d));
    }
  });
});

describe('the subject\'s body: a torso and a head', () => {
  // A bare point source 2 m in front of the subject, at the height of the map's plane, so its rays are level and
  // the shadow's width on the plane is the plan projection of whichever box the plane cuts. The subject faces the light.
  const body = { widthM: 0.45, depthM: 0.25, topM: 1.75 };
  const scene = (h: number): SceneInput =>
    room([flash('a', 1, 2.5, 0, { heightM: h })], {
      surfaces: [],
      flags: [],
      subject: { x: 3, y: 2.5, heightM: 1.6, facingDeg: 180, body },
      options: { bounce: false },
    });
  // Points along x = 5, 2 m behind the subject; 2 mm apart across.
  const line = (h: number) => lightMap(scene(h), { x0: 5, y0: 2, x1: 5.001, y1: 3, nx: 2, ny: 501, heightM: h, facing: 180 });
  // Half width of the shadow at x = 5: the box's nearest corners (half width w, at x = 3 − d/2 towards the light)
  // seen from the light at x = 1: w · (5 − 1) / (3 − d/2 − 1).
  const halfShadow = (w: number, d: number) => (w * 4) / (2 - d / 2);
  const edges = (h: number) => {
    const m = line(h);
    const dark: number[] = [];
    for (let j = 0; j < m.ny; j++) if (m.luxSeconds[j * 2]! === 0) dark.push(2 + j * 0.002);
    return { lo: Math.min(...dark), hi: Math.max(...dark), lit: m.luxSeconds.some((v) => v > 0) };
  };

  it('at head height the shadow is the head\'s (0.16 m wide, 0.2 m deep), not the shoulders\'', () => {
    const e = edges(1.6);
    const half = halfShadow(0.08, 0.2);
    expect(e.lit).toBe(true);
    expect(e.lo).toBeCloseTo(2.5 - half, 2);
    expect(e.hi).toBeCloseTo(2.5 + half, 2);
  });

  it('at chest height the shadow is the torso\'s (the body\'s width and depth)', () => {
    const e = edges(1.2);
    const half = halfShadow(0.225, 0.25);
    expect(e.lo).toBeCloseTo(2.5 - half, 2);
    expect(e.hi).toBeCloseTo(2.5 + half, 2);
  });

  it('above the head nothing is shaded; a body too short for a head is one box', () => {
    expect(edges(1.85).lo).toBe(Infinity);
    const short = lightMap(
      room([flash('a', 1, 2.5, 0, { heightM: 0.5 })], { surfaces: [], flags: [], subject: { x: 3, y: 2.5, heightM: 0.5, facingDeg: 180, body: { widthM: 0.45, depthM: 0.25, topM: 0.55 } }, options: { bounce: false } }),
      { x0: 5, y0: 2, x1: 5.001, y1: 3, nx: 2, ny: 501, heightM: 0.5, facing: 180 },
    );
    const dark: number[] = [];
    for (let j = 0; j < short.ny; j++) if (short.luxSeconds[j * 2]! === 0) dark.push(2 + j * 0.002);
    expect(Math.max(...dark) - 2.5).toBeCloseTo(halfShadow(0.225, 0.25), 2);
  });
});
