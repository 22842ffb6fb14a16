// Classes over real HTTP: joining by code or by an e-mailed invitation, the roster, lessons built from
// setup snapshots (stable until refreshed), assignments whose meter check the server computes with the
// same evaluateCheck the client runs, submissions, review comments, and the e-mails each step sends.
import { afterAll, describe, expect, inject, it } from 'vitest';
import { createDb } from '../../db/client';
import { evaluateCheck } from '../../model/classes';
import { parseDocument } from '../../model/document';
import { TEST_DATABASE_URL } from '../support/env';
import { Client, freshEmail } from '../support/http';
import { assignmentOn, classWith, darkBackgroundCheck, inboxFor, lessonDocument, lessonWith } from './classes.support';
import { fresh } from './fixtures';

const base = inject('baseUrl');
const { pool } = createDb(TEST_DATABASE_URL);
afterAll(() => pool.end());

describe('a class and its roster', () => {
  it('the creator teaches it; students join with the code however they type it; only instructors see the code and addresses', async () => {
    const w = await classWith(base, 0, 'Wednesday strobes');
    expect(w.joinCode).toMatch(/^[A-HJ-NP-Z2-9]{6}$/);
    const s = await fresh(base, 'Noor Student');
    const typed = `${w.joinCode.slice(0, 3).toLowerCase()} ${w.joinCode.slice(3)}`;
    const j = await s.client.post('/api/classes/join', { code: typed });
    expect(j.status).toBe(200);
    expect(j.body).toEqual({ classId: w.classId, role: 'student' });

    const asStudent = await s.client.get(`/api/classes/${w.classId}`);
    expect(asStudent.body).toMatchObject({ name: 'Wednesday strobes', role: 'student', joinCode: null, studentCount: 1, instructors: ['Ada Instructor'] });
    const asInstructor = await w.instructor.client.get(`/api/classes/${w.classId}`);
    expect(asInstructor.body.joinCode).toBe(w.joinCode);

    const roster = await s.client.get(`/api/classes/${w.classId}/members`);
    expect(roster.body.members.map((m: { name: string; role: string; email: string | null }) => [m.name, m.role, m.email])).toEqual([
      ['Ada Instructor', 'instructor', null],
      ['Noor Student', 'student', null],
    ]);
    const full = await w.instructor.client.get(`/api/classes/${w.classId}/members`);
    expect(full.body.members[1].email).toBe(s.email);

    const list = await s.client.get('/api/classes');
    expect(list.body.classes).toEqual([{ id: w.classId, name: 'Wednesday strobes', role: 'student', studentCount: 1, lessonCount: 0 }]);
    expect((await s.client.get('/api/me')).body.classes).toEqual([{ id: w.classId, name: 'Wednesday strobes', role: 'student' }]);
  });

  it('a new join code retires the old one; a wrong code is a 404 naming the field', async () => {
    const w = await classWith(base, 0);
    const r = await w.instructor.client.post(`/api/classes/${w.classId}/join-code`);
    expect(r.status).toBe(200);
    expect(r.body.joinCode).not.toBe(w.joinCode);
    const s = await fresh(base, 'Late Student');
    const old = await s.client.post('/api/classes/join', { code: w.joinCode });
    expect(old.status).toBe(404);
    expect(old.body.error.fields).toEqual({ code: 'no class has this code' });
    expect((await s.client.post('/api/classes/join', { code: 'ab' })).body.error.fields.code).toBe('a join code has at least 4 letters');
    expect((await s.client.post('/api/classes/join', { code: r.body.joinCode })).status).toBe(200);
  });

  it('an invitation by e-mail arrives with the code; the invitee sees it on their Classes list and joins in the invited role', async () => {
    const w = await classWith(base, 0, 'Gelled backgrounds');
    const email = freshEmail('invitee');
    const inv = await w.instructor.client.post(`/api/classes/${w.classId}/invitations`, { email: email.toUpperCase() });
    expect(inv.status).toBe(201);
    expect(inv.body).toMatchObject({ email, role: 'student', invitedBy: 'Ada Instructor', delivery: 'email' });
    const [mail] = await inboxFor(base, email);
    expect(mail!.subject).toBe('Join Gelled backgrounds on Falloff');
    expect(mail!.text).toContain(w.joinCode);
    expect(mail!.text).toContain(`${base}/classes`);

    const pending = await w.instructor.client.get(`/api/classes/${w.classId}/invitations`);
    expect(pending.body.invitations.map((i: { email: string }) => i.email)).toEqual([email]);

    const invitee = new Client(base);
    await invitee.signUp('Invited Iris', email, 'fresh-pass-123');
    const seen = await invitee.get('/api/classes');
    expect(seen.body.invitations).toEqual([expect.objectContaining({ classId: w.classId, className: 'Gelled backgrounds', role: 'student', invitedBy: 'Ada Instructor' })]);
    // Someone else cannot use it.
    const other = await fresh(base, 'Other Person');
    expect((await other.client.post(`/api/classes/${w.classId}/accept`)).status).toBe(404);
    const ok = await invitee.post(`/api/classes/${w.classId}/accept`);
    expect(ok.body).toEqual({ classId: w.classId, role: 'student' });
    expect((await invitee.get('/api/classes')).body.invitations).toEqual([]);
    expect((await w.instructor.client.get(`/api/classes/${w.classId}/invitations`)).body.invitations).toEqual([]);
    // Inviting a member again is refused by name.
    const again = await w.instructor.client.post(`/api/classes/${w.classId}/invitations`, { email });
    expect(again.status).toBe(409);
    expect(again.body.error.fields).toEqual({ email: 'already in the class' });
  });

  it('students may leave and be removed; the last instructor cannot go', async () => {
    const w = await classWith(base, 2);
    const [a, b] = w.students;
    expect((await a!.client.del(`/api/classes/${w.classId}/members/${b!.userId}`)).status).toBe(403);
    expect((await a!.client.del(`/api/classes/${w.classId}/members/${a!.userId}`)).status).toBe(204);
    expect((await a!.client.get(`/api/classes/${w.classId}`)).status).toBe(404);
    expect((await w.instructor.client.del(`/api/classes/${w.classId}/members/${b!.userId}`)).status).toBe(204);
    const last = await w.instructor.client.del(`/api/classes/${w.classId}/members/${w.instructor.userId}`);
    expect(last.status).toBe(409);
    expect(last.body.error.code).toBe('last_instructor');
  });
});

