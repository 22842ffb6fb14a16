// Bad input, generated with fast-check: wrong types, huge strings, deep nesting, unknown fields, wrong schema
// versions, in every body the API takes. Each one must get a 4xx JSON error whose `fields` names the field
// (never a 500), and the stored setup must be exactly as it was.
import fc from 'fast-check';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import type { Client } from '../support/http';
import { documentWith, fresh, newSetup, studioWithTeam, type Signed } from './fixtures';

const base = inject('baseUrl');

/** A body change known to be invalid by construction, and the field path the error must name. */
type Mutation = { field: string; apply: (body: Record<string, unknown>) => void };

const notAString = fc.oneof(fc.integer(), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.boolean(), fc.constant(null), fc.array(fc.integer(), { maxLength: 3 }), fc.object({ maxDepth: 1 }));
const notANumber = fc.oneof(fc.string({ maxLength: 10 }), fc.boolean(), fc.constant(null), fc.array(fc.integer(), { maxLength: 3 }), fc.object({ maxDepth: 1 }));
const notAnArray = fc.oneof(fc.string({ maxLength: 10 }), fc.integer(), fc.boolean(), fc.constant(null), fc.object({ maxDepth: 1 }));
const notAnObject = fc.oneof(fc.string({ maxLength: 10 }), fc.integer(), fc.boolean(), fc.constant(null), fc.array(fc.integer(), { maxLength: 3 }));
/** Strings longer than `max` that stay long after trimming. */
const tooLong = (max: number) => fc.integer({ min: max + 1, max: max * 4 + 50 }).chain((n) => fc.constant('ab c'.repeat(Math.ceil(n / 4)).slice(0, n - 1) + 'z'));
/** A value nested `depth` levels deep: arrays and objects of arrays and objects. */
const deep = fc.integer({ min: 20, max: 1500 }).map((depth) => {
  let v: unknown = 'bottom';
  for (let i = 0; i < depth; i++) v = i % 2 ? [v] : { d: v };
  return v;
});
/** A field name no schema knows (a prefix no real field has), or one that tempts prototype pollution. */
const unknownKey = fc.oneof(fc.string({ minLength: 1, maxLength: 30 }).map((k) => `zz_${k}`), fc.constantFrom('__proto__', 'constructor', 'prototype'));

/** Any JSON value (undefined would vanish from the body, making it valid). */
const present = fc.anything({ maxDepth: 2 }).filter((v) => v !== undefined);

const setField = (field: string, value: unknown): Mutation => ({ field, apply: (b) => void (b[field] = value) });
const inDocument = (field: string, f: (doc: Record<string, unknown>) => void): Mutation => ({
  field: `document${field ? `.${field}` : ''}`,
  apply: (b) => f(b.document as Record<string, unknown>),
});
const inItem = (field: string, f: (item: Record<string, unknown>) => void): Mutation =>
  inDocument(`items.1${field ? `.${field}` : ''}`, (d) => f((d.items as Record<string, unknown>[])[1]!));
/** Put a key that is not a field: JSON.parse makes "__proto__" an own key, as a client would send it. */
function withOwnKey(target: Record<string, unknown>, key: string, value: unknown) {
  Object.defineProperty(target, key, { value, enumerable: true, configurable: true, writable: true });
}

