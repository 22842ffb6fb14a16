// The foundation over real HTTP: health, sessions, JSON errors, the personal studio made at sign-up.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { Client, freshEmail } from '../support/http';

const base = inject('baseUrl');

describe('health', () => {
  it('answers ok after a real query', async () => {
    const r = await new Client(base).get('/api/health');
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ ok: true, db: 'up' });
  });
});

describe('signed out', () => {
  it.each(['/api/me', '/api/setups', '/api/setups/00000000-0000-0000-0000-000000000000', '/api/no-such-route'])(
    'GET %s is 401 JSON, not HTML',
    async (path) => {
      const r = await new Client(base).get(path);
      expect(r.status).toBe(401);
      expect(r.headers.get('content-type')).toMatch(/application\/json/);
      expect(r.body.error.code).toBe('unauthenticated');
    },
  );
});

describe('sign-up, sign-in, sign-out', () => {
  const email = freshEmail('newcomer');
  const c = new Client(base);

  it('sign-up mails a confirmation link; opening it sets an httpOnly, SameSite=Lax session cookie and makes a personal studio', async () => {
    const r = await c.post('/api/auth/sign-up/email', { name: 'Rafa Quint', email, password: 'long-enough-1' });
    expect(r.status).toBe(200);
    // No session yet: the answer must look the same whether or not the address already has an account.
    expect(r.headers.getSetCookie().find((s) => s.includes('session_token'))).toBeUndefined();
    const link = await c.mailedLink(email, '/api/auth/verify-email');
    const v = await c.get(link.slice(base.length));
    expect(v.status).toBe(302);
    const cookie = v.headers.getSetCookie().find((s) => s.includes('session_token'))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const me = await c.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);
    expect(me.body.studios).toEqual([expect.objectContaining({ personal: true, role: 'owner', name: "Rafa's studio" })]);
  });

  it('a new user has no setups yet', async () => {
    const r = await c.get('/api/setups');
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ setups: [], nextCursor: null });
  });

  it('sign-out ends the session', async () => {
    expect((await c.post('/api/auth/sign-out')).status).toBe(200);
    expect((await c.get('/api/me')).status).toBe(401);
  });

  it('a wrong password is refused', async () => {
    const r = await new Client(base).post('/api/auth/sign-in/email', { email, password: 'not-the-password' });
    expect(r.status).toBe(401);
  });
});

describe('JSON errors', () => {
  let c: Client;
  beforeAll(async () => {
    c = await new Client(base).signIn(demoUsers.owner.email, DEMO_PASSWORD);
  });

  it('a validation failure is 400 and names the field', async () => {
    const r = await c.post('/api/setups', { title: '' });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect(r.body.error.fields).toHaveProperty('title');
    expect(r.body.error.message).toContain('title');
  });

  it('an unknown field is refused by name', async () => {
    const r = await c.post('/api/setups', { title: 'x', colour: 'red' });
    expect(r.status).toBe(400);
    expect(JSON.stringify(r.body.error)).toContain('colour');
  });

  it('a bad query parameter names the parameter', async () => {
    const r = await c.get('/api/setups?studio=not-a-uuid');
    expect(r.status).toBe(400);
    expect(r.body.error.fields).toHaveProperty('studio');
  });

  it('malformed JSON is a 400 JSON error, not a 500', async () => {
    const r = await c.request('POST', '/api/setups', '{"title": ', {});
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('bad_request');
  });

  it('a body over 1 MB is 413', async () => {
    const r = await c.post('/api/setups', { title: 'big', notes: 'x'.repeat(1_100_000) });
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('too_large');
  });

  it('sends helmet headers', async () => {
    const r = await c.get('/api/health');
    expect(r.headers.get('x-content-type-options')).toBe('nosniff');
    expect(r.headers.get('content-security-policy')).toContain("default-src 'self'");
  });
});

describe('the crew sheet preview address', () => {
  it('takes the setup version as a cache key', async () => {
    const c = await new Client(base).signIn(demoUsers.owner.email, DEMO_PASSWORD);
    const { body } = await c.get('/api/setups?limit=1');
    const id = body.setups[0].id;
    const r = await c.get(`/api/setups/${id}/plan.png?width=300&v=7`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('image/png');
  });
});