describe('lessons', () => {
  it('keep a snapshot of each setup until the instructor refreshes it; words per step stay with the step', async () => {
    const w = await classWith(base, 1);
    const { setup, lessonId, entryId } = await lessonWith(w.instructor.client, w.classId, w.instructor.personalStudioId);
    const notes = await w.instructor.client.request('PATCH', `/api/lessons/${lessonId}/setups/${entryId}`, { stepNotes: { 'key-in': 'One head, straight on: the paper falls off.' } });
    expect(notes.status, JSON.stringify(notes.body)).toBe(200);
    expect(notes.body.stepNotes).toEqual({ 'key-in': 'One head, straight on: the paper falls off.' });
    const bad = await w.instructor.client.request('PATCH', `/api/lessons/${lessonId}/setups/${entryId}`, { stepNotes: { nope: 'x' } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ 'stepNotes.nope': 'no such step in this setup' });

    // The setup moves on; the lesson does not, until refreshed.
    const moved = await w.instructor.client.put(`/api/setups/${setup.id}`, { version: setup.version, document: lessonDocument(2) });
    expect(moved.status).toBe(200);
    const student = w.students[0]!.client;
    const seen = await student.get(`/api/lessons/${lessonId}`);
    expect(seen.body.setups[0].document.items.find((i: { id: string }) => i.id === 'key').y).toBe(4);
    expect(seen.body.setups[0].newerVersion).toBeNull();
    const taught = await w.instructor.client.get(`/api/lessons/${lessonId}`);
    expect(taught.body.setups[0].newerVersion).toBe(moved.body.version);
    const refreshed = await w.instructor.client.post(`/api/lessons/${lessonId}/setups/${entryId}/refresh`);
    expect(refreshed.status).toBe(200);
    expect(refreshed.body.document.items.find((i: { id: string }) => i.id === 'key').y).toBe(5);
    expect(refreshed.body).toMatchObject({ sourceVersion: moved.body.version, newerVersion: null, stepNotes: { 'key-in': 'One head, straight on: the paper falls off.' } });
  });

  it('are drafts until published: students neither list nor open them, and cannot change them', async () => {
    const w = await classWith(base, 1);
    const student = w.students[0]!.client;
    const l = await w.instructor.client.post(`/api/classes/${w.classId}/lessons`, { title: 'Draft lesson' });
    expect((await student.get(`/api/classes/${w.classId}/lessons`)).body.lessons).toEqual([]);
    expect((await student.get(`/api/lessons/${l.body.id}`)).status).toBe(404);
    await w.instructor.client.request('PATCH', `/api/lessons/${l.body.id}`, { published: true });
    expect((await student.get(`/api/classes/${w.classId}/lessons`)).body.lessons.map((x: { title: string }) => x.title)).toEqual(['Draft lesson']);
    const { lessonId } = await lessonWith(w.instructor.client, w.classId, w.instructor.personalStudioId);
    await assignmentOn(w.instructor.client, lessonId);
    const counted = await student.get(`/api/classes/${w.classId}/lessons`);
    expect(counted.body.lessons.map((x: { title: string; setupCount: number; assignmentCount: number }) => [x.title, x.setupCount, x.assignmentCount])).toEqual([
      ['Draft lesson', 0, 0],
      ['Falloff to the background', 1, 1],
    ]);
    expect((await student.get(`/api/classes/${w.classId}`)).body).toMatchObject({ lessonCount: 2, studentCount: 1 });
    expect((await student.request('PATCH', `/api/lessons/${l.body.id}`, { title: 'Mine now' })).status).toBe(403);
  });

  it('take setups the instructor can read (their studios, any template), in an order they can change', async () => {
    const w = await classWith(base, 0);
    const { lessonId } = await lessonWith(w.instructor.client, w.classId, w.instructor.personalStudioId);
    const stranger = await fresh(base, 'Stranger Setup');
    const theirs = await stranger.client.post('/api/setups', { title: 'Not yours', document: lessonDocument() });
    const refused = await w.instructor.client.post(`/api/lessons/${lessonId}/setups`, { setupId: theirs.body.id });
    expect(refused.status).toBe(404);
    expect(refused.body.error.fields).toEqual({ setupId: 'no setup you can read' });
    const templates = await w.instructor.client.get('/api/setups?templates=1');
    const template = templates.body.setups.find((s: { title: string }) => s.title === 'Teal backdrop, warm key');
    const added = await w.instructor.client.post(`/api/lessons/${lessonId}/setups`, { setupId: template.id });
    expect(added.status).toBe(201);
    const move = await w.instructor.client.request('PATCH', `/api/lessons/${lessonId}/setups/${added.body.id}`, { position: 0 });
    expect(move.status).toBe(200);
    const lesson = await w.instructor.client.get(`/api/lessons/${lessonId}`);
    expect(lesson.body.setups.map((s: { title: string }) => s.title)).toEqual(['Teal backdrop, warm key', 'One light, dark paper']);
  });
});

