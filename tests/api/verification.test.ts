// E-mail confirmation (better-auth's own), password rules and a sign-up that does not tell who has an account,
// over real HTTP against real PostgreSQL, with mail read from the fake SMTP server's inbox.
import { describe, expect, inject, it } from 'vitest';
import { demoUsers, DEMO_PASSWORD } from '../../db/demo';
import { Client, freshEmail } from '../support/http';
import { classWith } from './classes.support';
import { inbox } from './exports.helpers';
import { FRESH_PASSWORD, fresh, newSetup, studioWithTeam, tokenOf } from './fixtures';
import { documentWith } from './documents';

const base = inject('baseUrl');

describe('an unconfirmed address', () => {
  it('cannot accept a studio invitation until the mailed link is opened; then it can', async () => {
    const team = await studioWithTeam(base);
    // The stranger of the report: signs up with an address someone else was invited at, without owning it.
    const email = freshEmail('invited');
    const inv = await team.owner.client.post(`/api/studios/${team.studioId}/members`, { email, role: 'editor' });
    expect(inv.status).toBe(201);
    const stranger = await new Client(base).signUp('Not The Invitee', email, FRESH_PASSWORD, { verify: false });
    const refused = await stranger.post(`/api/invitations/${tokenOf(inv.body.link)}/accept`);
    expect(refused.status, JSON.stringify(refused.body)).toBe(403);
    expect(refused.body.error.code).toBe('email_not_verified');
    expect((await team.owner.client.get(`/api/studios/${team.studioId}/members`)).body.members.map((m: { email: string }) => m.email)).not.toContain(email);
    // Whoever reads that inbox confirms it (the mailed link signs them in) and may then accept.
    const owner = new Client(base);
    const link = await owner.mailedLink(email, '/api/auth/verify-email');
    expect((await owner.get(link.slice(base.length))).status).toBe(302);
    const ok = await owner.post(`/api/invitations/${tokenOf(inv.body.link)}/accept`);
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
  });

  it('cannot join a class by invitation, invite people or send the crew sheet by mail', async () => {
    const w = await classWith(base, 0, 'Verification class');
    const email = freshEmail('student');
    expect((await w.instructor.client.post(`/api/classes/${w.classId}/invitations`, { email, role: 'instructor' })).status).toBe(201);
    const u = await new Client(base).signUp('Unconfirmed Student', email, FRESH_PASSWORD, { verify: false });
    const join = await u.post(`/api/classes/${w.classId}/accept`);
    expect(join.status).toBe(403);
    expect(join.body.error.code).toBe('email_not_verified');
    // The instructor still sees no new member (and the stranger none of the students' addresses).
    expect((await u.get(`/api/classes/${w.classId}/members`)).status).toBe(404);

    const me = (await u.get('/api/me')).body;
    const personal = me.studios.find((s: { personal: boolean }) => s.personal).id;
    const setup = await newSetup(u, { studioId: personal, title: 'My first plan', document: documentWith(1) });
    const send = await u.post(`/api/setups/${setup.id}/send`, { to: ['someone@example.test'], attachPdf: false });
    expect(send.status).toBe(403);
    expect(send.body.error.code).toBe('email_not_verified');
    const invite = await u.post(`/api/studios/${personal}/members`, { email: 'crew@example.test', role: 'crew' });
    expect(invite.status).toBe(403);
    const klass = await u.post('/api/classes', { name: 'Mine' });
    expect(klass.status).toBe(201);
    expect((await u.post(`/api/classes/${klass.body.id}/invitations`, { email: 'a@example.test' })).status).toBe(403);
    expect(await inbox(base, 'someone@example.test')).toEqual([]);
  });

  it('the demo people are seeded confirmed', async () => {
    const ines = await new Client(base).signIn(demoUsers.owner.email, DEMO_PASSWORD);
    const r = await ines.get('/api/auth/get-session');
    expect(r.body.user.emailVerified).toBe(true);
  });
});

describe('sign-up does not reveal who has an account', () => {
  it('answers the same for a new and an existing address; the existing owner gets a mail', async () => {
    const existing = await fresh(base, 'Already Here');
    const newEmail = freshEmail('brandnew');
    const a = await new Client(base).post('/api/auth/sign-up/email', { name: 'Somebody', email: existing.email, password: 'another-pass-42' });
    const b = await new Client(base).post('/api/auth/sign-up/email', { name: 'Somebody', email: newEmail, password: 'another-pass-42' });
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    const shape = (r: { body: any; headers: Headers }) => ({
      keys: Object.keys(r.body).sort(),
      userKeys: Object.keys(r.body.user).sort(),
      token: r.body.token,
      verified: r.body.user.emailVerified,
      cookie: r.headers.getSetCookie().some((c) => c.includes('session_token')),
    });
    expect(shape(a)).toEqual(shape(b));
    // The existing account's owner is told; the visitor's password did not replace theirs.
    const told = async () => (await inbox(base, existing.email)).map((m) => m.subject);
    for (let i = 0; i < 50 && !(await told()).includes('You already have a Falloff account'); i++) await new Promise((r) => setTimeout(r, 100));
    expect(await told()).toContain('You already have a Falloff account');
    await new Client(base).signIn(existing.email, FRESH_PASSWORD);
  });
});

describe('password rules', () => {
  it.each([
    ['password', /too common/],
    ['12345678', /digits|easy/],
    ['        ', /spaces/],
    ['Password1', /too common/],
    ['aaaaaaaa', /easy to guess/],
    ['short', /at least 8/],
  ])('%j is refused at sign-up, with a 400 naming the password', async (password, why) => {
    const r = await new Client(base).post('/api/auth/sign-up/email', { name: 'Weak Pass', email: freshEmail('weak'), password });
    expect(r.status, JSON.stringify(r.body)).toBe(400);
    expect(r.body.message).toMatch(/^password: /);
    expect(r.body.message).toMatch(why);
  });

  it('a weak new password is refused on change and on reset too', async () => {
    const u = await fresh(base, 'Changing Pass');
    const change = await u.client.post('/api/auth/change-password', { currentPassword: FRESH_PASSWORD, newPassword: 'qwerty123' });
    expect(change.status).toBe(400);
    expect(change.body.message).toMatch(/^newPassword: too common/);
    const reset = await new Client(base).post('/api/auth/reset-password', { token: 'whatever', newPassword: '11111111' });
    expect(reset.status).toBe(400);
    expect(reset.body.message).toMatch(/^newPassword: /);
  });
});
