// Teaching: invitations to a class, lessons (ordered setups with the instructor's words), assignments set
// on a lesson, students' working copies and submissions, and review comments. The class and its members
// are in ./studios.ts.
//
// A lesson keeps a snapshot of each setup's document as it was added (or last refreshed), so a lesson does
// not change under a class because someone edited the setup; `setupId` is the way back for a refresh.
// A submission is a snapshot too, with the check's result as the server computed it then.
import { sql } from 'drizzle-orm';
import { boolean, index, integer, jsonb, pgEnum, pgTable, primaryKey, real, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';
import { setups } from './setups';
import { classes, classRole } from './studios';

/** An instructor asked someone to join by e-mail; they join from their Classes screen when signed in with that address. */
export const classInvitations = pgTable(
  'class_invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    classId: uuid('class_id').notNull().references(() => classes.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: classRole('role').notNull().default('student'),
    invitedBy: text('invited_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    /** 'email' once the mailer took it, 'failed' with deliveryError when it did not. */
    delivery: text('delivery').notNull().default('pending'),
    deliveryError: text('delivery_error'),
  },
  (t) => [
    uniqueIndex('class_invitations_open_uq')
      .on(t.classId, sql`lower(${t.email})`)
      .where(sql`${t.acceptedAt} is null and ${t.revokedAt} is null`),
    index('class_invitations_email_idx').on(sql`lower(${t.email})`),
  ],
);

export const lessons = pgTable(
  'lessons',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    classId: uuid('class_id').notNull().references(() => classes.id, { onDelete: 'cascade' }),
    title: text('title').notNull(),
    summary: text('summary').notNull().default(''),
    /** Order in the class's list (ascending). */
    position: integer('position').notNull().default(0),
    /** Students see a lesson once it is published. */
    published: boolean('published').notNull().default(false),
    createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('lessons_class_idx').on(t.classId, t.position)],
);

/** One setup of a lesson, in order: a snapshot of its document and the instructor's words for it and its steps. */
export const lessonSetups = pgTable(
  'lesson_setups',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    lessonId: uuid('lesson_id').notNull().references(() => lessons.id, { onDelete: 'cascade' }),
    position: integer('position').notNull().default(0),
    /** The setup it was taken from; null once that setup is gone (the snapshot stays). */
    setupId: uuid('setup_id').references(() => setups.id, { onDelete: 'set null' }),
    title: text('title').notNull(),
    document: jsonb('document').notNull(),
    schemaVersion: integer('schema_version').notNull(),
    /** The setup's version the snapshot was taken at. */
    sourceVersion: integer('source_version').notNull(),
    snapshotAt: timestamp('snapshot_at', { withTimezone: true }).notNull().defaultNow(),
    note: text('note').notNull().default(''),
    /** The instructor's words per step, keyed by the step's id in the snapshot. */
    stepNotes: jsonb('step_notes').$type<Record<string, string>>().notNull().default({}),
  },
  (t) => [index('lesson_setups_lesson_idx').on(t.lessonId, t.position)],
);

export const assignments = pgTable(
  'assignments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    lessonId: uuid('lesson_id').notNull().references(() => lessons.id, { onDelete: 'cascade' }),
    /** The lesson setup whose look is to be reproduced (students may start from a copy of it). */
    referenceId: uuid('reference_id').references(() => lessonSetups.id, { onDelete: 'set null' }),
    title: text('title').notNull(),
    brief: text('brief').notNull().default(''),
    /** Targets the meter can evaluate (model/classes.ts checkSchema), or null for a task reviewed by eye. */
    check: jsonb('check'),
    dueAt: timestamp('due_at', { withTimezone: true }),
    createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('assignments_lesson_idx').on(t.lessonId, t.createdAt)],
);

/** A student's working copy for an assignment: a normal setup in their personal studio. */
export const assignmentWork = pgTable(
  'assignment_work',
  {
    assignmentId: uuid('assignment_id').notNull().references(() => assignments.id, { onDelete: 'cascade' }),
    studentId: text('student_id').notNull().references(() => user.id, { onDelete: 'cascade' }),
    setupId: uuid('setup_id').references(() => setups.id, { onDelete: 'set null' }),
    startedFrom: text('started_from').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.assignmentId, t.studentId] })],
);

export const submissionStatus = pgEnum('submission_status', ['submitted', 'reviewed']);

/** Each submit is a new attempt; the instructor reviews attempts and comments on their plans. */
export const submissions = pgTable(
  'submissions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    assignmentId: uuid('assignment_id').notNull().references(() => assignments.id, { onDelete: 'cascade' }),
    studentId: text('student_id').notNull().references(() => user.id, { onDelete: 'cascade' }),
    /** 1, 2, … per student and assignment. */
    attempt: integer('attempt').notNull(),
    setupId: uuid('setup_id').references(() => setups.id, { onDelete: 'set null' }),
    title: text('title').notNull(),
    document: jsonb('document').notNull(),
    schemaVersion: integer('schema_version').notNull(),
    /** evaluateCheck's result, computed on the server at submission; null when the assignment has no check. */
    checkResult: jsonb('check_result'),
    passed: boolean('passed'),
    status: submissionStatus('status').notNull().default('submitted'),
    /** The instructor showed it to the whole class. */
    shared: boolean('shared').notNull().default(false),
    submittedAt: timestamp('submitted_at', { withTimezone: true }).notNull().defaultNow(),
    reviewedAt: timestamp('reviewed_at', { withTimezone: true }),
    reviewedBy: text('reviewed_by').references(() => user.id, { onDelete: 'set null' }),
  },
  (t) => [
    uniqueIndex('submissions_attempt_uq').on(t.assignmentId, t.studentId, t.attempt),
    index('submissions_assignment_idx').on(t.assignmentId, t.submittedAt),
  ],
);

/** A review comment on a submission's plan, pinned to an item or to a point (plan metres), or to neither. */
export const submissionComments = pgTable(
  'submission_comments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    submissionId: uuid('submission_id').notNull().references(() => submissions.id, { onDelete: 'cascade' }),
    authorId: text('author_id').references(() => user.id, { onDelete: 'set null' }),
    body: text('body').notNull(),
    itemId: text('item_id'),
    xM: real('x_m'),
    yM: real('y_m'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('submission_comments_idx').on(t.submissionId, t.createdAt)],
);
