/**
 * Light modifiers and gels: the default tables and the beam profile.
 *
 * Every number in these tables is from memory (typical values for the kind of modifier, not a measured
 * product) and every field can be overridden per light in the scene (`modifierOverride`, `gelOverride`).
 * A calibration reading on a light replaces its output and modifier loss altogether (see meter.ts).
 */
import { DEG } from './vec';

/** How a modifier shapes and dims the light of a head. */
export type ModifierSpec = {
  /** Plain trade name for the UI. */
  label: string;
  /** Off-axis angle (degrees from the beam axis) at which intensity is one stop below the axis. */
  halfAngleDeg: number;
  /** 0 = hard-edged beam (sharp cut-off past halfAngleDeg), 1 = very gradual falloff. */
  edgeSoftness: number;
  /** Loss on the beam axis in stops, relative to the head in its standard (bare) reflector. */
  lossStops: number;
  /**
   * Radius (m) of a disc with the area of the luminous face. Used for the near-field correction
   * E = I/(d² + R²), which keeps large sources finite up close (see photometry.discAxisIlluminanceLux).
   */
  faceRadiusM: number;
  /** Fraction of the profile emitted behind the head (beyond 90° off axis); 0 for closed modifiers. */
  backSpill: number;
};

/** From memory; see the note at the top of the file. */
export const MODIFIERS = {
  'bare-reflector': { label: 'bare reflector', halfAngleDeg: 28, edgeSoftness: 0.5, lossStops: 0, faceRadiusM: 0.09, backSpill: 0 },
  softbox: { label: 'softbox (90 cm)', halfAngleDeg: 50, edgeSoftness: 0.9, lossStops: 1.5, faceRadiusM: 0.5, backSpill: 0 },
  octa: { label: 'octa (120 cm)', halfAngleDeg: 55, edgeSoftness: 0.9, lossStops: 1.7, faceRadiusM: 0.6, backSpill: 0 },
  strip: { label: 'strip (30 × 120 cm)', halfAngleDeg: 50, edgeSoftness: 0.85, lossStops: 1.7, faceRadiusM: 0.34, backSpill: 0 },
  'umbrella-reflective': { label: 'umbrella, reflective (100 cm)', halfAngleDeg: 45, edgeSoftness: 0.7, lossStops: 1, faceRadiusM: 0.5, backSpill: 0 },
  'umbrella-shoot-through': { label: 'umbrella, shoot-through (100 cm)', halfAngleDeg: 60, edgeSoftness: 0.95, lossStops: 1.5, faceRadiusM: 0.5, backSpill: 0.3 },
  'beauty-dish': { label: 'beauty dish (55 cm)', halfAngleDeg: 35, edgeSoftness: 0.5, lossStops: 1, faceRadiusM: 0.28, backSpill: 0 },
  'grid-10': { label: '10° grid', halfAngleDeg: 5, edgeSoftness: 0.45, lossStops: 1, faceRadiusM: 0.09, backSpill: 0 },
  'grid-20': { label: '20° grid', halfAngleDeg: 10, edgeSoftness: 0.45, lossStops: 0.7, faceRadiusM: 0.09, backSpill: 0 },
  'grid-30': { label: '30° grid', halfAngleDeg: 15, edgeSoftness: 0.45, lossStops: 0.5, faceRadiusM: 0.09, backSpill: 0 },
  'grid-40': { label: '40° grid', halfAngleDeg: 20, edgeSoftness: 0.45, lossStops: 0.33, faceRadiusM: 0.09, backSpill: 0 },
  snoot: { label: 'snoot', halfAngleDeg: 6, edgeSoftness: 0.3, lossStops: 1.5, faceRadiusM: 0.04, backSpill: 0 },
  'barn-doors': { label: 'barn doors', halfAngleDeg: 22, edgeSoftness: 0.25, lossStops: 0.1, faceRadiusM: 0.09, backSpill: 0 },
  diffusion: { label: 'diffusion', halfAngleDeg: 45, edgeSoftness: 0.8, lossStops: 1, faceRadiusM: 0.2, backSpill: 0 },
} as const satisfies Record<string, ModifierSpec>;

