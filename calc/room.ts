/**
 * The room as the meter sees it: lights, occluders (with the subject's body), bounce patches on walls, floor
 * and ceiling, and the light each patch re-emits per light and per colour channel — the first bounce on fine
 * patches, every later bounce by radiosity on coarse patches. Receptors (flat discs and domes) gather from it.
 * Shared by meter.ts and field.ts.
 */
import { polygonFlat } from './bounce';
import type { Rgb } from './colour';
import { MODIFIERS, lookupProfile } from './modifiers';
import {
  type Occluders,
  type Patches,
  type PreparedLight,
  type SurfaceOptics,
  MIN_DISTANCE_SQ_M2,
  buildOccluders,
  buildPatches,
  prepareLight,
  surfaceOptics,
} from './flatScene';
import type { Scene } from './sceneSchema';
import { COS_EPSILON, type Receptor, directAt, patchFormFactor, patchIncident, transmissionAlong, transmissionAlongListed } from './transport';

/** Most patches one surface is split into by the meter (first bounce). */
const METER_MAX_PATCHES_PER_SURFACE = 400;
/** Edge of the coarse patches the later bounces are solved on, m, and their most per surface. */
const RADIOSITY_PATCH_M = 1.5;
const RADIOSITY_MAX_PATCHES_PER_SURFACE = 16;
/** Most coarse patches in all: a bigger room gets bigger coarse patches (the coupling costs n²). */
const RADIOSITY_MAX_PATCHES = 160;
/** Occluder surface index of the subject's body. */
const BODY_SURFACE = -2;
/** Modifiers evaluated as area sources (their face as a Lambertian polygon), with the face's half sizes, m. */
const AREA_FACES: Record<string, { halfW: number; halfH: number; round: boolean }> = {
  'softbox': { halfW: 0.45, halfH: 0.45, round: false },
  'octa': { halfW: 0.6, halfH: 0.6, round: true },
  'strip': { halfW: 0.15, halfH: 0.6, round: false },
  'umbrella-reflective': { halfW: 0.5, halfH: 0.5, round: true },
  'umbrella-shoot-through': { halfW: 0.5, halfH: 0.5, round: true },
  'beauty-dish': { halfW: 0.28, halfH: 0.28, round: true },
};
/** A face radius at or above this (m) makes any light an area source. */
const AREA_SOURCE_MIN_RADIUS_M = 0.25;

type ReceptorKind = 'flat' | 'dome';
export type FieldReceptor = Receptor & { kind?: ReceptorKind };

export type AreaFace = {
  n: number;
  /** n × 3: corners relative to the light's centre. */
  pts: Float64Array;
  area: number;
  /** Half extents of the face along its horizontal and its upward direction, as vectors. */
  u: [number, number, number];
  v: [number, number, number];
};

export type RoomLight = PreparedLight & {
  /** Walls the light stands on: it shines only to the side its beam points to. */
  onWalls: { ax: number; ay: number; ex: number; ey: number; side: number }[];
  face: AreaFace | null;
  /** What the light's light depends on besides the room (position, axis, output, beam, face, colour). */
  key: string;
  /** Small number standing for `key` in the room's caches. */
  uid: number;
};

export type Room = {
  scene: Scene;
  /** Stands for the room's geometry (walls, flags, floor, ceiling, subject, patch options): equal keys, same patches. */
  geometryKey: string;
  lights: RoomLight[];
  /** Occluders including the subject's body (for every receptor but the subject's own). */
  occ: Occluders;
  /** Occluders without the body (for receptors at the subject). */
  occFree: Occluders;
  patches: Patches;
  optics: SurfaceOptics;
  /**
   * Per light: luminance per fine patch, cd·s/m² per colour channel (linear sRGB, the light's colour),
   * [6·i + 3·side + c] with side 0 front, 1 back: first bounce plus all later ones.
   */
  lum: Float64Array[];
  /** The same for the first bounce only (for reports and tests). */
  lumFirst: Float64Array[];
  /**
   * Per light: the later bounces per coarse patch, [6·p + 3·side + c] — every fine patch's `lum` is its `lumFirst`
   * plus its coarse parent's entry here (the light map sums a light's bounce from the two parts).
   */
  lumLater: Float64Array[];
  /** Each fine patch's coarse patch (−1: none). */
  parent: Int32Array;
  /** Later bounces: solved directly (passes 0, converged), or passes used if iterated. */
  radiosity: { passes: number; converged: boolean; coarseCount: number };
  /** Coarse patches and per-side total luminance summed over all lights (for cheap per-pixel gathers). */
  coarse: Patches;
  coarseLum: Float64Array;
  /** Receptor weights on the patches, kept while the room's geometry stays (see receptorWeights). */
  weightsCache: Map<string, Weights>;
  /** Direct light by light and receptor, kept while the room's geometry stays (see cachedDirect). */
  directCache: Map<number, DirectResult>;
  ids: Map<string, number>;
};

/**
 * The head's size in the subject's body (common practice, from memory: an adult head is about 0.16 m wide and
 * 0.2 m front to back, and the shoulder line about 0.3 m below the top of the head).
 */
const HEAD_WIDTH_M = 0.16;
const HEAD_DEPTH_M = 0.2;
const HEAD_AND_NECK_M = 0.3;

type BodyPanel = { ax: number; ay: number; ex: number; ey: number; zLo: number; zHi: number };

/**
 * The subject's body as vertical panels, or none: a torso (the body's width across the shoulders and its
 * depth) from the floor to the shoulder line, and a narrower head on it up to the body's top — two upright
 * boxes, turned with the subject's facing. The torso's four panels come first (its footprint holds the head's).
 * A body too short for a head and shoulders is one box.
 */
export function bodyPanels(scene: Scene): BodyPanel[] {
  const b = scene.subject.body;
  if (!b) return [];
  const f = (scene.subject.facingDeg * Math.PI) / 180;
  const fx = Math.cos(f);
  const fy = Math.sin(f);
  const sx = -fy;
  const sy = fx;
  const box = (w: number, d: number, zLo: number, zHi: number): BodyPanel[] => {
    const hw = w / 2;
    const hd = d / 2;
    const c = [
      [hd, hw],
      [hd, -hw],
      [-hd, -hw],
      [-hd, hw],
    ].map(([a, s]) => [scene.subject.x + fx * a! + sx * s!, scene.subject.y + fy * a! + sy * s!] as const);
    return c.map((p, i) => {
      const q = c[(i + 1) % 4]!;
      return { ax: p[0], ay: p[1], ex: q[0] - p[0], ey: q[1] - p[1], zLo, zHi };
    });
  };
  const shoulders = b.topM - HEAD_AND_NECK_M;
  if (shoulders < HEAD_AND_NECK_M) return box(b.widthM, b.depthM, 0, b.topM);
  return [...box(b.widthM, b.depthM, 0, shoulders), ...box(Math.min(HEAD_WIDTH_M, b.widthM), Math.min(HEAD_DEPTH_M, b.depthM), shoulders, b.topM)];
}

