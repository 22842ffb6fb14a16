// Studios (shared workspaces for setups) and classes (for teaching), each with members in roles.
// A user's role in a studio or class decides what the API lets them do (server/access.ts).
import { boolean, index, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';

export const studioRole = pgEnum('studio_role', ['owner', 'editor', 'crew']);
export const classRole = pgEnum('class_role', ['instructor', 'student']);

export const studios = pgTable('studios', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  /** The studio made for a user at sign-up; it has exactly that one owner. */
  personal: boolean('personal').notNull().default(false),
  createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const studioMembers = pgTable(
  'studio_members',
  {
    studioId: uuid('studio_id').notNull().references(() => studios.id, { onDelete: 'cascade' }),
    userId: text('user_id').notNull().references(() => user.id, { onDelete: 'cascade' }),
    role: studioRole('role').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.studioId, t.userId] }), index('studio_members_user_idx').on(t.userId)],
);

export const classes = pgTable('classes', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  /** Short code a student types to join. */
  joinCode: text('join_code').notNull().unique(),
  createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const classMembers = pgTable(
  'class_members',
  {
    classId: uuid('class_id').notNull().references(() => classes.id, { onDelete: 'cascade' }),
    userId: text('user_id').notNull().references(() => user.id, { onDelete: 'cascade' }),
    role: classRole('role').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.classId, t.userId] }), index('class_members_user_idx').on(t.userId)],
);
