// An inspector edit lands on the item the inspector shows, in the saved document — on the demo's twin rims, whose
// fields all show the same values. (An earlier inspector kept a field's previous callback whenever its shown
// value had not changed, so "+" on Power for Rim right raised Rim left, and that was saved and shared.)
// Each field kind: number stepper, typed number, choice, switch, text; and a selection change mid-typing.
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { demoSetups } from '../../db/seed-setups';
import type { ItemOf, SetupDocument } from '../../model/document';
import { dragSheet, settledBox, sharedBrowser, shot, viewports, watchErrors, type ViewportName } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const twinRims = demoSetups.find((d) => d.document.items.some((i) => i.id === 'rimL'))!.document;

describe.each(Object.keys(viewports) as ViewportName[])('inspector edits on a %s viewport', (vp) => {
  it('reach the selected one of two identical lights, for every field kind', async () => {
    const phone = vp === 'phone';
    const context = await browser().newContext({ viewport: viewports[vp], hasTouch: phone, isMobile: phone });
    const page = await context.newPage();
    const errors = watchErrors(page);
    const headers = { origin: base };
    expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers })).status()).toBe(200);
    const created = await context.request.post(`${base}/api/setups`, { data: { title: `Twin rims, inspector check (${vp})`, document: twinRims }, headers });
    expect(created.status()).toBe(201);
    const { id } = (await created.json()) as { id: string };
    const saved = async () => {
      const r = await context.request.get(`${base}/api/setups/${id}`);
      const doc = ((await r.json()) as { document: SetupDocument }).document;
      const get = (lid: string) => doc.items.find((i) => i.id === lid) as ItemOf<'light'>;
      return { l: get('rimL'), r: get('rimR') };
    };

    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor();
    const pick = async (lid: string) => {
      if (phone) await dragSheet(page, false);
      // a press where the glyph is on screen (the plan hit-tests it; beams and labels drawn above it let it through)
      const box = await settledBox(page.getByTestId(`item-${lid}`));
      const at = { x: box.x + box.width / 2, y: box.y + box.height / 2 };
      if (phone) await page.touchscreen.tap(at.x, at.y);
      else await page.mouse.click(at.x, at.y);
      if (phone) {
        await dragSheet(page, true);
        await page.getByRole('tab', { name: 'Item' }).click();
      }
    };
    const field = (label: string) => page.getByLabel(label, { exact: true });
    const settled = () => expect.poll(() => page.getByTestId('save-state').textContent(), { timeout: 20_000, interval: 200 }).toBe('Saved');

    // Rim left first, then Rim right: every field of the inspector now shows the same values as a moment ago.
    await pick('rimL');
    await expect.poll(() => field('Label').inputValue(), { timeout: 10_000 }).toBe('Rim left');
    await pick('rimR');
    await expect.poll(() => field('Label').inputValue(), { timeout: 10_000 }).toBe('Rim right');

    // number stepper
    await page.getByRole('button', { name: 'More power' }).click();
    // typed number
    await field('Height (m)').fill('2.4');
    await field('Height (m)').press('Enter');
    // choice
    await page.getByRole('radio', { name: 'boom' }).click();
    // switch
    await page.getByRole('switch', { name: 'Sandbagged' }).click();
    // text
    await field('Label').fill('Rim right, strip');
    await field('Label').press('Enter');
    await settled();
    let { l, r } = await saved();
    expect(r.power).toBeGreaterThan(0.25);
    expect(r.heightM).toBeCloseTo(2.4, 6);
    expect(r.stand).toBe('boom');
    expect(r.sandbagged).toBe(false); // stands are sandbagged by default; the switch turned it off
    expect(r.label).toBe('Rim right, strip');
    expect(l).toEqual(twinRims.items.find((i) => i.id === 'rimL'));
    await shot(page, `inspector-target-${vp}`);

    // A height typed for Rim right, then the other light picked before Enter: the text goes to Rim right.
    await field('Height (m)').fill('2.6');
    await pick('rimL');
    await expect.poll(() => field('Label').inputValue(), { timeout: 10_000 }).toBe('Rim left');
    await settled();
    ({ l, r } = await saved());
    expect(r.heightM).toBeCloseTo(2.6, 6);
    expect(l.heightM).toBeCloseTo(1.8, 6);
    expect(errors).toEqual([]);
    await context.close();
  });
});
