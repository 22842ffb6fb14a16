/**
 * The scene-level meter: what a handheld incident meter would read at the subject — by the scene's receptor
 * (flat along the face, dome pointed at the camera, or flat pointed at each light) — at the background and at
 * chosen points, per light and in total, plus the derived advice (power for a target aperture, rims against
 * the key, key:fill, ambient, sync), the background as the camera records it and the mixed colour.
 *
 * Light is carried as luminous exposure H (lux·s) under the camera's shutter: flash as its I·t, continuous
 * light as E·t. An incident meter reads H as the f-number N = √(H·S/C) (ISO 2720, flash form).
 */
import { type Rgb, cctOfLinearRgb, hueHex, kelvinToLinearRgb, linearRgbToHex, relativeLuminance } from './colour';
import { apertureForFlashExposure, exposureValue, guideNumberFromCandelaSeconds, luxFromEv100, luxSecondsForAperture } from './exposure';
import { angleOfViewDeg } from './photometry';
import type { ByReceptor, ColourReading, LightReading, MeterResult, MeterWarning, PointReading, PowerAdvice, RecordedTone, VsKeyAdvice } from './results';
import { panelFrame } from './flatScene';
import { type FieldReceptor, type Gathered, type Room, bodyPanels, buildRoom, gather, gatherCoarse, subjectReceptors, surfaceWeights, unitVector } from './room';
import { type LightRole, type ReceptorId, type Scene, type SceneInput, parseScene } from './sceneSchema';
import type { Receptor } from './transport';
import { DEG } from './vec';


/** A reading more than this many stops under the camera is shown as "—" (common practice: black in the frame). */
const FAR_UNDER_STOPS = 12;
/** Mid-grey the recorded tones are relative to: an 18 % card (common practice; L* 50 is 18.4 %). */
const MID_GREY_REFLECTANCE = 0.18;
/** A channel over this many stops above a correctly exposed mid-grey clips (common practice: about +2.5). */
export const CLIP_STOPS = 2.5;
/** Every channel under this many stops below mid-grey reads as blocked-up black (common practice: about −5). */
const BLOCKED_STOPS = -5;
/** Points across the lens's field the background range is sampled at. */
const BACKGROUND_RANGE_SAMPLES = 15;

/**
 * Exposures at or below this (lux·s) count as no light: it is some 70 stops below f/1 at ISO 100, and keeps
 * ratios and power advice finite for geometry that grazes a light.
 */
export const DARK_LUX_SECONDS = 1e-20;

const safeLog2Ratio = (a: number, b: number): number | null =>
  a > DARK_LUX_SECONDS && b > DARK_LUX_SECONDS ? Math.log2(a) - Math.log2(b) : null;

function reading(h: number, direct: number, bounce: number, scene: Scene, correctH: number): PointReading {
  const stops = safeLog2Ratio(h, correctH);
  const farUnder = stops !== null && stops < -FAR_UNDER_STOPS;
  const r: PointReading = {
    luxSeconds: h,
    directLuxSeconds: direct,
    bounceLuxSeconds: bounce,
    aperture: h > DARK_LUX_SECONDS && !farUnder ? apertureForFlashExposure(h, scene.camera.iso, scene.options.calibrationC) : null,
    stopsVsCamera: farUnder ? null : stops,
  };
  if (farUnder) r.note = `more than ${FAR_UNDER_STOPS} stops under the camera: black in the frame`;
  else if (!(h > DARK_LUX_SECONDS)) r.note = 'no light';
  return r;
}

/** A reading with more fields (Object.assign: object spread is slow in this engine). */
const withReading = <T extends object>(r: PointReading, more: T): PointReading & T => Object.assign(more, r);

function colourReading(rgb: Rgb, wbK: number): ColourReading | null {
  const y = relativeLuminance(rgb);
  if (!(y > DARK_LUX_SECONDS)) return null;
  const n: Rgb = [rgb[0] / y, rgb[1] / y, rgb[2] / y];
  return { hex: hueHex(n, wbK), absoluteHex: hueHex(n), cctK: cctOfLinearRgb(n), linearRgb: n };
}

function horizontalNormal(deg: number): { nx: number; ny: number; nz: number } {
  return { nx: Math.cos(deg * DEG), ny: Math.sin(deg * DEG), nz: 0 };
}

