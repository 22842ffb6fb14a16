// Set furniture drawn for the crew; it does not change the meter.
import { z } from 'zod';
import { choiceField, wordOptions } from '../fields';
import { degrees, itemBase, metres } from '../geometry';
import { defineKind } from './kind';

const propShapes = ['chair', 'stool', 'apple-box', 'table'] as const;

const propSchema = z
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

export const propKind = defineKind({
  kind: 'prop',
  schema: propSchema,
  label: 'Prop',
  group: 'people',
  shape: 'point',
  radiusM: 0.25,
  angle: { key: 'rotationDeg', label: 'Turn (°)' },
  create: (at) => ({ x: at.x, y: at.y, shape: 'stool' }),
  fields: [choiceField<Prop>('Shape', 'shape', wordOptions(propShapes))],
  gear: (i) => i.shape.replace('-', ' '),
});
