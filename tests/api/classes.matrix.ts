// The class half of the role matrix (run by roles.test.ts, which also checks every route has a row): each
// class route × the class's instructor, the student whose work it is, a classmate, a student of another
// class, and a signed-out visitor. Every class is made fresh for this file.
import { expect } from 'vitest';
import { Client, freshEmail, type Res } from '../support/http';
import { darkBackgroundCheck, lessonDocument } from './classes.support';
import { fresh, newSetup, type Signed } from './fixtures';

export const classWho = ['instructor', 'student', 'classmate', 'outsider', 'signedOut'] as const;
export type ClassWho = (typeof classWho)[number];
type Expect = Record<ClassWho, number>;
type Vars = Record<string, string>;
export type ClassCase = { route: string; variant?: string; prepare?: (w: ClassWho) => Promise<Vars>; call: (c: Client, v: Vars) => Promise<Res>; expect: Expect };

export const classClients = {} as Record<ClassWho, Client>;
const people = {} as Record<Exclude<ClassWho, 'signedOut'>, Signed>;
/** Another instructor, who makes the fresh classes some rows need. */
let host: Signed;
export const classShared: Vars = {};

/** Expectations by kind of route, so the table reads as policy. */
const members = (ok: number): Expect => ({ instructor: ok, student: ok, classmate: ok, outsider: 404, signedOut: 401 });
const teachers = (ok: number): Expect => ({ instructor: ok, student: 403, classmate: 403, outsider: 404, signedOut: 401 });
const anyone = (ok: number): Expect => ({ instructor: ok, student: ok, classmate: ok, outsider: ok, signedOut: 401 });

const ok = (r: Res, status: number) => {
  expect(r.status, JSON.stringify(r.body)).toBe(status);
  return r.body;
};
const as = (w: ClassWho) => (w === 'signedOut' ? null : people[w]);

async function freshLesson(published = false): Promise<Vars> {
  const l = ok(await people.instructor.client.post(`/api/classes/${classShared.class}/lessons`, { title: 'Matrix lesson' }), 201);
  if (published) ok(await people.instructor.client.request('PATCH', `/api/lessons/${l.id}`, { published: true }), 200);
  return { lesson: l.id };
}
async function freshEntry(): Promise<Vars> {
  const e = ok(await people.instructor.client.post(`/api/lessons/${classShared.lesson}/setups`, { setupId: classShared.setup }), 201);
  return { entry: e.id };
}
async function freshAssignment(): Promise<Vars> {
  const a = ok(await people.instructor.client.post(`/api/lessons/${classShared.lesson}/assignments`, { title: 'Matrix task', check: darkBackgroundCheck }), 201);
  return { assignment: a.id };
}
/** A new submission by the student, shared with the class or not. */
async function freshSubmission(shared: boolean): Promise<Vars> {
  const sub = ok(await people.student.client.post(`/api/assignments/${classShared.assignment}/submissions`), 201);
  if (shared) ok(await people.instructor.client.request('PATCH', `/api/submissions/${sub.id}`, { shared: true }), 200);
  return { submission: sub.id };
}
/** A class of the host's that the caller has been invited to. */
async function invitedTo(w: ClassWho): Promise<Vars> {
  const c = ok(await host.client.post('/api/classes', { name: 'Invitation class' }), 201);
  ok(await host.client.post(`/api/classes/${c.id}/invitations`, { email: as(w)?.email ?? freshEmail('nobody') }), 201);
  return { other: c.id };
}
/** A class of the host's that the caller has joined as a student. */
async function joinedTo(w: ClassWho): Promise<Vars> {
  const c = ok(await host.client.post('/api/classes', { name: 'Leaving class' }), 201);
  const me = as(w);
  if (me) ok(await me.client.post('/api/classes/join', { code: c.joinCode }), 200);
  return { other: c.id, me: me?.userId ?? 'nobody' };
}

