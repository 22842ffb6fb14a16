// Signing out on a phone (390 × 844, touch) with a change still waiting on the device: the question opens where
// the Sign out button was, at the foot of the Account page, and all of it — its buttons included — must be in
// view, not below the fold.
import type { Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { sharedBrowser, shot, viewports, watchErrors } from '../support/browser';
import { Client, freshEmail } from '../support/http';
import { offlineDoc } from '../support/offlineSetup';

const base = inject('baseUrl');
const browser = sharedBrowser();
const PASSWORD = 'e2e-sign-out-phone-1';

/** The box's top and bottom against the viewport's height. */
const placeOf = (page: Page, testId: string) =>
  page.getByTestId(testId).evaluate((el) => {
    const r = el.getBoundingClientRect();
    return { top: r.top, bottom: r.bottom, viewport: window.innerHeight };
  });

describe('signing out on a phone with changes waiting', () => {
  it('shows the whole question, buttons included, without scrolling', { timeout: 300_000 }, async () => {
    const ctx = await browser().newContext({ viewport: viewports.phone, hasTouch: true, isMobile: true });
    const email = freshEmail('signout-phone');
    const up = await ctx.request.post(`${base}/api/auth/sign-up/email`, { data: { name: 'Ines Phone', email, password: PASSWORD }, headers: { origin: base } });
    expect(up.status()).toBe(200);
    expect((await ctx.request.get(await new Client(base).mailedLink(email, '/api/auth/verify-email'))).ok()).toBe(true);
    const made = await ctx.request.post(`${base}/api/setups`, { data: { title: 'Waiting on the phone', document: offlineDoc }, headers: { origin: base } });
    expect(made.status()).toBe(201);
    const id = ((await made.json()) as { id: string }).id;

    const page = await ctx.newPage();
    const errors = watchErrors(page);
    page.on('dialog', (d) => void d.accept());
    // The server does not take saves of this setup for now: the edit stays queued on the device.
    await page.route(`**/api/setups/${id}`, (route) =>
      route.request().method() === 'GET' ? route.continue() : route.fulfill({ status: 503, contentType: 'application/json', body: JSON.stringify({ error: { code: 'unavailable', message: 'try later' } }) }),
    );
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('item-key').waitFor({ timeout: 30_000 });
    const key = (await page.getByTestId('item-key').boundingBox())!;
    await page.touchscreen.tap(key.x + key.width / 2, key.y + key.height / 2);
    await page.keyboard.press('ArrowRight');
    await expect.poll(() => page.getByTestId('save-state').innerText(), { timeout: 20_000 }).toMatch(/1 change/);

    await page.goto(`${base}/account`);
    const button = page.getByTestId('sign-out');
    await button.waitFor({ timeout: 30_000 });
    // As a person gets there: scrolled down until the button shows at the foot of the screen.
    await button.evaluate((el) => el.scrollIntoView({ block: 'end' }));
    await button.tap();
    await expect.poll(() => page.getByTestId('sign-out-unsent').innerText(), { timeout: 15_000 }).toContain('1 change not sent');
    await expect
      .poll(async () => {
        const p = await placeOf(page, 'sign-out-unsent');
        return p.top >= 0 && p.bottom <= p.viewport;
      }, { timeout: 10_000 })
      .toBe(true);
    for (const b of ['sign-out-send', 'sign-out-anyway']) {
      const p = await placeOf(page, b);
      expect(p.bottom, `${b} is on screen`).toBeLessThanOrEqual(p.viewport);
    }
    await shot(page, 'sign-out-phone-question');
    // Stay signed in: the question closes, the change still waits.
    await page.getByRole('button', { name: 'Stay signed in' }).tap();
    await button.waitFor({ timeout: 10_000 });
    expect(errors).toEqual([]);
    await ctx.close();
  });
});
