// E-mail through the local fake SMTP server (server/fakes.ts), read back from its inbox: the crew sheet with
// its link and PDF, studio invitations and password resets; addresses validated, sends limited per user.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { demoSetups } from '../../db/seed-setups';
import { Client, freshEmail } from '../support/http';
import { inbox, pdfText, raw } from './exports.helpers';
import { FRESH_PASSWORD, fresh, newSetup, studioWithTeam } from './fixtures';

const base = inject('baseUrl');
const twin = demoSetups.find((s) => s.title.startsWith('Twin'))!.document;
let team: Awaited<ReturnType<typeof studioWithTeam>>;
let setupId: string;

beforeAll(async () => {
  team = await studioWithTeam(base);
  setupId = (await newSetup(team.owner.client, { studioId: team.studioId, title: 'Runner rims for the crew', document: twin })).id;
});

describe('POST /api/setups/:id/send', () => {
  it('e-mails the link and the crew sheet PDF to each address; the link opens signed out', async () => {
    const a = freshEmail('assistant');
    const b = freshEmail('tech');
    const r = await team.editor.client.post(`/api/setups/${setupId}/send`, { to: [a, b.toUpperCase(), a], message: 'Call time 7:30, bring the grids.' });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    expect(r.body.sent).toEqual([a, b]); // lower-cased, each once
    expect(r.body.attached).toBe(true);

    const [mail] = await inbox(base, a);
    expect(mail).toBeDefined();
    expect(mail!.to.sort()).toEqual([a, b].sort());
    expect(mail!.subject).toBe('Crew sheet: Runner rims for the crew');
    expect(mail!.text).toContain('Call time 7:30, bring the grids.');
    expect(mail!.text).toContain(r.body.url);
    expect(mail!.html).toContain(`href="${r.body.url}"`);
    expect(mail!.attachments).toHaveLength(1);
    expect(mail!.attachments[0]).toMatchObject({ filename: 'crew-sheet-runner-rims-for-the-crew.pdf', contentType: 'application/pdf' });

    const pdf = await raw(base, null, `/dev/inbox/${mail!.id}/attachments/0`);
    expect(pdf.body.subarray(0, 5).toString()).toBe('%PDF-');
    expect((await pdfText(pdf.body)).text).toContain('Rim left');

    const token = r.body.url.split('/s/')[1];
    expect((await new Client(base).get(`/api/shared/${token}`)).body.title).toBe('Runner rims for the crew');
    // The link is a share like any other: listed with who it went to, revocable.
    const list = await team.owner.client.get(`/api/setups/${setupId}/shares`);
    expect(list.body.shares.find((s: { id: string }) => s.id === r.body.shareId).label).toContain(a);
  });

  it('can leave the PDF out', async () => {
    const to = freshEmail('nopdf');
    const r = await team.owner.client.post(`/api/setups/${setupId}/send`, { to: [to], attachPdf: false });
    expect(r.status).toBe(201);
    expect((await inbox(base, to))[0]!.attachments).toEqual([]);
  });

  it('names a bad address, too many addresses or a long message (400) and sends nothing', async () => {
    const before = (await inbox(base)).length;
    const cases: [unknown, string][] = [
      [{ to: ['not-an-address'] }, 'to.0'],
      [{ to: [] }, 'to'],
      [{ to: Array.from({ length: 11 }, (_, k) => `p${k}@crew.test`) }, 'to'],
      [{ to: ['ok@crew.test'], message: 'x'.repeat(2001) }, 'message'],
      [{ to: 'ok@crew.test' }, 'to'],
      [{ to: ['ok@crew.test'], bcc: ['x@y.test'] }, 'bcc'],
    ];
    for (const [body, field] of cases) {
      const r = await team.owner.client.post(`/api/setups/${setupId}/send`, body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(r.body.error.fields)).toContain(field);
    }
    expect((await inbox(base)).length).toBe(before);
  });

  it('is for owners and editors: crew get 403, other users 404', async () => {
    expect((await team.crew.client.post(`/api/setups/${setupId}/send`, { to: ['x@crew.test'] })).status).toBe(403);
    const other = await fresh(base, 'Nosy Sender');
    expect((await other.client.post(`/api/setups/${setupId}/send`, { to: ['x@crew.test'] })).status).toBe(404);
  });

  it('limits a user to 10 sends in 10 minutes (429 with Retry-After), others unaffected', async () => {
    const u = await fresh(base, 'Busy Sender');
    const s = await newSetup(u.client, { title: 'Rate limited', document: twin });
    for (let k = 0; k < 10; k++) expect((await u.client.post(`/api/setups/${s.id}/send`, { to: [`crew${k}@limit.test`], attachPdf: false })).status).toBe(201);
    const r = await u.client.post(`/api/setups/${s.id}/send`, { to: ['crew10@limit.test'], attachPdf: false });
    expect(r.status).toBe(429);
    expect(r.body.error.code).toBe('rate_limited');
    expect(Number(r.headers.get('retry-after'))).toBeGreaterThan(500);
    expect((await inbox(base, 'crew10@limit.test')).length).toBe(0);
    expect((await team.owner.client.post(`/api/setups/${setupId}/send`, { to: [freshEmail('other')], attachPdf: false })).status).toBe(201);
  });
});

describe('account and studio e-mail', () => {
  it('sends a studio invitation by e-mail and still returns the link', async () => {
    const email = freshEmail('invitee');
    const r = await team.owner.client.post(`/api/studios/${team.studioId}/members`, { email, role: 'crew' });
    expect(r.status).toBe(201);
    const [mail] = await inbox(base, email);
    expect(mail!.subject).toBe('Join Test bench studio on Falloff');
    expect(mail!.text).toContain(r.body.link);
    expect(mail!.text).toContain('as crew');
  });

  it('e-mails a password reset link that works once', async () => {
    const u = await fresh(base, 'Forgetful Person');
    const r = await new Client(base).post('/api/auth/request-password-reset', { email: u.email, redirectTo: '/reset-password' });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const mail = (await inbox(base, u.email)).find((m) => m.subject !== 'Confirm your e-mail address for Falloff');
    expect(mail!.subject).toBe('Reset your Falloff password');
    const link = /https?:\/\/\S+\/api\/auth\/reset-password\/([A-Za-z0-9_-]+)\S*/.exec(mail!.text);
    expect(link, mail!.text).not.toBeNull();
    const token = link![1]!;
    const reset = await new Client(base).post('/api/auth/reset-password', { token, newPassword: 'a-new-pass-456' });
    expect(reset.status, JSON.stringify(reset.body)).toBe(200);
    await new Client(base).signIn(u.email, 'a-new-pass-456');
    expect((await new Client(base).post('/api/auth/sign-in/email', { email: u.email, password: FRESH_PASSWORD })).status).toBe(401);
    expect((await new Client(base).post('/api/auth/reset-password', { token, newPassword: 'third-pass-789' })).status).toBe(400);
  });

  it('answers a reset request for an unknown address the same way, and sends nothing', async () => {
    const email = freshEmail('nobody');
    const r = await new Client(base).post('/api/auth/request-password-reset', { email, redirectTo: '/reset-password' });
    expect(r.status).toBe(200);
    expect(await inbox(base, email)).toEqual([]);
  });
});
