// Bodies and queries of the HTTP API, shared by the client's forms and the server's validation, and the
// shapes of its answers.
import { z } from 'zod';
import { migrateDocument, setupDocumentSchema, type SetupDocument } from './document';
import { checkSchema, type Check, type CheckResult } from './classes';
import { idSchema, pointSchema } from './geometry';
import { multiLine, oneLine, plainQuery } from './text';
import { inviteMemberBody, personName, setupTitle, studioName, studioRoles, tagSchema, tagsSchema, uuid, type StudioRole } from './forms';

// The forms' schemas and fields live in model/forms.ts (light enough for the sign-in page); they are part of the API.
export * from './forms';


export type ClassRole = 'instructor' | 'student';

// ---------------------------------------------------------------------------------------------
// Fields

export const setupNotes = multiLine({ max: 20000 });
/** A document as sent by a client: brought up to the current schema version, then validated. */
export const documentInput = z.preprocess(migrateDocument, setupDocumentSchema);
/** An update body must change something: an empty one is a 400 naming the body. */
const somethingToChange = [(b: object) => Object.values(b).some((v) => v !== undefined), { message: 'nothing to change: send at least one field' }] as const;
const flag = z.enum(['0', '1', 'true', 'false']).transform((v) => v === '1' || v === 'true');

// ---------------------------------------------------------------------------------------------
// Setups

export const setupSorts = ['updated', 'created', 'title'] as const;
export type SetupSort = (typeof setupSorts)[number];

