// The installable web app, made after `expo export` (scripts/ensure.mjs): the web manifest and its icons, the
// <link rel="manifest"> in every page, and the service worker (web/serviceWorker.ts bundled with esbuild, then
// Workbox writes the precache list into it: every file of the build with a revision, so a new build is a new
// worker whose precache replaces the old one's).
import { copyFileSync, existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { htmlFiles } from './staticPages.mjs';

/** The files of the build the worker precaches (the app shell, chunks, workers, fonts, icons). */
export const PRECACHE_GLOBS = ['**/*.{html,js,css,ttf,otf,woff,woff2,png,svg,ico,webmanifest}'];
// Not the pages rendered at build time (dist/pages/): offline, a navigation gets the app shell (index.html),
// which renders any route.
const IGNORED = ['sw.js', '**/*.map', '**/*.br', '**/*.gz', '**/.falloff-*', 'assets/node_modules/expo-router/**', 'pages/**'];


const HEAD_TAGS = '<link rel="manifest" href="/manifest.webmanifest"><link rel="icon" href="/icon.svg" type="image/svg+xml"><link rel="apple-touch-icon" href="/icon-192.png"><meta name="theme-color" content="#1d2024">';

/**
 * Write the manifest, icons and service worker into `webDir`. `root`: the project (for public/ and the worker's
 * source). Returns { count, size } of the precache.
 */
export async function buildServiceWorker({ root, webDir, swSource = join(root, 'web', 'serviceWorker.ts') }) {
  const pub = join(root, 'public');
  for (const name of ['manifest.webmanifest', 'icon.svg']) if (existsSync(join(pub, name))) copyFileSync(join(pub, name), join(webDir, name));
  const { default: sharp } = await import('sharp');
  const svg = readFileSync(join(pub, 'icon.svg'));
  for (const px of [192, 512]) await sharp(svg, { density: 72 * (px / 512) * 4 }).resize(px, px).png().toFile(join(webDir, `icon-${px}.png`));
  for (const page of htmlFiles(webDir)) {
    const html = readFileSync(page, 'utf8');
    if (!html.includes('rel="manifest"')) writeFileSync(page, html.replace('</head>', `${HEAD_TAGS}</head>`));
  }
  const esbuild = await import('esbuild');
  const tmp = join(webDir, '.falloff-sw-src.js');
  await esbuild.build({ entryPoints: [swSource], bundle: true, format: 'iife', minify: true, target: 'es2020', outfile: tmp, logLevel: 'warning', define: { 'process.env.NODE_ENV': '"production"' } });
  const { injectManifest } = await import('workbox-build');
  try {
    const r = await injectManifest({
      swSrc: tmp,
      swDest: join(webDir, 'sw.js'),
      globDirectory: webDir,
      globPatterns: PRECACHE_GLOBS,
      globIgnores: IGNORED,
      maximumFileSizeToCacheInBytes: 16 * 1024 * 1024,
    });
    for (const w of r.warnings) console.warn(`[falloff] service worker: ${w}`);
    return { count: r.count, size: r.size };
  } finally {
    rmSync(tmp, { force: true });
  }
}
