// Talking through a share link in Chromium. A crew member of the studio, signed in on a phone (390 × 844,
// touch), opens the read-only link the photographer sent, pins a question to a light on the comment plan there
// and downloads the crew sheet; the photographer on a wide screen (1440 × 900) finds the pin on the light in the
// editor, replies and resolves. Times read as the app's one formatter writes them ("today, 4:18 PM"), never a
// padded "04:18 PM".
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BrowserContext, Locator } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { pdfText } from '../api/exports.helpers';
import { artifactsDir, sharedBrowser, shot, viewports, watchErrors } from '../support/browser';
import { Client, freshEmail } from '../support/http';

const base = inject('baseUrl');
const browser = sharedBrowser();
const PASSWORD = 'e2e-comments-share-1';
const word = Date.now().toString(36);
/** "today, 4:18 PM" in en-US: no leading zero on a 12-hour clock. */
const TODAY = /today, (?:[1-9]|1[0-2]):[0-5]\d\s?[AP]M/;

const doc = {
  schemaVersion: 1,
  stage: { widthM: 7, depthM: 6 },
  items: [
    { id: 'muslin', kind: 'wall', label: 'Grey muslin', surface: 'seamless', a: { x: 1.5, y: 1 }, b: { x: 5.5, y: 1 }, heightM: 2.7, colour: '#7a7874' },
    { id: 'cellist', kind: 'subject', label: 'Cellist', x: 3.5, y: 3, facingDeg: 90, faceHeightM: 1.2, pose: 'seated' },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 3.5, y: 5.4, heightM: 1.2, aimDeg: -90, iso: 100, aperture: 5.6, shutterS: 1 / 160 },
    { id: 'key', kind: 'light', label: 'Key octa', x: 2.2, y: 3.9, heightM: 2.1, aimDeg: -35, tiltDeg: -15, source: { type: 'strobe', energyWs: 500 }, power: 1 / 4, modifier: 'octa' },
    { id: 'hair', kind: 'light', label: 'Hair strip', x: 4.6, y: 1.8, heightM: 2.4, aimDeg: 135, tiltDeg: -30, source: { type: 'strobe', energyWs: 400 }, power: 1 / 16, modifier: 'strip' },
  ],
};

async function person(vp: keyof typeof viewports, name: string, touch = false) {
  const context = await browser().newContext({ viewport: viewports[vp], locale: 'en-US', acceptDownloads: true, ...(touch ? { isMobile: true, hasTouch: true } : {}) });
  const email = freshEmail(name.split(' ')[0]!.toLowerCase());
  const r = await context.request.post(`${base}/api/auth/sign-up/email`, { data: { name, email, password: PASSWORD }, headers: { origin: base } });
  expect(r.status()).toBe(200);
  const link = await new Client(base).mailedLink(email, '/api/auth/verify-email');
  expect((await context.request.get(link)).ok()).toBe(true);
  const page = await context.newPage();
  return { context, page, email, errors: watchErrors(page), send: sender(context) };
}
const sender = (c: BrowserContext) => async (method: 'POST' | 'PUT', path: string, data: unknown) => {
  const r = await c.request.fetch(`${base}/api${path}`, { method, data, headers: { origin: base } });
  expect(r.ok(), await r.text()).toBe(true);
  return r.json();
};
async function centreOf(l: Locator) {
  const b = (await l.boundingBox())!;
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}

