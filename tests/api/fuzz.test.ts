// A fuzz of every API route over real HTTP against real PostgreSQL: hostile bodies (control characters, lone
// surrogates, huge and deeply nested values, wrong types), hostile queries and hostile path parameters, sent
// as a signed-in member of real studios and classes (so requests reach the code past the role checks) and as a
// stranger. Not one answer may be a 5xx.
import fc from 'fast-check';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client } from '../support/http';
import { recordFigure } from '../support/redteam';
import { assignmentOn, classWith, lessonDocument, lessonWith } from './classes.support';
import { documentWith } from './documents';
import { newSetup, studioWithTeam } from './fixtures';

const base = inject('baseUrl');
const REQUESTS = 3200;
const PARALLEL = 6;

/** Every route the API has (server/app.ts and server/routes/*), with `:name` for its path parameters. */
const ROUTES: [string, string][] = [
  ['GET', '/api/health'],
  ['GET', '/api/invitations'],
  ['DELETE', '/api/invitations'],
  ['GET', '/api/invitations/:token'],
  ['POST', '/api/invitations/:token/accept'],
  ['GET', '/api/shared/:token'],
  ['GET', '/api/shared/:token/crew-sheet.pdf'],
  ['GET', '/api/shared/:token/plan.svg'],
  ['GET', '/api/shared/:token/plan.png'],
  ['GET', '/api/me'],
  ['PATCH', '/api/me'],
  ['GET', '/api/setups'],
  ['GET', '/api/tags'],
  ['POST', '/api/setups'],
  ['GET', '/api/setups/:setup'],
  ['PUT', '/api/setups/:setup'],
  ['DELETE', '/api/setups/:setup'],
  ['POST', '/api/setups/:setup/restore'],
  ['POST', '/api/setups/:setup/duplicate'],
  ['GET', '/api/setups/:setup/history'],
  ['GET', '/api/setups/:setup/history/:uuid'],
  ['POST', '/api/setups/:setup/history/:uuid/restore'],
  ['GET', '/api/setups/:setup/comments'],
  ['POST', '/api/setups/:setup/comments'],
  ['GET', '/api/setups/:setup/meter'],
  ['GET', '/api/setups/:setup/crew-sheet.pdf'],
  ['GET', '/api/setups/:setup/plan.svg'],
  ['GET', '/api/setups/:setup/plan.png'],
  ['POST', '/api/setups/:setup/shares'],
  ['GET', '/api/setups/:setup/shares'],
  ['DELETE', '/api/setups/:setup/shares/:uuid'],
  ['POST', '/api/setups/:setup/send'],
  ['POST', '/api/setups/:setup/photos'],
  ['GET', '/api/setups/:setup/photos'],
  ['GET', '/api/setups/:setup/photos/:uuid'],
  ['GET', '/api/setups/:setup/photos/:uuid/thumbnail'],
  ['DELETE', '/api/setups/:setup/photos/:uuid'],
  ['GET', '/api/studios'],
  ['POST', '/api/studios'],
  ['GET', '/api/studios/:studio'],
  ['PATCH', '/api/studios/:studio'],
  ['GET', '/api/studios/:studio/members'],
  ['POST', '/api/studios/:studio/members'],
  ['PATCH', '/api/studios/:studio/members/:user'],
  ['DELETE', '/api/studios/:studio/members/:user'],
  ['GET', '/api/studios/:studio/invitations'],
  ['DELETE', '/api/studios/:studio/invitations/:uuid'],
  ['GET', '/api/classes'],
  ['POST', '/api/classes'],
  ['POST', '/api/classes/join'],
  ['GET', '/api/classes/:class'],
  ['PATCH', '/api/classes/:class'],
  ['POST', '/api/classes/:class/join-code'],
  ['POST', '/api/classes/:class/accept'],
  ['GET', '/api/classes/:class/members'],
  ['DELETE', '/api/classes/:class/members/:user'],
  ['GET', '/api/classes/:class/invitations'],
  ['POST', '/api/classes/:class/invitations'],
  ['DELETE', '/api/classes/:class/invitations/:uuid'],
  ['GET', '/api/classes/:class/lessons'],
  ['POST', '/api/classes/:class/lessons'],
  ['GET', '/api/classes/:class/assignments'],
  ['GET', '/api/lessons/:lesson'],
  ['PATCH', '/api/lessons/:lesson'],
  ['DELETE', '/api/lessons/:lesson'],
  ['POST', '/api/lessons/:lesson/setups'],
  ['PATCH', '/api/lessons/:lesson/setups/:entry'],
  ['POST', '/api/lessons/:lesson/setups/:entry/refresh'],
  ['DELETE', '/api/lessons/:lesson/setups/:entry'],
  ['POST', '/api/lessons/:lesson/assignments'],
  ['GET', '/api/assignments/:assignment'],
  ['PATCH', '/api/assignments/:assignment'],
  ['DELETE', '/api/assignments/:assignment'],
  ['POST', '/api/assignments/:assignment/start'],
  ['GET', '/api/assignments/:assignment/submissions'],
  ['POST', '/api/assignments/:assignment/submissions'],
  ['GET', '/api/submissions/:submission'],
  ['PATCH', '/api/submissions/:submission'],
  ['POST', '/api/submissions/:submission/comments'],
  ['GET', '/api/no-such-route'],
  // better-auth's endpoints that take input (sign-out and account deletion would end the fuzzing session).
  ['POST', '/api/auth/sign-up/email'],
  ['POST', '/api/auth/sign-in/email'],
  ['POST', '/api/auth/request-password-reset'],
  ['POST', '/api/auth/reset-password'],
  ['POST', '/api/auth/update-user'],
  ['POST', '/api/auth/change-password'],
  ['POST', '/api/auth/send-verification-email'],
  ['GET', '/api/auth/verify-email'],
  ['GET', '/api/auth/get-session'],
];

