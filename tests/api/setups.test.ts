// Setups over real HTTP against the real database: create, read, save, history, duplicate, delete and
// restore, the library's lists (sorts, search, tags, templates, pages), comments and the meter.
import { CURRENT_SCHEMA_VERSION } from '../../model/document';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { sql } from 'drizzle-orm';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { meter } from '../../calc';
import { createDb } from '../../db/client';
import { pruneHistory } from '../../db/history';
import { sceneFromDocument } from '../../model/documentToScene';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { TEST_DATABASE_URL } from '../support/env';
import { Client } from '../support/http';
import { documentWith, fresh, newSetup, publishForEveryone, studioWithTeam, type Signed } from './fixtures';

const base = inject('baseUrl');
const { db, pool } = createDb(TEST_DATABASE_URL);
afterAll(() => pool.end());

let me: Signed;
beforeAll(async () => {
  me = await fresh(base, 'Library Keeper');
});

describe('create, read, save', () => {
  it('creates with defaults and reads it back with the caller role', async () => {
    const s = await newSetup(me.client, { title: '  Window light, north  ', tags: ['Portrait', 'portrait', ' window '] });
    expect(s).toMatchObject({ title: 'Window light, north', version: 1, tags: ['portrait', 'window'], role: 'owner', studioId: me.personalStudioId, isTemplate: false });
    expect(s.document.schemaVersion).toBe(CURRENT_SCHEMA_VERSION);
    expect(s.document.items).toEqual([]);
    const r = await me.client.get(`/api/setups/${s.id}`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toMatch(/application\/json/);
    expect(r.body).toEqual(s);
  });

  it('a save returns version + 1 and the stored document is the one sent, defaults filled in', async () => {
    const s = await newSetup(me.client, { title: 'Save me' });
    const doc = documentWith(3);
    const put = await me.client.put(`/api/setups/${s.id}`, { version: 1, document: doc, notes: 'Bring the apple box.' });
    expect(put.status).toBe(200);
    expect(put.body).toMatchObject({ id: s.id, version: 2, notes: 'Bring the apple box.', title: 'Save me' });
    expect(Date.parse(put.body.updatedAt)).toBeGreaterThanOrEqual(Date.parse(s.updatedAt));
    const got = await me.client.get(`/api/setups/${s.id}`);
    expect(got.body.document).toEqual(doc);
    expect(got.body.version).toBe(2);
  });

  it('a stale version is a 409 carrying the stored setup, and nothing is overwritten', async () => {
    const s = await newSetup(me.client, { title: 'Contested' });
    expect((await me.client.put(`/api/setups/${s.id}`, { version: 1, title: 'First writer' })).status).toBe(200);
    const late = await me.client.put(`/api/setups/${s.id}`, { version: 1, title: 'Second writer', document: documentWith(1) });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('version_conflict');
    expect(late.body.error.current).toMatchObject({ id: s.id, title: 'First writer', version: 2 });
    expect(late.body.error.current.document).toEqual(s.document);
    expect(typeof late.body.error.current.updatedAt).toBe('string');
    const stored = await me.client.get(`/api/setups/${s.id}`);
    expect(stored.body).toMatchObject({ title: 'First writer', version: 2 });
    expect(stored.body.document).toEqual(s.document);
  });

  it('the same changes sent again from the same base (a second sender on one device) are already applied: 200, not a 409; anything else from that base is still a 409', async () => {
    const s = await newSetup(me.client, { title: 'Sent by two' });
    const doc = documentWith(2);
    const first = await me.client.put(`/api/setups/${s.id}`, { version: 1, document: doc, notes: 'Flag the key.' });
    expect(first.status).toBe(200);
    const again = await me.client.put(`/api/setups/${s.id}`, { version: 1, document: doc, notes: 'Flag the key.' });
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.headers.get('already-applied')).toBe('true');
    expect(again.body).toMatchObject({ id: s.id, version: 2, notes: 'Flag the key.' });
    expect((await me.client.get(`/api/setups/${s.id}`)).body.version).toBe(2);
    // Part of it only: the sender's copy would still lack the notes, so it must hear of the conflict.
    expect((await me.client.put(`/api/setups/${s.id}`, { version: 1, document: doc })).status).toBe(409);
    // Something else from the old base: a conflict, as ever.
    expect((await me.client.put(`/api/setups/${s.id}`, { version: 1, document: doc, notes: 'Other words.' })).status).toBe(409);
    expect((await me.client.get(`/api/setups/${s.id}`)).body).toMatchObject({ version: 2, notes: 'Flag the key.' });
  });

  it('history keeps every distinct state; a save that changes nothing adds no history row', async () => {
    const s = await newSetup(me.client, { title: 'Draft' });
    await me.client.put(`/api/setups/${s.id}`, { version: 1, title: 'Draft two' });
    const same = await me.client.put(`/api/setups/${s.id}`, { version: 2, title: 'Draft two' });
    expect(same.body.version).toBe(3);
    await me.client.put(`/api/setups/${s.id}`, { version: 3, document: documentWith(2) });
    const h = await me.client.get(`/api/setups/${s.id}/history`);
    expect(h.status).toBe(200);
    expect(h.body.versions.map((v: { version: number; title: string }) => [v.version, v.title])).toEqual([
      [4, 'Draft two'],
      [2, 'Draft two'],
      [1, 'Draft'],
    ]);
    expect(h.body.versions[0]).toMatchObject({ itemCount: 5, savedBy: { id: me.userId, name: 'Library Keeper' } });
  });
});

