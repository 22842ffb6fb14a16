// Talking on set in Chromium. A crew member on a phone (390 × 844, touch) opens the studio's setup, taps the
// rim light on the comment plan and asks about it; the photographer on a wide screen sees "1 new" on the
// setup in the library, opens it, finds the numbered pin on the light, replies and resolves the thread; the
// crew member sees the reply and the resolved state. The studio, its crew member and the setup are made
// through the API; the talking is the UI.
import type { BrowserContext, Locator, Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { dragSheet, sharedBrowser, shot, viewports, watchErrors } from '../support/browser';
import { freshEmail, Client } from '../support/http';

const base = inject('baseUrl');
const browser = sharedBrowser();
const PASSWORD = 'e2e-comments-pass-1';
const word = Date.now().toString(36);

const doc = {
  schemaVersion: 1,
  stage: { widthM: 8, depthM: 6 },
  items: [
    { id: 'paper', kind: 'wall', label: 'Black paper', surface: 'seamless', a: { x: 2, y: 1 }, b: { x: 6, y: 1 }, heightM: 2.7, colour: '#202020' },
    { id: 'runner', kind: 'subject', label: 'Runner', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.7 },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 4, y: 5.6, heightM: 1.5, aimDeg: -90, iso: 100, aperture: 8, shutterS: 1 / 200 },
    { id: 'rim', kind: 'light', label: 'Rim left', x: 2.4, y: 2.2, heightM: 1.9, aimDeg: 30, tiltDeg: -5, source: { type: 'strobe', energyWs: 400 }, power: 1 / 8, modifier: 'strip' },
  ],
};

async function person(vp: keyof typeof viewports, name: string, touch = false) {
  const context = await browser().newContext({ viewport: viewports[vp], ...(touch ? { isMobile: true, hasTouch: true } : {}) });
  const email = freshEmail(name.split(' ')[0]!.toLowerCase());
  const r = await context.request.post(`${base}/api/auth/sign-up/email`, { data: { name, email, password: PASSWORD }, headers: { origin: base } });
  expect(r.status()).toBe(200);
  // Sign-up does not sign in: the link mailed to the address confirms it and signs this browser in.
  const link = await new Client(base).mailedLink(email, '/api/auth/verify-email');
  expect((await context.request.get(link)).ok()).toBe(true);
  const page = await context.newPage();
  return { context, page, email, errors: watchErrors(page), api: apiOf(context) };
}
const apiOf = (c: BrowserContext) => ({
  send: async (method: 'POST' | 'PUT', path: string, data: unknown) => {
    const r = await c.request.fetch(`${base}/api${path}`, { method, data, headers: { origin: base } });
    expect(r.ok(), await r.text()).toBe(true);
    return r.json();
  },
});
async function centreOf(l: Locator) {
  const b = (await l.boundingBox())!;
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}
const text = (p: Page, id: string) => p.getByTestId(id).first().textContent();

