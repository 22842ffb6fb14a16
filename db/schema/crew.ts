// What a setup sends out and keeps beside it: read-only share links for the crew, and reference and result
// photos (the image bytes live in object storage, see server/storage/; these rows say where).
import { index, integer, pgTable, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';
import { setups } from './setups';

/**
 * A read-only link to one setup, opened without an account. The link carries a random token of 256 bits;
 * only its SHA-256 is stored, so the table alone opens nothing. Revoking sets revokedAt and takes effect at
 * the next request. The creator's units and paper are kept so the crew sheet reads as the photographer's.
 */
export const setupShares = pgTable(
  'setup_shares',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    setupId: uuid('setup_id').notNull().references(() => setups.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    /** The last characters of the token, so a person can tell two links apart in the list. */
    tokenTail: text('token_tail').notNull(),
    label: text('label').notNull().default(''),
    units: text('units').notNull().default('metric'),
    paper: text('paper').notNull().default('a4'),
    createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    lastOpenedAt: timestamp('last_opened_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [index('setup_shares_setup_idx').on(t.setupId, t.createdAt)],
);

/** A photo attached to a setup: the set as rigged (reference) or a frame from the shoot (result). */
export const setupPhotos = pgTable(
  'setup_photos',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    setupId: uuid('setup_id').notNull().references(() => setups.id, { onDelete: 'cascade' }),
    kind: text('kind').notNull(),
    uploadedBy: text('uploaded_by').references(() => user.id, { onDelete: 'set null' }),
    filename: text('filename').notNull(),
    /** Sniffed from the bytes, never taken from the upload's name or header. */
    mime: text('mime').notNull(),
    bytes: integer('bytes').notNull(),
    width: integer('width'),
    height: integer('height'),
    /** Object keys in the photo bucket: the served original (GPS removed) and its thumbnail (none when it could not be made). */
    objectKey: text('object_key').notNull(),
    thumbKey: text('thumb_key'),
    /** Camera settings read from the original's EXIF; null when the photo does not say. */
    iso: real('iso'),
    aperture: real('aperture'),
    shutterS: real('shutter_s'),
    focalMm: real('focal_mm'),
    camera: text('camera'),
    takenAt: timestamp('taken_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('setup_photos_setup_idx').on(t.setupId, t.createdAt)],
);
