// The one Chromium drag driver of the editor's benches (editor.bench.ts, frame-drag.bench.ts) and the drag
// profile (editorProfile.ts): a test server and Debian's Chromium, a setup opened in the editor under a
// signed-in account, and a drag sent as a hand makes one — a press, pointer moves at 60 Hz through the DevTools
// protocol without waiting for the page (a hand does not wait either), a release — plus the page's main-thread
// busy time (CDP Performance.getMetrics) around it.
import { chromium, type Browser, type BrowserContext, type CDPSession, type Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { startServer } from '../../server/main';
import { TEST_DATABASE_URL } from '../support/env';

export const MOVES = 90;
export const MOVE_MS = 1000 / 60;
/** Wall-clock milliseconds, comparable with the page's `performance.timeOrigin + performance.now()`. */
export const now = () => performance.timeOrigin + performance.now();
type Point = { x: number; y: number };

export type Bench = { url: string; browser: Browser; close: () => Promise<void> };

export async function startBench(): Promise<Bench> {
  const server = await startServer({ databaseUrl: TEST_DATABASE_URL, port: 0, logLevel: 'error' });
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  return {
    url: server.url,
    browser,
    close: async () => {
      await browser.close();
      await server.close();
    },
  };
}

export type Opened = { context: BrowserContext; page: Page; cdp: CDPSession };

/**
 * A new browser context of `viewport` signed in (the demo owner, or a fresh account of its own), `document`
 * saved as a new setup and opened in the editor; resolves once the element `ready` (a test id) is shown. With
 * `cpuSlowdown`, the CPU is slowed by CDP throttling before the page is asked for (and stays slowed).
 */
export async function openSetup(
  bench: Bench,
  o: { viewport: { width: number; height: number }; account: 'demo' | 'fresh'; title: string; document: unknown; ready: string; cpuSlowdown?: number },
): Promise<Opened> {
  const context = await bench.browser.newContext({ viewport: o.viewport });
  const origin = { origin: bench.url };
  let email: string = demoUsers.owner.email;
  let password = DEMO_PASSWORD;
  if (o.account === 'fresh') {
    // A sign-up does not sign in (the address is confirmed by mail); the test server lets the account in.
    email = `drag-bench-${Date.now().toString(36)}@bench.test`;
    password = 'drag-bench-password-1';
    await context.request.post(`${bench.url}/api/auth/sign-up/email`, { data: { name: 'Drag Bench', email, password }, headers: origin });
  }
  const signIn = await context.request.post(`${bench.url}/api/auth/sign-in/email`, { data: { email, password }, headers: origin });
  if (!signIn.ok()) throw new Error(`signing in: ${signIn.status()} ${await signIn.text()}`);
  const res = await context.request.post(`${bench.url}/api/setups`, { data: { title: o.title, document: o.document }, headers: origin });
  if (!res.ok()) throw new Error(`making the bench's setup: ${res.status()} ${await res.text()}`);
  const { id } = (await res.json()) as { id: string };
  const page = await context.newPage();
  const cdp = await context.newCDPSession(page);
  // A CPU slowdown asked for here holds from the page's first byte (the setup opens on the slow CPU).
  if (o.cpuSlowdown && o.cpuSlowdown > 1) await cdp.send('Emulation.setCPUThrottlingRate', { rate: o.cpuSlowdown });
  await page.goto(`${bench.url}/setups/${id}`);
  await page.getByTestId(o.ready).waitFor({ timeout: 60_000 });
  await cdp.send('Performance.enable');
  return { context, page, cdp };
}

/** The page's main-thread busy time so far, seconds: all tasks, and script alone. */
export async function busyTime(cdp: CDPSession): Promise<{ task: number; script: number }> {
  const { metrics } = (await cdp.send('Performance.getMetrics')) as { metrics: { name: string; value: number }[] };
  const v = (n: string) => metrics.find((x) => x.name === n)?.value ?? 0;
  return { task: v('TaskDuration'), script: v('ScriptDuration') };
}

/** Where an element's box is centred on the page (the element with test id `testId`). */
export async function centreOf(page: Page, testId: string): Promise<Point> {
  const box = await page.getByTestId(testId).first().boundingBox();
  if (!box) throw new Error(`${testId} is not on the page`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

export type Sent = { t: number; x: number; y: number };

/**
 * One drag: a press at `from`, `moves` pointer moves to `from + step(k)` sent on a 60 Hz schedule without
 * waiting for the page, and a release where the last move went. Returns each move's position and the moment it
 * was sent, and when the moves began and ended (the release follows at once).
 */
export async function drag(cdp: CDPSession, from: Point, step: (k: number) => Point, moves = MOVES): Promise<{ sent: Sent[]; t0: number; t1: number }> {
  const send = (m: Record<string, unknown>) => cdp.send('Input.dispatchMouseEvent', m as never);
  await send({ type: 'mouseMoved', x: from.x, y: from.y, button: 'none' });
  await send({ type: 'mousePressed', x: from.x, y: from.y, button: 'left', buttons: 1, clickCount: 1 });
  const sent: Sent[] = [];
  const t0 = now();
  const inFlight: Promise<unknown>[] = [];
  for (let k = 1; k <= moves; k++) {
    const wait = t0 + k * MOVE_MS - now();
    if (wait > 0) await new Promise((r) => setTimeout(r, wait));
    const d = step(k);
    const at = { t: now(), x: from.x + d.x, y: from.y + d.y };
    sent.push(at);
    inFlight.push(send({ type: 'mouseMoved', x: at.x, y: at.y, button: 'left', buttons: 1 }));
  }
  await Promise.all(inFlight);
  const t1 = now();
  const last = sent.at(-1) ?? { x: from.x, y: from.y };
  await send({ type: 'mouseReleased', x: last.x, y: last.y, button: 'left', buttons: 0, clickCount: 1 });
  return { sent, t0, t1 };
}

/** The median of three runs' figure `k`. */
export const midRun = <R, K extends keyof R>(runs: R[], k: K) => (runs.map((r) => r[k]) as number[]).sort((a, b) => a - b)[Math.floor(runs.length / 2)]!;

export const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.floor(q * s.length))]! : NaN;
};
