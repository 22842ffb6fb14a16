// Passive shapers: reflectors bounce light, flags block it, v-flats do either (one white and one black side),
// scrims soften a light that passes through.
import { z } from 'zod';
import type { FlagInput, SurfaceInput } from '../../calc';
import { choiceField, lengthField, numberField, type FieldSpec } from '../fields';
import { degrees, direction, itemBase, metres, positiveMetres, type Point } from '../geometry';
import { formatLength, formatStops, type Units } from '../units';
import { defineKind } from './kind';

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
  /**
   * Tilt, degrees: 0 upright; positive turns the working face up (the lower edge stays put and the panel leans
   * back, e.g. a card under the chin at 45° facing up at the face), negative turns it down (a flag over a head).
   */
  tiltDeg: z.number().min(-90).max(90).default(0),
});

const reflectorSchema = z
  .object({ ...panel({ widthM: 1, heightM: 1, baseM: 0.5 }), kind: z.literal('reflector'), finish: z.enum(['white', 'silver', 'gold']).default('white') })
  .strict();
const flagSchema = z.object({ ...panel({ widthM: 0.6, heightM: 0.9, baseM: 1 }), kind: z.literal('flag') }).strict();
const vflatSchema = z
  .object({ ...panel({ widthM: 1.2, heightM: 2.4, baseM: 0 }), kind: z.literal('vflat'), face: z.enum(['white', 'black']).default('white') })
  .strict();
const scrimSchema = z
  .object({ ...panel({ widthM: 1.2, heightM: 1.2, baseM: 0.8 }), kind: z.literal('scrim'), lossStops: z.number().min(0).max(6).default(1) })
  .strict();

export type Reflector = z.infer<typeof reflectorSchema>;
export type Flag = z.infer<typeof flagSchema>;
export type VFlat = z.infer<typeof vflatSchema>;
export type Scrim = z.infer<typeof scrimSchema>;
type Panel = Reflector | Flag | VFlat | Scrim;

/** Surface looks of the passive shapers (colour and diffuse reflectance), from memory. */
export const SHAPER_SURFACES = {
  white: { colour: '#f3f2ee', reflectance: 0.85 },
  // Silver and gold are partly specular; a Lambertian stand-in with a high reflectance is the approximation.
  silver: { colour: '#dcdde0', reflectance: 0.9 },
  gold: { colour: '#e2b65a', reflectance: 0.75 },
  black: { colour: '#161616', reflectance: 0.04 },
} as const;

/** The two ends of an upright panel whose working face points along rotationDeg; the face is on the right
 *  of the walk from a to b (the meter's convention for a surface's front). */
export function panelEnds(p: { x: number; y: number; rotationDeg: number; widthM: number }): { a: Point; b: Point } {
  const along = direction(p.rotationDeg - 90);
  const h = p.widthM / 2;
  return { a: { x: p.x - along.x * h, y: p.y - along.y * h }, b: { x: p.x + along.x * h, y: p.y + along.y * h } };
}

function panelSurface(p: Reflector | VFlat): SurfaceInput {
  const { a, b } = panelEnds(p);
  const face = p.kind === 'reflector' ? SHAPER_SURFACES[p.finish] : SHAPER_SURFACES[p.face];
  const back = p.kind === 'reflector' ? SHAPER_SURFACES.white : SHAPER_SURFACES[p.face === 'white' ? 'black' : 'white'];
  return {
    id: p.id,
    kind: p.kind === 'reflector' ? 'reflector' : 'v-flat',
    x1: a.x,
    y1: a.y,
    x2: b.x,
    y2: b.y,
    baseM: p.baseM,
    topM: p.baseM + p.heightM,
    tiltDeg: p.tiltDeg,
    colour: face.colour,
    reflectance: face.reflectance,
    backColour: back.colour,
    backReflectance: back.reflectance,
  };
}