describe('history', () => {
  it('pages newest first, reads one version, and restores an old one as a new version', async () => {
    const s = await newSetup(me.client, { title: 'v1', document: documentWith(1) });
    for (let v = 1; v < 6; v++) expect((await me.client.put(`/api/setups/${s.id}`, { version: v, title: `v${v + 1}`, document: documentWith(v + 1) })).status).toBe(200);
    const p1 = await me.client.get(`/api/setups/${s.id}/history?limit=4`);
    expect(p1.body.versions.map((v: { version: number }) => v.version)).toEqual([6, 5, 4, 3]);
    const p2 = await me.client.get(`/api/setups/${s.id}/history?limit=4&before=${p1.body.nextBefore}`);
    expect(p2.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(p2.body.nextBefore).toBeNull();

    const first = p2.body.versions[1];
    const one = await me.client.get(`/api/setups/${s.id}/history/${first.id}`);
    expect(one.body).toMatchObject({ version: 1, title: 'v1' });
    expect(one.body.document).toEqual(documentWith(1));

    const stale = await me.client.post(`/api/setups/${s.id}/history/${first.id}/restore`, { version: 3 });
    expect(stale.status).toBe(409);
    const restored = await me.client.post(`/api/setups/${s.id}/history/${first.id}/restore`, { version: 6 });
    expect(restored.status).toBe(200);
    expect(restored.body).toMatchObject({ version: 7, title: 'v1' });
    const now = await me.client.get(`/api/setups/${s.id}`);
    expect(now.body.document).toEqual(documentWith(1));
    const all = await me.client.get(`/api/setups/${s.id}/history`);
    expect(all.body.versions.map((v: { version: number }) => v.version)).toEqual([7, 6, 5, 4, 3, 2, 1]);
  });

  it('a version of another setup is not found through this one', async () => {
    const a = await newSetup(me.client, { title: 'A' });
    const b = await newSetup(me.client, { title: 'B' });
    const hb = await me.client.get(`/api/setups/${b.id}/history`);
    expect((await me.client.get(`/api/setups/${a.id}/history/${hb.body.versions[0].id}`)).status).toBe(404);
    expect((await me.client.post(`/api/setups/${a.id}/history/${hb.body.versions[0].id}/restore`)).status).toBe(404);
  });

  it('is pruned only by the explicit policy, which always keeps the newest', async () => {
    const s = await newSetup(me.client, { title: 'p1' });
    for (let v = 1; v < 5; v++) await me.client.put(`/api/setups/${s.id}`, { version: v, title: `p${v + 1}` });
    expect(await pruneHistory(db, { setupId: s.id, keepLatest: 2, keepDays: 1 })).toBe(0); // all recent: kept
    expect(await pruneHistory(db, { setupId: s.id, keepLatest: 0, keepDays: 0 })).toBe(4);
    const h = await me.client.get(`/api/setups/${s.id}/history`);
    expect(h.body.versions.map((v: { version: number }) => v.version)).toEqual([5]);
  });
});

describe('delete and restore', () => {
  it('a deleted setup leaves the library, is listed for restore with its deadline, and comes back', async () => {
    const s = await newSetup(me.client, { title: 'Gone for a while' });
    expect((await me.client.del(`/api/setups/${s.id}`)).status).toBe(204);
    expect((await me.client.get(`/api/setups/${s.id}`)).status).toBe(410);
    expect((await me.client.put(`/api/setups/${s.id}`, { version: 1, title: 'x' })).status).toBe(410);
    const lib = await me.client.get('/api/setups?limit=100');
    expect(lib.body.setups.map((x: { id: string }) => x.id)).not.toContain(s.id);
    const del = await me.client.get('/api/setups?deleted=1');
    const row = del.body.setups.find((x: { id: string }) => x.id === s.id);
    expect(row).toBeTruthy();
    expect(Date.parse(row.restorableUntil) - Date.parse(row.deletedAt)).toBe(30 * 86_400_000);
    const back = await me.client.post(`/api/setups/${s.id}/restore`);
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ id: s.id, title: 'Gone for a while', version: 1 });
    expect((await me.client.get('/api/setups?deleted=1')).body.setups.map((x: { id: string }) => x.id)).not.toContain(s.id);
  });

  it('after 30 days it can no longer be restored', async () => {
    const s = await newSetup(me.client, { title: 'Long gone' });
    await me.client.del(`/api/setups/${s.id}`);
    await db.execute(sql`update setups set deleted_at = now() - interval '31 days' where id = ${s.id}`);
    expect((await me.client.get('/api/setups?deleted=1')).body.setups.map((x: { id: string }) => x.id)).not.toContain(s.id);
    const r = await me.client.post(`/api/setups/${s.id}/restore`);
    expect(r.status).toBe(410);
    expect(r.body.error.code).toBe('restore_expired');
  });
});

