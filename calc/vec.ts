/**
 * Small 3-D vector helpers for the meter.
 *
 * Frame: plan metres, x to the right, y down the screen (as SVG), z up (height above the floor).
 * This frame is left-handed as seen from above, which is harmless here: nothing in the meter depends on
 * handedness except the "front" side of a surface, defined in sceneSchema.ts.
 */
export type Vec3 = { x: number; y: number; z: number };

export const sub = (a: Vec3, b: Vec3): Vec3 => ({ x: a.x - b.x, y: a.y - b.y, z: a.z - b.z });
const scale = (a: Vec3, s: number): Vec3 => ({ x: a.x * s, y: a.y * s, z: a.z * s });
export const dot = (a: Vec3, b: Vec3): number => a.x * b.x + a.y * b.y + a.z * b.z;
export const cross = (a: Vec3, b: Vec3): Vec3 => ({
  x: a.y * b.z - a.z * b.y,
  y: a.z * b.x - a.x * b.z,
  z: a.x * b.y - a.y * b.x,
});
const length = (a: Vec3): number => Math.sqrt(dot(a, a));

/** Unit vector; the zero vector stays zero rather than becoming NaN. */
export const normalize = (a: Vec3): Vec3 => {
  const l = length(a);
  return l > 0 ? scale(a, 1 / l) : { x: 0, y: 0, z: 0 };
};

export const DEG = Math.PI / 180;

/**
 * Direction of a plan angle and a tilt, as a unit vector.
 * aimDeg: 0° along +x, increasing towards +y (clockwise on screen). tiltDeg: 0 horizontal, negative down.
 */
export const directionFromAim = (aimDeg: number, tiltDeg: number): Vec3 => {
  const a = aimDeg * DEG;
  const t = tiltDeg * DEG;
  const c = Math.cos(t);
  return { x: c * Math.cos(a), y: c * Math.sin(a), z: Math.sin(t) };
};
