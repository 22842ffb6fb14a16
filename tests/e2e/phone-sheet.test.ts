// The phone's sheet (390 × 844, touch): a tap on one of its tabs while it rests at its lowest shows that tab's
// content — the sheet rises to half height — and a tab tapped while it is higher leaves it where it is.
import { describe, expect, inject, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { dragSheet, sharedBrowser, shot, viewports, watchErrors } from '../support/browser';
import { washAndKicker } from '../support/frameLooks';

const base = inject('baseUrl');
const browser = sharedBrowser();
const screenH = viewports.phone.height;
// The sheet's stops (components/editor/BottomSheet.tsx): the lowest shows the handle, the kit at hand, the
// meter's line and the tabs (184 px); the middle is 55 % of the window; the highest 85 %.
const PEEK_PX = 184;
const halfTop = screenH - Math.round(screenH * 0.55);

const sheetTop = async (page: Page) => (await page.getByTestId('sheet-handle').boundingBox())!.y;
/** How much of an element shows between the sheet's top and the screen's bottom, px. */
async function shownInSheet(page: Page, loc: Locator) {
  const box = await loc.first().boundingBox().catch(() => null);
  if (!box) return 0;
  const top = Math.max(box.y, await sheetTop(page));
  return Math.max(0, Math.min(box.y + box.height, screenH) - top);
}

describe('the phone sheet', () => {
  it('rises from its lowest height to show a tapped tab', async () => {
    const context = await browser().newContext({ viewport: viewports.phone, hasTouch: true, isMobile: true });
    const page = await context.newPage();
    const errors = watchErrors(page);
    expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } })).status()).toBe(200);
    const created = await context.request.post(`${base}/api/setups`, { data: { title: 'Sheet tabs' }, headers: { origin: base } });
    const { id } = (await created.json()) as { id: string };
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor({ timeout: 30_000 });
    // The sheet opens at its lowest: only the kit at hand, the meter's line and the tabs show.
    await expect.poll(() => sheetTop(page), { timeout: 10_000 }).toBeGreaterThan(screenH - PEEK_PX - 4);
    expect(await sheetTop(page)).toBeLessThan(screenH - PEEK_PX + 8);
    // The kit at hand shows whole above the tabs at this height.
    const kit = (await page.getByRole('button', { name: 'Add light', exact: true }).boundingBox())!;
    const tabTop = (await page.getByRole('tab', { name: 'Meter', exact: true }).boundingBox())!.y;
    expect(kit.y).toBeGreaterThanOrEqual(await sheetTop(page));
    expect(kit.y + kit.height).toBeLessThanOrEqual(tabTop);
    await shot(page, 'phone-sheet-peek');

    await page.getByRole('tab', { name: 'Side', exact: true }).tap();
    // Half height: 55 % of the screen (within the handle's few pixels of padding).
    await expect.poll(async () => Math.abs((await sheetTop(page)) - halfTop), { timeout: 10_000 }).toBeLessThan(6);
    // The chosen tab is said to be chosen (aria-selected: react-native-web drops accessibilityState), and only it.
    await expect.poll(() => page.getByRole('tab', { name: 'Side', exact: true, selected: true }).count(), { timeout: 10_000 }).toBe(1);
    expect(await page.getByRole('tab', { name: 'Meter', exact: true, selected: false }).count()).toBe(1);
    await expect.poll(() => shownInSheet(page, page.getByText('Add a subject and a camera to see the setup from the side.')), { timeout: 10_000 }).toBeGreaterThan(10);
    await shot(page, 'phone-sheet-side-tab');

    // Raised higher by hand, a tab tap does not lower it.
    await dragSheet(page, true);
    const high = await sheetTop(page);
    expect(high).toBeLessThan(screenH * 0.3);
    await page.getByRole('tab', { name: 'Meter', exact: true }).tap();
    await page.waitForTimeout(600);
    expect(Math.abs((await sheetTop(page)) - high)).toBeLessThan(4);

    // Lowered again, the Setup tab rises to show the room's settings.
    await dragSheet(page, false);
    await expect.poll(() => sheetTop(page), { timeout: 10_000 }).toBeGreaterThan(screenH - PEEK_PX - 4);
    await page.getByRole('tab', { name: 'Setup', exact: true }).tap();
    await expect.poll(() => shownInSheet(page, page.getByLabel('Indoors, under a ceiling')), { timeout: 10_000 }).toBeGreaterThan(10);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('opens each tab at its top, not at the scroll left by the last one', async () => {
    const context = await browser().newContext({ viewport: viewports.phone, hasTouch: true, isMobile: true });
    const page = await context.newPage();
    const errors = watchErrors(page);
    expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } })).status()).toBe(200);
    const created = await context.request.post(`${base}/api/setups`, { data: { title: 'Sheet scroll', document: washAndKicker }, headers: { origin: base } });
    const { id } = (await created.json()) as { id: string };
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor({ timeout: 30_000 });
    await page.getByRole('tab', { name: 'Meter', exact: true }).tap();
    await page.getByTestId('meter-subject').first().waitFor({ timeout: 30_000 });
    // Read down the meter, as a photographer scrolls to the background's reading.
    const panel = page.getByRole('tabpanel');
    const box = (await panel.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await expect
      .poll(
        async () => {
          await page.mouse.wheel(0, 300);
          return panel.evaluate((el) => el.scrollTop);
        },
        { timeout: 10_000 },
      )
      .toBeGreaterThan(150);
    // The background's reading in the frame fits the phone's width (three channels' stops used to run off it).
    for (const id of ['meter-background-recorded', 'meter-background-range']) {
      const b = (await page.getByTestId(id).boundingBox())!;
      expect(b.x + b.width, id).toBeLessThanOrEqual(viewports.phone.width);
    }
    // The frame's tab opens at its top: the whole picture shows under the tabs.
    await page.getByRole('tab', { name: 'Frame', exact: true }).tap();
    await expect.poll(() => page.getByRole('tabpanel', { name: 'Frame' }).evaluate((el) => el.scrollTop), { timeout: 10_000 }).toBe(0);
    const tabsBottom = (await page.getByRole('tab', { name: 'Frame', exact: true }).boundingBox())!;
    const picture = (await page.getByLabel('The frame: what the camera will record').first().boundingBox())!;
    expect(picture.y).toBeGreaterThanOrEqual(tabsBottom.y + tabsBottom.height - 1);
    await shot(page, 'phone-sheet-frame-at-top');
    expect(errors).toEqual([]);
    await context.close();
  });
});
