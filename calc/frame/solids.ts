/**
 * The frame's solids: a neutral head-and-shoulders form of our own design, built from ellipsoids (no scanned or
 * third-party model), and props as boxes. Pure geometry: ray hits, normals and shadow tests.
 *
 * Subject frame: origin at the head's centre, f = facing (horizontal), s = f turned 90° clockwise on the plan,
 * u = up. The head's front (between the brows) sits at the meter's subject point, so the face is metered where
 * the frame shows it.
 */
import type { FrameProp } from './scene';
import { PROP_BOXES } from './scene';

export const MAT_SKIN = 1;
export const MAT_EYE = 2;
export const MAT_CLOTH = 3;

/**
 * One ellipsoid part: centre (f, s, u) and radii (f, s, u) in metres, its material, and its turn: `yawDeg`
 * about the vertical (positive turns its front towards +s), `rollDeg` about the facing axis, then `pitchDeg` about the side axis (positive leans its top forward). `side`: a
 * shoulder-line part whose side offset and side radius scale with the subject's shoulder width.
 */
type Part = { c: [number, number, number]; r: [number, number, number]; mat: number; yawDeg?: number; rollDeg?: number; pitchDeg?: number; side?: boolean };

/** Distance from the head's centre forward to the face's front between the brows, m. */
export const FACE_FRONT_M = 0.078;

/**
 * The head: our own proportions for an adult (about 23 cm crown to chin), built out from the skull so the
 * face has planes a key light can find — a brow that overhangs set-back eyes (the sockets are the hollows
 * between brow, nose and cheekbones), a nose with a bridge and a tip that cast a shadow across the cheek, high
 * cheekbones over fuller cheeks, a jaw that narrows to the chin. ±s mirror pairs are listed together.
 */
