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

const MAT_SKIN = 1;
export const MAT_EYE = 2;
export const MAT_CLOTH = 3;

/**
 * One ellipsoid part: centre (f, s, u) and radii (f, s, u) in metres, its material, and its turn: `yawDeg`
 * about the vertical (positive turns its front towards +s), `rollDeg` about the facing axis, then `pitchDeg`
 * about the side axis (positive leans its top forward). `side`: a shoulder-line part whose side offset and side
 * radius scale with the subject's shoulder width. `blend`: parts of one blend class meet in a smooth fillet
 * (their normals are blended within BLEND_M of each other), so the form reads as one surface, not as beads.
 */
type Part = { c: [number, number, number]; r: [number, number, number]; mat: number; yawDeg?: number; rollDeg?: number; pitchDeg?: number; side?: boolean; blend?: number };

/** Distance from the head's centre forward to the face's front between the brows, m. */
export const FACE_FRONT_M = 0.078;

/** Blend classes and how far (m) a neighbour's surface bends a part's normal: the head's skin, the clothes. */
const BLEND_HEAD = 1;
const BLEND_BODY = 2;
const BLEND_M = [0, 0.009, 0.03];

/** Mirror a part to the other side (s → −s, its turns reversed). */
const both = (p: Part): Part[] => [p, { ...p, c: [p.c[0], -p.c[1], p.c[2]], yawDeg: p.yawDeg === undefined ? undefined : -p.yawDeg, rollDeg: p.rollDeg === undefined ? undefined : -p.rollDeg }];
const skin = (c: Part['c'], r: Part['r'], turn: Partial<Part> = {}): Part => ({ c, r, mat: MAT_SKIN, blend: BLEND_HEAD, ...turn });
const cloth = (c: Part['c'], r: Part['r'], turn: Partial<Part> = {}): Part => ({ c, r, mat: MAT_CLOTH, blend: BLEND_BODY, ...turn });

/**
 * The head: our own proportions for an adult (about 23 cm crown to chin; its centre 8 mm below the brow line).
 * A smooth skull; a brow ridge over eyes set back between the lids; a nose with a bridge, a tip and wings that
 * cast a shadow across the cheek; cheekbones over fuller cheeks; a muzzle with lips; a jaw that narrows to the
 * chin; ears; the neck.
 */
const HEAD: Part[] = [
  skin([-0.017, 0, 0.032], [0.097, 0.078, 0.09]), // skull
  skin([0.018, 0, -0.036], [0.06, 0.058, 0.074]), // face: forehead to chin, one smooth front
  skin([0.064, 0, 0.0105], [0.02, 0.052, 0.0105]), // brow ridge
  skin([0.07, 0, 0.0], [0.011, 0.0075, 0.016]), // bridge of the nose
  skin([0.081, 0, -0.021], [0.0105, 0.0085, 0.026], { pitchDeg: -22 }), // nose
  skin([0.09, 0, -0.039], [0.011, 0.0105, 0.0095]), // tip of the nose
  ...both(skin([0.079, 0.012, -0.043], [0.009, 0.008, 0.0068])), // wing of the nose
  ...both({ c: [0.056, 0.032, 0.0], r: [0.0115, 0.0115, 0.0115], mat: MAT_EYE }), // eye
  ...both(skin([0.0555, 0.032, 0.0056], [0.0122, 0.0142, 0.0098])), // upper lid
  ...both(skin([0.0535, 0.032, -0.0072], [0.0122, 0.014, 0.0085])), // lower lid
  ...both(skin([0.047, 0.038, -0.02], [0.019, 0.02, 0.014], { yawDeg: 35 })), // cheekbone
  skin([0.046, 0, -0.061], [0.033, 0.03, 0.03]), // muzzle
  skin([0.076, 0, -0.066], [0.0085, 0.02, 0.0065]), // upper lip
  skin([0.073, 0, -0.0775], [0.009, 0.018, 0.0068]), // lower lip
  ...both(skin([0.0, 0.039, -0.068], [0.046, 0.014, 0.022], { yawDeg: -22 })), // line of the jaw
  skin([0.058, 0, -0.097], [0.019, 0.022, 0.016]), // chin
  ...both(skin([-0.012, 0.07, -0.004], [0.014, 0.006, 0.024])), // ear
  skin([-0.018, 0, -0.128], [0.048, 0.054, 0.075], { pitchDeg: 8 }), // neck
];

