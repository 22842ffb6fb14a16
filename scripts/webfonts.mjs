// Build step for the web app's fonts (run by scripts/ensure.mjs after `expo export`): the five IBM Plex faces the
// theme names, as WOFF2 subset to the characters the app can show, with content-hashed names under dist/fonts/,
// declared in every page (dist/index.html, dist/pages/) with `font-display: swap` (text shows at once in a fallback face and swaps when the
// face arrives) and the faces the first screen uses preloaded. The app on the web never waits for a font
// (hooks/useAppFonts.web.ts); on phones expo-font loads the same faces from the packages.
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import subsetFont from 'subset-font';
import { htmlFiles } from './staticPages.mjs';

/** The faces, by the family names the styles use (constants/theme.ts), and the files they come from. */
export const FACES = [
  { family: 'IBMPlexSans_400Regular', file: '@expo-google-fonts/ibm-plex-sans/400Regular/IBMPlexSans_400Regular.ttf', preload: true },
  { family: 'IBMPlexSans_500Medium', file: '@expo-google-fonts/ibm-plex-sans/500Medium/IBMPlexSans_500Medium.ttf', preload: true },
  { family: 'IBMPlexSans_600SemiBold', file: '@expo-google-fonts/ibm-plex-sans/600SemiBold/IBMPlexSans_600SemiBold.ttf', preload: true },
  { family: 'IBMPlexMono_400Regular', file: '@expo-google-fonts/ibm-plex-mono/400Regular/IBMPlexMono_400Regular.ttf', preload: false },
  { family: 'IBMPlexMono_500Medium', file: '@expo-google-fonts/ibm-plex-mono/500Medium/IBMPlexMono_500Medium.ttf', preload: false },
];

/** Where the client's words live: every character written in these sources can reach the screen. */
const CLIENT_SOURCES = ['app', 'components', 'constants', 'canvas', 'drawing', 'hooks', 'model', 'calc'];

function sourceFiles(dir, out = []) {
  let names;
  try {
    names = readdirSync(dir);
  } catch {
    return out;
  }
  for (const name of names) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) sourceFiles(p, out);
    else if (/\.(ts|tsx)$/.test(name)) out.push(p);
  }
  return out;
}

/** Printable ASCII, Latin-1 (names and places people type: é, ø, ß…), the typographic marks, and every other
 *  character found in the client's sources (′ ″ × ° · − … arrows, and whatever a label gains later). */
export function charactersShown(root) {
  const chars = new Set();
  for (let c = 0x20; c <= 0x7e; c++) chars.add(String.fromCodePoint(c));
  for (let c = 0xa0; c <= 0xff; c++) chars.add(String.fromCodePoint(c));
  for (const c of '‐‑–—‘’‚“”„†‡•…‰′″‹›€™−×÷±≈≠≤≥°·→←↑↓') chars.add(c);
  for (const dir of CLIENT_SOURCES) {
    for (const f of sourceFiles(join(root, dir))) {
      for (const ch of readFileSync(f, 'utf8')) {
        const cp = ch.codePointAt(0);
        // Letters, marks and symbols beyond ASCII; not emoji or private-use code points.
        if (cp > 0x7e && cp < 0x3000 && !/\p{Cc}|\p{Cs}/u.test(ch)) chars.add(ch);
      }
    }
  }
  return [...chars].sort().join('');
}


/** Writes the subsets into dist/fonts and the @font-face rules and preloads into every page (dist/index.html,
 *  dist/pages/). Returns sizes. */
export async function buildWebFonts(root, distDir, background = '#1d2024') {
  const text = charactersShown(root);
  mkdirSync(join(distDir, 'fonts'), { recursive: true });
  const faces = await Promise.all(
    FACES.map(async (f) => {
      const woff2 = await subsetFont(readFileSync(join(root, 'node_modules', f.file)), text, { targetFormat: 'woff2' });
      const hash = createHash('sha256').update(woff2).digest('hex').slice(0, 20);
      const url = `/fonts/${f.family}.${hash}.woff2`;
      writeFileSync(join(distDir, url), woff2);
      return { ...f, url, bytes: woff2.length };
    }),
  );
  const css = faces.map((f) => `@font-face{font-family:${f.family};src:url(${f.url}) format("woff2");font-display:swap}`).join('');
  const preloads = faces.filter((f) => f.preload).map((f) => `<link rel="preload" href="${f.url}" as="font" type="font/woff2" crossorigin>`).join('');
  // The page's own background from the first paint (the app's graphite), not white until the script runs.
  const page = `html,body{background-color:${background}}`;
  // Every page of the build: the app shell and the pages rendered at build time (scripts/staticPages.mjs).
  for (const path of htmlFiles(distDir)) {
    const html = readFileSync(path, 'utf8');
    if (html.includes('id="falloff-fonts"')) throw new Error(`${path} already has the fonts (build it again)`);
    writeFileSync(path, html.replace('</head>', `${preloads}<style id="falloff-fonts">${page}${css}</style></head>`));
  }
  return { characters: [...text].length, faces: faces.map((f) => ({ family: f.family, bytes: f.bytes })) };
}
