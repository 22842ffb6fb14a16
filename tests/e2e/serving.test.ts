// The built web app as a browser gets it: one origin, gzip, any app path answered by the app.
import { describe, expect, inject, it } from 'vitest';

const base = inject('baseUrl');

describe('serving the web app', () => {
  it('answers every app path with the app, and sends the bundle gzipped', async () => {
    for (const path of ['/', '/setups', '/setups/some-id', '/s/some-token']) {
      const r = await fetch(`${base}${path}`);
      expect(r.status, path).toBe(200);
      expect(r.headers.get('content-type')).toMatch(/text\/html/);
    }
    const html = await (await fetch(`${base}/`)).text();
    const src = /<script src="([^"]+\.js)"/.exec(html)?.[1];
    expect(src).toBeTruthy();
    const js = await fetch(`${base}${src}`, { headers: { 'accept-encoding': 'gzip' } });
    expect(js.status).toBe(200);
    expect(js.headers.get('content-encoding')).toBe('gzip');
  });

  it('keeps API misses as JSON, not the app page', async () => {
    const r = await fetch(`${base}/api/nothing-here`);
    expect(r.headers.get('content-type')).toMatch(/application\/json/);
  });
});
