// Keyboard and words, tried as a person would in Chromium: the skip link is the first tab stop on the editor
// and the share page and lands on the plan; Delete keeps the keyboard's focus on the plan (the next item);
// a setup that cannot be opened says why and offers ways on (the library, or signing in as someone else and
// coming back); re-joining a class says so and takes the person there; an instructor sets a due date.
import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { DEMO_CLASS, DEMO_JOIN_CODE, DEMO_PASSWORD, demoUsers, type DemoUserKey } from '../../db/demo';
import { demoSetups } from '../../db/seed-setups';
import { sharedBrowser, shot, viewports, type ViewportName } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const headers = { origin: base };

async function signIn(who: DemoUserKey, vp: ViewportName = 'wide'): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser().newContext({ viewport: viewports[vp], ...(vp === 'phone' ? { isMobile: true, hasTouch: true } : {}) });
  const page = await context.newPage();
  await page.goto(`${base}/sign-in`);
  await page.getByLabel('E-mail').fill(demoUsers[who].email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect.poll(() => page.url(), { timeout: 20_000 }).not.toContain('/sign-in');
  return { context, page };
}

/** The test id of the element with the keyboard's focus (or its tag when it has none). */
const focused = (page: Page) => page.evaluate(() => document.activeElement?.getAttribute('data-testid') ?? document.activeElement?.tagName ?? null);

describe('keyboard: skip link and focus after Delete', () => {
  it('the first Tab on the editor reaches "Skip to the plan", which lands on the plan; Delete moves focus to the next item', async () => {
    const { context, page } = await signIn('owner');
    const made = await (await context.request.post(`${base}/api/setups`, { data: { title: `Keyboard walk ${Date.now()}`, document: demoSetups[0]!.document }, headers })).json();
    await page.goto(`${base}/setups/${made.id}`);
    await expect.poll(() => page.getByTestId('plan').first().isVisible(), { timeout: 30_000 }).toBe(true);
    await expect.poll(() => page.locator('[data-testid="plan"] [data-testid^="item-"]').count(), { timeout: 20_000 }).toBeGreaterThan(2);
    // From the top of a freshly loaded page.
    await page.reload();
    await expect.poll(() => page.locator('[data-testid="plan"] [data-testid^="item-"]').count(), { timeout: 30_000 }).toBeGreaterThan(2);
    await page.keyboard.press('Tab');
    expect(await focused(page)).toBe('skip-link');
    // Shown while it has focus.
    const box = await page.getByTestId('skip-link').boundingBox();
    expect(box && box.y >= 0 && box.height >= 24).toBe(true);
    await shot(page, 'a11y-skip-link-wide');
    await page.keyboard.press('Enter');
    await expect.poll(() => focused(page), { timeout: 10_000 }).toBe('plan');
    // The next Tab reaches the plan's first item, and the one after it.
    await page.keyboard.press('Tab');
    await expect.poll(() => focused(page), { timeout: 10_000 }).toMatch(/^item-/);
    const ids = await page.locator('[data-testid="plan"] [data-testid^="item-"]:not([data-testid^="item-glyph-"])').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')!));
    const first = (await focused(page))!;
    expect(ids[0]).toBe(first);
    // Focus selects it, and the plan says which item is selected (aria-pressed: react-native-web drops
    // accessibilityState); the others say they are not.
    await expect.poll(() => page.getByTestId(first).getAttribute('aria-pressed'), { timeout: 10_000 }).toBe('true');
    expect(await page.getByTestId(ids[1]!).getAttribute('aria-pressed')).toBe('false');
    await page.keyboard.press('Delete');
    // The item is gone and the keyboard's focus is on the item after it (not lost to the page's start).
    await expect.poll(() => page.locator(`[data-testid="${first}"]`).count(), { timeout: 10_000 }).toBe(0);
    await expect.poll(() => focused(page), { timeout: 10_000 }).toBe(ids[1]);
    // The settings' Delete button too: focus goes on to the next item.
    await page.getByRole('button', { name: 'Delete', exact: true }).first().focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => page.locator(`[data-testid="${ids[1]}"]`).count(), { timeout: 10_000 }).toBe(0);
    await expect.poll(() => focused(page), { timeout: 10_000 }).toBe(ids[2]);
    await context.close();
  });

  it('the share page starts with the same skip link', async () => {
    const { context } = await signIn('owner');
    const list = await (await context.request.get(`${base}/api/setups`)).json();
    const first = (list.setups ?? list.items ?? list)[0] as { id: string; title: string };
    const share = await (await context.request.post(`${base}/api/setups/${first.id}/shares`, { data: { label: 'keyboard' }, headers })).json();
    const anon = await browser().newContext({ viewport: viewports.wide });
    const page = await anon.newPage();
    await page.goto(share.url);
    await expect.poll(() => page.getByTestId('plan').first().isVisible(), { timeout: 30_000 }).toBe(true);
    await page.keyboard.press('Tab');
    expect(await focused(page)).toBe('skip-link');
    await page.keyboard.press('Enter');
    await expect.poll(() => focused(page), { timeout: 10_000 }).toBe('plan');
    await anon.close();
    await context.close();
  });
});

