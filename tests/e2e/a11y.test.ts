// Accessibility in Chromium with axe-core: every route (signed-out pages, the library, the editor, a share
// page, a missing setup, classes, a class, an assignment, the lesson player, the account and a studio), on a
// phone (390 × 844) and wide (1440 × 900), checked against the WCAG 2.0/2.1/2.2 A and AA rules. The findings
// are written to tests/.artifacts/a11y.json and printed; every page is titled after what it shows and has
// exactly one top-level heading.
import { createRequire } from 'node:module';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { artifactsDir, launch, shot, viewports, type ViewportName } from '../support/browser';

const base = inject('baseUrl');
const axePath = createRequire(import.meta.url).resolve('axe-core/axe.min.js');
const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
let browser: Browser;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ browser, close } = await launch());
});
afterAll(async () => close?.());

type Finding = { id: string; impact: string | null; help: string; nodes: string[] };

/** Findings still open, each named here so that anything new fails the test (none at present). */
const KNOWN_OPEN: Record<string, string[]> = {
};
const knownOpen = (page: string, f: Finding) => (KNOWN_OPEN[page.split('-')[0]!] ?? []).includes(f.id);
const found: Record<string, Finding[]> = {};

/** One h1 on the page, and a title that says more than the product's name. */
async function headingAndTitle(page: Page, name: string) {
  await expect.poll(() => page.locator('h1').count(), { timeout: 10_000, message: `${name}: one h1` }).toBe(1);
  const title = await page.title();
  expect(title, `${name}: titled after what it shows`).toMatch(/ · Falloff$/);
}

async function audit(page: Page, name: string): Promise<Finding[]> {
  await headingAndTitle(page, name);
  await page.addScriptTag({ path: axePath });
  const result = await page.evaluate(async (tags) => {
    const axe = (window as unknown as { axe: { run: (c: unknown, o: unknown) => Promise<{ violations: { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }[] }> } }).axe;
    const r = await axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 5).map((n) => n.target.join(' ')) }));
  }, TAGS);
  found[name] = result;
  await shot(page, `a11y-${name}`);
  return result;
}

async function signIn(vp: ViewportName, who: 'owner' | 'instructor'): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: viewports[vp], ...(vp === 'phone' ? { isMobile: true, hasTouch: true } : {}) });
  const page = await context.newPage();
  await page.goto(`${base}/sign-in`);
  await page.getByLabel('E-mail').fill(demoUsers[who].email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect.poll(() => page.url(), { timeout: 20_000 }).not.toContain('/sign-in');
  return { context, page };
}

