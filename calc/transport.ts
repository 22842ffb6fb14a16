/**
 * Light transport between lights, bounce patches and receptors: occlusion, direct exposure, light on the
 * patches and the patch → receptor form factor. Shared by the meter and the light map.
 */
import { quadIrradiancePerLuminance } from './bounce';
import { lookupProfile } from './modifiers';
import { type Occluders, type Patches, type PreparedLight, MIN_DISTANCE_SQ_M2 } from './flatScene';

const quad = new Float64Array(12);

/** Cosines within this of zero count as zero (grazing light is no light, not rounding noise). */
export const COS_EPSILON = 1e-9;
const CORNER_SIGNS = [
  [-1, -1],
  [1, -1],
  [1, 1],
  [-1, 1],
] as const;

/** A receptor (meter cell): position (plan metres, z up) and unit normal. */
export type Receptor = { x: number; y: number; z: number; nx: number; ny: number; nz: number };

/**
 * Fraction of light passing along the segment P→Q (1 = clear). A plan segment crossing counts only when the
 * ray's height at the crossing lies within the occluder's height range. Crossings at the very ends of P→Q are
 * ignored, so a point on a surface is not shadowed by that surface. skipSurface: a surface index to ignore.
 */
export function transmissionAlong(
  o: Occluders,
  px: number,
  py: number,
  pz: number,
  qx: number,
  qy: number,
  qz: number,
  skipSurface = -1,
): number {
  const dx = qx - px;
  const dy = qy - py;
  const surface = o.surface;
  let trans = 1;
  for (let i = 0; i < o.count; i++) {
    if (skipSurface >= 0 && surface[i] === skipSurface) continue;
    if (!crossesOccluder(o, i, px, py, pz, dx, dy, qz)) continue;
    trans *= o.transmission[i]!;
    if (trans === 0) return 0;
  }
  return trans;
}

/**
 * transmissionAlong over the listed occluders only (`list[0 … count − 1]`, indices into `o`): the same test, for
 * callers that found by a bounding test which occluders can be in the way (a big face's 16 rays).
 */
export function transmissionAlongListed(o: Occluders, list: Int32Array, count: number, px: number, py: number, pz: number, qx: number, qy: number, qz: number): number {
  const dx = qx - px;
  const dy = qy - py;
  let trans = 1;
  for (let m = 0; m < count; m++) {
    const i = list[m]!;
    if (!crossesOccluder(o, i, px, py, pz, dx, dy, qz)) continue;
    trans *= o.transmission[i]!;
    if (trans === 0) return 0;
  }
  return trans;
}

/** Does P → Q (Q = P + (dx, dy, ·) at height qz) cross occluder i strictly between its ends, within its heights? */
function crossesOccluder(o: Occluders, i: number, px: number, py: number, pz: number, dx: number, dy: number, qz: number): boolean {
  if (o.tilted !== undefined && o.tilted[i] === 1) return crossesTilted(o, i, px, py, pz, dx, dy, qz - pz);
  const exi = o.ex[i]!;
  const eyi = o.ey[i]!;
  let denom = dx * eyi - dy * exi;
  if (denom === 0) return false; // parallel
  const apx = o.ax[i]! - px;
  const apy = o.ay[i]! - py;
  // t = tn/denom along P→Q, s = sn/denom along the occluder; compare without dividing.
  let tn = apx * eyi - apy * exi;
  let sn = apx * dy - apy * dx;
  if (denom < 0) {
    denom = -denom;
    tn = -tn;
    sn = -sn;
  }
  if (sn < 0 || sn > denom || tn <= 1e-9 * denom || tn >= (1 - 1e-9) * denom) return false;
  const z = pz + (tn / denom) * (qz - pz);
  return z >= o.zLo[i]! && z <= o.zHi[i]!;
}

/**
 * Does the segment P → P + D cross tilted panel i (the parallelogram A + s·E + w·V, s, w ∈ [0, 1]) strictly
 * between its ends? E and V are perpendicular (E is horizontal, V lies in the vertical plane across it).
 */
function crossesTilted(o: Occluders, i: number, px: number, py: number, pz: number, dx: number, dy: number, dz: number): boolean {
  const zA = o.zLo[i]!;
  // Bounding test first: the segment's height range must meet the panel's.
  if (Math.max(pz, pz + dz) < zA || Math.min(pz, pz + dz) > o.zHi[i]!) return false;
  const nx = o.nx![i]!;
  const ny = o.ny![i]!;
  const nz = o.nz![i]!;
  const den = dx * nx + dy * ny + dz * nz;
  if (den === 0) return false;
  const apx = o.ax[i]! - px;
  const apy = o.ay[i]! - py;
  const apz = zA - pz;
  const t = (apx * nx + apy * ny + apz * nz) / den;
  if (t <= 1e-9 || t >= 1 - 1e-9) return false;
  const rx = t * dx - apx;
  const ry = t * dy - apy;
  const rz = t * dz - apz;
  const ex = o.ex[i]!;
  const ey = o.ey[i]!;
  const s = (rx * ex + ry * ey) / (ex * ex + ey * ey);
  if (s < 0 || s > 1) return false;
  const vx = o.vx![i]!;
  const vy = o.vy![i]!;
  const vz = o.vz![i]!;
  const w = (rx * vx + ry * vy + rz * vz) / (vx * vx + vy * vy + vz * vz);
  return w >= 0 && w <= 1;
}

