// Starts the API and the web app on one origin. scripts/start.ts (npm start) and the tests call startServer.
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { pino } from 'pino';
import { createDb } from '../db/client';
import { createApp } from './app';
import { authConfig } from './config';
import { createAuth } from './auth';
import { loggerOptions } from './logging';
import type { Inbox } from './fakes';
import { createLimits, type LimitName, type LimitRule } from './limits';
import { createMailer, type MailConfig } from './mail/mailer';
import { startCommentNotices } from './mail/commentNotices';
import { startMailQueue } from './mail/queue';
import { createObjectStore, storageConfigFromEnv, type StorageConfig } from './storage/objects';

/**
 * mail and storage: where e-mail and photos go (server/fakes.ts starts local stand-ins for both). Without
 * them the server reads SMTP_URL and S3_* from the environment; with neither, sending and photos answer 503.
 * inbox: the fake SMTP server's captured mail, shown at /dev/inbox on a local machine (server/app.ts, devInboxAllowed).
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
  /** Changes to the shared rate limits (server/limits.ts), e.g. for a benchmark that exports in bulk. */
  limits?: Partial<Record<LimitName, Partial<LimitRule>>>;
};

export async function startServer(o: StartOptions) {
  const host = o.host ?? '127.0.0.1';
  // Before anything starts: outside local development AUTH_SECRET and PUBLIC_URL are required.
  const config = authConfig(process.env, host);
  // Log lines are written by a background flush, not on the request's turn (flushed again on close); cookies and
  // tokens are redacted (loggerOptions).
  const destination = pino.destination({ sync: false, minLength: 4096 });
  const logger = pino(loggerOptions(o.logLevel ?? process.env.LOG_LEVEL ?? 'info'), destination);
  // A connection PostgreSQL ends (a restart, a failover) is logged; the pool reconnects on the next query.
  const { db, pool } = createDb(o.databaseUrl, { onError: (err) => logger.warn({ err: { message: err.message, code: (err as { code?: string }).code } }, 'database connection lost') });
  const server = createServer();
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(o.port, host, () => resolve());
  });
  // The real URL is known only once listening (the port may be 0 in tests); better-auth needs it.
  const port = (server.address() as AddressInfo).port;
  const url = config.publicUrl ?? `http://${host}:${port}`;
  const mailConfig = o.mail ?? (process.env.SMTP_URL ? { url: process.env.SMTP_URL } : undefined);
  const smtp = mailConfig ? createMailer(mailConfig) : undefined;
  // The app sends through the durable queue in PostgreSQL; its worker delivers over SMTP with retries.
  const mailer = smtp ? await startMailQueue({ databaseUrl: o.databaseUrl, smtp, logger, domain: new URL(url).hostname }) : undefined;
  // Comment digests wait in the same queue's tables (a restart loses none).
  const notices = mailer ? await startCommentNotices({ db, queue: mailer, logger }) : undefined;
  const storageConfig = o.storage ?? (process.env.S3_ENDPOINT || process.env.S3_BUCKET ? storageConfigFromEnv() : undefined);
  const store = storageConfig ? createObjectStore(storageConfig) : undefined;
  const auth = createAuth(db, { baseURL: url, secret: config.secret, mailer });
  const webDir = o.webDir === null ? undefined : (o.webDir ?? join(__dirname, '..', 'dist'));
  const limits = createLimits(db, o.limits);
  server.on('request', createApp({ db, auth, logger, limits, webDir, mailer, notices, store, inbox: o.inbox, publicUrl: url }));
  logger.info({ url }, 'falloff is listening');
  return {
    url,
    port,
    db,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
      await mailer?.stop();
      smtp?.close();
      store?.close();
      await pool.end();
      destination.flushSync();
    },
  };
}

// Run directly (`npm run dev` watches this file); not when bundled into dist-server/start.cjs.
if (require.main === module && __filename.endsWith('main.ts')) {
  startServer({ databaseUrl: process.env.DATABASE_URL ?? '', port: Number(process.env.PORT ?? 8080) }).catch((err) => {
    process.stderr.write(`${err?.stack ?? err}\n`);
    process.exit(1);
  });
}