describe('accessibility (axe-core, WCAG 2.2 AA rules)', () => {
  for (const vp of ['phone', 'wide'] as const) {
    it(`library, editor, share page and lesson player on ${vp}`, async () => {
      const { context, page } = await signIn(vp, 'owner');
      const headers = { origin: base };
      // The library with a demo setup's card (searched for by name: other test files add setups of their own,
      // and the newest come first).
      const search = page.getByPlaceholder('Search titles, notes and tags');
      await expect.poll(() => search.isVisible(), { timeout: 30_000 }).toBe(true);
      await search.fill('Clamshell headshot');
      await expect.poll(() => page.getByText('Clamshell headshot on grey').first().isVisible(), { timeout: 20_000 }).toBe(true);
      await expect.poll(() => page.title()).toMatch(/Setups/);
      await audit(page, `library-${vp}`);

      // The same demo setup (not whatever another test file made last).
      const list = await (await context.request.get(`${base}/api/setups?q=Clamshell%20headshot`)).json();
      const first = (list.setups as { id: string; title: string }[]).find((x) => x.title.startsWith('Clamshell headshot'))!;
      await page.goto(`${base}/setups/${first.id}`);
      await expect.poll(() => page.getByTestId('plan').first().isVisible(), { timeout: 30_000 }).toBe(true);
      await expect.poll(() => page.title(), { timeout: 10_000 }).toContain(first.title);
      await audit(page, `editor-${vp}`);

      const made = await (await context.request.post(`${base}/api/setups/${first.id}/shares`, { data: { label: 'a11y' }, headers })).json();
      const anon = await browser.newContext({ viewport: viewports[vp] });
      const sp = await anon.newPage();
      await sp.goto(made.url);
      await expect.poll(() => sp.getByText(first.title).first().isVisible(), { timeout: 20_000 }).toBe(true);
      await expect.poll(() => sp.title(), { timeout: 10_000 }).toContain(first.title);
      await audit(sp, `share-${vp}`);
      await anon.close();
      await context.close();

      const teacher = await signIn(vp, 'instructor');
      const classes = await (await teacher.context.request.get(`${base}/api/classes`)).json();
      const cls = (classes.classes ?? classes)[0] as { id: string } | undefined;
      const lessons = cls ? await (await teacher.context.request.get(`${base}/api/classes/${cls.id}/lessons`)).json() : [];
      const lesson = (lessons.lessons ?? lessons)[0] as { id: string; title: string } | undefined;
      if (lesson) {
        await teacher.page.goto(`${base}/lessons/${lesson.id}`);
        await expect.poll(() => teacher.page.getByText(lesson.title).first().isVisible(), { timeout: 20_000 }).toBe(true);
        await expect.poll(() => teacher.page.title(), { timeout: 10_000 }).toContain(lesson.title);
        await audit(teacher.page, `lesson-${vp}`);
      }
      await teacher.context.close();
      expectNoNewFindings(vp, ['library', 'editor', 'share', 'lesson']);
    });

    it(`sign-in, sign-up and the password pages on ${vp}`, async () => {
      const context = await browser.newContext({ viewport: viewports[vp], ...(vp === 'phone' ? { isMobile: true, hasTouch: true } : {}) });
      const page = await context.newPage();
      for (const [path, name, title] of [
        ['/sign-in', 'signin', 'Sign in'],
        ['/sign-up', 'signup', 'Create your account'],
        ['/forgot-password', 'forgot', 'Forgotten password'],
        ['/reset-password?token=not-a-real-token', 'reset', 'Set a new password'],
      ] as const) {
        await page.goto(`${base}${path}`);
        await expect.poll(() => page.title(), { timeout: 20_000 }).toBe(`${title} · Falloff`);
        await audit(page, `${name}-${vp}`);
      }
      await context.close();
      expectNoNewFindings(vp, ['signin', 'signup', 'forgot', 'reset']);
    });

    it(`classes, a class, an assignment, the account, a studio and a missing setup on ${vp}`, async () => {
      const teacher = await signIn(vp, 'instructor');
      const page = teacher.page;
      await page.goto(`${base}/classes`);
      await expect.poll(() => page.title(), { timeout: 20_000 }).toBe('Classes · Falloff');
      await audit(page, `classes-${vp}`);
      const classes = await (await teacher.context.request.get(`${base}/api/classes`)).json();
      const cls = (classes.classes ?? classes)[0] as { id: string; name: string };
      await page.goto(`${base}/classes/${cls.id}`);
      await expect.poll(() => page.title(), { timeout: 30_000 }).toBe(`${cls.name} · Falloff`);
      await audit(page, `class-${vp}`);
      const assignments = await (await teacher.context.request.get(`${base}/api/classes/${cls.id}/assignments`)).json();
      const a = (assignments.assignments ?? assignments)[0] as { id: string; title: string };
      await page.goto(`${base}/assignments/${a.id}`);
      await expect.poll(() => page.title(), { timeout: 30_000 }).toBe(`${a.title} · Falloff`);
      await audit(page, `assignment-${vp}`);
      await teacher.context.close();

      const owner = await signIn(vp, 'owner');
      await owner.page.goto(`${base}/account`);
      await expect.poll(() => owner.page.title(), { timeout: 20_000 }).toBe('Account · Falloff');
      await expect.poll(() => owner.page.getByText(demoUsers.owner.email).first().isVisible(), { timeout: 20_000 }).toBe(true);
      await audit(owner.page, `account-${vp}`);
      const studios = await (await owner.context.request.get(`${base}/api/studios`)).json();
      const studio = (studios.studios ?? studios)[0] as { id: string; name: string };
      await owner.page.goto(`${base}/studios/${studio.id}`);
      await expect.poll(() => owner.page.title(), { timeout: 20_000 }).toBe(`${studio.name} · Falloff`);
      await audit(owner.page, `studio-${vp}`);
      await owner.page.goto(`${base}/setups/00000000-0000-4000-8000-000000000000`);
      await expect.poll(() => owner.page.title(), { timeout: 20_000 }).toBe('Setup not found · Falloff');
      await audit(owner.page, `missing-${vp}`);
      await owner.context.close();
      expectNoNewFindings(vp, ['classes', 'class', 'assignment', 'account', 'studio', 'missing']);
    });
  }
});

/** Writes every finding so far, prints them, and fails on any not in KNOWN_OPEN for these pages at this size. */
function expectNoNewFindings(vp: ViewportName, pages: string[]) {
  writeFileSync(join(artifactsDir, 'a11y.json'), JSON.stringify(found, null, 2));
  const here = Object.entries(found).filter(([n]) => pages.some((p) => n === `${p}-${vp}`));
  for (const [name, v] of here) console.log(`[a11y] ${name}: ${v.length ? v.map((x) => `${x.id} (${x.nodes.length})`).join(', ') : 'no violations'}`);
  const open = here.flatMap(([n, v]) => v.filter((x) => !knownOpen(n, x)).map((x) => `${n}: ${x.id} — ${x.help} — ${x.nodes.join(' | ')}`));
  expect(open).toEqual([]);
}
