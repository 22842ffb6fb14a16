// Operators (db/schema/operators.ts): who they are, and making or unmaking one by e-mail address.
import { asc, eq, sql } from 'drizzle-orm';
import type { Db } from './client';
import { operators, user } from './schema';

export async function isOperator(db: Db, userId: string): Promise<boolean> {
  const [row] = await db.select({ userId: operators.userId }).from(operators).where(eq(operators.userId, userId));
  return !!row;
}

/** Make the account with this address an operator: 'added', 'already' one, or 'no_account'. */
export async function addOperator(db: Db, email: string): Promise<'added' | 'already' | 'no_account'> {
  const [u] = await db.select({ id: user.id }).from(user).where(eq(sql`lower(${user.email})`, email.trim().toLowerCase()));
  if (!u) return 'no_account';
  const r = await db.insert(operators).values({ userId: u.id }).onConflictDoNothing().returning({ userId: operators.userId });
  return r.length ? 'added' : 'already';
}

/** The account with this address is no longer an operator: 'removed', 'not_one', or 'no_account'. */
export async function removeOperator(db: Db, email: string): Promise<'removed' | 'not_one' | 'no_account'> {
  const [u] = await db.select({ id: user.id }).from(user).where(eq(sql`lower(${user.email})`, email.trim().toLowerCase()));
  if (!u) return 'no_account';
  const r = await db.delete(operators).where(eq(operators.userId, u.id)).returning({ userId: operators.userId });
  return r.length ? 'removed' : 'not_one';
}

export async function listOperators(db: Db): Promise<{ email: string; name: string; addedAt: Date }[]> {
  return db.select({ email: user.email, name: user.name, addedAt: operators.addedAt }).from(operators).innerJoin(user, eq(user.id, operators.userId)).orderBy(asc(user.email));
}
