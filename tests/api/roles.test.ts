// The role matrix: every API route × owner, editor, crew, a member of another studio and a signed-out
// visitor, from one table. A test reads the app's own route list, so a new route without a row fails here.
// The studio is made for this file (its members joined by invitation), so the demo studio the browser tests
// sign in to is not filled with the matrix's setups.
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createDb } from '../../db/client';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { TEST_DATABASE_URL } from '../support/env';
import { Client, freshEmail, type Res } from '../support/http';
import sharp from 'sharp';
import { raw } from './exports.helpers';
import { classCases, classClients, classShared, classWho, setupClassMatrix } from './classes.matrix';
import { fresh, joinAs, newSetup, publishForEveryone, studioWithTeam, tokenOf, type Signed } from './fixtures';

const base = inject('baseUrl');
const who = ['owner', 'editor', 'crew', 'stranger', 'signedOut'] as const;
type Who = (typeof who)[number];
type Expect = Record<Who, number>;

/** Values a case's call needs; `prepare` makes fresh ones per cell when the call changes what it touches. */
type Vars = Record<string, string | number>;
type Case = { route: string; variant?: string; prepare?: () => Promise<Vars>; call: (c: Client, v: Vars) => Promise<Res>; expect: Expect };

const clients = {} as Record<Who, Client>;
let owner: Signed;
const shared: Vars = {};

/** Expectations by kind of route, so the table reads as policy. */
const readable: Expect = { owner: 200, editor: 200, crew: 200, stranger: 404, signedOut: 401 };
const writable = (ok: number): Expect => ({ owner: ok, editor: ok, crew: 403, stranger: 404, signedOut: 401 });
const ownerOnly = (ok: number): Expect => ({ owner: ok, editor: 403, crew: 403, stranger: 404, signedOut: 401 });
const anyUser = (ok: number): Expect => ({ owner: ok, editor: ok, crew: ok, stranger: ok, signedOut: 401 });

async function freshSetup(extra: Record<string, unknown> = {}): Promise<Vars> {
  const s = await newSetup(owner.client, { studioId: shared.studio, title: 'Matrix target', ...extra });
  return { setup: s.id, version: s.version };
}
/** A template of the shared studio that an operator put in the gallery for everyone. */
async function galleryTemplate(): Promise<Vars> {
  const v = await freshSetup({ isTemplate: true });
  await publishForEveryone(base, String(v.setup));
  return v;
}
async function setupWithTwoVersions(): Promise<Vars> {
  const v = await freshSetup();
  const put = await owner.client.put(`/api/setups/${v.setup}`, { version: 1, title: 'Matrix target, second version' });
  expect(put.status).toBe(200);
  const h = await owner.client.get(`/api/setups/${v.setup}/history`);
  return { ...v, version: 2, firstVersion: h.body.versions.find((x: { version: number }) => x.version === 1).id };
}
async function invite(email = freshEmail('invitee')): Promise<Vars> {
  const r = await owner.client.post(`/api/studios/${shared.studio}/members`, { email, role: 'crew' });
  expect(r.status).toBe(201);
  return { invitation: r.body.invitation.id, token: tokenOf(r.body.link) };
}
async function member(): Promise<Vars> {
  const m = await joinAs(base, owner.client, String(shared.studio), 'crew', 'Matrix Member');
  return { user: m.userId };
}

/** A thread on the shared setup, started by `c`. */
async function thread(c: Client): Promise<Vars> {
  const r = await c.post(`/api/setups/${shared.setup}/comments`, { body: 'Is the boom sandbagged?', point: { x: 1, y: 2 } });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return { comment: r.body.id };
}
async function share(): Promise<Vars> {
  const r = await owner.client.post(`/api/setups/${shared.setup}/shares`, {});
  expect(r.status).toBe(201);
  return { share: r.body.share.id, shareToken: r.body.token };
}
/** POST a small JPEG as multipart (the client speaks JSON only), answered in the client's shape. */
async function uploadPhoto(c: Client, setup: string | number): Promise<Res> {
  const jpg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#777' } }).jpeg().toBuffer();
  const form = new FormData();
  form.append('photo', new Blob([new Uint8Array(jpg)], { type: 'image/jpeg' }), 'matrix.jpg');
  const r = await raw(base, c, `/api/setups/${setup}/photos`, { method: 'POST', body: form });
  return { status: r.status, body: r.json, headers: new Headers({ 'content-type': r.type }) };
}
async function photo(): Promise<Vars> {
  const r = await uploadPhoto(owner.client, shared.setup!);
  expect(r.status).toBe(201);
  return { photo: r.body.id };
}