function withBody(o: Occluders, scene: Scene): Occluders {
  const body = bodyPanels(scene);
  if (body.length === 0) return o;
  const n = o.count + body.length;
  const grow = (a: Float64Array, f: (i: number) => number) => {
    const r = new Float64Array(n);
    r.set(a);
    for (let i = 0; i < body.length; i++) r[o.count + i] = f(i);
    return r;
  };
  const surface = new Int32Array(n);
  surface.set(o.surface);
  surface.fill(BODY_SURFACE, o.count);
  const out: Occluders = {
    count: n,
    ax: grow(o.ax, (i) => body[i]!.ax),
    ay: grow(o.ay, (i) => body[i]!.ay),
    ex: grow(o.ex, (i) => body[i]!.ex),
    ey: grow(o.ey, (i) => body[i]!.ey),
    zLo: grow(o.zLo, (i) => body[i]!.zLo),
    zHi: grow(o.zHi, (i) => body[i]!.zHi),
    transmission: grow(o.transmission, () => 0),
    surface,
  };
  if (o.tilted) {
    // The body's panels are upright: zeros in the tilted panels' arrays.
    const tilted = new Uint8Array(n);
    tilted.set(o.tilted);
    Object.assign(out, { tilted, vx: grow(o.vx!, () => 0), vy: grow(o.vy!, () => 0), vz: grow(o.vz!, () => 0), nx: grow(o.nx!, () => 0), ny: grow(o.ny!, () => 0), nz: grow(o.nz!, () => 0) });
  }
  return out;
}

/** Walls (opaque surfaces) a light stands on, within 1 mm of the line and inside their height. */
function wallsUnder(L: PreparedLight, o: Occluders): RoomLight['onWalls'] {
  const out: RoomLight['onWalls'] = [];
  for (let i = 0; i < o.count; i++) {
    if (o.surface[i]! < 0 || o.transmission[i]! > 0 || o.tilted?.[i] === 1) continue;
    const ex = o.ex[i]!;
    const ey = o.ey[i]!;
    const len2 = ex * ex + ey * ey;
    const t = ((L.px - o.ax[i]!) * ex + (L.py - o.ay[i]!) * ey) / len2;
    if (t < 0 || t > 1 || L.pz < o.zLo[i]! || L.pz > o.zHi[i]!) continue;
    const cross = ((L.px - o.ax[i]!) * ey - (L.py - o.ay[i]!) * ex) / Math.sqrt(len2);
    if (Math.abs(cross) > 1e-3) continue;
    // Side of the line the beam points to (sign of the same cross product for the axis direction).
    const side = Math.sign(L.ax * ey - L.ay * ex) || 1;
    out.push({ ax: o.ax[i]!, ay: o.ay[i]!, ex, ey, side });
  }
  return out;
}

/** True when a light standing on a wall line would have to shine through that wall to reach (qx, qy). */
export function behindOwnWall(L: RoomLight, qx: number, qy: number): boolean {
  for (const w of L.onWalls) {
    const s = (qx - w.ax) * w.ey - (qy - w.ay) * w.ex;
    if (s * w.side < 0) return true;
  }
  return false;
}

function areaFace(L: PreparedLight): AreaFace | null {
  const spec = AREA_FACES[L.light.modifier];
  const R = Math.sqrt(L.faceR2);
  if (!spec && R < AREA_SOURCE_MIN_RADIUS_M) return null;
  // Scale the face to the modifier's face radius (an override resizes it).
  const base = spec ?? { halfW: R, halfH: R, round: true };
  if (R <= 0) return null;
  // An overridden face radius scales the named face.
  const k = spec ? R / MODIFIERS[L.light.modifier].faceRadiusM : 1;
  // Face plane ⟂ the axis: u horizontal, v "up" in the face plane.
  let ux = -L.ay;
  let uy = L.ax;
  const ul = Math.hypot(ux, uy);
  if (ul < 1e-9) {
    ux = 1;
    uy = 0;
  } else {
    ux /= ul;
    uy /= ul;
  }
  // v = axis × u
  const vx = L.ay * 0 - L.az * uy;
  const vy = L.az * ux - L.ax * 0;
  const vz = L.ax * uy - L.ay * ux;
  const hw = base.halfW * k;
  const hh = base.halfH * k;
  const corners: [number, number][] = base.round
    ? Array.from({ length: 8 }, (_, i) => {
        // Regular octagon of the disc's area: circumradius r·√(π / (2√2)).
        const a = ((i + 0.5) * Math.PI) / 4;
        const c = Math.sqrt(Math.PI / (2 * Math.SQRT2));
        return [Math.cos(a) * hw * c, Math.sin(a) * hh * c];
      })
    : [
        [-hw, -hh],
        [hw, -hh],
        [hw, hh],
        [-hw, hh],
      ];
  const pts = new Float64Array(corners.length * 3);
  corners.forEach(([a, b], i) => {
    pts[3 * i] = ux * a + vx * b;
    pts[3 * i + 1] = uy * a + vy * b;
    pts[3 * i + 2] = vz * b;
  });
  const area = base.round ? Math.PI * hw * hh : 4 * hw * hh;
  return { n: corners.length, pts, area, u: [ux * hw, uy * hw, 0], v: [vx * hh, vy * hh, vz * hh] };
}

const polyBuf = new Float64Array(3 * 8);
/**
 * Points of a big face its occlusion is tested from: a 4 × 4 grid at the centres of its quarters. An even count
 * across: a flag edge over the face's middle (half the face hidden) cuts exactly half (−1 stop), where a 3 × 3
 * grid with a middle column counted that column all in or all out (−1.6 or −0.6 stop).
 */
const SAMPLE_FRACTIONS: readonly (readonly [number, number])[] = [-3 / 4, -1 / 4, 1 / 4, 3 / 4].flatMap((a) => [-3 / 4, -1 / 4, 1 / 4, 3 / 4].map((b) => [a, b] as const));


/** The polygon's unnormalised vector irradiance Σ γᵢ·cᵢ/|cᵢ| (its sign set by the corners' order), into vecOut. */
const vecOut = new Float64Array(3);
function contourVector(q: Float64Array, m: number): void {
  let sx = 0;
  let sy = 0;
  let sz = 0;
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
    if (cl < 1e-15) continue;
    const g = Math.atan2(cl, ax * bx + ay * by + az * bz) / cl;
    sx += g * cx;
    sy += g * cy;
    sz += g * cz;
  }
  vecOut[0] = sx;
  vecOut[1] = sy;
  vecOut[2] = sz;
}


const lenBuf = new Float64Array(8);

/**
 * Solid angle of a convex polygon (corners relative to the point, at most 8): a fan of triangles, each by Van
 * Oosterom & Strackee (1983), tan(Ω/2) = a·(b × c) / (abc + (a·b)c + (a·c)b + (b·c)a). Corner lengths are found
 * once (Math.sqrt, not Math.hypot, which is several times slower in V8). The triangles' half angles are summed as
 * the argument of the product of the complex numbers den + i·triple (one atan2, not one per triangle): for a
 * convex polygon off its plane they all turn the same way and sum to under π. Triangles that turn different ways
 * or lie within 1e-9 (relative) of the point's plane (a point on or near the polygon's plane) take the plain
 * per-triangle sum.
 */
