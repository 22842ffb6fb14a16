// Operators: the people who run this Falloff (an admin role above every studio). Only they publish templates to
// or withdraw them from the gallery for everyone. Kept apart from better-auth's user table so no account
// endpoint can ever write it; made with `npm run operator -- add <email>` (scripts/operator.ts).
import { pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { user } from './auth';

export const operators = pgTable('operators', {
  userId: text('user_id')
    .primaryKey()
    .references(() => user.id, { onDelete: 'cascade' }),
  addedAt: timestamp('added_at', { withTimezone: true }).notNull().defaultNow(),
});
