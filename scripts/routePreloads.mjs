// Which script files each page of the built web app needs before it can show, so the server can name them in
// the page's HTML (`<link rel="preload">`, server/web.ts) and the browser fetches them while it evaluates the
// first chunk, rather than one after another as the router asks for them (a round trip and a download each,
// with the network idle while the phone's CPU works).
//
// From the build's source maps (dist-maps/): each route's chunk (the one source under app/ is the route file), every
// layout's chunk (the router fetches every group's layout on every page), and the plan screens' lazily loaded
// chunks for the routes that use them: `sharedSetupScreen(` in the route file needs components/shareScreen.ts,
// `workspaceScreen(` needs it and components/workspace.ts (DEVELOPERS.md, "First load on the web").
// Writes dist/route-preloads.json: { routes: [{ route, pattern, files, later, page? }] }, most specific pattern first:
// `files` (small: the layouts) for the HTML itself, `later` (the route's chunk and the plan chunks: tens to
// a hundred and more KB) for the first chunk to ask for once it has arrived (entry.web.js), so they do not
// share the network with it (the library's 58 KB chunk preloaded by the HTML put its first paint ~0.5 s later);
// `page`, for a route rendered at build time (scripts/staticPages.mjs), the HTML to send instead of index.html.
import { existsSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const JS_DIR = ['_expo', 'static', 'js', 'web'];
const LAZY = { shareScreen: 'components/shareScreen.ts', workspace: 'components/workspace.ts' };

/** A route file (relative to app/, e.g. "(app)/setups/[id].tsx") as a RegExp source over URL paths, or null. */
export function routePattern(file) {
  const parts = file
    .replace(/\.[jt]sx?$/, '')
    .split('/')
    .filter((p) => !/^\(.+\)$/.test(p));
  const last = parts[parts.length - 1];
  if (last === '_layout' || last.startsWith('+')) return null;
  if (last === 'index') parts.pop();
  const segs = parts.map((p) => (/^\[\.\.\..+\]$/.test(p) ? '.+' : /^\[.+\]$/.test(p) ? '[^/]+' : p.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')));
  return `^/${segs.join('/')}${segs.length ? '/?' : ''}$`;
}

/** How many dynamic segments a pattern has (fewer first: /studios/join/x before /studios/x). */
const dynamics = (pattern) => (pattern.match(/\[\^\/\]\+|\.\+/g) ?? []).length;

export function routePreloads({ root, webDir, mapsDir }) {
  const jsDir = join(webDir, ...JS_DIR);
  const url = (name) => `/${[...JS_DIR, name].join('/')}`;
  const chunks = [];
  for (const name of readdirSync(jsDir)) {
    if (!name.endsWith('.js')) continue;
    const map = join(mapsDir, `${name}.map`);
    if (!existsSync(map)) continue;
    const sources = JSON.parse(readFileSync(map, 'utf8')).sources.map((s) => s.replace(/^\/+/, ''));
    // A route's (or layout's) chunk holds its file under app/ and no other; where in the chunk depends on the
    // export's output mode (first in a single-page export, after the modules it imports in a static one).
    chunks.push({ name, app: sources.find((s) => s.startsWith('app/')) ?? '', sources: new Set(sources) });
  }
  const layouts = chunks.filter((c) => /^app\/(.*\/)?_layout\.[jt]sx?$/.test(c.app)).map((c) => url(c.name));
  const lazy = {};
  for (const [key, source] of Object.entries(LAZY)) {
    const c = chunks.find((x) => x.name.startsWith(`${key}-`) && x.sources.has(source));
    if (!c) throw new Error(`route preloads: no chunk holds ${source} (is it still loaded lazily?)`);
    lazy[key] = url(c.name);
  }
  const routes = [];
  for (const c of chunks) {
    if (!c.app) continue;
    const file = c.app.slice('app/'.length);
    const pattern = routePattern(file);
    if (!pattern) continue;
    const text = readFileSync(join(root, c.app), 'utf8');
    const needs = /\bworkspaceScreen\(/.test(text) ? [lazy.shareScreen, lazy.workspace] : /\bsharedSetupScreen\(/.test(text) ? [lazy.shareScreen] : [];
    // The route's build-time render (scripts/staticPages.mjs), when it has one.
    const page = `pages/${file.replace(/\.[jt]sx?$/, '')}.html`;
    routes.push({ route: file, pattern, files: layouts, later: [url(c.name), ...needs], ...(existsSync(join(webDir, page)) ? { page: `/${page}` } : {}) });
  }
  routes.sort((a, b) => dynamics(a.pattern) - dynamics(b.pattern) || b.pattern.length - a.pattern.length);
  writeFileSync(join(webDir, 'route-preloads.json'), `${JSON.stringify({ routes }, null, 2)}\n`);
  return { routes: routes.length };
}

