// A read-only link in Chromium: a photographer makes a link to a setup; on a phone (390 × 844) with no
// account the link shows the plan, the kit with power settings and the safety notes, and downloads the crew
// sheet PDF; once withdrawn, the same link opens nothing. Screenshots of the page and the sheet go to
// tests/.artifacts for a person to look at.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { demoSetups } from '../../db/seed-setups';
import { artifactsDir, launch, shot, viewports, watchErrors } from '../support/browser';
import { freshEmail } from '../support/http';

const base = inject('baseUrl');
let browser: Browser;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ browser, close } = await launch());
});
afterAll(async () => close?.());

/** For a person to look at: the PDF's first page as a PNG, when poppler's pdftoppm is installed (tests do not need it). */
function sheetPicture(pdfPath: string, name: string) {
  if (!existsSync('/usr/bin/pdftoppm')) return;
  execFileSync('/usr/bin/pdftoppm', ['-png', '-r', '110', '-f', '1', '-l', '1', '-singlefile', pdfPath, join(artifactsDir, name)]);
}

describe('a read-only link', () => {
  it('opens on a phone signed out, downloads the crew sheet, and stops working when withdrawn', async () => {
    // The photographer, through the API: an account, a setup and a link.
    const studio = await browser.newContext();
    const headers = { origin: base };
    const maraEmail = freshEmail('mara');
    const signUp = await studio.request.post(`${base}/api/auth/sign-up/email`, { data: { name: 'Mara Quill', email: maraEmail, password: 'share-test-pass-1' }, headers });
    expect(signUp.status()).toBe(200);
    expect((await studio.request.post(`${base}/api/auth/sign-in/email`, { data: { email: maraEmail, password: 'share-test-pass-1' }, headers })).status()).toBe(200);
    const teal = demoSetups.find((s) => s.title.startsWith('Teal'))!;
    const setup = await (await studio.request.post(`${base}/api/setups`, { data: { title: 'Album cover, teal glow', notes: teal.notes, document: teal.document }, headers })).json();
    const made = await studio.request.post(`${base}/api/setups/${setup.id}/shares`, { data: { label: 'Assistants' }, headers });
    expect(made.status()).toBe(201);
    const { url, share } = await made.json();

    // The assistant's phone: a fresh browser with no cookies.
    const phone = await browser.newContext({ viewport: viewports.phone, isMobile: true, hasTouch: true, acceptDownloads: true });
    const page = await phone.newPage();
    const errors = watchErrors(page);
    await page.goto(url);
    await expect.poll(() => page.getByText('Album cover, teal glow').isVisible(), { timeout: 15_000 }).toBe(true);
    expect(await page.getByTestId('shared-camera').textContent()).toBe('f/5.6 · 1/200 · ISO 200');
    // The kit and what follows render just after the top of the page (components/crew/SharedSetupScreen.tsx).
    await expect.poll(() => page.getByTestId('shared-light').count()).toBe(2);
    expect(await page.getByText('Key — warm softbox').first().isVisible()).toBe(true);
    expect(await page.getByTestId('item-key').count()).toBe(1); // the plan is drawn, read-only
    await shot(page, 'share-phone-top');
    await page.getByText('Safety', { exact: true }).scrollIntoViewIfNeeded();
    expect(await page.getByText(/venue’s own rules/).isVisible()).toBe(true);
    await page.screenshot({ path: join(artifactsDir, 'share-phone-full.png'), fullPage: true });

    // Download the crew sheet: a real PDF with the kit in it.
    await page.getByTestId('download-pdf').scrollIntoViewIfNeeded();
    const [download] = await Promise.all([page.waitForEvent('download', { timeout: 30_000 }), page.getByTestId('download-pdf').click()]);
    expect(download.suggestedFilename()).toBe('crew-sheet-album-cover-teal-glow.pdf');
    const pdf = readFileSync((await download.path())!);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    mkdirSync(artifactsDir, { recursive: true });
    const pdfPath = join(artifactsDir, 'share-crew-sheet.pdf');
    writeFileSync(pdfPath, pdf);
    sheetPicture(pdfPath, 'share-crew-sheet');
    expect(errors).toEqual([]);

    // Withdrawn: the same link, reloaded, opens nothing.
    expect((await studio.request.delete(`${base}/api/setups/${setup.id}/shares/${share.id}`, { headers })).status()).toBe(204);
    await page.reload();
    await expect.poll(() => page.getByText('This link opens nothing').isVisible(), { timeout: 15_000 }).toBe(true);
    await shot(page, 'share-phone-withdrawn');
    await phone.close();
    await studio.close();
  });
});
