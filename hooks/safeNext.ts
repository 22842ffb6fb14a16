// Where to go after signing in: the page a signed-out visitor was sent away from (`?next=`), if it is one
// of ours — a path on this site, never another site's address.
export function safeNext(next: unknown): string {
  if (typeof next !== 'string' || !next.startsWith('/') || next.startsWith('//') || next.includes('\\')) return '/setups';
  if (next.startsWith('/sign-in') || next.startsWith('/sign-up')) return '/setups';
  return next;
}