export const classCases: ClassCase[] = [
  // Classes and the roster
  { route: 'GET /api/classes', call: (c) => c.get('/api/classes'), expect: anyone(200) },
  { route: 'POST /api/classes', call: (c) => c.post('/api/classes', { name: 'Matrix class' }), expect: anyone(201) },
  {
    route: 'POST /api/classes/join',
    prepare: async () => ({ code: ok(await host.client.post('/api/classes', { name: 'Join me' }), 201).joinCode }),
    call: (c, v) => c.post('/api/classes/join', { code: v.code }),
    expect: anyone(200),
  },
  { route: 'GET /api/classes/:id', call: (c, v) => c.get(`/api/classes/${v.class}`), expect: members(200) },
  { route: 'PATCH /api/classes/:id', call: (c, v) => c.request('PATCH', `/api/classes/${v.class}`, { name: 'Matrix class' }), expect: teachers(200) },
  { route: 'POST /api/classes/:id/join-code', call: (c, v) => c.post(`/api/classes/${v.class}/join-code`), expect: teachers(200) },
  { route: 'POST /api/classes/:id/accept', variant: 'invited', prepare: invitedTo, call: (c, v) => c.post(`/api/classes/${v.other}/accept`), expect: anyone(200) },
  { route: 'POST /api/classes/:id/accept', variant: 'not invited', call: (c, v) => c.post(`/api/classes/${v.class}/accept`), expect: { ...anyone(404) } },
  { route: 'GET /api/classes/:id/members', call: (c, v) => c.get(`/api/classes/${v.class}/members`), expect: members(200) },
  {
    route: 'DELETE /api/classes/:id/members/:userId',
    variant: 'someone else',
    prepare: async () => {
      const s = await fresh(people.instructor.client.base, 'Matrix Leaver');
      // The join code may have been changed by an earlier row.
      const { joinCode } = ok(await people.instructor.client.get(`/api/classes/${classShared.class}`), 200);
      ok(await s.client.post('/api/classes/join', { code: joinCode }), 200);
      return { target: s.userId };
    },
    call: (c, v) => c.del(`/api/classes/${v.class}/members/${v.target}`),
    expect: teachers(204),
  },
  { route: 'DELETE /api/classes/:id/members/:userId', variant: 'oneself (leaving)', prepare: joinedTo, call: (c, v) => c.del(`/api/classes/${v.other}/members/${v.me}`), expect: anyone(204) },
  { route: 'GET /api/classes/:id/invitations', call: (c, v) => c.get(`/api/classes/${v.class}/invitations`), expect: teachers(200) },
  { route: 'POST /api/classes/:id/invitations', call: (c, v) => c.post(`/api/classes/${v.class}/invitations`, { email: freshEmail('matrix') }), expect: teachers(201) },
  {
    route: 'DELETE /api/classes/:id/invitations/:invitationId',
    prepare: async () => ({ invitation: ok(await people.instructor.client.post(`/api/classes/${classShared.class}/invitations`, { email: freshEmail('withdrawn') }), 201).id }),
    call: (c, v) => c.del(`/api/classes/${v.class}/invitations/${v.invitation}`),
    expect: teachers(204),
  },
  { route: 'GET /api/classes/:id/lessons', call: (c, v) => c.get(`/api/classes/${v.class}/lessons`), expect: members(200) },
  { route: 'POST /api/classes/:id/lessons', call: (c, v) => c.post(`/api/classes/${v.class}/lessons`, { title: 'Matrix lesson' }), expect: teachers(201) },
  { route: 'GET /api/classes/:id/assignments', call: (c, v) => c.get(`/api/classes/${v.class}/assignments`), expect: members(200) },

  // Lessons
  { route: 'GET /api/lessons/:id', call: (c, v) => c.get(`/api/lessons/${v.lesson}`), expect: members(200) },
  { route: 'GET /api/lessons/:id', variant: 'a draft', call: (c, v) => c.get(`/api/lessons/${v.draft}`), expect: { ...members(200), student: 404, classmate: 404 } },
  { route: 'PATCH /api/lessons/:id', call: (c, v) => c.request('PATCH', `/api/lessons/${v.lesson}`, { summary: 'Light falls off with distance.' }), expect: teachers(200) },
  { route: 'DELETE /api/lessons/:id', prepare: () => freshLesson(true), call: (c, v) => c.del(`/api/lessons/${v.lesson}`), expect: teachers(204) },
  { route: 'DELETE /api/lessons/:id', variant: 'a draft', prepare: () => freshLesson(false), call: (c, v) => c.del(`/api/lessons/${v.lesson}`), expect: { ...teachers(204), student: 404, classmate: 404 } },
  { route: 'POST /api/lessons/:id/setups', call: (c, v) => c.post(`/api/lessons/${v.lesson}/setups`, { setupId: v.setup }), expect: teachers(201) },
  { route: 'PATCH /api/lessons/:id/setups/:entryId', call: (c, v) => c.request('PATCH', `/api/lessons/${v.lesson}/setups/${v.entry}`, { note: 'Watch the paper.' }), expect: teachers(200) },
  { route: 'POST /api/lessons/:id/setups/:entryId/refresh', call: (c, v) => c.post(`/api/lessons/${v.lesson}/setups/${v.entry}/refresh`), expect: teachers(200) },
  { route: 'DELETE /api/lessons/:id/setups/:entryId', prepare: freshEntry, call: (c, v) => c.del(`/api/lessons/${v.lesson}/setups/${v.entry}`), expect: teachers(204) },
  { route: 'POST /api/lessons/:id/assignments', call: (c, v) => c.post(`/api/lessons/${v.lesson}/assignments`, { title: 'Matrix task' }), expect: teachers(201) },

  // Assignments
  { route: 'GET /api/assignments/:id', call: (c, v) => c.get(`/api/assignments/${v.assignment}`), expect: members(200) },
  { route: 'PATCH /api/assignments/:id', call: (c, v) => c.request('PATCH', `/api/assignments/${v.assignment}`, { brief: 'Two stops under, at least.' }), expect: teachers(200) },
  { route: 'DELETE /api/assignments/:id', prepare: freshAssignment, call: (c, v) => c.del(`/api/assignments/${v.assignment}`), expect: teachers(204) },
  {
    route: 'POST /api/assignments/:id/start',
    prepare: freshAssignment,
    call: (c, v) => c.post(`/api/assignments/${v.assignment}/start`, { from: 'reference' }),
    expect: { instructor: 403, student: 201, classmate: 201, outsider: 404, signedOut: 401 },
  },
  { route: 'GET /api/assignments/:id/submissions', call: (c, v) => c.get(`/api/assignments/${v.assignment}/submissions`), expect: members(200) },
  {
    route: 'POST /api/assignments/:id/submissions',
    // Each caller submits a plan of their own (students of the class may; nobody else gets that far).
    prepare: async (w) => {
      const me = as(w);
      return { plan: me ? (await newSetup(me.client, { studioId: me.personalStudioId, title: 'My attempt', document: lessonDocument() })).id : '00000000-0000-4000-8000-000000000000' };
    },
    call: (c, v) => c.post(`/api/assignments/${v.assignment}/submissions`, { setupId: v.plan }),
    expect: { instructor: 403, student: 201, classmate: 201, outsider: 404, signedOut: 401 },
  },

  // Submissions: the student's own, and one shared with the class
  { route: 'GET /api/submissions/:id', call: (c, v) => c.get(`/api/submissions/${v.submission}`), expect: { ...members(200), classmate: 404 } },
  { route: 'GET /api/submissions/:id', variant: 'shared with the class', prepare: () => freshSubmission(true), call: (c, v) => c.get(`/api/submissions/${v.submission}`), expect: members(200) },
  { route: 'PATCH /api/submissions/:id', call: (c, v) => c.request('PATCH', `/api/submissions/${v.submission}`, { reviewed: true }), expect: { ...teachers(200), classmate: 404 } },
  {
    route: 'PATCH /api/submissions/:id',
    variant: 'shared with the class',
    prepare: () => freshSubmission(true),
    call: (c, v) => c.request('PATCH', `/api/submissions/${v.submission}`, { reviewed: true }),
    expect: teachers(200),
  },
  {
    route: 'POST /api/submissions/:id/comments',
    call: (c, v) => c.post(`/api/submissions/${v.submission}/comments`, { body: 'Move the key back.', itemId: 'key' }),
    expect: { instructor: 201, student: 201, classmate: 404, outsider: 404, signedOut: 401 },
  },
  {
    route: 'POST /api/submissions/:id/comments',
    variant: 'shared with the class',
    prepare: () => freshSubmission(true),
    call: (c, v) => c.post(`/api/submissions/${v.submission}/comments`, { body: 'Move the key back.', point: { x: 4, y: 4 } }),
    expect: { instructor: 201, student: 201, classmate: 403, outsider: 404, signedOut: 401 },
  },
];

