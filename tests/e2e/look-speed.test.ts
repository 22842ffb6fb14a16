// Speed to a look: build the two-light gelled look from an empty setup — a back wall, a subject, a camera, a
// key with a softbox, a rim with a grid and a red gel, and the key's power set for the target aperture with the
// meter's one-tap suggestion — on a
// phone (390 × 844, touch) and wide (1440 × 900), counting every tap, drag and field commit and the seconds
// taken. The figures are printed and written to tests/.artifacts/look-speed.json; the aim is ≤ 25 on a phone
// and ≤ 20 wide (what the test asserts is that the look is built, not how fast: timings are never asserted).
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { formatPower } from '../../model/units';
import { artifactsDir, dragMouse, dragSheet, sharedBrowser, shot, viewports, type ViewportName } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const figures: Record<string, { actions: number; seconds: number }> = {};

describe.each(['phone', 'wide'] as ViewportName[])('the two-light gelled look on %s', (vp) => {
  it('is built, and the taps and seconds are counted', async () => {
    const phone = vp === 'phone';
    const context = await browser().newContext({ viewport: viewports[vp], ...(phone ? { isMobile: true, hasTouch: true } : {}) });
    const page = await context.newPage();
    expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } })).status()).toBe(200);
    const created = await context.request.post(`${base}/api/setups`, { data: { title: `Gelled rim look (${vp})` }, headers: { origin: base } });
    const { id } = (await created.json()) as { id: string };
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor({ timeout: 30_000 });

    let actions = 0;
    const started = Date.now();
    const tap = async (p: Promise<unknown>) => {
      await p;
      actions++;
    };
    const click = (name: string, role: 'button' | 'radio' | 'tab' = 'button') => tap(page.getByRole(role, { name, exact: true }).first().click());
    const sheet = async (open: boolean) => {
      if (phone) await tap(dragSheet(page, open));
    };
    // The kit at hand (the sheet's top row on a phone, over the plan wide): one tap an item.
    const kit = (label: string) => tap(page.getByTestId('kit-at-hand').first().getByRole('button', { name: label, exact: true }).click());
    const inspectorFor = async (itemId: string) => {
      if (phone && !(await page.getByTestId(`inspector-${itemId}`).isVisible().catch(() => false))) {
        await sheet(true);
        if (!(await page.getByTestId(`inspector-${itemId}`).isVisible().catch(() => false))) await click('Item', 'tab');
      }
      await page.getByTestId(`inspector-${itemId}`).waitFor({ timeout: 10_000 });
    };

    // The back wall: one drag across the top of the plan.
    await kit('Draw a wall');
    const plan = (await page.getByTestId('plan').first().boundingBox())!;
    await tap(dragMouse(page, { x: plan.x + plan.width * 0.2, y: plan.y + plan.height * 0.15 }, { x: plan.x + plan.width * 0.8, y: plan.y + plan.height * 0.15 }));
    // Subject and camera where they land. (The kit at hand shows at every height of the sheet, and each new item
    // lands in the free plan above it: nothing needs the sheet lowered between adds.)
    await kit('Add subject');
    await kit('Add camera');
    // The key: a new light comes with a softbox.
    await kit('Add light');
    await inspectorFor('light-1');
    // Power for the aimed aperture: one tap on the meter's suggestion (waiting for the meter is not a tap).
    const suggestion = page.getByRole('button', { name: /^Set power to / }).first();
    await suggestion.waitFor({ timeout: 20_000 });
    const suggested = (await suggestion.getAttribute('aria-label'))?.replace(/^Set power to /, '') ?? (await suggestion.textContent())!.replace(/^Set power to /, '');
    await tap(suggestion.click());
    await page.getByRole('button', { name: 'Undo power' }).waitFor({ timeout: 10_000 });
    // The rim: a grid and a red gel.
    await kit('Add light');
    await inspectorFor('light-2');
    await click('20°', 'radio');
    await click('Gel: no gel. Change');
    const red = page.getByRole('radio', { name: 'red', exact: true }).first();
    await tap(red.click());
    const seconds = (Date.now() - started) / 1000;
    figures[vp] = { actions, seconds: Math.round(seconds * 10) / 10 };
    console.log(`[look-speed] ${vp}: ${actions} taps/drags/commits in ${seconds.toFixed(1)} s (aim ${phone ? 25 : 20})`);
    writeFileSync(join(artifactsDir, 'look-speed.json'), JSON.stringify(figures, null, 2));
    if (phone) await sheet(false);
    await shot(page, `look-speed-${vp}`);

    // The look is there: a wall, a subject, a camera, two lights, a gel on the second, power set on the first.
    // (Autosave follows the last tap by its debounce: wait until the gel, the last change, is saved too.)
    await expect
      .poll(async () => {
        const items = ((await (await context.request.get(`${base}/api/setups/${id}`)).json()).document?.items ?? []) as { kind: string; gel?: string }[];
        const ls = items.filter((i) => i.kind === 'light');
        return items.length >= 5 && ls.length === 2 && ls[1]!.gel !== 'none';
      }, { timeout: 30_000 })
      .toBe(true);
    const doc = (await (await context.request.get(`${base}/api/setups/${id}`)).json()).document as { items: { kind: string; gel?: string; power?: number; gridDeg?: number | null }[] };
    const lights = doc.items.filter((i) => i.kind === 'light');
    expect(doc.items.filter((i) => i.kind === 'wall').length).toBe(1);
    expect(doc.items.some((i) => i.kind === 'subject')).toBe(true);
    expect(doc.items.some((i) => i.kind === 'camera')).toBe(true);
    expect(lights.length).toBe(2);
    expect(formatPower(lights[0]!.power!)).toBe(suggested);
    expect(lights[1]!.gel).not.toBe('none');
    expect(lights[1]!.gridDeg).toBe(20);
    await context.close();
  });
});
