/**
 * The calc-level scene: everything the meter needs, nothing it does not. The app builds one from its plan
 * document; `sceneSchema` validates it and fills defaults. Units are SI and in the field names.
 *
 * Frame (all positions): plan metres, x to the right, y down the screen (as SVG), z / heightM up from the
 * floor. Plan angles (aimDeg, facingDeg) in degrees: 0° along +x, increasing towards +y (clockwise on
 * screen, as SVG rotate). tiltDeg: 0 horizontal, negative aimed down.
 */
import { z } from 'zod';
import { isColour } from './colour';
import { DEFAULT_CALIBRATION_C } from './exposure';
import { GEL_IDS, MODIFIER_IDS } from './modifiers';

/**
 * Default on-axis output of a flash head in its standard reflector, in cd·s per watt-second of rated energy.
 * From memory: a 500 Ws head in its standard reflector is typically rated near guide number 70 m at ISO 100,
 * i.e. about 12 000 cd·s (GN² = I·t·S/C with C = 250). Overridable per scene and per light.
 */
export const DEFAULT_FLASH_CD_S_PER_WS = 24;
/** Colour temperature of flash without a gel: 5500 K, common practice. */
export const DEFAULT_FLASH_KELVIN = 5500;
/** Colour temperature of a continuous light without a stated value: tungsten, 3200 K (common practice). */
export const DEFAULT_CONTINUOUS_KELVIN = 3200;
/** Flash sync speed when the camera does not say: 1/200 s, common practice (cameras range 1/60–1/500 s). */
export const DEFAULT_SYNC_SPEED_S = 1 / 200;
/** Lowest dimmer setting of a continuous light when not stated: 1 % (from memory, typical of LED panels). */
export const DEFAULT_CONTINUOUS_MIN_POWER = 0.01;

const coordM = z.number().min(-1000).max(1000);
const heightM = z.number().min(0).max(100);
const angleDeg = z.number().min(-3600).max(3600);
const colour = z.string().refine(isColour, { message: 'not a readable colour (use a CSS colour such as #d8c8b0)' });

/** A reading from a real incident meter, used to anchor one light's predictions. */
const calibrationSchema = z.object({
  /** f-number the meter showed. */
  aperture: z.number().min(0.5).max(512),
  /** Distance from the light (its face) to the meter's receptor, m; the meter on the beam axis, facing the light. */
  distanceM: z.number().positive().max(1000),
  /** ISO set on the meter. */
  iso: z.number().min(1).max(1e6),
  /** Shutter time set on the meter, s; required for continuous lights (whose reading depends on it). */
  shutterS: z.number().positive().max(3600).optional(),
  /** Power fraction the light was at for the reading; defaults to the light's current power. */
  powerFraction: z.number().positive().max(1).optional(),
});

/** Per-light override of any modifier field (see modifiers.ts ModifierSpec). */
const modifierOverrideSchema = z.object({
  halfAngleDeg: z.number().min(0.5).max(180).optional(),
  edgeSoftness: z.number().min(0).max(1).optional(),
  lossStops: z.number().min(-4).max(20).optional(),
  faceRadiusM: z.number().min(0).max(5).optional(),
  backSpill: z.number().min(0).max(1).optional(),
});

/** Per-light override of any gel field (see modifiers.ts GelSpec). */
const gelOverrideSchema = z.object({
  lossStops: z.number().min(0).max(20).optional(),
  miredShift: z.number().min(-500).max(500).optional(),
  tint: colour.optional(),
});

