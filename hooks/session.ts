// Who is signed in: better-auth's get-session route read with a plain fetch through the API client and kept as
// a TanStack Query. Every layout reads it, so it stays light: better-auth's client library loads only where a
// page signs in, up or out or resets a password (hooks/auth.ts), never on the share page or the library.
// Read again when the page regains focus (if older than STALE_MS), at once after this tab signs in or out
// (sessionChanged), and when another tab of the same site says it did (a BroadcastChannel; where there is
// none, the focus refetch covers it).
import { useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import type { SessionResponse } from '../model/api';
import { call } from './api';
import { setQueueOwner } from './offlineQueue';

export const sessionKey = ['session'] as const;
const STALE_MS = 10_000;
const CHANNEL = 'falloff-session';

export type Session = {
  /** The signed-in person and their session; null when signed out (or when the session could not be read). */
  data: SessionResponse;
  /** True until the first answer. */
  isPending: boolean;
  error: Error | null;
};

const readSession = ({ signal }: { signal: AbortSignal }) => call('getSession', { signal });

export function useSession(): Session {
  const qc = useQueryClient();
  useEffect(() => listenToOtherTabs(qc), [qc]);
  const q = useQuery({ queryKey: sessionKey, queryFn: readSession, staleTime: STALE_MS, refetchOnWindowFocus: true });
  const userId = q.isPending ? undefined : (q.data?.user.id ?? null);
  // The changes queued on this device are read and written as this person's (hooks/offlineQueue.ts).
  useEffect(() => {
    if (userId !== undefined) setQueueOwner(userId);
  }, [userId]);
  return { data: q.data ?? null, isPending: q.isPending, error: q.error };
}

// One channel for the page: a message is delivered to every other channel of that name, never back to its sender.
let channel: BroadcastChannel | null | undefined;
function sessionChannel(): BroadcastChannel | null {
  if (channel === undefined) channel = typeof BroadcastChannel === 'undefined' ? null : new BroadcastChannel(CHANNEL);
  return channel;
}

const listening = new WeakMap<QueryClient, { readers: number; listener: (e: MessageEvent) => void }>();
/** While any session reader is mounted: another tab signed in or out, so read the session again; when the person
 *  changed, every other cached answer belonged to someone else and is dropped and asked again. */
function listenToOtherTabs(qc: QueryClient): () => void {
  const ch = sessionChannel();
  if (!ch) return () => {};
  let entry = listening.get(qc);
  if (!entry) {
    const listener = (e: MessageEvent) => {
      if (e.data !== 'changed') return;
      const before = qc.getQueryData<SessionResponse>(sessionKey)?.user.id ?? null;
      void qc
        .fetchQuery({ queryKey: sessionKey, queryFn: readSession, staleTime: 0 })
        .then((s) => s?.user.id ?? null, () => before)
        .then((after) => (after !== before ? qc.resetQueries({ predicate: (q) => q.queryKey[0] !== sessionKey[0] }) : undefined));
    };
    entry = { readers: 0, listener };
    listening.set(qc, entry);
    ch.addEventListener('message', listener);
  }
  entry.readers++;
  const mine = entry;
  return () => {
    if (--mine.readers > 0) return;
    ch.removeEventListener('message', mine.listener);
    listening.delete(qc);
  };
}

/** After this tab signed in or out: read the session again now, and tell the other tabs to. */
export async function sessionChanged(qc: QueryClient, session?: SessionResponse): Promise<void> {
  sessionChannel()?.postMessage('changed');
  if (session !== undefined) qc.setQueryData(sessionKey, session);
  else await qc.invalidateQueries({ queryKey: sessionKey });
}
