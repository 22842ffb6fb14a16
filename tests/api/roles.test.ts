// What each role may do with the studio's setups, asserted for every route and role from one table.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { Client, freshEmail } from '../support/http';

const base = inject('baseUrl');
type Who = 'owner' | 'editor' | 'crew' | 'stranger' | 'signedOut';
const clients = {} as Record<Who, Client>;
let studioId = '';
let setupId = '';

beforeAll(async () => {
  clients.owner = await new Client(base).signIn(demoUsers.owner.email, DEMO_PASSWORD);
  clients.editor = await new Client(base).signIn(demoUsers.editor.email, DEMO_PASSWORD);
  clients.crew = await new Client(base).signIn(demoUsers.crew.email, DEMO_PASSWORD);
  clients.stranger = await new Client(base).signUp('Outsider Vale', freshEmail('stranger'), 'stranger-pass-1');
  clients.signedOut = new Client(base);
  const me = await clients.owner.get('/api/me');
  studioId = me.body.studios.find((s: { personal: boolean }) => !s.personal).id;
  const list = await clients.owner.get(`/api/setups?studio=${studioId}`);
  setupId = list.body.setups.find((s: { isTemplate: boolean }) => !s.isTemplate).id;
});

type Route = { name: string; call: (c: Client) => Promise<{ status: number }>; expect: Record<Who, number> };

const routes: Route[] = [
  { name: 'GET /api/setups/:id', call: (c) => c.get(`/api/setups/${setupId}`), expect: { owner: 200, editor: 200, crew: 200, stranger: 404, signedOut: 401 } },
  {
    name: 'POST /api/setups into the studio',
    call: (c) => c.post('/api/setups', { studioId, title: 'Role check' }),
    expect: { owner: 201, editor: 201, crew: 403, stranger: 404, signedOut: 401 },
  },
];

describe.each(routes)('$name', (route) => {
  it.each(Object.entries(route.expect) as [Who, number][])('as %s → %i', async (who, status) => {
    const r = await route.call(clients[who]);
    expect(r.status).toBe(status);
  });
});

describe('the library lists only what a user may read', () => {
  it('studio members see the studio setups', async () => {
    for (const who of ['owner', 'editor', 'crew'] as const) {
      const r = await clients[who].get(`/api/setups?studio=${studioId}`);
      expect(r.status).toBe(200);
      expect(r.body.setups.length).toBeGreaterThanOrEqual(3);
    }
  });

  it('a stranger sees none of them, even naming the studio', async () => {
    const r = await clients.stranger.get(`/api/setups?studio=${studioId}`);
    expect(r.status).toBe(200);
    expect(r.body.setups).toEqual([]);
  });

  it('search finds a demo setup by a word of its title', async () => {
    const r = await clients.crew.get('/api/setups?q=clamshell');
    expect(r.body.setups.map((s: { title: string }) => s.title)).toContain('Clamshell headshot on grey');
  });

  it('pages with a cursor, newest first, with no repeats', async () => {
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const r: { body: { setups: { id: string; updatedAt: string }[]; nextCursor: string | null } } = await clients.owner.get(
        `/api/setups?studio=${studioId}&limit=2${cursor ? `&cursor=${cursor}` : ''}`,
      );
      seen.push(...r.body.setups.map((s) => s.id));
      cursor = r.body.nextCursor;
    } while (cursor);
    expect(new Set(seen).size).toBe(seen.length);
    expect(seen.length).toBeGreaterThanOrEqual(3);
  });
});
