// Outside services that stop answering: object storage and SMTP that accept a connection and then say nothing
// must fail within seconds (a 503 for storage), never hang a request.
import { createServer, type Server, type Socket } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HttpError } from '../../server/errors';
import { createMailer, SMTP_TIMEOUT_MS } from '../../server/mail/mailer';
import { createObjectStore, S3_TIMEOUT_MS } from '../../server/storage/objects';

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
