// A light: strobe head, speedlight or continuous lamp, with its modifier, gel and power setting.
import { z } from 'zod';
import { GELS, GEL_IDS, MODIFIERS, MODIFIER_IDS, type LightInput } from '../../calc';
import { choiceField, lengthField, numberField, switchField, wordOptions, type FieldSpec } from '../fields';
import { degrees, itemBase, metres, positiveMetres } from '../geometry';
import { formatPower, parsePower } from '../units';
import { defineKind } from './kind';

const lightSourceSchema = z.discriminatedUnion('type', [
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

/** A new source of each type: a mid-size studio head, a speedlight, an LED panel (common practice). */
const defaultSources = {
  strobe: { type: 'strobe', energyWs: 500 },
  speedlight: { type: 'speedlight', guideNumberM: 45 },
  continuous: { type: 'continuous', lamp: 'led', lumens: 8000, luxAt1m: null, watts: 100, kelvin: 5600 },
} as const satisfies { [T in LightSource['type']]: Extract<LightSource, { type: T }> };

const lightRoles = ['key', 'fill', 'rim', 'hair', 'kicker', 'background', 'accent'] as const;

const lightSchema = z
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

/** Plain trade names for the editor's lists. */
const modifierChoices = Object.entries(MODIFIERS).map(([id, m]) => ({ id: id as keyof typeof MODIFIERS, label: m.label }));
const gelChoices = Object.entries(GELS).map(([id, g]) => ({ id: id as keyof typeof GELS, label: g.label, tint: g.tint }));

/** A fabric grid on a large modifier: narrows its beam to half the grid angle, common practice; its loss is from memory. */
const GRID_ON_MODIFIER_LOSS_STOPS = 0.5;

/** The meter's role for each of ours (the meter judges rims, hair lights and kickers against the key, read pointed at the light). */
export const roleToMeter = { key: 'key', fill: 'fill', rim: 'rim', hair: 'hair', kicker: 'kicker', background: 'background', accent: 'other' } as const satisfies Record<Light['role'], string>;

function gridOverride(modifier: keyof typeof MODIFIERS, gridDeg: number) {
  const spec = MODIFIERS[modifier];
  return {
    halfAngleDeg: Math.min(spec.halfAngleDeg, gridDeg / 2),
    edgeSoftness: Math.min(spec.edgeSoftness, 0.5),
    lossStops: spec.lossStops + GRID_ON_MODIFIER_LOSS_STOPS,
  };
}

function lightToScene(l: Light): LightInput {
  const base = {
    id: l.id,
    x: l.x,
    y: l.y,
    heightM: l.heightM,
    aimDeg: l.aimDeg,
    tiltDeg: l.tiltDeg,
    powerFraction: l.power,
    modifier: l.modifier,
    gel: l.gel,
    role: roleToMeter[l.role],
    enabled: l.on,
    ...(l.gridDeg !== null ? { modifierOverride: gridOverride(l.modifier, l.gridDeg) } : {}),
    ...(l.calibration
      ? {
          calibration: {
            aperture: l.calibration.aperture,
            distanceM: l.calibration.distanceM,
            iso: l.calibration.iso,
            ...(l.calibration.shutterS !== null ? { shutterS: l.calibration.shutterS } : {}),
            ...(l.calibration.power !== null ? { powerFraction: l.calibration.power } : {}),
          },
        }
      : {}),
  };
  const s = l.source;
  if (s.type === 'strobe') return { ...base, kind: 'flash', output: { type: 'energy', ratedWs: s.energyWs } };
  if (s.type === 'speedlight') return { ...base, kind: 'flash', output: { type: 'guideNumber', guideNumberM: s.guideNumberM } };
  const output = s.lumens !== null ? { type: 'lumens' as const, lumens: s.lumens } : { type: 'luxAt1m' as const, lux: s.luxAt1m ?? 1000 };
  return { ...base, kind: 'continuous', output, kelvin: s.kelvin };
}

const third = 2 ** (1 / 3);
type Source<T extends LightSource['type']> = Extract<LightSource, { type: T }>;
const isSource =
  <T extends LightSource['type']>(type: T) =>
  (l: Light) =>
    l.source.type === type;
/** A number inside the light's source (energy, guide number, lumens…), shown for one source type. */
function sourceField<T extends LightSource['type']>(type: T, label: string, key: keyof Source<T> & string, range: { min: number; max: number }, extra: Record<string, unknown> = {}): FieldSpec<Light> {
  return {
    ...numberField<Light>(label, 'power', range),
    when: isSource(type),
    get: (l) => (l.source as Record<string, unknown>)[key] as number ?? 0,
    set: (v: number, l: Light) => ({ source: { ...l.source, [key]: v, ...extra } }),
  };
}

/** The light's real meter reading: typed into a form and confirmed, or cleared; nothing changes before. */
const readingField: FieldSpec<Light> = {
  type: 'reading',
  label: 'Meter reading',
  get: (l) => l.calibration,
  set: (v) => ({ calibration: v }),
  needsShutter: (l) => l.source.type === 'continuous',
  powerNow: (l) => l.power,
};

export const lightKind = defineKind({
  kind: 'light',
  schema: lightSchema,
  label: 'Light',
  group: 'light',
  shape: 'point',
  radiusM: 0.25,
  angle: { key: 'aimDeg', label: 'Aim (°)' },
  create: (at) => ({ x: at.x, y: at.y, aimDeg: -90, source: defaultSources.strobe, power: 1 / 4, modifier: 'softbox' }),
  // What is changed most comes first (the inspector opens at it): power, then the modifier, its grid and the gel.
  lead: [
    {
      type: 'number',
      label: 'Power',
      get: (l) => l.power,
      set: (v) => ({ power: v }),
      range: { min: 1 / 256, max: 1 },
      format: formatPower,
      parse: parsePower,
      // One step is a third of a stop, kept between 1/256 and full power.
      step: (l, d) => ({ power: Math.min(1, Math.max(1 / 256, l.power * third ** d)) }),
      testID: 'field-power',
    },
    choiceField<Light>('Modifier', 'modifier', modifierChoices),
    {
      type: 'choice',
      label: 'Fabric grid',
      get: (l) => (l.gridDeg === null ? 'none' : String(l.gridDeg)),
      options: [{ id: 'none', label: 'none' }, ...['10', '20', '30', '40'].map((g) => ({ id: g, label: `${g}°` }))],
      set: (v) => ({ gridDeg: v === 'none' ? null : Number(v) }),
    },
    choiceField<Light>('Gel', 'gel', gelChoices.map((g) => ({ id: g.id, label: g.label, swatch: g.tint }))),
  ],
  fields: [
    switchField<Light>('On', 'on'),
    lengthField<Light>('Height', 'heightM', 0.1),
    numberField<Light>('Tilt (°, down is −)', 'tiltDeg', { by: 5, min: -90, max: 90 }),
    {
      type: 'choice',
      label: 'Source',
      get: (l) => l.source.type,
      options: [{ id: 'strobe', label: 'strobe head' }, { id: 'speedlight', label: 'speedlight' }, { id: 'continuous', label: 'continuous' }],
      set: (t) => ({ source: defaultSources[t as LightSource['type']] }),
    },
    sourceField('strobe', 'Rated energy (Ws)', 'energyWs', { min: 1, max: 12000 }),
    sourceField('speedlight', 'Guide number (m, ISO 100)', 'guideNumberM', { min: 1, max: 200 }),
    {
      type: 'choice',
      label: 'Lamp',
      when: isSource('continuous'),
      get: (l) => (l.source.type === 'continuous' ? l.source.lamp : ''),
      options: [{ id: 'led', label: 'LED' }, { id: 'tungsten', label: 'tungsten' }],
      // A tungsten lamp burns near 3200 K, a daylight LED near 5600 K (common practice).
      set: (v, l) => ({ source: { ...l.source, lamp: v, kelvin: v === 'tungsten' ? 3200 : 5600 } }),
    },
    sourceField('continuous', 'Output (lumens)', 'lumens', { min: 1, max: 1e6 }, { luxAt1m: null }),
    sourceField('continuous', 'Draw (W)', 'watts', { min: 0, max: 20000 }),
    sourceField('continuous', 'Colour temperature (K)', 'kelvin', { min: 1000, max: 20000 }),
    choiceField<Light>('Role', 'role', wordOptions(lightRoles)),
    choiceField<Light>('Stand', 'stand', wordOptions(['stand', 'boom', 'floor', 'handheld'])),
    switchField<Light>('Sandbagged', 'sandbagged'),
    readingField,
  ],
  meter: (l) => ({ light: lightToScene(l) }),
});
