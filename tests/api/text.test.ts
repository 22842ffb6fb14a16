// Text rules (model/text.ts) over real HTTP against real PostgreSQL: a NUL or another control character in any
// text a person types is a 400 naming the field (never a 500), bidi override and isolate controls are removed
// from titles and names, every text has a cap, an empty PATCH is a 400 naming the body, and a label stored
// before these rules still exports as well-formed XML and as a PNG.
import { DOMParser } from '@xmldom/xmldom';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createDb } from '../../db/client';
import { setups, studios } from '../../db/schema';
import { Client, freshEmail } from '../support/http';
import { TEST_DATABASE_URL } from '../support/env';
import { assignmentOn, classWith, inboxFor, lessonDocument, lessonWith } from './classes.support';
import { documentWith } from './documents';
import { pdfText, raw } from './exports.helpers';
import { FRESH_PASSWORD, fresh, newSetup, type Signed } from './fixtures';

const base = inject('baseUrl');
const NUL = '\u0000';
const RLO = '\u202e';

let owner: Signed;
let setupId = '';
let version = 1;

beforeAll(async () => {
  owner = await fresh(base, 'Text Rules');
  const s = await newSetup(owner.client, { title: 'Plain title', document: documentWith(1) });
  setupId = s.id;
  version = s.version;
});

/** A 400 whose `fields` names `field`, with a message about control characters. */
function expectRefused(r: { status: number; body: any }, field: string, pattern = /control characters/) {
  const said = (JSON.stringify(r.body) ?? '').slice(0, 500);
  expect(r.status, said).toBe(400);
  expect(r.body.error.fields, said).toHaveProperty([field]);
  expect(r.body.error.fields[field]).toMatch(pattern);
}

describe('control characters are a 400 naming the field, in every kind of text', () => {
  it('setups: title, notes, tags, a plan label, a step note, a note item, a comment, a share label', async () => {
    const c = owner.client;
    expectRefused(await c.post('/api/setups', { title: `a${NUL}b` }), 'title');
    expectRefused(await c.put(`/api/setups/${setupId}`, { version, notes: `line${NUL}` }), 'notes');
    expectRefused(await c.put(`/api/setups/${setupId}`, { version, tags: ['ok', `t\u0007`] }), 'tags.1');
    const doc = documentWith(1);
    const withLabel = { ...doc, items: doc.items.map((it, i) => (i === 0 ? { ...it, label: `Key\u0001light` } : it)) };
    expectRefused(await c.put(`/api/setups/${setupId}`, { version, document: withLabel }), 'document.items.0.label');
    const withStep = { ...doc, steps: [{ id: 's1', title: 'One', note: `x${NUL}`, itemIds: [] }] };
    expectRefused(await c.put(`/api/setups/${setupId}`, { version, document: withStep }), 'document.steps.0.note');
    const withNote = { ...doc, items: doc.items.map((it) => (it.kind === 'note' ? { ...it, text: `note\u001b[31m` } : it)) };
    expectRefused(await c.put(`/api/setups/${setupId}`, { version, document: withNote }), 'document.items.3.text');
    expectRefused(await c.post(`/api/setups/${setupId}/comments`, { body: `hi${NUL}` }), 'body');
    expectRefused(await c.post(`/api/setups/${setupId}/shares`, { label: `link\u0085` }), 'label');
    expectRefused(await c.post('/api/setups', { title: 'broken \ud800 surrogate' }), 'title', /not valid text/);
    // The setup is as it was.
    const now = await c.get(`/api/setups/${setupId}`);
    expect(now.body).toMatchObject({ title: 'Plain title', version });
  });

  it('new lines and tabs stay allowed in multi-line text (notes, comments), not in one-line text (titles)', async () => {
    const c = owner.client;
    const ok = await c.put(`/api/setups/${setupId}`, { version, notes: 'first line\r\n\tsecond line' });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    version = ok.body.version;
    expect((await c.get(`/api/setups/${setupId}`)).body.notes).toBe('first line\n\tsecond line');
    expectRefused(await c.put(`/api/setups/${setupId}`, { version, title: 'two\nlines' }), 'title');
    expect((await c.post(`/api/setups/${setupId}/comments`, { body: 'two\nlines' })).status).toBe(201);
  });

  it('studios, the account, classes, lessons, assignments, crew mail', async () => {
    const c = owner.client;
    expectRefused(await c.post('/api/studios', { name: `Studio${NUL}` }), 'name');
    expectRefused(await c.request('PATCH', '/api/me', { name: `Me${NUL}` }), 'name');
    expectRefused(await c.post('/api/classes', { name: `Class\u0000` }), 'name');
    expectRefused(await c.post(`/api/setups/${setupId}/send`, { to: ['crew@example.test'], message: `hello${NUL}` }), 'message');
    const w = await classWith(base, 1, 'Text class');
    const { lessonId } = await lessonWith(w.instructor.client, w.classId, w.instructor.personalStudioId, lessonDocument());
    expectRefused(await w.instructor.client.request('PATCH', `/api/lessons/${lessonId}`, { title: `L${NUL}` }), 'title');
    expectRefused(await w.instructor.client.request('PATCH', `/api/lessons/${lessonId}`, { summary: `S${NUL}` }), 'summary');
    expectRefused(await w.instructor.client.post(`/api/lessons/${lessonId}/assignments`, { title: `A${NUL}` }), 'title');
    const assignmentId = await assignmentOn(w.instructor.client, lessonId);
    expectRefused(await w.instructor.client.request('PATCH', `/api/assignments/${assignmentId}`, { brief: `B${NUL}` }), 'brief');
    // The join code is typed by people too.
    const j = await w.students[0]!.client.post('/api/classes/join', { code: `AB${NUL}CD` });
    expect(j.status, JSON.stringify(j.body)).toBe(400);
    expect(j.body.error.fields).toHaveProperty(['code']);
  });

  it('sign-up and account names through better-auth: a NUL, or 100 000 characters, is a 400 naming the name', async () => {
    const c = new Client(base);
    const nul = await c.post('/api/auth/sign-up/email', { name: `Nul${NUL}Name`, email: freshEmail('nul'), password: FRESH_PASSWORD });
    expect(nul.status, JSON.stringify(nul.body)).toBe(400);
    expect(nul.body.message).toMatch(/^name: .*control characters/);
    const long = await c.post('/api/auth/sign-up/email', { name: 'x'.repeat(100_000), email: freshEmail('long'), password: FRESH_PASSWORD });
    expect(long.status).toBe(400);
    expect(long.body.message).toMatch(/^name: at most 80 characters/);
    const upd = await owner.client.post('/api/auth/update-user', { name: `Upd${NUL}` });
    expect(upd.status).toBe(400);
    expect(upd.body.message).toMatch(/^name: /);
  });
});

