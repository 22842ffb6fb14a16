// Bodies and queries of the HTTP API, shared by the client's forms and the server's validation, and the
// shapes of its answers.
import { z } from 'zod';
import { migrateDocument, setupDocumentSchema, type SetupDocument } from './document';
import { idSchema } from './geometry';

export const signUpBody = z.object({
  name: z.string().trim().min(1, 'enter your name').max(80),
  email: z.string().trim().email('enter an e-mail address'),
  password: z.string().min(8, 'at least 8 characters').max(128),
});
export const signInBody = z.object({
  email: z.string().trim().email('enter an e-mail address'),
  password: z.string().min(1, 'enter your password').max(128),
});

export const studioRoles = ['owner', 'editor', 'crew'] as const;
export type StudioRole = (typeof studioRoles)[number];
export type ClassRole = 'instructor' | 'student';

// ---------------------------------------------------------------------------------------------
// Fields

const uuid = (what: string) => z.string().uuid(`${what} id`);
/** Tags are compared lower-case; a list keeps each tag once. */
export const tagSchema = z.string().trim().toLowerCase().min(1, 'an empty tag').max(40, 'at most 40 characters');
export const tagsSchema = z
  .array(tagSchema)
  .max(30, 'at most 30 tags')
  .transform((tags) => [...new Set(tags)]);
export const setupTitle = z.string().trim().min(1, 'give the setup a title').max(200, 'at most 200 characters');
export const setupNotes = z.string().max(20000, 'at most 20 000 characters');
/** A document as sent by a client: brought up to the current schema version, then validated. */
export const documentInput = z.preprocess(migrateDocument, setupDocumentSchema);
const flag = z.enum(['0', '1', 'true', 'false']).transform((v) => v === '1' || v === 'true');

// ---------------------------------------------------------------------------------------------
// Setups

export const setupSorts = ['updated', 'created', 'title'] as const;
export type SetupSort = (typeof setupSorts)[number];

export const listSetupsQuery = z
  .object({
    studio: uuid('a studio').optional(),
    q: z.string().max(200, 'at most 200 characters').optional(),
    tag: tagSchema.optional(),
    sort: z.enum(setupSorts).default('updated'),
    /** Templates from every studio instead of the caller's setups. */
    templates: flag.optional(),
    /** The caller's deleted setups that can still be restored (newest deletion first; `sort` is ignored). */
    deleted: flag.optional(),
    cursor: z.string().max(400).optional(),
    limit: z.coerce.number().int().min(1).max(100).default(30),
  })
  .strict()
  .refine((q) => !(q.templates && q.deleted), { message: 'choose templates or deleted, not both', path: ['deleted'] });
export type ListSetupsQuery = z.infer<typeof listSetupsQuery>;

export const createSetupBody = z
  .object({
    studioId: uuid('a studio').optional(),
    title: setupTitle,
    document: documentInput.optional(),
    notes: setupNotes.optional(),
    tags: tagsSchema.optional(),
    /** Publish as a template readable by every user; studio owners only. */
    isTemplate: z.boolean().optional(),
  })
  .strict();
export type CreateSetupBody = z.infer<typeof createSetupBody>;

export const updateSetupBody = z
  .object({
    /** The version the client's copy started from; the save is refused (409) when it is not the current one. */
    version: z.number().int().min(1),
    title: setupTitle.optional(),
    document: documentInput.optional(),
    notes: setupNotes.optional(),
    tags: tagsSchema.optional(),
    isTemplate: z.boolean().optional(),
  })
  .strict();
export type UpdateSetupBody = z.infer<typeof updateSetupBody>;

export const duplicateSetupBody = z
  .object({
    /** Where the copy goes; by default the source's studio when the caller may write there, else their personal studio. */
    studioId: uuid('a studio').optional(),
    title: setupTitle.optional(),
  })
  .strict();
export type DuplicateSetupBody = z.infer<typeof duplicateSetupBody>;

export const commentBody = z
  .object({
    body: z.string().trim().min(1, 'write something').max(4000, 'at most 4000 characters'),
    itemId: idSchema.optional(),
  })
  .strict();
export type CommentBody = z.infer<typeof commentBody>;

export const historyQuery = z
  .object({ before: z.coerce.number().int().min(1).optional(), limit: z.coerce.number().int().min(1).max(100).default(50) })
  .strict();

/**
 * One setup in a list. The server sends every field; the later additions are optional in the type so a
 * client (or a fixture) that predates them still type-checks, and the UI treats a missing `role` as read-only.
 */