describe('assignments, submissions and review', () => {
  it('the server computes the check with the same evaluateCheck as the client: fail, fix, pass; instructors are told', async () => {
    const w = await classWith(base, 1, 'Checks class');
    const student = w.students[0]!;
    const { lessonId } = await lessonWith(w.instructor.client, w.classId, w.instructor.personalStudioId);
    const assignmentId = await assignmentOn(w.instructor.client, lessonId);

    const set = await inboxFor(base, student.email);
    expect(set.map((m) => m.subject)).toContain('New assignment in Checks class: Dark paper, one light');
    expect(set.find((m) => m.subject.startsWith('New assignment'))!.text).toContain(`${base}/assignments/${assignmentId}`);

    // Start from the reference: a normal setup in the student's personal studio.
    const start = await student.client.post(`/api/assignments/${assignmentId}/start`, { from: 'reference' });
    expect(start.status, JSON.stringify(start.body)).toBe(201);
    const copy = await student.client.get(`/api/setups/${start.body.setupId}`);
    expect(copy.body).toMatchObject({ studioId: student.personalStudioId, role: 'owner', title: 'Dark paper, one light — my plan' });
    expect(copy.body.document.items.map((i: { id: string }) => i.id)).toEqual(['paper', 'sitter', 'cam', 'key']);
    expect((await student.client.post(`/api/assignments/${assignmentId}/start`, { from: 'blank' })).body.setupId).toBe(start.body.setupId);

    // The paper 0.5 m behind the sitter: not dark enough.
    const near = lessonDocument(1, 2.5);
    const put = await student.client.put(`/api/setups/${copy.body.id}`, { version: copy.body.version, document: near });
    expect(put.status).toBe(200);
    const first = await student.client.post(`/api/assignments/${assignmentId}/submissions`);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body).toMatchObject({ attempt: 1, passed: false, status: 'submitted' });
    expect(first.body.checkResult).toEqual(JSON.parse(JSON.stringify(evaluateCheck(darkBackgroundCheck, parseDocument(near)))));
    expect(first.body.checkResult.criteria.map((c: { measure: string; pass: boolean }) => [c.measure, c.pass])).toEqual([['lights', true], ['background', false]]);
    expect(first.body.reference.document.items).toHaveLength(4);

    // Back to 2 m behind: it passes, as attempt 2.
    const fixed = lessonDocument(1, 1);
    await student.client.put(`/api/setups/${copy.body.id}`, { version: put.body.version, document: fixed });
    const second = await student.client.post(`/api/assignments/${assignmentId}/submissions`);
    expect(second.body).toMatchObject({ attempt: 2, passed: true });
    expect(second.body.checkResult).toEqual(JSON.parse(JSON.stringify(evaluateCheck(darkBackgroundCheck, parseDocument(fixed)))));

    const told = await inboxFor(base, w.instructor.email);
    expect(told.filter((m) => m.subject === 'Student1 Learner submitted “Dark paper, one light”').map((m) => m.text.includes('does not meet'))).toEqual([true, false]);

    const mine = await student.client.get(`/api/assignments/${assignmentId}`);
    expect(mine.body.mine).toMatchObject({ setupId: copy.body.id, startedFrom: 'reference', latest: { attempt: 2, passed: true } });
    const all = await w.instructor.client.get(`/api/assignments/${assignmentId}`);
    expect(all.body).toMatchObject({ submittedCount: 1, reviewedCount: 0, mine: null });
  });

  it('refuses bad input by field: a check that cannot be evaluated, an assignment on a draft, submitting before starting', async () => {
    const w = await classWith(base, 1);
    const { lessonId } = await lessonWith(w.instructor.client, w.classId, w.instructor.personalStudioId);
    const bad = await w.instructor.client.post(`/api/lessons/${lessonId}/assignments`, { title: 'x', check: { criteria: [{ measure: 'keyFill', min: 4, max: 2 }] } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ 'check.criteria.0.max': 'the highest value is below the lowest' });
    const noTitle = await w.instructor.client.post(`/api/lessons/${lessonId}/assignments`, { check: null });
    expect(noTitle.body.error.fields.title).toBeTruthy();
    const draft = await w.instructor.client.post(`/api/classes/${w.classId}/lessons`, { title: 'Unpublished' });
    const onDraft = await w.instructor.client.post(`/api/lessons/${draft.body.id}/assignments`, { title: 'Too early' });
    expect(onDraft.status).toBe(409);
    const assignmentId = await assignmentOn(w.instructor.client, lessonId);
    const early = await w.students[0]!.client.post(`/api/assignments/${assignmentId}/submissions`);
    expect(early.status).toBe(409);
    expect(early.body.error.fields).toEqual({ setupId: 'nothing to submit yet' });
    expect((await w.instructor.client.post(`/api/assignments/${assignmentId}/start`)).status).toBe(403);
    // Taking the lesson back to a draft would hide the assignment from its students.
    expect((await w.instructor.client.request('PATCH', `/api/lessons/${lessonId}`, { published: false })).status).toBe(409);
  });

  it('a classmate sees a submission only once shared; comments pin to an item or a point; reviewing tells the student', async () => {
    const w = await classWith(base, 2);
    const [student, classmate] = w.students as [typeof w.students[0], typeof w.students[0]];
    const { lessonId } = await lessonWith(w.instructor.client, w.classId, w.instructor.personalStudioId);
    const assignmentId = await assignmentOn(w.instructor.client, lessonId);
    await student!.client.post(`/api/assignments/${assignmentId}/start`, { from: 'blank' });
    const sub = await student!.client.post(`/api/assignments/${assignmentId}/submissions`);
    expect(sub.body).toMatchObject({ passed: false, document: { items: [] } });
    const id = sub.body.id as string;

    expect((await classmate!.client.get(`/api/submissions/${id}`)).status).toBe(404);
    expect((await classmate!.client.get(`/api/assignments/${assignmentId}/submissions`)).body.submissions).toEqual([]);

    // A blank plan has no items: pin to a point.
    const c1 = await w.instructor.client.post(`/api/submissions/${id}/comments`, { body: 'Start with the sitter here.', point: { x: 4, y: 3 } });
    expect(c1.status).toBe(201);
    expect(c1.body).toMatchObject({ point: { x: 4, y: 3 }, itemId: null, author: { name: 'Ada Instructor' } });
    const badItem = await w.instructor.client.post(`/api/submissions/${id}/comments`, { body: 'This light', itemId: 'key' });
    expect(badItem.body.error.fields).toEqual({ itemId: 'no such item on this plan' });
    const both = await w.instructor.client.post(`/api/submissions/${id}/comments`, { body: 'x', itemId: 'a', point: { x: 1, y: 1 } });
    expect(both.body.error.fields).toEqual({ point: 'pin to an item or to a point, not both' });
    const reply = await student!.client.post(`/api/submissions/${id}/comments`, { body: 'Will do.' });
    expect(reply.status).toBe(201);

    expect((await student!.client.request('PATCH', `/api/submissions/${id}`, { reviewed: true })).status).toBe(403);
    const reviewed = await w.instructor.client.request('PATCH', `/api/submissions/${id}`, { reviewed: true, shared: true });
    expect(reviewed.body).toMatchObject({ status: 'reviewed', shared: true, commentCount: 2 });
    const [mail] = await inboxFor(base, student!.email).then((m) => m.filter((x) => x.subject.includes('was reviewed')));
    expect(mail!.subject).toBe('Your plan for “Dark paper, one light” was reviewed');
    expect(mail!.text).toContain('left 2 comments');

    // Shared: the classmate reads it and its comments, but cannot comment or review.
    const seen = await classmate!.client.get(`/api/submissions/${id}`);
    expect(seen.status).toBe(200);
    expect(seen.body).toMatchObject({ canComment: false, canReview: false });
    expect(seen.body.comments.map((c: { body: string }) => c.body)).toEqual(['Start with the sitter here.', 'Will do.']);
    expect((await classmate!.client.post(`/api/submissions/${id}/comments`, { body: 'Nice' })).status).toBe(403);
    const own = await student!.client.get(`/api/submissions/${id}`);
    expect(own.body).toMatchObject({ canComment: true, canReview: false, status: 'reviewed' });
  });
});
