// The operator role and the gallery for everyone: only an operator publishes a template to every account or
// withdraws it; studio owners keep templates for their own studio. An operator is made by the documented
// command (`npm run operator -- add <email>`), run here for real against the test database.
import { execFile } from 'node:child_process';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { TEST_DATABASE_URL } from '../support/env';
import { fresh, newSetup, studioWithTeam, type Signed } from './fixtures';

const base = inject('baseUrl');
const root = join(__dirname, '..', '..');
const run = promisify(execFile);

/** `npm run operator -- <args>` against the test database: exit code and what it printed. */
async function operatorCommand(...args: string[]) {
  try {
    const r = await run('npm', ['run', '--silent', 'operator', '--', ...args], { cwd: root, env: { ...process.env, DATABASE_URL: TEST_DATABASE_URL }, timeout: 60_000 });
    return { code: 0, out: r.stdout + r.stderr };
  } catch (err) {
    const e = err as { code?: number; stdout?: string; stderr?: string };
    return { code: e.code ?? -1, out: `${e.stdout ?? ''}${e.stderr ?? ''}` };
  }
}

let team: Awaited<ReturnType<typeof studioWithTeam>>;
let op: Signed;
let stranger: Signed;

beforeAll(async () => {
  team = await studioWithTeam(base);
  op = await fresh(base, 'Gallery Keeper');
  stranger = await fresh(base, 'Passer By');
  const made = await operatorCommand('add', op.email);
  expect(made.code, made.out).toBe(0);
  expect(made.out).toContain('is now an operator');
}, 120_000);

