import { defineConfig } from 'drizzle-kit';

// `npm run db:generate` writes a new SQL migration under db/migrations from the schema in db/schema.
export default defineConfig({
  dialect: 'postgresql',
  schema: './db/schema/index.ts',
  out: './db/migrations',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://falloff@127.0.0.1:54329/falloff' },
});
