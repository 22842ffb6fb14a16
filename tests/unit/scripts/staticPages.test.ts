// scripts/staticPages.mjs: from a static export's HTML, the app shell (empty root, the shared scripts only) and
// the pages kept rendered at build time (their markup and style sheet in the shell, marked for hydration).
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { rootMarkup, staticPages } from '../../../scripts/staticPages.mjs';

const dir = mkdtempSync(join(tmpdir(), 'falloff-static-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const js = (name: string) => `/_expo/static/js/web/${name}-0123456789abcdef0123456789abcdef.js`;
/** An exported page as Expo writes one: its markup, react-native-web's style sheet, the hydration flag, its scripts. */
const exported = (markup: string, css: string, route: string) =>
  `<!DOCTYPE html><html  lang="en"><head><title data-rh="true"></title><meta charSet="utf-8"/><style id="expo-reset">#root{display:flex}</style>` +
  `<style id="react-native-stylesheet">${css}</style><script type="module">globalThis.__EXPO_ROUTER_HYDRATE__=true;</script></head>` +
  `<body><div id="root">${markup}</div>` +
  [js('__expo-metro-runtime'), js('_layout'), js(route), js('__common'), js('entry')].map((s) => `<script src="${s}" defer></script>`).join('') +
  '\n</body></html>';

function write(rel: string, text: string) {
  mkdirSync(dirname(join(dir, rel)), { recursive: true });
  writeFileSync(join(dir, rel), text);
}

describe('rootMarkup', () => {
  it('finds the root element’s own markup, nested divs and all', () => {
    const html = '<body><div id="root"><div a><div b></div><p>x</p></div><div c></div></div><script src="s"></script></body>';
    expect(rootMarkup(html).inner).toBe('<div a><div b></div><p>x</p></div><div c></div>');
    expect(() => rootMarkup('<body><div id="root"><div></body>')).toThrow(/not closed/);
  });
});

describe('staticPages', () => {
  it('writes the app shell and the kept pages, and drops the rest of the export’s HTML', () => {
    write('index.html', exported('<div class="spin">loading</div>', '.spin{}', 'index'));
    write('(auth)/sign-in.html', exported('<div class="form"><div>E-mail</div><input type="email"/></div>', '.form{}', 'sign-in'));
    write('sign-in.html', exported('<div>twin</div>', '', 'sign-in'));
    write('s/[token].html', exported('<div data-testid="shared-shell">Opening the shared setup…</div>', '.shell{}', '[token]'));
    write('(app)/setups/[id].html', exported('<div>spinner</div>', '', '[id]'));
    write('_sitemap.html', exported('<div>map</div>', '', '_sitemap'));
    write('_expo/static/js/web/entry-0123456789abcdef0123456789abcdef.js', '/* entry */');
    expect(staticPages({ webDir: dir, routes: ['(auth)/sign-in', 's/[token]'] })).toEqual({ '(auth)/sign-in': '/pages/(auth)/sign-in.html', 's/[token]': '/pages/s/[token].html' });

    const shell = readFileSync(join(dir, 'index.html'), 'utf8');
    expect(rootMarkup(shell).inner).toBe('');
    expect(shell).not.toContain('react-native-stylesheet');
    expect(shell).not.toContain('__EXPO_ROUTER_HYDRATE__');
    expect(shell).not.toContain('falloff-prerendered');
    expect([...shell.matchAll(/<script src="([^"]+)"/g)].map((m) => m[1])).toEqual([js('__expo-metro-runtime'), js('__common'), js('entry')]);
    expect(shell).toContain('<title data-rh="true">Falloff</title>');
    expect(shell).toContain('<noscript>');

    const signIn = readFileSync(join(dir, 'pages', '(auth)', 'sign-in.html'), 'utf8');
    expect(rootMarkup(signIn).inner).toBe('<div class="form"><div>E-mail</div><input type="email"/></div>');
    expect(signIn).toContain('<meta name="falloff-prerendered" content="(auth)/sign-in"><style id="react-native-stylesheet">.form{}</style></head>');
    // The same scripts as the shell: the route's own are named by the server (server/web.ts, appPage).
    expect(signIn.replace(/<meta name="falloff-prerendered"[^>]*>|<style id="react-native-stylesheet">[^<]*<\/style>/g, '').replace(rootMarkup(signIn).inner, '')).toBe(shell);
    expect(readFileSync(join(dir, 'pages', 's', '[token].html'), 'utf8')).toContain('Opening the shared setup…');

    // Every other page of the export is gone, with the folders it leaves empty; scripts stay.
    expect(existsSync(join(dir, 'sign-in.html'))).toBe(false);
    expect(existsSync(join(dir, '_sitemap.html'))).toBe(false);
    expect(existsSync(join(dir, '(app)'))).toBe(false);
    expect(existsSync(join(dir, '(auth)'))).toBe(false);
    expect(existsSync(join(dir, 's'))).toBe(false);
    expect(existsSync(join(dir, '_expo/static/js/web/entry-0123456789abcdef0123456789abcdef.js'))).toBe(true);
  });

  it('says which route the export did not render', () => {
    const other = mkdtempSync(join(tmpdir(), 'falloff-static-'));
    try {
      writeFileSync(join(other, 'index.html'), exported('<div></div>', '', 'index'));
      expect(() => staticPages({ webDir: other, routes: ['(auth)/welcome'] })).toThrow(/no page for \(auth\)\/welcome/);
    } finally {
      rmSync(other, { recursive: true, force: true });
    }
  });
});
