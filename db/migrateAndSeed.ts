// Brings a database up to date: runs the committed SQL migrations, then seeds the demo data once.
// Called by scripts/ensure.mjs with DATABASE_URL set.
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { join } from 'node:path';
import { createDb, databaseAnswers } from './client';
import { seedDemo } from './seed';

async function main() {
  const { db, pool } = createDb();
  try {
    // A cluster just started, or a machine under heavy load, may take a while to take connections: wait for
    // one answer (up to a minute) before migrating, instead of failing on the first slow connect.
    const deadline = Date.now() + 60_000;
    while (!(await databaseAnswers(db)) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 1000));
    await migrate(db, { migrationsFolder: join(__dirname, 'migrations') });
    const seeded = await seedDemo(db);
    if (seeded) process.stdout.write(`[falloff] seeded demo data into ${new URL(process.env.DATABASE_URL!).pathname.slice(1)}\n`);
  } finally {
    await pool.end();
  }
}

main().catch((err) => {
  // Drizzle wraps the driver's error: its cause says what PostgreSQL (or the connection) reported.
  const cause = err?.cause ? `\ncaused by: ${err.cause?.stack ?? err.cause}` : '';
  process.stderr.write(`[falloff] preparing the database failed: ${err?.stack ?? err}${cause}\n`);
  process.exit(1);
});