export type ModifierId = keyof typeof MODIFIERS;
export const MODIFIER_IDS = Object.keys(MODIFIERS) as [ModifierId, ...ModifierId[]];

/** How a gel changes a light. */
export type GelSpec = {
  /** Plain trade name for the UI. */
  label: string;
  /** Transmission loss in stops (the whole loss; the colour below is luminance-neutral). */
  lossStops: number;
  /** Colour-temperature shift in mired (positive warms the light, negative cools it). */
  miredShift: number;
  /** Hue of the transmitted light, applied on top of the mired shift (white = none). CSS colour. */
  tint: string;
};

/** From memory; see the note at the top of the file. Colour-correction shifts follow the usual trade fractions. */
export const GELS = {
  none: { label: 'no gel', lossStops: 0, miredShift: 0, tint: '#ffffff' },
  'full-cto': { label: 'full CTO', lossStops: 0.67, miredShift: 159, tint: '#ffffff' },
  'half-cto': { label: 'half CTO', lossStops: 0.33, miredShift: 80, tint: '#ffffff' },
  'quarter-cto': { label: 'quarter CTO', lossStops: 0.2, miredShift: 42, tint: '#ffffff' },
  'eighth-cto': { label: 'eighth CTO', lossStops: 0.1, miredShift: 20, tint: '#ffffff' },
  'full-ctb': { label: 'full CTB', lossStops: 1.33, miredShift: -137, tint: '#ffffff' },
  'half-ctb': { label: 'half CTB', lossStops: 0.67, miredShift: -68, tint: '#ffffff' },
  'quarter-ctb': { label: 'quarter CTB', lossStops: 0.33, miredShift: -30, tint: '#ffffff' },
  'eighth-ctb': { label: 'eighth CTB', lossStops: 0.17, miredShift: -12, tint: '#ffffff' },
  'plus-green': { label: 'plus green', lossStops: 0.5, miredShift: 0, tint: '#d6ffc9' },
  'half-plus-green': { label: 'half plus green', lossStops: 0.25, miredShift: 0, tint: '#eaffe3' },
  'minus-green': { label: 'minus green', lossStops: 0.5, miredShift: 0, tint: '#ffd9f2' },
  'half-minus-green': { label: 'half minus green', lossStops: 0.25, miredShift: 0, tint: '#ffebf8' },
  red: { label: 'red', lossStops: 3, miredShift: 0, tint: '#ff2a1a' },
  amber: { label: 'amber', lossStops: 1, miredShift: 0, tint: '#ffb347' },
  yellow: { label: 'yellow', lossStops: 0.5, miredShift: 0, tint: '#fff04a' },
  green: { label: 'green', lossStops: 2.5, miredShift: 0, tint: '#3cff4a' },
  teal: { label: 'teal', lossStops: 2, miredShift: 0, tint: '#2ae6d2' },
  blue: { label: 'blue', lossStops: 3, miredShift: 0, tint: '#3a5cff' },
  magenta: { label: 'magenta', lossStops: 2, miredShift: 0, tint: '#ff3cd2' },
  'nd-0.3': { label: 'ND 0.3 (1 stop)', lossStops: 1, miredShift: 0, tint: '#ffffff' },
  'nd-0.6': { label: 'ND 0.6 (2 stops)', lossStops: 2, miredShift: 0, tint: '#ffffff' },
  'nd-0.9': { label: 'ND 0.9 (3 stops)', lossStops: 3, miredShift: 0, tint: '#ffffff' },
} as const satisfies Record<string, GelSpec>;

export type GelId = keyof typeof GELS;
export const GEL_IDS = Object.keys(GELS) as [GelId, ...GelId[]];

