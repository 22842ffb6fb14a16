// The person (or product) being lit: where the meter reads the light.
import { z } from 'zod';
import { degrees, itemBase, metres, positiveMetres } from '../geometry';

export const subjectSchema = z
  .object({
    ...itemBase,
    kind: z.literal('subject'),
    x: metres(),
    y: metres(),
    /** Which way the face points on the plan (the meter's receptor faces this way). */
    facingDeg: degrees.default(0),
    faceHeightM: positiveMetres(5).default(1.6),
    pose: z.enum(['standing', 'seated']).default('standing'),
  })
  .strict();
export type Subject = z.infer<typeof subjectSchema>;
