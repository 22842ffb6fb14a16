// Two people on one setup: a save that crossed someone else's is never forced. The editor shows both
// versions and lets the user load theirs or keep their own as a copy.
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { sharedBrowser, shot, watchErrors } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();

const doc = {
  schemaVersion: 1,
  stage: { widthM: 6, depthM: 5 },
  items: [
    { id: 'sub', kind: 'subject', x: 3, y: 2, facingDeg: 90 },
    { id: 'key', kind: 'light', x: 3, y: 3.2, aimDeg: -90, source: { type: 'strobe', energyWs: 400 } },
  ],
};

async function openWithConflict(page: Page, title: string) {
  const ctx = page.context();
  const h = { origin: base };
  const me = await (await ctx.request.get(`${base}/api/me`)).json();
  const studioId = me.studios.find((s: { personal: boolean }) => !s.personal).id;
  const made = await ctx.request.post(`${base}/api/setups`, { data: { studioId, title, document: doc }, headers: h });
  const { id } = (await made.json()) as { id: string };
  await page.goto(`${base}/setups/${id}`);
  await page.getByTestId('item-key').waitFor();
  // Meanwhile, the associate saves from their own phone.
  const other = await browser().newContext();
  await other.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.editor.email, password: DEMO_PASSWORD }, headers: h });
  const put = await other.request.put(`${base}/api/setups/${id}`, { data: { version: 1, title: `${title} — theirs` }, headers: h });
  expect(put.status()).toBe(200);
  await other.close();
  // Now this user moves the key light: the autosave meets the other save.
  const key = (await page.getByTestId('item-key').boundingBox())!;
  await page.mouse.click(key.x + key.width / 2, key.y + key.height / 2);
  await page.keyboard.press('ArrowRight');
  await expect.poll(() => page.getByText('This setup was changed somewhere else while you worked.').isVisible(), { timeout: 10_000 }).toBe(true);
  return id;
}

describe('a save that crossed another', () => {
  it('shows both versions and loads theirs on request', async () => {
    const page = await browser().newPage({ viewport: { width: 1440, height: 900 } });
    const errors = watchErrors(page);
    await page.context().request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } });
    const id = await openWithConflict(page, 'Crossed saves');
    expect(await page.getByText(/Theirs: “Crossed saves — theirs”/).isVisible()).toBe(true);
    await shot(page, 'conflict-wide');
    await page.getByRole('button', { name: 'Load theirs' }).click();
    await expect.poll(() => page.getByText('Crossed saves — theirs').first().isVisible()).toBe(true);
    expect(await page.getByText('This setup was changed somewhere else while you worked.').count()).toBe(0);
    // Nothing was overwritten: the stored setup is theirs, with the key where it was.
    const stored = await (await page.context().request.get(`${base}/api/setups/${id}`)).json();
    expect(stored.title).toBe('Crossed saves — theirs');
    expect(stored.document.items.find((i: { id: string }) => i.id === 'key').x).toBe(3);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('keeps mine as a new setup, leaving theirs as it was', async () => {
    const page = await browser().newPage({ viewport: { width: 1440, height: 900 } });
    await page.context().request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } });
    const id = await openWithConflict(page, 'Crossed again');
    await page.getByRole('button', { name: 'Keep mine as a copy' }).click();
    await expect.poll(() => page.url(), { timeout: 10_000 }).not.toContain(id);
    const copyId = page.url().split('/').pop()!;
    const copy = await (await page.context().request.get(`${base}/api/setups/${copyId}`)).json();
    expect(copy.title).toBe('Crossed again (my version)');
    expect(copy.document.items.find((i: { id: string }) => i.id === 'key').x).toBeCloseTo(3.1);
    const theirs = await (await page.context().request.get(`${base}/api/setups/${id}`)).json();
    expect(theirs.title).toBe('Crossed again — theirs');
    await page.close();
  });
});
