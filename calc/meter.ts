/**
 * The scene-level meter: what a handheld incident meter (flat receptor) would read at the subject, the
 * background and chosen points, per light and in total, plus the derived advice (power for a target
 * aperture, key:fill, ambient, sync) and the mixed colour.
 *
 * Light is carried as luminous exposure H (lux·s) under the camera's shutter: flash as its I·t, continuous
 * light as E·t. An incident meter reads H as the f-number N = √(H·S/C) (ISO 2720, flash form).
 */
import { type Rgb, cctOfLinearRgb, hueHex, kelvinToLinearRgb, relativeLuminance } from './colour';
import { apertureForFlashExposure, exposureValue, guideNumberFromCandelaSeconds, luxFromEv100, luxSecondsForAperture } from './exposure';
import { angleOfViewDeg } from './photometry';
import { type SurfaceOptics, buildOccluders, buildPatches, prepareLight, surfaceOptics } from './prepare';
import type { ColourReading, LightReading, MeterResult, MeterWarning, PointReading, PowerAdvice } from './readings';
import { type LightRole, type Scene, type SceneInput, parseScene } from './scene';
import { type Receptor, directAt, patchFormFactor, patchIncident, transmissionAlong } from './transport';
import { DEG } from './vec';

/** Most patches one surface is split into by the meter. */
export const METER_MAX_PATCHES_PER_SURFACE = 400;

/**
 * Exposures at or below this (lux·s) count as no light: it is some 70 stops below f/1 at ISO 100, and keeps
 * ratios and power advice finite for geometry that grazes a light.
 */
export const DARK_LUX_SECONDS = 1e-20;

const safeLog2Ratio = (a: number, b: number): number | null =>
  a > DARK_LUX_SECONDS && b > DARK_LUX_SECONDS ? Math.log2(a) - Math.log2(b) : null;

type PointAccum = { direct: number; bounce: number; rgb: [number, number, number] };

function reading(h: number, direct: number, bounce: number, scene: Scene, correctH: number): PointReading {
  return {
    luxSeconds: h,
    directLuxSeconds: direct,
    bounceLuxSeconds: bounce,
    aperture: h > DARK_LUX_SECONDS ? apertureForFlashExposure(h, scene.camera.iso, scene.options.calibrationC) : null,
    stopsVsCamera: safeLog2Ratio(h, correctH),
  };
}

function colourReading(rgb: Rgb, wbK: number): ColourReading | null {
  const y = relativeLuminance(rgb);
  if (!(y > DARK_LUX_SECONDS)) return null;
  const n: Rgb = [rgb[0] / y, rgb[1] / y, rgb[2] / y];
  return { hex: hueHex(n, wbK), absoluteHex: hueHex(n), cctK: cctOfLinearRgb(n), linearRgb: n };
}

function horizontalNormal(deg: number): { nx: number; ny: number; nz: number } {
  return { nx: Math.cos(deg * DEG), ny: Math.sin(deg * DEG), nz: 0 };
}

/**
 * The background point: where the camera's line of sight through the subject, continued past the subject,
 * first meets a surface (at the height of that line, clamped to the surface), nudged 1 mm towards the camera,
 * its receptor facing the camera side. Null when no surface is behind the subject and none is given.
 */