const cases: Case[] = [
  { route: 'GET /api/health', call: (c) => c.get('/api/health'), expect: { owner: 200, editor: 200, crew: 200, stranger: 200, signedOut: 200 } },
  { route: 'GET /api/me', call: (c) => c.get('/api/me'), expect: anyUser(200) },
  { route: 'PATCH /api/me', call: (c) => c.request('PATCH', '/api/me', {}), expect: anyUser(200) },

  // Setups
  { route: 'GET /api/setups', call: (c) => c.get(`/api/setups?studio=${shared.studio}`), expect: anyUser(200) },
  { route: 'GET /api/setups', variant: 'templates', call: (c) => c.get('/api/setups?templates=1'), expect: anyUser(200) },
  { route: 'GET /api/setups', variant: 'deleted', call: (c) => c.get('/api/setups?deleted=1'), expect: anyUser(200) },
  { route: 'GET /api/tags', call: (c) => c.get('/api/tags'), expect: anyUser(200) },
  { route: 'POST /api/setups', call: (c) => c.post('/api/setups', { studioId: shared.studio, title: 'Role check' }), expect: writable(201) },
  {
    route: 'POST /api/setups',
    variant: 'as a template',
    call: (c) => c.post('/api/setups', { studioId: shared.studio, title: 'Role check template', isTemplate: true }),
    expect: ownerOnly(201),
  },
  { route: 'GET /api/setups/:id', call: (c) => c.get(`/api/setups/${shared.setup}`), expect: readable },
  { route: 'GET /api/setups/:id', variant: 'a template in the gallery for everyone', call: (c) => c.get(`/api/setups/${shared.template}`), expect: anyUser(200) },
  { route: 'GET /api/setups/:id', variant: "a studio's own template", call: (c) => c.get(`/api/setups/${shared.studioTemplate}`), expect: readable },
  {
    route: 'POST /api/setups/:id/duplicate',
    variant: "a studio's own template",
    call: (c) => c.post(`/api/setups/${shared.studioTemplate}/duplicate`),
    expect: { owner: 201, editor: 201, crew: 201, stranger: 404, signedOut: 401 },
  },
  // The gallery for everyone is an operator's (tests/api/operators.test.ts has the operator's own answers).
  {
    route: 'PUT /api/setups/:id/everyone',
    variant: 'publishing',
    prepare: () => freshSetup({ isTemplate: true }),
    call: (c, v) => c.put(`/api/setups/${v.setup}/everyone`, { forEveryone: true }),
    expect: { owner: 403, editor: 403, crew: 403, stranger: 403, signedOut: 401 },
  },
  {
    route: 'PUT /api/setups/:id/everyone',
    variant: 'withdrawing',
    prepare: () => galleryTemplate(),
    call: (c, v) => c.put(`/api/setups/${v.setup}/everyone`, { forEveryone: false }),
    expect: { owner: 403, editor: 403, crew: 403, stranger: 403, signedOut: 401 },
  },
  {
    route: 'PUT /api/setups/:id',
    variant: 'un-marking a template in the gallery for everyone',
    prepare: () => galleryTemplate(),
    call: (c, v) => c.put(`/api/setups/${v.setup}`, { version: v.version, isTemplate: false }),
    expect: { owner: 403, editor: 403, crew: 403, stranger: 403, signedOut: 401 },
  },
  {
    route: 'PUT /api/setups/:id',
    prepare: () => freshSetup(),
    call: (c, v) => c.put(`/api/setups/${v.setup}`, { version: v.version, title: 'Renamed by the matrix' }),
    expect: writable(200),
  },
  {
    route: 'PUT /api/setups/:id',
    variant: 'a template in the gallery for everyone',
    prepare: () => galleryTemplate(),
    call: (c, v) => c.put(`/api/setups/${v.setup}`, { version: v.version, notes: 'changed' }),
    expect: { owner: 200, editor: 200, crew: 403, stranger: 403, signedOut: 401 },
  },
  {
    route: 'PUT /api/setups/:id',
    variant: 'publishing it as a template',
    prepare: () => freshSetup(),
    call: (c, v) => c.put(`/api/setups/${v.setup}`, { version: v.version, isTemplate: true }),
    expect: ownerOnly(200),
  },
  { route: 'DELETE /api/setups/:id', prepare: () => freshSetup(), call: (c, v) => c.del(`/api/setups/${v.setup}`), expect: writable(204) },
  {
    route: 'POST /api/setups/:id/restore',
    prepare: async () => {
      const v = await freshSetup();
      expect((await owner.client.del(`/api/setups/${v.setup}`)).status).toBe(204);
      return v;
    },
    call: (c, v) => c.post(`/api/setups/${v.setup}/restore`),
    expect: writable(200),
  },
  // Crew copy a studio's setup out only when the studio lets them (crewMayCopy, off by default: 403 naming it,
  // tests/api/studios.test.ts turns it on); never into the shared one.
  { route: 'POST /api/setups/:id/duplicate', call: (c) => c.post(`/api/setups/${shared.setup}/duplicate`), expect: { ...readable, owner: 201, editor: 201, crew: 403 } },
  {
    route: 'POST /api/setups/:id/duplicate',
    variant: 'into the shared studio',
    call: (c) => c.post(`/api/setups/${shared.setup}/duplicate`, { studioId: shared.studio }),
    expect: writable(201),
  },
  { route: 'POST /api/setups/:id/duplicate', variant: 'a template', call: (c) => c.post(`/api/setups/${shared.template}/duplicate`), expect: anyUser(201) },
  { route: 'GET /api/setups/:id/history', call: (c) => c.get(`/api/setups/${shared.setup}/history`), expect: readable },
  {
    route: 'GET /api/setups/:id/history',
    variant: 'a template (history stays in the studio)',
    call: (c) => c.get(`/api/setups/${shared.template}/history`),
    expect: { ...readable, stranger: 403 },
  },
  { route: 'GET /api/setups/:id/history/:versionId', call: (c) => c.get(`/api/setups/${shared.setup}/history/${shared.firstVersion}`), expect: readable },
  {
    route: 'POST /api/setups/:id/history/:versionId/restore',
    prepare: setupWithTwoVersions,
    call: (c, v) => c.post(`/api/setups/${v.setup}/history/${v.firstVersion}/restore`),
    expect: writable(200),
  },
  { route: 'GET /api/setups/:id/comments', call: (c) => c.get(`/api/setups/${shared.setup}/comments`), expect: readable },
  {
    route: 'GET /api/setups/:id/comments',
    variant: 'a template (comments stay in the studio)',
    call: (c) => c.get(`/api/setups/${shared.template}/comments`),
    expect: { ...readable, stranger: 403 },
  },
  { route: 'POST /api/setups/:id/comments', call: (c) => c.post(`/api/setups/${shared.setup}/comments`, { body: 'Sandbag the boom.' }), expect: { ...readable, owner: 201, editor: 201, crew: 201 } },
  {
    route: 'POST /api/setups/:id/comments',
    variant: 'a reply pinned nowhere',
    prepare: () => thread(owner.client),
    call: (c, v) => c.post(`/api/setups/${shared.setup}/comments`, { body: 'Done, bagged twice.', parentId: v.comment }),
    expect: { ...readable, owner: 201, editor: 201, crew: 201 },
  },
  // Resolving: anyone who may change the setup, and the member who started the thread (crew too).
  {
    route: 'PATCH /api/setups/:id/comments/:commentId',
    prepare: () => thread(owner.client),
    call: (c, v) => c.request('PATCH', `/api/setups/${shared.setup}/comments/${v.comment}`, { resolved: true }),
    expect: { ...readable, crew: 403 },
  },
  {
    route: 'PATCH /api/setups/:id/comments/:commentId',
    variant: 'a thread the crew member started',
    prepare: () => thread(clients.crew),
    call: (c, v) => c.request('PATCH', `/api/setups/${shared.setup}/comments/${v.comment}`, { resolved: true }),
    expect: readable,
  },
  { route: 'POST /api/setups/:id/comments/read', call: (c) => c.post(`/api/setups/${shared.setup}/comments/read`), expect: { ...readable, owner: 204, editor: 204, crew: 204 } },
  { route: 'GET /api/setups/:id/meter', call: (c) => c.get(`/api/setups/${shared.setup}/meter`), expect: readable },
  { route: 'GET /api/setups/:id/meter', variant: 'a template', call: (c) => c.get(`/api/setups/${shared.template}/meter`), expect: anyUser(200) },

  // Studios and members
  { route: 'GET /api/studios', call: (c) => c.get('/api/studios'), expect: anyUser(200) },
  { route: 'POST /api/studios', call: (c) => c.post('/api/studios', { name: 'Matrix annex' }), expect: anyUser(201) },
  { route: 'GET /api/studios/:id', call: (c) => c.get(`/api/studios/${shared.studio}`), expect: readable },
  { route: 'PATCH /api/studios/:id', call: (c) => c.request('PATCH', `/api/studios/${shared.studio}`, { name: shared.studioName }), expect: ownerOnly(200) },
  { route: 'GET /api/studios/:id/members', call: (c) => c.get(`/api/studios/${shared.studio}/members`), expect: readable },
  { route: 'POST /api/studios/:id/members', call: (c) => c.post(`/api/studios/${shared.studio}/members`, { email: freshEmail('matrix'), role: 'crew' }), expect: ownerOnly(201) },
  {
    route: 'PATCH /api/studios/:id/members/:userId',
    prepare: member,
    call: (c, v) => c.request('PATCH', `/api/studios/${shared.studio}/members/${v.user}`, { role: 'editor' }),
    expect: ownerOnly(200),
  },
  { route: 'DELETE /api/studios/:id/members/:userId', prepare: member, call: (c, v) => c.del(`/api/studios/${shared.studio}/members/${v.user}`), expect: ownerOnly(204) },
  { route: 'GET /api/studios/:id/invitations', call: (c) => c.get(`/api/studios/${shared.studio}/invitations`), expect: ownerOnly(200) },
  {
    route: 'DELETE /api/studios/:id/invitations/:invitationId',
    prepare: () => invite(),
    call: (c, v) => c.del(`/api/studios/${shared.studio}/invitations/${v.invitation}`),
    expect: ownerOnly(204),
  },

  // Invitation links: the token is the secret, so its preview needs no account; joining needs the invited address.
  { route: 'GET /api/invitations/:token', call: (c) => c.get(`/api/invitations/${shared.token}`), expect: { ...anyUser(200), signedOut: 200 } },
  { route: 'GET /api/invitations', call: (c) => c.get('/api/invitations'), expect: anyUser(200) },
  { route: 'DELETE /api/invitations', call: (c) => c.del('/api/invitations'), expect: anyUser(204) },
  { route: 'POST /api/invitations/:token/accept', variant: 'for someone else', prepare: () => invite(), call: (c, v) => c.post(`/api/invitations/${v.token}/accept`), expect: anyUser(403) },

  // Crew sheets and plan images: whoever may read the setup.
  { route: 'GET /api/setups/:id/crew-sheet.pdf', call: (c) => c.get(`/api/setups/${shared.setup}/crew-sheet.pdf`), expect: readable },
  { route: 'POST /api/day-sheet.pdf', call: (c) => c.post('/api/day-sheet.pdf', { setupIds: [shared.setup] }), expect: readable },
  { route: 'GET /api/setups/:id/crew-sheet.pdf', variant: 'a template', call: (c) => c.get(`/api/setups/${shared.template}/crew-sheet.pdf`), expect: anyUser(200) },
  { route: 'GET /api/setups/:id/plan.svg', call: (c) => c.get(`/api/setups/${shared.setup}/plan.svg`), expect: readable },
  { route: 'GET /api/setups/:id/plan.png', call: (c) => c.get(`/api/setups/${shared.setup}/plan.png?width=300`), expect: readable },
  { route: 'GET /api/setups/:id/frame.png', call: (c) => c.get(`/api/setups/${shared.setup}/frame.png?width=120`), expect: { ...readable, owner: 409, editor: 409, crew: 409 } }, // the matrix's plan has no subject: readers are told so (409), others get nothing

  // Share links: owners and editors make and revoke them, members list them; the token opens the setup for anyone.
  { route: 'POST /api/setups/:id/shares', call: (c) => c.post(`/api/setups/${shared.setup}/shares`, {}), expect: writable(201) },
  { route: 'GET /api/setups/:id/shares', call: (c) => c.get(`/api/setups/${shared.setup}/shares`), expect: readable },
  {
    route: 'GET /api/setups/:id/shares',
    variant: 'a template (links stay in the studio)',
    call: (c) => c.get(`/api/setups/${shared.template}/shares`),
    expect: { ...readable, stranger: 403 },
  },
  { route: 'DELETE /api/setups/:id/shares/:shareId', prepare: share, call: (c, v) => c.del(`/api/setups/${shared.setup}/shares/${v.share}`), expect: writable(204) },
  { route: 'GET /api/shared/:token', call: (c) => c.get(`/api/shared/${shared.shareToken}`), expect: { ...anyUser(200), signedOut: 200 } },
  { route: 'GET /api/shared/:token/crew-sheet.pdf', call: (c) => c.get(`/api/shared/${shared.shareToken}/crew-sheet.pdf`), expect: { ...anyUser(200), signedOut: 200 } },
  { route: 'GET /api/shared/:token/plan.svg', call: (c) => c.get(`/api/shared/${shared.shareToken}/plan.svg`), expect: { ...anyUser(200), signedOut: 200 } },
  // The comment thread on the share page: members of the setup's studio only.
  { route: 'GET /api/shared/:token/membership', call: (c) => c.get(`/api/shared/${shared.shareToken}/membership`), expect: readable },
  { route: 'GET /api/shared/:token/plan.png', call: (c) => c.get(`/api/shared/${shared.shareToken}/plan.png?width=300`), expect: { ...anyUser(200), signedOut: 200 } },
  { route: 'GET /api/shared/:token/frame.png', call: (c) => c.get(`/api/shared/${shared.shareToken}/frame.png?width=120`), expect: { ...anyUser(409), signedOut: 409 } }, // no subject on the matrix's plan

  // Sending to the crew makes a share link, so it is for owners and editors.
  { route: 'POST /api/setups/:id/send', call: (c) => c.post(`/api/setups/${shared.setup}/send`, { to: [freshEmail('matrix-crew')], attachPdf: false }), expect: writable(201) },

  // Photos: any member attaches (crew photograph the rigged set); owners, editors and the uploader delete.
  { route: 'POST /api/setups/:id/photos', call: (c) => uploadPhoto(c, shared.setup!), expect: { ...readable, owner: 201, editor: 201, crew: 201 } },
  { route: 'GET /api/setups/:id/photos', call: (c) => c.get(`/api/setups/${shared.setup}/photos`), expect: readable },
  { route: 'GET /api/setups/:id/photos/:photoId', call: (c) => c.get(`/api/setups/${shared.setup}/photos/${shared.photo}`), expect: readable },
  { route: 'GET /api/setups/:id/photos/:photoId/thumbnail', call: (c) => c.get(`/api/setups/${shared.setup}/photos/${shared.photo}/thumbnail`), expect: readable },
  {
    route: 'DELETE /api/setups/:id/photos/:photoId',
    variant: "the owner's photo",
    prepare: photo,
    call: (c, v) => c.del(`/api/setups/${shared.setup}/photos/${v.photo}`),
    expect: writable(204),
  },
];

