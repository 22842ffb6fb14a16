// Local stand-ins for the outside services, started by `npm start` and by the tests on free loopback ports:
// an SMTP server that keeps every message it is sent (read back at /dev/inbox), and an S3-compatible object
// store writing under a directory. The app talks to them through the same clients it would use in production.
import S3rver from '@20minutes/s3rver';
import { simpleParser } from 'mailparser';
import { mkdirSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';

type CapturedMail = {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  attachments: { filename: string; contentType: string; size: number; content: Buffer }[];
};
export type Inbox = { list: () => CapturedMail[]; clear: () => void };
export type Fakes = {
  /** stop/start: take the fake mail server away and bring it back on the same port (fault tests). */
  smtp: { host: string; port: number; stop: () => Promise<void>; start: () => Promise<void> };
  s3: { endpoint: string; bucket: string };
  inbox: Inbox;
  close: () => Promise<void>;
};

const HOST = '127.0.0.1';
const KEEP = 500;

function startSmtp(port = 0, mails: CapturedMail[] = [], counter = { next: 1 }): Promise<{ server: SMTPServer; port: number; inbox: Inbox; mails: CapturedMail[]; counter: { next: number } }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 30 * 1024 * 1024,
    onData(stream, session, done) {
      simpleParser(stream)
        .then((m) => {
          const to = session.envelope.rcptTo.map((r) => r.address);
          mails.push({
            id: counter.next++,
            receivedAt: new Date().toISOString(),
            from: m.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            to,
            subject: m.subject ?? '',
            text: m.text ?? '',
            html: typeof m.html === 'string' ? m.html : '',
            attachments: m.attachments.map((a) => ({ filename: a.filename ?? 'attachment', contentType: a.contentType, size: a.size, content: a.content })),
          });
          if (mails.length > KEEP) mails.shift();
          done();
        })
        .catch(done);
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, HOST, () => {
      // smtp-server re-emits every connection's socket error (a client that drops mid-message: ECONNRESET) as
      // an 'error' on the server. The listen's one-off listener above swallowed the first and the second ended
      // the process; a dropped client is that client's business, so they are ignored from here on.
      server.off('error', reject);
      server.on('error', () => undefined);
      const bound = (server.server.address() as AddressInfo).port;
      resolve({ server, port: bound, mails, counter, inbox: { list: () => [...mails], clear: () => void mails.splice(0) } });
    });
  });
}

/** Start both fakes; `s3Dir` is where the object store keeps its files (.data/s3 for npm start, a temp dir in tests). */
export async function startFakes(o: { s3Dir: string; bucket?: string }): Promise<Fakes> {
  const bucket = o.bucket ?? 'falloff-photos';
  mkdirSync(o.s3Dir, { recursive: true });
  let smtp = await startSmtp();
  let smtpUp = true;
  const stopSmtp = async () => {
    if (!smtpUp) return;
    smtpUp = false;
    await new Promise<void>((r) => smtp.server.close(() => r()));
  };
  // The fake checks request signatures its own way, which disagrees with the current SDK's on listing and
  // batch delete; it is a loopback stand-in, so it does not insist (real storage checks them).
  const s3 = new S3rver({ address: HOST, port: 0, silent: true, directory: o.s3Dir, allowMismatchedSignatures: true, configureBuckets: [{ name: bucket, configs: [] }] });
  const addr = (await s3.run()) as AddressInfo;
  return {
    smtp: {
      host: HOST,
      port: smtp.port,
      stop: stopSmtp,
      async start() {
        if (smtpUp) return;
        smtp = await startSmtp(smtp.port, smtp.mails, smtp.counter);
        smtpUp = true;
      },
    },
    s3: { endpoint: `http://${HOST}:${addr.port}`, bucket },
    inbox: smtp.inbox,
    async close() {
      await stopSmtp();
      (s3 as unknown as { httpServer?: { closeAllConnections(): void } }).httpServer?.closeAllConnections();
      await s3.close();
    },
  };
}

/** What startServer needs to use the fakes (environment variables do not override them). */
export function fakeServices(f: Fakes) {
  return {
    mail: { host: f.smtp.host, port: f.smtp.port },
    storage: { endpoint: f.s3.endpoint, region: 'us-east-1', bucket: f.s3.bucket, accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true },
    inbox: f.inbox,
  };
}