export function polygonSolidAngle(pts: Float64Array, n: number): number {
  for (let i = 0; i < n; i++) {
    const x = pts[3 * i]!;
    const y = pts[3 * i + 1]!;
    const z = pts[3 * i + 2]!;
    lenBuf[i] = Math.sqrt(x * x + y * y + z * z);
  }
  const ax = pts[0]!;
  const ay = pts[1]!;
  const az = pts[2]!;
  const la = lenBuf[0]!;
  let re = 1;
  let im = 0;
  let pos = false;
  let neg = false;
  for (let i = 1; i + 1 < n; i++) {
    const bx = pts[3 * i]!;
    const by = pts[3 * i + 1]!;
    const bz = pts[3 * i + 2]!;
    const cx = pts[3 * i + 3]!;
    const cy = pts[3 * i + 4]!;
    const cz = pts[3 * i + 5]!;
    const lb = lenBuf[i]!;
    const lc = lenBuf[i + 1]!;
    const triple = ax * (by * cz - bz * cy) - ay * (bx * cz - bz * cx) + az * (bx * cy - by * cx);
    const den = la * lb * lc + (ax * bx + ay * by + az * bz) * lc + (ax * cx + ay * cy + az * cz) * lb + (bx * cx + by * cy + bz * cz) * la;
    // Near the polygon's plane (|triple| tiny against the corners' distances) the plain sum decides.
    if (!(Math.abs(triple) > 1e-9 * la * lb * lc)) return solidAngleByTriangles(pts, n);
    if (triple > 0) pos = true;
    else neg = true;
    // Scaled to |den| + |triple| = 1 (the argument is all that counts), so the product neither overflows nor
    // underflows; corners a hair from the point (lengths near the smallest doubles) take the plain sum.
    const size = Math.abs(den) + Math.abs(triple);
    if (!(size > 1e-290)) return solidAngleByTriangles(pts, n);
    const s = 1 / size;
    const d = den * s;
    const t = triple * s;
    const r2 = re * d - im * t;
    im = re * t + im * d;
    re = r2;
  }
  if (pos && neg) return solidAngleByTriangles(pts, n);
  return Math.abs(2 * Math.atan2(im, re));
}

/** polygonSolidAngle as a plain sum over the fan's triangles (lenBuf filled by the caller). */
function solidAngleByTriangles(pts: Float64Array, n: number): number {
  const ax = pts[0]!;
  const ay = pts[1]!;
  const az = pts[2]!;
  const la = lenBuf[0]!;
  let s = 0;
  for (let i = 1; i + 1 < n; i++) {
    const bx = pts[3 * i]!;
    const by = pts[3 * i + 1]!;
    const bz = pts[3 * i + 2]!;
    const cx = pts[3 * i + 3]!;
    const cy = pts[3 * i + 4]!;
    const cz = pts[3 * i + 5]!;
    const lb = lenBuf[i]!;
    const lc = lenBuf[i + 1]!;
    const triple = ax * (by * cz - bz * cy) - ay * (bx * cz - bz * cx) + az * (bx * cy - by * cx);
    const den = la * lb * lc + (ax * bx + ay * by + az * bz) * lc + (ax * cx + ay * cy + az * cz) * lb + (bx * cx + by * cy + bz * cz) * la;
    s += Math.abs(2 * Math.atan2(triple, den));
  }
  return s;
}

/**
 * Response per unit luminance of a receptor to a polygon: flat disc — Lambert's contour integral (π × view
 * factor); dome — an ideal hemisphere responds to a direction at θ from its axis with its projected area,
 * (1 + cos θ)/2 of the frontal response for θ from 0° to 180°, so its response to a luminous polygon is
 * ½(solid angle) + ½∫cos θ dω, the cosine signed: what lies in front of the axis' plane adds, what lies behind
 * it takes away. A light 125° behind the axis reads (1 + cos 125°)/2 = 0.21 of its frontal response, not ½.
 * The signed integral is the axis' component of the polygon's vector irradiance ∫ω dω = ½Σγᵢ·cᵢ/|cᵢ| over the
 * whole polygon, unclipped (equal to the flat response along the axis minus that along its reverse, each clipped
 * to its horizon; tested): one contour sum, oriented so that it points to the polygon's side of the point.
 */
export function polygonResponse(pts: Float64Array, n: number, r: FieldReceptor): number {
  if (r.kind !== 'dome') return polygonFlat(pts, n, r.nx, r.ny, r.nz);
  // The polygon's normal m from its first three corners and its plane's offset h = q₀·m: every direction to the
  // polygon has the sign of h along m, so the vector irradiance does too.
  const e1x = pts[3]! - pts[0]!;
  const e1y = pts[4]! - pts[1]!;
  const e1z = pts[5]! - pts[2]!;
  const e2x = pts[6]! - pts[0]!;
  const e2y = pts[7]! - pts[1]!;
  const e2z = pts[8]! - pts[2]!;
  const mx = e1y * e2z - e1z * e2y;
  const my = e1z * e2x - e1x * e2z;
  const mz = e1x * e2y - e1y * e2x;
  const h = pts[0]! * mx + pts[1]! * my + pts[2]! * mz;
  const ml = Math.sqrt(mx * mx + my * my + mz * mz);
  const q0 = Math.sqrt(pts[0]! * pts[0]! + pts[1]! * pts[1]! + pts[2]! * pts[2]!);
  let signed: number;
  if (Math.abs(h) > 1e-9 * ml * q0) {
    contourVector(pts, n);
    const sx = vecOut[0]!;
    const sy = vecOut[1]!;
    const sz = vecOut[2]!;
    const along = sx * r.nx + sy * r.ny + sz * r.nz;
    signed = ((sx * mx + sy * my + sz * mz) * h < 0 ? -along : along) * 0.5;
  } else {
    // The point on (or within rounding of) the polygon's plane: the two clipped halves.
    signed = polygonFlat(pts, n, r.nx, r.ny, r.nz) - polygonFlat(pts, n, -r.nx, -r.ny, -r.nz);
  }
  return Math.max(0, 0.5 * signed + 0.5 * polygonSolidAngle(pts, n));
}
/**
 * An area source's light at a receptor before occlusion, lux·s: the face as a Lambertian polygon of luminance
 * I/A integrated over the receptor, times the beam's shape beyond a Lambertian face (p(θ)/cos θ, at most 1).
 * `cosOff`: cosine of the receptor's angle off the beam axis.
 */
export function areaUnshaded(L: RoomLight, face: AreaFace, r: FieldReceptor, cosOff: number): number {
  const n = face.n;
  for (let i = 0; i < n; i++) {
    polyBuf[3 * i] = L.px + face.pts[3 * i]! - r.x;
    polyBuf[3 * i + 1] = L.py + face.pts[3 * i + 1]! - r.y;
    polyBuf[3 * i + 2] = L.pz + face.pts[3 * i + 2]! - r.z;
  }
  const resp = polygonResponse(polyBuf, n, r);
  if (resp <= COS_EPSILON) return 0;
  const prof = lookupProfile(L.lut, cosOff);
  const shape = cosOff > COS_EPSILON ? Math.min(1, prof / cosOff) : prof;
  return (L.axialCdS / face.area) * resp * shape;
}

/** The points of a big face its occlusion is tested from (4 × 4 over the face), absolute plan coordinates. */
export function faceSamplePoints(L: RoomLight, face: AreaFace): [number, number, number][] {
  return SAMPLE_FRACTIONS.map(([a, b]) => [
    L.px + face.u[0] * a + face.v[0] * b,
    L.py + face.u[1] * a + face.v[1] * b,
    L.pz + face.u[2] * a + face.v[2] * b,
  ]);
}

export type DirectResult = { luxSeconds: number; distanceM: number; incidenceDeg: number; offAxisDeg: number; transmission: number };

/** A direct result written out (object spread, and a closure made per call, are slow in this engine). */
function directResult(base: DirectResult, luxSeconds: number, transmission: number): DirectResult {
  return { luxSeconds, distanceM: base.distanceM, incidenceDeg: base.incidenceDeg, offAxisDeg: base.offAxisDeg, transmission };
}

