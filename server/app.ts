// The one Express app: better-auth at /api/auth/*, the JSON API at /api/*, and the built web app.
import compression from 'compression';
import express from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import { toNodeHandler } from 'better-auth/node';
import type { Db } from '../db/client';
import type { Auth } from './auth';
import { apiNotFound, errorHandler } from './errors';
import type { Inbox } from './fakes';
import type { Mailer } from './mail/mailer';
import { assignmentRoutes } from './routes/assignments';
import { classRoutes } from './routes/classes';
import { commentRoutes } from './routes/comments';
import { devInboxRoutes } from './routes/devInbox';
import { exportRoutes } from './routes/exports';
import { healthRoutes } from './routes/health';
import { historyRoutes } from './routes/history';
import { invitationRoutes, publicInvitationRoutes, rememberInvitation } from './routes/invitations';
import { lessonRoutes } from './routes/lessons';
import { mailRoutes } from './routes/mail';
import { meRoutes } from './routes/me';
import { meterRoutes } from './routes/meter';
import { photoRoutes } from './routes/photos';
import { shareRoutes, sharedRoutes } from './routes/shares';
import { setupRoutes } from './routes/setups';
import { studioRoutes } from './routes/studios';
import { submissionRoutes } from './routes/submissions';
import { forgetSession, requireUser } from './session';
import type { ObjectStore } from './storage/objects';

/** mailer and store are optional: without them the routes that need them answer 503 (the route list stays the same).
 *  inbox: the local fake SMTP server's captured mail, served at /dev/inbox outside production. */
export type AppDeps = { db: Db; auth: Auth; logger: Logger; webDir?: string; mailer?: Mailer; store?: ObjectStore; inbox?: Inbox };

export const BODY_LIMIT = '1mb';

export function createApp({ db, auth, logger, webDir, mailer, store, inbox }: AppDeps) {
  const app = express();
  app.disable('x-powered-by');
  // No ETag on API answers: clients revalidate by setup version, not by hashing ~50 KB bodies per request.
  // (Static files keep theirs: express.static computes its own.)
  app.set('etag', false);
  app.set('trust proxy', 'loopback');
  app.use(pinoHttp({ logger, autoLogging: { ignore: (req) => !req.url?.startsWith('/api/') } }));
  // The web bundle is a few megabytes; gzip makes it about a quarter on a phone's connection.
  app.use(compression());
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Expo's web build inlines a small bootstrap and style tags; react-native-web sets inline styles.
          'script-src': ["'self'", "'unsafe-inline'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
        },
      },
    }),
  );

  // better-auth reads its own body, so it is mounted before the JSON parser. A sign-out also leaves our
  // session cache (server/session.ts).
  app.post('/api/auth/sign-out', forgetSession);
  app.all('/api/auth/{*any}', toNodeHandler(auth));

  app.use('/api', express.json({ limit: BODY_LIMIT }));
  app.use('/api', healthRoutes(db));
  app.use('/api', publicInvitationRoutes(db));
  app.use('/api', sharedRoutes(db));
  app.use('/api', requireUser(auth));
  app.use('/api', meRoutes(db));
  app.use('/api', setupRoutes(db));
  app.use('/api', historyRoutes(db));
  app.use('/api', commentRoutes(db));
  app.use('/api', meterRoutes(db));
  app.use('/api', studioRoutes(db, mailer));
  app.use('/api', invitationRoutes(db));
  app.use('/api', classRoutes(db, mailer));
  app.use('/api', lessonRoutes(db, mailer));
  app.use('/api', assignmentRoutes(db, mailer));
  app.use('/api', submissionRoutes(db, mailer));
  app.use('/api', exportRoutes(db));
  app.use('/api', shareRoutes(db));
  app.use('/api', mailRoutes(db, mailer));
  app.use('/api', photoRoutes(db, store));
  app.use('/api', apiNotFound);
  if (inbox && process.env.NODE_ENV !== 'production') app.use('/dev', devInboxRoutes(inbox));

  if (webDir && existsSync(join(webDir, 'index.html'))) {
    // An invitation link opened signed out: remember its token through sign-up (see routes/invitations.ts).
    app.get('/studios/join/:token', rememberInvitation);
    app.use(express.static(webDir, { index: false, maxAge: '1h' }));
    // A single-page app: every other path is the app, which routes on the client.
    app.get('/{*any}', (_req, res) => res.sendFile(join(webDir, 'index.html')));
  }

  app.use(errorHandler);
  return app;
}
