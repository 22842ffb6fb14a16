// Sign up, land on the empty library, sign out, sign in as a demo owner and see the demo setups:
// on a phone and on a wide screen.
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { Client, freshEmail } from '../support/http';
import { sharedBrowser, shot, viewports, watchErrors, type ViewportName } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();

describe.each(Object.keys(viewports) as ViewportName[])('on a %s viewport', (vp) => {
  it('signs up, signs out, and signs in as a demo user', async () => {
    const context = await browser().newContext({ viewport: viewports[vp] });
    const page = await context.newPage();
    const errors = watchErrors(page);

    await page.goto(`${base}/`);
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByLabel('Name').fill('Noor Ellery');
    const email = freshEmail('e2e');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password (8 characters or more)').fill('e2e-password-1');
    await page.getByRole('button', { name: 'Create account' }).click();
    // The address is confirmed from the link mailed to it (the local inbox), which signs the person in.
    const link = await new Client(base).mailedLink(email, '/api/auth/verify-email');
    await page.goto(link);

    await expect.poll(() => page.getByText('No setups yet').isVisible(), { timeout: 15_000 }).toBe(true);
    expect(page.url()).toMatch(/\/setups$/);
    await shot(page, `smoke-${vp}-empty-library`);

    await page.getByRole('link', { name: 'Account' }).click();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await expect.poll(() => page.getByRole('button', { name: 'Sign in' }).isVisible(), { timeout: 15_000 }).toBe(true);

    await page.getByLabel('E-mail').fill(demoUsers.owner.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    // The library opens; other tests add setups to the demo studio, so the demo's own are found by searching
    // (in a fresh database they are the only ones).
    await expect.poll(() => page.getByLabel('Search setups').isVisible(), { timeout: 30_000 }).toBe(true);
    for (const title of ['Clamshell headshot on grey', 'Twin rims on black for a runner', 'Teal backdrop, warm key']) {
      await page.getByLabel('Search setups').fill(title);
      await expect.poll(() => page.getByText(title).first().isVisible(), { timeout: 30_000 }).toBe(true);
    }
    await page.getByLabel('Search setups').fill('');
    await shot(page, `smoke-${vp}-demo-library`);
    if (vp === 'wide') expect(await page.getByText('Falloff', { exact: true }).isVisible()).toBe(true); // the side rail
    expect(errors).toEqual([]);
    await context.close();
  });
});
