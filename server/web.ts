// Serving costs kept small: security headers computed once, the built web app served from files compressed at
// build time (scripts/ensure.mjs writes .br and .gz beside each text file), with caching by content hash.
import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { existsSync, readFileSync, readdirSync, statSync } from 'node:fs';
import { extname, join, relative, sep } from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';

/** helmet's options for the whole app. `upgrade`: the CSP asks browsers to upgrade to https — only for a page
 *  that itself came over https (securityHeaders decides per request): over plain http — a LAN address, a test
 *  host — it would turn every request into a failing https one and leave a blank page. */
export function helmetOptionsFor({ upgrade }: { upgrade: boolean }): Parameters<typeof helmet>[0] {
  return {
    contentSecurityPolicy: {
      directives: {
        // Expo's web build inlines a small bootstrap and style tags; react-native-web sets inline styles.
        'script-src': ["'self'", "'unsafe-inline'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'upgrade-insecure-requests': upgrade ? [] : null,
      },
    },
  };
}
export const helmetOptions = helmetOptionsFor({ upgrade: false });

type Recorded = { set: [string, string | string[]][]; removed: string[] };

/** What helmet does to a response with `options`, recorded once (it sets the same headers for every request). */
function recordHelmet(options: Parameters<typeof helmet>[0]): Recorded {
  const set: Recorded['set'] = [];
  const removed: string[] = [];
  const recorder = {
    setHeader: (name: string, value: string | string[]) => set.push([name, value]),
    removeHeader: (name: string) => removed.push(name),
    getHeader: () => undefined,
  };
  let called = false;
  helmet(options)({} as IncomingMessage, recorder as unknown as ServerResponse, () => (called = true));
  if (!called) throw new Error('helmet did not finish synchronously: its headers cannot be precomputed');
  return { set, removed };
}

/**
 * helmet's headers as precomputed lists: helmet is run once against a recording response and its result is
 * replayed per request (helmet's own chain is about a dozen middleware calls per request). Two lists: a request
 * that came over https (`req.secure`: TLS here, or `X-Forwarded-Proto: https` from a proxy the app trusts, see
 * `trust proxy` in server/app.ts) gets the CSP's upgrade-insecure-requests, a plain-http one does not.
 */
export function securityHeaders(): RequestHandler {
  const plain = recordHelmet(helmetOptionsFor({ upgrade: false }));
  const secure = recordHelmet(helmetOptionsFor({ upgrade: true }));
  return (req, res, next) => {
    const { set, removed } = req.secure ? secure : plain;
    for (const [name, value] of set) res.setHeader(name, value);
    for (const name of removed) res.removeHeader(name);
    next();
  };
}

/** Files whose names carry a content hash (Expo's bundles and assets): cached for a year and never revalidated. */
export function isHashed(urlPath: string) {
  return urlPath.startsWith('/_expo/static/') || /\.[0-9a-f]{20,}\.[a-z0-9]+$/i.test(urlPath);
}

const types: Record<string, string> = {
  '.js': 'application/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.html': 'text/html; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.map': 'application/json; charset=utf-8',
  '.ttf': 'font/ttf',
  '.otf': 'font/otf',
  '.txt': 'text/plain; charset=utf-8',
  '.webmanifest': 'application/manifest+json; charset=utf-8',
};

/** Files a browser must ask about every time: the pages and the service worker (a new build's worker replaces
 *  the old one's precache, so it must never be held back by an HTTP cache). */
const alwaysRevalidated = (urlPath: string) => urlPath.endsWith('.html') || urlPath === '/sw.js';

/** The URL paths (from the web root) that have a precompressed twin, per encoding. */
function precompressed(webDir: string) {
  const found = { br: new Set<string>(), gzip: new Set<string>() };
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const p = join(dir, name);
      if (statSync(p).isDirectory()) walk(p);
      else if (name.endsWith('.br')) found.br.add(`/${relative(webDir, p.slice(0, -3)).split(sep).join('/')}`);
      else if (name.endsWith('.gz')) found.gzip.add(`/${relative(webDir, p.slice(0, -3)).split(sep).join('/')}`);
    }
  };
  walk(webDir);
  return found;
}

/**
 * The built web app: precompressed files when the client takes them (Brotli, else gzip), content-hashed files
 * cached for a year, index.html revalidated every time, everything else for an hour. Paths that are no file
 * fall through (the caller answers them with the app's HTML).
 */
