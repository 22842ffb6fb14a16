// Pages that paint before any JavaScript (scripts/staticPages.mjs): the signed-out forms and the read-only link's
// shell come as HTML rendered at build time; the app then hydrates that markup (the same elements, kept) rather
// than drawing the page again, and what was typed before the scripts arrived is what the form sends.
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { holdRequests, sharedBrowser, shot, viewports, watchErrors } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const headers = { Origin: base };

/** Where two markups part, with some context either side; null when they are the same. */
function firstDifference(a: string, b: string): string | null {
  if (a === b) return null;
  let i = 0;
  while (i < a.length && a[i] === b[i]) i++;
  return `at ${i}: …${a.slice(Math.max(0, i - 150), i + 150)}… but …${b.slice(Math.max(0, i - 150), i + 150)}…`;
}

/** The route's HTML as a phone with scripts turned off shows it. */
async function withoutScripts(path: string): Promise<string> {
  const context = await browser().newContext({ viewport: viewports.phone, javaScriptEnabled: false, serviceWorkers: 'block' });
  const page = await context.newPage();
  await page.goto(`${base}${path}`);
  const text = await page.locator('#root').innerText();
  await shot(page, `static-${path.split('/')[1]}-no-scripts`);
  await context.close();
  return text;
}

describe('pages rendered at build time', () => {
  it('the signed-out forms and the share page paint their words before any script runs', async () => {
    const signIn = await withoutScripts('/sign-in');
    expect(signIn).toContain('Sign in');
    expect(signIn).toContain('E-mail');
    expect(signIn).toContain('Password');
    expect(signIn).toContain('Create an account');
    expect(await withoutScripts('/sign-up')).toContain('Create your account');
    expect(await withoutScripts('/forgot-password')).toContain('Forgotten password');
    // Any token: the shell knows none (it is the same HTML for every link).
    expect(await withoutScripts('/s/any-token-at-all')).toContain('Opening the shared setup…');
    // A page behind sign-in is the app shell: an empty root that the app renders into.
    expect((await withoutScripts('/setups')).trim()).toBe('');
  });

  it('hydrates the sign-in form it painted, keeps what was typed before the scripts came, and signs in', async () => {
    const context = await browser().newContext({ viewport: viewports.phone, isMobile: true, hasTouch: true, serviceWorkers: 'block' });
    const page = await context.newPage();
    const errors = watchErrors(page);
    // The app's entry is held until the test lets it go: until then the page is the build's HTML alone.
    const release = await holdRequests(page, /\/entry-[0-9a-f]+\.js$/);
    await page.goto(`${base}/sign-in?next=/setups`, { waitUntil: 'commit' });
    const email = page.locator('input[autocomplete="email"]');
    await expect.poll(() => email.isVisible(), { timeout: 30_000 }).toBe(true);
    // No script has run: the input is the build's element, with no React behind it.
    const reactKeys = () => email.evaluate((el) => Object.keys(el).filter((k) => k.startsWith('__react')).length);
    expect(await reactKeys()).toBe(0);
    await email.fill(demoUsers.owner.email);
    await page.locator('input[autocomplete="current-password"]').fill(DEMO_PASSWORD);
    await page.evaluate(() => {
      (window as unknown as { builtInput: Element | null }).builtInput = document.querySelector('input[autocomplete="email"]');
    });
    release();
    // Hydrated: React has taken over the very element the build wrote (a mismatch would make React draw the page
    // again, with new elements).
    await expect.poll(reactKeys, { timeout: 60_000 }).toBeGreaterThan(0);
    expect(await page.evaluate(() => document.querySelector('input[autocomplete="email"]') === (window as unknown as { builtInput: Element | null }).builtInput)).toBe(true);
    expect(await email.inputValue()).toBe(demoUsers.owner.email);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => new URL(page.url()).pathname, { timeout: 60_000 }).toBe('/setups');
    expect(errors).toEqual([]);
    await context.close();
  });

  for (const path of ['/sign-in?next=/setups/elsewhere', '/sign-up?next=/classes', '/forgot-password']) {
    it(`${path.split('?')[0]}: the hydrated page is the one the browser draws itself`, async () => {
      // The same route drawn twice: hydrated from its build-time HTML, and rendered into the app shell's empty
      // root (the HTML a page behind sign-in gets). Markup, classes and links (with ?next=) must be equal.
      const shell = await (await fetch(`${base}/setups`)).text();
      expect(shell).not.toContain('falloff-prerendered');
      const drawn: string[] = [];
      for (const served of ['built', 'shell'] as const) {
        const context = await browser().newContext({ viewport: viewports.wide, serviceWorkers: 'block' });
        const page = await context.newPage();
        const errors = watchErrors(page);
        if (served === 'shell') await page.route((u) => u.pathname === path.split('?')[0], (route) => route.fulfill({ status: 200, contentType: 'text/html', body: shell }));
        await page.goto(`${base}${path}`);
        const input = page.locator('input').first();
        await expect.poll(() => input.evaluate((el) => Object.keys(el).some((k) => k.startsWith('__reactFiber'))).catch(() => false), { timeout: 60_000 }).toBe(true);
        // The session has been read (signed out) and every link is the final one.
        await page.waitForLoadState('networkidle');
        // Without the comments React's server render leaves around suspense boundaries, with each inline style
        // as the browser reads it (the build writes `flex:1`, the browser `flex: 1 1 0%`: the same style)
        drawn.push(
          await page.locator('#root').evaluate((r) => {
            const copy = r.cloneNode(true) as HTMLElement;
            for (const el of Array.from(copy.querySelectorAll<HTMLElement>('[style]'))) el.setAttribute('style', el.style.cssText);
            // and the attributes in one order (React sets an input's type after creating it; the build writes
            // it in place).
            for (const el of Array.from(copy.querySelectorAll('*'))) {
              const attrs = Array.from(el.attributes).map((a) => [a.name, a.value] as const).sort(([x], [y]) => (x < y ? -1 : 1));
              for (const [name] of attrs) el.removeAttribute(name);
              for (const [name, value] of attrs) el.setAttribute(name, value);
            }
            return copy.innerHTML.replace(/<!--[^]*?-->/g, '');
          }),
        );
        if (served === 'built') await shot(page, `static-${path.split('/')[1]!.split('?')[0]}-hydrated`);
        expect(errors).toEqual([]);
        await context.close();
      }
      expect(firstDifference(drawn[0]!, drawn[1]!)).toBeNull();
      if (path.includes('next=')) expect(drawn[0]!).toContain(encodeURIComponent(new URLSearchParams(path.split('?')[1]).get('next')!));
    });
  }

  it('a signed-in visitor to the sign-in page is still sent on to their setups', async () => {
    const context = await browser().newContext({ viewport: viewports.phone, serviceWorkers: 'block' });
    const r = await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.editor.email, password: DEMO_PASSWORD }, headers });
    expect(r.status()).toBe(200);
    const page = await context.newPage();
    await page.goto(`${base}/sign-in`);
    await expect.poll(() => new URL(page.url()).pathname, { timeout: 60_000 }).toBe('/setups');
    await context.close();
  });
});
