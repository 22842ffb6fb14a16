// Comment e-mail survives the server's death: the comment and its waiting digest are stored together in
// PostgreSQL (server/mail/commentNotices.ts), so a process killed with SIGKILL between the comment and the digest
// loses nothing — the next process sends it, once.
import { afterAll, beforeAll, expect, test } from 'vitest';
import { freshEmail } from '../support/http';
import { startMailFaults, type MailFaults } from '../support/mailFaults';

let m: MailFaults;
beforeAll(async () => {
  // A digest waits 4 s; the gap is long enough that a second e-mail could only be a duplicate.
  m = await startMailFaults({ COMMENT_DIGEST_DELAY_MS: '4000', COMMENT_DIGEST_GAP_MS: '600000' });
}, 90_000);
afterAll(() => m?.close());

test('kill -9 between a comment and its digest: the next process sends the notice, once', async () => {
  const ownerEmail = freshEmail('downer');
  const crewEmail = freshEmail('dcrew');
  const owner = await m.confirmed('Digest Owner', ownerEmail);
  const crew = await m.confirmed('Digest Crew', crewEmail);
  const studio = (await owner.post('/api/studios', { name: 'Digest fault studio' })).body.id as string;
  const inv = await owner.post(`/api/studios/${studio}/members`, { email: crewEmail, role: 'crew' });
  expect(inv.status, JSON.stringify(inv.body)).toBe(201);
  const link = inv.body.link as string;
  expect((await crew.post(`/api/invitations/${link.slice(link.lastIndexOf('/') + 1)}/accept`)).status).toBe(200);
  const title = `Killed before the digest ${Date.now().toString(36)}`;
  const setup = (await owner.post('/api/setups', { studioId: studio, title })).body.id as string;
  expect(setup).toBeTruthy();

  expect((await crew.post(`/api/setups/${setup}/comments`, { body: 'The boom arm sags past two metres.' })).status).toBe(201);
  expect((await crew.post(`/api/setups/${setup}/comments`, { body: 'Sandbag added on the back leg.' })).status).toBe(201);
  // Dead before the digest's wait is over: nothing in this process's memory survives.
  await m.server.stop('SIGKILL');
  const digests = () => m.mailTo(ownerEmail).filter((x) => x.subject.includes(title));
  expect(digests()).toEqual([]);

  const next = await m.startServer();
  await expect.poll(() => digests().length, { timeout: 90_000, interval: 250 }).toBe(1);
  const [mail] = digests();
  expect(mail!.subject).toBe(`2 new comments on ${title}`);
  expect(mail!.text).toContain('The boom arm sags past two metres.');
  expect(mail!.text).toContain('Sandbag added on the back leg.');
  // And only once, whatever else the new process and the queue's retries do.
  await new Promise((r) => setTimeout(r, 6_000));
  expect(digests()).toHaveLength(1);
  // Crew are not e-mailed about comments.
  expect(m.mailTo(crewEmail).filter((x) => x.subject.includes(title))).toEqual([]);
  expect(next.exited()).toBe(false);
}, 240_000);
