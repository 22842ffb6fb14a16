// The camera: position and aim on the plan (drawn as its field-of-view wedge) and its exposure settings.
import { z } from 'zod';
import { choiceField, formatFNumber, lengthField, numberField, stepIn } from '../fields';
import { degrees, itemBase, metres, positiveMetres } from '../geometry';
import { APERTURE_THIRDS, ISO_THIRDS, SHUTTER_THIRDS, formatShutter, parseNumber, parseShutter } from '../units';
import { defineKind } from './kind';

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
    /** Tilt of the lens axis, degrees: 0 level, negative aimed down (the frame view uses it). */
    tiltDeg: z.number().min(-90).max(90).default(0),
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

/**
 * The stepper stops, ascending, on the standard third-stop scales: "+" moves up the aperture and ISO lists and
 * to a faster (shorter) shutter.
 */
const shutterSteps = SHUTTER_THIRDS;
const apertureSteps = APERTURE_THIRDS;
const isoSteps = ISO_THIRDS;

export const cameraKind = defineKind({
  kind: 'camera',
  schema: cameraSchema,
  label: 'Camera',
  group: 'camera',
  shape: 'point',
  radiusM: 0.25,
  angle: { key: 'aimDeg', label: 'Aim (°)' },
  create: (at) => ({ x: at.x, y: at.y, aimDeg: -90 }),
  fields: [
    {
      type: 'number',
      label: 'Aperture (f/)',
      get: (c) => c.aperture,
      set: (v) => ({ aperture: v }),
      range: { min: 0.7, max: 128 },
      format: formatFNumber,
      parse: parseNumber,
      step: (c, d) => ({ aperture: stepIn(apertureSteps, c.aperture, d) }),
      testID: 'field-aperture',
    },
    {
      type: 'number',
      label: 'Shutter (s)',
      get: (c) => c.shutterS,
      set: (v) => ({ shutterS: v }),
      range: { min: 1 / 8000, max: 30 },
      format: formatShutter,
      parse: parseShutter,
      // "+" on a shutter shows a faster one (a shorter time): one step down the list.
      step: (c, d) => ({ shutterS: stepIn(shutterSteps, c.shutterS, -d) }),
    },
    { ...numberField<Camera>('ISO', 'iso', { min: 25, max: 409600 }), step: (c, d) => ({ iso: stepIn(isoSteps, c.iso, d) }) },
    numberField<Camera>('ND on the lens (stops)', 'ndStops', { by: 1, min: 0, max: 20 }),
    numberField<Camera>('Focal length (mm)', 'focalMm', { min: 4, max: 2000 }),
    choiceField<Camera>('Sensor', 'sensor', (Object.keys(sensorFormats) as SensorFormat[]).map((k) => ({ id: k, label: sensorFormats[k].label }))),
    { type: 'number', label: 'Flash sync (s)', get: (c) => c.syncS, set: (v) => ({ syncS: v }), range: { min: 1 / 8000, max: 1 }, format: formatShutter, parse: parseShutter },
    lengthField<Camera>('Height', 'heightM', 0.1),
  ],
});
