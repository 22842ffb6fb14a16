// A class review compares pictures, not only numbers: the student's frame beside the reference's, rendered in
// the browser's Web Worker, with one set of looks for both. The reference keys from camera left, the student
// moved the key to camera right: each frame is brighter on its key's side, and black and white changes both.
// The plans are made through the API; the review is the instructor's page in Chromium. Screenshot in
// tests/.artifacts/frame-review-side-by-side.png.
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { artifactsDir, sharedBrowser, viewports, watchErrors } from '../support/browser';
import { freshEmail } from '../support/http';

const base = inject('baseUrl');
const browser = sharedBrowser();
const headers = { origin: base };
const PASSWORD = 'e2e-frame-review-1';

/** Our own small set: grey paper, a sitter facing the lens, one key 45° to the side given (−1 left, +1 right). */
const plan = (side: -1 | 1) => ({
  schemaVersion: 1,
  stage: { widthM: 8, depthM: 6 },
  items: [
    { id: 'paper', kind: 'wall', label: 'Grey paper', surface: 'seamless', a: { x: 2, y: 1 }, b: { x: 6, y: 1 }, heightM: 2.7, colour: '#8a8a8a' },
    { id: 'sitter', kind: 'subject', label: 'Sitter', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 4, y: 5.4, heightM: 1.6, aimDeg: -90, focalMm: 85, iso: 100, aperture: 8, shutterS: 1 / 200 },
    { id: 'key', kind: 'light', label: 'Key', x: 4 + side * 1.1, y: 4.1, heightM: 1.9, aimDeg: side < 0 ? -45 : -135, tiltDeg: -10, source: { type: 'strobe', energyWs: 400 }, power: 1 / 8, modifier: 'bare-reflector' },
  ],
  steps: [],
});

type Json = any;

async function person(name: string): Promise<{ context: BrowserContext; name: string; api: (method: string, path: string, data?: unknown) => Promise<Json> }> {
  const context = await browser().newContext({ viewport: viewports.wide, deviceScaleFactor: 1 });
  const email = freshEmail(name.split(' ')[0]!.toLowerCase());
  expect((await context.request.post(`${base}/api/auth/sign-up/email`, { data: { name, email, password: PASSWORD }, headers })).status()).toBe(200);
  expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email, password: PASSWORD }, headers })).status()).toBe(200);
  const api = async (method: string, path: string, data?: unknown) => {
    const r = await context.request.fetch(`${base}/api${path}`, { method, data, headers });
    expect(r.ok(), `${method} ${path}: ${await r.text()}`).toBe(true);
    return r.json();
  };
  return { context, name, api };
}

async function refined(page: Page, testId: string) {
  await expect.poll(async () => (await page.getByTestId(`${testId}-quality`).first().textContent().catch(() => '')) ?? '', { interval: 250, timeout: 120_000 }).toMatch(/px/);
  await expect.poll(() => page.getByTestId(`${testId}-image`).first().locator('img').evaluate((i: HTMLImageElement) => i.complete && i.naturalWidth > 0).catch(() => false), { timeout: 30_000 }).toBe(true);
}

/** The RGBA pixels of the picture a frame view shows (drawn from its <img> onto a canvas in the page). */
function shownPixels(page: Page, testId: string): Promise<{ width: number; height: number; data: number[]; src: string }> {
  return page
    .getByTestId(`${testId}-image`)
    .first()
    .locator('img')
    .evaluate((img: HTMLImageElement) => {
      const c = document.createElement('canvas');
      c.width = img.naturalWidth;
      c.height = img.naturalHeight;
      const g = c.getContext('2d')!;
      g.drawImage(img, 0, 0);
      return { width: c.width, height: c.height, data: Array.from(g.getImageData(0, 0, c.width, c.height).data), src: img.currentSrc || img.src };
    });
}

/**
 * Mean luminance (0–255) of the left and right halves of the face in the picture the page shows: a band 12 %
 * of the width either side of the centre line, 40–60 % down (the sitter is centred, face at lens height; the
 * key's spill on the paper behind lands on the other side, so the whole picture's halves would not tell).
 */