describe('the gallery for everyone', () => {
  it("a studio owner's template stays in the studio: another account can neither read nor list it", async () => {
    const t = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Owner-only template', isTemplate: true });
    expect((await stranger.client.get(`/api/setups/${t.id}`)).status).toBe(404);
    expect((await stranger.client.post(`/api/setups/${t.id}/duplicate`)).status).toBe(404);
    const list = await stranger.client.get('/api/setups?templates=1&limit=100');
    expect(list.body.setups.map((s: { id: string }) => s.id)).not.toContain(t.id);
    // …while the studio's own crew read and copy it.
    expect((await team.crew.client.get(`/api/setups/${t.id}`)).status).toBe(200);
    expect((await team.crew.client.post(`/api/setups/${t.id}/duplicate`)).status).toBe(201);
  });

  it('a normal account, the studio owner included, gets a 403 saying only an operator may publish or withdraw', async () => {
    const t = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Wants to be for everyone', isTemplate: true });
    for (const c of [team.owner.client, team.editor.client, stranger.client]) {
      const r = await c.put(`/api/setups/${t.id}/everyone`, { forEveryone: true });
      expect(r.status).toBe(403);
      expect(r.body.error.code).toBe('operator_only');
      expect(r.body.error.message).toMatch(/only an operator/);
    }
    expect((await stranger.client.get(`/api/setups/${t.id}`)).status).toBe(404);
    // Creating one straight into the gallery is not a field a body may carry.
    const sneak = await team.owner.client.post('/api/setups', { studioId: team.studioId, title: 'Sneaky', isTemplate: true, forEveryone: true });
    expect(sneak.status).toBe(400);
    expect(sneak.body.error.fields).toHaveProperty('forEveryone');
    // Nor is the operator role a field of one's own account.
    await team.owner.client.post('/api/auth/update-user', { operator: true });
    expect((await team.owner.client.put(`/api/setups/${t.id}/everyone`, { forEveryone: true })).status).toBe(403);
  });

  it('an operator publishes a setup: every account reads, lists and copies it; withdrawn, it is the studio’s again', async () => {
    const s = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Clamshell for everyone' });
    const pub = await op.client.put(`/api/setups/${s.id}/everyone`, { forEveryone: true });
    expect(pub.status, JSON.stringify(pub.body)).toBe(200);
    expect(pub.body).toEqual({ id: s.id, isTemplate: true, forEveryone: true });

    const read = await stranger.client.get(`/api/setups/${s.id}`);
    expect(read.status).toBe(200);
    expect(read.body).toMatchObject({ isTemplate: true, forEveryone: true, role: null, version: 1 });
    const list = await stranger.client.get('/api/setups?templates=1&limit=100');
    expect(list.body.setups.find((x: { id: string }) => x.id === s.id)).toMatchObject({ forEveryone: true, role: null });
    expect((await stranger.client.post(`/api/setups/${s.id}/duplicate`)).status).toBe(201);
    // Still never changed by a non-member.
    expect((await stranger.client.put(`/api/setups/${s.id}`, { version: 1, title: 'Mine now' })).status).toBe(403);

    // The owner cannot take it out of the gallery by un-marking the template…
    const unmark = await team.owner.client.put(`/api/setups/${s.id}`, { version: 1, isTemplate: false });
    expect(unmark.status).toBe(403);
    expect(unmark.body.error.code).toBe('operator_only');
    // …the operator withdraws it; it stays a template of its studio.
    const out = await op.client.put(`/api/setups/${s.id}/everyone`, { forEveryone: false });
    expect(out.body).toEqual({ id: s.id, isTemplate: true, forEveryone: false });
    expect((await stranger.client.get(`/api/setups/${s.id}`)).status).toBe(404);
    expect((await team.crew.client.get(`/api/setups/${s.id}`)).body).toMatchObject({ isTemplate: true, forEveryone: false });
    // Now an owner may un-mark it.
    expect((await team.owner.client.put(`/api/setups/${s.id}`, { version: 1, isTemplate: false })).status).toBe(200);
  });

  it('refuses a missing or deleted setup and a body without the flag, by name', async () => {
    expect((await op.client.put('/api/setups/00000000-0000-4000-8000-000000000000/everyone', { forEveryone: true })).status).toBe(404);
    const s = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Soon deleted' });
    await team.owner.client.del(`/api/setups/${s.id}`);
    const gone = await op.client.put(`/api/setups/${s.id}/everyone`, { forEveryone: true });
    expect(gone.status).toBe(410);
    const bad = await op.client.put(`/api/setups/${s.id}/everyone`, { forEveryone: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('forEveryone');
  });

  it("the demo's template is in the gallery (seeded as if an operator had published it)", async () => {
    const list = await stranger.client.get('/api/setups?templates=1&limit=100');
    expect(list.body.setups.find((s: { title: string }) => s.title === 'Teal backdrop, warm key')).toMatchObject({ forEveryone: true, role: null });
  });
});

describe('npm run operator', () => {
  it('lists, refuses an unknown address, and removes', async () => {
    const listed = await operatorCommand('list');
    expect(listed.code).toBe(0);
    expect(listed.out).toContain(op.email);
    const again = await operatorCommand('add', op.email);
    expect(again.out).toContain('already an operator');
    const nobody = await operatorCommand('add', 'nobody-here@falloff.test');
    expect(nobody.code).toBe(1);
    expect(nobody.out).toContain('no account has the address');
    const usage = await operatorCommand('promote', op.email);
    expect(usage.code).toBe(2);
    expect(usage.out).toContain('usage: npm run operator');

    const other = await fresh(base, 'Brief Operator');
    expect((await operatorCommand('add', other.email)).code).toBe(0);
    const s = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Published then demoted' });
    expect((await other.client.put(`/api/setups/${s.id}/everyone`, { forEveryone: true })).status).toBe(200);
    const removed = await operatorCommand('remove', other.email);
    expect(removed.out).toContain('no longer an operator');
    // At once, on the next request: no role is cached in the process.
    expect((await other.client.put(`/api/setups/${s.id}/everyone`, { forEveryone: false })).status).toBe(403);
  }, 120_000);
});
