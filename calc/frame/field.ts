/**
 * The frame's one door into the meter's light field (calc/field.ts: `prepareField` → `exposureAt`), so the
 * picture and the meter's numbers agree. `exposureAt` here is the meter's own call. For picture pixels the
 * same sum is split so it can be paced: each pixel gets its own direct light (the meter's `directLight`: beam,
 * gel, area sources, walls, flags, the body), and the bounce (the meter's coarse radiosity patches with their
 * occlusion, exactly as `gatherCoarse`) is gathered on a lattice of pixels and reused by the pixels of the
 * same surface around each lattice point.
 */
import { type Rgb, kelvinToLinearRgb } from '../colour';
import { luxFromEv100, luxSecondsForAperture } from '../exposure';
import { type Field as MeterField, exposureAt as meterExposureAt, prepareField as prepareMeterField } from '../field';
import { type Room, type RoomLight, directLux, patchResponse } from '../room';
import type { Scene, SceneInput } from '../sceneSchema';
import { type Receptor, transmissionAlong } from '../transport';

export type { Receptor };

export type Field = {
  scene: Scene;
  meter: MeterField;
  room: Room;
  lights: RoomLight[];
  /** The exposure (lux·s) an incident meter reads as "correct" at the camera's settings, lens ND included. */
  correctLuxSeconds: number;
  /** The ambient's exposure as linear RGB (lux·s per channel, luminance = its H), or zeros. */
  ambientRgb: Rgb;
};

export function prepareField(input: SceneInput | Scene): Field {
  const meter = prepareMeterField(input);
  const scene = meter.scene;
  const cam = scene.camera;
  const C = scene.options.calibrationC;
  const correctLuxSeconds = luxSecondsForAperture(cam.aperture, cam.iso, C) * Math.pow(2, cam.ndStops);
  let ambientRgb: Rgb = [0, 0, 0];
  if (scene.ambient) {
    const h = luxFromEv100(scene.ambient.ev100, C) * cam.shutterS;
    const c = kelvinToLinearRgb(scene.ambient.kelvin);
    ambientRgb = [h * c[0], h * c[1], h * c[2]];
  }
  return { scene, meter, room: meter.room, lights: meter.room.lights, correctLuxSeconds, ambientRgb };
}

/**
 * The meter's exposure at a receptor (direct and every bounce, not the ambient). atSubject: a point on the
 * subject (its own body does not shade it). rgb: linear-RGB lux·s per channel; luxSeconds: its luminance.
 */
export function exposureAt(f: Field, r: Receptor, atSubject = false): { rgb: Rgb; luxSeconds: number } {
  const e = meterExposureAt(f.meter, { ...r, atSubject });
  return { rgb: e.rgb, luxSeconds: e.lux };
}

/** A per-light shadow test the frame adds (its head-and-shoulders solid): fraction of light passing to r. */
export type ExtraShadow = (L: RoomLight, r: Receptor) => number;

/**
 * Direct light at r, into out[0..2] (added), times an optional extra shadow. `which`: 'point' lights only
 * (per pixel), 'area' sources only (big modifiers: smooth, gathered on the lattice with the bounce), or 'all'.
 */
export function directInto(f: Field, r: Receptor, out: Float64Array, atSubject: boolean, shadow?: ExtraShadow, which: 'all' | 'point' | 'area' = 'all'): void {
  const occ = atSubject ? f.room.occFree : f.room.occ;
  for (const L of f.lights) {
    if (L.axialCdS <= 0) continue;
    if (which !== 'all' && (L.face !== null) !== (which === 'area')) continue;
    let h = directLux(L, occ, r);
    if (h <= 0) continue;
    if (shadow) h *= shadow(L, r);
    out[0] = out[0]! + h * L.rgb[0];
    out[1] = out[1]! + h * L.rgb[1];
    out[2] = out[2]! + h * L.rgb[2];
  }
}

/**
 * Every bounce at r from the meter's coarse patches (as calc/room.ts gatherCoarse), into out[0..2] (added).
 * exactWithin: patch sizes within which the exact polygon form factor is used (the meter: 2; pixels: 1).
 */
export function bounceInto(f: Field, r: Receptor, out: Float64Array, atSubject: boolean, exactWithin = 2): void {
  const occ = atSubject ? f.room.occFree : f.room.occ;
  const C = f.room.coarse;
  const lum = f.room.coarseLum;
  for (let i = 0; i < C.count; i++) {
    const ff = patchResponse(C, i, r, exactWithin);
    if (ff === 0) continue;
    const b = 6 * i + (ff > 0 ? 0 : 3);
    const lr = lum[b]!;
    const lg = lum[b + 1]!;
    const lb = lum[b + 2]!;
    if (lr === 0 && lg === 0 && lb === 0) continue;
    const w = Math.abs(ff) * transmissionAlong(occ, C.cx[i]!, C.cy[i]!, C.cz[i]!, r.x, r.y, r.z, C.surface[i]!);
    out[0] = out[0]! + lr * w;
    out[1] = out[1]! + lg * w;
    out[2] = out[2]! + lb * w;
  }
}
