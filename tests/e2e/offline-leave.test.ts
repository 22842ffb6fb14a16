// Edits that have not reached the server, and the ways a person leaves them: the browser's own Back (a history
// pop the router would otherwise act on unasked) warns first; signing out with changes queued on the device
// warns, keeps them under their owner, another person signing in on the device neither sends nor drops them,
// and they go out once their owner signs in again.
import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { sharedBrowser, shot, viewports, watchErrors } from '../support/browser';
import { newOfflineSetup, signInAs, storedKeyReader } from '../support/offlineSetup';

const base = inject('baseUrl');
const browser = sharedBrowser();
const storedKeyX = storedKeyReader();
const signIn = (ctx: BrowserContext, who: Parameters<typeof signInAs>[2]) => signInAs(base, ctx, who);
const newSetup = (ctx: BrowserContext, title: string) => newOfflineSetup(base, ctx, title);

const saveState = (page: Page) => page.getByTestId('save-state').innerText();

async function nudgeKey(page: Page) {
  const key = (await page.getByTestId('item-key').boundingBox())!;
  await page.mouse.click(key.x + key.width / 2, key.y + key.height / 2);
  await page.keyboard.press('ArrowRight');
}

/** Every queued entry on this device, whoever it belongs to (read straight from IndexedDB). */
const storedQueue = (page: Page) =>
  page.evaluate(
    () =>
      new Promise<{ owner: string; setupId: string; count: number }[]>((resolve, reject) => {
        const open = indexedDB.open('falloff-offline');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const d = open.result;
          if (!d.objectStoreNames.contains('queue')) return resolve([]);
          const all = d.transaction('queue').objectStore('queue').getAll();
          all.onsuccess = () => resolve(all.result as { owner: string; setupId: string; count: number }[]);
          all.onerror = () => reject(all.error);
        };
      }),
  );

