/**
 * Turns a validated Scene into flat numeric structures the meter and the light map loop over: resolved
 * light output and beam, occluders and bounce patches. Nothing here allocates per evaluated point.
 */
import { type Rgb, hueHex, kelvinToLinearRgb, linearRgbOf, normaliseLuminance, surfaceReflectance } from './colour';
import { MIN_POWER_FRACTION, candelaSecondsFromGuideNumber, luxSecondsForAperture } from './exposure';
import {
  GELS,
  type GelId,
  type GelSpec,
  MODIFIERS,
  type ModifierSpec,
  beamSolidAngleSr,
  profileLut,
} from './modifiers';
import { shiftKelvin } from './photometry';
import {
  DEFAULT_CONTINUOUS_KELVIN,
  DEFAULT_CONTINUOUS_MIN_POWER,
  DEFAULT_FLASH_KELVIN,
  type Light,
  type Scene,
} from './sceneSchema';
import { directionFromAim } from './vec';

/** Smallest squared distance used in a 1/d² term (1 cm): keeps a light placed on a point finite. */
export const MIN_DISTANCE_SQ_M2 = 1e-4;

/** Solid angle of the standard (bare) reflector's beam, sr: lumens / this = on-axis candela. */
export const BARE_REFLECTOR_BEAM_SR = beamSolidAngleSr(MODIFIERS['bare-reflector']);

export type PreparedLight = {
  index: number;
  light: Light;
  px: number;
  py: number;
  pz: number;
  /** Unit beam axis. */
  ax: number;
  ay: number;
  az: number;
  /**
   * On-axis intensity-time at the current power, after modifier and gel, in cd·s: for flash the flash's
   * I·t, for continuous light its intensity (cd) times the camera's shutter time.
   */
  axialCdS: number;
  /** The same at full power (powerFraction 1). */
  axialFullPowerCdS: number;
  /** Squared face radius for the near-field term 1/(d² + R²), m². */
  faceR2: number;
  lut: Float64Array;
  modifier: ModifierSpec;
  gel: GelSpec;
  /** Colour temperature of the light after mired-shifting gels, K. */
  kelvin: number;
  /** Linear sRGB of the light after its gel, relative luminance 1. */
  rgb: Rgb;
  calibrated: boolean;
  minPowerFraction: number;
};

function resolveModifier(l: Light): ModifierSpec {
  // Object.assign: object spread is slow in this engine (tens of µs a call).
  return Object.assign({}, MODIFIERS[l.modifier], l.modifierOverride ? stripUndefined(l.modifierOverride) : undefined);
}

function resolveGel(l: Light): GelSpec {
  return Object.assign({}, GELS[l.gel], l.gelOverride ? stripUndefined(l.gelOverride) : undefined);
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  const out: Partial<T> = {};
  for (const k of Object.keys(o) as (keyof T)[]) if (o[k] !== undefined) out[k] = o[k];
  return out;
}

/**
 * On-axis cd·s at full power of one light, under the camera's shutter for continuous lights.
 * With a calibration, the reading replaces the output model, modifier loss and gel loss: the meter was read
 * on the axis, facing the light, with its current modifier and gel, so
 *   H = N²·C/S (ISO 2720, flash form) and I = H·(d² + R²) at the reading's power.
 */
