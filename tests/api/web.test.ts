// Serving for production (server/web.ts, server/app.ts): the web app's files compressed at build time and cached
// by content hash, security headers precomputed, API answers compressed only above a threshold.
import express from 'express';
import helmet from 'helmet';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, get, type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { precompressDir } from '../../scripts/precompress.mjs';
import { COMPRESS_MIN_BYTES } from '../../server/app';
import { startServer } from '../../server/main';
import { helmetOptions, isHashed } from '../../server/web';
import { TEST_DATABASE_URL } from '../support/env';
import { Client, freshEmail } from '../support/http';
import { documentWith } from './documents';

/** A GET that hands back the bytes as sent (fetch would decode them). */
function raw(url: string, headers: Record<string, string> = {}): Promise<{ status: number; headers: IncomingHttpHeaders; body: Buffer }> {
  return new Promise((resolve, reject) => {
    get(url, { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (d: Buffer) => chunks.push(d));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    }).on('error', reject);
  });
}

const webDir = mkdtempSync(join(tmpdir(), 'falloff-web-'));
const bundlePath = '/_expo/static/js/web/entry-0123456789abcdef0123456789abcdef.js';
const bundle = `console.log(${JSON.stringify('plan '.repeat(2000))});`;
const html = `<!doctype html><html><head><title>Falloff</title></head><body>${'<!-- shell -->'.repeat(100)}<script src="${bundlePath}"></script></body></html>`;
let app: Awaited<ReturnType<typeof startServer>>;

beforeAll(async () => {
  mkdirSync(join(webDir, '_expo/static/js/web'), { recursive: true });
  writeFileSync(join(webDir, bundlePath), bundle);
  writeFileSync(join(webDir, 'index.html'), html);
  writeFileSync(join(webDir, 'metadata.json'), JSON.stringify({ note: 'x'.repeat(2000) }));
  await precompressDir(webDir);
  app = await startServer({ databaseUrl: TEST_DATABASE_URL, port: 0, logLevel: 'silent', webDir });
});

afterAll(async () => {
  await app?.close();
  rmSync(webDir, { recursive: true, force: true });
});

