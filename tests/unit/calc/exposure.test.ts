import { describe, expect, it } from 'vitest';
import {
  apertureForFlashExposure,
  apertureFromGuideNumber,
  apertureStops,
  candelaSecondsFromGuideNumber,
  DEFAULT_CALIBRATION_C,
  ev100FromLux,
  exposureDifferenceStops,
  exposureValue,
  guideNumberFromCandelaSeconds,
  luxFromEv100,
  luxSecondsForAperture,
  powerFractionFromStops,
  powerFractionStops,
} from '../../../calc';

describe('exposureValue — APEX (ASA PH2.5-1960, ANSI PH3.49-1971): Ev = log2(N²/t) − log2(S/100)', () => {
  // Worked values from the APEX tables (Kerr, "APEX — the Additive System of Photographic Exposure").
  it.each([
    { aperture: 1, shutterS: 1, iso: 100, ev: 0 },
    { aperture: 8, shutterS: 1, iso: 100, ev: 6 },
    { aperture: 16, shutterS: 1 / 125, iso: 100, ev: 14.966 },
    { aperture: 16, shutterS: 1 / 100, iso: 100, ev: 14.644 },
    { aperture: 5.6, shutterS: 1 / 1000, iso: 100, ev: 14.937 },
  ])('f/$aperture at $shutterS s → EV $ev', ({ ev, ...e }) => {
    expect(exposureValue(e)).toBeCloseTo(ev, 3);
  });

  it('is Av + Tv with Av = 2·log2 N and Tv = −log2 t (APEX): exact Tv of 1/125 s is 6.966', () => {
    expect(exposureValue({ aperture: 1, shutterS: 1 / 125, iso: 100 })).toBeCloseTo(6.966, 3);
    // Av: f/1.4 → 1 (nominal; exact 0.971), f/2 → 2, f/16 → 8, f/32 → 10.
    expect(exposureValue({ aperture: 2, shutterS: 1, iso: 100 })).toBeCloseTo(2, 10);
    expect(exposureValue({ aperture: 16, shutterS: 1, iso: 100 })).toBeCloseTo(8, 10);
    expect(exposureValue({ aperture: 32, shutterS: 1, iso: 100 })).toBeCloseTo(10, 10);
    expect(exposureValue({ aperture: Math.SQRT2, shutterS: 1, iso: 100 })).toBeCloseTo(1, 10);
  });

  it('normalises to ISO 100: ISO 400 lowers EV100 by 2 (Sv = log2(S/3.125): ISO 100 → 5, ISO 400 → 7)', () => {
    const sv = (s: number) => Math.log2(s / 3.125);
    expect(sv(100)).toBeCloseTo(5, 10);
    expect(sv(400)).toBeCloseTo(7, 10);
    const e100 = exposureValue({ aperture: 8, shutterS: 1 / 125, iso: 100 });
    const e400 = exposureValue({ aperture: 8, shutterS: 1 / 125, iso: 400 });
    expect(e100 - e400).toBeCloseTo(sv(400) - sv(100), 10);
  });
});

describe('exposureDifferenceStops', () => {
  it('common practice: f/2.8 at ISO 400 → f/7 at ISO 100, same shutter, darkens the ambient by about 4.6 stops (rounded to five)', () => {
    const d = exposureDifferenceStops({ aperture: 2.8, shutterS: 1 / 200, iso: 400 }, { aperture: 7, shutterS: 1 / 200, iso: 100 });
    // 2·log2(7/2.8) + log2(400/100) = 2.644 + 2
    expect(d).toBeCloseTo(-(2 * Math.log2(7 / 2.8) + 2), 10);
    expect(d).toBeCloseTo(-4.644, 3);
    expect(Math.round(-d)).toBe(5);
  });

  it.each([
    // Rules of thumb, "stop = ×2 light" (common practice): f/16 → f/11 doubles; f/16 → f/8 is ×4.
    { from: { aperture: 16, shutterS: 1 / 125, iso: 100 }, to: { aperture: 11.3137, shutterS: 1 / 125, iso: 100 }, stops: 1 },
    { from: { aperture: 16, shutterS: 1 / 125, iso: 100 }, to: { aperture: 8, shutterS: 1 / 125, iso: 100 }, stops: 2 },
    { from: { aperture: 8, shutterS: 1 / 125, iso: 100 }, to: { aperture: 8, shutterS: 1 / 250, iso: 100 }, stops: -1 },
    { from: { aperture: 8, shutterS: 1 / 125, iso: 100 }, to: { aperture: 8, shutterS: 1 / 125, iso: 800 }, stops: 3 },
  ])('$from.aperture → $to.aperture: $stops stops', ({ from, to, stops }) => {
    expect(exposureDifferenceStops(from, to)).toBeCloseTo(stops, 3);
  });

  it('is antisymmetric and agrees with apertureStops for aperture-only changes', () => {
    const a = { aperture: 4, shutterS: 1 / 60, iso: 200 };
    const b = { aperture: 11, shutterS: 1 / 60, iso: 200 };
    expect(exposureDifferenceStops(a, b)).toBeCloseTo(-exposureDifferenceStops(b, a), 12);
    expect(exposureDifferenceStops(a, b)).toBeCloseTo(-apertureStops(4, 11), 12);
  });
});

