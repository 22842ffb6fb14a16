// Starts the API and the web app on one origin. scripts/start.ts (npm start) and the tests call startServer.
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { pino } from 'pino';
import { createDb } from '../db/client';
import { createApp } from './app';
import { createAuth } from './auth';

export type StartOptions = { databaseUrl: string; port: number; host?: string; logLevel?: string; webDir?: string | null };

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
  const auth = createAuth(db, { baseURL: url, secret: process.env.AUTH_SECRET ?? 'falloff-local-development-secret-0123456789' });
  const webDir = o.webDir === null ? undefined : (o.webDir ?? join(__dirname, '..', 'dist'));
  server.on('request', createApp({ db, auth, logger, webDir }));
  logger.info({ url }, 'falloff is listening');
  return {
    url,
    port,
    db,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
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
