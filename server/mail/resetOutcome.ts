// Whether a password reset's e-mail reached the durable mail queue (server/mail/queue.ts). better-auth awaits
// its sendResetPassword but swallows what it throws and answers 200 anyway; the reset route (server/session.ts)
// runs the request inside this store and answers 503 instead when the message was not queued.
import { AsyncLocalStorage } from 'node:async_hooks';

export type ResetOutcome = { failed: string | null };
export const resetOutcome = new AsyncLocalStorage<ResetOutcome>();

export const RESET_PATHS = new Set(['/request-password-reset', '/forget-password']);
