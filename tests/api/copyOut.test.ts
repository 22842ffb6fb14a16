// Crew copying a studio's setup out (server/access.ts, checkCopyOut) over real HTTP: with the studio's
// crewMayCopy off (the default), every route that takes a copy of a setup somewhere else refuses crew with 403
// crew_copy_off — a duplicate, a lesson's snapshot (adding and refreshing), a submission to a class — and each
// lets them once an owner turns the setting on. Templates may always be copied.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { assignmentOn, classWith, lessonDocument } from './classes.support';
import { newSetup, studioWithTeam } from './fixtures';

const base = inject('baseUrl');

type Team = Awaited<ReturnType<typeof studioWithTeam>>;
let team: Team;
let houseLook = '';

/** A 403 crew_copy_off naming the setting (and `field`, when the body chose the setup). */
function expectCopyOff(r: { status: number; body: any }, field?: string) {
  expect(r.status, JSON.stringify(r.body)).toBe(403);
  expect(r.body.error).toMatchObject({ code: 'crew_copy_off', fields: { crewMayCopy: expect.any(String) } });
  if (field) expect(r.body.error.fields).toHaveProperty([field]);
}

const setCrewMayCopy = async (on: boolean) => {
  const r = await team.owner.client.request('PATCH', `/api/studios/${team.studioId}`, { crewMayCopy: on });
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  expect(r.body.crewMayCopy).toBe(on);
};

beforeAll(async () => {
  team = await studioWithTeam(base);
  houseLook = (await newSetup(team.owner.client, { studioId: team.studioId, title: 'House look, stays in the studio', document: lessonDocument() })).id;
});

describe('crew teaching a class cannot take a studio setup into a lesson while the studio says no', () => {
  it('adding it to a lesson, and refreshing a lesson entry from it, are 403 crew_copy_off; allowed once the owner turns it on', async () => {
    await setCrewMayCopy(false);
    const c = team.crew.client;
    const cls = await c.post('/api/classes', { name: 'Crew teaches on Thursdays' });
    expect(cls.status, JSON.stringify(cls.body)).toBe(201);
    const lesson = await c.post(`/api/classes/${cls.body.id}/lessons`, { title: 'The house look' });
    expect(lesson.status, JSON.stringify(lesson.body)).toBe(201);
    const lessonId = lesson.body.id as string;

    expectCopyOff(await c.post(`/api/lessons/${lessonId}/setups`, { setupId: houseLook }), 'setupId');
    expect((await c.get(`/api/lessons/${lessonId}`)).body.setups ?? []).toEqual([]);
    // The duplicate route says the same, through the same check.
    expectCopyOff(await c.post(`/api/setups/${houseLook}/duplicate`, {}));

    await setCrewMayCopy(true);
    const added = await c.post(`/api/lessons/${lessonId}/setups`, { setupId: houseLook });
    expect(added.status, JSON.stringify(added.body)).toBe(201);

    // Turned off again: the lesson keeps the copy it has, but cannot take the setup's newer version.
    await setCrewMayCopy(false);
    expectCopyOff(await c.post(`/api/lessons/${lessonId}/setups/${added.body.id}/refresh`, {}), 'setupId');
    await setCrewMayCopy(true);
    expect((await c.post(`/api/lessons/${lessonId}/setups/${added.body.id}/refresh`, {})).status).toBe(200);
  });

  it("the studio's templates may be taken into a lesson with the setting off", async () => {
    await setCrewMayCopy(false);
    const template = await newSetup(team.owner.client, { studioId: team.studioId, title: 'House template', isTemplate: true });
    const c = team.crew.client;
    const cls = await c.post('/api/classes', { name: 'Templates class' });
    const lesson = await c.post(`/api/classes/${cls.body.id}/lessons`, { title: 'From the template' });
    expect((await c.post(`/api/lessons/${lesson.body.id}/setups`, { setupId: template.id })).status).toBe(201);
  });
});

describe('crew studying in a class cannot hand a studio setup in as their work while the studio says no', () => {
  it('a submission naming it is 403 crew_copy_off; allowed once the owner turns it on', async () => {
    await setCrewMayCopy(false);
    const w = await classWith(base, 0, 'Where crew learn');
    const j = await team.crew.client.post('/api/classes/join', { code: w.joinCode });
    expect(j.status, JSON.stringify(j.body)).toBe(200);
    const own = await newSetup(w.instructor.client, { studioId: w.instructor.personalStudioId, title: 'Reference', document: lessonDocument() });
    const l = await w.instructor.client.post(`/api/classes/${w.classId}/lessons`, { title: 'One light' });
    expect((await w.instructor.client.post(`/api/lessons/${l.body.id}/setups`, { setupId: own.id })).status).toBe(201);
    expect((await w.instructor.client.request('PATCH', `/api/lessons/${l.body.id}`, { published: true })).status).toBe(200);
    const assignmentId = await assignmentOn(w.instructor.client, l.body.id);

    expectCopyOff(await team.crew.client.post(`/api/assignments/${assignmentId}/submissions`, { setupId: houseLook }), 'setupId');
    const none = await w.instructor.client.get(`/api/assignments/${assignmentId}/submissions`);
    expect(none.body.submissions).toEqual([]);

    await setCrewMayCopy(true);
    const handedIn = await team.crew.client.post(`/api/assignments/${assignmentId}/submissions`, { setupId: houseLook });
    expect(handedIn.status, JSON.stringify(handedIn.body)).toBe(201);
  });
});
