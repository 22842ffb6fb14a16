// The person (or product) being lit: where the meter reads the light.
import { z } from 'zod';
import { choiceField, lengthField } from '../fields';
import { degrees, itemBase, metres, positiveMetres } from '../geometry';
import { defineKind } from './kind';

const subjectSchema = z
  .object({
    ...itemBase,
    kind: z.literal('subject'),
    x: metres(),
    y: metres(),
    /** Which way the face points on the plan (the meter's receptor faces this way). */
    facingDeg: degrees.default(0),
    faceHeightM: positiveMetres(5).default(1.6),
    pose: z.enum(['standing', 'seated']).default('standing'),
    /** Skin tone of the neutral form in the frame view, from a small neutral range (calc/frame SKIN_TONES). */
    skinTone: z.enum(['light', 'medium-light', 'mid', 'medium-deep', 'deep']).default('mid'),
  })
  .strict();
export type Subject = z.infer<typeof subjectSchema>;

/** Face height for a pose, common practice for an adult. */
const faceHeightFor = { standing: 1.6, seated: 1.2 } as const;

export const subjectKind = defineKind({
  kind: 'subject',
  schema: subjectSchema,
  label: 'Subject',
  group: 'people',
  shape: 'point',
  radiusM: 0.3,
  angle: { key: 'facingDeg', label: 'Facing (°)' },
  create: (at) => ({ x: at.x, y: at.y, facingDeg: 90 }),
  fields: [
    lengthField<Subject>('Face height', 'faceHeightM', 0.05, { min: 0.1, max: 5 }),
    {
      ...choiceField<Subject>('Pose', 'pose', [{ id: 'standing', label: 'standing' }, { id: 'seated', label: 'seated' }]),
      set: (v: string) => ({ pose: v, faceHeightM: faceHeightFor[v as Subject['pose']] }),
    },
  ],
});
