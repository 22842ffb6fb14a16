// The setup document: everything drawn on a plan, its steps and shot list. This zod schema is the one
// definition of it; the editor, the API and the exports all parse with it. Old documents are brought up to
// date by `migrateDocument` before parsing.
import { z } from 'zod';
import { idSchema } from './geometry';
import { arrowSchema, noteSchema, tapeSchema } from './items/annotation';
import { cameraSchema } from './items/camera';
import { lightSchema } from './items/light';
import { propSchema } from './items/prop';
import { flagSchema, reflectorSchema, scrimSchema, vflatSchema } from './items/shaper';
import { subjectSchema } from './items/subject';
import { wallSchema } from './items/wall';

export const CURRENT_SCHEMA_VERSION = 1;
export const MAX_ITEMS = 400;

export const itemSchema = z.discriminatedUnion('kind', [
  wallSchema,
  subjectSchema,
  propSchema,
  cameraSchema,
  lightSchema,
  reflectorSchema,
  flagSchema,
  vflatSchema,
  scrimSchema,
  noteSchema,
  tapeSchema,
  arrowSchema,
]);
export type Item = z.infer<typeof itemSchema>;
export type ItemKind = Item['kind'];
export type ItemOf<K extends ItemKind> = Extract<Item, { kind: K }>;

export const stepSchema = z
  .object({
    id: idSchema,
    title: z.string().max(120).default(''),
    note: z.string().max(4000).default(''),
    /** Items switched on (lights) or placed (everything else) from this step on. */
    itemIds: z.array(idSchema).max(MAX_ITEMS).default([]),
  })
  .strict();
export type Step = z.infer<typeof stepSchema>;

export const shotSchema = z
  .object({
    id: idSchema,
    framing: z.enum(['wide', 'medium', 'tight']),
    focalMm: z.number().min(4).max(2000),
    aperture: z.number().min(0.7).max(128),
    shutterS: z.number().positive().max(60),
    iso: z.number().min(25).max(409600),
    note: z.string().max(1000).default(''),
  })
  .strict();
export type Shot = z.infer<typeof shotSchema>;

export const setupDocumentSchema = z
  .object({
    schemaVersion: z.literal(CURRENT_SCHEMA_VERSION),
    /** The drawn area of the plan, metres. */
    stage: z.object({ widthM: z.number().min(1).max(200), depthM: z.number().min(1).max(200) }).strict(),
    items: z.array(itemSchema).max(MAX_ITEMS),
    /** Metered ambient light, EV at ISO 100; null when the room's light does not matter (a dark studio). */
    ambientEv100: z.number().min(-10).max(24).nullable().default(null),
    /** The aperture the photographer wants at the subject, for "power to set". */
    targetAperture: z.number().min(0.7).max(128).nullable().default(null),
    steps: z.array(stepSchema).max(100).default([]),
    shots: z.array(shotSchema).max(100).default([]),
  })
  .strict()
  .superRefine((doc, ctx) => {
    const seen = new Set<string>();
    doc.items.forEach((item, i) => {
      if (seen.has(item.id)) ctx.addIssue({ code: 'custom', path: ['items', i, 'id'], message: `duplicate item id "${item.id}"` });
      seen.add(item.id);
    });
  });
export type SetupDocument = z.infer<typeof setupDocumentSchema>;

/** Ordered migrations: entry n turns a version-n document into version n+1 (plain JSON in, plain JSON out). */
const migrations: Record<number, (doc: Record<string, unknown>) => Record<string, unknown>> = {};

/** Bring a stored or uploaded document up to the current schema version (it is validated afterwards). */
export function migrateDocument(raw: unknown): unknown {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return raw;
  let doc = raw as Record<string, unknown>;
  let v = doc.schemaVersion;
  while (typeof v === 'number' && v < CURRENT_SCHEMA_VERSION && migrations[v]) {
    doc = migrations[v]!(doc);
    v = doc.schemaVersion;
  }
  return doc;
}

export function parseDocument(raw: unknown): SetupDocument {
  return setupDocumentSchema.parse(migrateDocument(raw));
}

export function emptyDocument(): SetupDocument {
  return setupDocumentSchema.parse({ schemaVersion: CURRENT_SCHEMA_VERSION, stage: { widthM: 8, depthM: 6 }, items: [] });
}
