/**
 * One bounce off Lambertian surfaces.
 *
 * A Lambertian surface lit with illuminance E and reflectance ρ has exitance M = ρE and luminance
 * L = ρE/π, the same in every direction (CIE ILV "Lambertian surface"). A receptor then receives
 * E′ = L·∫cosθe·cosθr/r² dA over the surface it sees, which for a polygon has the closed form of Lambert's
 * contour integral; for a small patch it is the point form L·A·cosθe·cosθr/r².
 */
import { type Vec3, DEG, cross, dot, normalize, sub } from './vec';

/** Arguments of patchBounceLux. Angles in degrees from each surface's normal. */
export type PatchBounceArgs = {
  /** Illuminance on the patch (lux). */
  incidentLux: number;
  /** Diffuse reflectance ρ, 0–1. */
  reflectance: number;
  /** Patch area (m²); small compared with distanceM². */
  areaM2: number;
  /** Distance from the patch to the receiving point (m). */
  distanceM: number;
  /** Angle between the patch normal and the direction to the point. */
  emitAngleDeg: number;
  /** Angle between the receptor's normal and the direction to the patch. */
  receiveAngleDeg: number;
};

/**
 * Illuminance (lux) a small Lambertian patch lit with incidentLux re-emits to a point:
 * E′ = (ρE/π)·A·cosθe·cosθr/d². Either angle at or past 90° gives 0.
 */
export function patchBounceLux(a: PatchBounceArgs): number {
  const ce = Math.cos(a.emitAngleDeg * DEG);
  const cr = Math.cos(a.receiveAngleDeg * DEG);
  if (ce <= 0 || cr <= 0) return 0;
  return ((a.reflectance * a.incidentLux) / Math.PI) * ((a.areaM2 * ce * cr) / (a.distanceM * a.distanceM));
}

/**
 * Irradiance at the origin, receptor normal n (unit), from a Lambertian polygon of unit luminance whose
 * vertices `v` are given relative to the receptor: Lambert's contour integral
 *   E/L = ½ · |Σ γᵢ · n·(vᵢ × vᵢ₊₁)/|vᵢ × vᵢ₊₁||,  γᵢ = angle between vᵢ and vᵢ₊₁,
 * after clipping the polygon to the receptor's front half-space (n·v ≥ 0). Equals π·F, F the view factor.
 */
export function polygonIrradiancePerLuminance(v: readonly Vec3[], n: Vec3): number {
  // Clip against the plane n·p = 0 (Sutherland–Hodgman, one plane).
  const clipped: Vec3[] = [];
  const count = v.length;
  for (let i = 0; i < count; i++) {
    const a = v[i]!;
    const b = v[(i + 1) % count]!;
    const da = dot(a, n);
    const db = dot(b, n);
    if (da >= 0) clipped.push(a);
    if ((da >= 0) !== (db >= 0)) {
      const t = da / (da - db);
      clipped.push({ x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t, z: a.z + (b.z - a.z) * t });
    }
  }
  const m = clipped.length;
  if (m < 3) return 0;
  let sum = 0;
  for (let i = 0; i < m; i++) {
    const a = clipped[i]!;
    const b = clipped[(i + 1) % m]!;
    const c = cross(a, b);
    const cl = Math.sqrt(dot(c, c));
    if (cl < 1e-15) continue; // edge through the receptor or degenerate: no contribution
    const gamma = Math.atan2(cl, dot(a, b)); // angle between a and b, robust for small angles
    sum += (gamma * dot(n, c)) / cl;
  }
  return Math.abs(sum) * 0.5;
}

const clipPoly = new Float64Array(3 * 10);

/** Σ γᵢ·(n·cᵢ)/|cᵢ| over the edges of the polygon q (m corners), cᵢ = qᵢ × qᵢ₊₁, γᵢ the angle between the corners. */
function contourSum(q: Float64Array, m: number, nx: number, ny: number, nz: number): number {
  let sum = 0;
  for (let i = 0; i < m; i++) {
    const j = i + 1 === m ? 0 : i + 1;
    const ax = q[3 * i]!;
    const ay = q[3 * i + 1]!;
    const az = q[3 * i + 2]!;
    const bx = q[3 * j]!;
    const by = q[3 * j + 1]!;
    const bz = q[3 * j + 2]!;
    const cx = ay * bz - az * by;
    const cy = az * bx - ax * bz;
    const cz = ax * by - ay * bx;
    const cl = Math.sqrt(cx * cx + cy * cy + cz * cz);
    if (cl < 1e-15) continue; // edge through the receptor or degenerate: no contribution
    sum += (Math.atan2(cl, ax * bx + ay * by + az * bz) * (nx * cx + ny * cy + nz * cz)) / cl;
  }
  return sum;
}