/** Shoulders, chest and arms hanging at the sides (clothed; the hands skin). */
const TORSO: Part[] = [
  ...both(cloth([-0.025, 0.085, -0.172], [0.055, 0.1, 0.032], { rollDeg: -17, side: true })), // slope of the shoulder
  ...both(cloth([-0.022, 0.168, -0.215], [0.054, 0.052, 0.052], { side: true })), // shoulder
  cloth([-0.02, 0, -0.3], [0.09, 0.162, 0.13], { side: true }), // chest
  cloth([-0.024, 0, -0.44], [0.085, 0.138, 0.3], { side: true }), // trunk, chest to hips
  cloth([-0.028, 0, -0.68], [0.09, 0.142, 0.11], { side: true }), // hips
  ...both(cloth([-0.025, 0.192, -0.355], [0.046, 0.046, 0.155], { rollDeg: -3, side: true })), // upper arm
];
const ARMS_HANGING: Part[] = [
  ...both(cloth([-0.012, 0.2, -0.628], [0.039, 0.039, 0.135], { side: true })), // forearm
  ...both({ c: [-0.004, 0.2, -0.83], r: [0.024, 0.04, 0.075], mat: MAT_SKIN, side: true }), // hand
];
const ARMS_ON_LAP: Part[] = [
  ...both(cloth([0.088, 0.185, -0.57], [0.14, 0.039, 0.039], { pitchDeg: 32, side: true })), // forearm
  ...both({ c: [0.225, 0.165, -0.665], r: [0.075, 0.042, 0.022], mat: MAT_SKIN, pitchDeg: 15, side: true }), // hand
];
/** Hip joint below the head's centre, m. */
const HIP_U = -0.72;
/** Legs, from the hip to the floor `floorU` (below the head's centre): standing, or seated with thighs level. */
function legs(pose: 'standing' | 'seated', floorU: number): Part[] {
  if (pose === 'standing') {
    const L = Math.max(0.1, HIP_U - floorU);
    return [
      ...both(cloth([-0.02, 0.085, HIP_U - 0.25 * L], [0.072, 0.078, 0.27 * L])), // thigh
      ...both(cloth([-0.032, 0.082, HIP_U - 0.73 * L], [0.052, 0.052, 0.26 * L])), // shin
      ...both(cloth([0.045, 0.082, floorU + 0.035], [0.12, 0.045, 0.035])), // foot
    ];
  }
  const seat = HIP_U - 0.02;
  const knee = Math.max(0.05, seat - floorU);
  return [
    ...both(cloth([0.2, 0.09, seat], [0.255, 0.078, 0.072])), // thigh
    ...both(cloth([0.43, 0.09, (seat + floorU) / 2], [0.052, 0.052, knee / 2])), // shin
    ...both(cloth([0.49, 0.09, floorU + 0.035], [0.12, 0.045, 0.035])), // foot
  ];
}
/** Shoulder width the form's shoulder line is drawn for, m (the subject's body width scales it). */
const FORM_SHOULDERS_M = 0.44;
/** Most parts a form has (two 32-bit words of picture-tile masks, render.ts). */
const MAX_PARTS = 64;

/**
 * Ellipsoids as flat arrays: centre (3) and the world → unit-sphere matrix M (9, row-major) per part, so a
 * ray o + t·d hits when |M(o − c) + t·M d| = 1 and the outward normal is Mᵀ M (p − c).
 */