/** Routes handled by other code, with the reason they are not in the table. */
const outside: Record<string, string> = {
  'ALL /api/auth/{*any}': "better-auth's own handler (sign-up, sign-in, sign-out); covered by foundation.test.ts",
};

beforeAll(async () => {
  const team = await studioWithTeam(base);
  owner = team.owner;
  clients.owner = team.owner.client;
  clients.editor = team.editor.client;
  clients.crew = team.crew.client;
  clients.stranger = (await fresh(base, 'Outsider Vale')).client;
  clients.signedOut = new Client(base);
  shared.studio = team.studioId;
  shared.studioName = (await owner.client.get(`/api/studios/${shared.studio}`)).body.name;
  Object.assign(shared, await setupWithTwoVersions());
  shared.template = (await galleryTemplate()).setup!;
  shared.studioTemplate = (await freshSetup({ isTemplate: true })).setup!;
  await freshSetup();
  shared.token = (await invite()).token!;
  Object.assign(shared, await share(), await photo());
});

describe.each(cases)('$route $variant', (c) => {
  it.each(who.map((w) => [w, c.expect[w]] as const))('as %s → %i', async (w, status) => {
    const vars = c.prepare ? { ...shared, ...(await c.prepare()) } : shared;
    const r = await c.call(clients[w], vars);
    expect(r.status, JSON.stringify(r.body)).toBe(status);
    if (status >= 400) {
      expect(r.headers.get('content-type')).toMatch(/application\/json/);
      expect(typeof r.body.error.code).toBe('string');
    }
  });
});

