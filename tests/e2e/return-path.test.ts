// A link to one setup, opened signed out, comes back to that setup after signing in.
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { sharedBrowser, viewports } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();

describe('signing in from a link', () => {
  it('returns to the page the link named', async () => {
    const owner = await browser().newContext();
    await owner.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } });
    const { id } = await (await owner.request.post(`${base}/api/setups`, { data: { title: 'Sent by link' }, headers: { origin: base } })).json();
    await owner.close();

    const context = await browser().newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    await page.goto(`${base}/setups/${id}`);
    await expect.poll(() => new URL(page.url()).pathname, { timeout: 30_000 }).toBe('/sign-in');
    expect(new URL(page.url()).searchParams.get('next')).toBe(`/setups/${id}`);
    await page.getByLabel('E-mail').fill(demoUsers.owner.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.url(), { timeout: 15_000 }).toBe(`${base}/setups/${id}`);
    await page.getByTestId('plan').waitFor();
    expect(await page.getByText('Sent by link').isVisible()).toBe(true);
    // A reload while signed in stays on the same page.
    await page.reload();
    await page.getByTestId('plan').waitFor();
    expect(page.url()).toBe(`${base}/setups/${id}`);
    await context.close();
  });
});
