// A new version of the app while a page is open: the new build's service worker installs and waits; the page
// says "A new version is ready — Reload"; Reload sends what is waiting first, then the new worker takes over and
// the page reloads under it. The "new build" here is the served worker script with one byte more (the test puts
// the original back afterwards), which the browser treats as a new version like any other change.
import { readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { newOfflineSetup, signInAs } from '../support/offlineSetup';
import { sharedBrowser, shot, viewports, watchErrors } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const dist = resolve(__dirname, '../../dist');
const files = ['sw.js', 'sw.js.br', 'sw.js.gz'].map((f) => join(dist, f));
const originals = files.map((f) => readFileSync(f));
const restore = () => files.forEach((f, i) => writeFileSync(f, originals[i]!));
afterAll(restore);

/** Serve a worker that differs from the installed one (and its compressed twins with it). */
function publishNewWorker(mark: string) {
  const js = Buffer.concat([originals[0]!, Buffer.from(`\n// build ${mark}\n`)]);
  writeFileSync(files[0]!, js);
  writeFileSync(files[1]!, brotliCompressSync(js));
  writeFileSync(files[2]!, gzipSync(js));
}

const controllerUrl = (page: Page) => page.evaluate(() => navigator.serviceWorker.controller?.scriptURL ?? null);
const hasWaiting = (page: Page) => page.evaluate(() => navigator.serviceWorker.getRegistration().then((reg) => !!reg?.waiting));

describe('a new version', () => {
  it('waits until the person reloads, and reloads only once their changes are sent', async () => {
    const ctx = await browser().newContext({ viewport: viewports.phone, hasTouch: true });
    await signInAs(base, ctx, 'owner');
    const id = await newOfflineSetup(base, ctx, 'Mid-shoot update');

    const page = await ctx.newPage();
    const errors = watchErrors(page);
    const dialogs: string[] = [];
    page.on('dialog', (d) => {
      dialogs.push(d.type());
      void d.dismiss();
    });
    await page.goto(`${base}/setups/${id}`);
    await expect.poll(() => controllerUrl(page), { timeout: 60_000, interval: 500 }).toContain('/sw.js');
    await page.reload();
    await page.getByTestId('item-key').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('update-banner').count()).toBe(0);

    // A new build is published; the page asks for updates (as it does every half hour, and the browser on
    // navigations).
    publishNewWorker('two');
    try {
      await page.evaluate(() => navigator.serviceWorker.getRegistration().then((reg) => reg?.update()));
      await page.getByTestId('update-banner').waitFor({ timeout: 60_000 });
      expect(await page.getByTestId('update-banner').innerText()).toContain('A new version is ready');
      // It waits: the page is still under the old worker.
      expect(await hasWaiting(page)).toBe(true);
      await shot(page, 'offline-update-ready');

      // Without signal a change waits on the device: Reload says so and does not reload.
      await ctx.setOffline(true);
      const key = (await page.getByTestId('item-key').boundingBox())!;
      await page.mouse.click(key.x + key.width / 2, key.y + key.height / 2);
      await page.keyboard.press('ArrowRight');
      await expect.poll(() => page.getByTestId('save-state').innerText(), { timeout: 15_000 }).toBe('Offline — 1 change waiting');
      await page.getByTestId('update-reload').click();
      await expect.poll(() => page.getByTestId('update-banner').innerText(), { timeout: 15_000 }).toContain('1 change still waiting to be sent');
      await shot(page, 'offline-update-waiting');
      expect(await hasWaiting(page)).toBe(true);

      // The signal returns: the change is saved, and Reload now switches to the new version.
      await ctx.setOffline(false);
      await expect.poll(() => page.getByTestId('save-state').innerText(), { timeout: 30_000 }).toBe('Saved');
      const navigated = page.waitForEvent('framenavigated', { timeout: 60_000 });
      await page.getByTestId('update-reload').click();
      await navigated;
      await page.getByTestId('item-key').waitFor({ timeout: 30_000 });
      // Under the new worker: nothing waits any more, and the page is controlled.
      await expect.poll(() => hasWaiting(page), { timeout: 30_000, interval: 500 }).toBe(false);
      await expect.poll(() => controllerUrl(page), { timeout: 30_000, interval: 500 }).toContain('/sw.js');
      expect(await page.getByTestId('update-banner').count()).toBe(0);
      expect(dialogs).toEqual([]); // nothing was left to warn about
    } finally {
      restore();
    }
    expect(errors).toEqual([]);
    await ctx.close();
  });
});