/**
 * Direct light of one light at a receptor (flat or dome), lux·s. Point sources: H = I·p(θ)·g·T/(d² + R²) with
 * g the receptor's response (flat: cos i; dome: (1 + cos i)/2). Area sources (big modifiers): the face as a
 * Lambertian polygon of luminance I/A, integrated exactly over the receptor (so side-on readings close to a
 * softbox see only the part of the face above their horizon), times the beam's shape beyond a Lambertian face
 * (p(θ)/cos θ, at most 1); transmission averaged over 16 points of the face, so a flag over part of the
 * face cuts part of the light.
 */
export function directLight(L: RoomLight, occ: Occluders, r: FieldReceptor): DirectResult {
  const base = directAt(L, occ, r.x, r.y, r.z, r.nx, r.ny, r.nz);
  const dx = r.x - L.px;
  const dy = r.y - L.py;
  const dz = r.z - L.pz;
  const d2 = dx * dx + dy * dy + dz * dz;
  const d = Math.sqrt(d2);
  if (L.axialCdS <= 0) return directResult(base, 0, base.transmission);
  if (L.onWalls.length > 0 && behindOwnWall(L, r.x, r.y)) return directResult(base, 0, 0);
  const cosOff = d > 1e-6 ? (dx * L.ax + dy * L.ay + dz * L.az) / d : 1;
  const face = L.face;
  if (!face) {
    if (r.kind !== 'dome') return base;
    const c = d > 1e-6 ? -(dx * r.nx + dy * r.ny + dz * r.nz) / d : 1;
    const g = (1 + c) / 2;
    if (g <= COS_EPSILON) return directResult(base, 0, base.transmission);
    const t = transmissionAlong(occ, L.px, L.py, L.pz, r.x, r.y, r.z);
    const h = (L.axialCdS * lookupProfile(L.lut, cosOff) * g * t) / Math.max(MIN_DISTANCE_SQ_M2, d2 + L.faceR2);
    return directResult(base, h, t);
  }
  // Receptor behind the face plane: nothing (the modifier's back is closed) unless it spills backwards.
  if (cosOff <= COS_EPSILON && L.modifier.backSpill <= 0) return directResult(base, 0, base.transmission);
  const unshaded = areaUnshaded(L, face, r, cosOff);
  if (unshaded <= 0) return directResult(base, 0, base.transmission);
  const t = faceTransmission(L, face, occ, r);
  return directResult(base, unshaded * t, t);
}

/**
 * directLight's lux·s alone, for per-pixel and per-sample callers (the frame, the map's wall strips, the coarse
 * gather): the same formulas in the same order (so the same numbers, tested), without the angles in degrees,
 * the result object, or — for domes and big faces — the point form's own ray test, which directLight computes
 * for its report and then replaces.
 */
export function directLux(L: RoomLight, occ: Occluders, r: FieldReceptor): number {
  if (L.axialCdS <= 0) return 0;
  if (L.onWalls.length > 0 && behindOwnWall(L, r.x, r.y)) return 0;
  const dx = r.x - L.px;
  const dy = r.y - L.py;
  const dz = r.z - L.pz;
  const d2 = dx * dx + dy * dy + dz * dz;
  const d = Math.sqrt(d2);
  const face = L.face;
  if (!face) {
    if (r.kind !== 'dome') {
      // transport.directAt's point form.
      const apart = d > 1e-6;
      const inv = apart ? 1 / d : 0;
      const cosInc = apart ? -(dx * r.nx + dy * r.ny + dz * r.nz) * inv : 1;
      if (cosInc <= COS_EPSILON) return 0;
      const cosOffP = apart ? (dx * L.ax + dy * L.ay + dz * L.az) * inv : 1;
      const t = transmissionAlong(occ, L.px, L.py, L.pz, r.x, r.y, r.z);
      return (L.axialCdS * lookupProfile(L.lut, cosOffP) * cosInc * t) / Math.max(MIN_DISTANCE_SQ_M2, d2 + L.faceR2);
    }
    const cosOffD = d > 1e-6 ? (dx * L.ax + dy * L.ay + dz * L.az) / d : 1;
    const c = d > 1e-6 ? -(dx * r.nx + dy * r.ny + dz * r.nz) / d : 1;
    const g = (1 + c) / 2;
    if (g <= COS_EPSILON) return 0;
    const t = transmissionAlong(occ, L.px, L.py, L.pz, r.x, r.y, r.z);
    return (L.axialCdS * lookupProfile(L.lut, cosOffD) * g * t) / Math.max(MIN_DISTANCE_SQ_M2, d2 + L.faceR2);
  }
  const cosOff = d > 1e-6 ? (dx * L.ax + dy * L.ay + dz * L.az) / d : 1;
  if (cosOff <= COS_EPSILON && L.modifier.backSpill <= 0) return 0;
  const unshaded = areaUnshaded(L, face, r, cosOff);
  if (unshaded <= 0) return 0;
  return unshaded * faceTransmission(L, face, occ, r);
}

/**
 * The occluders that could stand between a big face and a receptor, listed in `nearList` (their count returned):
 * a bounding-box test of the box around the face's corners and the receptor against each occluder's box (its plan
 * extent, a tilted panel's lean included, and its heights). Conservative: one left out meets no such ray.
 */
let nearList = new Int32Array(64);
function occludersNear(L: RoomLight, face: AreaFace, occ: Occluders, r: FieldReceptor): number {
  let x0 = r.x;
  let x1 = r.x;
  let y0 = r.y;
  let y1 = r.y;
  let z0 = r.z;
  let z1 = r.z;
  for (let k = 0; k < face.n; k++) {
    const x = L.px + face.pts[3 * k]!;
    const y = L.py + face.pts[3 * k + 1]!;
    const z = L.pz + face.pts[3 * k + 2]!;
    if (x < x0) x0 = x;
    if (x > x1) x1 = x;
    if (y < y0) y0 = y;
    if (y > y1) y1 = y;
    if (z < z0) z0 = z;
    if (z > z1) z1 = z;
  }
  const tl = occ.tilted;
  let n = 0;
  for (let i = 0; i < occ.count; i++) {
    if (occ.zHi[i]! < z0 || occ.zLo[i]! > z1) continue;
    const ax = occ.ax[i]!;
    const ay = occ.ay[i]!;
    const bx = ax + occ.ex[i]!;
    const by = ay + occ.ey[i]!;
    let lx = Math.min(ax, bx);
    let hx = Math.max(ax, bx);
    let ly = Math.min(ay, by);
    let hy = Math.max(ay, by);
    if (tl !== undefined && tl[i] === 1) {
      const vx = occ.vx![i]!;
      const vy = occ.vy![i]!;
      lx = Math.min(lx, lx + vx);
      hx = Math.max(hx, hx + vx);
      ly = Math.min(ly, ly + vy);
      hy = Math.max(hy, hy + vy);
    }
    if (hx < x0 || lx > x1 || hy < y0 || ly > y1) continue;
    if (nearList.length < occ.count) nearList = new Int32Array(occ.count);
    nearList[n++] = i;
  }
  return n;
}

/**
 * Transmission from a big face to a receptor: the mean over the face's points (SAMPLE_FRACTIONS), each ray tested
 * only when some occluder's box meets the face–receptor box (most receptors in a room have none in the way).
 */
