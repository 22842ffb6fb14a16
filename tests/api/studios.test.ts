// Studios, members and invitations over real HTTP: inviting by e-mail with an unguessable link, joining,
// roles, leaving, and a studio never left without an owner.
import { sql } from 'drizzle-orm';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { createDb } from '../../db/client';
import { Client, freshEmail } from '../support/http';
import { TEST_DATABASE_URL } from '../support/env';
import { fresh, joinAs, studioWithTeam, tokenOf } from './fixtures';

const base = inject('baseUrl');
const { db, pool } = createDb(TEST_DATABASE_URL);
afterAll(() => pool.end());

/** Give a client a cookie the way a browser would hold it after visiting a link. */
const holdCookie = (c: Client, name: string, value: string) => (c as unknown as { cookies: Map<string, string> }).cookies.set(name, value);

describe('studios', () => {
  it('a new studio has its creator as its one owner, and appears in their list', async () => {
    const u = await fresh(base, 'Studio Maker');
    const s = await u.client.post('/api/studios', { name: '  Quay Street Loft ' });
    expect(s.status).toBe(201);
    expect(s.body).toMatchObject({ name: 'Quay Street Loft', personal: false, role: 'owner', memberCount: 1 });
    const list = await u.client.get('/api/studios');
    expect(list.body.studios.map((x: { name: string; role: string }) => [x.name, x.role])).toEqual([
      ['Quay Street Loft', 'owner'],
      ["Studio's studio", 'owner'],
    ]);
    const renamed = await u.client.request('PATCH', `/api/studios/${s.body.id}`, { name: 'Quay Street' });
    expect(renamed.body.name).toBe('Quay Street');
  });
});

