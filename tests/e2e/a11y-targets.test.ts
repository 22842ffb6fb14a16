// Touch targets on a phone (390 × 844, touch): every control a finger can press on the library, the editor (its
// sheet on the meter and on a light's settings), the share page and the lesson player is at least 44 × 44 px, or
// at least 24 × 24 px with room around it: the 44 px square centred on it touches no other control (the spacing
// exception of WCAG 2.2's 2.5.8, kept to the 44 px we aim for). What fails is listed by name and size, and
// written to tests/.artifacts/a11y-targets.json.
import { writeFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { artifactsDir, sharedBrowser, viewports } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const phone = { viewport: viewports.phone, isMobile: true, hasTouch: true };

type Small = { name: string; w: number; h: number };

/** The controls under 44 px that lack the room to make up for it. */
async function smallTargets(page: Page): Promise<Small[]> {
  return page.evaluate(() => {
    const FULL = 44;
    const MIN = 24;
    const selector = 'a[href], button, input:not([type=hidden]), select, textarea, [role=button], [role=link], [role=tab], [role=radio], [role=checkbox], [role=switch], [role=menuitem], [role=option]';
    const shown = (el: Element) => {
      // Not in an aria-hidden part (a second plan, a picture under a button) and drawn with a size.
      if (el.closest('[aria-hidden="true"]')) return false;
      const st = getComputedStyle(el);
      if (st.visibility === 'hidden' || st.display === 'none' || st.pointerEvents === 'none') return false;
      const r = el.getBoundingClientRect();
      // A skip link rests as a 1 px clip until it has the keyboard's focus (a keyboard's target, not a finger's).
      return r.width > 1 && r.height > 1;
    };
    // Nested matches (a native button inside a role=button) count once: the outermost.
    const all = Array.from(document.querySelectorAll(selector)).filter(shown);
    const targets = all.filter((el) => !all.some((o) => o !== el && o.contains(el)));
    const boxes = targets.map((el) => el.getBoundingClientRect());
    const name = (el: Element) =>
      (el.getAttribute('aria-label') || (el as HTMLElement).innerText || el.getAttribute('placeholder') || el.getAttribute('data-testid') || el.tagName).trim().replace(/\s+/g, ' ').slice(0, 60);
    const out: { name: string; w: number; h: number }[] = [];
    targets.forEach((el, i) => {
      const r = boxes[i]!;
      if (r.width >= FULL - 0.5 && r.height >= FULL - 0.5) return;
      if (r.width >= MIN && r.height >= MIN) {
        // The 44 px square around its centre must be clear of every other control.
        const cx = r.x + r.width / 2;
        const cy = r.y + r.height / 2;
        const clear = boxes.every((o, j) => j === i || o.right <= cx - FULL / 2 || o.left >= cx + FULL / 2 || o.bottom <= cy - FULL / 2 || o.top >= cy + FULL / 2);
        if (clear) return;
      }
      out.push({ name: name(el), w: Math.round(r.width), h: Math.round(r.height) });
    });
    return out;
  });
}

const found: Record<string, Small[]> = {};

describe('touch targets at 390 × 844', () => {
  it('are 44 px (or 24 px with room) on the library, editor, share page and lesson player', async () => {
    const context = await browser().newContext(phone);
    expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } })).status()).toBe(200);
    const page = await context.newPage();
    await page.goto(`${base}/`);
    // The library with cards in it (searched for a demo setup by name: other test files add setups of their own,
    // and the newest come first).
    const search = page.getByPlaceholder('Search titles, notes and tags');
    await expect.poll(() => search.isVisible(), { timeout: 30_000 }).toBe(true);
    await search.fill('Clamshell headshot');
    await expect.poll(() => page.getByText('Clamshell headshot on grey').first().isVisible(), { timeout: 30_000 }).toBe(true);
    found.library = await smallTargets(page);

    // A demo setup with lights (not whatever another test file made last).
    const list = await (await context.request.get(`${base}/api/setups?q=Clamshell%20headshot`)).json();
    const first = (list.setups as { id: string; title: string }[]).find((x) => x.title.startsWith('Clamshell headshot'))!;
    await page.goto(`${base}/setups/${first.id}`);
    await page.getByTestId('plan').first().waitFor({ timeout: 30_000 });
    await page.getByTestId('meter-peek').waitFor({ timeout: 30_000 });
    // The meter's first reading comes after the first paint: its panels' controls are there once it has.
    await expect.poll(() => page.getByTestId('meter-peek').textContent(), { timeout: 30_000 }).not.toBe('Reading the plan…');
    found.editor = await smallTargets(page);
    // A light's settings, as a tap on it opens them (the sheet at half height, the Item tab).
    const doc = (await (await context.request.get(`${base}/api/setups/${first.id}`)).json()).document as { items: { id: string; kind: string }[] };
    const light = doc.items.find((i) => i.kind === 'light')!;
    const box = (await page.getByTestId(`item-${light.id}`).first().boundingBox())!;
    await page.touchscreen.tap(box.x + box.width / 2, box.y + box.height / 2);
    await page.getByTestId(`inspector-${light.id}`).waitFor({ timeout: 10_000 });
    found['editor, a light'] = await smallTargets(page);

    const made = await (await context.request.post(`${base}/api/setups/${first.id}/shares`, { data: { label: 'targets' }, headers: { origin: base } })).json();
    const anon = await browser().newContext(phone);
    const sp = await anon.newPage();
    await sp.goto(made.url);
    await expect.poll(() => sp.getByText(first.title).first().isVisible(), { timeout: 30_000 }).toBe(true);
    found.share = await smallTargets(sp);
    await anon.close();
    await context.close();

    const teacher = await browser().newContext(phone);
    expect((await teacher.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.instructor.email, password: DEMO_PASSWORD }, headers: { origin: base } })).status()).toBe(200);
    const classes = await (await teacher.request.get(`${base}/api/classes`)).json();
    const cls = (classes.classes ?? classes)[0] as { id: string };
    const lessons = await (await teacher.request.get(`${base}/api/classes/${cls.id}/lessons`)).json();
    const lesson = (lessons.lessons ?? lessons)[0] as { id: string; title: string };
    const lp = await teacher.newPage();
    await lp.goto(`${base}/lessons/${lesson.id}`);
    await expect.poll(() => lp.getByText(lesson.title).first().isVisible(), { timeout: 30_000 }).toBe(true);
    await lp.getByTestId('player-position').first().waitFor({ timeout: 30_000 });
    found.lesson = await smallTargets(lp);
    await teacher.close();

    mkdirSync(artifactsDir, { recursive: true });
    writeFileSync(join(artifactsDir, 'a11y-targets.json'), JSON.stringify(found, null, 2));
    for (const [where, small] of Object.entries(found)) if (small.length) console.log(`[a11y-targets] ${where}: ${small.map((t) => `${t.name} ${t.w}×${t.h}`).join('; ')}`);
    expect(found).toEqual({ library: [], editor: [], 'editor, a light': [], share: [], lesson: [] });
  });
});