// Classes: instructor, the student whose work it is, a classmate, a student of another class, signed out.
describe('classes', () => {
  beforeAll(() => setupClassMatrix(base));
  describe.each(classCases)('$route $variant', (c) => {
    it.each(classWho.map((w) => [w, c.expect[w]] as const))('as %s → %i', async (w, status) => {
      const vars = c.prepare ? { ...classShared, ...(await c.prepare(w)) } : classShared;
      const r = await c.call(classClients[w], vars);
      expect(r.status, JSON.stringify(r.body)).toBe(status);
      if (status >= 400) {
        expect(r.headers.get('content-type')).toMatch(/application\/json/);
        expect(typeof r.body.error.code).toBe('string');
      }
    });
  });
});

describe('the table covers every route', () => {
  const { db, pool } = createDb(TEST_DATABASE_URL);
  afterAll(() => pool.end());

  it('has a row for each route the app serves under /api', () => {
    const app = createApp({ db, auth: createAuth(db, { baseURL: base, secret: 'route-listing-only-0123456789abcdef' }), logger: pino({ level: 'silent' }) });
    type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle: { stack?: Layer[] }; match: (p: string) => unknown };
    const served = new Set<string>();
    for (const layer of (app as unknown as { router: { stack: Layer[] } }).router.stack) {
      if (layer.route) {
        const methods = Object.keys(layer.route.methods);
        served.add(`${methods.length > 5 ? 'ALL' : methods[0]!.toUpperCase()} ${layer.route.path}`);
      } else if (layer.handle.stack) {
        expect(layer.match('/api/anything'), 'every router is mounted at /api').toBeTruthy();
        for (const inner of layer.handle.stack) {
          if (inner.route) for (const m of Object.keys(inner.route.methods)) served.add(`${m.toUpperCase()} /api${inner.route.path}`);
        }
      }
    }
    const inTable = new Set([...cases, ...classCases].map((c) => c.route));
    const missing = [...served].filter((r) => !inTable.has(r) && !(r in outside));
    expect(missing, 'routes with no row in the role matrix').toEqual([]);
    const stale = [...inTable].filter((r) => !served.has(r));
    expect(stale, 'rows for routes the app does not serve').toEqual([]);
    expect(served.size).toBeGreaterThanOrEqual(30);
  });
});

