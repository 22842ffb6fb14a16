// Notes drawn on the plan for the crew: text labels, a distance tape and arrows.
import { z } from 'zod';
import { itemBase, metres, pointSchema } from '../geometry';

export const noteSchema = z
  .object({ ...itemBase, kind: z.literal('note'), x: metres(), y: metres(), text: z.string().max(500).default('') })
  .strict();
export const tapeSchema = z.object({ ...itemBase, kind: z.literal('tape'), a: pointSchema, b: pointSchema }).strict();
export const arrowSchema = z.object({ ...itemBase, kind: z.literal('arrow'), a: pointSchema, b: pointSchema }).strict();

export type Note = z.infer<typeof noteSchema>;
export type Tape = z.infer<typeof tapeSchema>;
export type Arrow = z.infer<typeof arrowSchema>;
