// Signing in, up and out and resetting a password, through better-auth's client, which loads only when one of
// these is used (loadAuthClient) or about to be (useWarmAuth on the signed-out forms). Who is signed in is
// read without it (hooks/session.ts), so the layouts, the library and the share page never download it.
import { useQueryClient } from '@tanstack/react-query';
import { clearOfflineData } from './offline';
import { setQueueOwner } from './offlineQueue';
import { useWarmOnTouch } from './lazyResolver';
import { sessionChanged } from './session';

type AuthClient = (typeof import('./authClient'))['authClient'];

let loading: Promise<AuthClient> | null = null;
/** better-auth's client, loaded once (again after a failed load, e.g. without signal). */
export function loadAuthClient(): Promise<AuthClient> {
  loading ??= import('./authClient').then(
    (m) => m.authClient,
    (err: unknown) => {
      loading = null;
      throw err;
    },
  );
  return loading;
}

/** Starts loading better-auth's client at the page's first pointer press, key or focus, before a submit needs it. */
export function useWarmAuth() {
  useWarmOnTouch(loadAuthClient);
}

/** After a sign-in (or anything else that starts a session): the layouts read the session again and move on. */
export function useSessionChanged() {
  const qc = useQueryClient();
  return () => sessionChanged(qc);
}

/** Sign out and forget every cached server answer that belonged to the user. */
export function useSignOut() {
  const qc = useQueryClient();
  return async () => {
    const client = await loadAuthClient();
    const { error } = await client.signOut();
    if (error) throw new Error(error.message || error.statusText || 'signing out failed');
    setQueueOwner(null);
    await sessionChanged(qc, null);
    qc.clear();
    await clearOfflineData().catch(() => {});
  };
}