function axialFullPowerCdS(l: Light, mod: ModifierSpec, gel: GelSpec, scene: Scene): number {
  const C = scene.options.calibrationC;
  const t = scene.camera.shutterS;
  const cal = l.calibration;
  if (cal) {
    const r2 = cal.distanceM * cal.distanceM + mod.faceRadiusM * mod.faceRadiusM;
    const readPower = cal.powerFraction ?? l.powerFraction;
    if (l.kind === 'flash') {
      return (luxSecondsForAperture(cal.aperture, cal.iso, C) * r2) / readPower;
    }
    // Continuous: N²/t = E·S/C for the reading's shutter; intensity then times the camera's shutter.
    const lux = luxSecondsForAperture(cal.aperture, cal.iso, C) / (cal.shutterS ?? t);
    return ((lux * r2) / readPower) * t;
  }
  const loss = Math.pow(2, -(mod.lossStops + gel.lossStops));
  if (l.kind === 'flash') {
    const o = l.output;
    const cdS =
      o.type === 'energy'
        ? o.ratedWs * (o.efficiencyCdSPerWs ?? scene.options.flashCdSPerWs)
        : candelaSecondsFromGuideNumber(o.guideNumberM, C);
    return cdS * loss;
  }
  const o = l.output;
  const cd = o.type === 'luxAt1m' ? o.lux * 1 /* m² */ : o.lumens / BARE_REFLECTOR_BEAM_SR;
  return cd * loss * t;
}

/**
 * Colour of a light after its gel: temperature (bare source shifted by the gel's mired) and linear sRGB of
 * luminance 1 (Planckian colour times the gel's tint).
 */
function gelledColour(l: Pick<Light, 'kind' | 'kelvin'>, gel: GelSpec): { kelvin: number; rgb: Rgb } {
  const baseK = l.kelvin ?? (l.kind === 'flash' ? DEFAULT_FLASH_KELVIN : DEFAULT_CONTINUOUS_KELVIN);
  // A strong blue shift can push the mired value to zero or below; clamp to the range the locus fit covers.
  const shiftedMired = 1e6 / baseK + gel.miredShift;
  const kelvin = shiftedMired > 40 ? Math.max(1000, shiftKelvin(baseK, gel.miredShift)) : 25000;
  const src = kelvinToLinearRgb(kelvin);
  const tint = linearRgbOf(gel.tint);
  return { kelvin, rgb: normaliseLuminance([src[0] * tint[0], src[1] * tint[1], src[2] * tint[2]]) };
}

/**
 * A light's colour for drawing (e.g. its beam tinted by its gel) without running the meter: colour
 * temperature after the gel, and the hue as a camera white-balanced to whiteBalanceK (default 5500 K) renders it.
 */
export function lightColour(
  l: { kind: 'flash' | 'continuous'; kelvin?: number; gel?: GelId; gelOverride?: Partial<GelSpec> },
  whiteBalanceK = DEFAULT_FLASH_KELVIN,
): { kelvin: number; hex: string } {
  const gel = { ...GELS[l.gel ?? 'none'], ...stripUndefined(l.gelOverride ?? {}) };
  const { kelvin, rgb } = gelledColour(l, gel);
  return { kelvin, hex: hueHex(rgb, whiteBalanceK) };
}

export function prepareLight(l: Light, index: number, scene: Scene): PreparedLight {
  const modifier = resolveModifier(l);
  const gel = resolveGel(l);
  const a = directionFromAim(l.aimDeg, l.tiltDeg);
  const full = axialFullPowerCdS(l, modifier, gel, scene);
  const { kelvin, rgb } = gelledColour(l, gel);
  return {
    index,
    light: l,
    px: l.x,
    py: l.y,
    pz: l.heightM,
    ax: a.x,
    ay: a.y,
    az: a.z,
    axialCdS: l.enabled ? full * l.powerFraction : 0,
    axialFullPowerCdS: full,
    faceR2: modifier.faceRadiusM * modifier.faceRadiusM,
    lut: profileLut(modifier),
    modifier,
    gel,
    kelvin,
    rgb,
    calibrated: l.calibration !== undefined,
    minPowerFraction: l.minPowerFraction ?? (l.kind === 'flash' ? MIN_POWER_FRACTION : DEFAULT_CONTINUOUS_MIN_POWER),
  };
}

/**
 * A panel's plane (a surface, or a flag with heights): the lower edge runs from A = (ax, ay, az) along E = (ex,
 * ey, 0) (end 1 → end 2), the panel rises from it along V (length topM − baseM, leaning back by the tilt), and
 * N is the unit front normal (on the right of the walk from end 1 to end 2, turned up by the tilt).
 */