function panelFlag(p: Flag | Scrim): FlagInput {
  const { a, b } = panelEnds(p);
  return {
    id: p.id,
    x1: a.x,
    y1: a.y,
    x2: b.x,
    y2: b.y,
    baseM: p.baseM,
    topM: p.baseM + p.heightM,
    tiltDeg: p.tiltDeg,
    transmission: p.kind === 'scrim' ? 2 ** -p.lossStops : 0,
  };
}

const size = (p: Panel, units: Units) => `${formatLength(p.widthM, units)} × ${formatLength(p.heightM, units)}`;
const lowerEdge = (p: Panel, units: Units) => `lower edge at ${formatLength(p.baseM, units)}`;
/** The crew sheet's words for a tilt ("tilted 45° face up"), or nothing for an upright panel. */
export const tiltWords = (p: Panel): string => (p.tiltDeg === 0 ? '' : `, tilted ${Math.abs(p.tiltDeg)}° face ${p.tiltDeg > 0 ? 'up' : 'down'}`);

/** Size fields every panel has, after its own. */
const sizeFields = <T extends Panel>(): FieldSpec<T>[] => [
  lengthField<T>('Width', 'widthM', 0.1),
  lengthField<T>('Height', 'heightM', 0.1),
  lengthField<T>('Lower edge', 'baseM', 0.1, { min: 0, max: 10 }),
  numberField<T>('Tilt (°)', 'tiltDeg', { by: 5, min: -90, max: 90 }),
];

const panelKind = {
  group: 'shaper',
  shape: 'panel',
  radiusM: 0.2,
  // The angle is the way the working face points (a flag faces the light it cuts): "Turn" read as the
  // panel's own line, and a flag typed square to a beam stood edge-on to it.
  angle: { key: 'rotationDeg', label: 'Facing (°)' },
  create: (at: Point) => ({ x: at.x, y: at.y, rotationDeg: -90 }),
} as const;

export const reflectorKind = defineKind({
  ...panelKind,
  kind: 'reflector',
  schema: reflectorSchema,
  label: 'Reflector',
  fields: [choiceField<Reflector>('Finish', 'finish', [{ id: 'white', label: 'white' }, { id: 'silver', label: 'silver' }, { id: 'gold', label: 'gold' }]), ...sizeFields<Reflector>()],
  meter: (p) => ({ surface: panelSurface(p) }),
  gear: (p, units) => `${p.finish} reflector, ${size(p, units)}, ${lowerEdge(p, units)}${tiltWords(p)}`,
});

export const flagKind = defineKind({
  ...panelKind,
  kind: 'flag',
  schema: flagSchema,
  label: 'Flag',
  fields: sizeFields<Flag>(),
  meter: (p) => ({ flag: panelFlag(p) }),
  gear: (p, units) => `flag, ${size(p, units)}, ${lowerEdge(p, units)}${tiltWords(p)}`,
});

export const vflatKind = defineKind({
  ...panelKind,
  kind: 'vflat',
  schema: vflatSchema,
  label: 'V-flat',
  fields: [choiceField<VFlat>('Face towards the set', 'face', [{ id: 'white', label: 'white (bounce)' }, { id: 'black', label: 'black (negative fill)' }]), ...sizeFields<VFlat>()],
  meter: (p) => ({ surface: panelSurface(p) }),
  gear: (p, units) => `v-flat, ${p.face} side to the set, ${size(p, units)}${tiltWords(p)}`,
});

export const scrimKind = defineKind({
  ...panelKind,
  kind: 'scrim',
  schema: scrimSchema,
  label: 'Scrim',
  fields: [numberField<Scrim>('Loss (stops)', 'lossStops', { digits: 1, by: 0.5, min: 0, max: 6 }), ...sizeFields<Scrim>()],
  meter: (p) => ({ flag: panelFlag(p) }),
  gear: (p, units) => `scrim, ${size(p, units)}, about ${formatStops(-p.lossStops)} stops${tiltWords(p)}`,
});
