// Notes drawn on the plan for the crew: text labels, a distance tape and arrows.
import { z } from 'zod';
import { textField } from '../fields';
import { itemBase, metres, pointSchema, type Point } from '../geometry';
import { defineKind } from './kind';
import { multiLine } from '../text';

const noteSchema = z
  .object({ ...itemBase, kind: z.literal('note'), x: metres(), y: metres(), text: multiLine({ max: 500 }).default('') })
  .strict();
const tapeSchema = z.object({ ...itemBase, kind: z.literal('tape'), a: pointSchema, b: pointSchema }).strict();
const arrowSchema = z.object({ ...itemBase, kind: z.literal('arrow'), a: pointSchema, b: pointSchema }).strict();

export type Note = z.infer<typeof noteSchema>;

/** A level segment `lengthM` long centred on `at`. */
export const segmentAt = (at: Point, lengthM: number) => ({ a: { x: at.x - lengthM / 2, y: at.y }, b: { x: at.x + lengthM / 2, y: at.y } });

export const noteKind = defineKind({
  kind: 'note',
  schema: noteSchema,
  label: 'Note',
  group: 'note',
  shape: 'point',
  radiusM: 0.3,
  create: (at) => ({ x: at.x, y: at.y, text: 'Note' }),
  fields: [textField<Note>('Text', 'text', true)],
});

export const tapeKind = defineKind({
  kind: 'tape',
  schema: tapeSchema,
  label: 'Distance tape',
  group: 'note',
  shape: 'segment',
  radiusM: 0.1,
  create: (at) => segmentAt(at, 2),
  fields: [],
});

export const arrowKind = defineKind({
  kind: 'arrow',
  schema: arrowSchema,
  label: 'Arrow',
  group: 'note',
  shape: 'segment',
  radiusM: 0.1,
  create: (at) => segmentAt(at, 1.5),
  fields: [],
});