/** Mutations of a setup body (POST and PUT); `version` ones only where the body has a version. */
function setupMutations(withVersion: boolean): fc.Arbitrary<Mutation> {
  const all: fc.Arbitrary<Mutation>[] = [
    notAString.map((v) => setField('title', v)),
    tooLong(200).map((v) => setField('title', v)),
    fc.constantFrom('', '   ', '\t\n').map((v) => setField('title', v)),
    notAString.map((v) => setField('notes', v)),
    tooLong(20000).map((v) => setField('notes', v)),
    notAnArray.map((v) => setField('tags', v)),
    fc.array(fc.constant('t'), { minLength: 31, maxLength: 60 }).map((t) => setField('tags', t.map((x, i) => `${x}${i}`))),
    fc.tuple(notAString, fc.nat(2)).map(([v, i]) => ({ field: 'tags', apply: (b: Record<string, unknown>) => void (b.tags = ['ok', 'fine', 'good'].map((t, j) => (j === i ? v : t))) })),
    tooLong(40).map((v) => setField('tags', ['ok', v])),
    fc.constantFrom('', '   ').map((v) => setField('tags', [v])),
    notANumber.filter((v) => typeof v !== 'boolean').map((v) => setField('isTemplate', v)),
    fc.tuple(unknownKey, present).map(([k, v]) => ({ field: k, apply: (b: Record<string, unknown>) => withOwnKey(b, k, v) })),
    fc.tuple(unknownKey, deep).map(([k, v]) => ({ field: k, apply: (b: Record<string, unknown>) => withOwnKey(b, k, v) })),
    // The document
    notAnObject.map((v) => setField('document', v)),
    fc.oneof(fc.integer().filter((n) => n !== 1), fc.constantFrom('1', 1.5, null, true, [1])).map((v) => inDocument('schemaVersion', (d) => void (d.schemaVersion = v))),
    fc.constant(inDocument('schemaVersion', (d) => void delete d.schemaVersion)),
    fc.constant(inDocument('stage', (d) => void delete d.stage)),
    fc.oneof(fc.double({ min: -1e9, max: 0.99, noNaN: true }), fc.double({ min: 200.01, max: 1e12, noNaN: true }), notANumber).map((v) =>
      inDocument('stage.widthM', (d) => void ((d.stage as Record<string, unknown>).widthM = v)),
    ),
    notAnArray.map((v) => inDocument('items', (d) => void (d.items = v))),
    fc.integer({ min: 401, max: 600 }).map((n) => inDocument('items', (d) => void (d.items = Array.from({ length: n }, (_, i) => ({ id: `p${i}`, kind: 'prop', x: 1, y: 1, shape: 'stool' }))))),
    fc.string({ maxLength: 12 }).filter((k) => !['wall', 'subject', 'prop', 'camera', 'light', 'reflector', 'flag', 'vflat', 'scrim', 'note', 'tape', 'arrow'].includes(k)).map((k) => inItem('', (it) => void (it.kind = k))),
    notANumber.map((v) => inItem('x', (it) => void (it.x = v))),
    fc.double({ min: 200.01, max: 1e300, noNaN: true }).map((v) => inItem('x', (it) => void (it.x = v))),
    notAString.map((v) => inItem('label', (it) => void (it.label = v))),
    tooLong(80).map((v) => inItem('label', (it) => void (it.label = v))),
    deep.map((v) => inItem('label', (it) => void (it.label = v))),
    fc.tuple(unknownKey, present).map(([k, v]) => inItem(k, (it) => withOwnKey(it, k, v))),
    fc.constant(inDocument('items.2.id', (d) => void ((d.items as { id: string }[])[2]!.id = (d.items as { id: string }[])[0]!.id))),
    fc.tuple(unknownKey, present).map(([k, v]) => inDocument(k, (d) => withOwnKey(d, k, v))),
  ];
  if (withVersion) {
    all.push(
      fc.oneof(notANumber, fc.integer({ max: 0 }), fc.double({ min: 1.01, max: 1e6, noNaN: true }).filter((n) => !Number.isInteger(n)), fc.constant(2 ** 60)).map((v) => setField('version', v)),
      fc.constant({ field: 'version', apply: (b: Record<string, unknown>) => void delete b.version }),
    );
  }
  return fc.oneof(...all);
}

function expectNamedError(r: { status: number; body: any; headers: Headers }, field: string) {
  expect(r.status, JSON.stringify(r.body).slice(0, 400)).toBe(400);
  expect(r.headers.get('content-type')).toMatch(/application\/json/);
  expect(r.body.error.code).toBe('invalid_input');
  const names = Object.keys(r.body.error.fields ?? {});
  const cut = field.slice(0, 100); // the server shortens absurd field names
  expect(names.some((n) => n === cut || n.startsWith(`${cut}.`)), `fields ${JSON.stringify(names)} should name ${cut}`).toBe(true);
}

let me: Signed;
beforeAll(async () => {
  me = await fresh(base, 'Fuzz Target');
});

describe('PUT /api/setups/:id with malformed bodies', () => {
  it('answers 400 naming the field, and leaves the stored setup exactly as it was', async () => {
    const doc = documentWith(3);
    const s = await newSetup(me.client, { title: 'Do not break me', document: doc, notes: 'original', tags: ['keep'] });
    await fc.assert(
      fc.asyncProperty(setupMutations(true), async (m) => {
        const body: Record<string, unknown> = { version: s.version, title: 'Changed', notes: 'changed', tags: ['changed'], document: structuredClone(doc) };
        m.apply(body);
        expectNamedError(await me.client.put(`/api/setups/${s.id}`, body), m.field);
      }),
      { numRuns: 250 },
    );
    const after = await me.client.get(`/api/setups/${s.id}`);
    expect(after.body).toEqual(s);
    expect((await me.client.get(`/api/setups/${s.id}/history`)).body.versions).toHaveLength(1);
  }, 120_000);
});

describe('POST /api/setups with malformed bodies', () => {
  it('answers 400 naming the field and creates nothing', async () => {
    const u = await fresh(base, 'Fuzz Creator');
    await fc.assert(
      fc.asyncProperty(setupMutations(false), async (m) => {
        const body: Record<string, unknown> = { title: 'New', notes: '', tags: [], document: structuredClone(documentWith(3)) };
        m.apply(body);
        expectNamedError(await u.client.post('/api/setups', body), m.field);
      }),
      { numRuns: 150 },
    );
    expect((await u.client.get('/api/setups')).body.setups).toEqual([]);
  }, 120_000);
});