const HEAD: Part[] = [
  { c: [-0.02, 0, 0.026], r: [0.088, 0.076, 0.092], mat: MAT_SKIN }, // skull
  { c: [0.018, 0, 0.03], r: [0.058, 0.062, 0.05], mat: MAT_SKIN }, // forehead
  { c: [0.064, 0.027, 0.022], r: [0.015, 0.028, 0.009], mat: MAT_SKIN, rollDeg: -8 }, // brow ridge
  { c: [0.064, -0.027, 0.022], r: [0.015, 0.028, 0.009], mat: MAT_SKIN, rollDeg: 8 }, // brow ridge
  { c: [0.065, 0, 0.006], r: [0.011, 0.008, 0.018], mat: MAT_SKIN }, // bridge of the nose
  { c: [0.078, 0, -0.016], r: [0.012, 0.009, 0.026], mat: MAT_SKIN, pitchDeg: -24 }, // nose
  { c: [0.088, 0, -0.036], r: [0.011, 0.011, 0.009], mat: MAT_SKIN }, // tip of the nose
  { c: [0.078, 0.012, -0.038], r: [0.009, 0.008, 0.007], mat: MAT_SKIN }, // wing of the nose
  { c: [0.078, -0.012, -0.038], r: [0.009, 0.008, 0.007], mat: MAT_SKIN }, // wing of the nose
  { c: [0.055, 0.032, 0.006], r: [0.0125, 0.0125, 0.0125], mat: MAT_EYE }, // eye
  { c: [0.055, -0.032, 0.006], r: [0.0125, 0.0125, 0.0125], mat: MAT_EYE }, // eye
  { c: [0.034, 0.042, -0.013], r: [0.018, 0.028, 0.015], mat: MAT_SKIN, yawDeg: 40, rollDeg: -15 }, // cheekbone
  { c: [0.034, -0.042, -0.013], r: [0.018, 0.028, 0.015], mat: MAT_SKIN, yawDeg: -40, rollDeg: 15 }, // cheekbone
  { c: [0.022, 0.032, -0.045], r: [0.03, 0.036, 0.032], mat: MAT_SKIN, yawDeg: 30 }, // cheek
  { c: [0.022, -0.032, -0.045], r: [0.03, 0.036, 0.032], mat: MAT_SKIN, yawDeg: -30 }, // cheek
  { c: [0.025, 0, -0.045], r: [0.057, 0.05, 0.056], mat: MAT_SKIN }, // face below the eyes
  { c: [0.066, 0, -0.062], r: [0.012, 0.022, 0.01], mat: MAT_SKIN }, // mouth
  { c: [0.0, 0.042, -0.07], r: [0.055, 0.02, 0.026], mat: MAT_SKIN, rollDeg: 10 }, // jaw
  { c: [0.0, -0.042, -0.07], r: [0.055, 0.02, 0.026], mat: MAT_SKIN, rollDeg: -10 }, // jaw
  { c: [0.05, 0, -0.094], r: [0.022, 0.025, 0.018], mat: MAT_SKIN }, // chin
  { c: [-0.012, 0.072, 0], r: [0.014, 0.008, 0.03], mat: MAT_SKIN }, // ear
  { c: [-0.012, -0.072, 0], r: [0.014, 0.008, 0.03], mat: MAT_SKIN }, // ear
  { c: [-0.014, 0, -0.15], r: [0.05, 0.052, 0.09], mat: MAT_SKIN }, // neck
  { c: [-0.03, 0.085, -0.228], r: [0.062, 0.11, 0.038], mat: MAT_CLOTH, rollDeg: -22, side: true }, // slope of the shoulder
  { c: [-0.03, -0.085, -0.228], r: [0.062, 0.11, 0.038], mat: MAT_CLOTH, rollDeg: 22, side: true }, // slope of the shoulder
  { c: [-0.03, 0.16, -0.295], r: [0.066, 0.062, 0.066], mat: MAT_CLOTH, side: true }, // shoulder
  { c: [-0.03, -0.16, -0.295], r: [0.066, 0.062, 0.066], mat: MAT_CLOTH, side: true }, // shoulder
  { c: [-0.02, 0, -0.45], r: [0.11, 0.18, 0.22], mat: MAT_CLOTH, side: true }, // chest and waist
];
const STANDING: Part[] = [{ c: [-0.025, 0, -1.15], r: [0.1, 0.15, 0.55], mat: MAT_CLOTH, side: true }];
const SEATED: Part[] = [
  { c: [0.2, 0.09, -0.8], r: [0.26, 0.075, 0.075], mat: MAT_CLOTH },
  { c: [0.2, -0.09, -0.8], r: [0.26, 0.075, 0.075], mat: MAT_CLOTH },
];
/** Shoulder width the form's shoulder line is drawn for, m (the subject's body width scales it). */
const FORM_SHOULDERS_M = 0.44;

/**
 * Ellipsoids as flat arrays: centre (3) and the world → unit-sphere matrix M (9, row-major) per part, so a
 * ray o + t·d hits when |M(o − c) + t·M d| = 1 and the outward normal is Mᵀ M (p − c).
 */
export type Solids = {
  count: number;
  c: Float64Array;
  m: Float64Array;
  mat: Int32Array;
  /** Each part's bounding radius (its largest semi-axis), m. */
  pr: Float64Array;
  /** Bounding sphere of the whole subject. */
  bx: number;
  by: number;
  bz: number;
  br: number;
  /** Parts in groups (head, body), each with a bounding sphere: [first, end, x, y, z, r] per group. */
  groups: Float64Array;
  /** Eye centres (world), for catchlights: 6 numbers. */
  eyes: Float64Array;
};