/** Text that has broken servers before: control characters, lone surrogates, bidi controls, huge, odd numbers. */
const shortHostileString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.constantFrom('\u0000', 'a\u0000b', '\ud800', '\u202eabc', '\u0007', '%00', '../../etc/passwd', "'; drop table setups; --", '__proto__', 'NaN', '-1', '1e400', '', '9'.repeat(40), 'x'.repeat(2000)),
);
const hostileString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.constantFrom('\u0000', 'a\u0000b', '\ud800', '\udfff x', '\u202eabc', '\u0007\u001b[2J', '\r\n\t', '\ufffe', '%00', '../../etc/passwd', "'; drop table setups; --", '<svg onload=alert(1)>', '__proto__', 'constructor', 'NaN', '-0', '1e400', ''),
  fc.integer({ min: 1000, max: 120_000 }).map((n) => 'x'.repeat(n)),
);
const hostileValue: fc.Arbitrary<unknown> = fc.letrec((tie) => ({
  value: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    hostileString,
    fc.integer(),
    fc.double(),
    fc.constantFrom(null, true, false, Number.MAX_SAFE_INTEGER, -1, 0, 1e308),
    fc.array(tie('value'), { maxLength: 4 }),
    fc.dictionary(hostileString, tie('value'), { maxKeys: 4 }),
  ),
})).value;

/** A body: either a plausible one with one field made hostile, or any hostile value, or raw bytes. */
function bodyFor(plausible: Record<string, unknown>[]): fc.Arbitrary<{ raw?: string; json?: unknown; type?: string }> {
  return fc.oneof(
    fc.tuple(fc.constantFrom(...plausible), hostileString, hostileValue).map(([p, k, v]) => {
      const keys = Object.keys(p);
      const key = keys.length && k.length % 2 ? keys[k.length % keys.length]! : k;
      const b = JSON.parse(JSON.stringify(p)) as Record<string, unknown>;
      Object.defineProperty(b, key, { value: v, enumerable: true, configurable: true, writable: true });
      return { json: b };
    }),
    hostileValue.map((json) => ({ json })),
    fc.oneof(fc.constantFrom('{', '{"a":', '[1,2', '\u0000', 'null', '"x"', '{"__proto__":{"admin":true}}', '{"title":"\\u0000"}', '{"title":"\\ud800"}'), hostileString).map((raw) => ({ raw, type: 'application/json' })),
    hostileString.map((raw) => ({ raw, type: 'application/x-www-form-urlencoded' })),
    hostileString.map((raw) => ({ raw, type: 'multipart/form-data; boundary=zz' })),
    fc.constant({}),
  );
}