function faceTransmission(L: RoomLight, face: AreaFace, occ: Occluders, r: FieldReceptor): number {
  const n = occludersNear(L, face, occ, r);
  if (n === 0) return 1;
  const list = nearList;
  let t = 0;
  for (const [a, b] of SAMPLE_FRACTIONS) {
    const sx = L.px + face.u[0] * a + face.v[0] * b;
    const sy = L.py + face.u[1] * a + face.v[1] * b;
    const sz = L.pz + face.u[2] * a + face.v[2] * b;
    t += transmissionAlongListed(occ, list, n, sx, sy, sz, r.x, r.y, r.z);
  }
  return t / SAMPLE_FRACTIONS.length;
}

function prepareRoomLights(scene: Scene, occ: Occluders): RoomLight[] {
  return scene.lights.map((l, i) => {
    const L = prepareLight(l, i, scene);
    const face = areaFace(L);
    const cal = l.calibration;
    if (face && cal) {
      // The calibration was derived with the on-axis point form I/(d² + R²); keep the reading exact under the
      // area model by scaling the output by (point form)/(area form) at the reading's distance.
      const d = cal.distanceM;
      for (let k = 0; k < face.n; k++) {
        polyBuf[3 * k] = face.pts[3 * k]! - L.ax * d;
        polyBuf[3 * k + 1] = face.pts[3 * k + 1]! - L.ay * d;
        polyBuf[3 * k + 2] = face.pts[3 * k + 2]! - L.az * d;
      }
      const areaForm = polygonFlat(polyBuf, face.n, -L.ax, -L.ay, -L.az) / face.area;
      const pointForm = 1 / (d * d + L.faceR2);
      if (areaForm > 0) {
        L.axialCdS *= pointForm / areaForm;
        L.axialFullPowerCdS *= pointForm / areaForm;
      }
    }
    const m = L.modifier;
    const key = `${L.px},${L.py},${L.pz},${L.ax},${L.ay},${L.az},${L.axialCdS},${L.faceR2},${l.modifier},${m.halfAngleDeg},${m.edgeSoftness},${m.backSpill},${L.rgb[0]},${L.rgb[1]},${L.rgb[2]}`;
    return Object.assign(L, { onWalls: wallsUnder(L, occ), face, key, uid: -1 });
  });
}

function parentIndex(fine: Patches, coarse: Patches, i: number): number {
  const s = fine.surface[i]!;
  const lf = fine.layout[s]!;
  const lc = coarse.layout[s]!;
  if (lc.nu === 0) return -1;
  const k = i - lf.start;
  const iu = Math.floor(k / lf.nv);
  const iv = k % lf.nv;
  const cu = Math.min(lc.nu - 1, Math.floor(((iu + 0.5) / lf.nu) * lc.nu));
  const cv = Math.min(lc.nv - 1, Math.floor(((iv + 0.5) / lf.nv) * lc.nv));
  return lc.start + cu * lc.nv + cv;
}

/** Coarse coupling: for each ordered pair of facing coarse sides, irradiance at a per unit luminance of b. */
type Coupling = { to: Int32Array; from: Int32Array; k: Float64Array; count: number };

function couplings(P: Patches, occ: Occluders): Coupling {
  const to: number[] = [];
  const from: number[] = [];
  const ks: number[] = [];
  for (let i = 0; i < P.count; i++) {
    for (let j = 0; j < P.count; j++) {
      if (i === j || P.surface[i] === P.surface[j]) continue;
      const vx = P.cx[i]! - P.cx[j]!;
      const vy = P.cy[i]! - P.cy[j]!;
      const vz = P.cz[i]! - P.cz[j]!;
      const r2 = vx * vx + vy * vy + vz * vz;
      const cj = (vx * P.nx[j]! + vy * P.ny[j]! + vz * P.nz[j]!) / Math.sqrt(r2); // j's side that i is on
      const ci = -(vx * P.nx[i]! + vy * P.ny[i]! + vz * P.nz[i]!) / Math.sqrt(r2); // i's side that j is on
      if (Math.abs(cj) < COS_EPSILON || Math.abs(ci) < COS_EPSILON) continue;
      const t = transmissionAlong(occ, P.cx[j]!, P.cy[j]!, P.cz[j]!, P.cx[i]!, P.cy[i]!, P.cz[i]!, P.surface[j]!);
      if (t <= 0) continue;
      const a = P.area[j]!;
      to.push(2 * i + (ci > 0 ? 0 : 1));
      from.push(2 * j + (cj > 0 ? 0 : 1));
      ks.push((a * Math.abs(ci) * Math.abs(cj) * t) / (r2 + a / Math.PI));
    }
  }
  return { to: Int32Array.from(to), from: Int32Array.from(from), k: Float64Array.from(ks), count: ks.length };
}

/**
 * Every later bounce of the coarse system at once, per channel c: with A_c = diag(ρ_c/π)·K on the side-patches
 * that take part in any coupling, the sum of all later bounces is Σ_{k≥1} A_c^k · first = (I − A_c)⁻¹·A_c · first.
 * Solved once per room geometry (Gaussian elimination with partial pivoting); each light then costs one
 * matrix–vector product per channel. `side[s]`: row of side-patch s (2·patch + side) or −1.
 */
type Transfer = { n: number; side: Int32Array; sides: Int32Array; Y: Float64Array[] };

function solveTransfer(coarse: Patches, coupling: Coupling, optics: SurfaceOptics): Transfer | null {
  const nS = 2 * coarse.count;
  const side = new Int32Array(nS).fill(-1);
  const list: number[] = [];
  for (let m = 0; m < coupling.count; m++) {
    for (const s of [coupling.to[m]!, coupling.from[m]!]) {
      if (side[s]! < 0) {
        side[s] = list.length;
        list.push(s);
      }
    }
  }
  const n = list.length;
  if (n === 0) return null;
  const Y: Float64Array[] = [];
  for (let c = 0; c < 3; c++) {
    const A = new Float64Array(n * n);
    for (let m = 0; m < coupling.count; m++) {
      const a = side[coupling.to[m]!]!;
      const b = side[coupling.from[m]!]!;
      A[a * n + b] = A[a * n + b]! + coupling.k[m]!;
    }
    for (let a = 0; a < n; a++) {
      const s = list[a]!;
      const o = optics[coarse.surface[s >> 1]!]!;
      const rho = ((s & 1) === 0 ? o.front.rgb[c]! : o.back.rgb[c]!) / Math.PI;
      for (let b = 0; b < n; b++) A[a * n + b] = A[a * n + b]! * rho;
    }
    // M = I − A; solve M·X = A for X (all n right-hand sides).
    const M = new Float64Array(n * n);
    for (let q = 0; q < n * n; q++) M[q] = -A[q]!;
    for (let a = 0; a < n; a++) M[a * n + a] = M[a * n + a]! + 1;
    const X = A;
    for (let col = 0; col < n; col++) {
      let piv = col;
      let best = Math.abs(M[col * n + col]!);
      for (let r = col + 1; r < n; r++) {
        const v = Math.abs(M[r * n + col]!);
        if (v > best) {
          best = v;
          piv = r;
        }
      }
      if (piv !== col) {
        for (let q = 0; q < n; q++) {
          const t = M[col * n + q]!;
          M[col * n + q] = M[piv * n + q]!;
          M[piv * n + q] = t;
          const u = X[col * n + q]!;
          X[col * n + q] = X[piv * n + q]!;
          X[piv * n + q] = u;
        }
      }
      const d = M[col * n + col]!;
      for (let r = 0; r < n; r++) {
        if (r === col) continue;
        const f = M[r * n + col]! / d;
        if (f === 0) continue;
        for (let q = col; q < n; q++) M[r * n + q] = M[r * n + q]! - f * M[col * n + q]!;
        for (let q = 0; q < n; q++) X[r * n + q] = X[r * n + q]! - f * X[col * n + q]!;
      }
    }
    for (let r = 0; r < n; r++) {
      const d = M[r * n + r]!;
      for (let q = 0; q < n; q++) X[r * n + q] = X[r * n + q]! / d;
    }
    Y.push(X);
  }
  return { n, side, sides: Int32Array.from(list), Y };
}

