// Sign-in state through better-auth's client (cookie session on the same origin).
import { useQueryClient } from '@tanstack/react-query';
import { createAuthClient } from 'better-auth/react';
import { useEffect } from 'react';
import { clearOfflineData } from './offline';
import { setQueueOwner } from './offlineQueue';

export const authClient = createAuthClient({
  baseURL: typeof window !== 'undefined' && window.location ? window.location.origin : 'http://127.0.0.1:8080',
  basePath: '/api/auth',
});

export function useSession() {
  const session = authClient.useSession();
  const userId = session.isPending ? undefined : (session.data?.user.id ?? null);
  // The changes queued on this device are read and written as this person's (hooks/offlineQueue.ts).
  useEffect(() => {
    if (userId !== undefined) setQueueOwner(userId);
  }, [userId]);
  return session;
}

/** Sign out and forget every cached server answer that belonged to the user. */
export function useSignOut() {
  const qc = useQueryClient();
  return async () => {
    const { error } = await authClient.signOut();
    if (error) throw new Error(error.message || error.statusText || 'signing out failed');
    setQueueOwner(null);
    qc.clear();
    await clearOfflineData().catch(() => {});
  };
}