async function halves(page: Page, testId: string): Promise<{ left: number; right: number; src: string }> {
  const { width, height, data: d, src } = await shownPixels(page, testId);
  let l = 0;
  let r = 0;
  let nl = 0;
  let nr = 0;
  for (let y = Math.round(height * 0.4); y < height * 0.6; y++)
    for (let x = Math.round(width * 0.38); x < width * 0.62; x++) {
      const i = (y * width + x) * 4;
      const v = 0.2126 * d[i]! + 0.7152 * d[i + 1]! + 0.0722 * d[i + 2]!;
      if (x < width / 2) {
        l += v;
        nl++;
      } else {
        r += v;
        nr++;
      }
    }
  return { left: l / nl, right: r / nr, src };
}

/** Largest difference between a pixel's channels in the picture shown: 0 when it is all grey. */
async function colourfulness(page: Page, testId: string): Promise<number> {
  const { data: d } = await shownPixels(page, testId);
  let off = 0;
  for (let i = 0; i < d.length; i += 4) off = Math.max(off, Math.abs(d[i]! - d[i + 1]!), Math.abs(d[i + 1]! - d[i + 2]!));
  return off;
}

describe('the review shows the frames side by side', () => {
  it("the student's frame beside the reference's: each lit from its own key's side, one set of looks for both", async () => {
    const teacher = await person('Noor Teacher');
    const student = await person('Pim Student');
    const reference = await teacher.api('POST', '/setups', { title: 'Key from camera left', document: plan(-1) });
    const klass = await teacher.api('POST', '/classes', { name: 'Frame review class' });
    const lesson = await teacher.api('POST', `/classes/${klass.id}/lessons`, { title: 'One key, 45°' });
    await teacher.api('POST', `/lessons/${lesson.id}/setups`, { setupId: reference.id });
    await teacher.api('PATCH', `/lessons/${lesson.id}`, { published: true });
    const assignment = await teacher.api('POST', `/lessons/${lesson.id}/assignments`, { title: 'Key at 45°', brief: 'One key, 45° to the side.', check: { criteria: [{ measure: 'lights', min: null, max: 1 }] } });

    await student.api('POST', '/classes/join', { code: klass.joinCode });
    const start = await student.api('POST', `/assignments/${assignment.id}/start`, { from: 'reference' });
    const mine = await student.api('GET', `/setups/${start.setupId}`);
    await student.api('PUT', `/setups/${start.setupId}`, { version: mine.version, document: plan(1) });
    const submission = await student.api('POST', `/assignments/${assignment.id}/submissions`);
    await student.context.close();

    const page = await teacher.context.newPage();
    const errors = watchErrors(page);
    await page.goto(`${base}/submissions/${submission.id}`);
    const pair = page.getByTestId('review-frames');
    await pair.waitFor({ timeout: 90_000 });
    await pair.scrollIntoViewIfNeeded();
    await refined(page, 'review-frames-left');
    await refined(page, 'review-frames-right');
    expect(await pair.textContent()).toContain('Pim Student’s plan');
    expect(await pair.textContent()).toContain('Reference: Key from camera left');

    // Left: the student's (key at camera right); right: the reference (key at camera left).
    const theirs = await halves(page, 'review-frames-left');
    const ref = await halves(page, 'review-frames-right');
    expect(theirs.src).not.toBe(ref.src);
    expect(theirs.right).toBeGreaterThan(theirs.left * 1.1);
    expect(ref.left).toBeGreaterThan(ref.right * 1.1);
    await pair.screenshot({ path: join(artifactsDir, 'frame-review-side-by-side.png') });

    // One look for both: black and white turns both pictures grey.
    await pair.getByLabel('Colour, switch to black and white', { exact: true }).first().click();
    const grey = (testId: string) => colourfulness(page, testId).catch(() => 255);
    await expect.poll(() => grey('review-frames-left'), { interval: 500, timeout: 120_000 }).toBe(0);
    await expect.poll(() => grey('review-frames-right'), { interval: 500, timeout: 120_000 }).toBe(0);
    await refined(page, 'review-frames-left');
    await pair.screenshot({ path: join(artifactsDir, 'frame-review-side-by-side-mono.png') });
    expect(errors).toEqual([]);
    await teacher.context.close();
  });
});
