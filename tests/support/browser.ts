// Debian's Chromium driven by playwright-core (never a downloaded browser), with the flags this machine needs.
// playwright gives every launch a fresh, empty profile of its own.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type Locator, type Page } from 'playwright-core';
import { afterAll, beforeAll, expect } from 'vitest';

export const viewports = {
  phone: { width: 390, height: 844 },
  wide: { width: 1440, height: 900 },
} as const;
export type ViewportName = keyof typeof viewports;

export const artifactsDir = join(__dirname, '..', '.artifacts');

export async function launch(): Promise<{ browser: Browser; close: () => Promise<void> }> {
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  return {
    browser,
    close: () => browser.close(),
  };
}

/** A screenshot for a person to look at (tests/.artifacts is git-ignored). */
export async function shot(page: Page, name: string) {
  mkdirSync(artifactsDir, { recursive: true });
  await page.screenshot({ path: join(artifactsDir, `${name}.png`) });
}

/** Holds back the page's requests whose URL matches `re` until the returned function is called. */
export async function holdRequests(page: Page, re: RegExp): Promise<() => void> {
  let release!: () => void;
  const held = new Promise<void>((r) => (release = r));
  await page.route(re, async (route) => {
    await held;
    await route.continue();
  });
  return release;
}

/** Fail the test on any uncaught error in the page. */
export function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  return errors;
}

/** One Chromium for a test file: launched before its tests, closed after. Call at the top of the file. */
export function sharedBrowser(): () => Browser {
  let browser: Browser | undefined;
  let close: (() => Promise<void>) | undefined;
  beforeAll(async () => {
    ({ browser, close } = await launch());
  });
  afterAll(async () => close?.());
  return () => {
    if (!browser) throw new Error('the browser is not launched yet');
    return browser;
  };
}

/** A mouse drag in steps, as a finger or a mouse moves (gestures need the moves in between). */
export async function dragMouse(page: Page, from: { x: number; y: number }, to: { x: number; y: number }, steps = 12) {
  await page.mouse.move(from.x, from.y);
  await page.mouse.down();
  for (let k = 1; k <= steps; k++) await page.mouse.move(from.x + ((to.x - from.x) * k) / steps, from.y + ((to.y - from.y) * k) / steps);
  await page.mouse.up();
}

/** On a phone the editor's sheet is dragged up by its handle to work in it, and down to see the plan; waits
 *  for its spring to settle so nothing is pressed under a moving sheet. */
/**
 * Where a plan item is once the plan stops moving: the editor re-fits the plan to the room above the phone's sheet
 * as the sheet settles and as the page lays out, so a box read at once can be where the item was a frame ago (a
 * tap there selects nothing or another item). Polls until two reads 150 ms apart agree.
 */
type Box = { x: number; y: number; width: number; height: number };
export async function settledBox(locator: Locator): Promise<Box> {
  let last = null as Box | null;
  let box = null as Box | null;
  await expect
    .poll(
      async () => {
        box = await locator.boundingBox();
        const same = !!box && !!last && Math.abs(box.x - last.x) < 0.5 && Math.abs(box.y - last.y) < 0.5 && Math.abs(box.width - last.width) < 0.5;
        last = box;
        return same;
      },
      { interval: 150, timeout: 10_000 },
    )
    .toBe(true);
  return box!;
}

export async function dragSheet(page: Page, open: boolean) {
  // The handle is a button of its own (a tap steps the sheet's height); the drag starts in the handle's row beside it,
  // once the sheet has stopped moving (a tap on an item raises it): a handle read mid-move puts the press on the kit row.
  const handle = await settledBox(page.getByTestId('sheet-handle'));
  const x = handle.x + handle.width + 30;
  const y = handle.y + handle.height / 2;
  // Stay inside the viewport: a pointer released outside it never reaches the page.
  const bottom = (page.viewportSize()?.height ?? 844) - 4;
  await dragMouse(page, { x, y }, { x, y: open ? Math.max(4, y - 480) : bottom });
  let last = NaN;
  await expect
    .poll(
      async () => {
        const now = (await page.getByTestId('sheet-handle').boundingBox())!.y;
        const settled = Math.abs(now - last) < 0.5;
        last = now;
        return settled;
      },
      { interval: 150, timeout: 5000 },
    )
    .toBe(true);
}
