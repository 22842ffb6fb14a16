// One connection pool per process, and the Drizzle handle over it.
//
// PostgreSQL may restart or be unreachable for a while: an idle connection it ends raises an 'error' on the
// pool, which must be handled (an unhandled one ends the process). A connection that is lent out (a transaction
// between two of its queries) has no listener of the pool's, so every connection gets one of its own for its whole
// life: its error then reaches whoever holds it as a failed query, never the process. The pool then simply opens new connections
// for the next queries; until the database answers again those fail at once (or after CONNECT_TIMEOUT_MS) and
// the API turns them into 503s (server/errors.ts, isDatabaseUnavailable).
import { sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './schema';

export type Db = ReturnType<typeof createDb>['db'];

/**
 * How long a query waits for a connection before it fails. node-postgres counts the wait for a free pool slot in
 * this too, so it must outlast a burst on a loaded machine (a 3 s limit turned a burst of 200 reads into 503s);
 * a stopped database still fails at once (connection refused).
 */
const CONNECT_TIMEOUT_MS = 10_000;

export function createDb(url = process.env.DATABASE_URL, opts: { onError?: (err: Error) => void } = {}) {
  if (!url) throw new Error('DATABASE_URL is not set (the scripts in scripts/ set it; see README).');
  const pool = new pg.Pool({ connectionString: url, max: Number(process.env.PG_POOL_MAX ?? 10), connectionTimeoutMillis: CONNECT_TIMEOUT_MS });
  pool.on('error', (err) => opts.onError?.(err));
  // The pool reports an idle connection's error above (through its own listener, taken off while the connection is
  // lent out); a lent-out one's error fails the holder's next query, and this listener keeps it from being unhandled.
  pool.on('connect', (client) => client.on('error', () => undefined));
  const db = drizzle(pool, { schema, casing: 'snake_case' });
  return { db, pool };
}

export { schema };

/** Whether PostgreSQL answers a trivial query now. */
export async function databaseAnswers(db: Db): Promise<boolean> {
  try {
    await db.execute(sql`select 1`);
    return true;
  } catch {
    return false;
  }
}

/** What a library that writes its own SQL (pg-boss) needs to run it on a given connection. */
export type SqlExecutor = { executeSql: (text: string, values?: unknown[]) => Promise<{ rows: unknown[] }> };

/**
 * Run raw SQL on the connection of a Drizzle transaction (made by `db.transaction` on the pool), so that, say, a
 * queued job commits or rolls back with the rows written beside it. Drizzle keeps that connection as the
 * transaction session's `client`; anything else is refused rather than silently run outside the transaction.
 */
export function txExecutor(tx: unknown): SqlExecutor {
  const client = (tx as { session?: { client?: unknown } } | null)?.session?.client;
  if (!(client instanceof pg.Client)) throw new Error('txExecutor: not a transaction on its own connection');
  return { executeSql: (text, values) => client.query(text, values) };
}