describe('bidi override and isolate controls are removed from titles and names', () => {
  it('a setup title, a studio name and a sign-up name keep their letters in order', async () => {
    const s = await newSetup(owner.client, { title: `${RLO}fdp.exe\u202c portrait` });
    expect(s.title).toBe('fdp.exe portrait');
    const st = await owner.client.post('/api/studios', { name: `\u2067Harbour\u2069 ${RLO}Two` });
    expect(st.status).toBe(201);
    expect(st.body.name).toBe('Harbour Two');
    const email = freshEmail('bidi');
    const c = await new Client(base).signUp(`Ada ${RLO}Lovelace`, email, FRESH_PASSWORD);
    expect((await c.get('/api/me')).body.user.name).toBe('Ada Lovelace');
  });

  it('a crew mail subject carries the cleaned title', async () => {
    const s = await newSetup(owner.client, { title: `${RLO}Night rims` });
    const to = freshEmail('crew');
    const r = await owner.client.post(`/api/setups/${s.id}/send`, { to: [to], attachPdf: false });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const mail = await owner.client.mailedLink(to, '/s/');
    expect(mail).toContain('/s/');
    const inbox = (await (await fetch(`${base}/dev/inbox.json`)).json()) as { messages: { to: string[]; subject: string }[] };
    expect(inbox.messages.filter((m) => m.to.includes(to)).map((m) => m.subject)).toEqual(['Crew sheet: Night rims']);
  });
});

describe('length caps', () => {
  it('names, titles, labels, notes and comments over their cap are a 400 naming the field', async () => {
    const c = owner.client;
    expectRefused(await c.post('/api/studios', { name: 'n'.repeat(100_000) }), 'name', /at most 80/);
    expectRefused(await c.post('/api/setups', { title: 't'.repeat(201) }), 'title', /at most 200/);
    expectRefused(await c.post(`/api/setups/${setupId}/comments`, { body: 'c'.repeat(4001) }), 'body', /at most 4 000|at most 4000/);
    expectRefused(await c.put(`/api/setups/${setupId}`, { version, notes: 'n'.repeat(20_001) }), 'notes', /at most 20 000/);
    const doc = documentWith(1);
    const longLabel = { ...doc, items: doc.items.map((it, i) => (i === 0 ? { ...it, label: 'l'.repeat(81) } : it)) };
    expectRefused(await c.put(`/api/setups/${setupId}`, { version, document: longLabel }), 'document.items.0.label', /at most 80/);
  });
});

describe('an empty PATCH is a 400 naming the body', () => {
  it('assignments, submissions and lessons', async () => {
    const w = await classWith(base, 1, 'Empty patch class');
    const { lessonId } = await lessonWith(w.instructor.client, w.classId, w.instructor.personalStudioId, lessonDocument());
    const assignmentId = await assignmentOn(w.instructor.client, lessonId);
    const student = w.students[0]!;
    expect((await student.client.post(`/api/assignments/${assignmentId}/start`, { from: 'reference' })).status).toBe(201);
    const sub = await student.client.post(`/api/assignments/${assignmentId}/submissions`);
    expect(sub.status, JSON.stringify(sub.body)).toBe(201);
    for (const path of [`/api/assignments/${assignmentId}`, `/api/submissions/${sub.body.id}`, `/api/lessons/${lessonId}`]) {
      const r = await w.instructor.client.request('PATCH', path, {});
      expect(r.status, `${path}: ${JSON.stringify(r.body)}`).toBe(400);
      expect(r.body.error.fields).toEqual({ '(body)': expect.stringMatching(/nothing to change/) });
    }
  });
});