/** Direct result of one light at one receptor, with the geometry the meter reports. */
export type DirectSample = {
  luxSeconds: number;
  distanceM: number;
  /** Angle between the receptor normal and the direction to the light, degrees. */
  incidenceDeg: number;
  /** Angle between the beam axis and the direction to the receptor, degrees. */
  offAxisDeg: number;
  /** Fraction passed by flags and walls. */
  transmission: number;
};

/**
 * Direct luminous exposure (lux·s) from a light at receptor Q with unit normal N:
 *   H = I·p(θ)·max(0, cos i)·T / (d² + R²)
 * I the on-axis cd·s, p the beam profile, i the incidence on the receptor, T the occluders' transmission,
 * R the face radius (near-field term; R = 0 is the inverse-square law).
 */
export function directAt(
  L: PreparedLight,
  occ: Occluders,
  qx: number,
  qy: number,
  qz: number,
  nx: number,
  ny: number,
  nz: number,
): DirectSample {
  const dx = qx - L.px;
  const dy = qy - L.py;
  const dz = qz - L.pz;
  const d2 = dx * dx + dy * dy + dz * dz;
  const d = Math.sqrt(d2);
  // Closer than a micrometre the directions are numerical noise: treat the receptor as on the axis, facing.
  const apart = d > 1e-6;
  const inv = apart ? 1 / d : 0;
  const cosInc = apart ? -(dx * nx + dy * ny + dz * nz) * inv : 1;
  const cosOff = apart ? (dx * L.ax + dy * L.ay + dz * L.az) * inv : 1;
  const incidenceDeg = (Math.acos(Math.max(-1, Math.min(1, cosInc))) * 180) / Math.PI;
  const offAxisDeg = (Math.acos(Math.max(-1, Math.min(1, cosOff))) * 180) / Math.PI;
  const geo = cosInc;
  if (geo <= COS_EPSILON || L.axialCdS <= 0) return { luxSeconds: 0, distanceM: d, incidenceDeg, offAxisDeg, transmission: 1 };
  const transmission = transmissionAlong(occ, L.px, L.py, L.pz, qx, qy, qz);
  const luxSeconds =
    (L.axialCdS * lookupProfile(L.lut, cosOff) * geo * transmission) / Math.max(MIN_DISTANCE_SQ_M2, d2 + L.faceR2);
  return { luxSeconds, distanceM: d, incidenceDeg, offAxisDeg, transmission };
}


/**
 * Bounce form factor from patch i to receptor q: irradiance per unit patch luminance (π × view factor),
 * signed: positive when q is on the patch's front side, negative on its back, 0 when not seen.
 * Near the patch (within four patch sizes) the exact polygon integral is used; farther away the point form
 * A·cosθe·cosθr/(r² + A/π), whose A/π term makes it exact on the axis of a disc of the same area.
 */
export function patchFormFactor(P: Patches, i: number, q: Receptor, exactWithin: number): number {
  const vx = q.x - P.cx[i]!;
  const vy = q.y - P.cy[i]!;
  const vz = q.z - P.cz[i]!;
  const nd = vx * P.nx[i]! + vy * P.ny[i]! + vz * P.nz[i]!;
  if (nd === 0) return 0;
  const side = nd > 0 ? 1 : -1;
  const r2 = vx * vx + vy * vy + vz * vz;
  const hw = P.halfW[i]!;
  const hh = P.halfH[i]!;
  const size = 2 * Math.max(hw, hh);
  if (r2 < exactWithin * exactWithin * size * size) {
    const wx = P.wx[i]! * hw;
    const wy = P.wy[i]! * hw;
    const ux = P.vx[i]! * hh;
    const uy = P.vy[i]! * hh;
    const uz = P.vz[i]! * hh;
    // Corners relative to the receptor: centre − v ± w·halfW ± v·halfH.
    let k = 0;
    for (const [sw, sh] of CORNER_SIGNS) {
      quad[k++] = -vx + wx * sw + ux * sh;
      quad[k++] = -vy + wy * sw + uy * sh;
      quad[k++] = -vz + uz * sh;
    }
    return side * quadIrradiancePerLuminance(quad, q.nx, q.ny, q.nz);
  }
  const r = Math.sqrt(r2);
  const cosE = Math.abs(nd) / r;
  const cosR = -(vx * q.nx + vy * q.ny + vz * q.nz) / r;
  if (cosR <= 0) return 0;
  const a = P.area[i]!;
  return (side * a * cosE * cosR) / (r2 + a / Math.PI);
}

