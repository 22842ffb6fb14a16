import { describe, expect, it } from 'vitest';
import { angleOfViewDeg, discAxisIlluminanceLux, illuminanceLux, inverseSquareStops, kelvinFromMired, mired, shiftKelvin } from '../../../calc';

describe('inverseSquareStops — inverse-square law E ∝ 1/d²', () => {
  it('common practice: doubling the distance to a light costs two stops', () => {
    expect(inverseSquareStops(1, 2)).toBeCloseTo(-2, 12);
    expect(inverseSquareStops(2.5, 5)).toBeCloseTo(-2, 12);
  });
  it.each([
    [1, Math.SQRT2, -1],
    [3, 1.5, 2],
    [2, 2, 0],
    [1, 4, -4],
  ])('%d m → %d m: %d stops', (from, to, stops) => {
    expect(inverseSquareStops(from, to)).toBeCloseTo(stops, 10);
  });
});

describe('illuminanceLux — inverse-square and Lambert cosine law E = I·cosθ/d² (IES definition "cosine law")', () => {
  it('628 lm isotropic → I = 50 cd; at 1 m with cosθ = 0.8 → 40 lx (byjus worked example)', () => {
    const I = 628 / (4 * Math.PI);
    expect(I).toBeCloseTo(50, 1);
    expect(illuminanceLux(I, 1, (Math.acos(0.8) * 180) / Math.PI)).toBeCloseTo(0.8 * I, 10);
    expect(illuminanceLux(50, 1, (Math.acos(0.8) * 180) / Math.PI)).toBeCloseTo(40, 10);
  });
  it('2000 cd at 8 ft → 31.25 fc (336 lx); at 20° → 29.4 fc (lecture notes, imperial)', () => {
    const ft = 0.3048;
    const fc = 10.7639; // lux per foot-candle
    expect(illuminanceLux(2000, 8 * ft) / fc).toBeCloseTo(31.25, 2);
    expect(illuminanceLux(2000, 8 * ft)).toBeCloseTo(336.4, 0);
    expect(illuminanceLux(2000, 8 * ft, 20) / fc).toBeCloseTo(29.37, 2);
  });
  it('light from behind the surface gives nothing', () => {
    expect(illuminanceLux(100, 1, 90)).toBeCloseTo(0, 12);
    expect(illuminanceLux(100, 1, 135)).toBe(0);
  });
  it('disc on-axis form I/(d² + R²) equals the coaxial-disc view factor R²/(R²+h²) times πL, and tends to I/d²', () => {
    // Lambertian disc of luminance L, radius R: I = L·πR²; view factor F = R²/(R²+h²) (disk view factor).
    const L = 1000;
    const R = 0.5;
    for (const h of [0.5, 1, 2]) {
      const F = (R * R) / (R * R + h * h);
      expect(discAxisIlluminanceLux(L * Math.PI * R * R, h, R)).toBeCloseTo(Math.PI * L * F, 8);
    }
    expect(discAxisIlluminanceLux(100, 100, 0.5) / illuminanceLux(100, 100)).toBeCloseTo(1, 4);
  });
});

describe('angleOfViewDeg — AOV = 2·atan(d / 2f), 36 × 24 mm frame (diagonal 43.267 mm)', () => {
  it.each([
    { f: 24, h: 73.74, v: 53.13, d: 84.06 },
    { f: 35, h: 54.43, v: 37.85, d: 63.44 },
    { f: 50, h: 39.6, v: 26.99, d: 46.79 },
  ])('$f mm → $h° × $v° (diagonal $d°)', ({ f, h, v, d }) => {
    expect(angleOfViewDeg(f, 36)).toBeCloseTo(h, 1);
    expect(angleOfViewDeg(f, 24)).toBeCloseTo(v, 1);
    expect(angleOfViewDeg(f, Math.hypot(36, 24))).toBeCloseTo(d, 1);
  });
});

describe('mired — M = 10⁶/T', () => {
  it.each([
    [25000, 40],
    [5000, 200],
    [5500, 181.8],
    [3600, 277.8],
  ])('%d K → %d mired', (k, m) => {
    expect(mired(k)).toBeCloseTo(m, 1);
    expect(kelvinFromMired(mired(k))).toBeCloseTo(k, 8);
  });
  it('5700 K → 3200 K is about −137 mired the other way (full CTB); 6500 K → 3200 K is about +159 (full CTO)', () => {
    expect(mired(5700) - mired(3200)).toBeCloseTo(-137, 0);
    expect(mired(3200) - mired(6500)).toBeCloseTo(159, 0);
    expect(shiftKelvin(6500, mired(3200) - mired(6500))).toBeCloseTo(3200, 6);
  });
});
