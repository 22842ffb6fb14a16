// A real two-finger pinch on a phone (390 × 844, touch), driven through the browser's own touch input (two
// touch points at once), on the editor and on the share page: the plan point under the fingers' midpoint stays
// under it within a few pixels while the plan zooms. Where the plan point is comes from two item markers on
// the plan (the subject and the camera), whose spacing gives the zoom.
import { describe, expect, inject, it } from 'vitest';
import type { CDPSession, Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { demoSetups } from '../../db/seed-setups';
import { sharedBrowser, shot, viewports, watchErrors } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const doc = demoSetups[0]!.document;
const subjectId = doc.items.find((i) => i.kind === 'subject')!.id;
const cameraId = doc.items.find((i) => i.kind === 'camera')!.id;

async function centre(page: Page, id: string) {
  const box = await page.getByTestId('plan').first().getByTestId(`item-${id}`).boundingBox();
  if (!box) throw new Error(`${id} is not on screen`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

/** Two fingers down either side of `mid`, `from` px apart, spread to `to` px apart in `steps` moves, lifted. */
async function pinch(cdp: CDPSession, mid: { x: number; y: number }, from: number, to: number, steps = 12) {
  const points = (gap: number) => [
    { x: mid.x - gap / 2, y: mid.y, id: 1, radiusX: 4, radiusY: 4, force: 1 },
    { x: mid.x + gap / 2, y: mid.y, id: 2, radiusX: 4, radiusY: 4, force: 1 },
  ];
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: points(from) });
  for (let k = 1; k <= steps; k++) {
    await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: points(from + ((to - from) * k) / steps) });
    await new Promise((r) => setTimeout(r, 30));
  }
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });
}

/** Pinch about a point beside the subject and check the plan point under the fingers stayed there. */
async function pinchKeepsPoint(page: Page, name: string) {
  const cdp = await page.context().newCDPSession(page);
  const s0 = await centre(page, subjectId);
  const c0 = await centre(page, cameraId);
  const mid = { x: s0.x + 24, y: s0.y - 12 };
  await pinch(cdp, mid, 60, 150);
  // The zoom, from the markers' spacing once the plan has settled.
  let k = 1;
  await expect
    .poll(
      async () => {
        const s1 = await centre(page, subjectId);
        const c1 = await centre(page, cameraId);
        k = Math.hypot(c1.x - s1.x, c1.y - s1.y) / Math.hypot(c0.x - s0.x, c0.y - s0.y);
        return k;
      },
      { timeout: 10_000 },
    )
    .toBeGreaterThan(1.6);
  const s1 = await centre(page, subjectId);
  // The subject sat (s0 − mid) from the fingers' midpoint; after a zoom by k about that point it sits k times as far.
  const want = { x: mid.x + (s0.x - mid.x) * k, y: mid.y + (s0.y - mid.y) * k };
  const off = Math.hypot(s1.x - want.x, s1.y - want.y);
  console.log(`[pinch] ${name}: zoom ×${k.toFixed(2)}, the point under the fingers moved ${off.toFixed(1)} px`);
  expect(off).toBeLessThan(6);
  await shot(page, `pinch-${name}`);
  await cdp.detach();
}

describe('a two-finger pinch on a phone', () => {
  it('keeps the plan point under the fingers, on the editor and on the share page', async () => {
    const context = await browser().newContext({ viewport: viewports.phone, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const errors = watchErrors(page);
    const headers = { origin: base };
    expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers })).status()).toBe(200);
    const setup = await (await context.request.post(`${base}/api/setups`, { data: { title: 'Pinch check', document: doc }, headers })).json();
    await page.goto(`${base}/setups/${setup.id}`);
    await page.getByTestId('plan').first().getByTestId(`item-${subjectId}`).waitFor({ timeout: 30_000 });
    await pinchKeepsPoint(page, 'editor');

    const made = await context.request.post(`${base}/api/setups/${setup.id}/shares`, { data: { label: 'Pinch' }, headers });
    expect(made.status()).toBe(201);
    const { url } = await made.json();
    const viewer = await browser().newContext({ viewport: viewports.phone, isMobile: true, hasTouch: true });
    const share = await viewer.newPage();
    const shareErrors = watchErrors(share);
    await share.goto(url);
    await share.getByTestId('plan').first().getByTestId(`item-${subjectId}`).waitFor({ timeout: 30_000 });
    await share.getByTestId('shared-plan').scrollIntoViewIfNeeded();
    await pinchKeepsPoint(share, 'share');
    expect(errors).toEqual([]);
    expect(shareErrors).toEqual([]);
    await viewer.close();
    await context.close();
  });
});