/** Most sub-samples per side when a beam is sampled over a patch. */
const MAX_BEAM_SAMPLES = 6;
/** Beyond this many half angles off the axis a patch is in the beam's tail and sampled at its centre only. */
export const BEAM_TAIL_HALF_ANGLES = 3;

/**
 * Illuminance-time on every patch from one light, signed by the side it lights (+ front, − back): the mean
 * over the patch. A beam narrow against the patch (the patch spans more than half the beam's half angle as
 * seen from the light) is sampled on an s × s grid over the patch (s ≤ 6), so a grid spot smaller than a
 * patch lights it by the share it covers rather than by whether it hits the centre. Occlusion is tested from
 * the patch centre. The patch's own surface does not shadow it. `needed`: patches to compute (others get 0).
 * Patches wholly beyond `tailHalfAngles` half angles off the axis are in the beam's tail: one sample at the centre.
 */
export function patchIncident(
  L: PreparedLight,
  P: Patches,
  occ: Occluders,
  out: Float64Array,
  needed?: Uint8Array,
  tailHalfAngles = BEAM_TAIL_HALF_ANGLES,
): void {
  const halfRad = (L.modifier.halfAngleDeg * Math.PI) / 180;
  for (let i = 0; i < P.count; i++) {
    out[i] = 0;
    if (L.axialCdS <= 0 || (needed && needed[i] === 0)) continue;
    const dx = P.cx[i]! - L.px;
    const dy = P.cy[i]! - L.py;
    const dz = P.cz[i]! - L.pz;
    const d2 = dx * dx + dy * dy + dz * dz;
    const d = Math.sqrt(d2);
    if (d === 0) continue;
    const pnx = P.nx[i]!;
    const pny = P.ny[i]!;
    const pnz = P.nz[i]!;
    const nd = -(dx * pnx + dy * pny + dz * pnz) / d; // cos of incidence on the front
    if (Math.abs(nd) < COS_EPSILON) continue;
    const hw = P.halfW[i]!;
    const hh = P.halfH[i]!;
    const span = (2 * Math.max(hw, hh)) / d;
    let s = span > halfRad / 2 ? Math.min(MAX_BEAM_SAMPLES, Math.ceil((2 * span) / halfRad)) : 1;
    if (s > 1) {
      // A patch whose nearest part lies beyond three half angles off the axis sees only the beam's tail
      // (under 1/9 of the axis for the softest beam, far less for hard ones): its centre is sample enough.
      const cosC = (dx * L.ax + dy * L.ay + dz * L.az) / d;
      const offC = Math.acos(Math.max(-1, Math.min(1, cosC)));
      if (offC - span * Math.SQRT1_2 > tailHalfAngles * halfRad) s = 1;
    }
    let e = 0;
    if (s === 1) {
      const cosOff = (dx * L.ax + dy * L.ay + dz * L.az) / d;
      const prof = lookupProfile(L.lut, cosOff);
      if (prof <= 0) continue;
      e = (L.axialCdS * prof * Math.abs(nd)) / Math.max(MIN_DISTANCE_SQ_M2, d2 + L.faceR2);
    } else {
      const side = nd > 0 ? 1 : -1;
      for (let a = 0; a < s; a++) {
        const fu = ((a + 0.5) / s) * 2 - 1;
        for (let b = 0; b < s; b++) {
          const fv = ((b + 0.5) / s) * 2 - 1;
          const qx = dx + P.wx[i]! * hw * fu + P.vx[i]! * hh * fv;
          const qy = dy + P.wy[i]! * hw * fu + P.vy[i]! * hh * fv;
          const qz = dz + P.vz[i]! * hh * fv;
          const q2 = qx * qx + qy * qy + qz * qz;
          const q = Math.sqrt(q2);
          if (q === 0) continue;
          const c = (-(qx * pnx + qy * pny + qz * pnz) / q) * side;
          if (c <= 0) continue;
          const prof = lookupProfile(L.lut, (qx * L.ax + qy * L.ay + qz * L.az) / q);
          e += (prof * c) / Math.max(MIN_DISTANCE_SQ_M2, q2 + L.faceR2);
        }
      }
      e = (e * L.axialCdS) / (s * s);
    }
    if (e <= 0) continue;
    const t = transmissionAlong(occ, L.px, L.py, L.pz, P.cx[i]!, P.cy[i]!, P.cz[i]!, P.surface[i]!);
    if (t <= 0) continue;
    out[i] = nd > 0 ? e * t : -e * t;
  }
}
