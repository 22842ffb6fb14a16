// Drawing a setup in the browser, on a phone and on a wide screen: draw a room, place a subject, a camera
// and two lights, drag the key from 1 m to 2 m and watch it lose two stops (inverse-square law), undo,
// reload, and find the plan as it was left.
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { dragMouse, dragSheet, sharedBrowser, shot, viewports, watchErrors, type ViewportName } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();

async function centre(page: Page, testId: string) {
  const box = await page.getByTestId(testId).boundingBox();
  if (!box) throw new Error(`${testId} is not on screen`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

const stopsOf = async (page: Page, lightId: string) => Number((await page.getByTestId(`meter-light-${lightId}-stops`).textContent())!.replace('−', '-').replace('±', ''));

describe.each(Object.keys(viewports) as ViewportName[])('the editor on a %s viewport', (vp) => {
  it('draws a setup, meters the key falling off by two stops, undoes and keeps it over a reload', async () => {
    const context = await browser().newContext({ viewport: viewports[vp] });
    const page = await context.newPage();
    const errors = watchErrors(page);
    const phone = vp === 'phone';

    const signIn = await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } });
    expect(signIn.status()).toBe(200);
    const created = await context.request.post(`${base}/api/setups`, { data: { title: `Two-light test (${vp})` }, headers: { origin: base } });
    expect(created.status()).toBe(201);
    const { id } = (await created.json()) as { id: string };
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor();

    // The sheet on a phone: drag its handle up to work in it, down to see the plan.
    const sheet = async (open: boolean) => (phone ? dragSheet(page, open) : undefined);
    const kit = async (label: string) => {
      if (phone) await page.getByRole('button', { name: 'Open the kit' }).click();
      // The whole kit (the kit at hand has the same buttons for the items it carries).
      await page.getByTestId('kit').getByRole('button', { name: label }).click();
      // The kit slides away on a phone; wait until it no longer covers the plan.
      if (phone) await page.getByLabel('Close the kit').waitFor({ state: 'detached' });
    };
    const setField = async (label: string, value: string) => {
      const f = page.getByLabel(label, { exact: true });
      await f.fill(value);
      await f.press('Enter');
    };
    const place = async (kindLabel: string, id: string, fields: [string, string][]) => {
      await kit(kindLabel);
      await sheet(true);
      if (phone) await page.getByRole('tab', { name: 'Item' }).click();
      // The inspector follows the selection at low priority: type once it shows the new item (until then its
      // fields are the previous item's, and an edit there rightly goes to that one).
      await page.getByTestId(`inspector-${id}`).waitFor();
      for (const [label, value] of fields) await setField(label, value);
      await sheet(false);
    };

    await place('Add subject', 'subject-1', [['Across (m)', '4'], ['Down (m)', '3'], ['Face height (m)', '1.6']]);
    await place('Add camera', 'camera-1', [['Across (m)', '4'], ['Down (m)', '5.5']]);
    // Aimed straight up the plan at the subject (a new light is aimed at the subject from where it lands, and
    // moving it by its fields keeps that aim).
    await place('Add light', 'light-1', [['Across (m)', '4'], ['Down (m)', '4'], ['Aim (°)', '-90'], ['Height (m)', '1.6'], ['Tilt (°, down is −)', '0']]);
    await sheet(true);
    await page.getByRole('button', { name: 'Modifier: softbox (90 cm). Change' }).click();
    await page.getByRole('radio', { name: 'bare reflector' }).click();
    await sheet(false);
    await place('Add light', 'light-2', [['Across (m)', '2.6'], ['Down (m)', '4.4'], ['Height (m)', '1.6']]);

    // A room: a back wall and a side wall, drawn by dragging on the plan. Where plan metres fall on screen
    // comes from the subject (4, 3) and key (4, 4) markers.
    const subj0 = await centre(page, 'item-subject-1');
    const key0 = await centre(page, 'item-light-1');
    const m = key0.y - subj0.y;
    const onScreen = (x: number, y: number) => ({ x: subj0.x + (x - 4) * m, y: subj0.y + (y - 3) * m });
    for (const [a, b] of [
      [onScreen(1.5, 1), onScreen(6.5, 1)],
      [onScreen(0.8, 1.5), onScreen(0.8, 5)],
    ] as const) {
      await kit('Draw a wall');
      await dragMouse(page, a, b);
    }
    await expect.poll(() => page.getByTestId('plan').getByRole('button', { name: 'Wall', exact: true }).count()).toBe(2);

    if (phone) {
      await sheet(true);
      await page.getByRole('tab', { name: 'Meter' }).click();
      await sheet(false);
    }
    await expect.poll(() => page.getByTestId('meter-light-light-1-stops').count()).toBeGreaterThan(0);
    const before = await stopsOf(page, 'light-1');
    await shot(page, `editor-${vp}-two-lights`);

    // Drag the key from 1 m to 2 m: the plan's scale comes from the subject and key markers, 1 m apart.
    const subj = await centre(page, 'item-subject-1');
    const key = await centre(page, 'item-light-1');
    const pxPerM = Math.hypot(key.x - subj.x, key.y - subj.y);
    expect(pxPerM).toBeGreaterThan(20);
    // A drag selects the light but leaves the sheet on the meter (only a tap opens an item's settings).
    const glyphBefore = await centre(page, 'item-glyph-light-1');
    const savedKeyY = async () => {
      const r = await context.request.get(`${base}/api/setups/${id}`);
      const d = (await r.json()) as { document: { items: { id: string; y?: number }[] } };
      return d.document.items.find((i) => i.id === 'light-1')!.y!;
    };
    await expect.poll(() => page.getByTestId('save-state').textContent(), { timeout: 10_000 }).toBe('Saved');
    const keyYBefore = await savedKeyY();
    await dragMouse(page, key, { x: key.x, y: key.y + pxPerM });
    // The glyph itself stands where the hand let go (the drag moved it outside React; the release drew it from
    // the document), and the drag was saved as it ended: 1 m further on the server.
    await expect.poll(async () => (await centre(page, 'item-glyph-light-1')).y - glyphBefore.y).toBeCloseTo(pxPerM, -1);
    await expect.poll(savedKeyY, { timeout: 15_000 }).toBeCloseTo(keyYBefore + 1, 1);
    await expect.poll(async () => before - (await stopsOf(page, 'light-1')), { timeout: 15_000 }).toBeGreaterThan(1.9);
    const after = await stopsOf(page, 'light-1');
    expect(Math.abs(before - after - 2)).toBeLessThanOrEqual(0.1);
    await shot(page, `editor-${vp}-key-at-2m`);

    // Undo puts the key back at 1 m.
    if (phone) await page.getByRole('button', { name: 'Undo' }).click();
    else await page.keyboard.press('Control+z');
    await expect.poll(() => stopsOf(page, 'light-1')).toBeCloseTo(before, 5);

    // Saved, and a reload shows exactly that.
    await expect.poll(() => page.getByTestId('save-state').textContent(), { timeout: 10_000 }).toBe('Saved');
    await page.reload();
    await page.getByTestId('plan').waitFor();
    // (counted on the editor's plan: on a wide screen the comment pins' small plan shows the same items)
    await expect.poll(() => stopsOf(page, 'light-1').catch(() => NaN), { timeout: 10_000 }).toBeCloseTo(before, 5);
    expect(await page.getByTestId('plan').getByRole('button', { name: 'Wall', exact: true }).count()).toBe(2);
    expect(await page.getByTestId('plan').getByRole('button', { name: 'Light', exact: true }).count()).toBe(2);
    await shot(page, `editor-${vp}-after-reload`);
    expect(errors).toEqual([]);
    await context.close();
  });
});
