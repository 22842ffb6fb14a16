// The setup document: everything drawn on a plan, its steps and shot list. This zod schema is the one
// definition of it; the editor, the API and the exports all parse with it. Old documents are brought up to
// date by `migrateDocument` before parsing.
import { z } from 'zod';
import { idSchema } from './geometry';
import { itemSchemas } from './items';
import { cleanStoredText, multiLine, oneLine } from './text';

export const CURRENT_SCHEMA_VERSION = 2;
const MAX_ITEMS = 400;

/** Any plan item: the union of every kind's schema (model/items/). */
export const itemSchema = z.discriminatedUnion('kind', itemSchemas);
export type Item = z.infer<typeof itemSchema>;
export type ItemKind = Item['kind'];
export type ItemOf<K extends ItemKind> = Extract<Item, { kind: K }>;

const stepSchema = z
  .object({
    id: idSchema,
    title: oneLine({ max: 120 }).default(''),
    note: multiLine({ max: 4000 }).default(''),
    /** Items switched on (lights) or placed (everything else) from this step on. */
    itemIds: z.array(idSchema).max(MAX_ITEMS).default([]),
  })
  .strict();
export type Step = z.infer<typeof stepSchema>;

const shotSchema = z
  .object({
    id: idSchema,
    framing: z.enum(['wide', 'medium', 'tight']),
    focalMm: z.number().min(4).max(2000),
    aperture: z.number().min(0.7).max(128),
    shutterS: z.number().positive().max(60),
    iso: z.number().min(25).max(409600),
    note: multiLine({ max: 1000 }).default(''),
  })
  .strict();
export type Shot = z.infer<typeof shotSchema>;

/** Default ceiling height of a room, m (from memory: a typical studio or living room is 2.5–4 m). */
export const DEFAULT_CEILING_M = 3;

/**
 * How the meter reads this setup: the exposure receptor (default a dome at the subject pointed at the camera,
 * as most handheld meters are used), and the room's floor and ceiling (the ceiling null outdoors or on a big
 * stage). Colours are CSS hex; reflectance null: from the colour.
 */
const meterSettingsSchema = z
  .object({
    receptor: z.enum(['dome-camera', 'flat-light', 'flat-face']).default('dome-camera'),
    floor: z
      .object({ colour: z.string().regex(/^#[0-9a-fA-F]{6}$/).default('#8a8580'), reflectance: z.number().min(0).max(1).nullable().default(null) })
      .strict()
      .default({ colour: '#8a8580', reflectance: null }),
    ceiling: z
      .object({
        heightM: z.number().min(1).max(50).nullable().default(DEFAULT_CEILING_M),
        colour: z.string().regex(/^#[0-9a-fA-F]{6}$/).default('#f0efea'),
        reflectance: z.number().min(0).max(1).nullable().default(null),
      })
      .strict()
      .default({ heightM: DEFAULT_CEILING_M, colour: '#f0efea', reflectance: null }),
  })
  .strict();
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
    meter: meterSettingsSchema.default(() => meterSettingsSchema.parse({})),
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
const migrations: Record<number, (doc: Record<string, unknown>) => Record<string, unknown>> = {
  // 1 → 2: the meter's receptor, floor and ceiling (defaults: dome at the camera, a grey floor, a 3 m ceiling).
  1: (doc) => ({ ...doc, schemaVersion: 2, meter: doc.meter ?? meterSettingsSchema.parse({}) }),
};

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

/** Read a stored document: migrated, text cleaned of characters saved before the text rules, validated. */
export function parseDocument(raw: unknown): SetupDocument {
  return setupDocumentSchema.parse(cleanStoredText(migrateDocument(raw)));
}

export function emptyDocument(): SetupDocument {
  return setupDocumentSchema.parse({ schemaVersion: CURRENT_SCHEMA_VERSION, stage: { widthM: 8, depthM: 6 }, items: [] });
}
