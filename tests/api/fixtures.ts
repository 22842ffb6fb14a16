// Shared helpers for the API tests: fresh users, studio membership through real invitations, setups and
// documents of a known size.
import { expect } from 'vitest';
import { createDb } from '../../db/client';
import { addOperator } from '../../db/operators';
import type { SetupDetail, StudioRole } from '../../model/api';
import { TEST_DATABASE_URL } from '../support/env';
import { Client, freshEmail } from '../support/http';

export type Signed = { client: Client; userId: string; email: string; personalStudioId: string };

async function whoAmI(client: Client, email: string): Promise<Signed> {
  const me = await client.get('/api/me');
  expect(me.status).toBe(200);
  return { client, userId: me.body.user.id, email, personalStudioId: me.body.studios.find((s: { personal: boolean }) => s.personal).id };
}

export const FRESH_PASSWORD = 'fresh-pass-123';

export async function fresh(base: string, name = 'Fresh Tester'): Promise<Signed> {
  const email = freshEmail(name.split(' ')[0]!.toLowerCase());
  return whoAmI(await new Client(base).signUp(name, email, FRESH_PASSWORD), email);
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

/** Make an existing account an operator, as `npm run operator -- add <email>` does. */
export async function makeOperator(email: string) {
  const { db, pool } = createDb(TEST_DATABASE_URL);
  try {
    expect(await addOperator(db, email)).toBe('added');
  } finally {
    await pool.end();
  }
}

const operators = new Map<string, Promise<Signed>>();
/** A fresh account made an operator (one per server address in a test file). */
export function operator(base: string): Promise<Signed> {
  let o = operators.get(base);
  if (!o) {
    o = fresh(base, 'Site Operator').then(async (u) => (await makeOperator(u.email), u));
    operators.set(base, o);
  }
  return o;
}

/** An operator puts the setup in the gallery for everyone. */
export async function publishForEveryone(base: string, setupId: string) {
  const r = await (await operator(base)).client.put(`/api/setups/${setupId}/everyone`, { forEveryone: true });
  expect(r.status, JSON.stringify(r.body)).toBe(200);
}

export { documentWith } from './documents';
