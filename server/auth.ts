// Accounts and sessions through better-auth: e-mail and password, cookie sessions, on our PostgreSQL.
// Every new user gets a personal studio they own, so they can save setups at once.
import { betterAuth } from 'better-auth';
import { APIError, createAuthMiddleware } from 'better-auth/api';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import type { Db } from '../db/client';
import { schema } from '../db/client';
import { createPersonalStudio } from '../db/studios';
import type { Mailer } from './mail/mailer';
import { trustedOrigins } from './origin';
import { noteMailOutcome } from './mail/mailOutcome';
import { existingAccountMessage, resetPasswordMessage, verifyEmailMessage } from './mail/messages';
import { MAX_PASSWORD_LENGTH, MIN_PASSWORD_LENGTH, personName, weakPasswordReason } from '../model/api';

/** better-auth's endpoints that take a person's name or a new password, and the body field that holds it. */
const NAME_FIELDS: Record<string, string> = { '/sign-up/email': 'name', '/update-user': 'name' };
const PASSWORD_FIELDS: Record<string, string> = { '/sign-up/email': 'password', '/reset-password': 'newPassword', '/change-password': 'newPassword', '/set-password': 'newPassword' };

/**
 * Our text and password rules on better-auth's own endpoints (its schemas take any string): a name follows
 * model/text.ts (no control characters, bidi controls removed, at most 80 characters), a new password is not
 * a common one. A refusal is a 400 naming the field.
 */
const textAndPasswordRules = createAuthMiddleware(async (ctx) => {
  const body = ctx.body as Record<string, unknown> | undefined;
  if (!body || typeof body !== 'object') return;
  const nameField = NAME_FIELDS[ctx.path];
  let changed: Record<string, unknown> | null = null;
  if (nameField && body[nameField] !== undefined) {
    const r = personName.safeParse(body[nameField]);
    if (!r.success) throw new APIError('BAD_REQUEST', { code: 'INVALID_NAME', message: `${nameField}: ${r.error.issues[0]?.message ?? 'not a valid name'}`, field: nameField });
    if (r.data !== body[nameField]) changed = { ...body, [nameField]: r.data };
  }
  const passwordField = PASSWORD_FIELDS[ctx.path];
  const password = passwordField ? body[passwordField] : undefined;
  if (passwordField && typeof password === 'string') {
    const why = weakPasswordReason(password);
    if (why) throw new APIError('BAD_REQUEST', { code: 'WEAK_PASSWORD', message: `${passwordField}: ${why}`, field: passwordField });
  }
  if (changed) return { context: { body: changed } };
});

export function createAuth(db: Db, opts: { baseURL: string; secret: string; mailer?: Mailer }) {
  const appUrl = (path: string) => new URL(path, opts.baseURL).toString();
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
      minPasswordLength: MIN_PASSWORD_LENGTH,
      maxPasswordLength: MAX_PASSWORD_LENGTH,
      // A sign-up never signs in at once: the answer is then the same whether or not the address already has an
      // account (better-auth returns a look-alike user for an existing one), so sign-up does not reveal who has
      // an account. The owner of an existing account gets a mail instead (onExistingUserSignUp).
      autoSignIn: false,
      // Its mail not queued makes the sign-up a 503, as for a new account (server/session.ts), so the answer
      // still does not tell the two apart.
      onExistingUserSignUp: async ({ user }) => {
        const mailer = opts.mailer;
        if (!mailer) return;
        await noteMailOutcome(() => mailer.send(existingAccountMessage({ to: user.email, name: user.name, signInUrl: appUrl('/sign-in') })));
      },
      // A reset ends every session of the account (a change does too: server/session.ts asks for it).
      revokeSessionsOnPasswordReset: true,
      // POST /api/auth/request-password-reset e-mails the link (better-auth answers the same whether or not
      // the address has an account, so it does not reveal who has one).
      // The request's answer waits for the message to be stored in the durable queue; a failure is reported
      // through mailOutcome (server/session.ts answers 503 rather than better-auth's 200).
      sendResetPassword: async ({ user, url }) => {
        await noteMailOutcome(async () => {
          if (!opts.mailer) throw new Error('no mail service is set up, so a password reset cannot be sent');
          await opts.mailer.send(resetPasswordMessage({ to: user.email, name: user.name, url }));
        });
      },
    },
    // better-auth's own e-mail verification: a link mailed on sign-up; opening it confirms the address and
    // signs the person in. An unconfirmed account may sign in and draw, but cannot accept an invitation, join
    // a class by invitation or send mail to others (server/verified.ts).
    emailVerification: {
      sendOnSignUp: true,
      autoSignInAfterVerification: true,
      expiresIn: 60 * 60 * 24 * 3,
      // A confirmation mail the queue refuses (database or queue down) turns the sign-up into a 503 and the account
      // it made is removed (server/session.ts), so no account is left that could never be confirmed.
      sendVerificationEmail: async ({ user, url }) => {
        // Without a mail service (the demo seed) nothing is sent and the address stays unconfirmed.
        const mailer = opts.mailer;
        if (!mailer) return;
        await noteMailOutcome(() => mailer.send(verifyEmailMessage({ to: user.email, name: user.name, url })), user.id);
      },
    },
    hooks: { before: textAndPasswordRules },
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
    // The app's own origin (and TRUSTED_ORIGINS), as for our routes (server/origin.ts): a page on another
    // port of the same host is another origin.
    trustedOrigins: trustedOrigins(opts.baseURL),
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
