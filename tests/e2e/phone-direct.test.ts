// Direct manipulation on a phone (touch, 390×844) and on a wide screen: items added from the kit land apart,
// a tap on an item opens its settings with the item still in view above the sheet, the side view shows the
// heights. Screenshots in tests/.artifacts for a person to look at.
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { sharedBrowser, shot, viewports, watchErrors, type ViewportName } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();

async function centre(page: Page, testId: string) {
  const box = await page.getByTestId('plan').getByTestId(testId).boundingBox();
  if (!box) throw new Error(`${testId} is not on screen`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

describe.each(Object.keys(viewports) as ViewportName[])('direct manipulation on a %s viewport', (vp) => {
  it('places items apart, opens a tapped item above the sheet, and shows the side view', async () => {
    const phone = vp === 'phone';
    const context = await browser().newContext({ viewport: viewports[vp], hasTouch: phone, isMobile: phone });
    const page = await context.newPage();
    const errors = watchErrors(page);
    const signIn = await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } });
    expect(signIn.status()).toBe(200);
    const created = await context.request.post(`${base}/api/setups`, { data: { title: `Direct (${vp})` }, headers: { origin: base } });
    const { id } = (await created.json()) as { id: string };
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor();

    const kit = async (label: string) => {
      if (phone) await page.getByRole('button', { name: 'Open the kit' }).click();
      // The whole kit (the kit at hand has the same buttons for the items it carries).
      await page.getByTestId('kit').getByRole('button', { name: label }).click();
      if (phone) await page.getByLabel('Close the kit').waitFor({ state: 'detached' });
    };
    for (const k of ['Add subject', 'Add camera', 'Add light', 'Add light']) await kit(k);
    await expect.poll(() => page.getByTestId('plan').getByTestId('item-light-2').count(), { timeout: 10_000 }).toBe(1);
    const spots = await Promise.all(['item-subject-1', 'item-camera-1', 'item-light-1', 'item-light-2'].map((t) => centre(page, t)));
    for (let a = 0; a < spots.length; a++) for (let b = a + 1; b < spots.length; b++) expect(Math.hypot(spots[a]!.x - spots[b]!.x, spots[a]!.y - spots[b]!.y)).toBeGreaterThan(12);

    if (phone) {
      // Lower the sheet, then tap the second light: its settings open and it stays above the sheet.
      await page.getByRole('tab', { name: 'Meter' }).click();
      const light = await centre(page, 'item-light-2');
      await page.touchscreen.tap(light.x, light.y);
      await page.getByTestId('inspector-light-2').waitFor({ timeout: 10_000 });
      // (on a phone the inspector shows only on the Item tab: seeing it is seeing that tab open)
      await expect
        .poll(async () => {
          const sheetTop = (await page.getByTestId('sheet-handle').boundingBox())!.y;
          const now = await centre(page, 'item-light-2');
          return now.y < sheetTop - 10 && sheetTop < 844 - 300;
        }, { timeout: 8000 })
        .toBe(true);
      await shot(page, 'phone-a-tap-opens-item');
      // Six tabs on the sheet; the setup's own parts one tap further under Setup.
      expect(await page.getByRole('tablist').first().getByRole('tab').count()).toBeLessThanOrEqual(6);
      await page.getByRole('tab', { name: 'Setup' }).click();
      await page.getByLabel('Indoors, under a ceiling').first().waitFor({ timeout: 10_000 });
      await page.getByRole('tab', { name: 'Crew sheet' }).click();
      await page.getByTestId('crew-sheet-preview').waitFor({ timeout: 10_000 });
      await shot(page, 'phone-a-setup-tab');
      await page.getByRole('tab', { name: 'Side' }).click();
    }
    await page.getByTestId('side-view').waitFor();
    await expect.poll(() => page.getByTestId('side-view').getByTestId('side-light-1').count(), { timeout: 5000 }).toBe(1);
    await shot(page, `phone-a-side-view-${vp}`);
    expect(errors).toEqual([]);
    await context.close();
  });
});