export type SetupSummary = {
  id: string;
  studioId: string;
  studioName: string;
  title: string;
  tags: string[];
  version: number;
  isTemplate: boolean;
  itemCount: number;
  updatedAt: string;
  ownerName?: string | null;
  createdAt?: string;
  /** Set in the deleted list only, with the moment the setup can no longer be restored. */
  deletedAt?: string | null;
  restorableUntil?: string | null;
  /** The caller's role in the setup's studio; null for another studio's template. */
  role?: StudioRole | null;
};
export type SetupListResponse = { setups: SetupSummary[]; nextCursor: string | null };

/** One setup with its document, as GET /api/setups/:id returns it. */
export type SetupDetail = {
  id: string;
  studioId: string;
  studioName: string;
  ownerId: string | null;
  ownerName: string | null;
  title: string;
  notes: string;
  tags: string[];
  document: SetupDocument;
  schemaVersion: number;
  version: number;
  isTemplate: boolean;
  createdAt: string;
  updatedAt: string;
  /** The caller's role in the setup's studio; null when they read another studio's template. Crew is read-only. */
  role: StudioRole | null;
};

/** What a save returns: the new version (the document is the one sent). */
export type SetupSaved = Omit<SetupDetail, 'document' | 'role' | 'studioName' | 'ownerName'>;

/** The body of a 409 on save: the stored setup, so the client can show both versions. */
export type VersionConflictError = { error: { code: 'version_conflict'; message: string; current: SetupDetail } };

export type HistoryEntry = {
  id: string;
  version: number;
  title: string;
  itemCount: number;
  savedAt: string;
  savedBy: { id: string; name: string } | null;
};
export type HistoryResponse = { versions: HistoryEntry[]; nextBefore: number | null };
export type HistoryVersion = HistoryEntry & { notes: string; tags: string[]; document: SetupDocument };

export type SetupComment = {
  id: string;
  body: string;
  itemId: string | null;
  createdAt: string;
  author: { id: string; name: string } | null;
};

export type TagCount = { tag: string; count: number };

// ---------------------------------------------------------------------------------------------
// Studios, members, invitations

export const studioName = z.string().trim().min(1, 'give the studio a name').max(80, 'at most 80 characters');
export const createStudioBody = z.object({ name: studioName }).strict();
export const updateStudioBody = z.object({ name: studioName }).strict();
export const inviteMemberBody = z
  .object({
    email: z.string().trim().toLowerCase().email('enter an e-mail address').max(254),
    role: z.enum(studioRoles, 'owner, editor or crew'),
  })
  .strict();
export type InviteMemberBody = z.infer<typeof inviteMemberBody>;
export const updateMemberBody = z.object({ role: z.enum(studioRoles, 'owner, editor or crew') }).strict();

export type StudioSummary = { id: string; name: string; personal: boolean; role: StudioRole };
export type StudioView = StudioSummary & { memberCount: number; createdAt: string };
export type StudioMember = { userId: string; name: string; email: string; role: StudioRole; joinedAt: string };
export type StudioInvitation = {
  id: string;
  email: string;
  role: StudioRole;
  invitedBy: string | null;
  createdAt: string;
  expiresAt: string;
  delivery: string;
};
/** POST /api/studios/:id/members: the invitation and, until a mailer sends it, the link to hand over. */
export type InvitationCreated = { invitation: StudioInvitation; link: string };
/** What the holder of an invitation link may see before joining. */
export type InvitationPreview = {
  studioName: string;
  role: StudioRole;
  email: string;
  invitedBy: string | null;
  expiresAt: string;
  status: 'open' | 'accepted' | 'revoked' | 'expired';
};

export type Me = {
  user: { id: string; name: string; email: string; units: 'metric' | 'imperial'; paper: 'a4' | 'letter' };
  studios: StudioSummary[];
  classes: { id: string; name: string; role: ClassRole }[];
};

/** Every error body the API sends. */
export type ApiError = { error: { code: string; message: string; fields?: Record<string, string> } };

// ---------------------------------------------------------------------------------------------
// Forms on the client, built from the same fields

/** "New setup": tags typed as one comma-separated line. */
export const newSetupForm = z.object({
  title: setupTitle,
  studioId: uuid('a studio'),
  tags: z
    .string()
    .max(1200)
    .transform((s) => s.split(',').map((t) => t.trim()).filter(Boolean))
    .pipe(tagsSchema),
});
export const duplicateForm = z.object({ title: setupTitle, studioId: uuid('a studio') });

/** PATCH /api/me: the account's own settings. */
export const updateMeBody = z
  .object({
    name: z.string().trim().min(1, 'enter your name').max(80).optional(),
    units: z.enum(['metric', 'imperial']).optional(),
    paper: z.enum(['a4', 'letter']).optional(),
  })
  .strict();
export type UpdateMeBody = z.infer<typeof updateMeBody>;