describe('invitations', () => {
  it('the link carries a long random token, only its hash is stored, and it shows what it invites to without an account', async () => {
    const team = await studioWithTeam(base);
    const email = freshEmail('invited');
    const r = await team.owner.client.post(`/api/studios/${team.studioId}/members`, { email: email.toUpperCase(), role: 'editor' });
    expect(r.status).toBe(201);
    expect(r.body.link).toMatch(new RegExp(`^${base}/studios/join/[A-Za-z0-9_-]{43}$`));
    expect(r.body.invitation).toMatchObject({ email, role: 'editor', invitedBy: 'Studio Owner', delivery: 'link' });
    const token = tokenOf(r.body.link);
    const stored = await db.execute<{ token_hash: string }>(sql`select token_hash from studio_invitations where id = ${r.body.invitation.id}`);
    expect(stored.rows[0]!.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored.rows[0]!.token_hash).not.toContain(token);

    const preview = await new Client(base).get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ studioName: 'Test bench studio', role: 'editor', email, invitedBy: 'Studio Owner', status: 'open' });
    expect(preview.body).not.toHaveProperty('studioId');
    expect((await new Client(base).get(`/api/invitations/${token.slice(0, -2)}xx`)).status).toBe(404);

    const pending = await team.owner.client.get(`/api/studios/${team.studioId}/invitations`);
    expect(pending.body.invitations.map((i: { email: string }) => i.email)).toContain(email);
  });

  it('joins the invited address once, in the invited role; anyone else is refused', async () => {
    const team = await studioWithTeam(base);
    const invitee = await fresh(base, 'Ines Invitee');
    const other = await fresh(base, 'Someone Else');
    const r = await team.owner.client.post(`/api/studios/${team.studioId}/members`, { email: invitee.email, role: 'editor' });
    const token = tokenOf(r.body.link);
    const wrong = await other.client.post(`/api/invitations/${token}/accept`);
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.code).toBe('wrong_email');
    const ok = await invitee.client.post(`/api/invitations/${token}/accept`);
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ studioId: team.studioId, role: 'editor' });
    const members = await invitee.client.get(`/api/studios/${team.studioId}/members`);
    expect(members.body.members.map((m: { name: string; role: string }) => [m.name, m.role])).toEqual([
      ['Studio Owner', 'owner'],
      ['Ines Invitee', 'editor'],
      ['Team Editor', 'editor'],
      ['Team Crew', 'crew'],
    ]);
    const again = await invitee.client.post(`/api/invitations/${token}/accept`);
    expect(again.status).toBe(410);
    expect((await new Client(base).get(`/api/invitations/${token}`)).body.status).toBe('accepted');
    // Inviting a member again is refused by name.
    const dup = await team.owner.client.post(`/api/studios/${team.studioId}/members`, { email: invitee.email, role: 'crew' });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields).toHaveProperty('email');
  });

  it('inviting the same address again replaces the open invitation; a withdrawn or expired one no longer works', async () => {
    const team = await studioWithTeam(base);
    const invitee = await fresh(base, 'Late Joiner');
    const first = await team.owner.client.post(`/api/studios/${team.studioId}/members`, { email: invitee.email, role: 'crew' });
    const second = await team.owner.client.post(`/api/studios/${team.studioId}/members`, { email: invitee.email, role: 'editor' });
    expect((await new Client(base).get(`/api/invitations/${tokenOf(first.body.link)}`)).body.status).toBe('revoked');
    expect((await invitee.client.post(`/api/invitations/${tokenOf(first.body.link)}/accept`)).status).toBe(410);

    expect((await team.owner.client.del(`/api/studios/${team.studioId}/invitations/${second.body.invitation.id}`)).status).toBe(204);
    expect((await invitee.client.post(`/api/invitations/${tokenOf(second.body.link)}/accept`)).status).toBe(410);
    expect((await team.owner.client.del(`/api/studios/${team.studioId}/invitations/${second.body.invitation.id}`)).status).toBe(404);

    const third = await team.owner.client.post(`/api/studios/${team.studioId}/members`, { email: invitee.email, role: 'crew' });
    await db.execute(sql`update studio_invitations set expires_at = now() - interval '1 minute' where id = ${third.body.invitation.id}`);
    expect((await new Client(base).get(`/api/invitations/${tokenOf(third.body.link)}`)).body.status).toBe('expired');
    expect((await invitee.client.post(`/api/invitations/${tokenOf(third.body.link)}/accept`)).status).toBe(410);
    const open = await team.owner.client.get(`/api/studios/${team.studioId}/invitations`);
    expect(open.body.invitations.map((i: { email: string }) => i.email)).not.toContain(invitee.email);
  });

  it('a browser that opened the link signed out finds the invitation after signing up, and can forget it', async () => {
    const team = await studioWithTeam(base);
    const email = freshEmail('newcomer');
    const r = await team.owner.client.post(`/api/studios/${team.studioId}/members`, { email, role: 'crew' });
    const token = tokenOf(r.body.link);
    const c = await new Client(base).signUp('New Comer', email, 'newcomer-pass-1');
    expect((await c.get('/api/invitations')).body).toEqual({ invitation: null });
    holdCookie(c, 'falloff_invite', token);
    const carried = await c.get('/api/invitations');
    expect(carried.body.invitation).toMatchObject({ token, studioName: 'Test bench studio', role: 'crew', status: 'open' });
    expect((await c.del('/api/invitations')).status).toBe(204);
    expect((await c.get('/api/invitations')).body).toEqual({ invitation: null });
    holdCookie(c, 'falloff_invite', token);
    expect((await c.post(`/api/invitations/${token}/accept`)).status).toBe(200);
    expect((await c.get('/api/invitations')).body).toEqual({ invitation: null });
  });
});

