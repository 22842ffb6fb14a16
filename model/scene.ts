// From a setup document (what is drawn) to the meter's scene (what the physics needs). The editor, the
// server's /meter route, the crew sheet and the lesson player all meter through this one function.
import { GELS, MODIFIERS, type FlagInput, type LightInput, type SceneInput, type SurfaceInput } from '../calc';
import { direction, type Point } from './geometry';
import type { Item, ItemOf, SetupDocument } from './document';
import { sensorFormats } from './items/camera';

/** Surface looks of the passive shapers (colour and diffuse reflectance), from memory. */
export const SHAPER_SURFACES = {
  white: { colour: '#f3f2ee', reflectance: 0.85 },
  // Silver and gold are partly specular; a Lambertian stand-in with a high reflectance is the approximation.
  silver: { colour: '#dcdde0', reflectance: 0.9 },
  gold: { colour: '#e2b65a', reflectance: 0.75 },
  black: { colour: '#161616', reflectance: 0.04 },
} as const;

/** A fabric grid on a large modifier: narrows its beam to half the grid angle, common practice; its loss is from memory. */
export const GRID_ON_MODIFIER_LOSS_STOPS = 0.5;

export type SceneBuild = {
  /** The scene to meter, or null when the plan cannot be metered yet. */
  scene: SceneInput | null;
  /** What is missing for a reading, in plain words ("a subject"). */
  missing: string[];
  /** True when the camera was not drawn and a stand-in in front of the subject is used. */
  assumedCamera: boolean;
};

/**
 * Items placed by the end of step `stepIndex` (0-based); items in no step are always there. With no step
 * index, everything is.
 */
export function itemsAtStep(doc: SetupDocument, stepIndex?: number): Item[] {
  if (stepIndex === undefined || doc.steps.length === 0) return doc.items;
  const firstStep = new Map<string, number>();
  doc.steps.forEach((s, i) => s.itemIds.forEach((id) => firstStep.has(id) || firstStep.set(id, i)));
  return doc.items.filter((it) => (firstStep.get(it.id) ?? -1) <= stepIndex);
}

/** The two ends of an upright panel whose working face points along rotationDeg; the face is on the right
 *  of the walk from a to b (the meter's convention for a surface's front). */
export function panelEnds(p: { x: number; y: number; rotationDeg: number; widthM: number }): { a: Point; b: Point } {
  const along = direction(p.rotationDeg - 90);
  const h = p.widthM / 2;
  return { a: { x: p.x - along.x * h, y: p.y - along.y * h }, b: { x: p.x + along.x * h, y: p.y + along.y * h } };
}

const roleToMeter = { key: 'key', fill: 'fill', rim: 'rim', hair: 'rim', background: 'background', accent: 'other' } as const;

function lightToScene(l: ItemOf<'light'>): LightInput {
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

function gridOverride(modifier: keyof typeof MODIFIERS, gridDeg: number) {
  const spec = MODIFIERS[modifier];
  return {
    halfAngleDeg: Math.min(spec.halfAngleDeg, gridDeg / 2),
    edgeSoftness: Math.min(spec.edgeSoftness, 0.5),
    lossStops: spec.lossStops + GRID_ON_MODIFIER_LOSS_STOPS,
  };
}

function panelSurface(p: ItemOf<'reflector'> | ItemOf<'vflat'>): SurfaceInput {
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
    colour: face.colour,
    reflectance: face.reflectance,
    backColour: back.colour,
    backReflectance: back.reflectance,
  };
}

function panelFlag(p: ItemOf<'flag'> | ItemOf<'scrim'>): FlagInput {
  const { a, b } = panelEnds(p);
  return {
    id: p.id,
    x1: a.x,
    y1: a.y,
    x2: b.x,
    y2: b.y,
    baseM: p.baseM,
    topM: p.baseM + p.heightM,
    transmission: p.kind === 'scrim' ? 2 ** -p.lossStops : 0,
  };
}

/** Build the meter's scene for the whole plan, or for the plan as it stands at one step. */
export function sceneFromDocument(doc: SetupDocument, opts: { stepIndex?: number } = {}): SceneBuild {
  const items = itemsAtStep(doc, opts.stepIndex);
  const subject = items.find((i): i is ItemOf<'subject'> => i.kind === 'subject');
  const cameraItem = items.find((i): i is ItemOf<'camera'> => i.kind === 'camera');
  const lights = items.filter((i): i is ItemOf<'light'> => i.kind === 'light');
  const missing = [...(subject ? [] : ['a subject']), ...(lights.length ? [] : ['a light'])];
  if (!subject) return { scene: null, missing, assumedCamera: !cameraItem };

  // Without a drawn camera, meter for one 3 m in front of the subject at the usual studio settings.
  const front = direction(subject.facingDeg);
  const cam = cameraItem ?? {
    x: subject.x + front.x * 3,
    y: subject.y + front.y * 3,
    heightM: subject.faceHeightM,
    aimDeg: subject.facingDeg + 180,
    focalMm: 85,
    sensor: 'full-frame' as const,
    iso: 100,
    aperture: 8,
    shutterS: 1 / 200,
    ndStops: 0,
    syncS: 1 / 200,
  };
  const sensor = sensorFormats[cam.sensor];

  const surfaces: SurfaceInput[] = [];
  const flags: FlagInput[] = [];
  for (const it of items) {
    if (it.kind === 'wall') {
      if (Math.hypot(it.b.x - it.a.x, it.b.y - it.a.y) < 0.01) continue; // a wall still being drawn
      surfaces.push({
        id: it.id,
        kind: it.surface === 'wall' ? 'wall' : 'backdrop',
        x1: it.a.x,
        y1: it.a.y,
        x2: it.b.x,
        y2: it.b.y,
        baseM: 0,
        topM: it.heightM,
        colour: it.colour,
        ...(it.reflectance !== null ? { reflectance: it.reflectance } : {}),
      });
    } else if (it.kind === 'reflector' || it.kind === 'vflat') surfaces.push(panelSurface(it));
    else if (it.kind === 'flag' || it.kind === 'scrim') flags.push(panelFlag(it));
  }

  const scene: SceneInput = {
    lights: lights.slice(0, 64).map(lightToScene),
    surfaces: surfaces.slice(0, 64),
    flags: flags.slice(0, 64),
    subject: { x: subject.x, y: subject.y, heightM: subject.faceHeightM, facingDeg: subject.facingDeg },
    camera: {
      x: cam.x,
      y: cam.y,
      heightM: cam.heightM,
      aimDeg: cam.aimDeg,
      focalMm: cam.focalMm,
      sensorWidthMm: sensor.widthMm,
      sensorHeightMm: sensor.heightMm,
      aperture: cam.aperture,
      shutterS: cam.shutterS,
      iso: cam.iso,
      ndStops: cam.ndStops,
      syncSpeedS: cam.syncS,
    },
    ...(doc.ambientEv100 !== null ? { ambient: { ev100: doc.ambientEv100 } } : {}),
    options: { ...(doc.targetAperture !== null ? { targetAperture: doc.targetAperture } : {}) },
  };
  return { scene, missing, assumedCamera: !cameraItem };
}

/** Plain trade names for the editor's lists. */
export const modifierChoices = Object.entries(MODIFIERS).map(([id, m]) => ({ id: id as keyof typeof MODIFIERS, label: m.label }));
export const gelChoices = Object.entries(GELS).map(([id, g]) => ({ id: id as keyof typeof GELS, label: g.label, tint: g.tint }));