describe('comments on set', () => {
  it('crew on a phone comments on a light; the photographer sees the pin, replies and resolves', async () => {
    const owner = await person('wide', 'Noor Photographer');
    const crew = await person('phone', 'Kai Assistant', true);
    const studio = await owner.api.send('POST', '/studios', { name: `Riverside ${word}` });
    const inv = await owner.api.send('POST', `/studios/${studio.id}/members`, { email: crew.email, role: 'crew' });
    await crew.api.send('POST', `/invitations/${inv.link.slice(inv.link.lastIndexOf('/') + 1)}/accept`, {});
    const setup = await owner.api.send('POST', '/setups', { studioId: studio.id, title: `Sprint rims ${word}`, document: doc });

    // ---- The crew member, on a phone: tap the rim on the comment plan, ask, send ----
    const p = crew.page;
    await p.goto(`${base}/setups/${setup.id}`);
    await p.getByTestId('plan').waitFor({ timeout: 30_000 });
    await dragSheet(p, true);
    await p.getByRole('tab', { name: 'Talk' }).click();
    const plan = p.getByTestId('comment-plan');
    await expect.poll(() => plan.getByTestId('pin-item-rim').count(), { timeout: 15_000 }).toBe(1);
    await plan.scrollIntoViewIfNeeded();
    const rimAt = await centreOf(plan.getByTestId('pin-item-rim'));
    await p.touchscreen.tap(rimAt.x, rimAt.y);
    await expect.poll(() => text(p, 'comment-pin-target')).toBe('Pinned on Rim left');
    await p.getByLabel('New comment').fill('No grid for the strip in the case. Bare strip, or flag it?');
    await p.getByTestId('add-comment').tap();
    await expect.poll(() => p.getByTestId('comment-thread').count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(() => plan.getByLabel('Comment 1').count()).toBe(1);
    // Saved (the draft shown at once is replaced by the stored comment, which can be replied to).
    await p.getByTestId('comment-thread').getByRole('button', { name: 'Reply' }).waitFor({ timeout: 10_000 });
    await p.getByTestId('comment-thread').scrollIntoViewIfNeeded();
    await shot(p, 'comments-phone-crew-asks');

    // ---- The photographer, wide: unread in the library, the pin on the light, reply, resolve ----
    const o = owner.page;
    await o.goto(`${base}/setups`);
    const card = o.getByTestId('setup-card-title-row').filter({ hasText: `Sprint rims ${word}` });
    await expect.poll(() => card.getByTestId('unread-comments').textContent().catch(() => null), { timeout: 15_000 }).toBe('1 new');
    await shot(o, 'comments-wide-library-unread');
    await card.click();
    await o.getByTestId('plan').waitFor({ timeout: 30_000 });
    const thread = o.getByTestId('comment-thread');
    await expect.poll(() => thread.count(), { timeout: 15_000 }).toBe(1);
    expect(await thread.textContent()).toContain('Kai Assistant · on Rim left');
    expect(await thread.textContent()).toContain('new');
    // The pin sits on the light in the comment plan.
    const pin = await centreOf(o.getByTestId('comment-plan').getByLabel('Comment 1'));
    const light = await centreOf(o.getByTestId('comment-plan').getByTestId('pin-item-rim'));
    expect(Math.abs(pin.x - light.x)).toBeLessThan(20);
    expect(Math.abs(pin.y - light.y)).toBeLessThan(40);
    await thread.getByRole('button', { name: 'Reply' }).click();
    await o.getByLabel('Your reply').fill('Bare is fine; flag the camera side with the small black card.');
    await o.getByRole('button', { name: 'Send the reply' }).click();
    await expect.poll(() => o.getByTestId('comment-reply').count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(() => thread.getByRole('button', { name: 'Reply' }).count(), { timeout: 10_000 }).toBe(1);
    await thread.scrollIntoViewIfNeeded();
    await shot(o, 'comments-wide-reply');
    await thread.getByRole('button', { name: 'Resolve' }).click();
    await expect.poll(() => o.getByText('Show resolved (1)').count(), { timeout: 10_000 }).toBe(1);
    expect(await o.getByTestId('comment-plan').getByLabel('Comment 1').count()).toBe(0);
    // Reading the thread cleared the unread count.
    await o.goto(`${base}/setups`);
    await card.waitFor({ timeout: 15_000 });
    expect(await card.getByTestId('unread-comments').count()).toBe(0);

    // ---- The crew member sees the reply, under "resolved" ----
    await p.reload();
    await p.getByTestId('plan').waitFor({ timeout: 30_000 });
    await dragSheet(p, true);
    await p.getByRole('tab', { name: 'Talk' }).click();
    await p.getByText('Show resolved (1)').tap();
    await expect.poll(() => p.getByTestId('comment-reply').count(), { timeout: 10_000 }).toBe(1);
    expect(await p.getByTestId('comment-thread').textContent()).toContain('Resolved by Noor Photographer');
    await p.getByTestId('comment-reply').scrollIntoViewIfNeeded();
    await shot(p, 'comments-phone-crew-sees-reply');

    expect(owner.errors).toEqual([]);
    expect(crew.errors).toEqual([]);
    await owner.context.close();
    await crew.context.close();
  });
});
