// A wall or backdrop: a segment on the plan with a surface colour. Reflectance comes from the colour's
// relative luminance unless given (see calc/). Seamless paper is drawn as a backdrop.
import { z } from 'zod';
import { hexColour, itemBase, pointSchema, positiveMetres } from '../geometry';

export const wallSchema = z
  .object({
    ...itemBase,
    kind: z.literal('wall'),
    surface: z.enum(['wall', 'seamless', 'curtain']).default('wall'),
    a: pointSchema,
    b: pointSchema,
    heightM: positiveMetres(20).default(2.7),
    colour: hexColour.default('#d9d6cf'),
    /** 0..1; null means "from the colour". */
    reflectance: z.number().min(0).max(1).nullable().default(null),
  })
  .strict();
export type Wall = z.infer<typeof wallSchema>;
