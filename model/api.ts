// Bodies and queries of the HTTP API, shared by the client's forms and the server's validation.
import { z } from 'zod';
import { setupDocumentSchema } from './document';

export const signUpBody = z.object({
  name: z.string().trim().min(1, 'enter your name').max(80),
  email: z.string().trim().email('enter an e-mail address'),
  password: z.string().min(8, 'at least 8 characters').max(128),
});
export const signInBody = z.object({
  email: z.string().trim().email('enter an e-mail address'),
  password: z.string().min(1, 'enter your password').max(128),
});

const tag = z.string().trim().min(1).max(40);

export const listSetupsQuery = z
  .object({
    studio: z.string().uuid('a studio id').optional(),
    q: z.string().max(200).optional(),
    tag: tag.optional(),
    cursor: z.string().max(200).optional(),
    limit: z.coerce.number().int().min(1).max(100).default(30),
  })
  .strict();
export type ListSetupsQuery = z.infer<typeof listSetupsQuery>;

export const createSetupBody = z
  .object({
    studioId: z.string().uuid('a studio id').optional(),
    title: z.string().trim().min(1, 'give the setup a title').max(200),
    document: setupDocumentSchema.optional(),
    notes: z.string().max(20000).optional(),
    tags: z.array(tag).max(30).optional(),
  })
  .strict();
export type CreateSetupBody = z.infer<typeof createSetupBody>;

/** What the API returns for one setup in a list. */
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
};
export type SetupListResponse = { setups: SetupSummary[]; nextCursor: string | null };

export type StudioRole = 'owner' | 'editor' | 'crew';
export type ClassRole = 'instructor' | 'student';
export type StudioSummary = { id: string; name: string; personal: boolean; role: StudioRole };
export type Me = {
  user: { id: string; name: string; email: string; units: 'metric' | 'imperial'; paper: 'a4' | 'letter' };
  studios: StudioSummary[];
  classes: { id: string; name: string; role: ClassRole }[];
};

/** Every error body the API sends. */
export type ApiError = { error: { code: string; message: string; fields?: Record<string, string> } };
