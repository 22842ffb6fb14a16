// The Setups library in Chromium: an owner creates a setup in the shared studio, finds it by search,
// duplicates it, deletes the copy (undo, delete again) and restores it from Deleted; a crew member of the
// studio sees the setup read-only (no delete action, role 'crew' from the API).
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { freshEmail } from '../support/http';
import { launch, shot, viewports, watchErrors, type ViewportName } from '../support/browser';

const base = inject('baseUrl');
let browser: Browser;
let close: () => Promise<void>;
// A word no demo setup has, so a search finds only what this run made.
const word = `quokka${Date.now().toString(36)}`;
const title = `Rim light ${word}`;
const copyTitle = `${title} (copy)`;
let setupId = '';

beforeAll(async () => {
  ({ browser, close } = await launch());
});
afterAll(async () => close?.());

async function signIn(vp: ViewportName, who: 'owner' | 'crew'): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser.newContext({ viewport: viewports[vp] });
  const page = await context.newPage();
  const errors = watchErrors(page);
  await page.goto(`${base}/sign-in`);
  await page.getByLabel('E-mail').fill(demoUsers[who].email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect.poll(() => page.getByText('Clamshell headshot on grey').isVisible(), { timeout: 15_000 }).toBe(true);
  return { context, page, errors };
}

const card = (page: Page, t: string) => page.getByRole('link', { name: t, exact: true });
const visible = (page: Page, t: string) => card(page, t).isVisible();

async function search(page: Page, text: string) {
  await page.getByLabel('Search setups').fill(text);
}

