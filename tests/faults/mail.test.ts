// Mail accepted while the mail server is away is delivered once it is back, exactly once: the server queues it
// in PostgreSQL (server/mail/queue.ts) and its worker retries.
import { afterAll, beforeAll, expect, test } from 'vitest';
import { Client, freshEmail } from '../support/http';
import { startMailFaults, type MailFaults } from '../support/mailFaults';

let m: MailFaults;
beforeAll(async () => {
  m = await startMailFaults();
}, 90_000);
afterAll(() => m?.close());

const mailTo = (to: string) => m.mailTo(to);
/** Mail to `to` other than its address confirmation (sent at sign-up, before the mail server went away). */
const resetsTo = (to: string) => mailTo(to).filter((x) => !x.text.includes('/api/auth/verify-email'));
const confirmed = (name: string, email: string) => m.confirmed(name, email);

test('SMTP down: a reset and an invitation are accepted, and arrive once each when it returns', async () => {
  const owner = freshEmail('owner');
  const forgetful = freshEmail('forgetful');
  const invitee = freshEmail('invitee');
  const c = await confirmed('Queue Owner', owner);
  await confirmed('Forgetful', forgetful);
  const studio = await c.post('/api/studios', { name: 'Queued studio' });
  expect(studio.status).toBe(201);

  await m.fakes.smtp.stop();
  const reset = await new Client(m.server.url).post('/api/auth/request-password-reset', { email: forgetful, redirectTo: '/reset-password' });
  expect(reset.status, JSON.stringify(reset.body)).toBe(200);
  const invite = await c.post(`/api/studios/${studio.body.id}/members`, { email: invitee, role: 'crew' });
  expect(invite.status, JSON.stringify(invite.body)).toBe(201);

  // Away long enough for the first tries to fail.
  await new Promise((r) => setTimeout(r, 3_000));
  expect(resetsTo(forgetful)).toEqual([]);
  expect(mailTo(invitee)).toEqual([]);

  const back = Date.now();
  await m.fakes.smtp.start();
  await expect.poll(() => resetsTo(forgetful).length + mailTo(invitee).length, { timeout: 60_000, interval: 250 }).toBe(2);
  console.log(`[faults] queued mail delivered ${((Date.now() - back) / 1000).toFixed(1)} s after SMTP returned`);
  // And no second copy follows.
  await new Promise((r) => setTimeout(r, 4_000));
  expect(resetsTo(forgetful).map((m) => m.subject)).toEqual(['Reset your Falloff password']);
  expect(mailTo(invitee).map((m) => m.subject)).toEqual(['Join Queued studio on Falloff']);
  expect(m.server.exited()).toBe(false);
}, 120_000);

test('a reset answers 200 only when its mail is queued: with no mail service every reset gets the same 503, account or not', async () => {
  const noMail = await m.startServer({ FALLOFF_TEST_SMTP_PORT: '0' });
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
