// Sessions end at once: nothing about a session is remembered in a server process beyond one request, a
// revoked session is refused on the next request, and a password change or reset ends the other sessions.
// (Across two server processes: tests/api/instances.test.ts.)
import { describe, expect, inject, it } from 'vitest';
import { sessionResponse } from '../../model/api';
import { Client } from '../support/http';
import { FRESH_PASSWORD, fresh } from './fixtures';

const base = inject('baseUrl');

async function secondSession(email: string, password = FRESH_PASSWORD) {
  return new Client(base).signIn(email, password);
}

describe('sessions', () => {
  it('a session revoked from another one is refused on its very next request', async () => {
    const u = await fresh(base, 'Revoking Rue');
    const phone = await secondSession(u.email);
    // Busy first, as an autosaving client would be.
    for (let i = 0; i < 3; i++) expect((await phone.get('/api/me')).status).toBe(200);
    const r = await u.client.post('/api/auth/revoke-other-sessions', {});
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect((await phone.get('/api/me')).status).toBe(401);
    expect((await u.client.get('/api/me')).status).toBe(200);
  });

  it('a password change ends every other session, even when the client did not ask', async () => {
    const u = await fresh(base, 'Changing Cass');
    const other = await secondSession(u.email);
    expect((await other.get('/api/me')).status).toBe(200);
    const r = await u.client.post('/api/auth/change-password', { currentPassword: FRESH_PASSWORD, newPassword: 'a-changed-pass-42', revokeOtherSessions: false });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect((await other.get('/api/me')).status).toBe(401);
    // The one that changed it goes on (it is handed a new session).
    expect((await u.client.get('/api/me')).status).toBe(200);
  });

  it('a password reset ends every session of the account', async () => {
    const u = await fresh(base, 'Resetting Roe');
    const other = await secondSession(u.email);
    expect((await other.get('/api/me')).status).toBe(200);
    expect((await new Client(base).post('/api/auth/request-password-reset', { email: u.email, redirectTo: '/reset-password' })).status).toBe(200);
    // the account's first mail confirmed its address; the reset link comes in a mail of its own
    const link = await new Client(base).mailedLink(u.email, '/api/auth/reset-password/');
    const token = /\/api\/auth\/reset-password\/([A-Za-z0-9_-]+)/.exec(link)![1]!;
    expect((await new Client(base).post('/api/auth/reset-password', { token, newPassword: 'a-reset-pass-42' })).status).toBe(200);
    expect((await u.client.get('/api/me')).status).toBe(401);
    expect((await other.get('/api/me')).status).toBe(401);
  });

  it('get-session answers what the client reads without better-auth’s client (model/api.ts sessionResponse)', async () => {
    const nobody = await new Client(base).get('/api/auth/get-session');
    expect(nobody.status).toBe(200);
    expect(sessionResponse.parse(nobody.body)).toBeNull();
    const u = await fresh(base, 'Reading Rhea');
    const r = await u.client.get('/api/auth/get-session');
    expect(r.status).toBe(200);
    const s = sessionResponse.parse(r.body);
    const me = await u.client.get<{ user: { id: string; email: string } }>('/api/me');
    expect(s?.user.id).toBe(me.body.user.id);
    expect(s?.user.email).toBe(me.body.user.email);
    expect(s?.session.userId).toBe(me.body.user.id);
  });
});
