// Outside services that stop answering: object storage and SMTP that accept a connection and then say nothing
// must fail within seconds (a 503 for storage), never hang a request — every storage call (put, get, remove,
// list), and the photo routes over real HTTP on an app whose storage is silent.
import { createServer as createHttpServer } from 'node:http';
import { createServer, type Server, type Socket } from 'node:net';
import { pino } from 'pino';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createDb } from '../../db/client';
import { demoSetups } from '../../db/seed-setups';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { LOCAL_SECRET } from '../../server/config';
import { HttpError } from '../../server/errors';
import { createMailer, SMTP_TIMEOUT_MS } from '../../server/mail/mailer';
import { createObjectStore, S3_TIMEOUT_MS } from '../../server/storage/objects';
import { TEST_DATABASE_URL } from '../support/env';
import { raw } from './exports.helpers';
import { newSetup, studioWithTeam } from './fixtures';

let silent: Server;
let port = 0;
const sockets: Socket[] = [];

beforeAll(async () => {
  // Accepts every connection, reads what it is sent, answers nothing.
  silent = createServer((s) => {
    sockets.push(s);
    s.on('data', () => undefined);
    s.on('error', () => undefined);
  });
  await new Promise<void>((r) => silent.listen(0, '127.0.0.1', r));
  port = (silent.address() as { port: number }).port;
});
afterAll(async () => {
  for (const s of sockets) s.destroy();
  await new Promise((r) => silent.close(r));
});

describe('a silent object store', () => {
  it('fails a put and a get with a 503 within seconds', async () => {
    const store = createObjectStore({ endpoint: `http://127.0.0.1:${port}`, region: 'us-east-1', bucket: 'b', accessKeyId: 'k', secretAccessKey: 's', forcePathStyle: true });
    for (const call of [() => store.put('a/b.jpg', Buffer.from('x'), 'image/jpeg'), () => store.get('a/b.jpg')]) {
      const t0 = Date.now();
      const err = await call().then(() => null, (e: unknown) => e);
      const took = Date.now() - t0;
      expect(err).toBeInstanceOf(HttpError);
      expect((err as HttpError).status).toBe(503);
      expect(took).toBeLessThan(S3_TIMEOUT_MS + 4000);
    }
    store.close();
  }, 60_000);

  it('fails a delete and a listing with a 503 too (each call settles; a hang would run into the test timeout)', async () => {
    const store = createObjectStore({ endpoint: `http://127.0.0.1:${port}`, region: 'us-east-1', bucket: 'b', accessKeyId: 'k', secretAccessKey: 's', forcePathStyle: true });
    for (const call of [() => store.remove(['a/b.jpg', 'a/c.jpg']), () => store.list('a/')]) {
      const err = await call().then(() => null, (e: unknown) => e);
      expect(err).toBeInstanceOf(HttpError);
      expect(err).toMatchObject({ status: 503, code: 'storage_unavailable' });
    }
    store.close();
  }, 60_000);
});

describe('the photo routes on an app whose object storage does not answer', () => {
  const base = inject('baseUrl');
  const app = createHttpServer();
  const { db, pool } = createDb(TEST_DATABASE_URL);
  pool.on('error', () => undefined);
  let url = '';
  beforeAll(async () => {
    await new Promise<void>((r) => app.listen(0, '127.0.0.1', r));
    url = `http://127.0.0.1:${(app.address() as { port: number }).port}`;
    // The test server's secret (local default), so a session made there is good here too.
    const auth = createAuth(db, { baseURL: url, secret: LOCAL_SECRET });
    const store = createObjectStore({ endpoint: `http://127.0.0.1:${port}`, region: 'us-east-1', bucket: 'falloff-photos', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true });
    app.on('request', createApp({ db, auth, logger: pino({ level: 'silent' }), store, publicUrl: url }));
  });
  afterAll(async () => {
    app.closeAllConnections();
    await new Promise((r) => app.close(r));
    await pool.end();
  });

  it('an upload, a photo read and a delete answer 503 storage_unavailable, not a hang', async () => {
    const team = await studioWithTeam(base);
    const setupId = (await newSetup(team.owner.client, { studioId: team.studioId, title: 'Storage away', document: demoSetups[0]!.document })).id;
    const png = await sharp({ create: { width: 200, height: 150, channels: 3, background: '#445566' } }).png().toBuffer();
    const form = () => {
      const f = new FormData();
      f.append('kind', 'result');
      f.append('photo', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'set.png');
      return f;
    };
    // Stored through the test server (its storage answers), read and deleted through the silent one.
    const kept = await raw(base, team.owner.client, `/api/setups/${setupId}/photos`, { method: 'POST', body: form() });
    expect(kept.status, kept.body.toString()).toBe(201);

    const up = await raw(url, team.owner.client, `/api/setups/${setupId}/photos`, { method: 'POST', body: form() });
    const read = await raw(url, team.owner.client, kept.json.url);
    const thumb = await raw(url, team.owner.client, kept.json.thumbnailUrl);
    const del = await raw(url, team.owner.client, kept.json.url, { method: 'DELETE' });
    for (const [what, r] of Object.entries({ up, read, thumb, del })) {
      expect(r.status, `${what}: ${r.body.toString().slice(0, 300)}`).toBe(503);
      expect(r.json.error.code, what).toBe('storage_unavailable');
      // A client is told when to try again, in the header and in the body.
      expect(r.retryAfter, what).toMatch(/^[1-9]\d*$/);
      expect(r.json.error.retryAfterS, what).toBe(Number(r.retryAfter));
    }
    // Nothing was lost on the way: the photo is still listed and still served where storage answers.
    expect((await raw(base, team.owner.client, kept.json.url)).status).toBe(200);
    expect((await team.owner.client.get(`/api/setups/${setupId}/photos`)).body.photos).toHaveLength(1);
  }, 90_000);
});

describe('a silent mail server', () => {
  it('fails a send within seconds', async () => {
    const mailer = createMailer({ host: '127.0.0.1', port });
    const t0 = Date.now();
    const err = await mailer.send({ to: 'a@example.test', subject: 's', text: 't', html: '<p>t</p>' }).then(() => null, (e: unknown) => e);
    expect(err).toBeInstanceOf(Error);
    expect(Date.now() - t0).toBeLessThan(SMTP_TIMEOUT_MS * 2 + 4000);
    mailer.close();
  }, 60_000);
});