export const listSetupsQuery = z
  .object({
    studio: uuid('a studio').optional(),
    q: plainQuery(200).optional(),
    tag: tagSchema.optional(),
    sort: z.enum(setupSorts).default('updated'),
    /** The templates the caller may use (the gallery for everyone and their studios' own) instead of their setups. */
    templates: flag.optional(),
    /** The caller's deleted setups that can still be restored (newest deletion first; `sort` is ignored). */
    deleted: flag.optional(),
    cursor: plainQuery(400).optional(),
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
    /** A template of its studio (its members start new setups from it); studio owners only. */
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

/** PUT /api/setups/:id/everyone: publish a template to, or withdraw it from, the gallery for everyone (operators only). */
export const forEveryoneBody = z.object({ forEveryone: z.boolean('true or false') }).strict();
export type ForEveryoneBody = z.infer<typeof forEveryoneBody>;
export type ForEveryoneResponse = { id: string; isTemplate: boolean; forEveryone: boolean };

/** A comment on a setup or a submission. */
export const commentText = multiLine({ min: 1, minMessage: 'write something', max: 4000, trim: true });

/** A new comment on a setup: a thread's start (optionally pinned to an item or a point) or a reply to one. */
export const commentBody = z
  .object({
    body: commentText,
    itemId: idSchema.optional(),
    /** A point on the plan, metres. */
    point: pointSchema.optional(),
    /** The thread this replies to (its first comment); a reply carries no pin of its own. */
    parentId: uuid('a comment').optional(),
  })
  .strict()
  .refine((c) => !(c.itemId && c.point), { message: 'pin to an item or to a point, not both', path: ['point'] })
  .refine((c) => !(c.parentId && (c.itemId || c.point)), { message: 'a reply is pinned where its thread is', path: ['parentId'] });
export type CommentBody = z.infer<typeof commentBody>;
/** Resolve or reopen a thread. */
export const resolveCommentBody = z.object({ resolved: z.boolean('true or false') }).strict();
export type ResolveCommentBody = z.infer<typeof resolveCommentBody>;
/** Several setups' crew sheets in one PDF (a shoot day), in the order given, behind a cover listing them. */
export const daySheetBody = z
  .object({
    setupIds: z.array(uuid('a setup')).min(1, 'choose at least one setup').max(20, 'at most 20 setups').refine((a) => new Set(a).size === a.length, 'a setup is listed twice'),
    title: oneLine({ max: 120 }).optional(),
    /** The day, as printed on the cover (free text: "Saturday 14 March"). */
    date: oneLine({ max: 60 }).optional(),
  })
  .strict();
export type DaySheetBody = z.infer<typeof daySheetBody>;

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
  /** In the gallery for everyone (an operator published it). */
  forEveryone?: boolean;
  itemCount: number;
  updatedAt: string;
  ownerName?: string | null;
  createdAt?: string;
  /** Set in the deleted list only, with the moment the setup can no longer be restored. */
  deletedAt?: string | null;
  restorableUntil?: string | null;
  /** The caller's role in the setup's studio; null for another studio's template. */
  role?: StudioRole | null;
  /** Comments by others since the caller last read the setup's comments. */
  unreadComments?: number;
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
  /** In the gallery for everyone (an operator published it). Optional for clients and fixtures that predate it. */
  forEveryone?: boolean;
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
  /** A point on the plan, metres, or null. */
  point: { x: number; y: number } | null;
  /** The thread's first comment for a reply; null for a thread's start. */
  parentId: string | null;
  /** Set on a thread's start once resolved. */
  resolvedAt: string | null;
  resolvedBy: { id: string; name: string } | null;
  createdAt: string;
  author: { id: string; name: string } | null;
};
/** A setup's comments oldest first, and when the caller last read them before this answer (null: never). */
export type CommentsResponse = { comments: SetupComment[]; lastReadAt: string | null };

export type TagCount = { tag: string; count: number };

// ---------------------------------------------------------------------------------------------
// Studios, members, invitations

export const updateStudioBody = z
  .object({
    name: studioName.optional(),
    /** The studio setting "crew may copy setups out" (off by default). */
    crewMayCopy: z.boolean('true or false').optional(),
  })
  .strict()
  .refine((b) => b.name !== undefined || b.crewMayCopy !== undefined, { message: 'change the name or crewMayCopy' });
export type InviteMemberBody = z.infer<typeof inviteMemberBody>;
export const updateMemberBody = z.object({ role: z.enum(studioRoles, 'owner, editor or crew') }).strict();

export type StudioSummary = { id: string; name: string; personal: boolean; role: StudioRole };
export type StudioView = StudioSummary & { memberCount: number; createdAt: string; crewMayCopy: boolean };
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

/**
 * GET /api/auth/get-session (better-auth's own route): who is signed in, or null. The client reads it with a
 * plain fetch (hooks/session.ts); this names the part of better-auth's answer the app relies on (it sends more).
 */
export const sessionResponse = z
  .object({
    session: z.object({ id: z.string(), userId: z.string(), expiresAt: z.string() }),
    user: z.object({ id: z.string(), name: z.string(), email: z.string(), emailVerified: z.boolean() }),
  })
  .nullable();
export type SessionResponse = z.infer<typeof sessionResponse>;

/** Every error body the API sends. */
export type ApiError = { error: { code: string; message: string; fields?: Record<string, string> } };

// ---------------------------------------------------------------------------------------------
// Forms on the client, built from the same fields


/** PATCH /api/me: the account's own settings. */
export const updateMeBody = z
  .object({
    name: personName.optional(),
    units: z.enum(['metric', 'imperial']).optional(),
    paper: z.enum(['a4', 'letter']).optional(),
  })
  .strict();
export type UpdateMeBody = z.infer<typeof updateMeBody>;

// ---------------------------------------------------------------------------------------------
// Crew sheets, share links, sending to the crew, photos

export const paperSizes = ['a4', 'letter'] as const;
export type PaperSize = (typeof paperSizes)[number];

/** GET …/plan.png: how wide the image is, in pixels (height follows the stage's proportions). `v`, the setup's
 *  version, only makes the address change when the setup does, so a browser never shows a stale preview. */
export const planPngQuery = z
  .object({
    width: z.coerce.number().int().min(200, 'at least 200 px').max(4000, 'at most 4000 px').default(2000),
    v: z.coerce.number().int().min(0).optional(),
  })
  .strict();
/** GET …/frame.png: the frame (what the camera records) `width` px wide; `step` (1-based) for the plan at a step. */
export const framePngQuery = z
  .object({
    width: z.coerce.number().int().min(80, 'at least 80 px').max(2000, 'at most 2000 px').default(640),
    look: z.enum(['colour', 'mono']).default('colour'),
    step: z.coerce.number().int().min(1).max(100).optional(),
    v: z.coerce.number().int().min(0).optional(),
  })
  .strict();
/** GET …/plan.svg takes no options (the drawing scales). */
export const planSvgQuery = z.object({}).strict();
/** GET …/crew-sheet.pdf: paper and units default to the account's (or, for a share link, its creator's). */
export const crewSheetQuery = z
  .object({ paper: z.enum(paperSizes).optional(), units: z.enum(['metric', 'imperial']).optional(), download: z.enum(['0', '1']).optional() })
  .strict();

export const createShareBody = z.object({ label: oneLine({ max: 80 }).optional() }).strict();
export type CreateShareBody = z.infer<typeof createShareBody>;
/** A share link as listed to the setup's studio. Only its token's hash is stored, so the list names a link by
 *  its label and the token's last characters; the whole address is given once, when it is made. */
export type ShareLink = { id: string; label: string; tokenTail: string; createdAt: string; createdBy: string | null; lastOpenedAt: string | null };
/** POST /api/setups/:id/shares: the link (the only time its token is sent) and its row. */
export type ShareCreated = { token: string; url: string; share: ShareLink };
/** GET /api/shared/:token: the setup as the holder of the link sees it. */
/** A signed-in member opening a share link: the setup behind it, for the comment thread. */
export type ShareMembership = { setupId: string; role: StudioRole; me: { id: string; name: string } };
export type SharedSetup = {
  title: string;
  notes: string;
  studioName: string;
  version: number;
  updatedAt: string;
  units: 'metric' | 'imperial';
  paper: PaperSize;
  document: SetupDocument;
};

const emailAddress = z.string().trim().toLowerCase().email('not an e-mail address').max(254);
export const MAX_RECIPIENTS = 10;
export const sendToCrewBody = z
  .object({
    to: z.array(emailAddress).min(1, 'add at least one address').max(MAX_RECIPIENTS, `at most ${MAX_RECIPIENTS} addresses`).transform((a) => [...new Set(a)]),
    message: multiLine({ max: 2000, trim: true }).optional(),
    /** Attach the crew sheet PDF as well as the link (default yes). */
    attachPdf: z.boolean().default(true),
  })
  .strict();
export type SendToCrewBody = z.input<typeof sendToCrewBody>;
/** The form: addresses typed as one line, separated by commas, spaces or new lines; one message names the bad ones. */
export const sendToCrewForm = z.object({
  to: z
    .string()
    .max(3000)
    .transform((s) => s.split(/[\s,;]+/).filter(Boolean))
    .superRefine((list, ctx) => {
      const bad = list.filter((a) => !emailAddress.safeParse(a).success);
      if (bad.length) ctx.addIssue({ code: 'custom', message: `not an e-mail address: ${bad.join(', ')}` });
      else if (!list.length) ctx.addIssue({ code: 'custom', message: 'add at least one address' });
      else if (new Set(list.map((a) => a.toLowerCase())).size > MAX_RECIPIENTS) ctx.addIssue({ code: 'custom', message: `at most ${MAX_RECIPIENTS} addresses` });
    })
    .transform((list) => [...new Set(list.map((a) => a.trim().toLowerCase()))]),
  message: multiLine({ max: 2000 }),
});
export type SendToCrewResult = { sent: string[]; url: string; shareId: string; attached: boolean };

export const photoKinds = ['reference', 'result'] as const;
export type PhotoKind = (typeof photoKinds)[number];
export const MAX_PHOTO_BYTES = 20 * 1024 * 1024;
/** The most pixels a photo may have (read from its header before anything decodes it): 64 MP covers today's
 *  high-resolution cameras; an image bomb (a small file of a huge picture) is refused unread. */
export const MAX_PHOTO_PIXELS = 64_000_000;
export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif'] as const;
export const uploadPhotoFields = z.object({ kind: z.enum(photoKinds, 'reference or result').default('result') }).strict();
/** A photo attached to a setup, with the camera settings its EXIF gave (null where it said nothing). */
export type SetupPhoto = {
  id: string;
  kind: PhotoKind;
  filename: string;
  mime: string;
  bytes: number;
  width: number | null;
  height: number | null;
  /** Image and thumbnail URLs (same origin); thumbnailUrl is null when no thumbnail could be made (HEIC here). */
  url: string;
  thumbnailUrl: string | null;
  exif: { iso: number | null; aperture: number | null; shutterS: number | null; focalMm: number | null; camera: string | null; takenAt: string | null };
  uploadedBy: { id: string; name: string } | null;
  createdAt: string;
  /** Why something is missing (no thumbnail, no settings), in plain words. */
  notes: string[];
};

// ---------------------------------------------------------------------------------------------
// Classes, lessons, assignments, submissions

export const classRoles = ['instructor', 'student'] as const;
export const className = oneLine({ min: 1, minMessage: 'give the class a name', max: 120 });
export const createClassBody = z.object({ name: className }).strict();
export const updateClassBody = z.object({ name: className }).strict();
/** Join codes are typed by people: case and spaces do not matter. */
export const joinClassBody = z
  .object({ code: z.string().transform((s) => s.replace(/[\s-]/g, '').toUpperCase()).pipe(z.string().min(4, 'a join code has at least 4 letters').max(12, 'at most 12 letters').regex(/^[A-Z0-9]+$/, 'letters and digits only')) })
  .strict();
export const inviteToClassBody = z
  .object({
    email: z.string().trim().toLowerCase().email('enter an e-mail address').max(254),
    role: z.enum(classRoles, 'instructor or student').default('student'),
  })
  .strict();
export type InviteToClassBody = z.input<typeof inviteToClassBody>;

const lessonTitle = oneLine({ min: 1, minMessage: 'give the lesson a title', max: 200 });
const teachingText = multiLine({ max: 8000 });
export const createLessonBody = z.object({ title: lessonTitle, summary: teachingText.optional() }).strict();
export const updateLessonBody = z
  .object({ title: lessonTitle.optional(), summary: teachingText.optional(), published: z.boolean().optional(), position: z.number().int().min(0).max(10000).optional() })
  .strict()
  .refine(...somethingToChange);
export type UpdateLessonBody = z.infer<typeof updateLessonBody>;
export const addLessonSetupBody = z.object({ setupId: uuid('a setup'), note: teachingText.optional() }).strict();
export const updateLessonSetupBody = z
  .object({
    note: teachingText.optional(),
    /** The instructor's words per step id; an empty text removes a step's note. */
    stepNotes: z.record(idSchema, multiLine({ max: 4000 })).optional(),
    /** Move to this place in the lesson (0 = first). */
    position: z.number().int().min(0).max(1000).optional(),
  })
  .strict()
  .refine(...somethingToChange);
export type UpdateLessonSetupBody = z.infer<typeof updateLessonSetupBody>;

const assignmentTitle = oneLine({ min: 1, minMessage: 'give the assignment a title', max: 200 });
const dueAt = z.iso.datetime({ offset: true, error: 'a date and time, e.g. 2027-03-01T18:00:00Z' }).nullable();
export const createAssignmentBody = z
  .object({
    title: assignmentTitle,
    brief: teachingText.optional(),
    check: checkSchema.nullable().optional(),
    /** The lesson setup whose look is the reference (default: the lesson's first). */
    referenceId: uuid('a lesson setup').nullable().optional(),
    dueAt: dueAt.optional(),
  })
  .strict();
export type CreateAssignmentBody = z.input<typeof createAssignmentBody>;
export const updateAssignmentBody = z
  .object({ title: assignmentTitle.optional(), brief: teachingText.optional(), check: checkSchema.nullable().optional(), referenceId: uuid('a lesson setup').nullable().optional(), dueAt: dueAt.optional() })
  .strict()
  .refine(...somethingToChange);
export type UpdateAssignmentBody = z.input<typeof updateAssignmentBody>;
export const startAssignmentBody = z.object({ from: z.enum(['reference', 'blank'], 'reference or blank').default('reference') }).strict();
/** Submit the working copy (default) or another setup the student can read. */
export const submitBody = z.object({ setupId: uuid('a setup').optional() }).strict();
export const updateSubmissionBody = z.object({ reviewed: z.boolean().optional(), shared: z.boolean().optional() }).strict().refine(...somethingToChange);
export const submissionCommentBody = z
  .object({
    body: commentText,
    itemId: idSchema.optional(),
    /** A point on the plan, metres. */
    point: pointSchema.optional(),
  })
  .strict()
  .refine((c) => !(c.itemId && c.point), { message: 'pin to an item or to a point, not both', path: ['point'] });
export type SubmissionCommentBody = z.infer<typeof submissionCommentBody>;

export type ClassSummary = { id: string; name: string; role: ClassRole; studentCount: number; lessonCount: number };
/** An invitation to the caller's own address, shown on their Classes screen. */
export type ClassInvitePreview = { classId: string; className: string; role: ClassRole; invitedBy: string | null; createdAt: string };
export type ClassListResponse = { classes: ClassSummary[]; invitations: ClassInvitePreview[] };
export type ClassView = ClassSummary & { createdAt: string; instructors: string[]; /** Instructors only. */ joinCode: string | null };
export type ClassMember = { userId: string; name: string; /** Shown to instructors only. */ email: string | null; role: ClassRole; joinedAt: string };
export type ClassInvitation = { id: string; email: string; role: ClassRole; invitedBy: string | null; createdAt: string; delivery: string };
export type JoinedClass = { classId: string; role: ClassRole };

export type LessonSummary = {
  id: string;
  classId: string;
  title: string;
  summary: string;
  position: number;
  published: boolean;
  setupCount: number;
  assignmentCount: number;
  updatedAt: string;
};
export type LessonSetup = {
  id: string;
  position: number;
  /** The setup the snapshot came from; null once it is gone. */
  setupId: string | null;
  title: string;
  document: SetupDocument;
  sourceVersion: number;
  snapshotAt: string;
  note: string;
  stepNotes: Record<string, string>;
  /** Instructors: the setup's version now, when it has changed since the snapshot (refresh to take it). */
  newerVersion: number | null;
};
export type LessonDetail = LessonSummary & { className: string; role: ClassRole; setups: LessonSetup[]; assignments: AssignmentSummary[] };

export type SubmissionSummary = {
  id: string;
  assignmentId: string;
  student: { id: string; name: string };
  attempt: number;
  title: string;
  /** The check's verdict at submission; null when the assignment has no check. */
  passed: boolean | null;
  status: 'submitted' | 'reviewed';
  shared: boolean;
  submittedAt: string;
  reviewedAt: string | null;
  commentCount: number;
};
export type AssignmentSummary = {
  id: string;
  lessonId: string;
  lessonTitle: string;
  title: string;
  brief: string;
  check: Check | null;
  referenceId: string | null;
  dueAt: string | null;
  createdAt: string;
  /** Instructors: how many students submitted, and how many latest attempts are reviewed. */
  submittedCount: number | null;
  reviewedCount: number | null;
};
export type AssignmentWork = { setupId: string | null; startedFrom: 'reference' | 'blank'; latest: SubmissionSummary | null };
export type AssignmentDetail = AssignmentSummary & {
  classId: string;
  className: string;
  role: ClassRole;
  reference: { id: string; title: string; document: SetupDocument } | null;
  /** Students: their working copy and latest attempt; null before they start. */
  mine: AssignmentWork | null;
};
export type SubmissionComment = {
  id: string;
  body: string;
  itemId: string | null;
  point: { x: number; y: number } | null;
  createdAt: string;
  author: { id: string; name: string } | null;
};
export type SubmissionDetail = SubmissionSummary & {
  classId: string;
  assignmentTitle: string;
  brief: string;
  check: Check | null;
  checkResult: CheckResult | null;
  document: SetupDocument;
  reference: { title: string; document: SetupDocument } | null;
  comments: SubmissionComment[];
  /** The caller may comment (the instructor, the student who submitted) and review (instructors). */
  canComment: boolean;
  canReview: boolean;
};