/** Receptor weights on a patch set: for each patch seen, the luminance offset (6·i + 3·side) and response × transmission. */
export type Weights = { off: Int32Array; w: Float64Array; n: number };

/** One light's bounce: fine-patch luminance of the first bounce, and with every later bounce added. */
type LightBounce = { first: Float64Array; total: Float64Array; later: Float64Array };

type GeoCache = {
  key: string;
  fine: Patches;
  coarse: Patches;
  parent: Int32Array;
  coupling: Coupling;
  transfer: Transfer | null;
  occ: Occluders;
  occFree: Occluders;
  optics: SurfaceOptics;
  /** Per light (by what its bounce depends on): its bounce; kept while the geometry stays. */
  lights: Map<string, LightBounce>;
  /** Receptor weights by receptor, patch set and occluders; kept while the geometry stays. */
  weights: Map<string, Weights>;
  /** Direct light by light and receptor (the meter's fixed receptors while one light is dragged), keyed uid·2²⁰ + receptor id. */
  direct: Map<number, DirectResult>;
  /** Small numbers for light keys and receptor keys. */
  ids: Map<string, number>;
  /** The scene parts the key was made of, compared by identity first. */
  parts: unknown[];
};

/** Geometry cache: the last room's patches, couplings and radiosity transfer, reused while walls, flags, floor and ceiling stay. */
let geoCache: GeoCache | null = null;
/** Forget the cached room (tests compare a cached answer with a fresh one). */
export function resetRoomCache(): void {
  geoCache = null;
}

/** Most cached lights and receptors per room geometry (a drag adds one per frame; the oldest are dropped). */
const LIGHT_CACHE_MAX = 128;
const WEIGHTS_CACHE_MAX = 256;
const DIRECT_CACHE_MAX = 4096;

const receptorKey = (r: FieldReceptor, self: boolean): string => `${self ? 1 : 0}|${r.kind ?? 'flat'}|${r.x},${r.y},${r.z},${r.nx},${r.ny},${r.nz}`;

function internId(ids: Map<string, number>, key: string): number {
  let id = ids.get(key);
  if (id === undefined) {
    id = ids.size;
    ids.set(key, id);
  }
  return id;
}

/** directLight through the room's cache: a light that did not move is not recomputed at a receptor asked before. */
function cachedDirect(room: Room, L: RoomLight, r: FieldReceptor, self: boolean, rk: number): DirectResult {
  const key = L.uid * 1048576 + rk;
  const hit = room.directCache.get(key);
  if (hit) return hit;
  return remember(room.directCache, key, directLight(L, self ? room.occFree : room.occ, r), DIRECT_CACHE_MAX);
}

// The subject is part of the geometry only through its body (its shadow); without one, moving it keeps the room.
const GEOMETRY_PARTS = (scene: Scene): unknown[] => [scene.surfaces, scene.flags, scene.floor, scene.ceiling, scene.subject.body ? scene.subject : null, scene.options.patchSizeM, scene.options.bounce, scene.options.interreflection];

function geometryKey(scene: Scene): string {
  return JSON.stringify(GEOMETRY_PARTS(scene));
}

function remember<K, V>(map: Map<K, V>, key: K, value: V, max: number): V {
  if (map.size >= max) map.delete(map.keys().next().value as K);
  map.set(key, value);
  return value;
}

/** Light of one light on the patches: first bounce on the fine patches, later bounces through the coarse transfer. */
function lightBounce(L: RoomLight, g: GeoCache, inc: Float64Array): LightBounce {
  const { fine, coarse, parent, transfer, occ, optics } = g;
  const nF = fine.count;
  const nC = coarse.count;
  const first = new Float64Array(nF * 6);
  if (L.axialCdS > 0 && nF > 0) {
    patchIncident(L, fine, occ, inc);
    for (let i = 0; i < nF; i++) {
      const e = inc[i]!;
      if (e === 0) continue;
      if (L.onWalls.length > 0 && behindOwnWall(L, fine.cx[i]!, fine.cy[i]!)) continue;
      const o = optics[fine.surface[i]!]!;
      const side = e > 0 ? 0 : 1;
      const rho = side === 0 ? o.front.rgb : o.back.rgb;
      const m = Math.abs(e) / Math.PI;
      for (let c = 0; c < 3; c++) first[6 * i + 3 * side + c] = m * L.rgb[c]! * rho[c]!;
    }
  }
  const total = new Float64Array(first);
  const later = new Float64Array(nC * 6);
  if (L.axialCdS > 0 && nC > 0 && transfer) {
    const n = transfer.n;
    const x = new Float64Array(3 * n);
    patchIncident(L, coarse, occ, inc);
    let any = false;
    for (let i = 0; i < nC; i++) {
      const e = inc[i]!;
      if (e === 0) continue;
      if (L.onWalls.length > 0 && behindOwnWall(L, coarse.cx[i]!, coarse.cy[i]!)) continue;
      const sd = e > 0 ? 0 : 1;
      const row = transfer.side[2 * i + sd]!;
      if (row < 0) continue;
      const o = optics[coarse.surface[i]!]!;
      const rho = sd === 0 ? o.front.rgb : o.back.rgb;
      for (let c = 0; c < 3; c++) x[c * n + row] = (Math.abs(e) / Math.PI) * L.rgb[c]! * rho[c]!;
      any = true;
    }
    if (any) {
      // Later bounces per active side-patch and channel: Y_c · x_c.
      const h = new Float64Array(3 * n);
      for (let c = 0; c < 3; c++) {
        const Y = transfer.Y[c]!;
        const xo = c * n;
        for (let r = 0; r < n; r++) {
          let acc = 0;
          const ro = r * n;
          for (let q = 0; q < n; q++) acc += Y[ro + q]! * x[xo + q]!;
          h[xo + r] = acc;
        }
      }
      for (let p = 0; p < nC; p++) {
        for (let sd = 0; sd < 2; sd++) {
          const row = transfer.side[2 * p + sd]!;
          if (row < 0) continue;
          for (let c = 0; c < 3; c++) later[6 * p + 3 * sd + c] = h[c * n + row]!;
        }
      }
      for (let i = 0; i < nF; i++) {
        const p = parent[i]!;
        if (p < 0) continue;
        for (let sd = 0; sd < 2; sd++) {
          const row = transfer.side[2 * p + sd]!;
          if (row < 0) continue;
          for (let c = 0; c < 3; c++) total[6 * i + 3 * sd + c] = total[6 * i + 3 * sd + c]! + h[c * n + row]!;
        }
      }
    }
  }
  return { first, total, later };
}

/** Build the room for a validated scene. */
/** Builds the room's geometry for `scene` into the cache now (its patches, couplings and radiosity transfer:
 *  the bulk of a cold reading), so a reading asked for next (say, in the next task) starts from it. */
export function warmRoomCache(scene: Scene): void {
  buildRoom(scene);
}