/** Two classes: ours (instructor, student, classmate) and another (the outsider is its student). */
export async function setupClassMatrix(base: string) {
  people.instructor = await fresh(base, 'Matrix Instructor');
  people.student = await fresh(base, 'Matrix Student');
  people.classmate = await fresh(base, 'Matrix Classmate');
  people.outsider = await fresh(base, 'Matrix Outsider');
  host = await fresh(base, 'Matrix Host');
  for (const w of classWho) classClients[w] = w === 'signedOut' ? new Client(base) : people[w].client;

  const c = ok(await people.instructor.client.post('/api/classes', { name: 'Matrix class' }), 201);
  classShared.class = c.id;
  for (const w of ['student', 'classmate'] as const) ok(await people[w].client.post('/api/classes/join', { code: c.joinCode }), 200);
  const other = ok(await host.client.post('/api/classes', { name: 'Another class' }), 201);
  ok(await people.outsider.client.post('/api/classes/join', { code: other.joinCode }), 200);

  classShared.setup = (await newSetup(people.instructor.client, { studioId: people.instructor.personalStudioId, title: 'Matrix plan', document: lessonDocument() })).id;
  classShared.lesson = (await freshLesson()).lesson!;
  classShared.draft = (await freshLesson()).lesson!;
  Object.assign(classShared, await freshEntry());
  ok(await people.instructor.client.request('PATCH', `/api/lessons/${classShared.lesson}`, { published: true }), 200);
  Object.assign(classShared, await freshAssignment());
  ok(await people.student.client.post(`/api/assignments/${classShared.assignment}/start`, { from: 'reference' }), 201);
  Object.assign(classShared, await freshSubmission(false));
}
