// A process of its own that holds a pooled connection checked out (as a transaction does between its queries) while
// PostgreSQL ends that connection, the way a restart or `pg_ctl stop -m fast` ends every open one. It prints
// "survived" and exits 0 when the process lives through it and the pool serves again; an unhandled 'error' event
// on the connection would end it with an exception instead (tests/faults/database.test.ts).
import { createDb } from '../../db/client';

async function main() {
  const errors: string[] = [];
  const { pool } = createDb(process.env.DATABASE_URL, { onError: (e) => errors.push(e.message) });
  const held = await pool.connect();
  await held.query('begin');
  const { rows } = await held.query<{ pid: number }>('select pg_backend_pid() as pid');
  // Another connection of the same pool ends the held one's backend (what a database shutdown does to all).
  await pool.query('select pg_terminate_backend($1)', [rows[0]!.pid]);
  await new Promise((r) => setTimeout(r, 500));
  const next = await held.query('select 1').then(
    () => 'answered',
    (e: Error) => `refused: ${e.message}`,
  );
  held.release(true);
  const again = await pool.query<{ one: number }>('select 1 as one');
  process.stdout.write(`held connection ${next}; pool again ${again.rows[0]!.one}; survived\n`);
  await pool.end();
}

main().catch((e) => {
  process.stderr.write(`${e?.stack ?? e}\n`);
  process.exit(2);
});
