// Accounts and sessions through better-auth: e-mail and password, cookie sessions, on our PostgreSQL.
// Every new user gets a personal studio they own, so they can save setups at once.
import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import type { Db } from '../db/client';
import { schema } from '../db/client';
import { createPersonalStudio } from '../db/studios';
import type { Mailer } from './mail/mailer';
import { resetPasswordMessage } from './mail/messages';

export function createAuth(db: Db, opts: { baseURL: string; secret: string; mailer?: Mailer }) {
  return betterAuth({
    baseURL: opts.baseURL,
    basePath: '/api/auth',
    secret: opts.secret,
    database: drizzleAdapter(db, {
      provider: 'pg',
      schema: { user: schema.user, session: schema.session, account: schema.account, verification: schema.verification },
    }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: 8,
      maxPasswordLength: 128,
      autoSignIn: true,
      // POST /api/auth/request-password-reset e-mails the link (better-auth answers the same whether or not
      // the address has an account, so it does not reveal who has one).
      sendResetPassword: async ({ user, url }) => {
        if (!opts.mailer) throw new Error('no mail service is set up, so a password reset cannot be sent');
        await opts.mailer.send(resetPasswordMessage({ to: user.email, name: user.name, url }));
      },
    },
    user: {
      additionalFields: {
        units: { type: 'string', required: false, defaultValue: 'metric', input: false },
        paper: { type: 'string', required: false, defaultValue: 'a4', input: false },
      },
    },
    session: { expiresIn: 60 * 60 * 24 * 30, updateAge: 60 * 60 * 24 },
    advanced: {
      // Same-origin app: a first-party, httpOnly, SameSite=Lax cookie; Secure only behind HTTPS.
      useSecureCookies: opts.baseURL.startsWith('https://'),
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax' },
    },
    // Any local origin may sign in during development and tests (the server listens on loopback only).
    trustedOrigins: (request) => {
      const origin = request?.headers.get('origin');
      return origin && /^http:\/\/(127\.0\.0\.1|localhost)(:\d+)?$/.test(origin) ? [origin] : [opts.baseURL];
    },
    rateLimit: { enabled: false },
    databaseHooks: {
      user: {
        create: {
          after: async (user) => {
            await createPersonalStudio(db, { id: user.id, name: user.name });
          },
        },
      },
    },
  });
}

export type Auth = ReturnType<typeof createAuth>;
