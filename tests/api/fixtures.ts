// Shared helpers for the API tests: demo and fresh users, studio membership through real invitations,
// setups and documents of a known size.
import { expect } from 'vitest';
import { DEMO_PASSWORD, DEMO_STUDIO, demoUsers, type DemoUserKey } from '../../db/demo';
import type { SetupDetail, StudioRole } from '../../model/api';
import { CURRENT_SCHEMA_VERSION, parseDocument, type SetupDocument } from '../../model/document';
import { Client, freshEmail } from '../support/http';

export type Signed = { client: Client; userId: string; email: string; personalStudioId: string };

async function whoAmI(client: Client, email: string): Promise<Signed> {
  const me = await client.get('/api/me');
  expect(me.status).toBe(200);
  return { client, userId: me.body.user.id, email, personalStudioId: me.body.studios.find((s: { personal: boolean }) => s.personal).id };
}

export async function demo(base: string, who: DemoUserKey): Promise<Signed> {
  const email = demoUsers[who].email;
  return whoAmI(await new Client(base).signIn(email, DEMO_PASSWORD), email);
}

export async function fresh(base: string, name = 'Fresh Tester'): Promise<Signed> {
  const email = freshEmail(name.split(' ')[0]!.toLowerCase());
  return whoAmI(await new Client(base).signUp(name, email, 'fresh-pass-123'), email);
}

export async function demoStudioId(c: Client): Promise<string> {
  const me = await c.get('/api/me');
  return me.body.studios.find((s: { name: string }) => s.name === DEMO_STUDIO).id;
}

/** The token at the end of an invitation link. */
export const tokenOf = (link: string) => link.slice(link.lastIndexOf('/') + 1);

/** A fresh user who joins `studioId` in `role` the real way: the owner invites, the invitee accepts the link. */
export async function joinAs(base: string, owner: Client, studioId: string, role: StudioRole, name = 'Joined Member'): Promise<Signed> {
  const u = await fresh(base, name);
  const inv = await owner.post(`/api/studios/${studioId}/members`, { email: u.email, role });
  expect(inv.status, JSON.stringify(inv.body)).toBe(201);
  const acc = await u.client.post(`/api/invitations/${tokenOf(inv.body.link)}/accept`);
  expect(acc.status, JSON.stringify(acc.body)).toBe(200);
  return u;
}

/** A shared studio owned by `owner`, with an editor and a crew member who joined by invitation. */
export async function studioWithTeam(base: string) {
  const owner = await fresh(base, 'Studio Owner');
  const s = await owner.client.post('/api/studios', { name: 'Test bench studio' });
  expect(s.status).toBe(201);
  const studioId: string = s.body.id;
  const editor = await joinAs(base, owner.client, studioId, 'editor', 'Team Editor');
  const crew = await joinAs(base, owner.client, studioId, 'crew', 'Team Crew');
  return { studioId, owner, editor, crew };
}

export async function newSetup(c: Client, body: Record<string, unknown>): Promise<SetupDetail> {
  const r = await c.post('/api/setups', body);
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return r.body;
}

/** A valid document (defaults filled in) with a subject, a key light and `notes` note items of `noteChars` characters. */
export function documentWith(notes: number, noteChars = 40, marker = ''): SetupDocument {
  const items: unknown[] = [
    { id: 'subj', kind: 'subject', label: 'Sitter', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 },
    { id: 'key', kind: 'light', label: 'Key', x: 3, y: 4, heightM: 2, aimDeg: -45, source: { type: 'strobe', energyWs: 400 }, power: 0.25, modifier: 'softbox' },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 4, y: 5.5, heightM: 1.5, aimDeg: -90, focalMm: 85, iso: 100, aperture: 8, shutterS: 1 / 160 },
  ];
  for (let i = 0; i < notes; i++) {
    items.push({ id: `n${i}`, kind: 'note', x: (i % 7) + 0.5, y: (i % 5) + 0.5, text: `${marker}${'x'.repeat(Math.max(0, noteChars - marker.length))}` });
  }
  return parseDocument({ schemaVersion: CURRENT_SCHEMA_VERSION, stage: { widthM: 8, depthM: 6 }, items, targetAperture: 8 });
}