export type PanelFrame = { ax: number; ay: number; az: number; ex: number; ey: number; vx: number; vy: number; vz: number; nx: number; ny: number; nz: number; tilted: boolean };

export function panelFrame(p: { x1: number; y1: number; x2: number; y2: number; baseM: number; topM: number; tiltDeg?: number }): PanelFrame {
  const ex = p.x2 - p.x1;
  const ey = p.y2 - p.y1;
  const len = Math.hypot(ex, ey);
  const hx = len > 0 ? -ey / len : 0;
  const hy = len > 0 ? ex / len : 0;
  const tilt = p.tiltDeg ?? 0;
  const h = p.topM - p.baseM;
  if (tilt === 0) return { ax: p.x1, ay: p.y1, az: p.baseM, ex, ey, vx: 0, vy: 0, vz: h, nx: hx, ny: hy, nz: 0, tilted: false };
  const t = (tilt * Math.PI) / 180;
  const c = Math.abs(tilt) === 90 ? 0 : Math.cos(t);
  const sn = Math.sin(t);
  return { ax: p.x1, ay: p.y1, az: p.baseM, ex, ey, vx: -hx * sn * h, vy: -hy * sn * h, vz: c * h, nx: hx * c, ny: hy * c, nz: sn, tilted: true };
}

/** A panel's plan segment where it crosses height z (tilted panels lean, so it moves with z), or null. */
export function panelSectionAt(p: { x1: number; y1: number; x2: number; y2: number; baseM: number; topM: number; tiltDeg?: number }, z: number): { x1: number; y1: number; x2: number; y2: number } | null {
  if (!p.tiltDeg) return p.baseM <= z && z <= p.topM ? p : null;
  const f = panelFrame(p);
  if (!(f.vz > 0) || z < f.az || z > f.az + f.vz) return null;
  const w = (z - f.az) / f.vz;
  return { x1: f.ax + f.vx * w, y1: f.ay + f.vy * w, x2: f.ax + f.ex + f.vx * w, y2: f.ay + f.ey + f.vy * w };
}

/**
 * Occluders as a structure of arrays. Each is the plan segment A + s·E (s ∈ [0, 1]) blocking between zLo and
 * zHi with the given transmission. `surface` is the index of the surface it belongs to, −1 for flags.
 * A tilted panel (`tilted[i]` = 1) is the parallelogram A + s·E + w·V (s, w ∈ [0, 1]) with A at height zLo and unit
 * normal N; its zLo–zHi is then the height range it spans (for bounding tests).
 */
export type Occluders = {
  count: number;
  ax: Float64Array;
  ay: Float64Array;
  ex: Float64Array;
  ey: Float64Array;
  zLo: Float64Array;
  zHi: Float64Array;
  transmission: Float64Array;
  surface: Int32Array;
  /** Tilted panels only (absent when none is): 1 for a tilted one, its up edge V and unit normal N. */
  tilted?: Uint8Array;
  vx?: Float64Array;
  vy?: Float64Array;
  vz?: Float64Array;
  nx?: Float64Array;
  ny?: Float64Array;
  nz?: Float64Array;
};

