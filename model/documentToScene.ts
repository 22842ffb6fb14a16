// From a setup document (what is drawn) to the meter's scene (what the physics needs). The editor, the
// server's /meter route, the crew sheet and the lesson player all meter through this one function.
import type { FlagInput, LightInput, SceneInput, SurfaceInput } from '../calc';
import { direction, normaliseDeg } from './geometry';
import type { Item, ItemOf, SetupDocument } from './document';
import { cameraSchema, sensorFormats } from './items/camera';
import { kindOf } from './kinds';

export type SceneBuild = {
  /** The scene to meter, or null when the plan cannot be metered yet. */
  scene: SceneInput | null;
  /** What is missing for a reading, in plain words ("a subject"). */
  missing: string[];
  /** True when the camera was not drawn and a stand-in in front of the subject is used. */
  assumedCamera: boolean;
  /** Why the plan cannot be metered although nothing is missing (e.g. too many lights), in plain words. */
  error?: string;
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

/**
 * The subject's body as the meter's upright box: shoulders about 45 cm wide and 25 cm deep, from the floor to
 * the top of the head some 12 cm over the face's centre (an adult, from memory; a simple solid, not a figure).
 */
export function subjectBody(s: ItemOf<'subject'>): { widthM: number; depthM: number; topM: number } {
  return { widthM: 0.45, depthM: 0.25, topM: s.faceHeightM + 0.12 };
}

/** Most lights the meter takes (calc's scene limit); more is an error shown in the editor, not a silent cut. */
const MAX_METERED_LIGHTS = 64;

/** Build the meter's scene for the whole plan, or for the plan as it stands at one step. */
export function sceneFromDocument(doc: SetupDocument, opts: { stepIndex?: number } = {}): SceneBuild {
  const items = itemsAtStep(doc, opts.stepIndex);
  const subject = items.find((i): i is ItemOf<'subject'> => i.kind === 'subject');
  const cameraItem = items.find((i): i is ItemOf<'camera'> => i.kind === 'camera');
  const lights = items.filter((i): i is ItemOf<'light'> => i.kind === 'light');
  const missing = [...(subject ? [] : ['a subject']), ...(lights.length ? [] : ['a light'])];
  if (!subject) return { scene: null, missing, assumedCamera: !cameraItem };
  if (lights.length > MAX_METERED_LIGHTS) {
    return { scene: null, missing: [], assumedCamera: !cameraItem, error: `The meter takes at most ${MAX_METERED_LIGHTS} lights; this plan has ${lights.length}. Remove or merge some to read the light.` };
  }

  // Without a drawn camera, meter for one 3 m in front of the subject at the usual studio settings.
  const front = direction(subject.facingDeg);
  const cam =
    cameraItem ??
    cameraSchema.parse({ id: 'assumed-camera', kind: 'camera', x: subject.x + front.x * 3, y: subject.y + front.y * 3, heightM: subject.faceHeightM, aimDeg: normaliseDeg(subject.facingDeg + 180) });
  const sensor = sensorFormats[cam.sensor];

  // Each kind says what it gives the meter (model/items/): lights, surfaces that bounce, flags that block.
  const lightInputs: LightInput[] = [];
  const surfaces: SurfaceInput[] = [];
  const flags: FlagInput[] = [];
  for (const it of items) {
    const part = kindOf(it).meter?.(it);
    if (!part) continue;
    if ('light' in part) lightInputs.push(part.light);
    else if ('surface' in part) surfaces.push(part.surface);
    else flags.push(part.flag);
  }

  const scene: SceneInput = {
    lights: lightInputs,
    surfaces: surfaces.slice(0, 64),
    flags: flags.slice(0, 64),
    // The subject's body casts its shadow on the background and the floor (the meter reads the background
    // beside the silhouette, where the lens sees it).
    subject: { x: subject.x, y: subject.y, heightM: subject.faceHeightM, facingDeg: subject.facingDeg, body: subjectBody(subject) },
    // The room: the stage is the floor; the ceiling over it unless set to none.
    floor: {
      x1: 0,
      y1: 0,
      x2: doc.stage.widthM,
      y2: doc.stage.depthM,
      colour: doc.meter.floor.colour,
      ...(doc.meter.floor.reflectance !== null ? { reflectance: doc.meter.floor.reflectance } : {}),
    },
    ...(doc.meter.ceiling.heightM !== null
      ? { ceiling: { heightM: doc.meter.ceiling.heightM, colour: doc.meter.ceiling.colour, ...(doc.meter.ceiling.reflectance !== null ? { reflectance: doc.meter.ceiling.reflectance } : {}) } }
      : {}),
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
    options: { receptor: doc.meter.receptor, ...(doc.targetAperture !== null ? { targetAperture: doc.targetAperture } : {}) },
  };
  return { scene, missing, assumedCamera: !cameraItem };
}