describe('the web app files', () => {
  it('sends the Brotli twin of a hashed bundle, cached for a year', async () => {
    const r = await raw(`${app.url}${bundlePath}`, { 'accept-encoding': 'gzip, deflate, br' });
    expect(r.status).toBe(200);
    expect(r.headers['content-encoding']).toBe('br');
    expect(r.headers['content-type']).toMatch(/javascript/);
    expect(r.headers.vary).toMatch(/Accept-Encoding/i);
    expect(r.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(brotliDecompressSync(r.body).toString()).toBe(bundle);
    expect(r.body.length).toBeLessThan(bundle.length / 5);
  });

  it('falls back to the gzip twin, then to the file as it is', async () => {
    const gz = await raw(`${app.url}${bundlePath}`, { 'accept-encoding': 'gzip' });
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.body).toString()).toBe(bundle);
    const plain = await raw(`${app.url}${bundlePath}`);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString()).toBe(bundle);
    expect(plain.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('answers app paths with the HTML, compressed and revalidated every time', async () => {
    for (const path of ['/', '/setups/some-id', '/s/some-token']) {
      const r = await raw(`${app.url}${path}`, { 'accept-encoding': 'br' });
      expect(r.status, path).toBe(200);
      expect(r.headers['content-type'], path).toMatch(/text\/html/);
      expect(r.headers['cache-control'], path).toBe('no-cache');
      expect(r.headers['content-encoding'], path).toBe('br');
      expect(brotliDecompressSync(r.body).toString(), path).toBe(html);
    }
  });

  it('names the scripts a route needs in the HTML of the paths it matches (route-preloads.json)', async () => {
    const routeChunk = '/_expo/static/js/web/[token]-00112233445566778899aabbccddeeff.js';
    const planChunk = '/_expo/static/js/web/shareScreen-00112233445566778899aabbccddeeff.js';
    writeFileSync(join(webDir, 'route-preloads.json'), JSON.stringify({ routes: [{ route: 's/[token].tsx', pattern: '^/s/[^/]+/?$', files: [routeChunk, bundlePath], later: [planChunk] }] }));
    try {
      for (const [encoding, decode] of [['br', brotliDecompressSync], ['gzip', gunzipSync]] as const) {
        const r = await raw(`${app.url}/s/some-token`, { 'accept-encoding': encoding });
        expect(r.status).toBe(200);
        expect(r.headers['content-type']).toMatch(/text\/html/);
        expect(r.headers['cache-control']).toBe('no-cache');
        expect(r.headers['content-encoding']).toBe(encoding);
        const page = decode(r.body).toString();
        expect(page).toContain(`<link rel="preload" href="${routeChunk}" as="script" fetchpriority="low"><link rel="preload" href="${bundlePath}" as="script" fetchpriority="low">`);
        // The large ones are named for the first chunk to ask for (entry.web.js), not preloaded by the HTML.
        expect(page).toContain(`<meta name="falloff-later-scripts" content="${planChunk}">`);
        expect(page).not.toContain(`<link rel="preload" href="${planChunk}"`);
        // After the page's own scripts: the first chunk is asked for first.
        expect(page.indexOf(routeChunk)).toBeGreaterThan(page.indexOf(`<script src="${bundlePath}">`));
        expect(page.replace(/<link rel="preload"[^>]*>|<meta name="falloff-later-scripts"[^>]*>/g, '').replace('\n</body>', '</body>')).toBe(html);
      }
      // A path the list has no route for: the HTML as built.
      const other = await raw(`${app.url}/setups/some-id`, { 'accept-encoding': 'br' });
      expect(brotliDecompressSync(other.body).toString()).toBe(html);
    } finally {
      rmSync(join(webDir, 'route-preloads.json'));
    }
    // Read again when the build changes: without the list, every path has the HTML as built.
    expect(brotliDecompressSync((await raw(`${app.url}/s/some-token`, { 'accept-encoding': 'br' })).body).toString()).toBe(html);
  });

  it('sends a route rendered at build time its own page, naming the scripts it hydrates with', async () => {
    const layout = '/_expo/static/js/web/_layout-00112233445566778899aabbccddeeff.js';
    const routeChunk = '/_expo/static/js/web/sign-in-00112233445566778899aabbccddeeff.js';
    const built = `<!doctype html><html><head><meta name="falloff-prerendered" content="(auth)/sign-in"></head><body><div id="root"><h1>Sign in</h1></div><script src="${bundlePath}"></script></body></html>`;
    mkdirSync(join(webDir, 'pages', '(auth)'), { recursive: true });
    writeFileSync(join(webDir, 'pages', '(auth)', 'sign-in.html'), built);
    const routes = [
      { route: '(auth)/sign-in.tsx', pattern: '^/sign-in/?$', files: [layout], later: [routeChunk], page: '/pages/(auth)/sign-in.html' },
      // A page the list names but the build lacks: the app shell.
      { route: '(auth)/sign-up.tsx', pattern: '^/sign-up/?$', files: [layout], later: [routeChunk], page: '/pages/(auth)/sign-up.html' },
    ];
    writeFileSync(join(webDir, 'route-preloads.json'), JSON.stringify({ routes }));
    try {
      const page = brotliDecompressSync((await raw(`${app.url}/sign-in?next=/setups`, { 'accept-encoding': 'br' })).body).toString();
      expect(page).toContain('<div id="root"><h1>Sign in</h1></div>');
      expect(page).toContain(`<meta name="falloff-hydrate-scripts" content="${layout} ${routeChunk}">`);
      expect(page).toContain(`<link rel="preload" href="${layout}" as="script" fetchpriority="low">`);
      const shell = brotliDecompressSync((await raw(`${app.url}/sign-up`, { 'accept-encoding': 'br' })).body).toString();
      expect(shell).not.toContain('<h1>Sign in</h1>');
      expect(shell).not.toContain('falloff-hydrate-scripts');
      expect(shell.replace(/<link rel="preload"[^>]*>|<meta name="falloff-later-scripts"[^>]*>/g, '').replace('\n</body>', '</body>')).toBe(html);
    } finally {
      rmSync(join(webDir, 'route-preloads.json'));
      rmSync(join(webDir, 'pages'), { recursive: true });
    }
  });

  it('caches files without a content hash for an hour only', async () => {
    const r = await raw(`${app.url}/metadata.json`);
    expect(r.headers['cache-control']).toBe('public, max-age=3600');
    expect(isHashed('/metadata.json')).toBe(false);
    expect(isHashed('/assets/fonts/Plex.f7c4c8c20e7d7fc722d9b99ff968f80c.ttf')).toBe(true);
  });
});

describe('security headers', () => {
  it('are the ones helmet sets per request', async () => {
    const bare = express();
    bare.use(helmet(helmetOptions));
    bare.get('/x', (_req, res) => res.json({}));
    const s = createServer(bare);
    await new Promise<void>((r) => s.listen(0, '127.0.0.1', r));
    const fromHelmet = await raw(`http://127.0.0.1:${(s.address() as AddressInfo).port}/x`);
    s.close();
    const ours = await raw(`${app.url}/api/health`);
    const names = Object.keys(fromHelmet.headers).filter((h) => !['date', 'connection', 'keep-alive', 'content-length', 'content-type', 'etag'].includes(h));
    expect(names.length).toBeGreaterThan(8);
    for (const h of names) expect(ours.headers[h], h).toBe(fromHelmet.headers[h]);
    expect(ours.headers['x-powered-by']).toBeUndefined();
  });
});

describe('API compression', () => {
  it(`leaves answers under ${COMPRESS_MIN_BYTES} bytes alone and compresses larger ones`, async () => {
    const small = await raw(`${app.url}/api/health`, { 'accept-encoding': 'gzip' });
    expect(small.body.length).toBeLessThan(COMPRESS_MIN_BYTES);
    expect(small.headers['content-encoding']).toBeUndefined();

    const c = await new Client(app.url).signUp('Web Test', freshEmail('web'), 'web-password-1');
    const made = await c.post('/api/setups', { title: 'Big enough', document: documentWith(60, 60) });
    expect(made.status).toBe(201);
    const cookie = cookieOf(c);
    const big = await raw(`${app.url}/api/setups/${made.body.id}`, { 'accept-encoding': 'gzip', cookie });
    expect(big.status).toBe(200);
    expect(big.headers['content-encoding']).toBe('gzip');
    const json = JSON.parse(gunzipSync(big.body).toString());
    expect(Buffer.byteLength(JSON.stringify(json))).toBeGreaterThan(COMPRESS_MIN_BYTES);
    expect(json.id).toBe(made.body.id);
  });
});

function cookieOf(c: Client) {
  const jar = (c as unknown as { cookies: Map<string, string> }).cookies;
  return [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
}