const lightBase = {
  id: z.string().min(1),
  x: coordM,
  y: coordM,
  heightM,
  aimDeg: angleDeg,
  tiltDeg: z.number().min(-90).max(90).default(0),
  /** Power as a fraction of full (1 = full, 1/8 = three stops down). For continuous lights: the dimmer. */
  powerFraction: z.number().positive().max(1).default(1),
  /** Lowest settable fraction; defaults to 1/256 for flash and 1 % for continuous lights. */
  minPowerFraction: z.number().positive().max(1).optional(),
  modifier: z.enum(MODIFIER_IDS).default('bare-reflector'),
  modifierOverride: modifierOverrideSchema.optional(),
  gel: z.enum(GEL_IDS).default('none'),
  gelOverride: gelOverrideSchema.optional(),
  /** Colour temperature of the bare source, K; defaults to 5500 (flash) or 3200 (continuous). */
  kelvin: z.number().min(1000).max(25000).optional(),
  /** Key/fill choice: 'auto' lets the meter decide (meter.ts); rim, background and other are never key or fill. */
  role: z.enum(['auto', 'key', 'fill', 'rim', 'hair', 'kicker', 'background', 'other']).default('auto'),
  /** Rim, hair and kicker: wanted level over the key, both read pointed at the light, stops; default options.rimTargetStops. */
  targetVsKeyStops: z.number().min(-6).max(6).optional(),
  enabled: z.boolean().default(true),
  calibration: calibrationSchema.optional(),
};

/** Flash output: rated energy (Ws) at full power, or a guide number (m, ISO 100, full power, as rated). */
const flashOutputSchema = z.discriminatedUnion('type', [
  z.object({
    type: z.literal('energy'),
    ratedWs: z.number().positive().max(1e5),
    /** On-axis cd·s per Ws in the standard reflector; default: scene options, then DEFAULT_FLASH_CD_S_PER_WS. */
    efficiencyCdSPerWs: z.number().positive().max(1e4).optional(),
  }),
  z.object({ type: z.literal('guideNumber'), guideNumberM: z.number().positive().max(1000) }),
]);

/** Continuous output: luminous flux (lm, into the bare-reflector beam) or illuminance at 1 m on axis (lux). */
const continuousOutputSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('lumens'), lumens: z.number().positive().max(1e7) }),
  z.object({ type: z.literal('luxAt1m'), lux: z.number().positive().max(1e7) }),
]);

const flashLightSchema = z.object({ ...lightBase, kind: z.literal('flash'), output: flashOutputSchema });
const continuousLightSchema = z.object({
  ...lightBase,
  kind: z.literal('continuous'),
  output: continuousOutputSchema,
});
const lightSchema = z.discriminatedUnion('kind', [flashLightSchema, continuousLightSchema]);

/**
 * A panel's tilt, degrees: 0 upright; positive turns its front face up (its lower edge stays on the plan
 * segment at baseM and the panel leans back, away from the side its front faces), negative turns it down (it
 * leans forward). Its height topM − baseM is measured along the panel, so a tilted panel's top edge is lower
 * than topM: baseM + (topM − baseM)·cos tilt. ±90 lies flat.
 */
const panelTilt = z.number().min(-90).max(90).default(0);

/**
 * A vertical surface standing on the plan segment (x1, y1)–(x2, y2), from baseM to topM: wall, backdrop,
 * reflector or v-flat. It bounces light (one bounce) and blocks light crossing it. Its front side is on your
 * right as you walk from (x1, y1) to (x2, y2) on screen; backColour/backReflectance apply to the other side
 * (default: same as the front).
 */
const surfaceSchema = z
  .object({
    id: z.string().min(1),
    kind: z.enum(['wall', 'backdrop', 'reflector', 'v-flat']).default('wall'),
    x1: coordM,
    y1: coordM,
    x2: coordM,
    y2: coordM,
    baseM: heightM.default(0),
    topM: heightM.default(3),
    colour,
    /** Diffuse reflectance 0–1; default: the colour's relative luminance, clamped to the paint range. */
    reflectance: z.number().min(0).max(1).optional(),
    backColour: colour.optional(),
    backReflectance: z.number().min(0).max(1).optional(),
    bounces: z.boolean().default(true),
    occludes: z.boolean().default(true),
    tiltDeg: panelTilt,
  })
  .refine((s) => Math.hypot(s.x2 - s.x1, s.y2 - s.y1) >= 0.01, {
    message: 'surface is shorter than 1 cm',
    path: ['x2'],
  })
  .refine((s) => s.topM > s.baseM, { message: 'topM must be above baseM', path: ['topM'] });

