// Saving safely at the same time: of two saves from one version exactly one wins and the other gets 409
// with the winner's copy; under 200 saves from 10 clients at once, every acknowledged save is in history
// with what that client sent, and the version numbers have no holes or doubles.
import { describe, expect, inject, it } from 'vitest';
import { Client } from '../support/http';
import { FRESH_PASSWORD, documentWith, newSetup, studioWithTeam } from './fixtures';

const base = inject('baseUrl');

describe('two clients save from the same version', () => {
  it('exactly one succeeds and the other gets 409 with the stored copy — every time, over 25 rounds', async () => {
    const team = await studioWithTeam(base);
    const s = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Race' });
    let version = s.version;
    for (let round = 0; round < 25; round++) {
      const docs = [documentWith(1, 20, `owner-${round}-`), documentWith(1, 20, `editor-${round}-`)];
      const [a, b] = await Promise.all([
        team.owner.client.put(`/api/setups/${s.id}`, { version, title: `owner ${round}`, document: docs[0] }),
        team.editor.client.put(`/api/setups/${s.id}`, { version, title: `editor ${round}`, document: docs[1] }),
      ]);
      expect([a.status, b.status].sort()).toEqual([200, 409]);
      const [won, lost, wonDoc] = a.status === 200 ? [a, b, docs[0]] : [b, a, docs[1]];
      expect(won.body.version).toBe(version + 1);
      expect(lost.body.error.code).toBe('version_conflict');
      expect(lost.body.error.current).toMatchObject({ id: s.id, version: version + 1, title: won.body.title });
      expect(lost.body.error.current.document).toEqual(wonDoc);
      version += 1;
    }
    const stored = await team.owner.client.get(`/api/setups/${s.id}`);
    expect(stored.body.version).toBe(version);
  });
});

describe('200 concurrent saves from 10 clients', () => {
  it('loses none: every acknowledged save is in history with its own content', async () => {
    const team = await studioWithTeam(base);
    const s = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Crowd' });
    // Ten sessions: five for the owner, five for the editor (two devices each is common; here more).
    const clients: Client[] = [];
    for (let i = 0; i < 10; i++) {
      const who = i % 2 ? team.editor : team.owner;
      clients.push(await new Client(base).signIn(who.email, FRESH_PASSWORD));
    }

    const acknowledged: { version: number; marker: string }[] = [];
    let conflicts = 0;
    async function saver(c: Client, ci: number) {
      let version = s.version;
      for (let n = 0; n < 20; n++) {
        const marker = `c${ci}-n${n}`;
        for (;;) {
          const r = await c.put(`/api/setups/${s.id}`, { version, title: marker, document: documentWith(2, 30, `${marker}-`) });
          if (r.status === 200) {
            acknowledged.push({ version: r.body.version, marker });
            version = r.body.version;
            break;
          }
          expect(r.status, JSON.stringify(r.body)).toBe(409);
          conflicts++;
          version = r.body.error.current.version; // rebase on the stored copy and try again
        }
      }
    }
    await Promise.all(clients.map(saver));

    expect(acknowledged).toHaveLength(200);
    expect(conflicts).toBeGreaterThan(0); // they really did collide
    const versions = acknowledged.map((a) => a.version).sort((x, y) => x - y);
    expect(versions).toEqual(Array.from({ length: 200 }, (_, i) => s.version + 1 + i));

    const history: { id: string; version: number; title: string }[] = [];
    let before: number | null = null;
    do {
      const page: { body: { versions: typeof history; nextBefore: number | null } } = await team.owner.client.get(`/api/setups/${s.id}/history?limit=100${before ? `&before=${before}` : ''}`);
      history.push(...page.body.versions);
      before = page.body.nextBefore;
    } while (before);
    const byVersion = new Map(history.map((h) => [h.version, h]));
    for (const a of acknowledged) expect(byVersion.get(a.version)?.title, `version ${a.version}`).toBe(a.marker);

    // The documents too, not only the titles: read back every acknowledged version.
    // Ten at a time, as a person's browser would (not 200 at once through one session).
    const docs: { status: number; body: { document?: unknown } }[] = [];
    for (let i = 0; i < acknowledged.length; i += 10) {
      docs.push(...(await Promise.all(acknowledged.slice(i, i + 10).map((a) => team.owner.client.get(`/api/setups/${s.id}/history/${byVersion.get(a.version)!.id}`)))));
    }
    docs.forEach((d, i) => {
      expect(d.status, `${acknowledged[i]!.marker}: ${JSON.stringify(d.body).slice(0, 200)}`).toBe(200);
      expect(d.body.document, acknowledged[i]!.marker).toEqual(documentWith(2, 30, `${acknowledged[i]!.marker}-`));
    });

    const last = acknowledged.reduce((m, a) => (a.version > m.version ? a : m));
    const stored = await team.owner.client.get(`/api/setups/${s.id}`);
    expect(stored.body).toMatchObject({ version: last.version, title: last.marker });
  }, 300_000);
});