/** Where a ray from (ox, oy) along (dx, dy) first meets a surface past `tMin` (in units of |d|), and the normal facing the ray's origin. */
type SurfaceHit = { t: number; x: number; y: number; nx: number; ny: number; surface: Scene['surfaces'][number] };

function firstSurfaceHit(scene: Scene, ox: number, oy: number, dx: number, dy: number, tMin: number, accept: (s: Scene['surfaces'][number], t: number) => boolean = () => true): SurfaceHit | null {
  let hit: SurfaceHit | null = null;
  for (const s of scene.surfaces) {
    // A tilted panel (a card or reflector leaning back) is never taken for the background.
    if (s.tiltDeg) continue;
    const ex = s.x2 - s.x1;
    const ey = s.y2 - s.y1;
    const denom = dx * ey - dy * ex;
    if (denom === 0) continue;
    const apx = s.x1 - ox;
    const apy = s.y1 - oy;
    const t = (apx * ey - apy * ex) / denom;
    const u = (apx * dy - apy * dx) / denom;
    if (t <= tMin || u < 0 || u > 1 || (hit && t >= hit.t) || !accept(s, t)) continue;
    const len = Math.hypot(ex, ey);
    let nx = -ey / len;
    let ny = ex / len;
    if (nx * -dx + ny * -dy < 0) {
      nx = -nx;
      ny = -ny;
    }
    hit = { t, x: ox + t * dx + nx * 1e-3, y: oy + t * dy + ny * 1e-3, nx, ny, surface: s };
  }
  return hit;
}

/** Gap kept between the subject's silhouette and the background point beside it, m (at the subject). */
const SILHOUETTE_MARGIN_M = 0.05;

/**
 * Plan angles (radians) of the camera's rays that graze the subject's body on either side, or null with no
 * body. The background behind the body is hidden from the lens; what the frame shows is beside it.
 */
function silhouetteRays(scene: Scene): [number, number] | null {
  const cam = scene.camera;
  const sub = scene.subject;
  if (!sub.body) return null;
  const centre = Math.atan2(sub.y - cam.y, sub.x - cam.x);
  const dist = Math.hypot(sub.x - cam.x, sub.y - cam.y);
  let lo = 0;
  let hi = 0;
  // The silhouette at the line's height (the head at the face, the shoulders lower down).
  const panels = bodyPanels(scene);
  const atHeight = panels.filter((p) => p.zLo <= sub.heightM && sub.heightM <= p.zHi);
  for (const p of atHeight.length > 0 ? atHeight : panels) {
    let a = Math.atan2(p.ay - cam.y, p.ax - cam.x) - centre;
    a = Math.atan2(Math.sin(a), Math.cos(a));
    lo = Math.min(lo, a);
    hi = Math.max(hi, a);
  }
  const m = SILHOUETTE_MARGIN_M / Math.max(dist, 0.1);
  return [centre + lo - m, centre + hi + m];
}

/** Does the camera's ray at plan angle a (radians) pass through the subject's body? */
function hiddenBySubject(scene: Scene, a: number): boolean {
  const rays = silhouetteRays(scene);
  if (!rays) return false;
  const c = Math.atan2(scene.subject.y - scene.camera.y, scene.subject.x - scene.camera.x);
  const rel = (x: number) => Math.atan2(Math.sin(x - c), Math.cos(x - c));
  return rel(a) > rel(rays[0]) && rel(a) < rel(rays[1]);
}

/**
 * The background point: where the camera's line of sight through the subject, continued past the subject,
 * first meets a surface (at the height of that line, clamped to the surface), nudged 1 mm towards the camera,
 * its receptor facing the camera side. With the subject's body on, the point straight behind the subject is
 * hidden from the lens: the background is read just beside the silhouette on both sides (`receptors`, averaged
 * by the meter). Null when no surface is behind the subject and none is given.
 */
