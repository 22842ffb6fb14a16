// Whether the e-mail a better-auth request sends reached the durable mail queue (server/mail/queue.ts). better-auth
// awaits its mail callbacks (sendResetPassword, sendVerificationEmail, onExistingUserSignUp) but swallows what they
// throw and answers 200 anyway; server/session.ts runs those requests inside this store and answers 503 instead
// when a message was not queued (undoing a sign-up whose confirmation mail was not queued).
import { AsyncLocalStorage } from 'node:async_hooks';

export type MailOutcome = {
  /** Why a message the request wanted to send was not queued, or null. */
  failed: string | null;
  /** A sign-up: the account it made (undone when its confirmation mail was not queued). */
  createdUserId?: string;
};
export const mailOutcome = new AsyncLocalStorage<MailOutcome>();

/** Run a mail callback: a message the queue refuses is noted for the request (and still thrown). */
export async function noteMailOutcome(send: () => Promise<unknown>, created?: string): Promise<void> {
  const outcome = mailOutcome.getStore();
  if (outcome && created) outcome.createdUserId = created;
  try {
    await send();
  } catch (err) {
    if (outcome) outcome.failed = err instanceof Error ? err.message : String(err);
    throw err;
  }
}

export const RESET_PATHS = new Set(['/request-password-reset', '/forget-password']);
export const SIGN_UP_PATH = '/sign-up/email';
