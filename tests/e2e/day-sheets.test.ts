// Sheets for a shoot day, from the library in Chromium: pick setups by tapping them in shooting order (each
// card shows its place), change the order by taking one out and tapping it again, name the day, and get one
// PDF whose cover lists them in that order before their crew sheets.
import { readFileSync } from 'node:fs';
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { pdfText } from '../api/exports.helpers';
import { sharedBrowser, shot, viewports, watchErrors } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();

const doc = {
  schemaVersion: 1,
  stage: { widthM: 5, depthM: 4 },
  items: [
    { id: 'sub', kind: 'subject', x: 2.5, y: 1.8, facingDeg: 90 },
    { id: 'key', kind: 'light', x: 1.6, y: 2.8, aimDeg: -45, source: { type: 'strobe', energyWs: 300 } },
  ],
};

describe('day sheets', () => {
  it('makes one PDF of the setups picked, in the order picked, behind a cover', async () => {
    const ctx = await browser().newContext({ viewport: viewports.wide, acceptDownloads: true });
    const h = { origin: base };
    await ctx.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: h });
    const me = await (await ctx.request.get(`${base}/api/me`)).json();
    const studioId = me.studios.find((s: { personal: boolean }) => !s.personal).id;
    const stamp = Date.now().toString(36);
    const titles = [`Dawn pier ${stamp}`, `Noon market ${stamp}`, `Dusk bridge ${stamp}`];
    for (const title of titles) expect((await ctx.request.post(`${base}/api/setups`, { data: { studioId, title, document: doc }, headers: h })).status()).toBe(201);

    const page = await ctx.newPage();
    const errors = watchErrors(page);
    await page.goto(`${base}/setups`);
    // The card's title row: its link (named by the title) and, beside it, the pick number.
    const card = (t: string) => page.getByTestId('setup-card-title-row').filter({ has: page.getByRole('link', { name: t, exact: true }) });
    await card(titles[0]!).waitFor({ timeout: 30_000 });
    await page.getByTestId('pick-day').click();
    await expect.poll(() => page.getByTestId('day-sheet-bar').innerText()).toContain('Tap setups in shooting order');

    // Tap: noon, dawn, dusk; then take dawn out and tap it again — the order is noon, dusk, dawn.
    for (const t of [titles[1]!, titles[0]!, titles[2]!]) await card(t).click();
    await expect.poll(() => card(titles[0]!).getByTestId('picked-no').innerText()).toBe('2');
    await card(titles[0]!).click();
    await expect.poll(() => card(titles[0]!).getByTestId('picked-no').count()).toBe(0);
    expect(await card(titles[2]!).getByTestId('picked-no').innerText()).toBe('2');
    await card(titles[0]!).click();
    await expect.poll(() => card(titles[0]!).getByTestId('picked-no').innerText()).toBe('3');
    expect(await card(titles[1]!).getByTestId('picked-no').innerText()).toBe('1');
    expect(await page.getByTestId('day-sheet-bar').innerText()).toContain('3 chosen, in the order tapped');
    await page.getByLabel('Name of the shoot day').fill('Harbour walk');
    await shot(page, 'day-sheets-picked-wide');

    const [download] = await Promise.all([page.waitForEvent('download', { timeout: 60_000 }), page.getByTestId('make-day-sheets').click()]);
    const { text, pages } = await pdfText(readFileSync((await download.path())!));
    expect(pages).toBeGreaterThanOrEqual(4); // a cover and at least a page per setup
    expect(text).toContain('Harbour walk');
    const at = (k: number) => text.indexOf(`${k}. ${[titles[1], titles[2], titles[0]][k - 1]}`);
    expect(at(1)).toBeGreaterThan(-1);
    expect(at(2)).toBeGreaterThan(at(1));
    expect(at(3)).toBeGreaterThan(at(2));
    // Each crew sheet follows the cover in that order.
    const sheetsStart = at(3) + 10;
    const first = (t: string) => text.indexOf(t, sheetsStart);
    expect(first(titles[1]!)).toBeGreaterThan(-1);
    expect(first(titles[2]!)).toBeGreaterThan(first(titles[1]!));
    expect(first(titles[0]!)).toBeGreaterThan(first(titles[2]!));

    await page.getByRole('button', { name: 'Done' }).click();
    await expect.poll(() => page.getByTestId('day-sheet-bar').count()).toBe(0);
    expect(errors).toEqual([]);
    await ctx.close();
  });
});
