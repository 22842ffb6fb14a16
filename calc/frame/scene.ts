/**
 * What the frame needs beyond the meter's scene: the camera's tilt, the subject's skin tone and pose, props as
 * simple solids, the floor and an optional ceiling. Units in the names; plan frame as in calc/README.md.
 */
import { z } from 'zod';
import { isColour } from '../colour';
import { type Scene, type SceneInput, sceneSchema } from '../sceneSchema';

/**
 * A small neutral range of skin tones, as diffuse reflectance (relative luminance) with one warm hue for all.
 * Our own steps, one half to one stop apart; `mid` is 18 %, so a face metered "correct" renders at middle grey
 * (sRGB ≈ 118), as an 18 % card does under an incident reading (common practice).
 */
export const SKIN_TONES = {
  light: { label: 'Light', reflectance: 0.36 },
  'medium-light': { label: 'Medium light', reflectance: 0.25 },
  mid: { label: 'Mid', reflectance: 0.18 },
  'medium-deep': { label: 'Medium deep', reflectance: 0.11 },
  deep: { label: 'Deep', reflectance: 0.06 },
} as const;
export type SkinTone = keyof typeof SKIN_TONES;
export const SKIN_TONE_IDS = Object.keys(SKIN_TONES) as [SkinTone, ...SkinTone[]];

/** Linear-sRGB hue of skin before scaling to a tone's reflectance (our own neutral warm hue, luminance 1). */
export const SKIN_HUE: readonly [number, number, number] = [1.32, 0.95, 0.76];

/** Props the plan knows, as boxes: plan footprint (m) and height (m), from memory of typical furniture. */
export const PROP_BOXES = {
  chair: { widthM: 0.45, depthM: 0.45, heightM: 0.45 },
  stool: { widthM: 0.38, depthM: 0.38, heightM: 0.65 },
  'apple-box': { widthM: 0.5, depthM: 0.3, heightM: 0.2 },
  table: { widthM: 1.2, depthM: 0.7, heightM: 0.74 },
} as const;

const colour = z.string().refine(isColour, { message: 'not a readable colour' });

const framePropSchema = z.object({
  x: z.number().min(-1000).max(1000),
  y: z.number().min(-1000).max(1000),
  rotationDeg: z.number().min(-3600).max(3600).default(0),
  shape: z.enum(['chair', 'stool', 'apple-box', 'table']),
});

const frameExtrasSchema = z.object({
  /** Camera tilt, degrees: 0 level, negative aimed down. */
  cameraTiltDeg: z.number().min(-90).max(90).default(0),
  skinTone: z.enum(SKIN_TONE_IDS).default('mid'),
  pose: z.enum(['standing', 'seated']).default('standing'),
  /** Whether the plan has a subject to draw (the meter always has a subject point). */
  subjectVisible: z.boolean().default(true),
  props: z.array(framePropSchema).max(64).default([]),
  floor: z.object({ colour: colour.default('#6e6a64') }).default({ colour: '#6e6a64' }),
  ceiling: z.object({ heightM: z.number().min(1).max(100), colour: colour.default('#e8e6e0') }).optional(),
});

type FrameExtras = z.output<typeof frameExtrasSchema>;
export type FrameExtrasInput = z.input<typeof frameExtrasSchema>;
export type FrameProp = z.output<typeof framePropSchema>;

/** A frame to render: the meter's scene plus the extras. */
export type FrameInput = { scene: SceneInput | Scene; extras?: FrameExtrasInput };
export type FrameScene = { scene: Scene; extras: FrameExtras };

export function parseFrameInput(input: FrameInput): FrameScene {
  const s = sceneSchema.safeParse(input.scene);
  if (!s.success) throw new Error(`invalid scene:\n${z.prettifyError(s.error)}`);
  const e = frameExtrasSchema.safeParse(input.extras ?? {});
  if (!e.success) throw new Error(`invalid frame extras:\n${z.prettifyError(e.error)}`);
  return { scene: s.data, extras: e.data };
}
