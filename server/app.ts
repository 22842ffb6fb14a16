// The one Express app: better-auth at /api/auth/*, the JSON API at /api/*, and the built web app.
import compression from 'compression';
import express, { type RequestHandler } from 'express';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import type { Db } from '../db/client';
import type { Auth } from './auth';
import { apiNotFound, errorHandler } from './errors';
import { redactUrl } from './logging';
import { requireSameOrigin, trustedOrigins } from './origin';
import type { Inbox } from './fakes';
import type { CommentNotices } from './mail/commentNotices';
import type { Mailer } from './mail/mailer';
import { assignmentRoutes } from './routes/assignments';
import { classRoutes } from './routes/classes';
import { commentRoutes } from './routes/comments';
import { devInboxRoutes } from './routes/devInbox';
import { daySheetRoutes, exportRoutes } from './routes/exports';
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
import { createLimits, type LimitName, type Limits } from './limits';
import { authHandler, requireUser } from './session';
import type { ObjectStore } from './storage/objects';
import { appPage, securityHeaders, webFiles } from './web';

/** mailer and store are optional: without them the routes that need them answer 503 (the route list stays the same).
 *  inbox: the local fake SMTP server's captured mail, served at /dev/inbox on a local machine.
 *  notices: e-mail digests of new comments (server/mail/commentNotices.ts; none without a mail queue). */
export type AppDeps = { db: Db; auth: Auth; logger: Logger; limits?: Limits; webDir?: string; mailer?: Mailer; notices?: CommentNotices; store?: ObjectStore; inbox?: Inbox; publicUrl?: string };

/** The fake SMTP server's inbox is shown only on a local machine: it is handed over only when the fake runs
 *  (no SMTP_URL: a local `npm start`, which runs the compiled server in production mode, or the tests); never when
 *  the server has a public address or real mail (PUBLIC_URL, SMTP_URL), and only to loopback (devOnlyLoopback). */
export function devInboxAllowed(env: NodeJS.ProcessEnv = process.env): boolean {
  // A local `npm start` names its own loopback address as PUBLIC_URL (scripts/start.ts); any other address is a
  // server other people reach.
  const local = !env.PUBLIC_URL || /^https?:\/\/(127\.\d+\.\d+\.\d+|localhost|\[::1\])(:\d+)?\/?$/.test(env.PUBLIC_URL);
  return local && !env.SMTP_URL;
}

const LOOPBACK = /^(127\.\d+\.\d+\.\d+|::1|::ffff:127\.\d+\.\d+\.\d+)$/;
const devOnlyLoopback: express.RequestHandler = (req, res, next) => {
  // Both the socket and the client a trusted proxy names (X-Forwarded-For) must be this machine.
  if (LOOPBACK.test(req.socket.remoteAddress ?? '') && LOOPBACK.test(req.ip ?? '')) return next();
  res.status(404).type('text').send('not found');
};

const BODY_LIMIT = '1mb';
export const COMPRESS_MIN_BYTES = 4096;

export function createApp({ db, auth, logger, limits = createLimits(db), webDir, mailer, notices, store, inbox, publicUrl = process.env.PUBLIC_URL }: AppDeps) {
  const app = express();
  app.disable('x-powered-by');
  // No ETag on API answers: clients revalidate by setup version, not by hashing ~50 KB bodies per request.
  // (Static files keep theirs: express.static computes its own.)
  app.set('etag', false);
  app.set('trust proxy', 'loopback');
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api/') },
      // Never a cookie, an Authorization header or a token in the logs (server/logging.ts; the logger's own
      // redact covers the same paths when it was made with loggerOptions).
      serializers: {
        req: (r: { url?: string; headers?: Record<string, unknown> }) => {
          const { cookie: _c, authorization: _a, ...headers } = r.headers ?? {};
          return { ...r, url: redactUrl(r.url), headers };
        },
        res: (r: { headers?: Record<string, unknown> }) => {
          const { 'set-cookie': _s, ...headers } = r.headers ?? {};
          return { ...r, headers };
        },
      },
    }),
  );
  // Bodies under COMPRESS_MIN_BYTES go as they are (compressing them costs more than it saves); the web app's
  // files are compressed once at build time (server/web.ts), so this only ever compresses API answers.
  app.use(compression({ threshold: COMPRESS_MIN_BYTES }));
  app.use(securityHeaders());

  // Same-origin rule for every state-changing request, better-auth's included (server/origin.ts).
  app.use('/api', requireSameOrigin(trustedOrigins(publicUrl ?? '')));
  // better-auth reads its own body, so it is mounted before the JSON parser.
  app.all('/api/auth/{*any}', authHandler(auth, db, limits, { mail: !!mailer }));

  app.use('/api', express.json({ limit: BODY_LIMIT }));
  app.use('/api', healthRoutes(db));
  app.use('/api', publicInvitationRoutes(db));
  // Limits shared by every process (server/limits.ts), counted before the route runs: per network address
  // on share links, per signed-in user below requireUser.
  const limited = (method: string, name: LimitName): RequestHandler => {
    const take = limits.perRequest(name);
    return (req, res, next) => (req.method === method ? take(req, res, next) : next());
  };
  app.use(['/api/shared/:token/crew-sheet.pdf', '/api/shared/:token/plan.svg', '/api/shared/:token/plan.png'], limited('GET', 'export'));
  app.use('/api', sharedRoutes(db));
  app.use('/api', requireUser(auth, db));
  app.use(['/api/setups/:id/crew-sheet.pdf', '/api/setups/:id/plan.svg', '/api/setups/:id/plan.png'], limited('GET', 'export'));
  app.use(['/api/studios/:id/members', '/api/classes/:id/invitations'], limited('POST', 'invite'));
  app.use('/api/classes/join', limited('POST', 'join'));
  app.use('/api/setups/:id/photos', limited('POST', 'upload'));
  app.use('/api', meRoutes(db));
  app.use('/api', setupRoutes(db));
  app.use('/api', historyRoutes(db));
  app.use('/api', commentRoutes(db, notices));
  app.use('/api', meterRoutes(db));
  app.use('/api', studioRoutes(db, mailer));
  app.use('/api', invitationRoutes(db));
  app.use('/api', classRoutes(db, mailer));
  app.use('/api', lessonRoutes(db, mailer));
  app.use('/api', assignmentRoutes(db, mailer));
  app.use('/api', submissionRoutes(db, mailer));
  app.use('/api', exportRoutes(db));
  app.use('/api', daySheetRoutes(db));
  app.use('/api', shareRoutes(db));
  app.use('/api', mailRoutes(db, mailer, limits));
  app.use('/api', photoRoutes(db, store));
  app.use('/api', apiNotFound);
  // Decided on the address this app is served at (PUBLIC_URL, or what startServer listened on), not only on the
  // environment: an app given a public address by its caller keeps the inbox closed as well.
  if (inbox && devInboxAllowed({ ...process.env, PUBLIC_URL: publicUrl ?? process.env.PUBLIC_URL })) app.use('/dev', devOnlyLoopback, devInboxRoutes(inbox));

  if (webDir && existsSync(join(webDir, 'index.html'))) {
    // An invitation link opened signed out: remember its token through sign-up (see routes/invitations.ts).
    app.get('/studios/join/:token', rememberInvitation);
    const web = webFiles(webDir);
    app.use(web);
    // A single-page app: every other path is the app, which routes on the client (its HTML names the scripts
    // that path's route needs: appPage).
    app.get('/{*any}', appPage(webDir, web));
  }

  app.use(errorHandler);
  return app;
}
