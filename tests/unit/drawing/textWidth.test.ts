// The label width table against the font files the app ships: every advance in the table is the file's own
// (read with fontkit), and a whole label adds up to the file's laid-out width within its kerning.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import * as fontkit from 'fontkit';
import { describe, expect, it } from 'vitest';
import { sansAdvance, textWidthEm } from '../../../drawing/textWidth';
import { textBox } from '../../../drawing/labels';

const req = createRequire(__filename);
// Only what the test reads of a parsed face.
type Face = { unitsPerEm: number; glyphForCodePoint: (c: number) => { id: number; advanceWidth: number }; layout: (s: string) => { advanceWidth: number } };
const open = (path: string) => fontkit.create(readFileSync(req.resolve(path))) as unknown as Face;
const sans = open('@expo-google-fonts/ibm-plex-sans/500Medium/IBMPlexSans_500Medium.ttf');
const mono = open('@expo-google-fonts/ibm-plex-mono/400Regular/IBMPlexMono_400Regular.ttf');

const tabled = [
  ...Array.from({ length: 0x7e - 0x20 + 1 }, (_, k) => String.fromCodePoint(0x20 + k)),
  ...Array.from({ length: 0xff - 0xa0 + 1 }, (_, k) => String.fromCodePoint(0xa0 + k)),
  ...'·°−–—′″×÷’‘“”…→←↑↓€•',
];

describe('label widths', () => {
  it('are the sans face’s own advances, character by character', () => {
    expect(sans.unitsPerEm).toBe(1000);
    for (const ch of tabled) expect(sansAdvance(ch), `U+${ch.codePointAt(0)!.toString(16)}`).toBe(sans.glyphForCodePoint(ch.codePointAt(0)!).advanceWidth);
  });

  it('are 0.6 em a character in the mono face', () => {
    expect(mono.unitsPerEm).toBe(1000);
    // (read from the metrics table: fontkit cannot size the mono face's empty space glyph)
    const hmtx = (mono as unknown as { hmtx: { metrics: { get: (id: number) => { advance: number } } } }).hmtx;
    for (const ch of '0123456789 .,:/−+°′″·fmsISOftin') expect(hmtx.metrics.get(mono.glyphForCodePoint(ch.codePointAt(0)!).id).advance).toBe(600);
    expect(textWidthEm('1/8 · f/5.6', true)).toBeCloseTo(11 * 0.6, 6);
  });

  it.each(['Key · 1.90 m', 'Rim left · 2.00 m · −20°', 'Hair light', 'Beauty dish, 22″', 'WWW', 'iiii', 'Ève à côté'])('“%s” adds up to the laid-out width within 3 %%', (words) => {
    const laid = sans.layout(words).advanceWidth / 1000;
    expect(Math.abs(textWidthEm(words, false) - laid)).toBeLessThanOrEqual(0.03 * laid + 0.01);
  });

  it('tells narrow words from wide ones (the old estimate gave both the same box)', () => {
    const narrow = textBox('iiiiii', 12, false).hw;
    const wide = textBox('WWWWWW', 12, false).hw;
    expect(wide / narrow).toBeGreaterThan(3);
    expect(textBox('Key', 12, false).hh).toBeCloseTo(7.2, 6);
  });
});