export function buildRoom(scene: Scene): Room {
  // The same geometry objects as last time (a drag that moves only lights keeps them): skip the key.
  const same =
    geoCache !== null && geoCache.parts.length === GEOMETRY_PARTS(scene).length && GEOMETRY_PARTS(scene).every((p, i) => p === geoCache!.parts[i]);
  const key = same ? geoCache!.key : geometryKey(scene);
  if (!geoCache || geoCache.key !== key) {
    const occFree = buildOccluders(scene);
    const occ = withBody(occFree, scene);
    const bounceOn = scene.options.bounce;
    const none = { ...scene, surfaces: [], floor: undefined, ceiling: undefined };
    const fine = bounceOn ? buildPatches(scene, scene.options.patchSizeM, METER_MAX_PATCHES_PER_SURFACE, true) : buildPatches(none, 1, 1, true);
    let area = 0;
    for (const sf of scene.surfaces) if (sf.bounces) area += Math.hypot(sf.x2 - sf.x1, sf.y2 - sf.y1) * (sf.topM - sf.baseM);
    if (scene.floor) area += Math.abs((scene.floor.x2 - scene.floor.x1) * (scene.floor.y2 - scene.floor.y1)) * (scene.ceiling ? 2 : 1);
    const coarseSize = Math.max(RADIOSITY_PATCH_M, Math.sqrt(area / RADIOSITY_MAX_PATCHES));
    const coarse =
      bounceOn && scene.options.interreflection
        ? buildPatches(scene, coarseSize, RADIOSITY_MAX_PATCHES_PER_SURFACE, true)
        : buildPatches(none, 1, 1, true);
    const parent = new Int32Array(fine.count);
    for (let i = 0; i < fine.count; i++) parent[i] = coarse.count > 0 ? parentIndex(fine, coarse, i) : -1;
    const optics = surfaceOptics(scene);
    const coupling = couplings(coarse, occ);
    geoCache = {
      key, fine, coarse, parent, coupling, occ, occFree, optics,
      transfer: coupling.count > 0 ? solveTransfer(coarse, coupling, optics) : null,
      lights: new Map(),
      weights: new Map(),
      direct: new Map(),
      ids: new Map(),
      parts: GEOMETRY_PARTS(scene),
    };
  } else if (!same) geoCache.parts = GEOMETRY_PARTS(scene);
  const g = geoCache;
  const { fine, coarse, parent, occ, occFree, optics } = g;
  const lights = prepareRoomLights(scene, occFree);
  const nF = fine.count;
  const nC = coarse.count;
  const inc = new Float64Array(Math.max(nF, nC));
  const lum: Float64Array[] = [];
  const lumFirst: Float64Array[] = [];
  const lumLater: Float64Array[] = [];
  if (g.ids.size > 1 << 19) {
    g.ids.clear();
    g.direct.clear();
  }
  for (const L of lights) {
    const k = L.key;
    L.uid = internId(g.ids, 'L' + k);
    const b = g.lights.get(k) ?? remember(g.lights, k, lightBounce(L, g, inc), LIGHT_CACHE_MAX);
    lum.push(b.total);
    lumFirst.push(b.first);
    lumLater.push(b.later);
  }
  // Coarse totals over all lights: area-weighted mean of the fine luminances inside each coarse patch.
  const coarseLum = new Float64Array(nC * 6);
  if (nC > 0) {
    const area = new Float64Array(nC);
    for (let i = 0; i < nF; i++) {
      const p = parent[i]!;
      if (p < 0) continue;
      const a = fine.area[i]!;
      area[p] = area[p]! + a;
      for (const t of lum) for (let q = 0; q < 6; q++) coarseLum[6 * p + q] = coarseLum[6 * p + q]! + a * t[6 * i + q]!;
    }
    for (let p = 0; p < nC; p++) if (area[p]! > 0) for (let q = 0; q < 6; q++) coarseLum[6 * p + q] = coarseLum[6 * p + q]! / area[p]!;
  }
  return {
    scene,
    geometryKey: g.key,
    lights,
    occ,
    occFree,
    patches: fine,
    optics,
    lum,
    lumFirst,
    lumLater,
    parent,
    radiosity: { passes: 0, converged: true, coarseCount: nC },
    coarse,
    coarseLum,
    weightsCache: g.weights,
    directCache: g.direct,
    ids: g.ids,
  };
}

/**
 * A receptor at the subject's weights on one surface's fine patches (response × transmission, the body not in the
 * way), cached per room geometry like every receptor's weights: key:fill's fill-side panels read them per call.
 */
export function surfaceWeights(room: Room, surfaceIndex: number, r: FieldReceptor): Weights {
  const key = `s${surfaceIndex}|${receptorKey(r, true)}`;
  const hit = room.weightsCache.get(key);
  if (hit) return hit;
  const P = room.patches;
  const lay = P.layout[surfaceIndex];
  const count = lay ? lay.nu * lay.nv : 0;
  const off = new Int32Array(count);
  const w = new Float64Array(count);
  let n = 0;
  for (let i = lay ? lay.start : 0; i < (lay ? lay.start + count : 0); i++) {
    const f = patchResponse(P, i, r, 4);
    if (f === 0) continue;
    const t = transmissionAlong(room.occFree, P.cx[i]!, P.cy[i]!, P.cz[i]!, r.x, r.y, r.z, P.surface[i]!);
    if (t <= 0) continue;
    off[n] = 6 * i + (f > 0 ? 0 : 3);
    w[n] = Math.abs(f) * t;
    n++;
  }
  return remember(room.weightsCache, key, { off: off.slice(0, n), w: w.slice(0, n), n }, WEIGHTS_CACHE_MAX);
}

/** Weights of a receptor on a patch set (response × patch → receptor transmission), cached per room geometry. */
function receptorWeights(room: Room, P: Patches, set: 'fine' | 'coarse', r: FieldReceptor, self: boolean, exactWithin: number): Weights {
  const key = `${set}|${receptorKey(r, self)}`;
  const hit = room.weightsCache.get(key);
  if (hit) return hit;
  return remember(room.weightsCache, key, patchWeights(room, P, r, self, exactWithin), WEIGHTS_CACHE_MAX);
}

/**
 * A receptor's weights on a patch set (response × patch → receptor transmission), not cached: for callers that
 * keep them themselves (the light map's wall samples, kept with the map's fixed part).
 */
export function patchWeights(room: Room, P: Patches, r: FieldReceptor, self: boolean, exactWithin: number): Weights {
  const occ = self ? room.occFree : room.occ;
  const off = new Int32Array(P.count);
  const w = new Float64Array(P.count);
  let n = 0;
  for (let i = 0; i < P.count; i++) {
    const f = patchResponse(P, i, r, exactWithin);
    if (f === 0) continue;
    const t = transmissionAlong(occ, P.cx[i]!, P.cy[i]!, P.cz[i]!, r.x, r.y, r.z, P.surface[i]!);
    if (t <= 0) continue;
    off[n] = 6 * i + (f > 0 ? 0 : 3);
    w[n] = Math.abs(f) * t;
    n++;
  }
  return { off: off.slice(0, n), w: w.slice(0, n), n };
}

/** The dome's axis reversed, for the part of a patch behind the dome's plane (reused: the gather calls per patch). */
const reversed: FieldReceptor = { x: 0, y: 0, z: 0, nx: 0, ny: 0, nz: 0, kind: 'flat' };

/**
 * Response per unit luminance of a receptor to patch i (flat: signed πF as patchFormFactor; dome: ½ solid angle
 * + ½ the signed cosine integral — flat along its axis minus flat along its reverse, as polygonResponse), signed
 * by the patch side the receptor is on.
 */
