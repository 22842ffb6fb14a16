// The client's forms (sign-in, sign-up, passwords, new setup, copy, studios and invitations) and the fields they
// are built from: the same schemas the server validates those bodies with (model/api.ts re-exports them all).
// Kept apart from model/api.ts so the pages with these forms load zod and nothing of the setup document's model.
import { z } from 'zod';
import { oneLine } from './text';

/** A person's name (sign-up, profile). */
export const personName = oneLine({ min: 1, minMessage: 'enter your name', max: 80 });
export const MIN_PASSWORD_LENGTH = 8;
export const MAX_PASSWORD_LENGTH = 128;
/** Passwords so common (or so empty) that they are tried first; compared lower-case, spaces removed. */
const WEAK_PASSWORDS = new Set([
  'password', 'password1', 'password12', 'password123', 'passw0rd', 'p@ssw0rd', 'p@ssword', 'letmein', 'letmein123',
  'qwerty', 'qwertyuiop', 'qwerty123', 'qwerty1234', 'asdfghjkl', 'iloveyou', 'welcome', 'welcome1', 'welcome123',
  'admin', 'admin123', 'administrator', 'changeme', 'changeme123', 'trustno1', 'abc123', 'abcdefgh', 'abcdefghij',
  'football', 'baseball', 'sunshine', 'princess', 'monkey', 'dragon', 'superman', 'starwars', 'whatever',
  'photography', 'photographer', 'falloff', 'falloff123', 'lighting', 'flash', 'strobe', 'softbox',
]);
/** Why a new password is refused, or null when it is fine. The same rule on the client's form and the server. */
export function weakPasswordReason(password: string): string | null {
  if (password.length < MIN_PASSWORD_LENGTH) return `at least ${MIN_PASSWORD_LENGTH} characters`;
  if (password.length > MAX_PASSWORD_LENGTH) return `at most ${MAX_PASSWORD_LENGTH} characters`;
  const squashed = password.toLowerCase().replace(/\s+/g, '');
  if (!squashed) return 'a password cannot be only spaces';
  if (new Set(squashed).size < 4) return 'too easy to guess: use more different characters';
  if (/^\d+$/.test(squashed) && '01234567890123456789'.includes(squashed)) return 'too easy to guess: a run of digits';
  if (/^(\d)\1*$/.test(squashed) || /^\d{1,12}$/.test(squashed)) return 'too easy to guess: digits only';
  if (WEAK_PASSWORDS.has(squashed) || WEAK_PASSWORDS.has(squashed.replace(/[\d!.?]+$/, ''))) return 'too common: choose another';
  return null;
}
export const newPassword = z.string().superRefine((p, ctx) => {
  const why = weakPasswordReason(p);
  if (why) ctx.addIssue({ code: 'custom', message: why });
});

export const signUpBody = z.object({
  name: personName,
  email: z.string().trim().email('enter an e-mail address').max(254),
  password: newPassword,
});
export const signInBody = z.object({
  email: z.string().trim().email('enter an e-mail address'),
  password: z.string().min(1, 'enter your password').max(128),
});

export const studioRoles = ['owner', 'editor', 'crew'] as const;
export type StudioRole = (typeof studioRoles)[number];

// Fields

export const uuid = (what: string) => z.string().uuid(`${what} id`);
/** Tags are compared lower-case; a list keeps each tag once. */
export const tagSchema = oneLine({ min: 1, minMessage: 'an empty tag', max: 40 }).toLowerCase();
export const tagsSchema = z
  .array(tagSchema)
  .max(30, 'at most 30 tags')
  .transform((tags) => [...new Set(tags)]);
export const setupTitle = oneLine({ min: 1, minMessage: 'give the setup a title', max: 200 });

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

/** The forgotten-password form, and the form that sets a new one from the e-mailed link. */
export const forgotPasswordBody = z.object({ email: z.string().trim().email('enter an e-mail address').max(254) });
export const resetPasswordBody = z.object({ password: newPassword });

export const studioName = oneLine({ min: 1, minMessage: 'give the studio a name', max: 80 });
export const createStudioBody = z.object({ name: studioName }).strict();
export const inviteMemberBody = z
  .object({
    email: z.string().trim().toLowerCase().email('enter an e-mail address').max(254),
    role: z.enum(studioRoles, 'owner, editor or crew'),
  })
  .strict();
