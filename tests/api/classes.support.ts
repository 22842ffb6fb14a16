// Helpers for the class tests: a class with its instructor and students (joined by code, as in a room),
// a lesson built from a setup, an assignment with a meter check, and the fake SMTP server's inbox.
import { expect } from 'vitest';
import { settledMail } from './exports.helpers';
import type { Check } from '../../model/classes';
import type { Client } from '../support/http';
import { fresh, newSetup, type Signed } from './fixtures';

/**
 * A two-step plan: sitter, camera and paper first, then one bare head 1 m in front of the face, 0.6 m above it and
 * tilted down onto it (as keys usually stand: the sitter's shadow falls below the face on the paper, and the
 * meter reads the paper beside the silhouette, where the lens sees it).
 */
export const lessonDocument = (keyDistanceM = 1, paperY = 1) => ({
  schemaVersion: 1,
  stage: { widthM: 8, depthM: 6 },
  items: [
    { id: 'paper', kind: 'wall', label: 'Grey paper', surface: 'seamless', a: { x: 2, y: paperY }, b: { x: 6, y: paperY }, heightM: 2.7, colour: '#808080' },
    { id: 'sitter', kind: 'subject', label: 'Sitter', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 },
    { id: 'cam', kind: 'camera', x: 4, y: 5.6, heightM: 1.6, aimDeg: -90, iso: 100, aperture: 8, shutterS: 1 / 200 },
    { id: 'key', kind: 'light', label: 'Key', x: 4, y: 3 + keyDistanceM, heightM: 2.2, aimDeg: -90, tiltDeg: (-Math.atan2(0.6, keyDistanceM) * 180) / Math.PI, source: { type: 'strobe', energyWs: 400 }, power: 1 / 4, modifier: 'bare-reflector' },
  ],
  steps: [
    { id: 'room', title: 'The room', itemIds: ['paper', 'sitter', 'cam'] },
    { id: 'key-in', title: 'Key in', itemIds: ['key'] },
  ],
});

/** One light, background at least two stops under the subject. */
export const darkBackgroundCheck: Check = { criteria: [{ measure: 'lights', min: null, max: 1 }, { measure: 'background', min: null, max: -2 }] };

export type ClassWorld = { classId: string; joinCode: string; instructor: Signed; students: Signed[] };

export async function classWith(base: string, students = 1, name = 'Evening flash class'): Promise<ClassWorld> {
  const instructor = await fresh(base, 'Ada Instructor');
  const c = await instructor.client.post('/api/classes', { name });
  expect(c.status, JSON.stringify(c.body)).toBe(201);
  const joined: Signed[] = [];
  for (let k = 0; k < students; k++) {
    const s = await fresh(base, `Student${k + 1} Learner`);
    const j = await s.client.post('/api/classes/join', { code: c.body.joinCode });
    expect(j.status, JSON.stringify(j.body)).toBe(200);
    joined.push(s);
  }
  return { classId: c.body.id, joinCode: c.body.joinCode, instructor, students: joined };
}

/** A published lesson of one setup taken from the instructor's personal studio. */
export async function lessonWith(instructor: Client, classId: string, studioId: string, doc: unknown = lessonDocument()) {
  const setup = await newSetup(instructor, { studioId, title: 'One light, dark paper', document: doc });
  const l = await instructor.post(`/api/classes/${classId}/lessons`, { title: 'Falloff to the background' });
  expect(l.status, JSON.stringify(l.body)).toBe(201);
  const e = await instructor.post(`/api/lessons/${l.body.id}/setups`, { setupId: setup.id, note: 'Watch the paper go dark.' });
  expect(e.status, JSON.stringify(e.body)).toBe(201);
  const p = await instructor.request('PATCH', `/api/lessons/${l.body.id}`, { published: true });
  expect(p.status, JSON.stringify(p.body)).toBe(200);
  return { setup, lessonId: l.body.id as string, entryId: e.body.id as string };
}

export async function assignmentOn(instructor: Client, lessonId: string, body: Record<string, unknown> = {}) {
  const a = await instructor.post(`/api/lessons/${lessonId}/assignments`, { title: 'Dark paper, one light', brief: 'Keep the paper two stops under the face.', check: darkBackgroundCheck, ...body });
  expect(a.status, JSON.stringify(a.body)).toBe(201);
  return a.body.id as string;
}

export type InboxMail = { id: number; to: string[]; subject: string; text: string; html: string };
/** Mail to `to`, once it has arrived through the queue and settled (tests/api/exports.helpers.ts, settledMail). */
export async function inboxFor(base: string, to: string): Promise<InboxMail[]> {
  return settledMail(async () => {
    const r = await fetch(`${base}/dev/inbox.json`);
    const { messages } = (await r.json()) as { messages: InboxMail[] };
    return messages.filter((m) => m.to.includes(to));
  });
}