function findBackground(scene: Scene): { receptor: Receptor; receptors: Receptor[]; surfaceId: string | null } | null {
  const cam = scene.camera;
  const sub = scene.subject;
  if (scene.background) {
    const b = scene.background;
    const deg = b.facingDeg ?? (Math.atan2(cam.y - b.y, cam.x - b.x) / DEG);
    const r = { x: b.x, y: b.y, z: b.z, ...horizontalNormal(deg) };
    return { receptor: r, receptors: [r], surfaceId: null };
  }
  const dx = sub.x - cam.x;
  const dy = sub.y - cam.y;
  if (dx === 0 && dy === 0) return null;
  const dist = Math.hypot(dx, dy);
  const toReceptor = (h: SurfaceHit, tSub: number): Receptor => ({
    x: h.x,
    y: h.y,
    z: Math.min(h.surface.topM, Math.max(h.surface.baseM, cam.heightM + (h.t / tSub) * (sub.heightM - cam.heightM))),
    nx: h.nx,
    ny: h.ny,
    nz: 0,
  });
  const rays = silhouetteRays(scene);
  const receptors: Receptor[] = [];
  let surfaceId: string | null = null;
  for (const a of rays ?? [Math.atan2(dy, dx)]) {
    const ux = Math.cos(a);
    const uy = Math.sin(a);
    // Distance along this ray to the subject's depth (1 on the line through the subject).
    const tSub = dist / Math.max(1e-9, ux * (dx / dist) + uy * (dy / dist));
    const h = firstSurfaceHit(scene, cam.x, cam.y, ux, uy, tSub);
    if (!h) continue;
    receptors.push(toReceptor(h, tSub));
    surfaceId ??= h.surface.id;
  }
  if (receptors.length === 0) return null;
  return { receptor: receptors[0]!, receptors, surfaceId };
}

/**
 * Key and fill: if any light has role 'key', the brightest of those (at the subject) is the key; otherwise the
 * brightest 'auto' light is. Fill is every light with role 'fill' if any has it; otherwise every other 'auto'
 * light. Rim, hair, kicker, background and other lights are never key or fill. The exposures compared are the
 * ratio readings (meterParsed: flat along the face with that receptor, else flat pointed at each light).
 */
function chooseKeyFill(
  lights: { id: string; role: LightRole; luxSeconds: number; enabled: boolean }[],
): { keyId: string | null; fillIds: string[]; rule: 'roles' | 'brightest' } {
  const on = lights.filter((l) => l.enabled);
  const flaggedKey = on.filter((l) => l.role === 'key');
  const flaggedFill = on.filter((l) => l.role === 'fill');
  const pool = flaggedKey.length > 0 ? flaggedKey : on.filter((l) => l.role === 'auto' && l.luxSeconds > 0);
  let key: (typeof on)[number] | null = null;
  for (const l of pool) if (!key || l.luxSeconds > key.luxSeconds) key = l;
  const fill = flaggedFill.length > 0 ? flaggedFill : on.filter((l) => l.role === 'auto' && l !== key);
  return {
    keyId: key?.id ?? null,
    fillIds: fill.map((l) => l.id),
    rule: flaggedKey.length > 0 || flaggedFill.length > 0 ? 'roles' : 'brightest',
  };
}

/**
 * A panel (reflector or v-flat) is on the fill side when its centre lies more than this far around the subject
 * from the key (the 3-D angle at the subject's face between the key and the panel). Our own line, not a rule
 * of the trade: a card beside or below the face, across from the key, fills; one next to the key adds to it.
 */
export const FILL_SIDE_MIN_DEG = 45;

/**
 * The key's light that one panel returns to a receptor at the subject, lux·s (luminance of the key's first and
 * later bounces on the panel's patches × each patch's response at the receptor × the path's transmission).
 */
function panelReturn(room: Room, keyIndex: number, surfaceIndex: number, r: FieldReceptor): number {
  const W = surfaceWeights(room, surfaceIndex, r);
  const lum = room.lum[keyIndex]!;
  let h = 0;
  for (let m = 0; m < W.n; m++) {
    const b = W.off[m]!;
    h += (0.2126 * lum[b]! + 0.7152 * lum[b + 1]! + 0.0722 * lum[b + 2]!) * W.w[m]!;
  }
  return h;
}

/**
 * The key's light returned to the face by fill-side panels (FILL_SIDE_MIN_DEG): read on the fill side by a flat
 * disc pointed at each panel's centre (the flat-face receptor: by the face's disc, as its ratios are), and the
 * same panels' share of the key's own ratio reading (`inKey`), which moves from the key side to the fill side.
 */
