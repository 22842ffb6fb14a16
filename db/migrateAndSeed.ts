// Brings a database up to date: runs the committed SQL migrations, then seeds the demo data once.
// Called by scripts/ensure.mjs with DATABASE_URL set.
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { join } from 'node:path';
import { createDb } from './client';
import { seedDemo } from './seed';

async function main() {
  const { db, pool } = createDb();
  try {
    await migrate(db, { migrationsFolder: join(__dirname, 'migrations') });
    const seeded = await seedDemo(db);
    if (seeded) process.stdout.write(`[falloff] seeded demo data into ${new URL(process.env.DATABASE_URL!).pathname.slice(1)}\n`);
  } finally {
    await pool.end();
  }
}

main().catch((err) => {
  process.stderr.write(`[falloff] preparing the database failed: ${err?.stack ?? err}\n`);
  process.exit(1);
});