/**
 * Relative beam intensity at offAxisDeg (0 on the axis = 1):
 *   p(θ) = 1 / (1 + (θ/θ½)^k),  k = 2 + 18·(1 − softness)
 * so p(θ½) = ½ (one stop down) for every softness, soft beams fall off like a Lorentzian and hard ones drop
 * within a few degrees past θ½. Beyond 90° the profile is multiplied by backSpill. This is a shape chosen to
 * be smooth and monotone, not a measured photometric curve.
 */
export function beamProfile(spec: Pick<ModifierSpec, 'halfAngleDeg' | 'edgeSoftness' | 'backSpill'>, offAxisDeg: number): number {
  const k = 2 + 18 * (1 - Math.min(1, Math.max(0, spec.edgeSoftness)));
  const p = 1 / (1 + Math.pow(Math.abs(offAxisDeg) / spec.halfAngleDeg, k));
  return Math.abs(offAxisDeg) > 90 ? p * spec.backSpill : p;
}

/** Number of entries of a profile lookup table. */
export const PROFILE_LUT_SIZE = 1024;

/**
 * Beam profile tabulated against u = sin(θ/2) = √((1 − cosθ)/2), u ∈ [0, 1]. The index is nearly linear in θ
 * near the axis (where narrow grids need resolution) and needs only a square root of the cosine, so the hot
 * loops avoid acos and pow. Entry j is the profile at θ = 2·asin(j/(N−1)).
 */
export function profileLut(spec: Pick<ModifierSpec, 'halfAngleDeg' | 'edgeSoftness' | 'backSpill'>): Float64Array {
  // Tabulating costs ~1000 pow() calls; a drag frame re-prepares lights, so reuse tables by beam shape.
  const key = `${spec.halfAngleDeg}|${spec.edgeSoftness}|${spec.backSpill}`;
  const hit = lutCache.get(key);
  if (hit) return hit;
  if (lutCache.size > 256) lutCache.clear();
  const lut = buildProfileLut(spec);
  lutCache.set(key, lut);
  return lut;
}

const lutCache = new Map<string, Float64Array>();

function buildProfileLut(spec: Pick<ModifierSpec, 'halfAngleDeg' | 'edgeSoftness' | 'backSpill'>): Float64Array {
  const lut = new Float64Array(PROFILE_LUT_SIZE + 1);
  for (let j = 0; j < PROFILE_LUT_SIZE; j++) {
    const theta = (2 * Math.asin(j / (PROFILE_LUT_SIZE - 1))) / DEG;
    lut[j] = beamProfile(spec, theta);
  }
  lut[PROFILE_LUT_SIZE] = lut[PROFILE_LUT_SIZE - 1] ?? 0; // guard for interpolation at u = 1
  return lut;
}

/** Profile from a LUT and the cosine of the off-axis angle (linear interpolation). */
export function lookupProfile(lut: Float64Array, cosOffAxis: number): number {
  const u2 = (1 - cosOffAxis) * 0.5;
  const f = (u2 > 0 ? Math.sqrt(u2) : 0) * (PROFILE_LUT_SIZE - 1);
  const j = f | 0;
  const w = f - j;
  const a = lut[j] ?? 0;
  const b = lut[j + 1] ?? 0;
  return a + (b - a) * w;
}

/**
 * Effective solid angle (sr) of a beam: ∫ p dΩ = 2π ∫ p(θ) sinθ dθ. A continuous light rated in lumens
 * puts that flux into its beam, so its on-axis intensity is lumens / Ω (meter.ts).
 */
export function beamSolidAngleSr(spec: Pick<ModifierSpec, 'halfAngleDeg' | 'edgeSoftness' | 'backSpill'>): number {
  const n = 2000;
  let s = 0;
  for (let i = 0; i < n; i++) {
    const t = ((i + 0.5) / n) * Math.PI;
    s += beamProfile(spec, t / DEG) * Math.sin(t);
  }
  return 2 * Math.PI * s * (Math.PI / n);
}
