// The frame view in the browser: the three demo setups and look 1 (a gelled wash with a kicker from behind),
// in colour and in black and white, on a wide screen (a pane beside the plan, enlarged) and on a phone (a tab
// of the sheet). Rendered in the Web Worker bundle (dist/workers/frame.js). Screenshots in tests/.artifacts/.
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { demoSetups } from '../../db/seed-setups';
import type { SetupDocument } from '../../model/document';
import { artifactsDir, dragSheet, sharedBrowser, viewports, watchErrors } from '../support/browser';
import { washAndKicker } from '../support/frameLooks';
import { join } from 'node:path';

const base = inject('baseUrl');
const browser = sharedBrowser();

const cases: { name: string; doc: SetupDocument }[] = [
  ...demoSetups.map((s, i) => ({ name: `demo${i + 1}`, doc: s.document })),
  { name: 'look1-wash-kicker', doc: washAndKicker },
];

async function refined(page: Page, testId: string) {
  await expect.poll(async () => (await page.getByTestId(`${testId}-quality`).textContent().catch(() => '')) ?? '', { interval: 250, timeout: 90_000 }).toMatch(/px/);
  // The picture is a decoded image of the frame's size.
  await expect.poll(() => page.getByTestId(`${testId}-image`).locator('img').evaluate((i: HTMLImageElement) => i.complete && i.naturalWidth > 0).catch(() => false), { timeout: 30_000 }).toBe(true);
}

async function newContext(vp: keyof typeof viewports) {
  const context = await browser().newContext({ viewport: viewports[vp], deviceScaleFactor: 1 });
  const signIn = await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } });
  expect(signIn.status()).toBe(200);
  return context;
}

describe('the frame view', () => {
  it('wide: a pane beside the plan shows each setup in colour and black and white, from the Web Worker; enlarges', async () => {
    const context = await newContext('wide');
    const page = await context.newPage();
    const errors = watchErrors(page);
    const workerUrls: string[] = [];
    page.on('worker', (w) => workerUrls.push(w.url()));
    for (const c of cases) {
      const made = await context.request.post(`${base}/api/setups`, { data: { title: `Frame: ${c.name}`, document: c.doc }, headers: { origin: base } });
      expect(made.status()).toBe(201);
      const { id } = (await made.json()) as { id: string };
      await page.goto(`${base}/setups/${id}`);
      await page.getByTestId('frame-view').waitFor({ timeout: 60_000 });
      await refined(page, 'frame-picture');
      await page.getByTestId('frame-picture').screenshot({ path: join(artifactsDir, `frame-${c.name}-colour.png`) });
      await page.getByRole('button', { name: 'Black and white' }).click();
      await expect.poll(() => page.getByText('Black and white', { exact: true }).count(), { timeout: 10_000 }).toBeGreaterThan(0);
      await page.waitForTimeout(400);
      await refined(page, 'frame-picture');
      await page.getByTestId('frame-picture').screenshot({ path: join(artifactsDir, `frame-${c.name}-mono.png`) });
      await page.getByRole('button', { name: 'Black and white' }).click();
      if (c.name === 'look1-wash-kicker') {
        await page.screenshot({ path: join(artifactsDir, 'frame-wide-editor.png') });
        await page.getByRole('button', { name: 'Show clipping' }).click();
        await page.getByRole('button', { name: 'Show the one-stop lines' }).click();
        await page.waitForTimeout(400);
        await refined(page, 'frame-picture');
        await page.getByTestId('frame-picture').screenshot({ path: join(artifactsDir, `frame-${c.name}-clipping-stops.png`) });
        await page.getByRole('button', { name: 'Enlarge the frame' }).click();
        await refined(page, 'frame-picture-large');
        await page.screenshot({ path: join(artifactsDir, 'frame-wide-enlarged.png') });
        await page.getByRole('button', { name: 'Close the large frame' }).click();
        // Dragging a light redraws the frame while the hand still holds it (draft pictures), not only at release.
        // Snapping off: on the zoom's grid (0.5 m here) this short drag moves in one or two jumps, and the frame
        // would refine while the hand holds still between them; free, every move changes the plan.
        await page.getByRole('button', { name: 'Snapping on' }).click();
        await refined(page, 'frame-picture');
        const src = () => page.getByTestId('frame-picture-image').locator('img').getAttribute('src');
        const before = await src();
        const kick = (await page.getByTestId('item-kick').boundingBox())!;
        await page.mouse.move(kick.x + kick.width / 2, kick.y + kick.height / 2);
        await page.mouse.down();
        for (let k = 1; k <= 12; k++) await page.mouse.move(kick.x + kick.width / 2 + 4 * k, kick.y + kick.height / 2 + 2 * k);
        await expect.poll(() => page.getByTestId('frame-picture-quality').textContent(), { timeout: 30_000 }).toBe('draft');
        await expect.poll(src, { timeout: 30_000 }).not.toBe(before);
        await page.mouse.up();
      }
    }
    expect(workerUrls.some((u) => u.endsWith('/workers/frame.js'))).toBe(true);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('phone: a Frame tab of the sheet, and a full-screen view', async () => {
    const context = await newContext('phone');
    const page = await context.newPage();
    const errors = watchErrors(page);
    const made = await context.request.post(`${base}/api/setups`, { data: { title: 'Frame on a phone', document: washAndKicker }, headers: { origin: base } });
    const { id } = (await made.json()) as { id: string };
    await page.goto(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor({ timeout: 60_000 });
    await dragSheet(page, true);
    await page.getByRole('tab', { name: 'Frame' }).click();
    await refined(page, 'frame-picture');
    await page.screenshot({ path: join(artifactsDir, 'frame-phone-tab.png') });
    await page.getByRole('button', { name: 'Enlarge the frame' }).click();
    await refined(page, 'frame-picture-large');
    await page.screenshot({ path: join(artifactsDir, 'frame-phone-full.png') });
    expect(errors).toEqual([]);
    await context.close();
  });
});