function fillPanels(room: Room, keyIndex: number, keyReceptor: FieldReceptor, flatFace: FieldReceptor | null): { luxSeconds: number; inKey: number; panelIds: string[] } {
  const out = { luxSeconds: 0, inKey: 0, panelIds: [] as string[] };
  if (room.lights[keyIndex]!.axialCdS <= 0) return out;
  const scene = room.scene;
  const sub = scene.subject;
  const L = room.lights[keyIndex]!;
  const k = unitVector(L.px - sub.x, L.py - sub.y, L.pz - sub.heightM);
  const cosMax = Math.cos(FILL_SIDE_MIN_DEG * DEG);
  scene.surfaces.forEach((s, i) => {
    if (!s.bounces || (s.kind !== 'reflector' && s.kind !== 'v-flat')) return;
    const f = panelFrame(s);
    const c = unitVector(f.ax + (f.ex + f.vx) / 2 - sub.x, f.ay + (f.ey + f.vy) / 2 - sub.y, f.az + f.vz / 2 - sub.heightM);
    if (c.nx * k.nx + c.ny * k.ny + c.nz * k.nz >= cosMax) return;
    const r: FieldReceptor = flatFace ?? { x: sub.x, y: sub.y, z: sub.heightM, ...c, kind: 'flat' };
    const h = panelReturn(room, keyIndex, i, r);
    if (h <= 0) return;
    out.luxSeconds += h;
    out.inKey += panelReturn(room, keyIndex, i, keyReceptor);
    out.panelIds.push(s.id);
  });
  return out;
}

/** Meter a scene (validated and defaulted by sceneSchema; throws with the field path if invalid). */
export function meter(input: SceneInput | Scene): MeterResult {
  return meterParsed(parseScene(input));
}

const SUBJECT_ROLES: readonly LightRole[] = ['auto', 'key', 'fill'];
const RIM_ROLES: readonly LightRole[] = ['rim', 'hair', 'kicker'];


const sumH = (g: Gathered): number => g.direct + g.bounce;

/** Per light, the mean of the same lights gathered at several receptors. */
function averageGathered(sets: Gathered[][]): Gathered[] {
  if (sets.length === 1) return sets[0]!;
  const k = 1 / sets.length;
  return sets[0]!.map((g0, i) => {
    const out: Gathered = { direct: 0, bounce: 0, rgb: [0, 0, 0], sample: g0.sample };
    for (const set of sets) {
      const g = set[i]!;
      out.direct += g.direct * k;
      out.bounce += g.bounce * k;
      out.rgb[0] += g.rgb[0] * k;
      out.rgb[1] += g.rgb[1] * k;
      out.rgb[2] += g.rgb[2] * k;
    }
    return out;
  });
}

/** Recorded tone of a point: incident light (linear sRGB lux·s) × the surface's reflectance × white balance. */
export function recordedTone(rgb: Rgb, rho: Rgb, gains: Rgb, correctH: number): RecordedTone {
  const stops: [number | null, number | null, number | null] = [null, null, null];
  const lin: [number, number, number] = [0, 0, 0];
  let clipped = false;
  let blocked = true;
  for (let c = 0; c < 3; c++) {
    const v = (rgb[c]! * rho[c]! * gains[c]!) / (correctH * MID_GREY_REFLECTANCE);
    lin[c] = MID_GREY_REFLECTANCE * v;
    const st = v > 0 ? Math.log2(v) : null;
    stops[c] = st;
    if (st !== null && st > CLIP_STOPS) clipped = true;
    if (st !== null && st >= BLOCKED_STOPS) blocked = false;
  }
  const any = lin.some((v) => v > 0);
  return { stops, hex: any ? linearRgbToHex(lin) : null, clipped, blocked };
}

/** Like meter, for a scene already validated by sceneSchema (the editor parses once per frame for both the
 *  meter and the light map). */
