// The read-only link's setup asked for as soon as its route renders (app/s/[token].tsx), while the share chunk
// is still downloading and evaluating, instead of once the screen has mounted; the screen's query
// (useSharedSetup, hooks/shares.ts) takes that answer the first time. Small: it is in the first chunk.
import { call } from './api';

type Answer = ReturnType<typeof call<'sharedSetup'>>;
/** An early answer older than this is not taken (the screen asks afresh). */
const FRESH_MS = 30_000;
const early = new Map<string, { p: Answer; at: number }>();

/** Starts the request for `token` (once until it is taken, or when the last one has grown old). */
export function fetchSharedEarly(token: string) {
  const e = early.get(token);
  if (!token || (e && Date.now() - e.at < FRESH_MS)) return;
  const p = call('sharedSetup', { params: { token } });
  p.catch(() => {}); // the screen's query reports a failure when it takes the answer
  early.set(token, { p, at: Date.now() });
}

/** The early request for `token`, once (later fetches go to the server again), or null. */
export function takeSharedEarly(token: string): Answer | null {
  const e = early.get(token);
  early.delete(token);
  return e && Date.now() - e.at < FRESH_MS ? e.p : null;
}
