import { describe, expect, it } from 'vitest';
import { M_PER_FT, formatAperture, formatLength, formatPower, formatShutter, formatStops, fromDisplay, parseFraction, parseLength, parseNumber, toDisplay } from '../../../model/units';

describe('lengths', () => {
  // The international foot is exactly 0.3048 m (International Yard and Pound Agreement, 1959).
  it('uses the international foot', () => expect(M_PER_FT).toBe(0.3048));
  it.each([
    [1, 'metric', '1.00 m'],
    [1.9304, 'imperial', '6′ 4″'],
    [0.3048, 'imperial', '1′ 0″'],
  ] as const)('formats %f m in %s as %s', (m, u, s) => expect(formatLength(m, u)).toBe(s));

  it.each([
    ['2.5', 'metric', 2.5],
    ['250 cm', 'metric', 2.5],
    ['2,5 m', 'metric', 2.5],
    ['6', 'imperial', 6 * 0.3048],
    ["6' 4\"", 'imperial', (6 + 4 / 12) * 0.3048],
    ['6ft 4in', 'imperial', (6 + 4 / 12) * 0.3048],
    ['76 in', 'imperial', (76 / 12) * 0.3048],
    ['2 m', 'imperial', 2],
  ] as const)('reads "%s" in %s', (t, u, m) => expect(parseLength(t, u)).toBeCloseTo(m, 6));

  it('refuses what is not a length', () => {
    for (const t of ['', 'abc', '2 parsecs', '--3']) expect(parseLength(t, 'metric')).toBeNull();
  });

  it('round-trips through the display unit', () => {
    for (const u of ['metric', 'imperial'] as const) expect(fromDisplay(toDisplay(2.37, u), u)).toBeCloseTo(2.37, 9);
  });
});

describe('photographic notation', () => {
  it.each([
    [8, 'f/8'],
    [5.6, 'f/5.6'],
    [11.3, 'f/11'],
    [null, '—'],
  ])('aperture %s → %s', (n, s) => expect(formatAperture(n)).toBe(s));
  it.each([
    [0.34, '+0.3'],
    [-2, '−2.0'],
    [0.01, '±0.0'],
  ])('stops %f → %s', (v, s) => expect(formatStops(v)).toBe(s));
  it.each([
    [1 / 200, '1/200'],
    [1 / 8, '1/8'],
    [2, '2″'],
  ])('shutter %f → %s', (t, s) => expect(formatShutter(t)).toBe(s));
  it.each([
    [1, '1/1'],
    [1 / 8, '1/8'],
    [1 / 256, '1/256'],
    [2 ** -3.3, '1/8 −0.3'],
    [2 ** -2.6, '1/8 +0.4'],
  ])('power %f → %s (each step of the ladder is one stop, common practice)', (p, s) => expect(formatPower(p)).toBe(s));
});

describe('reading typed numbers', () => {
  it.each([
    ['8', 8],
    ['5,6', 5.6],
    ['f/11', 11],
    [' 0.5 ', 0.5],
  ])('number "%s" → %f', (t, v) => expect(parseNumber(t)).toBeCloseTo(v));
  it.each(['', 'eight', '1/8', '3 m'])('"%s" is not a number', (t) => expect(parseNumber(t)).toBeNull());
  it.each([
    ['1/200', 1 / 200],
    ['1 / 8', 1 / 8],
    ['0.5', 0.5],
    ['2″', 2],
    ['1/8 +0.3', 2 ** (-3 + 0.3)],
    ['1/8 −0.3', 2 ** (-3 - 0.3)],
  ])('fraction "%s" → %f', (t, v) => expect(parseFraction(t)!).toBeCloseTo(v, 9));
  it('reads back what formatPower writes', () => {
    for (const p of [1, 1 / 2, 2 ** -3.3, 2 ** -2.6, 1 / 256]) expect(parseFraction(formatPower(p))!).toBeCloseTo(p, 2);
  });
  it.each(['1/0', 'one eighth', '1/'])('"%s" is not a fraction', (t) => expect(parseFraction(t)).toBeNull());
});
