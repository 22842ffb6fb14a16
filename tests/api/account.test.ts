// The account's own settings: units and paper size, validated, kept, and seen at once.
import { describe, expect, inject, it } from 'vitest';
import { Client, freshEmail } from '../support/http';

const base = inject('baseUrl');

describe('PATCH /api/me', () => {
  it('changes units and paper, and GET /api/me shows it at once', async () => {
    const c = await new Client(base).signUp('Lior Fenn', freshEmail('units'), 'units-pass-1');
    expect((await c.get('/api/me')).body.user).toMatchObject({ units: 'metric', paper: 'a4' });
    const r = await c.request('PATCH', '/api/me', { units: 'imperial', paper: 'letter' });
    expect(r.status).toBe(200);
    expect(r.body.user).toMatchObject({ units: 'imperial', paper: 'letter' });
    expect((await c.get('/api/me')).body.user).toMatchObject({ units: 'imperial', paper: 'letter' });
  });

  it('refuses an unknown unit by field, and unknown fields by name', async () => {
    const c = await new Client(base).signUp('Lior Fenn', freshEmail('units'), 'units-pass-1');
    const bad = await c.request('PATCH', '/api/me', { units: 'cubits' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('units');
    const extra = await c.request('PATCH', '/api/me', { email: 'other@x.test' });
    expect(extra.status).toBe(400);
    expect(JSON.stringify(extra.body.error)).toContain('email');
    expect((await c.get('/api/me')).body.user.units).toBe('metric');
  });
});