export function findBackground(scene: Scene): { receptor: Receptor; surfaceId: string | null } | null {
  const cam = scene.camera;
  const sub = scene.subject;
  if (scene.background) {
    const b = scene.background;
    const deg = b.facingDeg ?? (Math.atan2(cam.y - b.y, cam.x - b.x) / DEG);
    return { receptor: { x: b.x, y: b.y, z: b.z, ...horizontalNormal(deg) }, surfaceId: null };
  }
  const dx = sub.x - cam.x;
  const dy = sub.y - cam.y;
  if (dx === 0 && dy === 0) return null;
  let best = Infinity;
  let hit: { receptor: Receptor; surfaceId: string } | null = null;
  for (const s of scene.surfaces) {
    const ex = s.x2 - s.x1;
    const ey = s.y2 - s.y1;
    const denom = dx * ey - dy * ex;
    if (denom === 0) continue;
    const apx = s.x1 - cam.x;
    const apy = s.y1 - cam.y;
    const t = (apx * ey - apy * ex) / denom; // 1 at the subject
    const u = (apx * dy - apy * dx) / denom;
    if (t <= 1 || u < 0 || u > 1 || t >= best) continue;
    best = t;
    const len = Math.hypot(ex, ey);
    let nx = -ey / len;
    let ny = ex / len;
    if (nx * -dx + ny * -dy < 0) {
      nx = -nx;
      ny = -ny;
    }
    const z = Math.min(s.topM, Math.max(s.baseM, cam.heightM + t * (sub.heightM - cam.heightM)));
    hit = {
      receptor: { x: cam.x + t * dx + nx * 1e-3, y: cam.y + t * dy + ny * 1e-3, z, nx, ny, nz: 0 },
      surfaceId: s.id,
    };
  }
  return hit;
}

/**
 * Key and fill: if any light has role 'key', the brightest of those (at the subject) is the key; otherwise the
 * brightest 'auto' light is. Fill is every light with role 'fill' if any has it; otherwise every other 'auto'
 * light. Rim, background and other lights are never key or fill. The ratio compares exposures at the subject's
 * flat receptor, as metering each light alone does.
 */