export function buildSubjectSolids(subject: { x: number; y: number; heightM: number; facingDeg: number; body?: { widthM: number } | undefined }, pose: 'standing' | 'seated'): Solids {
  const a = (subject.facingDeg * Math.PI) / 180;
  const f = [Math.cos(a), Math.sin(a), 0];
  const s = [-Math.sin(a), Math.cos(a), 0];
  const u = [0, 0, 1];
  const ox = subject.x - f[0]! * FACE_FRONT_M;
  const oy = subject.y - f[1]! * FACE_FRONT_M;
  // The brow line is at the meter's height; the rest hangs from it, cut at the floor.
  const oz = subject.heightM - 0.008;
  // The shoulder line follows the subject's body width (when the plan gives one), within a believable range.
  const k = subject.body ? Math.min(1.35, Math.max(0.75, subject.body.widthM / FORM_SHOULDERS_M)) : 1;
  const parts = [...HEAD, ...(pose === 'seated' ? SEATED : STANDING)]
    .filter((p) => oz + p.c[2] + p.r[2] > 0)
    .map((p): Part => (p.side && k !== 1 ? { ...p, c: [p.c[0], p.c[1] * k, p.c[2]], r: [p.r[0], p.r[1] * k, p.r[2]] } : p));
  const n = parts.length;
  const out: Solids = { count: n, c: new Float64Array(n * 3), m: new Float64Array(n * 9), mat: new Int32Array(n), pr: new Float64Array(n), bx: 0, by: 0, bz: 0, br: 0, eyes: new Float64Array(6), groups: new Float64Array(12) };
  let lo = Infinity;
  let hi = -Infinity;
  let eye = 0;
  parts.forEach((p, i) => {
    const cx = ox + f[0]! * p.c[0] + s[0]! * p.c[1];
    const cy = oy + f[1]! * p.c[0] + s[1]! * p.c[1];
    const cz = oz + p.c[2];
    out.c[i * 3] = cx;
    out.c[i * 3 + 1] = cy;
    out.c[i * 3 + 2] = cz;
    const ya = ((p.yawDeg ?? 0) * Math.PI) / 180;
    const fy = [0, 1, 2].map((q) => f[q]! * Math.cos(ya) + s[q]! * Math.sin(ya));
    const sy = [0, 1, 2].map((q) => s[q]! * Math.cos(ya) - f[q]! * Math.sin(ya));
    const ro = ((p.rollDeg ?? 0) * Math.PI) / 180;
    const sr = [0, 1, 2].map((q) => sy[q]! * Math.cos(ro) + u[q]! * Math.sin(ro));
    const ur0 = [0, 1, 2].map((q) => u[q]! * Math.cos(ro) - sy[q]! * Math.sin(ro));
    const pi = ((p.pitchDeg ?? 0) * Math.PI) / 180;
    const fp = [0, 1, 2].map((q) => fy[q]! * Math.cos(pi) - ur0[q]! * Math.sin(pi));
    const ur = [0, 1, 2].map((q) => fy[q]! * Math.sin(pi) + ur0[q]! * Math.cos(pi));
    const axes = [fp, sr, ur];
    for (let r = 0; r < 3; r++) for (let k = 0; k < 3; k++) out.m[i * 9 + r * 3 + k] = axes[r]![k]! / p.r[r]!;
    out.mat[i] = p.mat;
    const rmax = Math.max(p.r[0], p.r[1], p.r[2]);
    out.pr[i] = rmax;
    lo = Math.min(lo, cz - rmax);
    hi = Math.max(hi, cz + rmax);
    if (p.mat === MAT_EYE && eye < 2) {
      out.eyes[eye * 3] = cx;
      out.eyes[eye * 3 + 1] = cy;
      out.eyes[eye * 3 + 2] = cz;
      eye++;
    }
  });
  // Head group: the parts before the neck; body group: the rest. Each bounded by a sphere around its parts.
  const neck = HEAD.findIndex((p) => p.c[2] < -0.12);
  const ranges: [number, number][] = [[0, neck], [neck, n]];
  ranges.forEach(([a, b], g) => {
    let cx = 0, cy = 0, cz = 0;
    for (let i = a; i < b; i++) { cx += out.c[i * 3]!; cy += out.c[i * 3 + 1]!; cz += out.c[i * 3 + 2]!; }
    const k = Math.max(1, b - a);
    cx /= k; cy /= k; cz /= k;
    let r = 0;
    for (let i = a; i < b; i++) {
      const p = parts[i]!;
      const d = Math.sqrt((out.c[i * 3]! - cx) ** 2 + (out.c[i * 3 + 1]! - cy) ** 2 + (out.c[i * 3 + 2]! - cz) ** 2);
      r = Math.max(r, d + Math.max(p.r[0], p.r[1], p.r[2]));
    }
    out.groups.set([a, b, cx, cy, cz, r], g * 6);
  });
  out.bx = ox;
  out.by = oy;
  out.bz = (lo + hi) / 2;
  out.br = Math.hypot((hi - lo) / 2, 0.4);
  return out;
}

