// Changes waiting on the device that the server refuses for a while (503: busy or restarting) are not shown as
// "sending" for ever: the banner says they are not sent and why, and the queue tries again by itself until the
// server takes them. Run without the service worker, so Playwright's routing can stand in for the busy server
// (requests under a service worker do not reach a route reliably); the queue entry is written to the device's
// store as the editor writes it without signal.
import type { Route } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { sharedBrowser, shot, viewports, watchErrors } from '../support/browser';
import { newOfflineSetup, signInAs, storedKeyReader } from '../support/offlineSetup';

const base = inject('baseUrl');
const browser = sharedBrowser();
const storedKeyX = storedKeyReader();

describe('changes waiting while the server is busy', () => {
  it('says they are not sent and why, then sends them on its own once the server answers', async () => {
    const ctx = await browser().newContext({ viewport: viewports.phone, hasTouch: true, serviceWorkers: 'block' });
    await signInAs(base, ctx, 'owner');
    const id = await newOfflineSetup(base, ctx, 'Loading dock, server restarting');
    const me = (await (await ctx.request.get(`${base}/api/me`)).json()) as { user: { id: string } };
    const setup = (await (await ctx.request.get(`${base}/api/setups/${id}`)).json()) as { version: number; document: { items: { id: string; x: number }[] } };
    const moved = { ...setup.document, items: setup.document.items.map((i) => (i.id === 'key' ? { ...i, x: 3.2 } : i)) };

    const page = await ctx.newPage();
    const errors = watchErrors(page);
    await page.goto(`${base}/setups`);
    await page.getByLabel('Search setups').waitFor({ timeout: 30_000 });
    // The app has made its store on the device; put two edits in it as the editor does without signal.
    const hasStore = () => page.evaluate(() => new Promise<boolean>((resolve) => {
      const open = indexedDB.open('falloff-offline');
      open.onsuccess = () => {
        resolve(open.result.objectStoreNames.contains('queue'));
        open.result.close();
      };
      open.onerror = () => resolve(false);
    }));
    await expect.poll(hasStore, { timeout: 30_000 }).toBe(true);
    const entry = { owner: me.user.id, setupId: id, baseVersion: setup.version, changes: { document: moved }, count: 2, at: new Date().toISOString() };
    await page.evaluate((e) => new Promise<void>((resolve, reject) => {
      const open = indexedDB.open('falloff-offline');
      open.onsuccess = () => {
        const tx = open.result.transaction('queue', 'readwrite');
        tx.objectStore('queue').put(e);
        tx.oncomplete = () => {
          open.result.close();
          resolve();
        };
        tx.onerror = () => reject(tx.error);
      };
    }), entry);

    // The server refuses every save for now.
    const refuseSaves = (route: Route) =>
      route.request().method() === 'GET'
        ? route.fallback()
        : route.fulfill({ status: 503, contentType: 'application/json', headers: { 'retry-after': '2' }, body: JSON.stringify({ error: { code: 'database_unavailable', message: 'the database is not answering' } }) });
    await ctx.route(`**/api/setups/${id}`, refuseSaves);
    await page.reload();
    await expect.poll(() => page.getByTestId('offline-banner').innerText().catch(() => ''), { timeout: 30_000 }).toMatch(/2 changes not sent yet: the server is busy or restarting/);
    expect(await page.getByTestId('offline-banner').getByRole('button', { name: 'Try now' }).isVisible()).toBe(true);
    await shot(page, 'offline-phone-not-sent');
    expect(await storedKeyX(id)).toBe(3);

    // The server answers again: the next try sends them, with no reload and no new connection event.
    await ctx.unroute(`**/api/setups/${id}`, refuseSaves);
    await expect.poll(() => storedKeyX(id), { timeout: 60_000, interval: 500 }).toBeCloseTo(3.2);
    await expect.poll(() => page.getByTestId('offline-banner').count(), { timeout: 15_000 }).toBe(0);
    expect(errors.filter((e) => !/503/.test(e))).toEqual([]);
    await ctx.close();
  });
});
