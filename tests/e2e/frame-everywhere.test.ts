// The frame where the plan goes beyond the editor: the share page (no account), and the lesson player, where
// the frame follows the steps (the picture changes as a light is added). Rendered in the browser's Web Worker.
// Screenshots in tests/.artifacts/.
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { demoSetups } from '../../db/seed-setups';
import { artifactsDir, sharedBrowser, viewports, watchErrors } from '../support/browser';
import { washAndKicker } from '../support/frameLooks';

const base = inject('baseUrl');
const browser = sharedBrowser();
const headers = { origin: base };

async function refined(page: Page, testId: string) {
  await expect.poll(async () => (await page.getByTestId(`${testId}-quality`).first().textContent().catch(() => '')) ?? '', { interval: 250, timeout: 90_000 }).toMatch(/px/);
  await expect.poll(() => page.getByTestId(`${testId}-image`).first().locator('img').evaluate((i: HTMLImageElement) => i.complete && i.naturalWidth > 0).catch(() => false), { timeout: 30_000 }).toBe(true);
}

async function signedIn(vp: keyof typeof viewports): Promise<BrowserContext> {
  const context = await browser().newContext({ viewport: viewports[vp], deviceScaleFactor: 1 });
  const r = await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers });
  expect(r.status()).toBe(200);
  return context;
}

async function post<T>(c: BrowserContext, path: string, data: unknown): Promise<T> {
  const r = await c.request.post(`${base}/api${path}`, { data, headers });
  expect(r.ok(), await r.text()).toBe(true);
  return (await r.json()) as T;
}

/** The decoded picture's pixels as a data URL's bytes (what the page shows). */
const pictureOf = (page: Page, testId: string) => page.getByTestId(`${testId}-image`).first().locator('img').evaluate((i: HTMLImageElement) => i.currentSrc || i.src);

describe('the frame beyond the editor', () => {
  it('the share page shows the frame to anyone with the link, with the line on what it does not model', async () => {
    const owner = await signedIn('wide');
    const setup = await post<{ id: string }>(owner, '/setups', { title: 'Frame on the share page', document: washAndKicker });
    const share = await post<{ token: string }>(owner, `/setups/${setup.id}/shares`, { label: 'Crew' });
    await owner.close();
    const anyone = await browser().newContext({ viewport: viewports.phone, deviceScaleFactor: 1 });
    const page = await anyone.newPage();
    const errors = watchErrors(page);
    await page.goto(`${base}/s/${share.token}`);
    await page.getByTestId('shared-frame-view').waitFor({ timeout: 60_000 });
    await page.getByTestId('shared-frame-view').scrollIntoViewIfNeeded();
    await refined(page, 'shared-frame-picture');
    expect(await page.getByTestId('shared-frame-limits').textContent()).toMatch(/lens flare/);
    await page.getByTestId('shared-frame-view').screenshot({ path: join(artifactsDir, 'frame-share-page-phone.png') });
    expect(errors).toEqual([]);
    await anyone.close();
  });

  it('the lesson player shows the frame at each step: the picture changes when the next light comes in', async () => {
    const teacher = await signedIn('wide');
    const teal = demoSetups.find((s) => s.title.startsWith('Teal'))!;
    expect(teal.document.steps.length).toBeGreaterThanOrEqual(2);
    const setup = await post<{ id: string }>(teacher, '/setups', { title: 'Frame by steps', document: teal.document });
    const klass = await post<{ id: string }>(teacher, '/classes', { name: 'Frame class' });
    const lesson = await post<{ id: string }>(teacher, `/classes/${klass.id}/lessons`, { title: 'Watch the frame fill in' });
    await post(teacher, `/lessons/${lesson.id}/setups`, { setupId: setup.id });
    const page = await teacher.newPage();
    const errors = watchErrors(page);
    await page.goto(`${base}/lessons/${lesson.id}`);
    await page.getByTestId('player-frame-view').waitFor({ timeout: 60_000 });
    await expect.poll(() => page.getByTestId('player-position').first().textContent()).toMatch(/step 1 of/);
    await refined(page, 'player-frame-picture');
    const first = await pictureOf(page, 'player-frame-picture');
    await page.getByTestId('player-frame-view').screenshot({ path: join(artifactsDir, 'frame-lesson-step1.png') });
    await page.keyboard.press('ArrowRight');
    await expect.poll(() => page.getByTestId('player-position').first().textContent()).toMatch(/step 2 of/);
    await expect.poll(() => page.getByTestId('player-frame-picture-quality').first().textContent(), { timeout: 90_000 }).toMatch(/px/);
    await expect.poll(() => pictureOf(page, 'player-frame-picture'), { timeout: 90_000 }).not.toBe(first);
    await refined(page, 'player-frame-picture');
    await page.getByTestId('player-frame-view').screenshot({ path: join(artifactsDir, 'frame-lesson-step2.png') });
    expect(errors).toEqual([]);
    await teacher.close();
  });
});
