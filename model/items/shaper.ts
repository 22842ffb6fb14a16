// Passive shapers: reflectors bounce light, flags block it, v-flats do either (one white and one black side),
// scrims soften a light that passes through.
import { z } from 'zod';
import { degrees, itemBase, metres, positiveMetres } from '../geometry';

/** A panel stands upright on the plan, centred at (x, y), its working face pointing along rotationDeg. */
const panel = (d: { widthM: number; heightM: number; baseM: number }) => ({
  ...itemBase,
  x: metres(),
  y: metres(),
  rotationDeg: degrees.default(0),
  widthM: positiveMetres(10).default(d.widthM),
  heightM: positiveMetres(10).default(d.heightM),
  /** Height of the panel's lower edge above the floor. */
  baseM: z.number().min(0).max(10).default(d.baseM),
});

export const reflectorSchema = z
  .object({ ...panel({ widthM: 1, heightM: 1, baseM: 0.5 }), kind: z.literal('reflector'), finish: z.enum(['white', 'silver', 'gold']).default('white') })
  .strict();
export const flagSchema = z.object({ ...panel({ widthM: 0.6, heightM: 0.9, baseM: 1 }), kind: z.literal('flag') }).strict();
export const vflatSchema = z
  .object({ ...panel({ widthM: 1.2, heightM: 2.4, baseM: 0 }), kind: z.literal('vflat'), face: z.enum(['white', 'black']).default('white') })
  .strict();
export const scrimSchema = z
  .object({ ...panel({ widthM: 1.2, heightM: 1.2, baseM: 0.8 }), kind: z.literal('scrim'), lossStops: z.number().min(0).max(6).default(1) })
  .strict();

export type Reflector = z.infer<typeof reflectorSchema>;
export type Flag = z.infer<typeof flagSchema>;
export type VFlat = z.infer<typeof vflatSchema>;
export type Scrim = z.infer<typeof scrimSchema>;