describe('leaving with changes waiting', () => {
  it("the browser's Back asks first, stays when told to, and leaves when told to", async () => {
    const ctx = await browser().newContext({ viewport: viewports.phone, hasTouch: true });
    await signIn(ctx, 'owner');
    const id = await newSetup(ctx, 'Back button on the landing');
    const page = await ctx.newPage();
    const errors = watchErrors(page);
    await page.goto(`${base}/setups`);
    // Into the editor the way a person does (a history entry of the app's own, not a page load).
    await page.getByText('Back button on the landing').first().click();
    await page.getByTestId('item-key').waitFor({ timeout: 30_000 });
    expect(page.url()).toContain(`/setups/${id}`);

    await ctx.setOffline(true);
    await nudgeKey(page);
    await expect.poll(() => saveState(page), { timeout: 15_000 }).toBe('Offline — 1 change waiting');

    const dialogs: string[] = [];
    let answer = false;
    page.on('dialog', (d) => {
      dialogs.push(d.message());
      void (answer ? d.accept() : d.dismiss());
    });
    // Back, and stay.
    await page.goBack({ waitUntil: 'commit', timeout: 5_000 }).catch(() => null);
    await expect.poll(() => dialogs.length, { timeout: 10_000 }).toBe(1);
    expect(dialogs[0]).toContain('1 change has not reached the server yet');
    await expect.poll(() => page.url(), { timeout: 10_000 }).toContain(`/setups/${id}`);
    await page.waitForTimeout(500);
    expect(page.url()).toContain(`/setups/${id}`);
    await page.getByTestId('item-key').waitFor({ timeout: 10_000 });
    expect(await saveState(page)).toBe('Offline — 1 change waiting');
    await shot(page, 'offline-back-stayed');

    // Back again, and leave: the library, the change still waiting on the device.
    answer = true;
    await page.goBack({ waitUntil: 'commit', timeout: 5_000 }).catch(() => null);
    await expect.poll(() => dialogs.length, { timeout: 10_000 }).toBe(2);
    await expect.poll(() => new URL(page.url()).pathname, { timeout: 15_000 }).toBe('/setups');
    await expect.poll(() => page.getByTestId('offline-banner').innerText(), { timeout: 15_000 }).toContain('Offline — 1 change waiting');
    await ctx.setOffline(false);
    await expect.poll(() => storedKeyX(id), { timeout: 30_000, interval: 500 }).toBeCloseTo(3.1);
    expect(dialogs).toHaveLength(2);
    expect(errors).toEqual([]);
    await ctx.close();
  });

  it('signing out warns, and queued changes wait for their owner, not the next person', async () => {
    const ctx = await browser().newContext({ viewport: viewports.phone, hasTouch: true });
    await signIn(ctx, 'owner');
    const id = await newSetup(ctx, 'Queued under her name');
    const page = await ctx.newPage();
    const errors = watchErrors(page);
    page.on('dialog', (d) => void d.accept());
    // The server does not take saves of this setup for now (as on a flaky connection): the edit is queued.
    const blockSaves = (route: import('playwright-core').Route) =>
      route.request().method() === 'GET' ? route.continue() : route.fulfill({ status: 503, contentType: 'application/json', body: JSON.stringify({ error: { code: 'unavailable', message: 'try later' } }) });
    await page.route(`**/api/setups/${id}`, blockSaves);
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('item-key').waitFor({ timeout: 30_000 });
    await nudgeKey(page);
    await expect.poll(async () => (await storedQueue(page)).filter((e) => e.setupId === id).length, { timeout: 20_000, interval: 500 }).toBe(1);

    await page.goto(`${base}/account`);
    await page.getByTestId('sign-out').click();
    await expect.poll(() => page.getByTestId('sign-out-unsent').innerText(), { timeout: 15_000 }).toContain('1 change not sent');
    await shot(page, 'offline-sign-out-unsent');
    // "Send now" cannot get it through while the server refuses: it says so and stays signed in.
    await page.getByTestId('sign-out-send').click();
    await expect.poll(() => page.getByTestId('sign-out-unsent').innerText(), { timeout: 15_000 }).toContain('could not be sent yet');
    expect(new URL(page.url()).pathname).toBe('/account');
    await page.getByTestId('sign-out-anyway').click();
    await expect.poll(() => new URL(page.url()).pathname, { timeout: 15_000 }).toBe('/sign-in');
    const [entry] = (await storedQueue(page)).filter((e) => e.setupId === id);
    expect(entry?.owner).toBeTruthy();

    // Saves go through again; another member of the studio signs in on this device.
    await page.unroute(`**/api/setups/${id}`, blockSaves);
    await signIn(ctx, 'editor');
    await page.goto(`${base}/setups`);
    await page.getByText('Queued under her name').first().waitFor({ timeout: 30_000 });
    await page.waitForTimeout(3_000);
    expect(await page.getByTestId('offline-banner').count()).toBe(0); // not theirs to see
    expect(await storedKeyX(id)).toBe(3); // nor to send
    expect((await storedQueue(page)).filter((e) => e.setupId === id)).toHaveLength(1); // nor to drop
    // Opening the setup shows the stored plan, not her queued change.
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('item-key').waitFor({ timeout: 30_000 });
    await page.waitForTimeout(1_500);
    expect(await storedKeyX(id)).toBe(3);
    await page.goto(`${base}/account`);
    await page.getByTestId('sign-out').click(); // nothing of theirs waits: out at once
    await expect.poll(() => new URL(page.url()).pathname, { timeout: 15_000 }).toBe('/sign-in');

    // She signs in again: her change goes out.
    await signIn(ctx, 'owner');
    await page.goto(`${base}/setups`);
    await expect.poll(() => storedKeyX(id), { timeout: 30_000, interval: 500 }).toBeCloseTo(3.1);
    await expect.poll(async () => (await storedQueue(page)).filter((e) => e.setupId === id).length, { timeout: 15_000 }).toBe(0);
    expect(errors).toEqual([]);
    await ctx.close();
  });
});
