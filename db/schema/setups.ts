// A setup: the plan document (validated JSON, see model/document.ts) plus what is listed and searched;
// its history of earlier versions and the comments on it.
import { sql } from 'drizzle-orm';
import { boolean, index, integer, jsonb, pgTable, primaryKey, real, text, timestamp, unique, uuid, type AnyPgColumn } from 'drizzle-orm/pg-core';
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
    /** document.items.length, kept beside the document so a list never has to read (detoast) documents. */
    itemCount: integer('item_count').notNull().default(0),
    /** Bumped on every save; a save must name the version it started from (optimistic concurrency). */
    version: integer('version').notNull().default(1),
    /** A template of its studio: its members copy it to start a new setup (owners mark it). */
    isTemplate: boolean('is_template').notNull().default(false),
    /**
     * A template in the gallery for everyone: readable (and copied, never edited) by every signed-in user. Only
     * an operator publishes or withdraws it (server/routes/setups.ts); always a template too.
     */
    forEveryone: boolean('for_everyone').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    /** Soft delete: restorable for 30 days (RESTORE_DAYS in db/setups.ts). */
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
  },
  (t) => [
    // The library's three orders within a studio, live setups only.
    index('setups_studio_updated_idx').on(t.studioId, t.updatedAt.desc(), t.id.desc()).where(sql`${t.deletedAt} is null`),
    index('setups_studio_created_idx').on(t.studioId, t.createdAt.desc(), t.id.desc()).where(sql`${t.deletedAt} is null`),
    index('setups_studio_title_idx').on(t.studioId, sql`lower(${t.title})`, t.id).where(sql`${t.deletedAt} is null`),
    // The restore list.
    index('setups_studio_deleted_idx').on(t.studioId, t.deletedAt.desc()).where(sql`${t.deletedAt} is not null`),
    // The templates section: the gallery for everyone, across studios.
    index('setups_everyone_updated_idx').on(t.updatedAt.desc(), t.id.desc()).where(sql`${t.forEveryone} and ${t.deletedAt} is null`),
    index('setups_tags_idx').using('gin', t.tags),
    // Search as you type matches any part of a word (ILIKE '%…%'), which trigram indexes serve.
    index('setups_title_trgm_idx').using('gin', t.title.op('gin_trgm_ops')),
    index('setups_notes_trgm_idx').using('gin', t.notes.op('gin_trgm_ops')),
  ],
);

/**
 * Every distinct saved state of a setup, the current one included (written in the same transaction as the
 * save). Restoring an old version writes a new version; rows are removed only by an explicit pruning policy
 * (pruneHistory in db/history.ts), never by a save.
 */
export const setupVersions = pgTable(
  'setup_versions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    setupId: uuid('setup_id').notNull().references(() => setups.id, { onDelete: 'cascade' }),
    /** The setup's version number this row records. */
    version: integer('version').notNull(),
    title: text('title').notNull(),
    notes: text('notes').notNull(),
    tags: text('tags').array().notNull(),
    document: jsonb('document').notNull(),
    schemaVersion: integer('schema_version').notNull(),
    itemCount: integer('item_count').notNull(),
    savedBy: text('saved_by').references(() => user.id, { onDelete: 'set null' }),
    savedAt: timestamp('saved_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique('setup_versions_setup_version_uq').on(t.setupId, t.version)],
);

/**
 * Comments on a setup, by any studio member (crew included). A thread starts with a comment that has no
 * parent; replies name it. A thread's first comment may be pinned to one plan item or to a point on the plan
 * (metres, the plan frame), and resolved (and reopened) as a whole.
 */
export const setupComments = pgTable(
  'setup_comments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    setupId: uuid('setup_id').notNull().references(() => setups.id, { onDelete: 'cascade' }),
    authorId: text('author_id').references(() => user.id, { onDelete: 'set null' }),
    body: text('body').notNull(),
    /** The plan item the comment is about (an item id of the document), or null for the whole setup. */
    itemId: text('item_id'),
    /** A point on the plan, metres; both or neither. */
    xM: real('x_m'),
    yM: real('y_m'),
    /** The thread's first comment, for a reply; null for a thread's start. */
    parentId: uuid('parent_id').references((): AnyPgColumn => setupComments.id, { onDelete: 'cascade' }),
    /** Set on a thread's first comment when someone marks the thread resolved. */
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    resolvedBy: text('resolved_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('setup_comments_setup_idx').on(t.setupId, t.createdAt, t.id)],
);

/**
 * What a save returned, by the client's Idempotency-Key (per user), kept for a day: a save retried after its
 * answer was lost (a dropped connection, a killed server) gets the same answer instead of a version conflict.
 * Written by the same statement as the save (db/setups.ts, saveSetup), so a committed save always has one.
 */
export const saveReceipts = pgTable(
  'save_receipts',
  {
    userId: text('user_id').notNull().references(() => user.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    setupId: uuid('setup_id').notNull().references(() => setups.id, { onDelete: 'cascade' }),
    result: jsonb('result').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.key] }), index('save_receipts_created_idx').on(t.createdAt)],
);

/**
 * Per person and setup: when they last read its comments (the library's unread count is the comments by
 * others after it) and when they were last e-mailed about new ones (the digest's rate limit).
 */
export const setupReads = pgTable(
  'setup_reads',
  {
    userId: text('user_id').notNull().references(() => user.id, { onDelete: 'cascade' }),
    setupId: uuid('setup_id').notNull().references(() => setups.id, { onDelete: 'cascade' }),
    lastReadAt: timestamp('last_read_at', { withTimezone: true }),
    notifiedAt: timestamp('notified_at', { withTimezone: true }),
  },
  (t) => [primaryKey({ columns: [t.userId, t.setupId] })],
);
