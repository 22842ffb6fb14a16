import { converter, formatHex, lab } from 'culori';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  cctOfLinearRgb,
  hueHex,
  kelvinToLinearRgb,
  linearRgbOf,
  linearToSrgb,
  mcCamyCct,
  PAINT_REFLECTANCE_MAX,
  planckianXy,
  relativeLuminance,
  srgbToLinear,
  surfaceReflectance,
} from '../../../calc';
import { culoriHexOfLinear, isColour, linearRgbToHex, xyOfLinearRgb } from '../../../calc/colour';

const toLrgb = converter('lrgb');

describe('sRGB transfer function (IEC 61966-2-1)', () => {
  it.each([
    [0.5, 0.214041],
    [128 / 255, 0.215861],
    [0.04045, 0.04045 / 12.92],
    [1, 1],
  ])('decode %d → %d', (c, lin) => {
    expect(srgbToLinear(c)).toBeCloseTo(lin, 6);
  });
  it.each([
    [0.18, 0.461356],
    [0.5, 0.735357],
    [0.0031308, 0.0031308 * 12.92],
  ])('encode %d → %d', (lin, c) => {
    expect(linearToSrgb(lin)).toBeCloseTo(c, 6);
  });
  it('agrees with culori (reference implementation) on every 8-bit value', () => {
    for (let i = 0; i <= 255; i++) {
      const hex = `#${i.toString(16).padStart(2, '0').repeat(3)}`;
      expect(srgbToLinear(i / 255)).toBeCloseTo(toLrgb(hex)!.r, 12);
    }
  });
  it('linearRgbToHex agrees with culori formatHex for any linear colour (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (r, g, b) => {
        expect(linearRgbToHex([r, g, b])).toBe(culoriHexOfLinear([r, g, b]));
      }),
    );
  });
});

describe('relative luminance and surface reflectance', () => {
  it('Y = 0.2126 R + 0.7152 G + 0.0722 B (IEC 61966-2-1 primaries) matches culori xyz65 Y', () => {
    const toXyz = converter('xyz65');
    for (const hex of ['#d8c8b0', '#336699', '#ff0000', '#777777']) {
      const lin = linearRgbOf(hex);
      expect(relativeLuminance(lin)).toBeCloseTo(toXyz(hex)!.y, 4);
    }
  });
  it('mid grey L* = 50 has reflectance ((50+16)/116)³ = 18.42 % (CIE L* definition)', () => {
    const grey = formatHex(lab({ mode: 'lab', l: 50, a: 0, b: 0 }));
    // 8-bit rounding of the hex moves Y by under 0.2 %.
    expect(surfaceReflectance(grey).y).toBeCloseTo(((50 + 16) / 116) ** 3, 2);
    expect(((50 + 16) / 116) ** 3).toBeCloseTo(0.1842, 4);
  });
  it('clamps paint to the 5–85 % range unless an explicit reflectance is given; keeps the hue', () => {
    expect(surfaceReflectance('#ffffff').y).toBe(PAINT_REFLECTANCE_MAX);
    expect(surfaceReflectance('#000000').y).toBeCloseTo(0.05, 12);
    expect(surfaceReflectance('#ffffff', 0.97).y).toBe(0.97);
    const red = surfaceReflectance('#c03020', 0.3);
    expect(relativeLuminance(red.rgb)).toBeCloseTo(0.3, 12);
    const lin = linearRgbOf('#c03020');
    expect(red.rgb[0] / red.rgb[1]).toBeCloseTo(lin[0] / lin[1], 10);
  });
});

describe('colour temperature', () => {
  it('Planckian locus fit (Kim et al. 2002) at 2856 K is CIE illuminant A, x 0.44757, y 0.40745 (ISO 11664-2)', () => {
    const { x, y } = planckianXy(2856);
    expect(x).toBeCloseTo(0.44757, 3);
    expect(y).toBeCloseTo(0.40745, 3);
  });
  it("McCamy's formula on the sRGB white (0.3127, 0.3290) gives 6505.08 K (colour-science doctest)", () => {
    expect(mcCamyCct(0.3127, 0.329)).toBeCloseTo(6505.08, 1);
    // and the sRGB white itself, through culori's XYZ
    expect(cctOfLinearRgb([1, 1, 1])).toBeCloseTo(6505, -1);
  });
  it.each([2500, 3200, 4000, 5500, 7500])('%d K round-trips through linear sRGB and McCamy within 1 %', (k) => {
    const cct = cctOfLinearRgb(kelvinToLinearRgb(k));
    expect(cct).not.toBeNull();
    expect(Math.abs(cct! - k) / k).toBeLessThan(0.01);
  });
  it('light colours carry luminance 1, warm ones more red than blue', () => {
    const warm = kelvinToLinearRgb(3200);
    const cool = kelvinToLinearRgb(8000);
    expect(relativeLuminance(warm)).toBeCloseTo(1, 10);
    expect(warm[0]).toBeGreaterThan(warm[2]);
    expect(cool[2]).toBeGreaterThan(cool[0]);
  });
  it('a saturated colour has no CCT (more than Δuv 0.05 from the Planckian locus)', () => {
    expect(cctOfLinearRgb([1, 0, 0])).toBeNull();
    expect(cctOfLinearRgb([0, 0.2, 1])).toBeNull();
    expect(cctOfLinearRgb([0, 0, 0])).toBeNull();
  });
  it('hueHex: a light at the white-balance temperature renders white; brightness is removed', () => {
    expect(hueHex(kelvinToLinearRgb(5500), 5500)).toBe('#ffffff');
    expect(hueHex([0.5, 0.5, 0.5])).toBe('#ffffff');
    const xy = xyOfLinearRgb(kelvinToLinearRgb(3200));
    expect(xy!.x).toBeGreaterThan(0.4);
  });
});

describe('which colours are read', () => {
  it('reads CSS colour syntax and refuses culori’s own color(--space …) on every platform', () => {
    for (const c of ['#f0b24a', 'white', 'rgb(255 128 0)', 'oklch(0.65 0.2 40)', 'color(display-p3 1 0 0)']) expect(isColour(c)).toBe(true);
    for (const c of ['color(--hsv 30 0.5 0.5)', ' COLOR( --luv 50 10 10)', 'not a colour', '', '#12']) expect(isColour(c)).toBe(false);
  });
});