export function buildOccluders(scene: Scene): Occluders {
  type It = { ax: number; ay: number; ex: number; ey: number; zLo: number; zHi: number; t: number; s: number; f: PanelFrame | null };
  const items: It[] = [];
  const framed = (p: Parameters<typeof panelFrame>[0]) => {
    const f = panelFrame(p);
    return f.tilted ? f : null;
  };
  scene.surfaces.forEach((s, i) => {
    if (!s.occludes) return;
    const f = framed(s);
    items.push({ ax: s.x1, ay: s.y1, ex: s.x2 - s.x1, ey: s.y2 - s.y1, zLo: s.baseM, zHi: f ? f.az + f.vz : s.topM, t: 0, s: i, f });
  });
  for (const fl of scene.flags) {
    const f = fl.baseM !== undefined && fl.topM !== undefined ? framed({ ...fl, baseM: fl.baseM, topM: fl.topM }) : null;
    items.push({
      ax: fl.x1,
      ay: fl.y1,
      ex: fl.x2 - fl.x1,
      ey: fl.y2 - fl.y1,
      zLo: fl.baseM ?? -Infinity,
      zHi: f ? f.az + f.vz : (fl.topM ?? Infinity),
      t: fl.transmission,
      s: -1,
      f,
    });
  }
  const n = items.length;
  const o: Occluders = {
    count: n,
    ax: new Float64Array(n),
    ay: new Float64Array(n),
    ex: new Float64Array(n),
    ey: new Float64Array(n),
    zLo: new Float64Array(n),
    zHi: new Float64Array(n),
    transmission: new Float64Array(n),
    surface: new Int32Array(n),
  };
  items.forEach((it, i) => {
    o.ax[i] = it.ax;
    o.ay[i] = it.ay;
    o.ex[i] = it.ex;
    o.ey[i] = it.ey;
    o.zLo[i] = it.zLo;
    o.zHi[i] = it.zHi;
    o.transmission[i] = it.t;
    o.surface[i] = it.s;
  });
  if (items.some((it) => it.f)) {
    o.tilted = Uint8Array.from(items, (it) => (it.f ? 1 : 0));
    const arr = (k: 'vx' | 'vy' | 'vz' | 'nx' | 'ny' | 'nz') => Float64Array.from(items, (it) => (it.f ? it.f[k] : 0));
    o.vx = arr('vx');
    o.vy = arr('vy');
    o.vz = arr('vz');
    o.nx = arr('nx');
    o.ny = arr('ny');
    o.nz = arr('nz');
  }
  return o;
}

/**
 * Bounce patches of all bouncing surfaces, as a structure of arrays. Walls: horizontal normal (front side),
 * w along the wall on the plan, v straight up (a tilted panel: v up along the panel, the normal turned up). Floor (normal up) and ceiling (normal down): w = +x, v = +y.
 * Surface index: scene.surfaces order, then the floor (surfaces.length) and the ceiling (surfaces.length + 1).
 */
export type Patches = {
  count: number;
  cx: Float64Array;
  cy: Float64Array;
  cz: Float64Array;
  nx: Float64Array;
  ny: Float64Array;
  nz: Float64Array;
  /** Unit vector along the surface (walls: on the plan, from its first to its second end). */
  wx: Float64Array;
  wy: Float64Array;
  /** Unit vector across the surface (walls: up). */
  vx: Float64Array;
  vy: Float64Array;
  vz: Float64Array;
  halfW: Float64Array;
  halfH: Float64Array;
  area: Float64Array;
  surface: Int32Array;
  /** Patch grid of each surface index: first patch, patches along w and along v (index = start + iu·nv + iv). */
  layout: { start: number; nu: number; nv: number }[];
};

/** Per-surface reflectance, per side: linear RGB and its luminance. */
export type SurfaceOptics = { front: { rgb: Rgb; y: number }; back: { rgb: Rgb; y: number } }[];

export function surfaceOptics(scene: Scene): SurfaceOptics {
  const flat = (c: { colour: string; reflectance?: number | undefined } | undefined) => {
    const f = c ? surfaceReflectance(c.colour, c.reflectance) : { rgb: [0, 0, 0] as Rgb, y: 0 };
    return { front: f, back: f };
  };
  return [...scene.surfaces.map((s) => {
    const front = surfaceReflectance(s.colour, s.reflectance);
    const back =
      s.backColour !== undefined || s.backReflectance !== undefined
        ? surfaceReflectance(s.backColour ?? s.colour, s.backReflectance ?? (s.backColour ? undefined : s.reflectance))
        : front;
    return { front, back };
  }), flat(scene.floor), flat(scene.floor ? scene.ceiling : undefined)];
}

/**
 * Split every bouncing surface into patches no larger than patchSizeM on a side (at most maxPerSurface per
 * surface; larger surfaces get larger patches). With horizontal, the floor and ceiling are patched too.
 */
