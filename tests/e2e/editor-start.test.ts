// The editor's first reading is never computed in the page's first render: the plan shows first, and every
// place that shows a reading says the meter is still reading (the phone's peek line, the meter panel) — no
// number, no "—" — until the numbers come, the same as the meter's own computation of the setup. With the
// meter's Web Worker held back (its script still on a slow line), the page computes the numbers itself after it
// has painted, and the light map (the worker's) follows once the worker is let through.
import { describe, expect, inject, it } from 'vitest';
import type { Page, Route } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { demoSetups } from '../../db/seed-setups';
import { parseDocument } from '../../model/document';
import { computeReadings } from '../../model/setupReadings';
import { formatAperture } from '../../model/units';
import { sharedBrowser, viewports, watchErrors, type ViewportName } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const PENDING = 'Reading the plan…';

/** Page-side: every text the element `testId` shows, in order, from the page's first byte (as text: the
 *  compiled test's helpers are not in the page). */
const recordTexts = (testIds: string[]) => `(() => {
  const seen = (window.__texts = {});
  const look = () => {
    for (const id of ${JSON.stringify(testIds)}) {
      const el = document.querySelector('[data-testid="' + id + '"]');
      const t = el ? el.textContent : null;
      const list = (seen[id] ??= []);
      if (t !== null && list[list.length - 1] !== t) list.push(t);
    }
  };
  new MutationObserver(look).observe(document, { subtree: true, childList: true, characterData: true });
})()`;
const texts = (page: Page, id: string) => page.evaluate(`window.__texts[${JSON.stringify(id)}] ?? []`) as Promise<string[]>;

/** A signed-in page with the meter worker's script held until `release()`, recording the meter's texts. */
async function heldWorkerPage(viewport: ViewportName) {
  const context = await browser().newContext({ viewport: viewports[viewport], serviceWorkers: 'block', ...(viewport === 'phone' ? { hasTouch: true, isMobile: true } : {}) });
  const page = await context.newPage();
  const errors = watchErrors(page);
  const headers = { origin: base };
  expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers })).status()).toBe(200);
  const doc = demoSetups[0]!.document;
  const made = await context.request.post(`${base}/api/setups`, { data: { title: `First reading ${viewport} ${Date.now()}`, document: doc }, headers });
  const { id } = (await made.json()) as { id: string };
  const held: Route[] = [];
  let released = false;
  await page.route('**/workers/meter.js', (route) => (released ? route.continue() : void held.push(route)));
  await page.addInitScript(recordTexts(['meter-peek', 'meter-pending', 'meter-subject']));
  const release = async () => {
    released = true;
    for (const r of held.splice(0)) await r.continue();
  };
  const subject = formatAperture(computeReadings(parseDocument(doc)).meter!.subject.aperture);
  return { context, page, errors, id, release, held, subject };
}

const planShown = (page: Page) => expect.poll(() => page.evaluate(`document.querySelectorAll('[data-testid="plan"] [data-testid^="item-"]').length`), { timeout: 30_000 }).toBeGreaterThan(0);
const mapLines = (page: Page) => page.evaluate(`document.querySelector('[data-testid="light-map-lines"]')?.innerHTML.length ?? 0`) as Promise<number>;

describe('the editor’s first reading', () => {
  it('on a phone: the peek says the meter is reading, then shows the numbers; the light map waits for the worker', async () => {
    const { context, page, errors, id, release, held, subject } = await heldWorkerPage('phone');
    await page.goto(`${base}/setups/${id}`);
    await planShown(page);
    // The worker was asked for (started early by the route) and is held.
    await expect.poll(() => held.length, { timeout: 10_000 }).toBeGreaterThan(0);
    // Numbers without the worker: the page computed them after its first paint.
    await expect.poll(() => page.getByTestId('meter-peek').textContent(), { timeout: 30_000 }).toMatch(new RegExp(`^Subject ${subject.replace(/[/.]/g, '\\$&')} `));
    const peeks = await texts(page, 'meter-peek');
    // The first thing the peek ever said: still reading (not a number computed in the first render, not "—").
    expect(peeks[0]).toBe(PENDING);
    expect(peeks.filter((t) => t !== PENDING && !t.startsWith('Subject '))).toEqual([]);
    expect((await texts(page, 'meter-pending'))[0]).toBe(PENDING);
    // No light map until the worker answers.
    expect(await mapLines(page)).toBe(0);
    await release();
    await expect.poll(() => mapLines(page), { timeout: 30_000 }).toBeGreaterThan(0);
    expect(await page.getByTestId('meter-peek').textContent()).toMatch(new RegExp(`^Subject ${subject.replace(/[/.]/g, '\\$&')} `));
    expect(errors).toEqual([]);
    await context.close();
  });

  it('on a wide screen: the meter panel says it is reading before it shows the subject', async () => {
    const { context, page, errors, id, release, subject } = await heldWorkerPage('wide');
    await page.goto(`${base}/setups/${id}`);
    await planShown(page);
    await expect.poll(() => page.getByTestId('meter-subject').first().textContent(), { timeout: 30_000 }).toBe(subject);
    expect((await texts(page, 'meter-pending'))[0]).toBe(PENDING);
    expect(await page.getByTestId('meter-pending').count()).toBe(0);
    await release();
    await expect.poll(() => mapLines(page), { timeout: 30_000 }).toBeGreaterThan(0);
    expect(await page.getByTestId('meter-subject').first().textContent()).toBe(subject);
    expect(errors).toEqual([]);
    await context.close();
  });
});
