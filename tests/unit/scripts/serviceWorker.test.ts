// The service worker made at web build time (scripts/buildServiceWorker.mjs) on a small stand-in build: it
// precaches the shell, chunks and fonts (not the compressed twins or maps), links the manifest from the page,
// and a changed file is a changed worker with a new revision for that file (so no old JS survives a new build).
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { buildServiceWorker } from '../../../scripts/buildServiceWorker.mjs';

const root = join(__dirname, '..', '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'falloff-sw-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function standInBuild(entry: string) {
  mkdirSync(join(dir, '_expo/static/js/web'), { recursive: true });
  mkdirSync(join(dir, 'assets/fonts'), { recursive: true });
  writeFileSync(join(dir, 'index.html'), `<!doctype html><html><head><title>Falloff</title></head><body><script src="/_expo/static/js/web/${entry}"></script></body></html>`);
  writeFileSync(join(dir, '_expo/static/js/web', entry), `console.log(${JSON.stringify(entry)});`);
  writeFileSync(join(dir, 'assets/fonts/Plex.ttf'), 'font bytes');
  writeFileSync(join(dir, 'index.html.br'), 'compressed twin');
  writeFileSync(join(dir, 'old.js.map'), '{}');
}
const precached = (sw: string) => new Map([...sw.matchAll(/\{"revision":("[0-9a-f]+"|null),"url":"([^"]+)"\}/g)].map((m) => [m[2]!, m[1]!]));

describe('the service worker build', () => {
  it('precaches the build with revisions and links the manifest; a new build is a new worker', async () => {
    standInBuild('entry-1111.js');
    const first = await buildServiceWorker({ root, webDir: dir });
    const sw1 = readFileSync(join(dir, 'sw.js'), 'utf8');
    const list1 = precached(sw1);
    expect([...list1.keys()].sort()).toEqual(['_expo/static/js/web/entry-1111.js', 'assets/fonts/Plex.ttf', 'icon-192.png', 'icon-512.png', 'icon.svg', 'index.html', 'manifest.webmanifest']);
    expect(first.count).toBe(7);
    expect(readFileSync(join(dir, 'index.html'), 'utf8')).toContain('<link rel="manifest" href="/manifest.webmanifest">');
    expect(JSON.parse(readFileSync(join(dir, 'manifest.webmanifest'), 'utf8')).display).toBe('standalone');

    // The next build names another chunk: the old one is gone from the list and the page's revision changed.
    rmSync(join(dir, '_expo/static/js/web/entry-1111.js'));
    standInBuild('entry-2222.js');
    await buildServiceWorker({ root, webDir: dir });
    const sw2 = readFileSync(join(dir, 'sw.js'), 'utf8');
    const list2 = precached(sw2);
    expect(list2.has('_expo/static/js/web/entry-1111.js')).toBe(false);
    expect(list2.has('_expo/static/js/web/entry-2222.js')).toBe(true);
    expect(list2.get('index.html')).not.toBe(list1.get('index.html'));
    expect(sw2).not.toBe(sw1);
  }, 60_000);
});