/**
 * Irradiance per unit luminance from a convex polygon (corners relative to the receptor, at most 8) on a flat
 * receptor of normal n, clipped to its horizon — Lambert's contour integral over the polygon's own edges (one
 * term per edge: an octagon costs 8, where a fan of quads cost 12, its diagonals twice).
 */
export function polygonFlat(pts: Float64Array, n: number, nx: number, ny: number, nz: number): number {
  let behind = false;
  let front = false;
  for (let i = 0; i < n; i++) {
    if (pts[3 * i]! * nx + pts[3 * i + 1]! * ny + pts[3 * i + 2]! * nz >= 0) front = true;
    else behind = true;
  }
  if (!front) return 0;
  if (!behind) return Math.abs(contourSum(pts, n, nx, ny, nz)) * 0.5;
  // Clip against the plane n·p = 0 (Sutherland–Hodgman, one plane: at most one corner more).
  let m = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const ax = pts[3 * i]!;
    const ay = pts[3 * i + 1]!;
    const az = pts[3 * i + 2]!;
    const bx = pts[3 * j]!;
    const by = pts[3 * j + 1]!;
    const bz = pts[3 * j + 2]!;
    const da = ax * nx + ay * ny + az * nz;
    const db = bx * nx + by * ny + bz * nz;
    if (da >= 0) {
      clipPoly[3 * m] = ax;
      clipPoly[3 * m + 1] = ay;
      clipPoly[3 * m + 2] = az;
      m++;
    }
    if ((da >= 0) !== (db >= 0)) {
      const t = da / (da - db);
      clipPoly[3 * m] = ax + (bx - ax) * t;
      clipPoly[3 * m + 1] = ay + (by - ay) * t;
      clipPoly[3 * m + 2] = az + (bz - az) * t;
      m++;
    }
  }
  if (m < 3) return 0;
  return Math.abs(contourSum(clipPoly, m, nx, ny, nz)) * 0.5;
}

/**
 * polygonIrradiancePerLuminance for a quadrilateral given as flat coordinates
 * [x0, y0, z0, … x3, y3, z3] relative to the receptor, without allocating (the meter calls it per patch).
 */
export function quadIrradiancePerLuminance(q: Float64Array, nx: number, ny: number, nz: number): number {
  return polygonFlat(q, 4, nx, ny, nz);
}

/** Arguments of rectangleBounceLux. Points in plan metres (x right, y down the screen, z up). */
export type RectangleBounceArgs = {
  /** Centre of the rectangle. */
  center: Vec3;
  /** Normal of the lit, emitting face (need not be unit length). */
  normal: Vec3;
  /** Direction of the rectangle's height edge (projected perpendicular to the normal). */
  up: Vec3;
  /** Extent across (perpendicular to up), m. */
  widthM: number;
  /** Extent along up, m. */
  heightM: number;
  /** Uniform illuminance on the face (lux). */
  incidentLux: number;
  /** Diffuse reflectance ρ, 0–1. */
  reflectance: number;
  /** Receiving point. */
  point: Vec3;
  /** Receptor normal at the point (need not be unit length). */
  pointNormal: Vec3;
};

/** Corners of a rectangle as vectors relative to `origin`. */
function rectangleCorners(
  center: Vec3,
  normal: Vec3,
  up: Vec3,
  widthM: number,
  heightM: number,
  origin: Vec3,
): Vec3[] {
  const n = normalize(normal);
  const u0 = normalize(up);
  const du = dot(u0, n);
  const u = normalize({ x: u0.x - du * n.x, y: u0.y - du * n.y, z: u0.z - du * n.z });
  const w = cross(u, n);
  const hw = widthM / 2;
  const hh = heightM / 2;
  const c = sub(center, origin);
  const corner = (sw: number, sh: number): Vec3 => ({
    x: c.x + w.x * hw * sw + u.x * hh * sh,
    y: c.y + w.y * hw * sw + u.y * hh * sh,
    z: c.z + w.z * hw * sw + u.z * hh * sh,
  });
  return [corner(-1, -1), corner(1, -1), corner(1, 1), corner(-1, 1)];
}

/**
 * Illuminance (lux) at `point` from a uniformly lit Lambertian rectangle (a wall): L = ρE/π times the
 * exact polygon integral. A point behind the emitting face gets 0. For a very large wall in front of the
 * point (receptor facing it) the view factor tends to 1 and the result to ρ·incidentLux.
 */
export function rectangleBounceLux(a: RectangleBounceArgs): number {
  const n = normalize(a.normal);
  if (dot(sub(a.point, a.center), n) <= 0) return 0;
  const corners = rectangleCorners(a.center, n, a.up, a.widthM, a.heightM, a.point);
  const luminance = (a.reflectance * a.incidentLux) / Math.PI;
  return luminance * polygonIrradiancePerLuminance(corners, normalize(a.pointNormal));
}