describe('duplicate', () => {
  it('copies the current state into the same studio with a fresh history', async () => {
    const s = await newSetup(me.client, { title: 'Original', document: documentWith(2), notes: 'n', tags: ['copyme'] });
    await me.client.put(`/api/setups/${s.id}`, { version: 1, title: 'Original, edited' });
    const c = await me.client.post(`/api/setups/${s.id}/duplicate`);
    expect(c.status).toBe(201);
    expect(c.body).toMatchObject({ title: 'Original, edited (copy)', version: 1, notes: 'n', tags: ['copyme'], studioId: me.personalStudioId, isTemplate: false });
    expect(c.body.id).not.toBe(s.id);
    expect(c.body.document).toEqual(documentWith(2));
    expect((await me.client.get(`/api/setups/${c.body.id}/history`)).body.versions).toHaveLength(1);
    const named = await me.client.post(`/api/setups/${s.id}/duplicate`, { title: 'Named copy' });
    expect(named.body.title).toBe('Named copy');
  });

  it("a template from another studio lands in the caller's own studio, as a plain setup", async () => {
    const team = await studioWithTeam(base);
    const t = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Shared template', isTemplate: true });
    await publishForEveryone(base, t.id);
    const c = await me.client.post(`/api/setups/${t.id}/duplicate`);
    expect(c.status).toBe(201);
    expect(c.body).toMatchObject({ studioId: me.personalStudioId, isTemplate: false, role: 'owner' });
    // …and not into a studio the caller is not in.
    expect((await me.client.post(`/api/setups/${t.id}/duplicate`, { studioId: team.studioId })).status).toBe(404);
    // Crew copy into their own studio, never into the shared one.
    expect((await team.crew.client.post(`/api/setups/${t.id}/duplicate`, { studioId: team.studioId })).status).toBe(403);
    const crewCopy = await team.crew.client.post(`/api/setups/${t.id}/duplicate`);
    expect(crewCopy.body.studioId).toBe(team.crew.personalStudioId);
    // An editor's default is the source's studio, where they may write.
    const edCopy = await team.editor.client.post(`/api/setups/${t.id}/duplicate`);
    expect(edCopy.body.studioId).toBe(team.studioId);
  });
});

