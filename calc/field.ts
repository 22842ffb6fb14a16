/**
 * The light field for per-pixel use (the frame view): prepare a scene once, then ask for the exposure at any
 * receptor. Stable API: `prepareField(scene)` → `exposureAt(field, receptor)` → `{ rgb, lux }`.
 *
 * Physics: the meter's (room.ts) — direct light with beam profiles, gels, area sources for big modifiers,
 * occlusion by walls, flags and the subject's body, plus every bounce (first bounce on the meter's patches,
 * later bounces by radiosity) off walls, floor and ceiling. For speed the bounce is gathered here from the
 * coarse radiosity patches, each carrying the summed luminance of all lights.
 */
import { type Rgb, kelvinToLinearRgb } from './colour';
import { type FieldReceptor, type Room, buildRoom, gatherCoarse } from './room';
import { type Scene, type SceneInput, parseScene } from './sceneSchema';

export type { FieldReceptor } from './room';

export type Field = {
  scene: Scene;
  room: Room;
  /**
   * Per-channel gains of the camera's white balance (divide by the colour of a source at whiteBalanceK,
   * normalised to luminance 1): camera channel = rgb[c] · gains[c].
   */
  whiteBalanceGains: Rgb;
};

/** Validate (if needed) and prepare a scene: lights, occluders, patches and their radiosity. */
export function prepareField(input: SceneInput | Scene): Field {
  const scene = parseScene(input);
  const w = kelvinToLinearRgb(scene.camera.whiteBalanceK);
  const y = 0.2126 * w[0] + 0.7152 * w[1] + 0.0722 * w[2];
  return { scene, room: buildRoom(scene), whiteBalanceGains: [y / w[0], y / w[1], y / w[2]] };
}

/**
 * Light arriving at a receptor: `rgb` linear sRGB lux·s per channel (the lights' own colours, before white
 * balance; multiply by `field.whiteBalanceGains` and by a surface's linear reflectance for what the camera
 * records), `lux` its luminance (lux·s). Receptor: position, unit normal, kind 'flat' (default: a surface
 * point or a flat meter) or 'dome'; `atSubject: true` for points on the subject (its body does not shade them).
 */
export function exposureAt(field: Field, receptor: FieldReceptor & { atSubject?: boolean }): { rgb: Rgb; lux: number } {
  const rgb = gatherCoarse(field.room, receptor, receptor.atSubject === true);
  return { rgb, lux: 0.2126 * rgb[0] + 0.7152 * rgb[1] + 0.0722 * rgb[2] };
}
