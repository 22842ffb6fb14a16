// The web's culori (web/culoriCss.js: only the colour spaces CSS writes) reads and converts every CSS colour
// syntax as the full culori does (calc/colour.ts refuses culori's own `color(--space …)` syntax on every
// platform: tests/unit/calc/colour.test.ts).
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import * as css from '../../../web/culoriCss.js';

// The full culori from its CommonJS bundle: a registry of its own, so a space the web's culori leaves out
// cannot be filled in by the full one in this process (this file imports nothing else of culori's).
const full = createRequire(__filename)('culori') as typeof import('culori');
const lite = css as unknown as Pick<typeof full, 'parse' | 'converter' | 'formatHex'>;

const cssColours = [
  '#fff', '#f0b24a', '#f0b24a80', 'white', 'rebeccapurple', 'transparent', 'rgb(255 128 0)', 'rgba(10, 20, 30, 0.5)',
  'hsl(30 80% 50%)', 'hsla(200, 50%, 40%, 0.3)', 'hwb(120 10% 20%)', 'lab(60 40 -20)', 'lch(70 45 30)',
  'oklab(0.7 0.1 -0.05)', 'oklch(0.65 0.2 40)', 'color(srgb 1 0.5 0)', 'color(srgb-linear 0.2 0.3 0.4)',
  'color(display-p3 1 0 0)', 'color(a98-rgb 0.3 0.6 0.2)', 'color(prophoto-rgb 0.4 0.4 0.7)', 'color(rec2020 0.9 0.2 0.1)',
  'color(xyz-d65 0.3 0.4 0.2)', 'color(xyz-d50 0.3 0.4 0.2)', 'color(xyz 0.2 0.2 0.2)',
];

describe('the web build’s culori', () => {
  it.each(cssColours)('reads %s to the same linear sRGB, XYZ and hex as the full culori', (c) => {
    expect(lite.parse(c)).toEqual(full.parse(c));
    for (const mode of ['lrgb', 'xyz65'] as const) {
      const a = lite.converter(mode)(c)!;
      const b = full.converter(mode)(c)!;
      expect(a).toBeDefined();
      for (const k of Object.keys(b) as (keyof typeof b)[]) {
        if (typeof b[k] === 'number') expect(a[k] as number).toBeCloseTo(b[k] as number, 12);
        else expect(a[k]).toEqual(b[k]);
      }
    }
    expect(lite.formatHex(c)).toBe(full.formatHex(c));
  });

  it('converts the meter’s objects (XYZ to linear sRGB and back) as the full culori does', () => {
    const xyz = { mode: 'xyz65' as const, x: 0.95, y: 1, z: 1.09 };
    expect(lite.converter('lrgb')(xyz)).toEqual(full.converter('lrgb')(xyz));
    const lrgb = { mode: 'lrgb' as const, r: 0.2, g: 0.5, b: 0.9 };
    expect(lite.converter('xyz65')(lrgb)).toEqual(full.converter('xyz65')(lrgb));
  });

  it('leaves out only culori’s own spaces', () => {
    for (const c of ['color(--hsv 30 0.5 0.5)', 'color(--cubehelix 20 0.5 0.5)']) {
      expect(full.parse(c)).toBeDefined();
      expect(lite.parse(c)).toBeUndefined();
    }
  });
});
