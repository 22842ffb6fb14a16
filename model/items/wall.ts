// A wall or backdrop: a segment on the plan with a surface colour. Reflectance comes from the colour's
// relative luminance unless given (see calc/). Seamless paper is drawn as a backdrop.
import { z } from 'zod';
import { choiceField, lengthField, parseNumberOrBlank, textField } from '../fields';
import { hexColour, itemBase, pointSchema, positiveMetres } from '../geometry';
import { formatLength } from '../units';
import { segmentAt } from './annotation';
import { defineKind } from './kind';

const wallSchema = z
  .object({
    ...itemBase,
    kind: z.literal('wall'),
    surface: z.enum(['wall', 'seamless', 'curtain']).default('wall'),
    a: pointSchema,
    b: pointSchema,
    heightM: positiveMetres(20).default(2.7),
    colour: hexColour.default('#d9d6cf'),
    /** 0..1; null means "from the colour". */
    reflectance: z.number().min(0).max(1).nullable().default(null),
  })
  .strict();
export type Wall = z.infer<typeof wallSchema>;

const wallColours = [
  { id: '#f2f0ea', label: 'white', swatch: '#f2f0ea' },
  { id: '#8a8d90', label: 'mid grey', swatch: '#8a8d90' },
  { id: '#151515', label: 'black', swatch: '#151515' },
  { id: '#c9c2b4', label: 'warm stone', swatch: '#c9c2b4' },
  { id: '#2f5d50', label: 'deep green', swatch: '#2f5d50' },
  { id: '#b5533c', label: 'brick red', swatch: '#b5533c' },
];

const lengthOf = (w: Wall) => Math.hypot(w.b.x - w.a.x, w.b.y - w.a.y);

export const wallKind = defineKind({
  kind: 'wall',
  schema: wallSchema,
  label: 'Wall',
  group: 'room',
  shape: 'segment',
  radiusM: 0.15,
  create: (at) => ({ ...segmentAt(at, 3), surface: 'wall' }),
  fields: [
    choiceField<Wall>('Surface', 'surface', [{ id: 'wall', label: 'painted wall' }, { id: 'seamless', label: 'seamless paper' }, { id: 'curtain', label: 'curtain' }]),
    lengthField<Wall>('Height', 'heightM', 0.1, { min: 0.01, max: 20 }),
    { ...choiceField<Wall>('Colour', 'colour', wallColours), get: (w) => w.colour.toLowerCase() },
    { ...textField<Wall>('Colour (#rrggbb)', 'colour'), set: (v: string) => ({ colour: v.trim() }) },
    {
      type: 'number',
      label: 'Reflectance (%, blank = from colour)',
      get: (w) => (w.reflectance === null ? -1 : w.reflectance * 100),
      range: { min: 0, max: 100 },
      blankOk: true,
      format: (v) => (v < 0 ? '' : v.toFixed(0)),
      parse: parseNumberOrBlank,
      set: (v) => ({ reflectance: v < 0 ? null : v / 100 }),
    },
  ],
  meter: (w) =>
    lengthOf(w) < 0.01
      ? null // a wall still being drawn
      : {
          surface: {
            id: w.id,
            kind: w.surface === 'wall' ? 'wall' : 'backdrop',
            x1: w.a.x,
            y1: w.a.y,
            x2: w.b.x,
            y2: w.b.y,
            baseM: 0,
            topM: w.heightM,
            colour: w.colour,
            ...(w.reflectance !== null ? { reflectance: w.reflectance } : {}),
          },
        },
  gear: (w, units) => (w.surface === 'wall' ? null : `${w.surface === 'seamless' ? 'seamless paper' : 'curtain'} ${w.colour}, ${formatLength(lengthOf(w), units)} wide`),
});