export function patchResponse(P: Patches, i: number, r: FieldReceptor, exactWithin: number): number {
  if (r.kind !== 'dome') return patchFormFactor(P, i, r, exactWithin);
  const vx = r.x - P.cx[i]!;
  const vy = r.y - P.cy[i]!;
  const vz = r.z - P.cz[i]!;
  const nd = vx * P.nx[i]! + vy * P.ny[i]! + vz * P.nz[i]!;
  if (nd === 0) return 0;
  const side = nd > 0 ? 1 : -1;
  reversed.x = r.x;
  reversed.y = r.y;
  reversed.z = r.z;
  reversed.nx = -r.nx;
  reversed.ny = -r.ny;
  reversed.nz = -r.nz;
  const flat = Math.abs(patchFormFactor(P, i, r, exactWithin)) - Math.abs(patchFormFactor(P, i, reversed, exactWithin));
  const r2 = vx * vx + vy * vy + vz * vz;
  const hw = P.halfW[i]!;
  const hh = P.halfH[i]!;
  const size = 2 * Math.max(hw, hh);
  let omega: number;
  if (r2 < exactWithin * exactWithin * size * size) {
    for (let k = 0; k < 4; k++) {
      const a = k === 0 || k === 3 ? -1 : 1;
      const b = k < 2 ? -1 : 1;
      polyBuf[3 * k] = -vx + P.wx[i]! * hw * a + P.vx[i]! * hh * b;
      polyBuf[3 * k + 1] = -vy + P.wy[i]! * hw * a + P.vy[i]! * hh * b;
      polyBuf[3 * k + 2] = -vz + P.vz[i]! * hh * b;
    }
    omega = polygonSolidAngle(polyBuf, 4);
  } else {
    const a = P.area[i]!;
    omega = (a * (Math.abs(nd) / Math.sqrt(r2))) / (r2 + a / Math.PI);
  }
  return side * Math.max(0, 0.5 * flat + 0.5 * omega);
}

/** Per-light gather at one receptor: direct and bounce lux·s and the colour (linear sRGB × lux·s). */
export type Gathered = { direct: number; bounce: number; rgb: [number, number, number]; sample: DirectResult };

/**
 * Gather light at a receptor: each listed light's direct light and the bounce off every fine patch (with
 * occlusion of the patch → receptor path). `self`: the receptor is at the subject (its own body is not in
 * the way).
 */
export function gather(room: Room, r: FieldReceptor, self: boolean, only?: number): Gathered[] {
  const rk = internId(room.ids, 'R' + receptorKey(r, self));
  const lights = only === undefined ? room.lights : [room.lights[only]!];
  const out: Gathered[] = lights.map((L) => {
    const s = cachedDirect(room, L, r, self, rk);
    const h = s.luxSeconds;
    return { direct: h, bounce: 0, rgb: [h * L.rgb[0], h * L.rgb[1], h * L.rgb[2]], sample: s };
  });
  const W = receptorWeights(room, room.patches, 'fine', r, self, 4);
  const { off, w } = W;
  for (let k = 0; k < lights.length; k++) {
    const lum = room.lum[lights[k]!.index]!;
    let cr = 0;
    let cg = 0;
    let cb = 0;
    for (let m = 0; m < W.n; m++) {
      const b = off[m]!;
      const x = w[m]!;
      cr += lum[b]! * x;
      cg += lum[b + 1]! * x;
      cb += lum[b + 2]! * x;
    }
    const g = out[k]!;
    g.rgb[0] += cr;
    g.rgb[1] += cg;
    g.rgb[2] += cb;
    g.bounce += 0.2126 * cr + 0.7152 * cg + 0.0722 * cb;
  }
  return out;
}

/**
 * Bounce at a receptor from the coarse patches' totals over all lights, added into `out` (linear sRGB lux·s).
 * `cacheWeights`: keep the receptor's patch weights for the room (points asked again while lights move).
 */
function coarseBounceInto(room: Room, r: FieldReceptor, self: boolean, cacheWeights: boolean, out: [number, number, number]): void {
  const C = room.coarse;
  const L = room.coarseLum;
  if (cacheWeights) {
    const W = receptorWeights(room, C, 'coarse', r, self, 2);
    for (let m = 0; m < W.n; m++) {
      const b = W.off[m]!;
      const x = W.w[m]!;
      out[0] += L[b]! * x;
      out[1] += L[b + 1]! * x;
      out[2] += L[b + 2]! * x;
    }
    return;
  }
  const occ = self ? room.occFree : room.occ;
  for (let i = 0; i < C.count; i++) {
    const f = patchResponse(C, i, r, 2);
    if (f === 0) continue;
    const b = 6 * i + (f > 0 ? 0 : 3);
    if (L[b] === 0 && L[b + 1] === 0 && L[b + 2] === 0) continue;
    const t = transmissionAlong(occ, C.cx[i]!, C.cy[i]!, C.cz[i]!, r.x, r.y, r.z, C.surface[i]!);
    const w = Math.abs(f) * t;
    out[0] += L[b]! * w;
    out[1] += L[b + 1]! * w;
    out[2] += L[b + 2]! * w;
  }
}

/**
 * Total light at a receptor by the cheap path: direct from every light, bounce from the coarse totals.
 * `cacheWeights`: keep the receptor's patch weights for the room (for points asked again while lights move,
 * as the meter's background samples; not for per-pixel use).
 */
export function gatherCoarse(room: Room, r: FieldReceptor, self: boolean, cacheWeights = false): Rgb {
  const occ = self ? room.occFree : room.occ;
  const rk = cacheWeights ? internId(room.ids, 'R' + receptorKey(r, self)) : -1;
  const out: [number, number, number] = [0, 0, 0];
  for (const L of room.lights) {
    if (L.axialCdS <= 0) continue;
    const h = cacheWeights ? cachedDirect(room, L, r, self, rk).luxSeconds : directLux(L, occ, r);
    out[0] += h * L.rgb[0];
    out[1] += h * L.rgb[1];
    out[2] += h * L.rgb[2];
  }
  coarseBounceInto(room, r, self, cacheWeights, out);
  return out;
}

/** Unit vector (x, y, z), or +x for a zero vector. */
export function unitVector(x: number, y: number, z: number): { nx: number; ny: number; nz: number } {
  const l = Math.hypot(x, y, z);
  return l > 0 ? { nx: x / l, ny: y / l, nz: z / l } : { nx: 1, ny: 0, nz: 0 };
}

/**
 * The meter's receptors at the subject: the flat disc along the face, the dome pointed at the camera, and the
 * flat disc pointed at light i. The meter and the light map ask with these same receptors (so the room's
 * caches answer both).
 */
export function subjectReceptors(scene: Scene): { face: FieldReceptor; dome: FieldReceptor; pointedAt: (L: PreparedLight) => FieldReceptor } {
  const sub = scene.subject;
  const cam = scene.camera;
  const f = (sub.facingDeg * Math.PI) / 180;
  return {
    face: { x: sub.x, y: sub.y, z: sub.heightM, nx: Math.cos(f), ny: Math.sin(f), nz: 0, kind: 'flat' },
    dome: { x: sub.x, y: sub.y, z: sub.heightM, ...unitVector(cam.x - sub.x, cam.y - sub.y, cam.heightM - sub.heightM), kind: 'dome' },
    pointedAt: (L) => ({ x: sub.x, y: sub.y, z: sub.heightM, ...unitVector(L.px - sub.x, L.py - sub.y, L.pz - sub.heightM), kind: 'flat' }),
  };
}