describe('the library', () => {
  it('creates, searches, duplicates, deletes (with undo) and restores a setup', async () => {
    const { context, page, errors } = await signIn('wide', 'owner');
    await shot(page, 'library-wide-owner');

    // New setup: a form with field errors beside the field, then the editor.
    await page.getByRole('button', { name: 'New setup' }).click();
    await page.getByRole('button', { name: 'Create and open' }).click();
    await expect.poll(() => page.getByText('give the setup a title').isVisible()).toBe(true);
    await page.getByLabel('Title', { exact: true }).fill(title);
    await page.getByRole('radiogroup', { name: 'Studio' }).getByRole('button', { name: 'Harbour Light Studio', exact: true }).click();
    await page.getByLabel('Tags (comma-separated, optional)').fill('Rim, e2e');
    await shot(page, 'library-wide-new-setup');
    await page.getByRole('button', { name: 'Create and open' }).click();
    await expect.poll(() => page.url(), { timeout: 15_000 }).toMatch(/\/setups\/[0-9a-f-]{36}$/);
    setupId = page.url().split('/').pop()!;

    // Search as you type finds it by a part of a word; nonsense finds nothing and says so.
    await page.goto(`${base}/setups`);
    await search(page, word.slice(0, 10));
    await expect.poll(() => page.getByTestId('setup-card').count(), { timeout: 10_000 }).toBe(1);
    expect(await visible(page, title)).toBe(true);
    await search(page, `${word}zzz`);
    await expect.poll(() => page.getByText('No setup matches that search').isVisible()).toBe(true);
    await search(page, word);
    await expect.poll(() => visible(page, title)).toBe(true);

    // Duplicate, with a dialog naming the copy and where it goes.
    await page.getByRole('button', { name: `Duplicate ${title}`, exact: true }).click();
    await page.getByRole('button', { name: 'Make the copy' }).click();
    await expect.poll(() => visible(page, copyTitle), { timeout: 10_000 }).toBe(true);
    expect(await page.getByTestId('toast').textContent()).toContain(`Made “${copyTitle}” in Harbour Light Studio.`);
    await shot(page, 'library-wide-duplicated');

    // Delete asks first; the toast's Undo brings it back.
    await page.getByRole('button', { name: `Delete ${copyTitle}` }).click();
    await shot(page, 'library-wide-confirm-delete');
    await page.getByRole('button', { name: 'Delete', exact: true }).click();
    await expect.poll(() => visible(page, copyTitle)).toBe(false);
    await page.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(() => visible(page, copyTitle), { timeout: 10_000 }).toBe(true);

    // Delete for real, then restore it from Deleted.
    await page.getByRole('button', { name: `Delete ${copyTitle}` }).click();
    await page.getByRole('button', { name: 'Delete', exact: true }).click();
    await expect.poll(() => visible(page, copyTitle)).toBe(false);
    await page.getByRole('tab', { name: 'Deleted' }).click();
    await expect.poll(() => visible(page, copyTitle), { timeout: 10_000 }).toBe(true);
    expect(await page.getByText(/restorable until/).first().isVisible()).toBe(true);
    await shot(page, 'library-wide-deleted');
    await page.getByRole('button', { name: `Restore ${copyTitle}` }).click();
    await expect.poll(() => visible(page, copyTitle)).toBe(false);
    await page.getByRole('tab', { name: 'Setups' }).click();
    await expect.poll(() => visible(page, copyTitle), { timeout: 10_000 }).toBe(true);
    expect(await visible(page, title)).toBe(true);

    // The tag filter: the new tag narrows the list to the two.
    await search(page, '');
    await page.getByRole('button', { name: '#e2e' }).click();
    await expect.poll(async () => page.getByTestId('setup-card').count(), { timeout: 10_000 }).toBe(2);

    // Tapping a card opens the setup.
    await card(page, title).click();
    await expect.poll(() => page.url()).toBe(`${base}/setups/${setupId}`);
    expect(errors).toEqual([]);
    await context.close();
  });

  it.each(['phone', 'wide'] as ViewportName[])('shows the setup read-only to crew on a %s', async (vp) => {
    expect(setupId, 'the first test made the setup').not.toBe('');
    const { context, page, errors } = await signIn(vp, 'crew');
    await search(page, word);
    await expect.poll(() => page.getByTestId('setup-card').count(), { timeout: 10_000 }).toBe(2);
    expect(await visible(page, title)).toBe(true);
    expect(await page.getByRole('button', { name: `Delete ${title}`, exact: true }).count()).toBe(0);
    expect(await page.getByRole('button', { name: `Duplicate ${title}`, exact: true }).count()).toBe(1);
    expect(await page.getByText('read-only').first().isVisible()).toBe(true);
    await shot(page, `library-${vp}-crew`);
    const r = await page.request.get(`${base}/api/setups/${setupId}`);
    expect(r.status()).toBe(200);
    expect((await r.json()).role).toBe('crew');
    // And the API agrees that crew cannot delete it.
    expect((await page.request.delete(`${base}/api/setups/${setupId}`)).status()).toBe(403);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('shows templates and the empty sections with what to do next, on a phone', async () => {
    const { context, page } = await signIn('phone', 'owner');
    await shot(page, 'library-phone-owner');
    await page.getByRole('tab', { name: 'Templates' }).click();
    await expect.poll(() => visible(page, 'Teal backdrop, warm key'), { timeout: 10_000 }).toBe(true);
    expect(await page.getByRole('button', { name: 'Use template Teal backdrop, warm key' }).isVisible()).toBe(true);
    await shot(page, 'library-phone-templates');
    await page.getByRole('tab', { name: 'Setups' }).click();
    await search(page, `${word}-nothing`);
    await expect.poll(() => page.getByText('No setup matches that search').isVisible()).toBe(true);
    await page.getByRole('button', { name: 'Clear the search' }).click();
    await expect.poll(() => visible(page, 'Clamshell headshot on grey')).toBe(true);
    await context.close();
  });
});

describe('studio members', () => {
  it('an owner invites by e-mail; the invitee opens the link signed out, signs up, comes back to it and joins', async () => {
    const owner = await signIn('wide', 'owner');
    await owner.page.getByRole('link', { name: 'Account' }).click();
    await owner.page.getByRole('link', { name: /^Harbour Light Studio/ }).click();
    await expect.poll(() => owner.page.getByTestId('member-row').count(), { timeout: 10_000 }).toBeGreaterThanOrEqual(3);
    const email = freshEmail('assistant');
    await owner.page.getByLabel('E-mail').fill(email);
    await owner.page.getByRole('radiogroup', { name: 'Role', exact: true }).getByRole('button', { name: 'Editor' }).click();
    await owner.page.getByRole('button', { name: 'Make the invitation' }).click();
    await expect.poll(() => owner.page.getByTestId('invitation-link').isVisible(), { timeout: 10_000 }).toBe(true);
    const link = (await owner.page.getByTestId('invitation-link').textContent())!.match(/http\S+\/studios\/join\/[A-Za-z0-9_-]{43}/)![0];
    expect(await owner.page.getByText('Waiting to join').isVisible()).toBe(true);
    await shot(owner.page, 'studio-wide-members-invited');

    const context = await browser.newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    const errors = watchErrors(page);
    await page.goto(link);
    // Signed out, the link asks to sign in and remembers where it was going.
    await expect.poll(() => new URL(page.url()).pathname, { timeout: 15_000 }).toBe('/sign-in');
    expect(new URL(page.url()).searchParams.get('next')).toBe(new URL(link).pathname);
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByLabel('Name').fill('Oriel Fenwick');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password (8 characters or more)').fill('assistant-pass-1');
    await page.getByRole('button', { name: 'Create account' }).click();
    // The address is confirmed by mail; the link signs in and comes back to the invitation. (The sign-up
    // screen's "check your inbox" message is not asserted here yet: see the harden-b report.)
    let confirm = '';
    await expect
      .poll(async () => {
        const { messages } = (await (await fetch(`${base}/dev/inbox.json`)).json()) as { messages: { to: string[]; text: string }[] };
        confirm = messages.filter((m) => m.to.includes(email)).map((m) => /https?:\/\/\S+\/api\/auth\/verify-email\S+/.exec(m.text)?.[0] ?? '').find(Boolean) ?? '';
        return confirm;
      }, { timeout: 15_000 })
      .not.toBe('');
    await page.goto(confirm);
    // Back on the invitation, now signed in.
    await expect.poll(() => page.url(), { timeout: 15_000 }).toBe(link);
    await shot(page, 'library-phone-invited');
    await page.getByTestId('join-studio').click();
    await expect.poll(() => page.url(), { timeout: 15_000 }).toMatch(/\/studios\/[0-9a-f-]{36}$/);
    await page.goto(new URL('/setups', link).toString());
    await expect.poll(() => visible(page, 'Clamshell headshot on grey'), { timeout: 15_000 }).toBe(true);
    expect(await page.getByTestId('invitation-banner').count()).toBe(0);
    // An editor may delete the studio's setups.
    expect(await page.getByRole('button', { name: 'Delete Clamshell headshot on grey', exact: true }).count()).toBe(1);
    expect(errors).toEqual([]);
    await context.close();

    await owner.page.reload();
    await expect.poll(() => owner.page.getByText('Oriel Fenwick').isVisible(), { timeout: 10_000 }).toBe(true);
    await owner.context.close();
  });
});
