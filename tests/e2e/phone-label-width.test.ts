// The plan's label boxes (drawing/textWidth.ts) against the browser: the app's own label face, loaded in
// Chromium, measured with canvas measureText at the phone's label size; every box is within 3 % of it, so
// labels placed clear of each other are clear on screen too.
import { expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { LABEL_PX } from '../../drawing/labels';
import { textWidthEm } from '../../drawing/textWidth';
import { sharedBrowser, viewports } from '../support/browser';

const base = inject('baseUrl');
const browser = sharedBrowser();

const words = ['Key · 1.90 m', 'Rim left · 2.00 m · −20°', 'Hair light', 'Beauty dish, 22″', 'Sitter', 'WWW', 'iiii', 'Ève à côté', '85 mm'];

it('label widths agree with the browser’s measureText in the app’s fonts', async () => {
  const context = await browser().newContext({ viewport: viewports.phone, hasTouch: true, isMobile: true });
  const page = await context.newPage();
  expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers.owner.email, password: DEMO_PASSWORD }, headers: { origin: base } })).status()).toBe(200);
  await page.goto(`${base}/setups`);
  await page.getByRole('heading').first().waitFor({ timeout: 30_000 });
  const measured = await page.evaluate(
    async ({ words, px }) => {
      const faces = { sans: `${px}px IBMPlexSans_500Medium`, mono: `${px}px IBMPlexMono_400Regular` };
      await Promise.all(Object.values(faces).map((f) => document.fonts.load(f)));
      await document.fonts.ready;
      const ctx = document.createElement('canvas').getContext('2d')!;
      const loaded = Object.values(faces).every((f) => document.fonts.check(f));
      const width = (font: string, w: string) => {
        ctx.font = font;
        return ctx.measureText(w).width;
      };
      return { loaded, sans: words.map((w) => width(faces.sans, w)), mono: words.map((w) => width(faces.mono, w)) };
    },
    { words, px: LABEL_PX },
  );
  expect(measured.loaded).toBe(true);
  words.forEach((w, k) => {
    const sans = textWidthEm(w, false) * LABEL_PX;
    const mono = textWidthEm(w, true) * LABEL_PX;
    expect(Math.abs(sans - measured.sans[k]!), `${w}: ${sans.toFixed(1)} px vs ${measured.sans[k]!.toFixed(1)} px`).toBeLessThanOrEqual(0.03 * measured.sans[k]! + 0.5);
    expect(Math.abs(mono - measured.mono[k]!), `${w} (mono)`).toBeLessThanOrEqual(0.03 * measured.mono[k]! + 0.5);
  });
  await context.close();
});
