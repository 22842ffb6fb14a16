// The app's own font files (shipped in npm packages, never fetched) for the server's exports. The plan
// sketch names fonts by the app's registered names ('IBMPlexSans_500Medium'); resvg and standalone SVG need
// real family names and weights, pdfkit needs the files registered under a name.
import { readFileSync } from 'node:fs';
import * as fontkit from 'fontkit';
import { dirname, join } from 'node:path';

export const FONT_NAMES = ['IBMPlexSans_400Regular', 'IBMPlexSans_500Medium', 'IBMPlexSans_600SemiBold', 'IBMPlexMono_400Regular', 'IBMPlexMono_500Medium'] as const;
export type FontName = (typeof FONT_NAMES)[number];

const NAME = /^IBMPlex(Sans|Mono)_(\d{3})[A-Za-z]+$/;

/** The .ttf of an app font name, from @expo-google-fonts/ibm-plex-sans or …-mono. */
function fontFile(name: FontName): string {
  const [, face] = NAME.exec(name)!;
  const pkg = `@expo-google-fonts/ibm-plex-${face!.toLowerCase()}`;
  const root = dirname(require.resolve(`${pkg}/package.json`));
  return join(root, name.slice(name.indexOf('_') + 1), `${name}.ttf`);
}

const allFontFiles = () => FONT_NAMES.map(fontFile);

/** CSS family stacks for an SVG that leaves this server (a viewer without Plex falls back sensibly). */
const CSS_FAMILY = { Sans: 'IBM Plex Sans, Helvetica, Arial, sans-serif', Mono: 'IBM Plex Mono, Menlo, Consolas, monospace' } as const;

/**
 * Rewrite `font-family="IBMPlexSans_500Medium"` into `font-family="IBM Plex Sans, …" font-weight="500"`,
 * which resvg (with the font files loaded) and any browser understand.
 */
export function realFontNames(svg: string): string {
  return svg.replace(/font-family="IBMPlex(Sans|Mono)_(\d{3})[A-Za-z]+"/g, (_m, face: 'Sans' | 'Mono', weight: string) => `font-family="${CSS_FAMILY[face]}" font-weight="${weight}"`);
}

let padded: Map<FontName, Buffer> | null = null;

/**
 * A font file's bytes for pdfkit. The Plex Mono files end with an empty glyph (the space) whose header
 * fontkit reads past the end of the file; a few zero bytes after the last table make that read land on
 * zeros (an empty box), which is what the glyph is. Read once per process.
 */
function pdfFontBytes(name: FontName): Buffer {
  padded ??= new Map(FONT_NAMES.map((n) => [n, Buffer.concat([readFileSync(fontFile(n)), Buffer.alloc(64)])]));
  return padded.get(name)!;
}

let parsed: Map<FontName, unknown> | null = null;

/**
 * The fonts parsed once per process (fontkit, the parser pdfkit itself uses), for `doc.registerFont`: pdfkit
 * takes a parsed font as it takes bytes, and parsing the five files again for every PDF was most of a crew
 * sheet's time. A parsed font is only read (pdfkit subsets it per document), and its glyph caches carry over.
 */
export function pdfFonts(): ReadonlyMap<FontName, unknown> {
  parsed ??= new Map(FONT_NAMES.map((n) => [n, fontkit.create(pdfFontBytes(n))]));
  return parsed;
}

/**
 * What the PNG renderer (resvg) gets of the fonts. resvg parses every font it is handed on every render, and the
 * five files are 923 KB; so once per process they are cut down (subset-font) to the characters a plan shows in
 * practice — Latin with its accents, punctuation, arrows, maths and shapes (′ ″ × ° · − … ▲ ⚠) — a small part of
 * the bytes. A drawing with any character outside that set gets the whole files, so no glyph is ever lost.
 */
const RESVG_RANGES: [number, number][] = [
  [0x20, 0x7e],
  [0xa0, 0x24f],
  [0x2000, 0x206f],
  [0x20ac, 0x20ac],
  [0x2100, 0x21ff],
  [0x2200, 0x22ff],
  [0x25a0, 0x25ff],
  [0x2600, 0x26ff],
];
const covered = (cp: number) => RESVG_RANGES.some(([a, b]) => cp >= a && cp <= b);
const RESVG_TEXT = RESVG_RANGES.flatMap(([a, b]) => Array.from({ length: b - a + 1 }, (_, i) => String.fromCodePoint(a + i))).join('');

/** True when every character of the text is in the subset (markup included: it is ASCII). */
export function subsetCovers(text: string): boolean {
  for (const ch of text) if (!covered(ch.codePointAt(0)!)) return false;
  return true;
}

let fullBuffers: Buffer[] | null = null;
let subsets: Buffer[] | null = null;
let subsetting: Promise<Buffer[]> | null = null;

/** The whole font files, read once per process. */
export function fullFontBuffers(): Buffer[] {
  fullBuffers ??= allFontFiles().map((f) => readFileSync(f));
  return fullBuffers;
}

/** Makes the subsets (once per process; later calls share the first). A failure leaves the whole files in use. */
export function prepareResvgFonts(): Promise<Buffer[] | null> {
  subsetting ??= (async () => {
    const { default: subsetFont } = await import('subset-font');
    const made = await Promise.all(fullFontBuffers().map((b) => subsetFont(b, RESVG_TEXT, { targetFormat: 'truetype' })));
    subsets = made;
    return made;
  })();
  return subsetting.catch(() => null);
}

/** The fonts to hand resvg for this SVG: the subsets once made and enough, else the whole files. */
export function resvgFontBuffers(svg: string): Buffer[] {
  return subsets && subsetCovers(svg) ? subsets : fullFontBuffers();
}