describe('the other bodies and queries', () => {
  let team: Awaited<ReturnType<typeof studioWithTeam>>;
  let setupId = '';
  beforeAll(async () => {
    team = await studioWithTeam(base);
    setupId = (await newSetup(team.owner.client, { studioId: team.studioId, title: 'Target' })).id;
  });

  /** For each endpoint: a valid body, and every field of it replaced by values of the wrong type, or joined by an unknown field. */
  const endpoints: { name: string; send: (c: Client, body: unknown) => Promise<{ status: number; body: any; headers: Headers }>; valid: Record<string, unknown> }[] = [
    { name: 'POST comments', send: (c, b) => c.post(`/api/setups/${setupId}/comments`, b), valid: { body: 'hello', itemId: 'key' } },
    { name: 'POST duplicate', send: (c, b) => c.post(`/api/setups/${setupId}/duplicate`, b), valid: { title: 'Copy', studioId: '' } },
    { name: 'POST studios', send: (c, b) => c.post('/api/studios', b), valid: { name: 'A studio' } },
    { name: 'PATCH studio', send: (c, b) => c.request('PATCH', `/api/studios/${team.studioId}`, b), valid: { name: 'Test bench studio' } },
    { name: 'POST members', send: (c, b) => c.post(`/api/studios/${team.studioId}/members`, b), valid: { email: 'someone@test.falloff.test', role: 'crew' } },
    { name: 'PATCH member', send: (c, b) => c.request('PATCH', `/api/studios/${team.studioId}/members/${team.crew.userId}`, b), valid: { role: 'crew' } },
    { name: 'POST history restore', send: (c, b) => c.post(`/api/setups/${setupId}/history/00000000-0000-4000-8000-000000000000/restore`, b), valid: { version: 1 } },
  ];

  it.each(endpoints)('$name: a wrong type or an unknown field is a 400 naming it', async (e) => {
    const valid: Record<string, unknown> = { ...e.valid, ...(e.name === 'POST duplicate' ? { studioId: team.studioId } : {}) };
    const fields = Object.keys(valid);
    const mutation = fc.oneof(
      // A value of another type than the valid one (a number where a string goes, a string where a number goes…).
      fc.constantFrom(...fields).chain((f) => (typeof valid[f] === 'number' ? fc.oneof(notANumber, deep) : fc.oneof(notAString, deep)).map((v) => ({ field: f, value: v, own: false }))),
      fc.tuple(unknownKey, present).map(([f, v]) => ({ field: f, value: v, own: true })),
      fc.tuple(fc.constantFrom(...fields), fc.integer({ min: 5000, max: 60000 })).map(([f, n]) => ({ field: f, value: 'q'.repeat(n), own: false })),
    );
    await fc.assert(
      fc.asyncProperty(mutation, async (m) => {
        const body: Record<string, unknown> = { ...valid };
        if (m.own) withOwnKey(body, m.field, m.value);
        else body[m.field] = m.value;
        expectNamedError(await e.send(team.owner.client, body), m.field);
      }),
      { numRuns: 40 },
    );
  }, 60_000);

  it('query strings too: unknown or ill-typed parameters are named', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(
          fc.tuple(fc.constantFrom('sort', 'templates', 'deleted', 'limit', 'studio'), fc.string({ minLength: 1, maxLength: 20 })).filter(([k, v]) => {
            if (k === 'limit') return !(Number.isInteger(Number(v)) && Number(v) >= 1 && Number(v) <= 100);
            return !['updated', 'created', 'title', '0', '1', 'true', 'false'].includes(v);
          }),
          fc.tuple(fc.string({ minLength: 1, maxLength: 10 }).map((k) => `zz${k}`), fc.string({ maxLength: 10 })),
          fc.tuple(fc.constant('q'), tooLong(200)),
        ),
        async ([k, v]) => {
          const r = await team.owner.client.get(`/api/setups?${encodeURIComponent(k)}=${encodeURIComponent(v)}`);
          expectNamedError(r, k);
        },
      ),
      { numRuns: 60 },
    );
  }, 60_000);
});

describe('bodies that are not JSON objects at all', () => {
  it('are 400 or 413 JSON errors, never a 500', async () => {
    const s = await newSetup(me.client, { title: 'Raw' });
    const raw = [
      '{"version": 1, "title": ',
      '[1, 2, 3]',
      '"just a string"',
      'null',
      '[' .repeat(200_000) + ']'.repeat(200_000),
      '{"a":'.repeat(100_000) + '1' + '}'.repeat(100_000),
      JSON.stringify({ version: 1, notes: 'x'.repeat(1_100_000) }),
    ];
    for (const text of raw) {
      const r = await me.client.request('PUT', `/api/setups/${s.id}`, text, {});
      expect([400, 413], text.slice(0, 40)).toContain(r.status);
      expect(r.body.error.code).toMatch(/^(invalid_input|bad_request|too_large)$/);
    }
    const wrongType = await me.client.request('PUT', `/api/setups/${s.id}`, 'version=2', { 'content-type': 'application/x-www-form-urlencoded' });
    expectNamedError(wrongType, 'version');
    expect((await me.client.get(`/api/setups/${s.id}`)).body).toEqual(s);
  });
});