/**
 * A flag, scrim or negative fill on the segment (x1, y1)–(x2, y2): blocks light, does not bounce.
 * transmission: fraction passed (0 = opaque flag; 0.5 = a one-stop scrim). Height range optional: absent
 * bounds mean it blocks at every height (plain plan occlusion), and then tiltDeg is ignored.
 */
const flagSchema = z
  .object({
    id: z.string().min(1),
    x1: coordM,
    y1: coordM,
    x2: coordM,
    y2: coordM,
    baseM: heightM.optional(),
    topM: heightM.optional(),
    transmission: z.number().min(0).max(1).default(0),
    tiltDeg: panelTilt,
  })
  .refine((f) => f.baseM === undefined || f.topM === undefined || f.topM > f.baseM, {
    message: 'topM must be above baseM',
    path: ['topM'],
  });

/** The metered subject: face position and the direction the face (and the meter's flat receptor) points. */
const subjectSchema = z.object({
  x: coordM,
  y: coordM,
  heightM,
  facingDeg: angleDeg,
  /** The subject as a solid that casts shadows: an upright box this wide (shoulders) and deep, floor to top. */
  body: z.object({ widthM: z.number().min(0.05).max(5), depthM: z.number().min(0.05).max(5), topM: heightM }).optional(),
});

const cameraSchema = z.object({
  x: coordM,
  y: coordM,
  heightM: heightM.default(1.5),
  aimDeg: angleDeg,
  focalMm: z.number().min(1).max(2000).default(50),
  sensorWidthMm: z.number().min(1).max(500).default(36),
  sensorHeightMm: z.number().min(1).max(500).default(24),
  aperture: z.number().min(0.5).max(512),
  shutterS: z.number().positive().max(3600),
  iso: z.number().min(1).max(1e6),
  /** Neutral density on the lens, stops. */
  ndStops: z.number().min(0).max(30).default(0),
  syncSpeedS: z.number().positive().max(1).default(DEFAULT_SYNC_SPEED_S),
  /** White balance the colour readings are rendered with, K. */
  whiteBalanceK: z.number().min(1000).max(25000).default(DEFAULT_FLASH_KELVIN),
});

/** A point to meter: position and receptor facing (plan angle; horizontal receptor). */
const probeSchema = z.object({
  id: z.string().min(1),
  x: coordM,
  y: coordM,
  z: heightM,
  /** Default: the subject's facing. */
  facingDeg: angleDeg.optional(),
});

/** The meter's receptors (see calc/README.md, "Receptors"). */
const RECEPTORS = ['dome-camera', 'flat-light', 'flat-face'] as const;
export type ReceptorId = (typeof RECEPTORS)[number];

/**
 * Floor and ceiling: horizontal surfaces over the rectangle (x1, y1)–(x2, y2); they bounce light like walls.
 * A ceiling with no heightM is absent (outdoors, a big stage).
 */
const floorSchema = z.object({
  x1: coordM,
  y1: coordM,
  x2: coordM,
  y2: coordM,
  colour: colour.default('#8a8580'),
  reflectance: z.number().min(0).max(1).optional(),
});
const ceilingSchema = z.object({
  heightM: z.number().min(0.5).max(100),
  colour: colour.default('#f0efea'),
  reflectance: z.number().min(0).max(1).optional(),
});

/** Wanted level of rim, hair and kicker lights over the key, each read pointed at its light: +1 stop (common practice: +½ to +1½). */
const DEFAULT_RIM_TARGET_STOPS = 1;

