// Snapping for fingers on a phone (390 × 844, touch): at the zoom that shows the whole stage the grid is 0.5 m,
// so a wall drawn and a light dragged by hand land on it; while the wall is drawn its length reads live.
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { sharedBrowser, shot, viewports, watchErrors } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const onHalfMetre = (v: number) => Math.abs(v * 2 - Math.round(v * 2)) < 1e-6;

type Doc = { items: { id: string; kind: string; x?: number; y?: number; a?: { x: number; y: number }; b?: { x: number; y: number } }[] };

async function move(page: Page, from: { x: number; y: number }, to: { x: number; y: number }, during?: () => Promise<void>) {
  await page.mouse.move(from.x, from.y);
  await page.mouse.down();
  for (let k = 1; k <= 14; k++) await page.mouse.move(from.x + ((to.x - from.x) * k) / 14, from.y + ((to.y - from.y) * k) / 14);
  await during?.();
  await page.mouse.up();
}

describe('snapping on a phone', () => {
  it('a wall drawn and a light dragged land on the 0.5 m grid; the wall\'s length reads while it is drawn', async () => {
    const context = await browser().newContext({ viewport: viewports.phone, hasTouch: true, isMobile: true });
    const page = await context.newPage();
    const errors = watchErrors(page);
    expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } })).status()).toBe(200);
    const created = await context.request.post(`${base}/api/setups`, { data: { title: 'Snap for fingers' }, headers: { origin: base } });
    const { id } = (await created.json()) as { id: string };
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor({ timeout: 30_000 });
    const saved = async () => ((await (await context.request.get(`${base}/api/setups/${id}`)).json()).document as Doc).items;

    await page.getByRole('button', { name: 'Draw a wall', exact: true }).first().tap();
    const plan = (await page.getByTestId('plan').first().boundingBox())!;
    // Off-grid on purpose: 0.27 and 0.71 of the plan's width.
    let during = '';
    await move(page, { x: plan.x + plan.width * 0.27, y: plan.y + plan.height * 0.21 }, { x: plan.x + plan.width * 0.71, y: plan.y + plan.height * 0.23 }, async () => {
      await page.getByTestId('wall-length').waitFor({ timeout: 5000 });
      during = (await page.getByTestId('wall-length').textContent()) ?? '';
      await shot(page, 'phone-snap-wall-drawing');
    });
    await expect.poll(async () => (await saved()).some((i) => i.kind === 'wall'), { timeout: 30_000 }).toBe(true);
    const wall = (await saved()).find((i) => i.kind === 'wall')!;
    for (const v of [wall.a!.x, wall.a!.y, wall.b!.x, wall.b!.y]) expect(onHalfMetre(v), `wall end ${v}`).toBe(true);
    const length = Math.hypot(wall.b!.x - wall.a!.x, wall.b!.y - wall.a!.y);
    // The live readout said the length the wall was released at.
    expect(during).toContain(`${length.toFixed(2)} m`);
    await expect(page.getByTestId('wall-length').count()).resolves.toBe(0);

    await page.getByRole('button', { name: 'Add light', exact: true }).first().tap();
    await expect.poll(async () => (await saved()).some((i) => i.kind === 'light'), { timeout: 30_000 }).toBe(true);
    const placed = (await saved()).find((i) => i.kind === 'light')!;
    const glyph = (await page.getByTestId('item-light-1').first().boundingBox())!;
    const from = { x: glyph.x + glyph.width / 2, y: glyph.y + glyph.height / 2 };
    await move(page, from, { x: from.x + 37, y: from.y + 23 });
    // It moved (the drag is saved), and to a point of the grid.
    await expect.poll(async () => (await saved()).find((i) => i.kind === 'light')!.x !== placed.x, { timeout: 30_000 }).toBe(true);
    const light = (await saved()).find((i) => i.kind === 'light')!;
    expect(onHalfMetre(light.x!) && onHalfMetre(light.y!), `light at ${light.x}, ${light.y}`).toBe(true);
    expect(errors).toEqual([]);
    await context.close();
  });
});
