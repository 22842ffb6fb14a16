// Passive shapers: reflectors bounce light, flags block it, v-flats do either (one white and one black side),
// scrims soften a light that passes through.
import { z } from 'zod';
import { degrees, itemBase, metres, positiveMetres } from '../geometry';

const panel = {
  ...itemBase,
  x: metres(),
  y: metres(),
  /** The way the panel's working face points on the plan. */
  rotationDeg: degrees.default(0),
  widthM: positiveMetres(10).default(1),
  heightM: positiveMetres(10).default(1),
};

export const reflectorSchema = z
  .object({ ...panel, kind: z.literal('reflector'), finish: z.enum(['white', 'silver', 'gold']).default('white') })
  .strict();
export const flagSchema = z.object({ ...panel, kind: z.literal('flag') }).strict();
export const vflatSchema = z
  .object({ ...panel, kind: z.literal('vflat'), face: z.enum(['white', 'black']).default('white') })
  .strict();
export const scrimSchema = z
  .object({ ...panel, kind: z.literal('scrim'), lossStops: z.number().min(0).max(6).default(1) })
  .strict();

export type Reflector = z.infer<typeof reflectorSchema>;
export type Flag = z.infer<typeof flagSchema>;
export type VFlat = z.infer<typeof vflatSchema>;
export type Scrim = z.infer<typeof scrimSchema>;
