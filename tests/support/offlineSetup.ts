// What the offline e2e tests share: a small setup (subject, one key at x = 3, camera) made through the API, the
// key's x as stored in PostgreSQL (so a test sees what reached the server, not what the page shows), and signing
// a browser context in as a demo user through the API.
import pg from 'pg';
import type { BrowserContext } from 'playwright-core';
import { afterAll, expect } from 'vitest';
import { DEMO_PASSWORD, demoUsers } from '../../db/demo';
import { TEST_DATABASE_URL } from './env';

export const offlineDoc = {
  schemaVersion: 1,
  stage: { widthM: 6, depthM: 5 },
  items: [
    { id: 'sub', kind: 'subject', x: 3, y: 2, facingDeg: 90 },
    { id: 'key', kind: 'light', x: 3, y: 3.2, aimDeg: -90, source: { type: 'strobe', energyWs: 400 } },
    { id: 'cam', kind: 'camera', x: 3, y: 4.5, aimDeg: -90 },
  ],
};

/** The stored key's x, read by a connection of the test's own (closed after the file's tests). */
export function storedKeyReader(): (setupId: string) => Promise<number> {
  const db = new pg.Client({ connectionString: TEST_DATABASE_URL });
  let open: Promise<unknown> | null = null;
  afterAll(async () => {
    if (open) await db.end();
  });
  return async (id) => {
    open ??= db.connect();
    await open;
    const r = await db.query<{ document: { items: { id: string; x: number }[] } }>('select document from setups where id = $1', [id]);
    return r.rows[0]!.document.items.find((i) => i.id === 'key')!.x;
  };
}

/** Sign the context in as a demo user (its cookie then serves every page it opens). */
export async function signInAs(base: string, ctx: BrowserContext, who: keyof typeof demoUsers): Promise<void> {
  const r = await ctx.request.post(`${base}/api/auth/sign-in/email`, { data: { email: demoUsers[who].email, password: DEMO_PASSWORD }, headers: { origin: base } });
  expect(r.status()).toBe(200);
}

/** A new setup of the small document in the signed-in person's (non-personal) studio; returns its id. */
export async function newOfflineSetup(base: string, ctx: BrowserContext, title: string): Promise<string> {
  const me = await (await ctx.request.get(`${base}/api/me`)).json();
  const studioId = me.studios.find((s: { personal: boolean }) => !s.personal).id;
  const made = await ctx.request.post(`${base}/api/setups`, { data: { studioId, title, document: offlineDoc }, headers: { origin: base } });
  expect(made.status()).toBe(201);
  return ((await made.json()) as { id: string }).id;
}