const sceneOptionsSchema = z.object({
  /**
   * The exposure receptor: 'flat-face' (a flat disc along the subject's facing; the default here, as before),
   * 'dome-camera' (a hemisphere at the subject pointed at the camera) or 'flat-light' (a flat disc pointed at
   * each light in turn, the readings summed).
   */
  receptor: z.enum(RECEPTORS).default('flat-face'),
  /** Inter-reflection between all surfaces (radiosity); false keeps one bounce. */
  interreflection: z.boolean().default(true),
  /** Default wanted level of rim, hair and kicker lights over the key, stops. */
  rimTargetStops: z.number().min(-6).max(6).default(DEFAULT_RIM_TARGET_STOPS),
  /** Incident-meter calibration constant C (ISO 2720 flat receptor 240–400). */
  calibrationC: z.number().min(100).max(1000).default(DEFAULT_CALIBRATION_C),
  /** Default flash efficiency, cd·s per Ws on axis in the standard reflector. */
  flashCdSPerWs: z.number().positive().max(1e4).default(DEFAULT_FLASH_CD_S_PER_WS),
  bounce: z.boolean().default(true),
  /** Edge length of the bounce patches the meter splits surfaces into, m. */
  patchSizeM: z.number().min(0.05).max(10).default(0.5),
  /** Target f-number for "power to set"; default: the camera's aperture. */
  targetAperture: z.number().min(0.5).max(512).optional(),
});

export const sceneSchema = z
  .object({
    lights: z.array(lightSchema).max(64),
    surfaces: z.array(surfaceSchema).max(64).default([]),
    flags: z.array(flagSchema).max(64).default([]),
    floor: floorSchema.optional(),
    /** Needs a floor (its rectangle is the ceiling's). */
    ceiling: ceilingSchema.optional(),
    subject: subjectSchema,
    camera: cameraSchema,
    /** Metered ambient at the set: incident EV at ISO 100, and its colour temperature. */
    ambient: z.object({ ev100: z.number().min(-10).max(25), kelvin: z.number().min(1000).max(25000).default(5500) }).optional(),
    /** Explicit background point; default: where the camera's line through the subject meets a surface. */
    background: z.object({ x: coordM, y: coordM, z: heightM, facingDeg: angleDeg.optional() }).optional(),
    probes: z.array(probeSchema).max(64).default([]),
    options: sceneOptionsSchema.default(() => sceneOptionsSchema.parse({})),
  })
  .superRefine((s, ctx) => {
    const seen = new Set<string>();
    s.lights.forEach((l, i) => {
      if (seen.has(l.id)) ctx.addIssue({ code: 'custom', message: `duplicate light id "${l.id}"`, path: ['lights', i, 'id'] });
      seen.add(l.id);
      if (l.kind === 'continuous' && l.calibration && l.calibration.shutterS === undefined) {
        ctx.addIssue({
          code: 'custom',
          message: 'a continuous light calibration needs the shutter time of the reading',
          path: ['lights', i, 'calibration', 'shutterS'],
        });
      }
    });
  });

export type Scene = z.output<typeof sceneSchema>;
export type SceneInput = z.input<typeof sceneSchema>;
export type Light = z.output<typeof lightSchema>;
export type LightInput = z.input<typeof lightSchema>;
export type SurfaceInput = z.input<typeof surfaceSchema>;
export type FlagInput = z.input<typeof flagSchema>;
export type LightRole = Light['role'];

/** Validate a scene and fill its defaults; throws an Error whose message names each bad field (zod's path). */
export function parseScene(input: unknown): Scene {
  const r = sceneSchema.safeParse(input);
  if (!r.success) throw new Error(`invalid scene:\n${z.prettifyError(r.error)}`);
  return r.data;
}

/** Like parseScene, without throwing. */
export function safeParseScene(input: unknown): { ok: true; scene: Scene } | { ok: false; message: string } {
  const r = sceneSchema.safeParse(input);
  return r.success ? { ok: true, scene: r.data } : { ok: false, message: z.prettifyError(r.error) };
}
