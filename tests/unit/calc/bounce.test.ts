import { describe, expect, it } from 'vitest';
import { patchBounceLux, polygonIrradiancePerLuminance, rectangleBounceLux, type Vec3 } from '../../../calc';

const v = (x: number, y: number, z: number): Vec3 => ({ x, y, z });

describe('patchBounceLux — Lambertian patch: L = ρE/π (CIE ILV "Lambertian surface"), E′ = L·A·cosθe·cosθr/d²', () => {
  it('E = 1000 lx, ρ = 0.8 → L = 254.65 cd/m²: a 1 cm² patch at 1 m, both normal, gives 254.65·10⁻⁴ lx', () => {
    const e = patchBounceLux({ incidentLux: 1000, reflectance: 0.8, areaM2: 1e-4, distanceM: 1, emitAngleDeg: 0, receiveAngleDeg: 0 });
    expect(e / 1e-4).toBeCloseTo(254.65, 2);
  });
  it('follows both cosines and the inverse square', () => {
    const base = { incidentLux: 500, reflectance: 0.5, areaM2: 0.01, distanceM: 2, emitAngleDeg: 0, receiveAngleDeg: 0 };
    const e0 = patchBounceLux(base);
    expect(patchBounceLux({ ...base, emitAngleDeg: 60 }) / e0).toBeCloseTo(0.5, 10);
    expect(patchBounceLux({ ...base, receiveAngleDeg: 60 }) / e0).toBeCloseTo(0.5, 10);
    expect(patchBounceLux({ ...base, distanceM: 4 }) / e0).toBeCloseTo(0.25, 10);
    expect(patchBounceLux({ ...base, emitAngleDeg: 100 })).toBe(0);
  });
  it('many small patches of a coaxial disc sum to the disc view factor F = R²/(R²+h²) (h = R → 0.5, h = 2R → 0.2, R = 2h → 0.8)', () => {
    for (const [R, h, F] of [[1, 1, 0.5], [1, 2, 0.2], [2, 1, 0.8]] as const) {
      const rings = 400;
      const sectors = 64;
      let e = 0;
      for (let i = 0; i < rings; i++) {
        const r = ((i + 0.5) / rings) * R;
        const dr = R / rings;
        for (let s = 0; s < sectors; s++) {
          const area = (r * dr * 2 * Math.PI) / sectors;
          const d = Math.hypot(r, h);
          const ang = (Math.atan2(r, h) * 180) / Math.PI;
          e += patchBounceLux({ incidentLux: Math.PI, reflectance: 1, areaM2: area, distanceM: d, emitAngleDeg: ang, receiveAngleDeg: ang });
        }
      }
      // incidentLux π, ρ = 1 → L = 1, so E′ = π·F... divided by π gives F.
      expect(e / Math.PI).toBeCloseTo(F, 3);
    }
  });
});

/** Differential element parallel to a rectangle a × b at distance c, normal through a corner (Howell, A Catalog of Radiation Heat Transfer Configuration Factors: planar element to parallel rectangle). */
function howellCornerParallel(a: number, b: number, c: number): number {
  const A = a / c;
  const B = b / c;
  const sA = Math.sqrt(1 + A * A);
  const sB = Math.sqrt(1 + B * B);
  return (1 / (2 * Math.PI)) * ((A / sA) * Math.atan(B / sA) + (B / sB) * Math.atan(A / sB));
}

describe('rectangleBounceLux — exact polygon (Lambert contour integral) for a uniformly lit Lambertian rectangle', () => {
  const wall = { center: v(0, 0, 0), normal: v(1, 0, 0), up: v(0, 0, 1), incidentLux: 1000, reflectance: 0.8 };
  it('infinite-plane limit: a very large wall in front of the point gives ρ·E = 800 lx (view factor → 1)', () => {
    const e = rectangleBounceLux({ ...wall, widthM: 1e5, heightM: 1e5, point: v(1, 0, 0), pointNormal: v(-1, 0, 0) });
    expect(e).toBeCloseTo(800, 1);
  });
  it('a receptor facing along the wall sees half of it (view factor to a perpendicular infinite plane = 1/2)', () => {
    const e = rectangleBounceLux({ ...wall, widthM: 1e5, heightM: 1e5, point: v(1, 0, 0), pointNormal: v(0, 1, 0) });
    expect(e).toBeCloseTo(400, 1);
  });
  it.each([
    [1, 1, 1],
    [2, 1, 0.5],
    [3, 0.5, 2],
  ])("matches the parallel corner view factor (Howell's catalog) for a = %d, b = %d, c = %d", (a, b, c) => {
    // Rectangle spanning y ∈ [0, a], z ∈ [0, b] on the plane x = 0; point at x = c over its corner.
    const e = rectangleBounceLux({ ...wall, center: v(0, a / 2, b / 2), widthM: a, heightM: b, point: v(c, 0, 0), pointNormal: v(-1, 0, 0) });
    const L = (wall.reflectance * wall.incidentLux) / Math.PI;
    expect(e / (Math.PI * L)).toBeCloseTo(howellCornerParallel(a, b, c), 8);
  });
  it('is zero behind the wall and for a receptor turned away', () => {
    expect(rectangleBounceLux({ ...wall, widthM: 2, heightM: 2, point: v(-1, 0, 0), pointNormal: v(1, 0, 0) })).toBe(0);
    expect(rectangleBounceLux({ ...wall, widthM: 2, heightM: 2, point: v(1, 0, 0), pointNormal: v(1, 0, 0) })).toBe(0);
  });
  it('the polygon integral does not depend on vertex order or a rotated frame', () => {
    const quad = [v(1, -1, 2), v(1, 1, 2), v(-1, 1, 2), v(-1, -1, 2)];
    const up = v(0, 0, 1);
    const f1 = polygonIrradiancePerLuminance(quad, up);
    const f2 = polygonIrradiancePerLuminance([...quad].reverse(), up);
    expect(f1).toBeCloseTo(f2, 12);
    // 2 × 2 square centred over the point at height 2 = four corner rectangles of 1 × 1 at c = 2.
    expect(f1 / Math.PI).toBeCloseTo(4 * howellCornerParallel(1, 1, 2), 10);
  });
});
