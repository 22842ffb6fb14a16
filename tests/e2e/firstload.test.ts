// What the first load of a page asks for, in Chromium against the built app: the sign-in page shows its form
// and asks for the session while its fonts are still on the way (held back here for as long as the test
// likes); it downloads no plan screen, no reanimated and no gesture handler (checked against the build's source
// maps); its fonts are WOFF2 subsets, a few tens of kilobytes each, declared with font-display: swap. A read-only
// link loads the plan in a chunk of its own (components/shareScreen.ts), not the editor's workspace chunk. The
// library comes without zod (its dialogs' schemas load when one opens). The app starts in steps (entry.web.js).
import { existsSync, readFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { Client } from '../support/http';
import { holdRequests, sharedBrowser, shot, viewports, watchErrors } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();
const root = join(__dirname, '..', '..');

/** The source files (from the build's source maps, dist-maps/) that the given script URLs were built from. */
function sourcesOf(scriptPaths: string[]): string[] {
  const out: string[] = [];
  for (const p of scriptPaths) {
    const map = join(root, 'dist-maps', `${basename(p)}.map`);
    if (!existsSync(map)) throw new Error(`no source map for ${p} in dist-maps/ (the web build keeps them there)`);
    out.push(...(JSON.parse(readFileSync(map, 'utf8')) as { sources: string[] }).sources);
  }
  return out;
}

describe('first load', () => {
  it('shows the sign-in form and asks for the session before any font arrives, without the plan screens', async () => {
    const context = await browser().newContext({ viewport: viewports.phone, isMobile: true, hasTouch: true, serviceWorkers: 'block' });
    const page = await context.newPage();
    const errors = watchErrors(page);
    // Fonts are held until the test lets them go.
    let release!: () => void;
    const fontsHeld = new Promise<void>((r) => (release = r));
    const fontUrls: string[] = [];
    await page.route(/\.(woff2|ttf|otf)(\?|$)/, async (route) => {
      fontUrls.push(new URL(route.request().url()).pathname);
      await fontsHeld;
      await route.continue();
    });
    const scripts: string[] = [];
    let sessionAsked = false;
    page.on('request', (r) => {
      if (r.resourceType() === 'script') scripts.push(new URL(r.url()).pathname);
      if (new URL(r.url()).pathname.startsWith('/api/auth/get-session')) sessionAsked = true;
    });

    // Not until 'load': the held preloads keep the load event back, which is the point.
    await page.goto(`${base}/sign-in`, { waitUntil: 'commit' });
    await expect.poll(() => page.getByLabel('E-mail').isVisible(), { timeout: 30_000 }).toBe(true);
    await expect.poll(() => sessionAsked, { timeout: 30_000 }).toBe(true);
    // The app started through entry.web.js: the first chunk's libraries evaluated in steps, each a task of its
    // own (each step leaves a User Timing mark), not in one long task.
    const marks = await page.evaluate(() => performance.getEntriesByType('mark').map((m) => m.name).filter((n) => n.startsWith('falloff:start ')));
    expect(marks.length).toBeGreaterThan(4);
    expect(marks).toEqual(marks.map((_, i) => `falloff:start ${i + 1}/${marks.length}`));
    // Still held: the form did not wait for them.
    expect(fontUrls.length).toBeGreaterThan(0);
    release();
    // (A screenshot waits for the fonts, so it is taken once they are let go.)
    await shot(page, 'firstload-sign-in');

    // The fonts: WOFF2 only, each a subset of a few tens of kilobytes, swapped in (never hiding text).
    expect(fontUrls.every((u) => u.endsWith('.woff2'))).toBe(true);
    const html = await (await fetch(`${base}/sign-in`)).text();
    expect(html).toContain('font-display:swap');
    expect(html).toMatch(/<link rel="preload" href="\/fonts\/IBMPlexSans_400Regular\.[0-9a-f]{20}\.woff2" as="font" type="font\/woff2" crossorigin>/);
    for (const u of new Set(fontUrls)) {
      const bytes = (await (await fetch(base + u)).arrayBuffer()).byteLength;
      expect(bytes, u).toBeLessThan(40 * 1024);
    }

    // What the page's scripts were built from: no plan, editor, classes or crew screens, no reanimated, no
    // gesture handler, no colour science, no setup document model, no zod (the form's schema arrives with the
    // first touch: hooks/lazyResolver.ts), no react-native-svg (the web's glyphs are plain SVG), no better-auth
    // client (it too arrives with the first touch: hooks/auth.ts; the session is read with a plain fetch).
    await expect.poll(() => page.getByRole('button', { name: 'Sign in' }).isVisible()).toBe(true);
    expect(scripts.some((s) => /\/workspace-[0-9a-f]+\.js$/.test(s))).toBe(false);
    const sources = sourcesOf(scripts);
    expect(sources.length).toBeGreaterThan(100);
    for (const heavy of ['react-native-reanimated', 'react-native-gesture-handler', 'node_modules/culori', '/components/editor/', '/components/classes/', '/components/crew/', '/components/photos/', '/canvas/PlanCanvas', '/model/document.ts', '/calc/', 'zod/v4/locales/index', 'node_modules/zod/', 'react-native-svg', '/model/forms.ts', 'node_modules/better-auth/', 'node_modules/@better-fetch/', 'node_modules/nanostores/', '/hooks/authClient.ts']) {
      // (The editor's small form fields serve the account page too.)
      expect(sources.filter((s) => s.includes(heavy) && !s.endsWith('/components/editor/fields.tsx')), heavy).toEqual([]);
    }
    // The form still checks with the shared schema, loaded once the visitor touches the page.
    await page.getByLabel('E-mail').fill('not an address');
    await page.getByLabel('Password').fill('x');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByText('enter an e-mail address').isVisible(), { timeout: 30_000 }).toBe(true);
    expect(scripts.some((s) => /\/formSchemas-[0-9a-f]+\.js$/.test(s))).toBe(true);
    expect(scripts.some((s) => /\/authClient-[0-9a-f]+\.js$/.test(s))).toBe(true);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('shows the library without zod, whose schemas arrive when a dialog opens, and the editor without gesture handler', async () => {
    const owner = await new Client(base).signIn(demoUsers.owner.email, DEMO_PASSWORD);
    const context = await browser().newContext({ viewport: viewports.phone, isMobile: true, hasTouch: true, serviceWorkers: 'block' });
    await context.addCookies(
      owner
        .cookieHeader()
        .split('; ')
        .filter(Boolean)
        .map((c) => ({ name: c.slice(0, c.indexOf('=')), value: c.slice(c.indexOf('=') + 1), url: base })),
    );
    const page = await context.newPage();
    const errors = watchErrors(page);
    const scripts: string[] = [];
    page.on('request', (r) => r.resourceType() === 'script' && scripts.push(new URL(r.url()).pathname));
    await page.goto(`${base}/setups`);
    await expect.poll(() => page.getByTestId('setup-card').count(), { timeout: 30_000 }).toBeGreaterThan(0);
    // The library's route chunk and its layouts: the dialogs' forms take their schemas through lazyResolver
    // (components/library/SetupDialogs.tsx), so neither zod nor the forms' schemas come with the page.
    const sources = sourcesOf(scripts.filter((s) => s.startsWith('/_expo/')));
    expect(sources.length).toBeGreaterThan(100);
    for (const heavy of ['node_modules/zod/', '/model/forms.ts', '@hookform/resolvers', '/model/document.ts', '/calc/']) {
      expect(sources.filter((s) => s.includes(heavy)), heavy).toEqual([]);
    }
    expect(scripts.some((s) => /\/formSchemas-[0-9a-f]+\.js$/.test(s))).toBe(false);
    // Opening "New setup" fetches them; the form still checks with the shared schema.
    await page.getByRole('button', { name: 'New setup' }).click();
    await expect.poll(() => scripts.some((s) => /\/formSchemas-[0-9a-f]+\.js$/.test(s)), { timeout: 30_000 }).toBe(true);
    await page.getByRole('button', { name: 'Create and open' }).click();
    await expect.poll(() => page.getByText('give the setup a title').isVisible(), { timeout: 30_000 }).toBe(true);

    // The editor on a phone: its bottom sheet drags with the page's own pointer events
    // (components/editor/sheetDrag.web.tsx), so the page downloads no gesture handler (tests/e2e/phone-sheet.test.ts
    // drags it).
    const setup = (await owner.get<{ setups: { id: string; title: string }[] }>('/api/setups?q=Clamshell%20headshot')).body.setups.find((x) => x.title.startsWith('Clamshell headshot'))!;
    scripts.length = 0;
    // The editor's route starts the plan screens' chunks as it renders (preloadWorkspace), so they evaluate
    // while the setup is still on its way: held here until the workspace's modules have been evaluated.
    let releaseSetup!: () => void;
    const setupHeld = new Promise<void>((r) => (releaseSetup = r));
    await page.route(new RegExp(`/api/setups/${setup.id}$`), async (route) => {
      if (route.request().method() === 'GET') await setupHeld;
      await route.continue();
    });
    await page.goto(`${base}/setups/${setup.id}`, { waitUntil: 'commit' });
    await expect.poll(() => page.evaluate(() => performance.getEntriesByName('falloff:workspace').length), { timeout: 30_000 }).toBe(1);
    releaseSetup();
    await expect.poll(() => page.getByTestId('sheet-handle').isVisible(), { timeout: 30_000 }).toBe(true);
    const editorSources = sourcesOf(scripts.filter((s) => s.startsWith('/_expo/')));
    expect(editorSources.some((s) => s.includes('/components/editor/BottomSheet.tsx'))).toBe(true);
    for (const heavy of ['react-native-gesture-handler', '@egjs/hammerjs']) expect(editorSources.filter((s) => s.includes(heavy)), heavy).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('paints the read-only page’s frame and words before its plan chunk arrives', async () => {
    const owner = await new Client(base).signIn(demoUsers.owner.email, DEMO_PASSWORD);
    const setup = (await owner.get<{ setups: { id: string; title: string }[] }>('/api/setups?q=Clamshell%20headshot')).body.setups.find((x) => x.title.startsWith('Clamshell headshot'))!;
    const made = await owner.post<{ url: string }>(`/api/setups/${setup.id}/shares`, { label: 'First load shell test' });
    expect(made.status).toBe(201);
    const context = await browser().newContext({ viewport: viewports.phone, isMobile: true, hasTouch: true, serviceWorkers: 'block' });
    const page = await context.newPage();
    const errors = watchErrors(page);
    // The share chunk is held until the test lets it go.
    const release = await holdRequests(page, /\/shareScreen-[0-9a-f]+\.js$/);
    await page.goto(new URL(new URL(made.body.url).pathname, base).href, { waitUntil: 'commit' });
    // components/SharedShell.tsx: the route's fallback, painted with the first chunks (the page's first
    // contentful paint), not a spinner.
    await expect.poll(() => page.getByText('Opening the shared setup…').isVisible(), { timeout: 30_000 }).toBe(true);
    expect(await page.getByText('FALLOFF · READ-ONLY').isVisible()).toBe(true);
    await expect.poll(() => page.evaluate(() => performance.getEntriesByName('first-contentful-paint').length), { timeout: 30_000 }).toBe(1);
    release();
    await expect.poll(() => page.getByTestId('shared-camera').isVisible(), { timeout: 30_000 }).toBe(true);
    expect(await page.getByText('Opening the shared setup…').count()).toBe(0);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('loads the read-only plan with a link, without the editor’s chunk', async () => {
    const owner = await new Client(base).signIn(demoUsers.owner.email, DEMO_PASSWORD);
    // A demo setup by name: the owner's newest setup is whatever another test file made last (an empty plan reads
    // no meter, and the reading below would be '—').
    const setup = (await owner.get<{ setups: { id: string; title: string }[] }>('/api/setups?q=Clamshell%20headshot')).body.setups.find((x) => x.title.startsWith('Clamshell headshot'))!;
    expect(setup, 'the demo clamshell setup').toBeTruthy();
    const made = await owner.post<{ url: string }>(`/api/setups/${setup.id}/shares`, { label: 'First load test' });
    expect(made.status).toBe(201);
    const context = await browser().newContext({ viewport: viewports.phone, isMobile: true, hasTouch: true, serviceWorkers: 'block' });
    const page = await context.newPage();
    const errors = watchErrors(page);
    const scripts: string[] = [];
    const workers: string[] = [];
    page.on('request', (r) => r.resourceType() === 'script' && scripts.push(new URL(r.url()).pathname));
    page.on('worker', (w) => workers.push(new URL(w.url()).pathname));
    const sharedAsks: string[] = [];
    page.on('request', (r) => /^\/api\/shared\/[^/]+$/.test(new URL(r.url()).pathname) && sharedAsks.push(r.url()));
    await page.goto(new URL(new URL(made.body.url).pathname, base).href);
    await expect.poll(() => page.getByTestId('shared-camera').isVisible(), { timeout: 30_000 }).toBe(true);
    expect(await page.getByTestId('shared-plan').locator('svg').count()).toBeGreaterThan(0);
    // The readings come from the live meter's Web Worker (canvas/useReadings.ts), after the plan: an aperture
    // at the subject, and the same in the sheet's meter section.
    await expect.poll(() => page.getByTestId('shared-subject').textContent(), { timeout: 30_000 }).toMatch(/^f\/\d/);
    const subject = (await page.getByTestId('shared-subject').textContent())!;
    await expect.poll(() => page.getByText('At the subject').first().isVisible()).toBe(true);
    expect(await page.getByText(subject, { exact: true }).count()).toBeGreaterThanOrEqual(2);
    expect(workers).toContain('/workers/meter.js');
    // One meter worker: started while the setup was on its way (warmMeterEngine) and taken by the screen.
    expect(workers.filter((w) => w === '/workers/meter.js')).toHaveLength(1);
    // The setup asked for once, by the route as it rendered (hooks/sharedEarly.ts), before the share chunk's
    // modules were evaluated (its first step's mark), and that answer taken by the screen.
    expect(sharedAsks).toHaveLength(1);
    const [askedAt, firstStep] = await page.evaluate(() => [
      performance.getEntriesByType('resource').find((e) => /\/api\/shared\/[^/]+$/.test(new URL(e.name).pathname))?.startTime ?? NaN,
      performance.getEntriesByName('falloff:share 1/6')[0]?.startTime ?? NaN,
    ]);
    expect(askedAt).toBeLessThan(firstStep!);
    // Its own chunk (the plan, the meter, the document model), not the editor's workspace chunk.
    expect(scripts.some((s) => /\/shareScreen-[0-9a-f]+\.js$/.test(s))).toBe(true);
    expect(scripts.some((s) => /\/workspace-[0-9a-f]+\.js$/.test(s))).toBe(false);
    // The page's HTML preloads the layouts and names the route's chunk and the plan's chunk (not the editor's)
    // for the first chunk to preload (entry.web.js), so they download while the first chunk evaluates; each is
    // fetched once (the preload is used).
    const html = await (await fetch(new URL(new URL(made.body.url).pathname, base))).text();
    const preloads = [...html.matchAll(/<link rel="preload" href="([^"]+\.js)" as="script"/g)].map((m) => m[1]!);
    const later = (/<meta name="falloff-later-scripts" content="([^"]*)">/.exec(html)?.[1] ?? '').split(' ').filter(Boolean);
    expect(preloads.some((s) => /\/_layout-[0-9a-f]+\.js$/.test(s))).toBe(true);
    expect(later.some((s) => /\/\[token\]-[0-9a-f]+\.js$/.test(s))).toBe(true);
    expect(later.some((s) => /\/shareScreen-[0-9a-f]+\.js$/.test(s))).toBe(true);
    expect([...preloads, ...later].some((s) => /\/workspace-[0-9a-f]+\.js$/.test(s))).toBe(false);
    expect(await page.evaluate(() => Array.from(document.querySelectorAll<HTMLLinkElement>('link[rel="preload"][as="script"]'), (l) => new URL(l.href).pathname))).toEqual(expect.arrayContaining(later));
    for (const p of [...preloads, ...later]) expect(scripts.filter((s) => s === p), p).toHaveLength(1);
    // (The meter's and the frame's workers, bundled apart from the app, have no map there.)
    const sources = sourcesOf(scripts.filter((s) => s.startsWith('/_expo/')));
    // Nor gesture handler (the plan reads pointer events on the web), the forms library, or culori's colour
    // spaces CSS does not write (web/culoriCss.js).
    // Nor better-auth's client: who is signed in is read with a plain fetch (hooks/session.ts).
    expect(scripts.some((s) => /\/authClient-[0-9a-f]+\.js$/.test(s))).toBe(false);
    // Nor the classes' model and page parts (the comments take an item's name from model/kinds.ts and the error
    // words from components/errorText.ts), nor the frame's renderer (the frame worker renders; the page loads it,
    // a chunk of its own, only without a worker: components/frame/engine.ts).
    for (const heavy of ['node_modules/better-auth/', 'node_modules/@better-fetch/', '/hooks/authClient.ts', '/components/editor/EditorScreen', '/components/editor/Inspector', '/components/classes/LessonBuilder', '/components/classes/ReviewScreen', '/components/side/', 'react-native-gesture-handler', '@egjs/hammerjs', 'react-hook-form', 'culori/src/cubehelix', 'culori/src/okhsl', '/model/classes.ts', '/components/classes/parts.tsx', '/calc/frame/render.ts']) {
      expect(sources.filter((s) => s.includes(heavy)), heavy).toEqual([]);
    }
    // Every group layout loads on every page; what two of them share comes once (scripts/chunkTiers.cjs).
    const twice = sources.filter((s, i) => !s.includes('empty-module') && sources.indexOf(s) !== i);
    expect(twice).toEqual([]);
    // Nor a library twice, as its ES and its CommonJS build (a `require` by a package's name resolves to the
    // latter: components/shareScreen.ts requires only our own modules).
    const stems = sources.map((s) => s.replace(/\.(c|m)?js$/, ''));
    expect(sources.filter((s, i) => /\.(c|m)?js$/.test(s) && stems.indexOf(stems[i]!) !== i)).toEqual([]);
    // The share chunk's modules evaluated in steps, each a task of its own (components/shareScreen.ts).
    const shareMarks = await page.evaluate(() => performance.getEntriesByType('mark').map((m) => m.name).filter((n) => n.startsWith('falloff:share ')));
    expect(shareMarks.length).toBeGreaterThan(3);
    expect(shareMarks).toEqual(shareMarks.map((_, i) => `falloff:share ${i + 1}/${shareMarks.length}`));
    expect(errors).toEqual([]);
    await context.close();
  });
});
