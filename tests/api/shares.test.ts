// Read-only share links: made by owners and editors, opened by anyone holding the link (no session) with the
// crew sheet downloads, listed to the studio without their tokens, and dead from the moment they are revoked.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { demoSetups } from '../../db/seed-setups';
import { createDb } from '../../db/client';
import { hashShareToken } from '../../db/shares';
import { setupShares } from '../../db/schema';
import { eq } from 'drizzle-orm';
import { TEST_DATABASE_URL } from '../support/env';
import { Client } from '../support/http';
import { pdfText, raw } from './exports.helpers';
import { newSetup, studioWithTeam } from './fixtures';

const base = inject('baseUrl');
const teal = demoSetups.find((s) => s.title.startsWith('Teal'))!.document;
let team: Awaited<ReturnType<typeof studioWithTeam>>;
let setupId: string;

beforeAll(async () => {
  team = await studioWithTeam(base);
  setupId = (await newSetup(team.owner.client, { studioId: team.studioId, title: 'Shared teal portrait', document: teal })).id;
});

describe('share links', () => {
  it('opens read-only for someone with no account, with the crew sheet, PNG and SVG', async () => {
    const made = await team.editor.client.post(`/api/setups/${setupId}/shares`, { label: 'For the assistants' });
    expect(made.status).toBe(201);
    const { token, url } = made.body;
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 random bytes
    expect(url).toBe(`${base}/s/${token}`);

    const stranger = new Client(base); // no cookies at all
    const r = await stranger.get(`/api/shared/${token}`);
    expect(r.status).toBe(200);
    expect(r.headers.get('cache-control')).toBe('no-store');
    expect(r.body).toMatchObject({ title: 'Shared teal portrait', studioName: 'Test bench studio', units: 'metric', paper: 'a4' });
    expect(r.body.document.items.map((i: { id: string }) => i.id)).toContain('key');
    expect(r.body).not.toHaveProperty('studioId');

    const pdf = await raw(base, null, `/api/shared/${token}/crew-sheet.pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.body.subarray(0, 5).toString()).toBe('%PDF-');
    const { text } = await pdfText(pdf.body);
    expect(text).toContain('Key — warm softbox');
    expect(text).toContain(url); // the footer carries the link
    const png = await raw(base, null, `/api/shared/${token}/plan.png?width=800`);
    expect(png.status).toBe(200);
    expect(png.type).toBe('image/png');
    const svg = await raw(base, null, `/api/shared/${token}/plan.svg`);
    expect(svg.status).toBe(200);
    expect(svg.body.toString()).toContain('<svg ');
  });

  it('stores only a hash of the token', async () => {
    const { token } = (await team.owner.client.post(`/api/setups/${setupId}/shares`, {})).body;
    const { db, pool } = createDb(TEST_DATABASE_URL);
    try {
      const rows = await db.select().from(setupShares).where(eq(setupShares.tokenHash, hashShareToken(token)));
      expect(rows).toHaveLength(1);
      expect(JSON.stringify(rows[0])).not.toContain(token);
    } finally {
      await pool.end();
    }
  });

  it('is listed to every member without its token, and revoking it ends it at once', async () => {
    const made = (await team.owner.client.post(`/api/setups/${setupId}/shares`, { label: 'Revoke me' })).body;
    const list = await team.crew.client.get(`/api/setups/${setupId}/shares`);
    expect(list.status).toBe(200);
    const row = list.body.shares.find((s: { id: string }) => s.id === made.share.id);
    expect(row).toMatchObject({ label: 'Revoke me', tokenTail: made.token.slice(-4), createdBy: 'Studio Owner' });
    expect(JSON.stringify(list.body)).not.toContain(made.token);

    expect((await new Client(base).get(`/api/shared/${made.token}`)).status).toBe(200);
    expect((await team.crew.client.del(`/api/setups/${setupId}/shares/${made.share.id}`)).status).toBe(403);
    expect((await team.editor.client.del(`/api/setups/${setupId}/shares/${made.share.id}`)).status).toBe(204);
    for (const path of ['', '/crew-sheet.pdf', '/plan.png', '/plan.svg']) {
      const r = await new Client(base).get(`/api/shared/${made.token}${path}`);
      expect(r.status, path).toBe(404);
      expect(r.body.error.code).toBe('not_found');
    }
    expect((await team.owner.client.get(`/api/setups/${setupId}/shares`)).body.shares.map((s: { id: string }) => s.id)).not.toContain(made.share.id);
    expect((await team.editor.client.del(`/api/setups/${setupId}/shares/${made.share.id}`)).status).toBe(404);
  });

  it('gives 404 for an unknown or malformed token, and for the link of a deleted setup', async () => {
    for (const t of ['x'.repeat(43), 'short', '%00', 'a'.repeat(500)]) expect((await new Client(base).get(`/api/shared/${t}`)).status, t).toBe(404);
    const s = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Soon deleted', document: teal });
    const { token } = (await team.owner.client.post(`/api/setups/${s.id}/shares`, {})).body;
    expect((await new Client(base).get(`/api/shared/${token}`)).status).toBe(200);
    expect((await team.owner.client.del(`/api/setups/${s.id}`)).status).toBe(204);
    expect((await new Client(base).get(`/api/shared/${token}`)).status).toBe(404);
    expect((await team.owner.client.post(`/api/setups/${s.id}/restore`)).status).toBe(200);
    expect((await new Client(base).get(`/api/shared/${token}`)).status).toBe(200);
  });

  it('shows the setup as saved now (the link follows the setup, it is not a snapshot)', async () => {
    const { token } = (await team.owner.client.post(`/api/setups/${setupId}/shares`, {})).body;
    const cur = await team.owner.client.get(`/api/setups/${setupId}`);
    expect((await team.owner.client.put(`/api/setups/${setupId}`, { version: cur.body.version, title: 'Shared teal portrait, take two' })).status).toBe(200);
    expect((await new Client(base).get(`/api/shared/${token}`)).body.title).toBe('Shared teal portrait, take two');
    await team.owner.client.put(`/api/setups/${setupId}`, { version: cur.body.version + 1, title: 'Shared teal portrait' });
  });

  it('validates the label', async () => {
    const r = await team.owner.client.post(`/api/setups/${setupId}/shares`, { label: 'x'.repeat(81) });
    expect(r.status).toBe(400);
    expect(r.body.error.fields).toHaveProperty('label');
    expect((await team.owner.client.post(`/api/setups/${setupId}/shares`, { token: 'mine' })).body.error.fields).toHaveProperty('token');
  });
});