export function webFiles(webDir: string): RequestHandler {
  const twins = precompressed(webDir);
  const files = express.static(webDir, {
    index: false,
    // The caching headers are set below, per file.
    cacheControl: false,
    setHeaders(res, path) {
      const urlPath = `/${relative(webDir, path).split(sep).join('/')}`.replace(/\.(br|gz)$/, '');
      res.setHeader('Cache-Control', alwaysRevalidated(urlPath) ? 'no-cache' : isHashed(urlPath) ? 'public, max-age=31536000, immutable' : 'public, max-age=3600');
    },
  });
  return (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const path = req.path;
    const accept = String(req.headers['accept-encoding'] ?? '');
    const encoding = twins.br.has(path) && /\bbr\b/.test(accept) ? 'br' : twins.gzip.has(path) && /\bgzip\b/.test(accept) ? 'gzip' : null;
    if (twins.br.has(path) || twins.gzip.has(path)) res.setHeader('Vary', 'Accept-Encoding');
    if (encoding) {
      res.setHeader('Content-Type', types[extname(path)] ?? 'application/octet-stream');
      res.setHeader('Content-Encoding', encoding);
      req.url = `${path}.${encoding === 'br' ? 'br' : 'gz'}${req.url.slice(path.length)}`;
    }
    files(req, res, next);
  };
}

type Preloads = { routes: { route: string; pattern: string; files: string[]; later?: string[]; page?: string }[] };
type Page = { html: string; br: Buffer; gzip: Buffer };
type PageCache = { stamp: string; routes: { re: RegExp; files: string[]; later: string[]; page: string | null }[]; html: string; pages: Map<number, Page> };

/**
 * The app's HTML for any path that is no file (a single-page app): index.html (the app shell), or for a route
 * rendered at build time its page (`dist/pages/…`, scripts/staticPages.mjs: the markup paints before any script
 * runs, and the app hydrates it), naming with `<link rel="preload">`
 * the script files that path's route needs before it can show (dist/route-preloads.json, written by
 * scripts/routePreloads.mjs), so the browser fetches them while it evaluates the first chunk instead of one after
 * another as the router asks; the larger ones (`later`) are named in a meta tag for entry.web.js to preload
 * once the first chunk has arrived, so they do not slow it down. Compressed once per route (Brotli, else gzip), revalidated every time. A path no
 * route matches (or a build without the list) gets index.html itself through `files`. Read again when the build
 * changes.
 */
export function appPage(webDir: string, files: RequestHandler): RequestHandler {
  const htmlPath = join(webDir, 'index.html');
  const preloadsPath = join(webDir, 'route-preloads.json');
  let cache: PageCache | null = null;
  const load = (): PageCache => {
    const stamp = [htmlPath, preloadsPath].map((p) => (existsSync(p) ? `${statSync(p).mtimeMs}:${statSync(p).size}` : '-')).join('|');
    if (cache?.stamp === stamp) return cache;
    const preloads: Preloads = existsSync(preloadsPath) ? JSON.parse(readFileSync(preloadsPath, 'utf8')) : { routes: [] };
    const html = readFileSync(htmlPath, 'utf8');
    const routes = preloads.routes.map((r) => {
      // A page named by the list but missing (a build cut short) falls back to the shell.
      const pagePath = r.page ? join(webDir, ...r.page.split('/').filter(Boolean)) : null;
      return { re: new RegExp(r.pattern), files: r.files, later: r.later ?? [], page: pagePath && existsSync(pagePath) ? readFileSync(pagePath, 'utf8') : null };
    });
    cache = { stamp, routes, html, pages: new Map() };
    return cache;
  };
  return (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const c = load();
    const i = c.routes.findIndex((r) => r.re.test(req.path));
    if (i < 0 || !(c.routes[i]!.page ?? c.html).includes('</body>')) {
      req.url = '/index.html';
      return files(req, res, next);
    }
    let page = c.pages.get(i);
    if (!page) {
      // After the build's own scripts (so the first chunk is asked for first), at low priority; the larger ones
      // (the route's chunk, the plan chunks) named for entry.web.js to preload once the first chunk has arrived.
      const r = c.routes[i]!;
      const links = r.files.map((f) => `<link rel="preload" href="${f}" as="script" fetchpriority="low">`).join('');
      const later = r.later.length ? `<meta name="falloff-later-scripts" content="${r.later.join(' ')}">` : '';
      // A page rendered at build time hydrates once its layouts and its screen's chunk have run (entry.web.js).
      const hydrate = r.page ? `<meta name="falloff-hydrate-scripts" content="${[...r.files, ...r.later.slice(0, 1)].join(' ')}">` : '';
      const html = (r.page ?? c.html).replace('</body>', `${links}${later}${hydrate}\n</body>`);
      page = { html, br: brotliCompressSync(html), gzip: gzipSync(html) };
      c.pages.set(i, page);
    }
    const accept = String(req.headers['accept-encoding'] ?? '');
    const encoding = /\bbr\b/.test(accept) ? 'br' : /\bgzip\b/.test(accept) ? 'gzip' : null;
    res.setHeader('Content-Type', 'text/html; charset=utf-8');
    res.setHeader('Cache-Control', 'no-cache');
    res.setHeader('Vary', 'Accept-Encoding');
    if (encoding) res.setHeader('Content-Encoding', encoding);
    res.send(encoding ? page[encoding] : page.html);
  };
}