describe('the library lists only what a user may read', () => {
  it('studio members see the studio setups', async () => {
    for (const w of ['owner', 'editor', 'crew'] as const) {
      const r = await clients[w].get(`/api/setups?studio=${shared.studio}`);
      expect(r.status).toBe(200);
      expect(r.body.setups.length).toBeGreaterThanOrEqual(3);
      expect(r.body.setups.every((s: { role: string }) => s.role === w)).toBe(true);
    }
  });

  it('a stranger sees none of them, even naming the studio, but sees those of its templates in the gallery for everyone', async () => {
    const r = await clients.stranger.get(`/api/setups?studio=${shared.studio}`);
    expect(r.status).toBe(200);
    expect(r.body.setups).toEqual([]);
    const t = await clients.stranger.get(`/api/setups?templates=1&studio=${shared.studio}`);
    expect(t.body.setups.map((s: { id: string }) => s.id)).toContain(shared.template);
    expect(t.body.setups.map((s: { id: string }) => s.id)).not.toContain(shared.studioTemplate);
    expect(t.body.setups.every((s: { isTemplate: boolean; role: null }) => s.isTemplate && s.role === null)).toBe(true);
  });

  it('a stranger cannot see the studio, its members or its tags', async () => {
    expect((await clients.stranger.get(`/api/studios/${shared.studio}/members`)).status).toBe(404);
    const tags = await clients.stranger.get(`/api/tags?studio=${shared.studio}`);
    expect(tags.body.tags).toEqual([]);
  });

  it('crew see no deleted setups to restore (they cannot restore)', async () => {
    const v = await freshSetup();
    await owner.client.del(`/api/setups/${v.setup}`);
    const mine = await owner.client.get(`/api/setups?deleted=1&studio=${shared.studio}`);
    expect(mine.body.setups.map((s: { id: string }) => s.id)).toContain(v.setup);
    const crew = await clients.crew.get(`/api/setups?deleted=1&studio=${shared.studio}`);
    expect(crew.body.setups).toEqual([]);
  });

  it('GET /api/setups/:id tells crew they are crew (the editor goes read-only)', async () => {
    const r = await clients.crew.get(`/api/setups/${shared.setup}`);
    expect(r.body.role).toBe('crew');
    expect((await clients.editor.get(`/api/setups/${shared.setup}`)).body.role).toBe('editor');
    expect((await clients.stranger.get(`/api/setups/${shared.template}`)).body.role).toBeNull();
  });

  it('a path id that is not a UUID is a 404, like one that does not exist', async () => {
    for (const path of ['/api/setups/not-a-uuid', '/api/setups/00000000-0000-4000-8000-000000000000', '/api/studios/xyz/members']) {
      const r = await clients.owner.get(path);
      expect(r.status, path).toBe(404);
      expect(r.body.error.code).toBe('not_found');
    }
  });
});
