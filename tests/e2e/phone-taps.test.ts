// Taps to one light on a phone (390 × 844, touch): from an empty setup, a light with a snoot, a red gel and 1/8
// power. Every tap, sheet drag, scroll to reach a control and field commit is counted; the figure is printed and
// written to tests/.artifacts/phone-taps.json. What the test asserts is that the light is built as asked (the
// count is reported, never asserted: it is a measure, and a new control may change it either way).
import { writeFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, inject, it } from 'vitest';
import type { Locator } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { artifactsDir, sharedBrowser, shot, viewports, watchErrors } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const screenH = viewports.phone.height;

describe('one snooted, red-gelled light at 1/8 on a phone', () => {
  it('is built, and its taps are counted', async () => {
    const context = await browser().newContext({ viewport: viewports.phone, hasTouch: true, isMobile: true });
    const page = await context.newPage();
    const errors = watchErrors(page);
    expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } })).status()).toBe(200);
    const created = await context.request.post(`${base}/api/setups`, { data: { title: 'One snooted light' }, headers: { origin: base } });
    const { id } = (await created.json()) as { id: string };
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor({ timeout: 30_000 });

    const steps: string[] = [];
    const sheetTop = async () => (await page.getByTestId('sheet-handle').boundingBox())!.y;
    /** A control out of sight (off the screen, or in the sheet's panel but scrolled above its top) costs a
     *  scroll to reach. */
    const reach = async (loc: Locator, what: string) => {
      await loc.waitFor({ timeout: 10_000 });
      const box = (await loc.boundingBox())!;
      const inSheet = await loc.evaluate((el) => !!el.closest('[role="tabpanel"]'));
      const top = inSheet ? await sheetTop() : 0;
      if (box.y < top || box.y + box.height > screenH) {
        await loc.scrollIntoViewIfNeeded();
        steps.push(`scroll to ${what}`);
      }
    };
    const tap = async (loc: Locator, what: string) => {
      await reach(loc, what);
      await loc.tap();
      steps.push(`tap ${what}`);
    };
    const button = (name: string) => page.getByRole('button', { name, exact: true }).first();
    const radio = (name: string) => page.getByRole('radio', { name, exact: true }).first();

    // The kit at hand, at the top of the sheet: one tap adds a light (it comes with a softbox) and opens its settings.
    await tap(button('Add light'), 'Add light');
    await page.getByTestId('inspector-light-1').waitFor({ timeout: 10_000 });
    // Top down, as the settings read: power, the modifier, the gel.
    const power = page.getByTestId('field-power');
    await tap(power, 'Power');
    await power.fill('8');
    await power.press('Enter');
    steps.push('commit 1/8');
    await tap(button('Modifier: softbox (90 cm). Change'), 'Modifier');
    await tap(radio('snoot'), 'snoot');
    await tap(button('Gel: no gel. Change'), 'Gel');
    await tap(radio('red'), 'red');

    console.log(`[phone-taps] ${steps.length} actions: ${steps.join(', ')}`);
    mkdirSync(artifactsDir, { recursive: true });
    writeFileSync(join(artifactsDir, 'phone-taps.json'), JSON.stringify({ actions: steps.length, steps }, null, 2));
    await shot(page, 'phone-taps');

    await expect
      .poll(async () => {
        const items = ((await (await context.request.get(`${base}/api/setups/${id}`)).json()).document?.items ?? []) as { kind: string; modifier?: string; gel?: string; power?: number }[];
        const l = items.find((i) => i.kind === 'light');
        return l ? { modifier: l.modifier, gel: l.gel, power: l.power } : null;
      }, { timeout: 30_000 })
      .toEqual({ modifier: 'snoot', gel: 'red', power: 1 / 8 });
    expect(errors).toEqual([]);
    await context.close();
  });
});
