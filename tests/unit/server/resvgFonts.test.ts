// The PNG renderer's fonts (server/export/fonts.ts): subsets made once per process, a small part of the five
// files' bytes, handed to resvg for a drawing they cover; a drawing with a character outside them gets the whole
// files; and a plan drawn with the subsets matches one drawn with the whole files.
import { describe, expect, it } from 'vitest';
import { Resvg } from '@resvg/resvg-js';
import { fullFontBuffers, prepareResvgFonts, resvgFontBuffers, subsetCovers } from '../../../server/export/fonts';

const render = (svg: string, fontBuffers: Buffer[]) =>
  new Resvg(svg, { font: { fontBuffers, loadSystemFonts: false, defaultFontFamily: 'IBM Plex Sans' } } as ConstructorParameters<typeof Resvg>[1]).render().pixels;

describe('resvg fonts', () => {
  it('are subsets a fraction of the files, made once and shared', async () => {
    const full = fullFontBuffers();
    const [a, b] = await Promise.all([prepareResvgFonts(), prepareResvgFonts()]);
    expect(a).toBe(b);
    expect(a).toHaveLength(full.length);
    const sum = (xs: Buffer[]) => xs.reduce((n, x) => n + x.length, 0);
    expect(sum(full)).toBeGreaterThan(800 * 1024);
    expect(sum(a!)).toBeLessThan(sum(full) / 2);
  }, 60_000);

  it('covers the trade’s symbols and falls back to the whole files for anything else', async () => {
    await prepareResvgFonts();
    const plan = '<svg xmlns="http://www.w3.org/2000/svg" width="400" height="80"><text x="4" y="40" font-family="IBM Plex Sans" font-weight="500" font-size="18">Kéy 5′ 6″ × 2 · 45° − f/8 … ▲ ⚠</text></svg>';
    expect(subsetCovers(plan)).toBe(true);
    expect(resvgFontBuffers(plan)).not.toBe(fullFontBuffers());
    const greek = plan.replace('Kéy', 'Φως');
    expect(subsetCovers(greek)).toBe(false);
    expect(resvgFontBuffers(greek)).toBe(fullFontBuffers());
    // The same pixels either way.
    expect(Buffer.from(render(plan, resvgFontBuffers(plan))).equals(Buffer.from(render(plan, fullFontBuffers())))).toBe(true);
  }, 60_000);
});