describe('roles and the last owner', () => {
  it('an owner changes roles and removes members; crew can then no longer write', async () => {
    const team = await studioWithTeam(base);
    const s = await team.owner.client.post('/api/setups', { studioId: team.studioId, title: 'Role change' });
    expect((await team.crew.client.put(`/api/setups/${s.body.id}`, { version: 1, title: 'crew edit' })).status).toBe(403);
    const up = await team.owner.client.request('PATCH', `/api/studios/${team.studioId}/members/${team.crew.userId}`, { role: 'editor' });
    expect(up.status).toBe(200);
    expect((await team.crew.client.put(`/api/setups/${s.body.id}`, { version: 1, title: 'now an editor' })).status).toBe(200);
    expect((await team.owner.client.del(`/api/studios/${team.studioId}/members/${team.editor.userId}`)).status).toBe(204);
    expect((await team.editor.client.get(`/api/setups/${s.body.id}`)).status).toBe(404);
    expect((await team.editor.client.get(`/api/studios/${team.studioId}`)).status).toBe(404);
  });

  it('the last owner can neither step down nor leave; with a second owner they can', async () => {
    const team = await studioWithTeam(base);
    const self = `/api/studios/${team.studioId}/members/${team.owner.userId}`;
    const demote = await team.owner.client.request('PATCH', self, { role: 'editor' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_owner');
    expect((await team.owner.client.del(self)).status).toBe(409);
    const second = await joinAs(base, team.owner.client, team.studioId, 'owner', 'Second Owner');
    expect((await team.owner.client.request('PATCH', self, { role: 'editor' })).status).toBe(200);
    // Now the second owner is the last one.
    expect((await second.client.del(`/api/studios/${team.studioId}/members/${second.userId}`)).status).toBe(409);
  });

  it('two owners demoting each other at the same moment leave one owner, never none', async () => {
    for (let round = 0; round < 5; round++) {
      const team = await studioWithTeam(base);
      const b = await joinAs(base, team.owner.client, team.studioId, 'owner', 'Other Owner');
      const [x, y] = await Promise.all([
        team.owner.client.request('PATCH', `/api/studios/${team.studioId}/members/${b.userId}`, { role: 'crew' }),
        b.client.request('PATCH', `/api/studios/${team.studioId}/members/${team.owner.userId}`, { role: 'crew' }),
      ]);
      const members = await team.editor.client.get(`/api/studios/${team.studioId}/members`);
      const owners = members.body.members.filter((m: { role: string }) => m.role === 'owner');
      expect(owners.length, JSON.stringify([x.status, y.status])).toBeGreaterThanOrEqual(1);
      expect([x.status, y.status]).toContain(200);
    }
  });

  it('any member may leave; a personal studio keeps its single owner', async () => {
    const team = await studioWithTeam(base);
    expect((await team.crew.client.del(`/api/studios/${team.studioId}/members/${team.crew.userId}`)).status).toBe(204);
    expect((await team.crew.client.get(`/api/studios/${team.studioId}`)).status).toBe(404);
    // Crew cannot remove others.
    expect((await team.editor.client.del(`/api/studios/${team.studioId}/members/${team.owner.userId}`)).status).toBe(403);

    const solo = await fresh(base, 'Solo Shooter');
    const asOwner = await solo.client.post(`/api/studios/${solo.personalStudioId}/members`, { email: freshEmail('x'), role: 'owner' });
    expect(asOwner.status).toBe(409);
    expect(asOwner.body.error.code).toBe('personal_studio');
    const crew = await joinAs(base, solo.client, solo.personalStudioId, 'crew', 'Solo Assistant');
    const promote = await solo.client.request('PATCH', `/api/studios/${solo.personalStudioId}/members/${crew.userId}`, { role: 'owner' });
    expect(promote.status).toBe(409);
    expect((await solo.client.del(`/api/studios/${solo.personalStudioId}/members/${solo.userId}`)).status).toBe(409);
  });
});

describe('the studio setting "crew may copy setups out"', () => {
  it('is off by default: crew copying a setup out gets 403 naming it; only an owner turns it on, and then crew may', async () => {
    const team = await studioWithTeam(base);
    const s = await team.owner.client.post('/api/setups', { studioId: team.studioId, title: 'House look, not for copying' });
    expect(s.status).toBe(201);
    expect((await team.owner.client.get(`/api/studios/${team.studioId}`)).body.crewMayCopy).toBe(false);

    const refused = await team.crew.client.post(`/api/setups/${s.body.id}/duplicate`, {});
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatchObject({ code: 'crew_copy_off', fields: { crewMayCopy: expect.any(String) } });
    expect(refused.body.error.message).toMatch(/crewMayCopy/);
    // Editors may copy whatever the setting says.
    expect((await team.editor.client.post(`/api/setups/${s.body.id}/duplicate`, {})).status).toBe(201);

    expect((await team.editor.client.request('PATCH', `/api/studios/${team.studioId}`, { crewMayCopy: true })).status).toBe(403);
    expect((await team.crew.client.request('PATCH', `/api/studios/${team.studioId}`, { crewMayCopy: true })).status).toBe(403);
    const bad = await team.owner.client.request('PATCH', `/api/studios/${team.studioId}`, { crewMayCopy: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('crewMayCopy');
    const on = await team.owner.client.request('PATCH', `/api/studios/${team.studioId}`, { crewMayCopy: true });
    expect(on.status).toBe(200);
    expect(on.body.crewMayCopy).toBe(true);
    const copy = await team.crew.client.post(`/api/setups/${s.body.id}/duplicate`, {});
    expect(copy.status).toBe(201);
    expect(copy.body.studioId).not.toBe(team.studioId);

    expect((await team.owner.client.request('PATCH', `/api/studios/${team.studioId}`, { crewMayCopy: false })).body.crewMayCopy).toBe(false);
    expect((await team.crew.client.post(`/api/setups/${s.body.id}/duplicate`, {})).status).toBe(403);
  });
});
