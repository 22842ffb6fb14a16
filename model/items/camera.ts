// The camera: position and aim on the plan (drawn as its field-of-view wedge) and its exposure settings.
import { z } from 'zod';
import { degrees, itemBase, metres, positiveMetres } from '../geometry';

/** Sensor widths in millimetres (the long side), common practice. */
export const sensorFormats = {
  'full-frame': { label: 'Full frame 36×24', widthMm: 36, heightMm: 24 },
  'aps-c': { label: 'APS-C 23.5×15.6', widthMm: 23.5, heightMm: 15.6 },
  'four-thirds': { label: 'Four Thirds 17.3×13', widthMm: 17.3, heightMm: 13 },
  'medium-44x33': { label: 'Medium format 44×33', widthMm: 43.8, heightMm: 32.9 },
} as const;
export type SensorFormat = keyof typeof sensorFormats;

export const cameraSchema = z
  .object({
    ...itemBase,
    kind: z.literal('camera'),
    x: metres(),
    y: metres(),
    heightM: positiveMetres(10).default(1.5),
    aimDeg: degrees.default(0),
    focalMm: z.number().min(4).max(2000).default(85),
    sensor: z.enum(Object.keys(sensorFormats) as [SensorFormat, ...SensorFormat[]]).default('full-frame'),
    iso: z.number().min(25).max(409600).default(100),
    aperture: z.number().min(0.7).max(128).default(8),
    /** Shutter time in seconds (1/200 s → 0.005). */
    shutterS: z.number().positive().max(60).default(1 / 200),
    ndStops: z.number().min(0).max(20).default(0),
    /** Fastest shutter that still syncs with the flash, in seconds. 1/200 s is common practice. */
    syncS: z.number().positive().max(1).default(1 / 200),
  })
  .strict();
export type Camera = z.infer<typeof cameraSchema>;
