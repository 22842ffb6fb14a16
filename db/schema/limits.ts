// Counters of the rate limits every server process shares (server/limits.ts, rate-limiter-flexible's Drizzle
// store): one row per limit and key, `points` used in the window that ends at `expire`.
import { integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

export const rateLimits = pgTable('rate_limits', {
  key: text('key').primaryKey(),
  points: integer('points').notNull().default(0),
  expire: timestamp('expire', { withTimezone: true }),
});
