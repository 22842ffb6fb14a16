// A light: strobe head, speedlight or continuous lamp, with its modifier, gel and power setting.
import { z } from 'zod';
import { GEL_IDS, MODIFIER_IDS } from '../../calc';
import { degrees, itemBase, metres, positiveMetres } from '../geometry';

export const lightSourceSchema = z.discriminatedUnion('type', [
  /** Studio strobe rated by stored energy. */
  z.object({ type: z.literal('strobe'), energyWs: z.number().positive().max(12000) }).strict(),
  /** Speedlight rated by its guide number in metres at ISO 100 (at the zoom in use). */
  z.object({ type: z.literal('speedlight'), guideNumberM: z.number().positive().max(200) }).strict(),
  /** Continuous lamp rated by luminous flux or by illuminance at 1 m. */
  z
    .object({
      type: z.literal('continuous'),
      lamp: z.enum(['led', 'tungsten']),
      lumens: z.number().positive().max(1e6).nullable().default(null),
      luxAt1m: z.number().positive().max(1e6).nullable().default(null),
      watts: z.number().min(0).max(20000).default(0),
      kelvin: z.number().min(1000).max(20000).default(5600),
    })
    .strict(),
]);
export type LightSource = z.infer<typeof lightSourceSchema>;

export const lightRoles = ['key', 'fill', 'rim', 'hair', 'background', 'accent'] as const;

export const lightSchema = z
  .object({
    ...itemBase,
    kind: z.literal('light'),
    x: metres(),
    y: metres(),
    heightM: positiveMetres(10).default(1.9),
    aimDeg: degrees.default(0),
    /** 0 = level, negative = aimed down. */
    tiltDeg: z.number().min(-90).max(90).default(-10),
    source: lightSourceSchema,
    /** Fraction of full output, 1/256 … 1 (for continuous lamps: the dimmer). */
    power: z.number().min(1 / 1024).max(1).default(1),
    /** Modifier from the meter's table (calc/modifiers.ts). */
    modifier: z.enum(MODIFIER_IDS).default('bare-reflector'),
    /** A fabric grid on the modifier's face, degrees (common sizes 10°–40°), or none. */
    gridDeg: z.number().min(5).max(60).nullable().default(null),
    /** Gel from the meter's table. */
    gel: z.enum(GEL_IDS).default('none'),
    role: z.enum(lightRoles).default('key'),
    on: z.boolean().default(true),
    /** A real meter reading that anchors this light's prediction. */
    calibration: z
      .object({
        aperture: z.number().min(0.7).max(128),
        distanceM: positiveMetres(50),
        iso: z.number().min(25).max(409600),
        /** Shutter of the reading; needed for continuous lights. */
        shutterS: z.number().positive().max(60).nullable().default(null),
        /** Power the light was at for the reading (default: its power now). */
        power: z.number().min(1 / 1024).max(1).nullable().default(null),
      })
      .strict()
      .nullable()
      .default(null),
    stand: z.enum(['stand', 'boom', 'floor', 'handheld']).default('stand'),
    sandbagged: z.boolean().default(true),
  })
  .strict();
export type Light = z.infer<typeof lightSchema>;