/** Ray o + t·d against part i: the nearest t in (tMin, best), or −1. */
function hitPart(S: Solids, i: number, ox: number, oy: number, oz: number, dx: number, dy: number, dz: number, tMin: number, best: number): number {
  const { c, m } = S;
  const qx = ox - c[i * 3]!;
  const qy = oy - c[i * 3 + 1]!;
  const qz = oz - c[i * 3 + 2]!;
  const k = i * 9;
  const o0 = m[k]! * qx + m[k + 1]! * qy + m[k + 2]! * qz;
  const o1 = m[k + 3]! * qx + m[k + 4]! * qy + m[k + 5]! * qz;
  const o2 = m[k + 6]! * qx + m[k + 7]! * qy + m[k + 8]! * qz;
  const d0 = m[k]! * dx + m[k + 1]! * dy + m[k + 2]! * dz;
  const d1 = m[k + 3]! * dx + m[k + 4]! * dy + m[k + 5]! * dz;
  const d2 = m[k + 6]! * dx + m[k + 7]! * dy + m[k + 8]! * dz;
  const A = d0 * d0 + d1 * d1 + d2 * d2;
  const B = o0 * d0 + o1 * d1 + o2 * d2;
  const C = o0 * o0 + o1 * o1 + o2 * o2 - 1;
  const disc = B * B - A * C;
  if (disc < 0) return -1;
  const sq = Math.sqrt(disc);
  let t = (-B - sq) / A;
  if (t <= tMin) t = (-B + sq) / A;
  if (t <= tMin || t >= best) return -1;
  return t;
}

/**
 * Nearest hit of ray o + t·d (t in (tMin, tMax)) on the solids: part index and t. `mask`: only the parts whose
 * bits are set (a caller that has culled them, e.g. by picture tile); without it, bounding spheres cull.
 */
export function hitSolids(S: Solids, ox: number, oy: number, oz: number, dx: number, dy: number, dz: number, tMin: number, tMax: number, out: { t: number; part: number }, mask?: number): boolean {
  let best = tMax;
  let part = -1;
  if (mask !== undefined) {
    let bits = mask >>> 0;
    while (bits !== 0) {
      const low = bits & -bits;
      const i = 31 - Math.clz32(low);
      bits = (bits ^ low) >>> 0;
      const t = hitPart(S, i, ox, oy, oz, dx, dy, dz, tMin, best);
      if (t < 0) continue;
      best = t;
      part = i;
    }
    // Parts past the mask's 32 bits are always tested.
    for (let i = 32; i < S.count; i++) {
      const t = hitPart(S, i, ox, oy, oz, dx, dy, dz, tMin, best);
      if (t < 0) continue;
      best = t;
      part = i;
    }
  } else {
    // Bounding sphere first, then each group's.
    const bx = ox - S.bx;
    const by = oy - S.by;
    const bz = oz - S.bz;
    const dd = dx * dx + dy * dy + dz * dz;
    const bb = bx * dx + by * dy + bz * dz;
    const bc = bx * bx + by * by + bz * bz - S.br * S.br;
    if (bb * bb - dd * bc < 0) return false;
    const groups = S.groups;
    for (let g = 0; g < 2; g++) {
      const gx = ox - groups[g * 6 + 2]!;
      const gy = oy - groups[g * 6 + 3]!;
      const gz = oz - groups[g * 6 + 4]!;
      const gr = groups[g * 6 + 5]!;
      const gb = gx * dx + gy * dy + gz * dz;
      if (gb * gb - dd * (gx * gx + gy * gy + gz * gz - gr * gr) < 0) continue;
      const end = groups[g * 6 + 1]!;
      for (let i = groups[g * 6]!; i < end; i++) {
        const t = hitPart(S, i, ox, oy, oz, dx, dy, dz, tMin, best);
        if (t < 0) continue;
        best = t;
        part = i;
      }
    }
  }
  if (part < 0) return false;
  out.t = best;
  out.part = part;
  return true;
}