describe('fuzz of every route', () => {
  const ids: Record<string, string[]> = {};
  let member: Client;
  let plausible: Record<string, unknown>[] = [];

  beforeAll(async () => {
    const team = await studioWithTeam(base);
    member = team.owner.client;
    const setup = await newSetup(member, { studioId: team.studioId, title: 'Fuzz target', document: documentWith(3) });
    const w = await classWith(base, 1, 'Fuzz class');
    const { lessonId, entryId } = await lessonWith(w.instructor.client, w.classId, w.instructor.personalStudioId, lessonDocument());
    const assignmentId = await assignmentOn(w.instructor.client, lessonId);
    const student = w.students[0]!;
    await student.client.post(`/api/assignments/${assignmentId}/start`, { from: 'reference' });
    const sub = await student.client.post(`/api/assignments/${assignmentId}/submissions`);
    const share = await member.post(`/api/setups/${setup.id}/shares`, { label: 'fuzz' });
    // The fuzzing client is the studio owner; the class routes are reached as its instructor.
    member = w.instructor.client;
    await member.post(`/api/studios`, { name: 'Instructor studio' });
    const instructorSetup = await newSetup(member, { title: 'Instructor target', document: documentWith(2) });
    const hostileIds = ['%00', 'not-a-uuid', '00000000-0000-0000-0000-000000000000', "1'--", '%E2%80%AE', 'x'.repeat(3000), '..%2F..%2F', '%F0%9F', '%ud800'];
    ids.setup = [instructorSetup.id, setup.id, w.instructor.personalStudioId, ...hostileIds];
    ids.studio = [w.instructor.personalStudioId, team.studioId, ...hostileIds];
    ids.class = [w.classId, ...hostileIds];
    ids.lesson = [lessonId, ...hostileIds];
    ids.entry = [entryId, ...hostileIds];
    ids.assignment = [assignmentId, ...hostileIds];
    ids.submission = [sub.body.id, ...hostileIds];
    ids.user = [student.userId, w.instructor.userId, ...hostileIds];
    ids.uuid = [setup.id, ...hostileIds];
    ids.token = [share.body.token, 'abc', ...hostileIds];
    plausible = [
      { title: 'A title', document: documentWith(1), notes: 'n', tags: ['a'] },
      { version: 1, title: 'A title', document: lessonDocument() },
      { name: 'A name' },
      { email: 'someone@example.test', role: 'crew' },
      { body: 'a comment', itemId: 'key' },
      { to: ['crew@example.test'], message: 'hi', attachPdf: false },
      { code: 'ABCDEF' },
      { title: 'Lesson', summary: 'S', published: true, position: 1 },
      { setupId: instructorSetup.id, note: 'n', stepNotes: { s1: 'x' }, position: 0 },
      { title: 'Assignment', brief: 'b', check: { criteria: [{ measure: 'lights', min: 1, max: 2 }] }, dueAt: '2027-01-01T00:00:00Z' },
      { reviewed: true, shared: true },
      { from: 'blank' },
      { email: 'fuzz@example.test', password: 'a-long-pass-1', name: 'Fuzz' },
      { token: 'abc', newPassword: 'a-long-pass-2' },
      { currentPassword: 'x', newPassword: 'a-long-pass-3' },
    ];
  }, 120_000);

  it(`${REQUESTS} hostile requests: not one 5xx`, async () => {
    const requestArb = fc.record({
      route: fc.constantFrom(...ROUTES),
      params: fc.dictionary(fc.constantFrom('setup', 'studio', 'class', 'lesson', 'entry', 'assignment', 'submission', 'user', 'uuid', 'token'), fc.nat(20)),
      query: fc.array(fc.tuple(fc.oneof(fc.constantFrom('q', 'tag', 'sort', 'templates', 'deleted', 'cursor', 'limit', 'width', 'v', 'paper', 'units', 'download', 'before', 'step', 'studio', 'token', 'kind'), shortHostileString), shortHostileString), { maxLength: 3 }),
      body: bodyFor([{}]),
      bodyIndex: fc.nat(100),
      signedIn: fc.nat(3).map((n) => n > 0),
    });
    const samples = fc.sample(requestArb, { numRuns: REQUESTS, seed: 1203 });
    const failures: string[] = [];
    let done = 0;
    const stranger = new Client(base);
    const tally = new Map<number, number>();
    async function one(s: (typeof samples)[number]) {
      const [method, pattern] = s.route;
      const path = pattern.replace(/:(\w+)/g, (_m, name: string) => {
        const list = ids[name] ?? ids.uuid!;
        return encodeURI(list[(s.params[name] ?? 0) % list.length]!).replace(/%25/g, '%');
      });
      const qs = s.query.map(([k, v]) => `${encodeURIComponent(k.toWellFormed())}=${encodeURIComponent(v.toWellFormed())}`).join('&');
      const url = `${path}${qs ? `?${qs}` : ''}`;
      let payload: string | undefined;
      const headers: Record<string, string> = {};
      if (method !== 'GET' && method !== 'DELETE') {
        // Half the time a plausible body for this route family with one field made hostile.
        const b = s.bodyIndex % 2 ? fc.sample(bodyFor(plausible), { numRuns: 1, seed: s.bodyIndex * 7919 + done })[0]! : s.body;
        if (b.raw !== undefined) {
          payload = b.raw;
          headers['content-type'] = b.type!;
        } else if (b.json !== undefined) {
          payload = JSON.stringify(b.json);
          headers['content-type'] = 'application/json';
        }
      }
      const client = s.signedIn ? member : stranger;
      let status = 0;
      try {
        const r = await client.request(method, url, payload, headers);
        status = r.status;
        tally.set(status, (tally.get(status) ?? 0) + 1);
        if (status >= 500) failures.push(`${status} ${method} ${url.slice(0, 200)} ${String(payload).slice(0, 200)} → ${JSON.stringify(r.body).slice(0, 300)}`);
      } catch (err) {
        failures.push(`network error ${method} ${url.slice(0, 200)}: ${String(err)}`);
      }
      done++;
    }
    let next = 0;
    await Promise.all(
      Array.from({ length: PARALLEL }, async () => {
        while (next < samples.length) await one(samples[next++]!);
      }),
    );
    expect(done).toBe(REQUESTS);
    console.info(`fuzz: ${REQUESTS} requests, answers by status: ${[...tally].sort((a, b) => a[0] - b[0]).map(([k, v]) => `${k}×${v}`).join(' ')}`);
    recordFigure('fuzz', `${failures.length} of ${REQUESTS}`, `tests/api/fuzz.test.ts: hostile bodies, queries and path parameters on all ${ROUTES.length} routes, as a member and a stranger`);
    expect(failures.slice(0, 20), `${failures.length} of ${REQUESTS} answered 5xx`).toEqual([]);
    // Not vacuous: many requests got past validation and the role checks, many were refused as bad input.
    const count = (lo: number, hi: number) => [...tally].filter(([k]) => k >= lo && k < hi).reduce((n, [, v]) => n + v, 0);
    expect(count(200, 300)).toBeGreaterThan(REQUESTS / 20);
    expect(count(400, 401)).toBeGreaterThan(REQUESTS / 5);

  }, 600_000);
});
