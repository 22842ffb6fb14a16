import { chromium } from 'playwright-core';
import { appPages, launchChromium } from './loadPages';
async function main() {
  const { specs, cookies, close } = await appPages();
  const browser = await launchChromium(chromium);
  const spec = specs.find((s) => s.name === 'editor')!;
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, serviceWorkers: process.env.SW === 'block' ? 'block' : 'allow' });
  await context.addCookies(cookies);
  const page = await context.newPage();
  page.on('console', (m) => console.log('console', m.type(), m.text().slice(0, 200)));
  page.on('pageerror', (e) => console.log('pageerror', e.message));
  page.on('worker', (w) => { console.log('worker started', w.url()); w.on('close', () => console.log('worker closed', w.url())); });
  await page.goto(spec.url);
  await page.getByTestId('meter-subject').first().waitFor({ timeout: 30000 });
  console.log('first load ok; sw controller', await page.evaluate('!!navigator.serviceWorker && !!navigator.serviceWorker.controller'));
  await page.waitForTimeout(3000);
  await page.reload();
  await page.waitForTimeout(8000);
  console.log('after reload: sw controller', await page.evaluate('!!navigator.serviceWorker && !!navigator.serviceWorker.controller'), 'pending', await page.getByTestId('meter-pending').count(), 'subject', await page.getByTestId('meter-subject').count(), 'marks', await page.evaluate(`performance.getEntriesByType('mark').map((m) => m.name).filter((n) => !n.includes('start')).join(',')`));
  await browser.close();
  await close();
}
main().catch((e) => { console.error(e); process.exit(1); });