describe('a label stored before the text rules still exports', () => {
  const { db, pool } = createDb(TEST_DATABASE_URL);
  afterAll(() => pool.end());

  it('a mail subject built from a name stored before the rules is one clean line (server/mail/queue.ts, cleanSubject)', async () => {
    const st = await owner.client.post('/api/studios', { name: 'Plain name' });
    expect(st.status).toBe(201);
    await db.update(studios).set({ name: `Harbour\r\nBcc: all@example.test ${RLO}oiduts` }).where(eq(studios.id, st.body.id));
    const to = freshEmail('subject');
    const inv = await owner.client.post(`/api/studios/${st.body.id}/members`, { email: to, role: 'crew' });
    expect(inv.status, JSON.stringify(inv.body)).toBe(201);
    const [mail] = await inboxFor(base, to);
    expect(mail?.subject).toBe('Join Harbour Bcc: all@example.test oiduts on Falloff');
    expect(mail?.to).toEqual([to]);
  });

  it('as well-formed SVG (XML), as a PNG and as a PDF', async () => {
    const s = await newSetup(owner.client, { title: 'Stored before the rules', document: documentWith(1) });
    // Written straight into the database, as an older server would have let it through.
    const doc = JSON.parse(JSON.stringify(s.document));
    doc.items[0].label = 'Key\u0001\u0008\u001f\ufffe light\u202e';
    doc.items[3].text = 'note \u000b with \u007f junk';
    await db.update(setups).set({ document: doc }).where(eq(setups.id, s.id));

    const svg = await fetch(`${base}/api/setups/${s.id}/plan.svg`, { headers: { cookie: owner.client.cookieHeader(), origin: base } });
    expect(svg.status).toBe(200);
    const text = await svg.text();
    expect(text).not.toMatch(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\ufffe]/);
    const errors: string[] = [];
    const parsed = new DOMParser({ errorHandler: { warning: () => undefined, error: (m: string) => void errors.push(m), fatalError: (m: string) => void errors.push(m) } }).parseFromString(text, 'image/svg+xml');
    expect(errors).toEqual([]);
    expect(parsed.documentElement?.nodeName).toBe('svg');

    const png = await fetch(`${base}/api/setups/${s.id}/plan.png?width=400`, { headers: { cookie: owner.client.cookieHeader(), origin: base } });
    expect(png.status).toBe(200);
    expect(Buffer.from(await png.arrayBuffer()).subarray(1, 4).toString()).toBe('PNG');
    const pdf = await fetch(`${base}/api/setups/${s.id}/crew-sheet.pdf`, { headers: { cookie: owner.client.cookieHeader(), origin: base } });
    expect(pdf.status).toBe(200);

    // And the setup still opens in the editor: the read path cleans the stored text.
    const read = await owner.client.get(`/api/setups/${s.id}`);
    expect(read.status).toBe(200);
  });
});

describe('the day sheet cover follows the text rules', () => {
  it('a NUL, a control character or 100 000 characters in its title or date is a 400 naming the field', async () => {
    const c = owner.client;
    const post = (body: Record<string, unknown>) => c.post('/api/day-sheet.pdf', { setupIds: [setupId], ...body });
    expectRefused(await post({ title: `Shoot${NUL}day` }), 'title');
    expectRefused(await post({ date: `Saturday\u0007 14 March` }), 'date');
    expectRefused(await post({ title: 'Shoot\nday' }), 'title');
    expectRefused(await post({ title: 'x'.repeat(100_000) }), 'title', /at most 120 characters/);
    expectRefused(await post({ date: 'x'.repeat(100_000) }), 'date', /at most 60 characters/);
  });

  it('bidi override and isolate controls are taken out of the title and date printed on the cover', async () => {
    const body = JSON.stringify({ setupIds: [setupId], title: `${RLO}Track day\u202c`, date: `\u2066Saturday${RLO} 14 March\u2069` });
    const r = await raw(base, owner.client, '/api/day-sheet.pdf', { method: 'POST', body, headers: { 'content-type': 'application/json' } });
    expect(r.status, r.body.toString().slice(0, 300)).toBe(200);
    expect(r.disposition).toContain('day-sheets-track-day.pdf');
    const { text } = await pdfText(r.body);
    expect(text).toContain('Track day');
    expect(text).toContain('Saturday 14 March');
    expect(text).not.toMatch(/[\u202a-\u202e\u2066-\u2069]/);
  });
});
