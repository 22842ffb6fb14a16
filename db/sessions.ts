// The signed-in user behind a session token: one prepared statement (session joined to its user, unexpired),
// asked on every API request (server/session.ts) — nothing is remembered between requests.
import { and, eq, gt, sql } from 'drizzle-orm';
import type { Db } from './client';
import { session, setups, studios, user } from './schema';

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

/**
 * Undo a sign-up whose confirmation e-mail could not be queued: the account (its sessions, credentials and
 * memberships go with it) and the personal studio made for it, only while its address is still unconfirmed and
 * the studio holds nothing of its own. True when the account is gone.
 */
export async function removeUnconfirmedSignUp(db: Db, userId: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [u] = await tx.select({ verified: user.emailVerified }).from(user).where(eq(user.id, userId)).for('update');
    if (!u || u.verified) return false;
    await tx.execute(sql`delete from ${studios} s where s.created_by = ${userId} and s.personal
      and not exists (select 1 from ${setups} x where x.studio_id = s.id)`);
    await tx.delete(user).where(eq(user.id, userId));
    return true;
  });
}
