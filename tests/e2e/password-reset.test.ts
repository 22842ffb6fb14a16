// A forgotten password, as a person meets it: ask for a link, open the e-mail, set a new one, sign in.
import { describe, expect, inject, it } from 'vitest';
import { freshEmail } from '../support/http';
import { sharedBrowser, shot, viewports } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();

type Message = { to: string[] | string; subject: string; text: string };

describe('forgotten password', () => {
  it('sets a new password from the e-mailed link, once', async () => {
    const email = freshEmail('forgetful');
    const maker = await browser().newContext();
    expect((await maker.request.post(`${base}/api/auth/sign-up/email`, { data: { name: 'Wren Alder', email, password: 'old-pass-1234' }, headers: { origin: base } })).status()).toBe(200);
    await maker.close();

    const context = await browser().newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    await page.goto(`${base}/sign-in`);
    await page.getByRole('link', { name: 'Forgotten your password?' }).click();
    await page.getByLabel('E-mail').fill(email);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByTestId('reset-sent').waitFor();

    let link = '';
    await expect
      .poll(async () => {
        const { messages } = (await (await fetch(`${base}/dev/inbox.json`)).json()) as { messages: Message[] };
        const m = messages.find((x) => JSON.stringify(x.to).includes(email) && /reset-password/.test(x.text));
        link = m ? (/https?:\/\/\S+reset-password\S+/.exec(m.text)?.[0] ?? '') : '';
        return link;
      }, { timeout: 10_000 })
      .not.toBe('');
    await page.goto(link);
    await expect.poll(() => new URL(page.url()).pathname).toBe('/reset-password');
    await page.getByLabel('New password (8 characters or more)').fill('new-pass-5678');
    await page.getByRole('button', { name: 'Set the password' }).click();
    await page.getByTestId('reset-done').waitFor();
    await shot(page, 'reset-phone-done');

    await page.getByRole('link', { name: 'Sign in' }).click();
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('new-pass-5678');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByText('No setups yet').isVisible(), { timeout: 15_000 }).toBe(true);

    // The link works once.
    const again = await browser().newPage();
    await again.goto(link);
    await expect.poll(() => again.getByText('This link has been used or has run out. Ask for a new one.').isVisible(), { timeout: 10_000 }).toBe(true);
    await again.close();
    await context.close();
  });
});