/** Outward unit normal of part i at point p, into n. */
export function solidNormal(S: Solids, i: number, px: number, py: number, pz: number, n: Float64Array): void {
  const qx = px - S.c[i * 3]!;
  const qy = py - S.c[i * 3 + 1]!;
  const qz = pz - S.c[i * 3 + 2]!;
  const m = S.m;
  const k = i * 9;
  const a0 = m[k]! * qx + m[k + 1]! * qy + m[k + 2]! * qz;
  const a1 = m[k + 3]! * qx + m[k + 4]! * qy + m[k + 5]! * qz;
  const a2 = m[k + 6]! * qx + m[k + 7]! * qy + m[k + 8]! * qz;
  // Mᵀ (M q)
  const gx = m[k]! * a0 + m[k + 3]! * a1 + m[k + 6]! * a2;
  const gy = m[k + 1]! * a0 + m[k + 4]! * a1 + m[k + 7]! * a2;
  const gz = m[k + 2]! * a0 + m[k + 5]! * a1 + m[k + 8]! * a2;
  const l = Math.hypot(gx, gy, gz) || 1;
  n[0] = gx / l;
  n[1] = gy / l;
  n[2] = gz / l;
}

const shadowHit = { t: 0, part: 0 };
/** 1 when the segment p → q clears the solids, 0 when they block it. */
export function solidsClear(S: Solids, px: number, py: number, pz: number, qx: number, qy: number, qz: number): number {
  return hitSolids(S, px, py, pz, qx - px, qy - py, qz - pz, 1e-6, 1, shadowHit) ? 0 : 1;
}

/** Props as boxes standing on the floor: centre, axes (cos, sin of rotation), half sizes. */
export type Boxes = { count: number; data: Float64Array };

export function buildBoxes(props: FrameProp[]): Boxes {
  const data = new Float64Array(props.length * 7);
  props.forEach((p, i) => {
    const b = PROP_BOXES[p.shape];
    const a = (p.rotationDeg * Math.PI) / 180;
    data.set([p.x, p.y, Math.cos(a), Math.sin(a), b.widthM / 2, b.depthM / 2, b.heightM], i * 7);
  });
  return { count: props.length, data };
}

/** Nearest box hit: t, and the outward normal into n. */
export function hitBoxes(B: Boxes, ox: number, oy: number, oz: number, dx: number, dy: number, dz: number, tMax: number, n: Float64Array): number {
  let best = tMax;
  for (let i = 0; i < B.count; i++) {
    const k = i * 7;
    const cx = B.data[k]!;
    const cy = B.data[k + 1]!;
    const ca = B.data[k + 2]!;
    const sa = B.data[k + 3]!;
    const hw = B.data[k + 4]!;
    const hd = B.data[k + 5]!;
    const h = B.data[k + 6]!;
    // Into the box frame: local x along (ca, sa), local y along (−sa, ca), z up from 0 to h.
    const rx = ox - cx;
    const ry = oy - cy;
    const lo = [ca * rx + sa * ry, -sa * rx + ca * ry, oz];
    const ld = [ca * dx + sa * dy, -sa * dx + ca * dy, dz];
    const mins = [-hw, -hd, 0];
    const maxs = [hw, hd, h];
    let t0 = 1e-6;
    let t1 = best;
    let axis = -1;
    let sign = 0;
    let ok = true;
    for (let a = 0; a < 3; a++) {
      const d = ld[a]!;
      if (Math.abs(d) < 1e-12) {
        if (lo[a]! < mins[a]! || lo[a]! > maxs[a]!) ok = false;
        continue;
      }
      let ta = (mins[a]! - lo[a]!) / d;
      let tb = (maxs[a]! - lo[a]!) / d;
      let s = -1;
      if (ta > tb) {
        [ta, tb] = [tb, ta];
        s = 1;
      }
      if (ta > t0) {
        t0 = ta;
        axis = a;
        sign = s;
      }
      if (tb < t1) t1 = tb;
      if (t0 > t1) ok = false;
    }
    if (!ok || axis < 0 || t0 >= best) continue;
    best = t0;
    if (axis === 0) {
      n[0] = ca * sign;
      n[1] = sa * sign;
      n[2] = 0;
    } else if (axis === 1) {
      n[0] = -sa * sign;
      n[1] = ca * sign;
      n[2] = 0;
    } else {
      n[0] = 0;
      n[1] = 0;
      n[2] = sign;
    }
  }
  return best;
}