describe('a setup that cannot be opened', () => {
  it('says so, leads back to the library, or to signing in as the right person and on to the setup', async () => {
    const owner = await signIn('owner', 'phone');
    // In the owner's personal studio: the crew member is not in it.
    const made = await (await owner.context.request.post(`${base}/api/setups`, { data: { title: `Only mine ${Date.now()}` }, headers })).json();
    await owner.context.close();

    const crew = await signIn('crew', 'phone');
    const page = crew.page;
    await page.goto(`${base}/setups/${made.id}`);
    await expect.poll(() => page.title(), { timeout: 20_000 }).toBe('Setup not found · Falloff');
    expect(await page.getByTestId('setup-missing-who').textContent()).toContain(demoUsers.crew.email);
    await shot(page, 'a11y-setup-missing-phone');
    await page.getByRole('button', { name: 'Back to your setups' }).click();
    await expect.poll(() => page.url(), { timeout: 20_000 }).toMatch(/\/setups$/);

    await page.goto(`${base}/setups/${made.id}`);
    await page.getByRole('button', { name: 'Sign in as someone else' }).click();
    await expect.poll(() => page.url(), { timeout: 20_000 }).toContain('/sign-in');
    await page.getByLabel('E-mail').fill(demoUsers.owner.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    // Back where the link pointed, now as someone who may open it.
    await expect.poll(() => page.url(), { timeout: 30_000 }).toContain(`/setups/${made.id}`);
    await expect.poll(() => page.getByTestId('plan').first().isVisible(), { timeout: 30_000 }).toBe(true);
    await crew.context.close();
  });
});

describe('classes', () => {
  it('re-joining a class with its code says "You are already in" it and takes the person there', async () => {
    const { context, page } = await signIn('student', 'phone');
    await page.goto(`${base}/classes`);
    await page.getByLabel('Join code').fill(DEMO_JOIN_CODE);
    await page.getByRole('button', { name: 'Join', exact: true }).click();
    await expect.poll(() => page.getByTestId('joined-notice').textContent().catch(() => null), { timeout: 20_000 }).toBe(`You are already in ${DEMO_CLASS}.`);
    expect(page.url()).toMatch(/\/classes\/[0-9a-f-]{36}/);
    expect(await page.title()).toBe(`${DEMO_CLASS} · Falloff`);
    await shot(page, 'a11y-rejoin-phone');
    await context.close();
  });

  it('an instructor sets, shows and clears an assignment\'s due date', async () => {
    const { context, page } = await signIn('instructor');
    const classes = await (await context.request.get(`${base}/api/classes`)).json();
    const cls = (classes.classes ?? classes)[0] as { id: string };
    const list = await (await context.request.get(`${base}/api/classes/${cls.id}/assignments`)).json();
    const a = (list.assignments ?? list)[0] as { id: string; dueAt: string | null };
    await page.goto(`${base}/assignments/${a.id}`);
    const field = page.getByTestId('due-date');
    await expect.poll(() => field.isVisible(), { timeout: 30_000 }).toBe(true);
    await field.fill('31 Feb');
    await page.getByTestId('save-due').click();
    await expect.poll(() => page.getByText(/Not a date this field reads/).count(), { timeout: 10_000 }).toBe(1);
    await field.fill('2031-03-01 18:00');
    await page.getByTestId('save-due').click();
    await expect.poll(() => page.getByTestId('due-shown').textContent().catch(() => null), { timeout: 20_000 }).toMatch(/^Due .*2031/);
    const saved = await (await context.request.get(`${base}/api/assignments/${a.id}`)).json();
    expect(new Date(saved.dueAt).getTime()).toBe(new Date(2031, 2, 1, 18, 0).getTime());
    // Cleared, it is gone from the page; then put back as it was.
    await field.fill('');
    await page.getByTestId('save-due').click();
    await expect.poll(() => page.getByTestId('due-shown').count(), { timeout: 20_000 }).toBe(0);
    expect((await context.request.patch(`${base}/api/assignments/${a.id}`, { data: { dueAt: a.dueAt }, headers })).status()).toBe(200);
    await context.close();
  });
});