export function meterParsed(scene: Scene): MeterResult {
  const cam = scene.camera;
  const C = scene.options.calibrationC;
  const room: Room = buildRoom(scene);
  const lights = room.lights;
  const receptorId: ReceptorId = scene.options.receptor;

  // Correct exposure at the camera: the H an incident meter reads as the camera's aperture, plus the lens ND.
  const correctH = luxSecondsForAperture(cam.aperture, cam.iso, C) * Math.pow(2, cam.ndStops);

  const sub = scene.subject;
  const at = subjectReceptors(scene);
  const face = gather(room, at.face, true);
  const dome = gather(room, at.dome, true);
  // A flat disc at the subject pointed at each light, that light alone.
  const pointed = lights.map((L, li) => gather(room, at.pointedAt(L), true, li)[0]!);
  const byId: Record<ReceptorId, Gathered[]> = { 'flat-face': face, 'dome-camera': dome, 'flat-light': pointed };
  const expo = byId[receptorId];
  // Ratios: flat along the face with that receptor (as before); otherwise each light read pointed at it.
  const ratioReads = receptorId === 'flat-face' ? face : pointed;

  const bg = findBackground(scene);
  // Beside the silhouette on both sides (with the body on): the mean of the two points, per light.
  const bgG = bg ? averageGathered(bg.receptors.map((r) => gather(room, { ...r, kind: 'flat' }, false))) : null;
  const probeG = scene.probes.map((p) =>
    gather(room, { x: p.x, y: p.y, z: p.z, ...horizontalNormal(p.facingDeg ?? sub.facingDeg), kind: 'flat' }, false),
  );

  const totalOf = (gs: Gathered[]) => {
    const t = { direct: 0, bounce: 0, rgb: [0, 0, 0] as [number, number, number] };
    for (const g of gs) {
      t.direct += g.direct;
      t.bounce += g.bounce;
      t.rgb[0] += g.rgb[0];
      t.rgb[1] += g.rgb[1];
      t.rgb[2] += g.rgb[2];
    }
    return t;
  };

  const targetAperture = scene.options.targetAperture ?? cam.aperture;
  const targetH = luxSecondsForAperture(targetAperture, cam.iso, C) * Math.pow(2, cam.ndStops);

  const ambient = scene.ambient
    ? {
        ev100: scene.ambient.ev100,
        kelvin: scene.ambient.kelvin,
        luxSeconds: luxFromEv100(scene.ambient.ev100, C) * cam.shutterS,
        stopsVsCamera: scene.ambient.ev100 - exposureValue(cam) - cam.ndStops,
      }
    : null;
  const ambientRgb = ambient ? kelvinToLinearRgb(ambient.kelvin) : null;
  const withAmbient = (rgb: [number, number, number]): Rgb =>
    ambient && ambientRgb
      ? [rgb[0] + ambient.luxSeconds * ambientRgb[0], rgb[1] + ambient.luxSeconds * ambientRgb[1], rgb[2] + ambient.luxSeconds * ambientRgb[2]]
      : rgb;
  // The flash must make up what the ambient does not give.
  const ambientH = ambient?.luxSeconds ?? 0;
  const lightsTargetH = targetH - ambientH;

  const subjTotal = totalOf(expo);
  const subjH = subjTotal.direct + subjTotal.bounce;
  const bgTotal = bgG ? totalOf(bgG) : null;

  const ratioH = ratioReads.map(sumH);
  const kf = chooseKeyFill(scene.lights.map((l, i) => ({ id: l.id, role: l.role, enabled: l.enabled, luxSeconds: ratioH[i]! })));
  const keyIndex = kf.keyId ? scene.lights.findIndex((l) => l.id === kf.keyId) : -1;
  // The key's light returned by fill-side panels counts on the fill side of key:fill (and leaves the key's side).
  const panels =
    keyIndex >= 0 ? fillPanels(room, keyIndex, receptorId === 'flat-face' ? at.face : at.pointedAt(lights[keyIndex]!), receptorId === 'flat-face' ? at.face : null) : { luxSeconds: 0, inKey: 0, panelIds: [] };
  const keyH = keyIndex >= 0 ? Math.max(0, ratioH[keyIndex]! - panels.inKey) : 0;
  const fillH = kf.fillIds.reduce((s, id) => s + ratioH[scene.lights.findIndex((l) => l.id === id)]!, 0) + panels.luxSeconds;
  const keyPointedH = keyIndex >= 0 ? sumH(pointed[keyIndex]!) : 0;

  const warnings: MeterWarning[] = [];
  const anyFlash = scene.lights.some((l) => l.enabled && l.kind === 'flash');
  const overSync = anyFlash && cam.shutterS < cam.syncSpeedS * (1 - 1e-9);
  if (overSync) {
    warnings.push({
      code: 'shutter-faster-than-sync',
      message: `shutter 1/${Math.round(1 / cam.shutterS)} s is faster than the sync speed 1/${Math.round(1 / cam.syncSpeedS)} s`,
    });
  }
  if (!(subjH > DARK_LUX_SECONDS)) warnings.push({ code: 'no-light-on-subject', message: 'no light reaches the subject' });
  if (ambient && lightsTargetH <= 0) {
    warnings.push({ code: 'ambient-over-target', message: `the ambient alone reaches f/${targetAperture}: the lights can only add to it` });
  }

  // What the camera records on the background: the surface's colour (side facing the camera) or a mid-grey card.
  const gains: Rgb = (() => {
    const w = kelvinToLinearRgb(cam.whiteBalanceK);
    const y = relativeLuminance(w);
    return [y / w[0], y / w[1], y / w[2]];
  })();
  const surfaceRho = (surfaceId: string | null, nx: number, ny: number): Rgb => {
    const s = surfaceId ? scene.surfaces.find((x) => x.id === surfaceId) : undefined;
    if (!s) return [MID_GREY_REFLECTANCE, MID_GREY_REFLECTANCE, MID_GREY_REFLECTANCE];
    const i = scene.surfaces.indexOf(s);
    const front = -(s.y2 - s.y1) * nx + (s.x2 - s.x1) * ny > 0;
    const o = room.optics[i]!;
    return front ? o.front.rgb : o.back.rgb;
  };
  const bgRho = bg ? surfaceRho(bg.surfaceId, bg.receptor.nx, bg.receptor.ny) : null;

  const lightReadings: LightReading[] = lights.map((L, li) => {
    const l = L.light;
    const g = expo[li]!;
    const h = sumH(g);
    const d = face[li]!.sample;
    const forSubject = SUBJECT_ROLES.includes(l.role);
    let forTarget: PowerAdvice = { stopsChange: null, fraction: null, beyondFull: false, belowMinimum: false };
    if (h > DARK_LUX_SECONDS && lightsTargetH > 0) {
      const stopsChange = Math.log2(lightsTargetH) - Math.log2(h);
      const fraction = l.powerFraction * Math.pow(2, stopsChange);
      forTarget = { stopsChange, fraction, beyondFull: fraction > 1 + 1e-9, belowMinimum: fraction < L.minPowerFraction * (1 - 1e-9) };
      if (l.enabled && forSubject && forTarget.beyondFull) {
        warnings.push({ code: 'beyond-full-power', lightId: l.id, message: `${l.id}: over full power by ${Math.log2(fraction).toFixed(1)} stops for f/${targetAperture}` });
      }
      if (l.enabled && forSubject && forTarget.belowMinimum) {
        warnings.push({ code: 'below-minimum-power', lightId: l.id, message: `${l.id} would need less than its lowest power for f/${targetAperture}` });
      }
    }
    if (receptorId === 'flat-face' && l.enabled && d.incidenceDeg >= 90 && L.axialCdS > 0 && (l.role === 'key' || l.role === 'fill')) {
      warnings.push({ code: 'light-behind-subject-facing', lightId: l.id, message: `${l.id} is behind the subject's facing and reads nothing on a flat receptor along the face` });
    }
    const pointedH = sumH(pointed[li]!);
    let vsKey: VsKeyAdvice | null = null;
    if (RIM_ROLES.includes(l.role)) {
      const targetStops = l.targetVsKeyStops ?? scene.options.rimTargetStops;
      const stops = safeLog2Ratio(pointedH, keyPointedH);
      const stopsChange = stops === null ? null : targetStops - stops;
      const fraction = stopsChange === null ? null : l.powerFraction * Math.pow(2, stopsChange);
      vsKey = {
        stops,
        targetStops,
        stopsChange,
        fraction,
        beyondFull: fraction !== null && fraction > 1 + 1e-9,
        belowMinimum: fraction !== null && fraction < L.minPowerFraction * (1 - 1e-9),
      };
    }
    const ratioRole: LightReading['ratioRole'] = kf.keyId === l.id ? 'key' : kf.fillIds.includes(l.id) ? 'fill' : 'none';
    const bgA = bgG ? bgG[li]! : null;
    const byReceptor: ByReceptor = { 'flat-face': sumH(face[li]!), 'dome-camera': sumH(dome[li]!), 'flat-light': pointedH };
    return withReading(reading(h, g.direct, g.bounce, scene, correctH), {
      id: l.id,
      kind: l.kind,
      enabled: l.enabled,
      role: l.role,
      ratioRole,
      calibrated: L.calibrated,
      distanceM: d.distanceM,
      incidenceDeg: d.incidenceDeg,
      offAxisDeg: d.offAxisDeg,
      transmission: d.transmission,
      kelvin: L.kelvin,
      colourHex: hueHex(L.rgb, cam.whiteBalanceK),
      axialCdS: L.axialCdS,
      guideNumberM: l.kind === 'flash' ? guideNumberFromCandelaSeconds(L.axialFullPowerCdS * l.powerFraction, C) : null,
      powerFraction: l.powerFraction,
      powerStops: Math.log2(l.powerFraction),
      minPowerFraction: L.minPowerFraction,
      forTarget,
      pointed: reading(pointedH, pointed[li]!.direct, pointed[li]!.bounce, scene, correctH),
      byReceptor,
      vsKey,
      backgroundTone: l.role === 'background' && bgA && bgRho ? recordedTone(bgA.rgb, bgRho, gains, correctH) : null,
      backgroundStopsVsSubject: bgA ? safeLog2Ratio(sumH(bgA), h) : null,
    });
  });

  let background: MeterResult['background'] = null;
  if (bg && bgTotal && bgRho) {
    const bgH = bgTotal.direct + bgTotal.bounce;
    const recorded = recordedTone(withAmbient(bgTotal.rgb), bgRho, gains, correctH);
    const range = backgroundRange(scene, room, gains, correctH, withAmbient, surfaceRho);
    background = withReading(reading(bgH, bgTotal.direct, bgTotal.bounce, scene, correctH), {
      point: { x: bg.receptor.x, y: bg.receptor.y, z: bg.receptor.z },
      surfaceId: bg.surfaceId,
      // As the frame records them: the room's light (uniform, see README) adds to both.
      stopsVsSubject: safeLog2Ratio(bgH + ambientH, subjH + ambientH),
      colour: colourReading(withAmbient(bgTotal.rgb), cam.whiteBalanceK),
      recorded,
      range,
    });
    const worst = range ? [recorded, range.brightest, range.darkest] : [recorded];
    if (worst.some((t) => t.clipped)) {
      const t = range?.brightest.clipped ? range.brightest : recorded;
      const ch = ['red', 'green', 'blue'].filter((_, c) => (t.stops[c] ?? -Infinity) > CLIP_STOPS);
      const top = Math.max(...t.stops.map((v) => v ?? -Infinity));
      warnings.push({ code: 'background-clips', message: `the background's ${ch.join(' and ')} channel${ch.length > 1 ? 's' : ''} clip${ch.length > 1 ? '' : 's'}: +${top.toFixed(1)} stops over mid-grey (over +${CLIP_STOPS} clips, common practice)` });
    }
    if (recorded.blocked || range?.darkest.blocked) {
      warnings.push({ code: 'background-blocked', message: `part of the background falls more than ${-BLOCKED_STOPS} stops under mid-grey: black in the frame (common practice)` });
    }
  }

  const combinedH = subjH + ambientH;
  const subjectByReceptor: ByReceptor = {
    'flat-face': face.reduce((s, g) => s + sumH(g), 0),
    'dome-camera': dome.reduce((s, g) => s + sumH(g), 0),
    'flat-light': pointed.reduce((s, g) => s + sumH(g), 0),
  };
  return {
    camera: {
      ev100: exposureValue(cam),
      horizontalAovDeg: angleOfViewDeg(cam.focalMm, cam.sensorWidthMm),
      verticalAovDeg: angleOfViewDeg(cam.focalMm, cam.sensorHeightMm),
      syncSpeedS: cam.syncSpeedS,
      overSync,
    },
    targetAperture,
    receptor: receptorId,
    subjectByReceptor,
    bounces: { passes: room.radiosity.passes, converged: room.radiosity.converged },
    subject: withReading(reading(subjH, subjTotal.direct, subjTotal.bounce, scene, correctH), { colour: colourReading(withAmbient(subjTotal.rgb), cam.whiteBalanceK) }),
    lights: lightReadings,
    keyFill: {
      ...kf,
      ratio: keyH > DARK_LUX_SECONDS && fillH > DARK_LUX_SECONDS ? keyH / fillH : null,
      ratioStops: safeLog2Ratio(keyH, fillH),
      litToShadowRatio: keyH > DARK_LUX_SECONDS && fillH > DARK_LUX_SECONDS ? (keyH + fillH) / fillH : null,
      fillPanels: { luxSeconds: panels.luxSeconds, panelIds: panels.panelIds },
    },
    background,
    probes: scene.probes.map((p, k) => {
      const t = totalOf(probeG[k]!);
      const h = t.direct + t.bounce;
      return withReading(reading(h, t.direct, t.bounce, scene, correctH), { id: p.id, point: { x: p.x, y: p.y, z: p.z }, stopsVsSubject: safeLog2Ratio(h + ambientH, subjH + ambientH) });
    }),
    ambient,
    combined: {
      luxSeconds: combinedH,
      aperture: combinedH > DARK_LUX_SECONDS ? apertureForFlashExposure(combinedH, cam.iso, C) : null,
      stopsVsCamera: safeLog2Ratio(combinedH, correctH),
    },
    allLightsStopsChange: lightsTargetH > 0 ? safeLog2Ratio(lightsTargetH, subjH) : null,
    warnings,
  };
}

