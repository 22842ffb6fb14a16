// Starts the API and the web app on one origin. scripts/start.ts (npm start) and the tests call startServer.
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { pino } from 'pino';
import { createDb } from '../db/client';
import { createApp } from './app';
import { createAuth } from './auth';
import type { Inbox } from './fakes';
import { createMailer, type MailConfig } from './mail/mailer';
import { createObjectStore, storageConfigFromEnv, type StorageConfig } from './storage/objects';

/**
 * mail and storage: where e-mail and photos go (server/fakes.ts starts local stand-ins for both). Without
 * them the server reads SMTP_URL and S3_* from the environment; with neither, sending and photos answer 503.
 * inbox: the fake SMTP server's captured mail, shown at /dev/inbox outside production.
 */
export type StartOptions = {
  databaseUrl: string;
  port: number;
  host?: string;
  logLevel?: string;
  webDir?: string | null;
  mail?: MailConfig;
  storage?: StorageConfig;
  inbox?: Inbox;
};

export async function startServer(o: StartOptions) {
  const host = o.host ?? '127.0.0.1';
  const logger = pino({ level: o.logLevel ?? process.env.LOG_LEVEL ?? 'info' });
  const { db, pool } = createDb(o.databaseUrl);
  const server = createServer();
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(o.port, host, () => resolve());
  });
  // The real URL is known only once listening (the port may be 0 in tests); better-auth needs it.
  const port = (server.address() as AddressInfo).port;
  const url = process.env.PUBLIC_URL ?? `http://${host}:${port}`;
  const mailConfig = o.mail ?? (process.env.SMTP_URL ? { url: process.env.SMTP_URL } : undefined);
  const mailer = mailConfig ? createMailer(mailConfig) : undefined;
  const storageConfig = o.storage ?? (process.env.S3_ENDPOINT || process.env.S3_BUCKET ? storageConfigFromEnv() : undefined);
  const store = storageConfig ? createObjectStore(storageConfig) : undefined;
  const auth = createAuth(db, { baseURL: url, secret: process.env.AUTH_SECRET ?? 'falloff-local-development-secret-0123456789', mailer });
  const webDir = o.webDir === null ? undefined : (o.webDir ?? join(__dirname, '..', 'dist'));
  server.on('request', createApp({ db, auth, logger, webDir, mailer, store, inbox: o.inbox }));
  logger.info({ url }, 'falloff is listening');
  return {
    url,
    port,
    db,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
      mailer?.close();
      store?.close();
      await pool.end();
    },
  };
}

if (require.main === module) {
  startServer({ databaseUrl: process.env.DATABASE_URL ?? '', port: Number(process.env.PORT ?? 8080) }).catch((err) => {
    process.stderr.write(`${err?.stack ?? err}\n`);
    process.exit(1);
  });
}