export type Solids = {
  count: number;
  c: Float64Array;
  m: Float64Array;
  mat: Int32Array;
  /** Each part's blend class (0: none) and the blend distance of that class, m. */
  blend: Int32Array;
  /** Each part's bounding radius (its largest semi-axis), m. */
  pr: Float64Array;
  /** Bounding sphere of the whole subject. */
  bx: number;
  by: number;
  bz: number;
  br: number;
  /** Parts in groups (head, body, legs), each with a bounding sphere: [first, end, x, y, z, r] per group. */
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
  // The brow line is at the meter's height; the rest hangs from it, the legs reach the floor.
  const oz = subject.heightM - 0.008;
  // The shoulder line follows the subject's body width (when the plan gives one), within a believable range.
  const k = subject.body ? Math.min(1.35, Math.max(0.75, subject.body.widthM / FORM_SHOULDERS_M)) : 1;
  const scale = (p: Part): Part => (p.side && k !== 1 ? { ...p, c: [p.c[0], p.c[1] * k, p.c[2]], r: [p.r[0], p.r[1] * k, p.r[2]] } : p);
  const above = (p: Part) => oz + p.c[2] + p.r[2] > 0;
  const groupsOf = [HEAD, [...TORSO, ...(pose === 'seated' ? ARMS_ON_LAP : ARMS_HANGING)], oz + HIP_U > 0.05 ? legs(pose, -oz) : []].map((g) => g.filter(above).map(scale));
  const parts = groupsOf.flat().slice(0, MAX_PARTS);
  const n = parts.length;
  const out: Solids = { count: n, c: new Float64Array(n * 3), m: new Float64Array(n * 9), mat: new Int32Array(n), blend: new Int32Array(n), pr: new Float64Array(n), bx: 0, by: 0, bz: 0, br: 0, eyes: new Float64Array(6), groups: new Float64Array(18) };
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
    out.blend[i] = p.blend ?? 0;
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
  // Groups (head, body and arms, legs), each bounded by a sphere around its parts.
  let first = 0;
  groupsOf.forEach((g, gi) => {
    const a = Math.min(first, n);
    const b = Math.min(first + g.length, n);
    first += g.length;
    let cx = 0, cy = 0, cz = 0;
    for (let i = a; i < b; i++) { cx += out.c[i * 3]!; cy += out.c[i * 3 + 1]!; cz += out.c[i * 3 + 2]!; }
    const k = Math.max(1, b - a);
    cx /= k; cy /= k; cz /= k;
    let r = 0;
    for (let i = a; i < b; i++) r = Math.max(r, Math.hypot(out.c[i * 3]! - cx, out.c[i * 3 + 1]! - cy, out.c[i * 3 + 2]! - cz) + out.pr[i]!);
    out.groups.set([a, b, cx, cy, cz, b > a ? r : -1], gi * 6);
  });
  out.bx = ox;
  out.by = oy;
  out.bz = (lo + hi) / 2;
  out.br = Math.hypot((hi - lo) / 2, 0.6);
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
 * Nearest hit of ray o + t·d (t in (tMin, tMax)) on the solids: part index and t. `mask`/`maskHi`: only the
 * parts whose bits are set (parts 0–31, 32–63; a caller that has culled them, e.g. by picture tile); without
 * them, bounding spheres cull.
 */
export function hitSolids(S: Solids, ox: number, oy: number, oz: number, dx: number, dy: number, dz: number, tMin: number, tMax: number, out: { t: number; part: number }, mask?: number, maskHi = 0): boolean {
  let best = tMax;
  let part = -1;
  if (mask !== undefined) {
    for (let w = 0; w < 2; w++) {
      let bits = (w === 0 ? mask : maskHi) >>> 0;
      while (bits !== 0) {
        const low = bits & -bits;
        const i = 31 - Math.clz32(low) + 32 * w;
        bits = (bits ^ low) >>> 0;
        const t = hitPart(S, i, ox, oy, oz, dx, dy, dz, tMin, best);
        if (t < 0) continue;
        best = t;
        part = i;
      }
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
    for (let g = 0; g < 3; g++) {
      const gr = groups[g * 6 + 5]!;
      if (gr < 0) continue;
      const gx = ox - groups[g * 6 + 2]!;
      const gy = oy - groups[g * 6 + 3]!;
      const gz = oz - groups[g * 6 + 4]!;
      const gb = gx * dx + gy * dy + gz * dz;
      const gc = gx * gx + gy * gy + gz * gz - gr * gr;
      const disc = gb * gb - dd * gc;
      if (disc < 0) continue;
      // From outside the group's sphere: it lies behind the ray, or past the segment's end.
      if (gc > 0 && (gb > 0 || -gb - Math.sqrt(disc) > dd * best)) continue;
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

/** Gradient of part i's implicit surface at q = p − c (Mᵀ M q) into g, and the distance estimate to it, m. */
function partGradient(S: Solids, i: number, qx: number, qy: number, qz: number, g: Float64Array): number {
  const m = S.m;
  const k = i * 9;
  const a0 = m[k]! * qx + m[k + 1]! * qy + m[k + 2]! * qz;
  const a1 = m[k + 3]! * qx + m[k + 4]! * qy + m[k + 5]! * qz;
  const a2 = m[k + 6]! * qx + m[k + 7]! * qy + m[k + 8]! * qz;
  const gx = m[k]! * a0 + m[k + 3]! * a1 + m[k + 6]! * a2;
  const gy = m[k + 1]! * a0 + m[k + 4]! * a1 + m[k + 7]! * a2;
  const gz = m[k + 2]! * a0 + m[k + 5]! * a1 + m[k + 8]! * a2;
  const k1 = Math.sqrt(gx * gx + gy * gy + gz * gz) || 1;
  g[0] = gx / k1;
  g[1] = gy / k1;
  g[2] = gz / k1;
  // Distance to an ellipsoid, first order: k0 (k0 − 1) / k1, k0 = |M q|, k1 = |Mᵀ M q|.
  const k0 = Math.sqrt(a0 * a0 + a1 * a1 + a2 * a2);
  return (k0 * (k0 - 1)) / k1;
}

const gradBuf = new Float64Array(3);
/**
 * Outward unit normal of the form at point p on part i, into n. Where a part of the same blend class lies
 * within BLEND_M, its normal is mixed in with weight (1 − d/BLEND_M)², so two parts meet in a smooth fillet
 * of shading instead of a crease (the silhouette and the shadows keep the parts' own shapes).
 */
export function solidNormal(S: Solids, i: number, px: number, py: number, pz: number, n: Float64Array): void {
  partGradient(S, i, px - S.c[i * 3]!, py - S.c[i * 3 + 1]!, pz - S.c[i * 3 + 2]!, n);
  const cls = S.blend[i]!;
  if (cls === 0) return;
  const reach = BLEND_M[cls]!;
  let nx = n[0]!;
  let ny = n[1]!;
  let nz = n[2]!;
  for (let j = 0; j < S.count; j++) {
    if (j === i || S.blend[j] !== cls) continue;
    const qx = px - S.c[j * 3]!;
    const qy = py - S.c[j * 3 + 1]!;
    const qz = pz - S.c[j * 3 + 2]!;
    const pr = S.pr[j]! + reach;
    if (qx * qx + qy * qy + qz * qz > pr * pr) continue;
    const d = partGradient(S, j, qx, qy, qz, gradBuf);
    if (d >= reach) continue;
    const w = d <= 0 ? 1 : (1 - d / reach) ** 2;
    nx += w * gradBuf[0]!;
    ny += w * gradBuf[1]!;
    nz += w * gradBuf[2]!;
  }
  const l = Math.sqrt(nx * nx + ny * ny + nz * nz) || 1;
  n[0] = nx / l;
  n[1] = ny / l;
  n[2] = nz / l;
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