describe('power fractions — common practice: each halving of flash power is one stop (1/1 … 1/256 = 8 stops)', () => {
  it.each([
    [1, 0],
    [1 / 2, -1],
    [1 / 4, -2],
    [1 / 8, -3],
    [1 / 16, -4],
    [1 / 256, -8],
  ])('%d → %d stops, and back', (fraction, stops) => {
    expect(powerFractionStops(fraction)).toBeCloseTo(stops, 12);
    expect(powerFractionFromStops(stops)).toBeCloseTo(fraction, 12);
  });
  it('a third of a stop below 1/4 is 1/4·2^(−1/3)', () => {
    expect(powerFractionFromStops(-2 - 1 / 3)).toBeCloseTo(0.25 * 2 ** (-1 / 3), 12);
  });
});

describe('guide number — definition GN = d × N at ISO 100, scaling with √(S/100)', () => {
  it.each([
    // openphotographicsociety.org / idigitalphoto.com dictionary, Wikipedia "Guide number"
    { gn: 32, d: 4, iso: 100, n: 8 },
    { gn: 45, d: 5, iso: 100, n: 9 },
    { gn: 80, d: 20, iso: 100, n: 4 }, // feet: GN 80 ft at 20 ft → f/4
    { gn: 80, d: 10, iso: 100, n: 8 },
    // ISO scaling (Photo SE): GN 24 m at 3 m → f/8 at ISO 100, f/11 at ISO 200
    { gn: 24, d: 3, iso: 100, n: 8 },
    { gn: 24, d: 3, iso: 200, n: 8 * Math.SQRT2 },
  ])('GN $gn at $d → f/$n (ISO $iso)', ({ gn, d, iso, n }) => {
    expect(apertureFromGuideNumber(gn, d, iso)).toBeCloseTo(n, 6);
  });
  it.each([
    [50, 0.7071],
    [200, 1.4142],
    [400, 2],
    [800, 2.828],
    [1600, 4],
  ])('ISO %d multiplies the GN by %d', (iso, k) => {
    expect(apertureFromGuideNumber(1, 1, iso)).toBeCloseTo(k, 3);
  });
  it('physics form GN² = I·t·S/C: 2560 cd·s at ISO 100, C = 250 → GN 32 m (ISO 2720 + inverse square)', () => {
    expect(guideNumberFromCandelaSeconds(2560, 250)).toBeCloseTo(32, 10);
    expect(candelaSecondsFromGuideNumber(32, 250)).toBeCloseTo(2560, 8);
  });
  it('power scaling GN·√p: 1/4 power halves the guide number (Photo SE)', () => {
    const full = candelaSecondsFromGuideNumber(40);
    expect(guideNumberFromCandelaSeconds(full / 4)).toBeCloseTo(20, 10);
    expect(guideNumberFromCandelaSeconds(full / 256)).toBeCloseTo(40 * 0.0625, 10);
  });
});

describe('incident-light equation — ISO 2720:1974, flash form N² = H·S/C', () => {
  it('the default C is the flat-receptor 250 (ISO 2720 range 240–400)', () => {
    expect(DEFAULT_CALIBRATION_C).toBe(250);
  });
  it.each([
    { h: 160, iso: 100, c: 250, n: 8 },
    { h: 2.5, iso: 100, c: 250, n: 1 },
    { h: 160, iso: 400, c: 250, n: 16 },
    { h: 160, iso: 100, c: 330, n: Math.sqrt((160 * 100) / 330) },
  ])('H = $h lx·s at ISO $iso, C = $c → f/$n', ({ h, iso, c, n }) => {
    expect(apertureForFlashExposure(h, iso, c)).toBeCloseTo(n, 8);
    expect(luxSecondsForAperture(n, iso, c)).toBeCloseTo(h, 6);
  });
  it('sunny 16 illuminance: E = 256·C at t = 1/S (64 000 lx for C = 250, 84 480 lx for C = 330)', () => {
    // f/16 at t = 1/100, ISO 100 → EV100 = log2(256·100)
    const ev = exposureValue({ aperture: 16, shutterS: 1 / 100, iso: 100 });
    expect(luxFromEv100(ev, 250)).toBeCloseTo(64000, 6);
    expect(luxFromEv100(ev, 330)).toBeCloseTo(84480, 6);
    expect(ev100FromLux(64000, 250)).toBeCloseTo(ev, 10);
  });
});