describe('the library list', () => {
  let lib: Signed;
  const titles = ['banana split light', 'Apple box portrait', 'cherry gel wash', 'Damson rim pair', 'elder bounce 50% card'];
  beforeAll(async () => {
    lib = await fresh(base, 'List Reader');
    for (const [i, title] of titles.entries()) {
      await newSetup(lib.client, { title, notes: i === 2 ? 'Needs the umbrella boom' : '', tags: i % 2 ? ['odd'] : ['even', 'fruit'] });
    }
    // Touch the oldest so "updated" and "created" orders differ.
    const all = await lib.client.get('/api/setups?sort=created&limit=100');
    const oldest = all.body.setups[all.body.setups.length - 1];
    await lib.client.put(`/api/setups/${oldest.id}`, { version: 1, notes: 'touched' });
  });

  const titlesOf = (r: { body: { setups: { title: string }[] } }) => r.body.setups.map((s) => s.title);

  it('sorts by updated (default), created and title', async () => {
    expect(titlesOf(await lib.client.get('/api/setups'))[0]).toBe('banana split light');
    expect(titlesOf(await lib.client.get('/api/setups?sort=created'))).toEqual([...titles].reverse());
    expect(titlesOf(await lib.client.get('/api/setups?sort=title'))).toEqual([...titles].sort((a, b) => a.toLowerCase().localeCompare(b.toLowerCase())));
  });

  it.each(['updated', 'created', 'title'])('pages by cursor in %s order with no repeats or gaps', async (sort) => {
    const whole = titlesOf(await lib.client.get(`/api/setups?sort=${sort}&limit=100`));
    const paged: string[] = [];
    let cursor: string | null = null;
    do {
      const r: { body: { setups: { title: string }[]; nextCursor: string | null } } = await lib.client.get(`/api/setups?sort=${sort}&limit=2${cursor ? `&cursor=${cursor}` : ''}`);
      paged.push(...titlesOf(r));
      cursor = r.body.nextCursor;
    } while (cursor);
    expect(paged).toEqual(whole);
  });

  it("refuses another order's cursor or a forged one, naming the parameter", async () => {
    const r = await lib.client.get('/api/setups?sort=title&limit=2');
    for (const bad of [`sort=created&cursor=${r.body.nextCursor}`, 'cursor=bm90LWpzb24', `cursor=${Buffer.from(JSON.stringify({ o: 'updated', k: "x'; drop", id: '0' })).toString('base64url')}`]) {
      const b = await lib.client.get(`/api/setups?${bad}`);
      expect(b.status).toBe(400);
      expect(b.body.error.fields).toHaveProperty('cursor');
    }
  });

  it('searches titles and notes by any part of a word, and tags by name', async () => {
    expect(titlesOf(await lib.client.get('/api/setups?q=BOX'))).toEqual(['Apple box portrait']);
    expect(titlesOf(await lib.client.get('/api/setups?q=umbrella'))).toEqual(['cherry gel wash']);
    expect(titlesOf(await lib.client.get('/api/setups?q=odd')).sort()).toEqual(['Apple box portrait', 'Damson rim pair']);
    // LIKE wildcards are plain characters.
    expect(titlesOf(await lib.client.get(`/api/setups?q=${encodeURIComponent('50%')}`))).toEqual(['elder bounce 50% card']);
    expect(titlesOf(await lib.client.get(`/api/setups?q=${encodeURIComponent('%')}`))).toEqual(['elder bounce 50% card']);
    expect(titlesOf(await lib.client.get('/api/setups?q=_'))).toEqual([]);
  });

  it('filters by tag and lists the tags in use with counts', async () => {
    expect(titlesOf(await lib.client.get('/api/setups?tag=Fruit&sort=title'))).toEqual(['banana split light', 'cherry gel wash', 'elder bounce 50% card']);
    const t = await lib.client.get('/api/tags');
    expect(t.body.tags).toEqual([
      { tag: 'even', count: 3 },
      { tag: 'fruit', count: 3 },
      { tag: 'odd', count: 2 },
    ]);
  });

  it("lists the gallery for everyone's templates and the caller's own studios' templates in the templates section", async () => {
    const team = await studioWithTeam(base);
    const t = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Template for all', isTemplate: true });
    const own = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Template kept in the studio', isTemplate: true });
    await publishForEveryone(base, t.id);
    const r = await lib.client.get('/api/setups?templates=1&limit=100');
    const row = r.body.setups.find((s: { id: string }) => s.id === t.id);
    expect(row).toMatchObject({ isTemplate: true, forEveryone: true, role: null, studioName: 'Test bench studio', ownerName: 'Studio Owner' });
    expect(r.body.setups.every((s: { isTemplate: boolean }) => s.isTemplate)).toBe(true);
    // A studio's own template is listed for its members only.
    expect(r.body.setups.map((s: { id: string }) => s.id)).not.toContain(own.id);
    const mine = await team.crew.client.get('/api/setups?templates=1&limit=100');
    expect(mine.body.setups.find((s: { id: string }) => s.id === own.id)).toMatchObject({ isTemplate: true, forEveryone: false, role: 'crew' });
  });

  it('refuses unknown parameters and mixed sections by name', async () => {
    const a = await lib.client.get('/api/setups?order=title');
    expect(a.status).toBe(400);
    expect(a.body.error.fields).toHaveProperty('order');
    const b = await lib.client.get('/api/setups?templates=1&deleted=1');
    expect(b.status).toBe(400);
    expect(b.body.error.fields).toHaveProperty('deleted');
  });
});

