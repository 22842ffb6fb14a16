// What the comment e2e tests share: a person with a confirmed account in their own browser context, a studio
// with a crew member, the centre of an element, and the photographer's half of a thread (the pin on its item,
// a reply, resolved).
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { expect } from 'vitest';
import { viewports, watchErrors } from './browser';
import { Client, freshEmail } from './http';

export async function centreOf(l: Locator): Promise<{ x: number; y: number }> {
  const b = (await l.boundingBox())!;
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}

type Send = (method: 'POST' | 'PUT', path: string, data: unknown) => Promise<any>;
const sender =
  (base: string, c: BrowserContext): Send =>
  async (method, path, data) => {
    const r = await c.request.fetch(`${base}/api${path}`, { method, data, headers: { origin: base } });
    expect(r.ok(), await r.text()).toBe(true);
    return r.json();
  };

export type Person = { context: BrowserContext; page: Page; email: string; errors: string[]; send: Send };

/** Sign a new person up and confirm the address through the mailed link (which signs the context in). */
export async function newPerson(base: string, browser: Browser, o: { viewport: keyof typeof viewports; name: string; password: string; touch?: boolean }): Promise<Person> {
  const context = await browser.newContext({ viewport: viewports[o.viewport], locale: 'en-US', acceptDownloads: true, ...(o.touch ? { isMobile: true, hasTouch: true } : {}) });
  const email = freshEmail(o.name.split(' ')[0]!.toLowerCase());
  const r = await context.request.post(`${base}/api/auth/sign-up/email`, { data: { name: o.name, email, password: o.password }, headers: { origin: base } });
  expect(r.status()).toBe(200);
  const link = await new Client(base).mailedLink(email, '/api/auth/verify-email');
  expect((await context.request.get(link)).ok()).toBe(true);
  const page = await context.newPage();
  return { context, page, email, errors: watchErrors(page), send: sender(base, context) };
}

/** A studio of the owner's with the other person in it as crew; returns the studio. */
export async function studioWithCrew(owner: Person, crew: Person, name: string): Promise<{ id: string }> {
  const studio = await owner.send('POST', '/studios', { name });
  const inv = await owner.send('POST', `/studios/${studio.id}/members`, { email: crew.email, role: 'crew' });
  await crew.send('POST', `/invitations/${inv.link.slice(inv.link.lastIndexOf('/') + 1)}/accept`, {});
  return studio;
}

/** On the photographer's open setup: the one thread's pin sits on its item in the comment plan; reply to it,
 *  then (after `between`, e.g. a screenshot) resolve it. */
export async function replyAndResolve(o: Page, itemId: string, reply: string, between: (thread: Locator) => Promise<void>): Promise<void> {
  const thread = o.getByTestId('comment-thread');
  // Both measured in one go, and again until they agree: the page may still be scrolling or laying out
  // between two separate measurements (seen once: the pin 71 px below its item, the x within 20).
  const offset = async () => {
    const [pin, item] = await Promise.all([centreOf(o.getByTestId('comment-plan').getByLabel('Comment 1')), centreOf(o.getByTestId('comment-plan').getByTestId(`pin-item-${itemId}`))]);
    return { dx: Math.round(Math.abs(pin.x - item.x)), dy: Math.round(Math.abs(pin.y - item.y)) };
  };
  await expect.poll(async () => {
    const d = await offset();
    return d.dx < 20 && d.dy < 40 ? 'on its item' : `off by ${d.dx}, ${d.dy} px`;
  }, { timeout: 15_000 }).toBe('on its item');
  await thread.getByRole('button', { name: 'Reply' }).click();
  await o.getByLabel('Your reply').fill(reply);
  await o.getByRole('button', { name: 'Send the reply' }).click();
  await expect.poll(() => o.getByTestId('comment-reply').count(), { timeout: 15_000 }).toBe(1);
  await expect.poll(() => thread.getByRole('button', { name: 'Reply' }).count(), { timeout: 15_000 }).toBe(1);
  await between(thread);
  await thread.getByRole('button', { name: 'Resolve' }).click();
  await expect.poll(() => o.getByText('Show resolved (1)').count(), { timeout: 15_000 }).toBe(1);
}
