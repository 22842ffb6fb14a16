// The pages whose HTML paints before any JavaScript has run (DEVELOPERS.md, "First load on the web").
//
// `expo export` with `web.output: "static"` (app.json) renders every route at build time into an HTML file of its
// own. We keep that markup only for the pages where it helps and where the first render depends on nothing the
// build cannot know (no session, no window size, no query string): the signed-out forms and the read-only link's
// shell. Every other path gets the app shell, `index.html`, with an empty root that the page renders into.
//
// From the export this writes:
// - `dist/index.html`: the app shell, from the export's page for "/" with its markup, its style sheet and its
//   route's scripts taken out (the scripts every page runs stay: the runtime, `__common`, the entry). The
//   service worker answers navigations from it when there is no network, and the server sends it for every path
//   with no page below.
// - `dist/pages/<route>.html` for each route in PRERENDERED: the shell with that route's rendered markup in the
//   root, react-native-web's style sheet for it in the head, and `<meta name="falloff-prerendered">`, which tells
//   entry.web.js to hydrate the markup rather than render over it.
// Every other HTML file the export wrote (one per route, each group's routes twice, a sitemap) is removed.
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, relative, sep } from 'node:path';

/**
 * Route files (under app/, without extension) whose build-time render is served. Each must render the same on
 * the client's first pass as at build time: nothing read from the session, the window or the address before
 * the page has hydrated (hooks/hydration.ts); `tests/e2e/staticPages.test.ts` compares each hydrated page
 * with the same page drawn without its HTML. Not reset-password: its first render depends on the link's token.
 */
export const PRERENDERED = ['(auth)/sign-in', '(auth)/sign-up', '(auth)/forgot-password', 's/[token]'];

/** The meta tag that marks a page whose root holds the build's markup. */
export const PRERENDERED_META = 'falloff-prerendered';

/** The scripts every page runs (the rest of an exported page's scripts are its route's, which the server names). */
const SHARED_SCRIPT = /^\/_expo\/static\/js\/web\/(__expo-metro-runtime|__common|entry)-[0-9a-f]+\.js$/;

const ROOT_OPEN = '<div id="root">';

/** The inner markup of the page's root element (the export writes it as the body's first element, followed by
 *  its scripts). */
export function rootMarkup(html) {
  const start = html.indexOf(ROOT_OPEN);
  if (start < 0) throw new Error('static pages: an exported page has no <div id="root">');
  const from = start + ROOT_OPEN.length;
  // The root is closed by the `</div>` that brings the nesting back to zero.
  const tag = /<(\/?)div\b[^>]*?(\/?)>/g;
  tag.lastIndex = from;
  let depth = 1;
  for (let m = tag.exec(html); m; m = tag.exec(html)) {
    if (m[2]) continue; // <div/> (not written by React, but harmless)
    depth += m[1] ? -1 : 1;
    if (depth === 0) return { inner: html.slice(from, m.index), start, end: m.index + m[0].length };
  }
  throw new Error('static pages: the root element of an exported page is not closed');
}

const STYLE_RE = /<style id="react-native-stylesheet">[\s\S]*?<\/style>/;
const HYDRATE_RE = /<script type="module">globalThis\.__EXPO_ROUTER_HYDRATE__=true;<\/script>/;
const SCRIPT_RE = /<script src="([^"]+)" defer><\/script>/g;

/** The app shell from an exported page: no markup in the root, no style sheet of its own, only the shared
 *  scripts, and the app's title. */
export function shellFrom(html) {
  const { start, end } = rootMarkup(html);
  let out = `${html.slice(0, start)}${ROOT_OPEN}</div>${html.slice(end)}`;
  out = out.replace(STYLE_RE, '').replace(HYDRATE_RE, '');
  out = out.replace(SCRIPT_RE, (tag, src) => (SHARED_SCRIPT.test(src) ? tag : ''));
  out = out.replace(/<title[^>]*><\/title>/, '<title data-rh="true">Falloff</title>');
  const kept = [...out.matchAll(SCRIPT_RE)].map((m) => m[1]);
  if (kept.length !== 3) throw new Error(`static pages: expected the runtime, __common and the entry in the exported page, found ${kept.join(', ') || 'none'}`);
  // For a browser with scripts off: a line saying why the page is blank (or, on a rendered page, inert).
  out = out.replace(ROOT_OPEN, `<noscript><p style="position:fixed;bottom:0;left:0;right:0;margin:0;z-index:1;color:#e9e6df;background:#1d2024;font-family:sans-serif;padding:12px 16px">Falloff needs JavaScript turned on.</p></noscript>${ROOT_OPEN}`);
  return out;
}

/** The shell with a route's build-time render: its markup in the root and its style sheet in the head. */
export function pageFrom(shell, exported, route) {
  const style = exported.match(STYLE_RE);
  if (!style) throw new Error(`static pages: the exported page for ${route} has no react-native-web style sheet`);
  const { inner } = rootMarkup(exported);
  const meta = `<meta name="${PRERENDERED_META}" content="${route}">`;
  return shell.replace('</head>', `${meta}${style[0]}</head>`).replace(`${ROOT_OPEN}</div>`, `${ROOT_OPEN}${inner}</div>`);
}

/** Every HTML file under `dir` (not in the bundles' and assets' folders). After staticPages: the app shell and the
 *  pages rendered at build time; the fonts and the service worker's head tags go into each. */
export function htmlFiles(dir) {
  const out = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) {
      if (name !== '_expo' && name !== 'assets') out.push(...htmlFiles(p));
    } else if (name.endsWith('.html')) out.push(p);
  }
  return out;
}

/** Rewrites the export's HTML in `webDir` as described above. Returns the pages written, by route. */
export function staticPages({ webDir, routes = PRERENDERED }) {
  const exported = join(webDir, 'index.html');
  if (!existsSync(exported)) throw new Error('static pages: the export wrote no index.html');
  const shell = shellFrom(readFileSync(exported, 'utf8'));
  const pages = {};
  const rendered = new Map();
  for (const route of routes) {
    const file = join(webDir, `${route}.html`);
    if (!existsSync(file)) throw new Error(`static pages: the export wrote no page for ${route} (is app/${route}.tsx still a route?)`);
    rendered.set(route, readFileSync(file, 'utf8'));
  }
  for (const f of htmlFiles(webDir)) {
    rmSync(f);
    // and the folders left empty (one per route group and path segment)
    for (let d = dirname(f); d !== webDir && readdirSync(d).length === 0; d = dirname(d)) rmSync(d, { recursive: true });
  }
  writeFileSync(exported, shell);
  for (const [route, html] of rendered) {
    const out = join(webDir, 'pages', `${route}.html`);
    mkdirSync(dirname(out), { recursive: true });
    writeFileSync(out, pageFrom(shell, html, route));
    pages[route] = `/${relative(webDir, out).split(sep).join('/')}`;
  }
  return pages;
}