describe('comments', () => {
  it('every member comments, crew included, oldest first with author names', async () => {
    const team = await studioWithTeam(base);
    const s = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Commented' });
    expect((await team.crew.client.post(`/api/setups/${s.id}/comments`, { body: 'Which stand for the boom?', itemId: 'key' })).status).toBe(201);
    expect((await team.owner.client.post(`/api/setups/${s.id}/comments`, { body: 'The C-stand, sandbagged.' })).status).toBe(201);
    const r = await team.editor.client.get(`/api/setups/${s.id}/comments`);
    expect(r.body.comments.map((c: { body: string; author: { name: string }; itemId: string | null }) => [c.author.name, c.body, c.itemId])).toEqual([
      ['Team Crew', 'Which stand for the boom?', 'key'],
      ['Studio Owner', 'The C-stand, sandbagged.', null],
    ]);
    const empty = await team.crew.client.post(`/api/setups/${s.id}/comments`, { body: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields).toHaveProperty('body');
  });
});

describe('meter', () => {
  it("returns calc's readings for the stored document, the same as metering it directly", async () => {
    const doc = documentWith(0);
    const s = await newSetup(me.client, { title: 'Metered', document: doc });
    const r = await me.client.get(`/api/setups/${s.id}/meter`);
    expect(r.status).toBe(200);
    expect(r.body.version).toBe(1);
    expect(r.body.missing).toEqual([]);
    expect(r.body.readings.lights).toHaveLength(1);
    const direct = JSON.parse(JSON.stringify(meter(sceneFromDocument(doc).scene!)));
    expect(r.body.readings).toEqual(direct);
    // The document's receptor (a dome at the face pointed at the camera by default), each light's reading pointed
    // at it and by every receptor, and the subject by every receptor.
    expect(r.body.readings.receptor).toBe('dome-camera');
    expect(Object.keys(r.body.readings.subjectByReceptor).sort()).toEqual(['dome-camera', 'flat-face', 'flat-light']);
    expect(r.body.readings.lights[0].pointed.luxSeconds).toBeGreaterThan(0);
    expect(r.body.readings.lights[0].byReceptor['dome-camera']).toBeCloseTo(r.body.readings.lights[0].luxSeconds, 9);
  });

  it('says what is missing for an empty plan', async () => {
    const s = await newSetup(me.client, { title: 'Empty plan' });
    const r = await me.client.get(`/api/setups/${s.id}/meter`);
    expect(r.body).toMatchObject({ readings: null, missing: ['a subject', 'a light'] });
  });
});

describe('no N+1: a list costs the same number of queries for 3 setups or 40', () => {
  let url = '';
  let queries = 0;
  const server = createServer();
  beforeAll(async () => {
    const counted = createDb(TEST_DATABASE_URL);
    const q = counted.pool.query.bind(counted.pool) as (...a: unknown[]) => unknown;
    (counted.pool as unknown as { query: (...a: unknown[]) => unknown }).query = (...a: unknown[]) => {
      queries++;
      return q(...a);
    };
    await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const auth = createAuth(counted.db, { baseURL: url, secret: 'query-count-secret-0123456789abcdef' });
    server.on('request', createApp({ db: counted.db, auth, logger: pino({ level: 'silent' }) }));
    return async () => {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await counted.pool.end();
    };
  });

  async function cost(c: Client, path: string) {
    await c.get(path); // warm: the session is then cached, as it is for any busy client
    queries = 0;
    const r = await c.get(path);
    expect(r.status).toBe(200);
    return queries;
  }

  it('for the library, templates, deleted, tags, history and comments', async () => {
    const few = await fresh(url, 'Few Setups');
    const many = await fresh(url, 'Many Setups');
    const make = async (u: Signed, n: number) => {
      const ids: string[] = [];
      for (let i = 0; i < n; i++) ids.push((await newSetup(u.client, { title: `s${i}`, tags: [`t${i}`], document: documentWith(1) })).id);
      for (const id of ids.slice(0, Math.ceil(n / 2))) {
        await u.client.put(`/api/setups/${id}`, { version: 1, title: 'again' });
        await u.client.post(`/api/setups/${id}/comments`, { body: 'hi' });
      }
      for (const id of ids.slice(0, 2)) await u.client.del(`/api/setups/${id}`);
      return ids[ids.length - 1]!;
    };
    const fewLast = await make(few, 3);
    const manyLast = await make(many, 40);
    for (const path of ['/api/setups?limit=100', '/api/setups?templates=1&limit=100', '/api/setups?deleted=1', '/api/tags', '/api/studios']) {
      expect(await cost(many.client, path), path).toBe(await cost(few.client, path));
    }
    expect(await cost(many.client, `/api/setups/${manyLast}/history`)).toBe(await cost(few.client, `/api/setups/${fewLast}/history`));
  });
});

describe('PUT /api/setups/:id with an Idempotency-Key', () => {
  it('a save retried after its answer was lost gets the same answer, not a 409, and is applied once', async () => {
    const u = await fresh(base, 'Retrying Rae');
    const s = await newSetup(u.client, { title: 'Sent twice' });
    const key = `retry-${Math.random().toString(36).slice(2, 10)}`;
    const first = await u.client.request('PUT', `/api/setups/${s.id}`, { version: s.version, title: 'Sent twice, saved once' }, { 'idempotency-key': key });
    expect(first.status).toBe(200);
    const again = await u.client.request('PUT', `/api/setups/${s.id}`, { version: s.version, title: 'Sent twice, saved once' }, { 'idempotency-key': key });
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.body).toEqual(first.body);
    expect(again.headers.get('idempotent-replay')).toBe('true');
    expect((await u.client.get(`/api/setups/${s.id}`)).body.version).toBe(s.version + 1);
    // Without the key (or with another) the same body is a conflict, as before.
    expect((await u.client.request('PUT', `/api/setups/${s.id}`, { version: s.version, title: 'x' }, { 'idempotency-key': `${key}-other` })).status).toBe(409);
    // Another user's key space is their own: the receipt is not theirs to read.
    const other = await fresh(base, 'Other Otto');
    expect((await other.client.request('PUT', `/api/setups/${s.id}`, { version: s.version, title: 'x' }, { 'idempotency-key': key })).status).toBe(404);
  });

  it('a malformed key is a 400 naming the header', async () => {
    const u = await fresh(base, 'Bad Key');
    const s = await newSetup(u.client, { title: 'Bad key' });
    const r = await u.client.request('PUT', `/api/setups/${s.id}`, { version: s.version, title: 'y' }, { 'idempotency-key': 'no' });
    expect(r.status).toBe(400);
    expect(r.body.error.fields).toHaveProperty('Idempotency-Key');
  });
});
