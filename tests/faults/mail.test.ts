// Mail accepted while the mail server is away is delivered once it is back, exactly once: the server queues it
// in PostgreSQL (server/mail/queue.ts) and its worker retries.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { startFakes, type Fakes } from '../../server/fakes';
import { startChildServer, type ChildServer } from '../support/child';
import { Client, freshEmail } from '../support/http';
import { startCluster } from '../support/pg';

let fakes: Fakes;
let server: ChildServer;
const s3Dir = mkdtempSync(join(tmpdir(), 'falloff-s3-'));

beforeAll(async () => {
  startCluster();
  fakes = await startFakes({ s3Dir });
  server = await startChildServer({ FALLOFF_TEST_SMTP_PORT: String(fakes.smtp.port) });
});

afterAll(async () => {
  await server?.stop();
  await fakes?.smtp.start();
  await fakes?.close();
  rmSync(s3Dir, { recursive: true, force: true });
});

const mailTo = (to: string) => fakes.inbox.list().filter((m) => m.to.includes(to));
/** Mail to `to` other than its address confirmation (sent at sign-up, before the mail server went away). */
const resetsTo = (to: string) => mailTo(to).filter((m) => !m.text.includes('/api/auth/verify-email'));

/** A signed-in account whose address is confirmed (inviting people needs that), through the link it was mailed
 *  (this child server has no /dev/inbox: the test reads the fake SMTP server's inbox itself). */
async function confirmed(name: string, email: string): Promise<Client> {
  const c = await new Client(server.url).signUp(name, email, 'a fine long password');
  const until = Date.now() + 30_000;
  let link: string | undefined;
  while (!link && Date.now() < until) {
    link = mailTo(email).map((m) => m.text.match(/https?:\/\/\S*\/api\/auth\/verify-email[^\s"<>]*/)?.[0]).find(Boolean);
    if (!link) await new Promise((r) => setTimeout(r, 100));
  }
  if (!link) throw new Error(`no confirmation mail to ${email}`);
  const v = await c.get(new URL(link).pathname + new URL(link).search);
  expect([200, 302]).toContain(v.status);
  return c;
}

test('SMTP down: a reset and an invitation are accepted, and arrive once each when it returns', async () => {
  const owner = freshEmail('owner');
  const forgetful = freshEmail('forgetful');
  const invitee = freshEmail('invitee');
  const c = await confirmed('Queue Owner', owner);
  await confirmed('Forgetful', forgetful);
  const studio = await c.post('/api/studios', { name: 'Queued studio' });
  expect(studio.status).toBe(201);

  await fakes.smtp.stop();
  const reset = await new Client(server.url).post('/api/auth/request-password-reset', { email: forgetful, redirectTo: '/reset-password' });
  expect(reset.status, JSON.stringify(reset.body)).toBe(200);
  const invite = await c.post(`/api/studios/${studio.body.id}/members`, { email: invitee, role: 'crew' });
  expect(invite.status, JSON.stringify(invite.body)).toBe(201);

  // Away long enough for the first tries to fail.
  await new Promise((r) => setTimeout(r, 3_000));
  expect(resetsTo(forgetful)).toEqual([]);
  expect(mailTo(invitee)).toEqual([]);

  const back = Date.now();
  await fakes.smtp.start();
  await expect.poll(() => resetsTo(forgetful).length + mailTo(invitee).length, { timeout: 60_000, interval: 250 }).toBe(2);
  console.log(`[faults] queued mail delivered ${((Date.now() - back) / 1000).toFixed(1)} s after SMTP returned`);
  // And no second copy follows.
  await new Promise((r) => setTimeout(r, 4_000));
  expect(resetsTo(forgetful).map((m) => m.subject)).toEqual(['Reset your Falloff password']);
  expect(mailTo(invitee).map((m) => m.subject)).toEqual(['Join Queued studio on Falloff']);
  expect(server.exited()).toBe(false);
}, 120_000);

test('a reset answers 200 only when its mail is queued: with no mail service every reset gets the same 503, account or not', async () => {
  const noMail = await startChildServer({});
  try {
    const email = freshEmail('no-mail');
    await new Client(noMail.url).signUp('No Mail', email, 'a fine long password');
    const known = await new Client(noMail.url).post('/api/auth/request-password-reset', { email, redirectTo: '/reset-password' });
    const unknown = await new Client(noMail.url).post('/api/auth/request-password-reset', { email: freshEmail('nobody'), redirectTo: '/reset-password' });
    for (const r of [known, unknown]) {
      expect(r.status, JSON.stringify(r.body)).toBe(503);
      expect(r.headers.get('retry-after')).toBe('60');
      expect(r.body.error.code).toBe('mail_unavailable');
    }
    // The same words either way: the answer does not say whether the account exists.
    expect(known.body).toEqual(unknown.body);
  } finally {
    await noMail.stop();
  }
}, 120_000);
