// Studios (shared workspaces for setups) and classes (for teaching), each with members in roles.
// A user's role in a studio or class decides what the API lets them do (server/access.ts).
import { sql } from 'drizzle-orm';
import { boolean, index, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';

export const studioRole = pgEnum('studio_role', ['owner', 'editor', 'crew']);
export const classRole = pgEnum('class_role', ['instructor', 'student']);

export const studios = pgTable('studios', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  /** The studio made for a user at sign-up; it has exactly that one owner. */
  personal: boolean('personal').notNull().default(false),
  /** Whether crew may copy the studio's setups out into a studio of their own (off unless an owner turns it on). */
  crewMayCopy: boolean('crew_may_copy').notNull().default(false),
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

/**
 * An invitation to join a studio in a role, sent to an e-mail address. The link carries a random token; only
 * its SHA-256 is stored, so the table alone cannot be used to join. Accepting needs the token and a signed-in
 * user with the invited address. `delivery*` is for the mailer: today the link is handed to the inviter in the
 * API response (delivery 'link'); a mailer will set 'email' and record sentAt / deliveryError.
 */
export const studioInvitations = pgTable(
  'studio_invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studioId: uuid('studio_id').notNull().references(() => studios.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: studioRole('role').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    invitedBy: text('invited_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedBy: text('accepted_by').references(() => user.id, { onDelete: 'set null' }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    delivery: text('delivery').notNull().default('link'),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    deliveryError: text('delivery_error'),
  },
  (t) => [
    // One open invitation per address and studio: inviting again replaces it.
    uniqueIndex('studio_invitations_open_uq')
      .on(t.studioId, sql`lower(${t.email})`)
      .where(sql`${t.acceptedAt} is null and ${t.revokedAt} is null`),
  ],
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
