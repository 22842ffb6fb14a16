// A setup: the plan document (validated JSON, see model/document.ts) plus what is listed and searched.
import { sql } from 'drizzle-orm';
import { boolean, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';
import { studios } from './studios';

export const setups = pgTable(
  'setups',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studioId: uuid('studio_id').notNull().references(() => studios.id, { onDelete: 'cascade' }),
    ownerId: text('owner_id').references(() => user.id, { onDelete: 'set null' }),
    title: text('title').notNull(),
    notes: text('notes').notNull().default(''),
    tags: text('tags').array().notNull().default(sql`'{}'::text[]`),
    document: jsonb('document').notNull(),
    schemaVersion: integer('schema_version').notNull(),
    /** Bumped on every save; a save must name the version it started from (optimistic concurrency). */
    version: integer('version').notNull().default(1),
    isTemplate: boolean('is_template').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    /** Soft delete: restorable for 30 days. */
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
  },
  (t) => [
    index('setups_studio_updated_idx').on(t.studioId, t.updatedAt.desc(), t.id),
    index('setups_tags_idx').using('gin', t.tags),
    index('setups_template_idx').on(t.isTemplate).where(sql`${t.isTemplate}`),
  ],
);
