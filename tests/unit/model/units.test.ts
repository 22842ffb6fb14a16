import { describe, expect, it } from 'vitest';
import { APERTURE_THIRDS, ISO_THIRDS, M_PER_FT, SHUTTER_THIRDS, formatAperture, formatLength, formatPower, formatShutter, formatStops, fromDisplay, lengthText, parseFraction, parseLength, parseNumber, parsePower, parseShutter, toDisplay } from '../../../model/units';

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
    ['5′ 6″', 'imperial', (5 + 6 / 12) * 0.3048],
    ['5.5', 'imperial', 5.5 * 0.3048],
    ['170 cm', 'imperial', 1.7],
  ] as const)('reads "%s" in %s', (t, u, m) => expect(parseLength(t, u)).toBeCloseTo(m, 6));

  it('refuses what is not a length', () => {
    for (const t of ['', 'abc', '2 parsecs', '--3']) expect(parseLength(t, 'metric')).toBeNull();
  });

  it('5′ 6″ in, 5′ 6″ out: every whole inch from 0 to 30 ft reads back to the text it was written as', () => {
    for (let inch = 0; inch <= 360; inch++) {
      const text = lengthText((inch / 12) * M_PER_FT, 'imperial');
      expect(lengthText(parseLength(text, 'imperial')!, 'imperial')).toBe(text);
    }
    expect(lengthText(parseLength('5′ 6″', 'imperial')!, 'imperial')).toBe('5′ 6″');
  });

  it('metric fields round-trip every centimetre to 20 m', () => {
    for (let cm = 0; cm <= 2000; cm++) {
      const text = lengthText(cm / 100, 'metric');
      expect(lengthText(parseLength(text, 'metric')!, 'metric')).toBe(text);
    }
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

  // A camera shows 1/200 s as "200" and marks whole seconds with ″ (common practice): the number pad types the first.
  it.each([
    ['200', 1 / 200],
    ['1/200', 1 / 200],
    ['0.5', 0.5],
    ['2″', 2],
    ['2s', 2],
    ['1', 1],
  ])('shutter "%s" → %f s', (t, v) => expect(parseShutter(t)!).toBeCloseTo(v, 9));
  it.each(['0', '', 'fast', '1/0'])('"%s" is not a shutter time', (t) => expect(parseShutter(t)).toBeNull());
  it('every shutter on the scale reads back from what formatShutter writes', () => {
    for (const t of SHUTTER_THIRDS) expect(parseShutter(formatShutter(t))!).toBeCloseTo(t, 2);
  });
  it.each([
    ['8', 1 / 8],
    ['1', 1],
    ['1/8', 1 / 8],
    ['0.25', 0.25],
    ['1/8 +0.3', 2 ** -2.7],
  ])('power "%s" → %f of full', (t, v) => expect(parsePower(t)!).toBeCloseTo(v, 9));
  it.each(['0', '', 'half'])('"%s" is not a power', (t) => expect(parsePower(t)).toBeNull());
});

describe('third-stop scales (common practice: each marked value is about a third of a stop from the next)', () => {
  it.each([
    ['ISO', ISO_THIRDS, (a: number, b: number) => Math.log2(b / a)],
    ['aperture', APERTURE_THIRDS, (a: number, b: number) => 2 * Math.log2(b / a)],
    ['shutter', SHUTTER_THIRDS, (a: number, b: number) => Math.log2(b / a)],
  ] as const)('%s: ascending, each step a third of a stop (marked values are rounded)', (_name, list, stops) => {
    for (let k = 1; k < list.length; k++) {
      const s = stops(list[k - 1]!, list[k]!);
      // The top ISO values past 25600 go in whole stops, as cameras extend them.
      if (list === ISO_THIRDS && list[k]! > 25600) expect(s).toBeCloseTo(1, 1);
      else expect(Math.abs(s - 1 / 3)).toBeLessThan(0.16);
    }
  });
  it('holds the values photographers expect', () => {
    expect(ISO_THIRDS.slice(6, 10)).toEqual([100, 125, 160, 200]);
    expect(APERTURE_THIRDS.slice(3, 10)).toEqual([1.4, 1.6, 1.8, 2, 2.2, 2.5, 2.8]);
    expect(SHUTTER_THIRDS.slice(15, 18).map((t) => Math.round(1 / t))).toEqual([250, 200, 160]);
  });
});
