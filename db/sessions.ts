// The signed-in user behind a session token: one prepared statement (session joined to its user, unexpired),
// asked on every API request (server/session.ts) — nothing is remembered between requests.
import { and, eq, gt, sql } from 'drizzle-orm';
import type { Db } from './client';
import { session, user } from './schema';

const byDb = new WeakMap<object, ReturnType<typeof build>>();
function build(db: Db) {
  return db
    .select({ id: user.id, name: user.name, email: user.email, units: user.units, paper: user.paper })
    .from(session)
    .innerJoin(user, eq(user.id, session.userId))
    .where(and(eq(session.token, sql.placeholder('token')), gt(session.expiresAt, sql`now()`)))
    .limit(1)
    .prepare('session_user');
}

/** The user of an unexpired session with this token, or null. Throws when the database cannot be asked. */
export async function sessionUser(db: Db, token: string) {
  let q = byDb.get(db);
  if (!q) byDb.set(db, (q = build(db)));
  const [row] = await q.execute({ token });
  return row ?? null;
}