export function buildPatches(scene: Scene, patchSizeM: number, maxPerSurface: number, horizontal = false): Patches {
  type Rect = { ox: number; oy: number; oz: number; w: [number, number]; v: [number, number, number]; n: [number, number, number]; lw: number; lv: number };
  const rects: (Rect | null)[] = scene.surfaces.map((s) => {
    if (!s.bounces) return null;
    const dx = s.x2 - s.x1;
    const dy = s.y2 - s.y1;
    const len = Math.hypot(dx, dy);
    const wx = dx / len;
    const wy = dy / len;
    const lv = s.topM - s.baseM;
    // front: on your right walking from end 1 to end 2 on screen (y down), turned up by the tilt
    if (!s.tiltDeg) return { ox: s.x1, oy: s.y1, oz: s.baseM, w: [wx, wy], v: [0, 0, 1], n: [-wy, wx, 0], lw: len, lv };
    const f = panelFrame(s);
    return { ox: s.x1, oy: s.y1, oz: s.baseM, w: [wx, wy], v: [f.vx / lv, f.vy / lv, f.vz / lv], n: [f.nx, f.ny, f.nz], lw: len, lv };
  });
  const f = scene.floor;
  const floorRect = (z: number, up: boolean): Rect | null =>
    f && horizontal
      ? {
          ox: Math.min(f.x1, f.x2),
          oy: Math.min(f.y1, f.y2),
          oz: z,
          w: [1, 0],
          v: [0, 1, 0],
          n: [0, 0, up ? 1 : -1],
          lw: Math.abs(f.x2 - f.x1),
          lv: Math.abs(f.y2 - f.y1),
        }
      : null;
  rects.push(floorRect(0, true));
  rects.push(scene.ceiling ? floorRect(scene.ceiling.heightM, false) : null);
  let start = 0;
  const layout = rects.map((r) => {
    if (!r || r.lw <= 0 || r.lv <= 0) return { start, nu: 0, nv: 0 };
    let nu = Math.max(1, Math.ceil(r.lw / patchSizeM));
    let nv = Math.max(1, Math.ceil(r.lv / patchSizeM));
    if (nu * nv > maxPerSurface) {
      const k = Math.sqrt((nu * nv) / maxPerSurface);
      nu = Math.max(1, Math.floor(nu / k));
      nv = Math.max(1, Math.floor(nv / k));
    }
    const out = { start, nu, nv };
    start += nu * nv;
    return out;
  });
  const n = start;
  const F = () => new Float64Array(n);
  const p: Patches = {
    count: n,
    cx: F(), cy: F(), cz: F(), nx: F(), ny: F(), nz: F(), wx: F(), wy: F(), vx: F(), vy: F(), vz: F(),
    halfW: F(), halfH: F(), area: F(),
    surface: new Int32Array(n),
    layout,
  };
  let k = 0;
  rects.forEach((r, si) => {
    const { nu, nv } = layout[si]!;
    if (!r || nu === 0) return;
    const hw = r.lw / nu / 2;
    const hh = r.lv / nv / 2;
    for (let i = 0; i < nu; i++) {
      const a = (r.lw * (i + 0.5)) / nu;
      for (let j = 0; j < nv; j++) {
        const b = (r.lv * (j + 0.5)) / nv;
        p.cx[k] = r.ox + r.w[0] * a + r.v[0] * b;
        p.cy[k] = r.oy + r.w[1] * a + r.v[1] * b;
        p.cz[k] = r.oz + r.v[2] * b;
        p.nx[k] = r.n[0];
        p.ny[k] = r.n[1];
        p.nz[k] = r.n[2];
        p.wx[k] = r.w[0];
        p.wy[k] = r.w[1];
        p.vx[k] = r.v[0];
        p.vy[k] = r.v[1];
        p.vz[k] = r.v[2];
        p.halfW[k] = hw;
        p.halfH[k] = hh;
        p.area[k] = 4 * hw * hh;
        p.surface[k] = si;
        k++;
      }
    }
  });
  return p;
}