/**
 * The background across the lens's horizontal field: rays from the camera at BACKGROUND_RANGE_SAMPLES angles
 * across its horizontal angle of view, each meeting the first surface beyond the subject's distance, at the
 * subject's height; the recorded tone there (cheap gather: coarse bounce). Brightest and darkest by luminance.
 */
function backgroundRange(
  scene: Scene,
  room: Room,
  gains: Rgb,
  correctH: number,
  withAmbient: (rgb: [number, number, number]) => Rgb,
  surfaceRho: (id: string | null, nx: number, ny: number) => Rgb,
): NonNullable<MeterResult['background']>['range'] {
  const cam = scene.camera;
  const sub = scene.subject;
  const half = angleOfViewDeg(cam.focalMm, cam.sensorWidthMm) / 2;
  const subDist = Math.hypot(sub.x - cam.x, sub.y - cam.y);
  const centre = Math.atan2(sub.y - cam.y, sub.x - cam.x) / DEG;
  type Sample = RecordedTone & { point: { x: number; y: number; z: number }; y: number };
  let best = null as Sample | null;
  let worst = null as Sample | null;
  let samples = 0;
  for (let k = 0; k < BACKGROUND_RANGE_SAMPLES; k++) {
    const a = (centre - half + (2 * half * (k + 0.5)) / BACKGROUND_RANGE_SAMPLES) * DEG;
    const dx = Math.cos(a);
    const dy = Math.sin(a);
    if (hiddenBySubject(scene, a)) continue;
    const h = firstSurfaceHit(scene, cam.x, cam.y, dx, dy, subDist * Math.cos(a - centre * DEG), (sf) => sub.heightM >= sf.baseM && sub.heightM <= sf.topM);
    const hit = h ? { x: h.x, y: h.y, nx: h.nx, ny: h.ny, id: h.surface.id } : null;
    if (!hit) continue;
    samples++;
    const rgb = gatherCoarse(room, { x: hit.x, y: hit.y, z: sub.heightM, nx: hit.nx, ny: hit.ny, nz: 0, kind: 'flat' }, false, true);
    const tone = recordedTone(withAmbient([rgb[0], rgb[1], rgb[2]]), surfaceRho(hit.id, hit.nx, hit.ny), gains, correctH);
    const rec: Sample = Object.assign(tone, { point: { x: hit.x, y: hit.y, z: sub.heightM }, y: 0 });
    const st = tone.stops.map((v) => (v === null ? 0 : Math.pow(2, v)));
    rec.y = 0.2126 * st[0]! + 0.7152 * st[1]! + 0.0722 * st[2]!;
    if (!best || rec.y > best.y) best = rec;
    if (!worst || rec.y < worst.y) worst = rec;
  }
  if (!best || !worst) return null;
  const strip = (r: Sample): RecordedTone & { point: Sample['point'] } => ({ stops: r.stops, hex: r.hex, clipped: r.clipped, blocked: r.blocked, point: r.point });
  return { brightest: strip(best), darkest: strip(worst), samples };
}
