// What the first-load benchmarks share (load.bench.ts, startProfile.bench.ts): the phone profile, the app's
// pages with the moment each is usable, and a fresh phone-profile page in Debian's Chromium.
import type { Browser, BrowserContext, CDPSession, Page } from 'playwright-core';
import { startServer } from '../../server/main';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { TEST_DATABASE_URL } from '../support/env';
import { Client } from '../support/http';

/** CPU slowed 4×, about 1.6 Mbps down / 750 kbps up, 150 ms round trips. */
export const phone = { downKbps: 1600, upKbps: 750, rttMs: 150, cpu: 4 };

export type PageSpec = { name: string; url: string; cookies?: boolean; usable: string };
export type Cookie = { name: string; value: string; url: string };

export const has = (sel: string) => `document.querySelector(${JSON.stringify(sel)})`;

/** The demo setup the editor and share pages open. */
export const BENCH_SETUP = 'Teal backdrop, warm key';

/** The app's server on a free port, the demo owner's cookies, and the app's pages (sign-in, library, editor, share). */
export async function appPages(): Promise<{ specs: PageSpec[]; cookies: Cookie[]; close: () => Promise<void> }> {
  const app = await startServer({ databaseUrl: TEST_DATABASE_URL, port: 0, logLevel: 'error' });
  const base = app.url;
  // The demo owner's session (signed in once, through the API) and one of their setups, and a read-only link to it.
  const owner = await new Client(base).signIn(demoUsers.owner.email, DEMO_PASSWORD);
  // Always the same demo setup (seven items, a wash on the background): the newest setup was whatever a test run
  // had made last in the test database, so the editor's figure depended on what ran before the bench.
  const list = await owner.get<{ setups: { id: string; title: string }[] }>(`/api/setups?q=${encodeURIComponent(BENCH_SETUP)}`);
  const setup = list.body.setups?.find((s) => s.title === BENCH_SETUP);
  if (list.status !== 200 || !setup) throw new Error(`the demo owner has no setup "${BENCH_SETUP}": ${list.status}`);
  const made = await owner.post<{ url: string }>(`/api/setups/${setup.id}/shares`, { label: 'Load bench' });
  if (made.status !== 201) throw new Error(`making a link failed: ${made.status} ${JSON.stringify(made.body)}`);
  const shareUrl = new URL(new URL(made.body.url).pathname, base).href;
  const cookies = owner
    .cookieHeader()
    .split('; ')
    .filter(Boolean)
    .map((c) => ({ name: c.slice(0, c.indexOf('=')), value: c.slice(c.indexOf('=') + 1), url: base }));
  const specs: PageSpec[] = [
    // The form is in the page's HTML (rendered at build time): usable once React has taken the e-mail field over
    // (hydrated), so that a press on "Sign in" does something.
    {
      name: 'sign-in',
      url: `${base}/sign-in`,
      usable: `() => { const el = ${has('input[type="email"], input[autocomplete="email"], input[aria-label="E-mail"]')}; return !!el && Object.keys(el).some((k) => k.startsWith('__reactFiber')); }`,
    },
    { name: 'library', url: `${base}/setups`, cookies: true, usable: `() => ${has('[data-testid="setup-card"]')}` },
    {
      name: 'editor',
      url: `${base}/setups/${setup.id}`,
      cookies: true,
      usable: `() => document.querySelectorAll('[data-testid="plan"] [data-testid^="item-"]').length > 0 && /^Subject/.test(${has('[data-testid="meter-peek"]')}?.textContent ?? '')`,
    },
    {
      name: 'share',
      url: shareUrl,
      usable: `() => ${has('[data-testid="shared-plan"] svg')} && ${has('[data-testid="shared-camera"]')} && /^f\\//.test(${has('[data-testid="shared-subject"]')}?.textContent ?? '')`,
    },
  ];
  return { specs, cookies, close: () => app.close() };
}

export function launchChromium(chromium: { launch: (o: object) => Promise<Browser> }): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}

/** A fresh context and page on the phone profile (cache off, service workers blocked), its DevTools session. */
export async function phonePage(browser: Browser, spec: PageSpec, cookies: Cookie[]): Promise<{ context: BrowserContext; page: Page; cdp: CDPSession }> {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 3, isMobile: true, hasTouch: true, serviceWorkers: 'block' });
  if (spec.cookies) await context.addCookies(cookies);
  const page = await context.newPage();
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
  await cdp.send('Network.emulateNetworkConditions', {
    offline: false,
    latency: phone.rttMs,
    downloadThroughput: (phone.downKbps * 1000) / 8,
    uploadThroughput: (phone.upKbps * 1000) / 8,
  });
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: phone.cpu });
  return { context, page, cdp };
}

/** Package (node_modules/<name> or @scope/name) or our own top folder for a source path from a map. */
export function ownerOf(source: string): string {
  const nm = source.lastIndexOf('node_modules/');
  if (nm >= 0) {
    const rest = source.slice(nm + 'node_modules/'.length).split('/');
    return rest[0]!.startsWith('@') ? `${rest[0]}/${rest[1]}` : rest[0]!;
  }
  const parts = source.replace(/^(\.\.\/|\.\/|\/)+/, '').split('/');
  return parts.length > 1 ? `${parts[0]}/ (ours)` : `${parts[0]} (ours)`;
}
