// better-auth's client (cookie session on the same origin): a chunk of its own, loaded through hooks/auth.ts
// only by the pages that sign in, up or out or reset a password. Nothing else imports this file.
import { createAuthClient } from 'better-auth/react';

export const authClient = createAuthClient({
  baseURL: typeof window !== 'undefined' && window.location ? window.location.origin : 'http://127.0.0.1:8080',
  basePath: '/api/auth',
});
