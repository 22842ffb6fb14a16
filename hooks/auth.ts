// Sign-in state through better-auth's client (cookie session on the same origin).
import { useQueryClient } from '@tanstack/react-query';
import { createAuthClient } from 'better-auth/react';

export const authClient = createAuthClient({
  baseURL: typeof window !== 'undefined' && window.location ? window.location.origin : 'http://127.0.0.1:8080',
  basePath: '/api/auth',
});

export function useSession() {
  return authClient.useSession();
}

/** Sign out and forget every cached server answer that belonged to the user. */
export function useSignOut() {
  const qc = useQueryClient();
  return async () => {
    await authClient.signOut();
    qc.clear();
  };
}