describe('comments through a share link', () => {
  it('crew on a phone pins a question to a light from the link; the photographer replies and resolves', { timeout: 400_000 }, async () => {
    const owner = await person('wide', 'Odile Photographer');
    const crew = await person('phone', 'Tomas Assistant', true);
    const studio = await owner.send('POST', '/studios', { name: `Quay ${word}` });
    const inv = await owner.send('POST', `/studios/${studio.id}/members`, { email: crew.email, role: 'crew' });
    await crew.send('POST', `/invitations/${inv.link.slice(inv.link.lastIndexOf('/') + 1)}/accept`, {});
    const setup = await owner.send('POST', '/setups', { studioId: studio.id, title: `Cello portrait ${word}`, notes: 'Chair at the tape cross; cello spike on the rubber mat.', document: doc });
    const { url } = await owner.send('POST', `/setups/${setup.id}/shares`, { label: 'Crew' });

    // ---- The crew member's phone: the link, the comment plan, a pinned question ----
    const p = crew.page;
    await p.goto(url);
    const comments = p.getByTestId('comments');
    await comments.waitFor({ timeout: 30_000 });
    const plan = p.getByTestId('comment-plan');
    await expect.poll(() => plan.getByTestId('pin-item-hair').count(), { timeout: 15_000 }).toBe(1);
    await plan.scrollIntoViewIfNeeded();
    const hairAt = await centreOf(plan.getByTestId('pin-item-hair'));
    await p.touchscreen.tap(hairAt.x, hairAt.y);
    await expect.poll(() => p.getByTestId('comment-pin-target').textContent()).toBe('Pinned on Hair strip');
    await p.getByLabel('New comment').fill('The boom arm will not reach 2.4 m over the muslin. Lower to 2.2 m?');
    await p.getByTestId('add-comment').tap();
    const thread = p.getByTestId('comment-thread');
    await thread.getByRole('button', { name: 'Reply' }).waitFor({ timeout: 15_000 });
    expect(await thread.textContent()).toContain('Tomas Assistant · on Hair strip');
    expect(await thread.textContent()).toMatch(TODAY);
    expect(await thread.textContent()).not.toMatch(/\b0\d:\d\d\s?[AP]M/);
    await thread.scrollIntoViewIfNeeded();
    await shot(p, 'comments-share-phone-asks');

    // The crew sheet from the same page: a real PDF with the notes and the lights to rig.
    await p.getByTestId('download-pdf').scrollIntoViewIfNeeded();
    const [download] = await Promise.all([p.waitForEvent('download', { timeout: 60_000 }), p.getByTestId('download-pdf').tap()]);
    const pdf = readFileSync((await download.path())!);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const { text } = await pdfText(pdf);
    for (const s of ['Chair at the tape cross', 'Key octa', 'Hair strip', 'to the subject', 'Rigging, in order', 'Safety']) expect(text).toContain(s);
    mkdirSync(artifactsDir, { recursive: true });
    writeFileSync(join(artifactsDir, 'comments-share-crew-sheet.pdf'), pdf);

    // ---- The photographer, wide: the pin on the light, a reply, resolved ----
    const o = owner.page;
    await o.goto(`${base}/setups/${setup.id}`);
    await o.getByTestId('plan').waitFor({ timeout: 30_000 });
    const othread = o.getByTestId('comment-thread');
    await expect.poll(() => othread.count(), { timeout: 20_000 }).toBe(1);
    const pin = await centreOf(o.getByTestId('comment-plan').getByLabel('Comment 1'));
    const light = await centreOf(o.getByTestId('comment-plan').getByTestId('pin-item-hair'));
    expect(Math.abs(pin.x - light.x)).toBeLessThan(20);
    expect(Math.abs(pin.y - light.y)).toBeLessThan(40);
    await othread.getByRole('button', { name: 'Reply' }).click();
    await o.getByLabel('Your reply').fill('Yes, 2.2 m; tilt it down a touch more.');
    await o.getByRole('button', { name: 'Send the reply' }).click();
    await expect.poll(() => o.getByTestId('comment-reply').count(), { timeout: 15_000 }).toBe(1);
    await expect.poll(() => othread.getByRole('button', { name: 'Reply' }).count(), { timeout: 15_000 }).toBe(1);
    expect(await o.getByTestId('comment-reply').textContent()).toMatch(TODAY);
    await othread.scrollIntoViewIfNeeded();
    await shot(o, 'comments-share-wide-reply');
    await othread.getByRole('button', { name: 'Resolve' }).click();
    await expect.poll(() => o.getByText('Show resolved (1)').count(), { timeout: 15_000 }).toBe(1);

    // ---- Back on the phone: the answer, under "resolved" ----
    await p.reload();
    await p.getByTestId('comments').waitFor({ timeout: 30_000 });
    await p.getByText('Show resolved (1)').tap();
    await expect.poll(() => p.getByTestId('comment-reply').count(), { timeout: 15_000 }).toBe(1);
    expect(await p.getByTestId('comment-thread').textContent()).toMatch(new RegExp(`Resolved by Odile Photographer · ${TODAY.source}`));
    await p.getByTestId('comment-reply').scrollIntoViewIfNeeded();
    await shot(p, 'comments-share-phone-answer');

    expect(owner.errors).toEqual([]);
    expect(crew.errors).toEqual([]);
    await owner.context.close();
    await crew.context.close();
  });
});
