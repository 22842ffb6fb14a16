// The comment pins' plan beside the editor's own plan on a wide screen, in Chromium: it is hidden from
// assistive tech (the items are reached once, on the editor's plan), and zoom and
// pan work on it with the pins showing — a pin stays on its light as the view moves.
import { describe, expect, inject, it } from 'vitest';
import { sharedBrowser, shot } from '../support/browser';
import { centreOf, newPerson } from '../support/comments';

const base = inject('baseUrl');
const browser = sharedBrowser();
const PASSWORD = 'e2e-pins-pass-1';

const doc = {
  schemaVersion: 1,
  stage: { widthM: 8, depthM: 6 },
  items: [
    { id: 'paper', kind: 'wall', label: 'Grey paper', surface: 'seamless', a: { x: 2, y: 1 }, b: { x: 6, y: 1 }, heightM: 2.7, colour: '#808080' },
    { id: 'dancer', kind: 'subject', label: 'Dancer', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 4, y: 5.4, heightM: 1.2, aimDeg: -90, iso: 100, aperture: 8, shutterS: 1 / 200 },
    { id: 'kick', kind: 'light', label: 'Kicker right', x: 5.8, y: 2.4, heightM: 1.8, aimDeg: 160, source: { type: 'strobe', energyWs: 300 }, power: 1 / 4, modifier: 'grid-20' },
  ],
};

describe('the comment pins plan in the editor', () => {
  it('is hidden from assistive tech, and zooms and pans with the pins on their items', async () => {
    const { context, page, errors, send } = await newPerson(base, browser(), { viewport: 'wide', name: 'Ines Pins', password: PASSWORD });
    const setup = await send('POST', '/setups', { title: 'Kicker check', document: doc });
    await send('POST', `/setups/${setup.id}/comments`, { body: 'Is the kicker spilling onto the paper?', itemId: 'kick' });

    await page.goto(`${base}/setups/${setup.id}`);
    await page.getByTestId('plan').waitFor({ timeout: 30_000 });
    const plan = page.getByTestId('comment-plan');
    const pin = plan.getByTestId('comment-plan-pins').locator('[aria-label="Comment 1"]');
    const light = plan.getByTestId('pin-item-kick');
    await expect.poll(() => pin.count(), { timeout: 20_000 }).toBe(1);
    await plan.scrollIntoViewIfNeeded();

    // Hidden from assistive tech; the light is one button, on the editor's plan.
    expect(await plan.getAttribute('aria-hidden')).toBe('true');
    await expect.poll(() => page.getByRole('button', { name: 'Light: Kicker right' }).count(), { timeout: 10_000 }).toBe(1);
    expect(await page.getByTestId('item-kick').count()).toBe(1);

    const onLight = async () => {
      const p = await centreOf(pin);
      const l = await centreOf(light);
      return Math.abs(p.x - l.x) < 20 && p.y < l.y && l.y - p.y < 40;
    };
    expect(await onLight()).toBe(true);
    const before = await centreOf(light);

    // Zoom in with the plan's own button: the light moves away from the centre, the pin with it.
    await plan.locator('[aria-label="Zoom in"]').click();
    await expect.poll(async () => Math.hypot((await centreOf(light)).x - before.x, (await centreOf(light)).y - before.y), { timeout: 10_000 }).toBeGreaterThan(5);
    await expect.poll(onLight, { timeout: 10_000 }).toBe(true);

    // Pan by dragging empty plan (a read-only plan pans under the mouse).
    const zoomed = await centreOf(light);
    const box = (await plan.boundingBox())!;
    const from = { x: box.x + 30, y: box.y + box.height - 40 };
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(from.x + k * 5, from.y - k * 3);
    await page.mouse.up();
    await expect.poll(async () => (await centreOf(light)).x - zoomed.x, { timeout: 10_000 }).toBeGreaterThan(25);
    await expect.poll(onLight, { timeout: 10_000 }).toBe(true);

    // The wheel zooms it too.
    const panned = await centreOf(light);
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.wheel(0, -300);
    await expect.poll(async () => Math.hypot((await centreOf(light)).x - panned.x, (await centreOf(light)).y - panned.y), { timeout: 10_000 }).toBeGreaterThan(5);
    await expect.poll(onLight, { timeout: 10_000 }).toBe(true);
    await shot(page, 'comment-pins-zoomed-panned');
    expect(errors).toEqual([]);
    await context.close();
  });
});
