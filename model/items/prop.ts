// Set furniture drawn for the crew; it does not change the meter.
import { z } from 'zod';
import { degrees, itemBase, metres } from '../geometry';

export const propShapes = ['chair', 'stool', 'apple-box', 'table'] as const;

export const propSchema = z
  .object({
    ...itemBase,
    kind: z.literal('prop'),
    shape: z.enum(propShapes).default('stool'),
    x: metres(),
    y: metres(),
    rotationDeg: degrees.default(0),
  })
  .strict();
export type Prop = z.infer<typeof propSchema>;
