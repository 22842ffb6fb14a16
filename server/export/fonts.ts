// The app's own font files (shipped in npm packages, never fetched) for the server's exports. The plan
// sketch names fonts by the app's registered names ('IBMPlexSans_500Medium'); resvg and standalone SVG need
// real family names and weights, pdfkit needs the files registered under a name.
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

export const FONT_NAMES = ['IBMPlexSans_400Regular', 'IBMPlexSans_500Medium', 'IBMPlexSans_600SemiBold', 'IBMPlexMono_400Regular', 'IBMPlexMono_500Medium'] as const;
export type FontName = (typeof FONT_NAMES)[number];

const NAME = /^IBMPlex(Sans|Mono)_(\d{3})[A-Za-z]+$/;

/** The .ttf of an app font name, from @expo-google-fonts/ibm-plex-sans or …-mono. */
export function fontFile(name: FontName): string {
  const [, face, weight] = NAME.exec(name)!;
  const pkg = `@expo-google-fonts/ibm-plex-${face!.toLowerCase()}`;
  const root = dirname(require.resolve(`${pkg}/package.json`));
  return join(root, name.slice(name.indexOf('_') + 1), `${name}.ttf`);
}

export const allFontFiles = () => FONT_NAMES.map(fontFile);

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
export function pdfFontBytes(name: FontName): Buffer {
  padded ??= new Map(FONT_NAMES.map((n) => [n, Buffer.concat([readFileSync(fontFile(n)), Buffer.alloc(64)])]));
  return padded.get(name)!;
}