export function chooseKeyFill(
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

/** Meter a scene (validated and defaulted by sceneSchema; throws with the field path if invalid). */
export function meter(input: SceneInput | Scene): MeterResult {
  return meterParsed(parseScene(input));
}

/** Like meter, for a scene already validated by sceneSchema (the editor parses once per frame for both the
 *  meter and the light map). */
export function meterParsed(scene: Scene): MeterResult {
  const cam = scene.camera;
  const C = scene.options.calibrationC;
  const lights = scene.lights.map((l, i) => prepareLight(l, i, scene));
  const occ = buildOccluders(scene);
  const useBounce = scene.options.bounce && scene.surfaces.some((s) => s.bounces);
  const patches = useBounce
    ? buildPatches(scene, scene.options.patchSizeM, METER_MAX_PATCHES_PER_SURFACE)
    : buildPatches({ ...scene, surfaces: [] }, 1, 1);
  const optics: SurfaceOptics = surfaceOptics(scene);

  // Correct exposure at the camera: the H an incident meter reads as the camera's aperture, plus the lens ND.
  const correctH = luxSecondsForAperture(cam.aperture, cam.iso, C) * Math.pow(2, cam.ndStops);

  const subjectR: Receptor = { x: scene.subject.x, y: scene.subject.y, z: scene.subject.heightM, ...horizontalNormal(scene.subject.facingDeg) };
  const bg = findBackground(scene);
  const probeR: Receptor[] = scene.probes.map((p) => ({ x: p.x, y: p.y, z: p.z, ...horizontalNormal(p.facingDeg ?? scene.subject.facingDeg) }));
  const receptors: Receptor[] = [subjectR, ...(bg ? [bg.receptor] : []), ...probeR];
  const nQ = receptors.length;

  // Patch → receptor form factors with occlusion, shared by all lights.
  const nP = patches.count;
  const ff = new Float64Array(nP * nQ);
  const seen = new Uint8Array(nP); // patches some receptor sees; the others need no light computed
  for (let q = 0; q < nQ; q++) {
    const r = receptors[q]!;
    for (let i = 0; i < nP; i++) {
      const f = patchFormFactor(patches, i, r, 4);
      if (f === 0) continue;
      const t = transmissionAlong(occ, patches.cx[i]!, patches.cy[i]!, patches.cz[i]!, r.x, r.y, r.z, patches.surface[i]!);
      ff[i * nQ + q] = f * t;
      if (t > 0) seen[i] = 1;
    }
  }

  const incident = new Float64Array(nP);
  const acc: PointAccum[][] = lights.map(() => receptors.map(() => ({ direct: 0, bounce: 0, rgb: [0, 0, 0] })));
  const subjectDirect = lights.map((L) =>
    directAt(L, occ, subjectR.x, subjectR.y, subjectR.z, subjectR.nx, subjectR.ny, subjectR.nz),
  );
  lights.forEach((L, li) => {
    const row = acc[li]!;
    for (let q = 0; q < nQ; q++) {
      const r = receptors[q]!;
      const d = q === 0 ? subjectDirect[li]! : directAt(L, occ, r.x, r.y, r.z, r.nx, r.ny, r.nz);
      const a = row[q]!;
      a.direct = d.luxSeconds;
      a.rgb[0] += d.luxSeconds * L.rgb[0];
      a.rgb[1] += d.luxSeconds * L.rgb[1];
      a.rgb[2] += d.luxSeconds * L.rgb[2];
    }
    if (nP === 0 || L.axialCdS <= 0) return;
    patchIncident(L, patches, occ, incident, seen);
    for (let i = 0; i < nP; i++) {
      const e = incident[i]!;
      if (e === 0) continue;
      const o = optics[patches.surface[i]!]!;
      const side = e > 0 ? o.front : o.back;
      const lum = Math.abs(e) / Math.PI; // luminance per unit reflectance, cd·s/m²
      for (let q = 0; q < nQ; q++) {
        const f = ff[i * nQ + q]!;
        if (f === 0 || (f > 0) !== (e > 0)) continue; // receptor must be on the lit side
        const w = lum * Math.abs(f);
        const a = row[q]!;
        const cr = L.rgb[0] * side.rgb[0] * w;
        const cg = L.rgb[1] * side.rgb[1] * w;
        const cb = L.rgb[2] * side.rgb[2] * w;
        a.rgb[0] += cr;
        a.rgb[1] += cg;
        a.rgb[2] += cb;
        a.bounce += 0.2126 * cr + 0.7152 * cg + 0.0722 * cb; // relative luminance, inlined
      }
    }
  });

  const total = (q: number): PointAccum => {
    const t: PointAccum = { direct: 0, bounce: 0, rgb: [0, 0, 0] };
    for (const row of acc) {
      const a = row[q]!;
      t.direct += a.direct;
      t.bounce += a.bounce;
      t.rgb[0] += a.rgb[0];
      t.rgb[1] += a.rgb[1];
      t.rgb[2] += a.rgb[2];
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

  const subjTotal = total(0);
  const subjH = subjTotal.direct + subjTotal.bounce;
  const bgIndex = bg ? 1 : -1;
  const bgTotal = bgIndex > 0 ? total(bgIndex) : null;

  const perLightH = acc.map((row) => row[0]!.direct + row[0]!.bounce);
  const kf = chooseKeyFill(scene.lights.map((l, i) => ({ id: l.id, role: l.role, enabled: l.enabled, luxSeconds: perLightH[i]! })));
  const keyH = kf.keyId ? perLightH[scene.lights.findIndex((l) => l.id === kf.keyId)]! : 0;
  const fillH = kf.fillIds.reduce((s, id) => s + perLightH[scene.lights.findIndex((l) => l.id === id)]!, 0);

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

  const lightReadings: LightReading[] = lights.map((L, li) => {
    const l = L.light;
    const row = acc[li]!;
    const a = row[0]!;
    const h = a.direct + a.bounce;
    const d = subjectDirect[li]!;
    let forTarget: PowerAdvice = { stopsChange: null, fraction: null, beyondFull: false, belowMinimum: false };
    if (h > DARK_LUX_SECONDS) {
      const stopsChange = Math.log2(targetH) - Math.log2(h);
      const fraction = l.powerFraction * Math.pow(2, stopsChange);
      forTarget = { stopsChange, fraction, beyondFull: fraction > 1 + 1e-9, belowMinimum: fraction < L.minPowerFraction * (1 - 1e-9) };
      if (l.enabled && forTarget.beyondFull) {
        warnings.push({ code: 'beyond-full-power', lightId: l.id, message: `${l.id} needs ${(Math.log2(fraction)).toFixed(1)} stops above full power for f/${targetAperture}` });
      }
      if (l.enabled && forTarget.belowMinimum) {
        warnings.push({ code: 'below-minimum-power', lightId: l.id, message: `${l.id} would need less than its lowest power for f/${targetAperture}` });
      }
    }
    if (l.enabled && d.incidenceDeg >= 90 && L.axialCdS > 0 && (l.role === 'key' || l.role === 'fill')) {
      warnings.push({ code: 'light-behind-subject-facing', lightId: l.id, message: `${l.id} is behind the subject's facing and reads nothing on a flat receptor` });
    }
    const ratioRole: LightReading['ratioRole'] = kf.keyId === l.id ? 'key' : kf.fillIds.includes(l.id) ? 'fill' : 'none';
    const bgA = bgIndex > 0 ? row[bgIndex]! : null;
    return {
      ...reading(h, a.direct, a.bounce, scene, correctH),
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
      backgroundStopsVsSubject: bgA ? safeLog2Ratio(bgA.direct + bgA.bounce, h) : null,
    };
  });

  const bgH = bgTotal ? bgTotal.direct + bgTotal.bounce : 0;
  const combinedH = subjH + (ambient?.luxSeconds ?? 0);
  return {
    camera: {
      ev100: exposureValue(cam),
      horizontalAovDeg: angleOfViewDeg(cam.focalMm, cam.sensorWidthMm),
      verticalAovDeg: angleOfViewDeg(cam.focalMm, cam.sensorHeightMm),
      syncSpeedS: cam.syncSpeedS,
      overSync,
    },
    targetAperture,
    subject: { ...reading(subjH, subjTotal.direct, subjTotal.bounce, scene, correctH), colour: colourReading(withAmbient(subjTotal.rgb), cam.whiteBalanceK) },
    lights: lightReadings,
    keyFill: {
      ...kf,
      ratio: keyH > DARK_LUX_SECONDS && fillH > DARK_LUX_SECONDS ? keyH / fillH : null,
      ratioStops: safeLog2Ratio(keyH, fillH),
      litToShadowRatio: keyH > DARK_LUX_SECONDS && fillH > DARK_LUX_SECONDS ? (keyH + fillH) / fillH : null,
    },
    background:
      bg && bgTotal
        ? {
            ...reading(bgH, bgTotal.direct, bgTotal.bounce, scene, correctH),
            point: { x: bg.receptor.x, y: bg.receptor.y, z: bg.receptor.z },
            surfaceId: bg.surfaceId,
            stopsVsSubject: safeLog2Ratio(bgH, subjH),
            colour: colourReading(withAmbient(bgTotal.rgb), cam.whiteBalanceK),
          }
        : null,
    probes: scene.probes.map((p, k) => {
      const q = 1 + (bg ? 1 : 0) + k;
      const t = total(q);
      const h = t.direct + t.bounce;
      return { ...reading(h, t.direct, t.bounce, scene, correctH), id: p.id, point: { x: p.x, y: p.y, z: p.z }, stopsVsSubject: safeLog2Ratio(h, subjH) };
    }),
    ambient,
    combined: {
      luxSeconds: combinedH,
      aperture: combinedH > DARK_LUX_SECONDS ? apertureForFlashExposure(combinedH, cam.iso, C) : null,
      stopsVsCamera: safeLog2Ratio(combinedH, correctH),
    },
    allLightsStopsChange: safeLog2Ratio(targetH, subjH),
    warnings,
  };
}
