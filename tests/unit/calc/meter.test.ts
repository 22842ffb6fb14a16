import { formatHex } from 'culori';
import { describe, expect, it } from 'vitest';
import {
  BARE_REFLECTOR_BEAM_SR,
  DEFAULT_FLASH_CD_S_PER_WS,
  GELS,
  MODIFIERS,
  exposureValue,
  illuminanceLux,
  kelvinToLinearRgb,
  lightColour,
  meter,
  patchBounceLux,
  shiftKelvin,
  type LightInput,
  type SceneInput,
} from '../../../calc';

type P = { x: number; y: number; z: number };
const SUBJECT: P = { x: 0, y: 0, z: 1.6 };

/** Plan aim and tilt from a light position towards a target (degrees). */
function aim(from: P, to: P = SUBJECT) {
  const dx = to.x - from.x;
  const dy = to.y - from.y;
  return { aimDeg: (Math.atan2(dy, dx) * 180) / Math.PI, tiltDeg: (Math.atan2(to.z - from.z, Math.hypot(dx, dy)) * 180) / Math.PI };
}

/** A flash at `at`, aimed at the subject, point-like (face radius 0) unless overridden. */
function flash(id: string, at: P, over: Partial<LightInput> = {}): LightInput {
  return {
    id,
    kind: 'flash',
    x: at.x,
    y: at.y,
    heightM: at.z,
    ...aim(at),
    output: { type: 'guideNumber', guideNumberM: 32 },
    modifierOverride: { faceRadiusM: 0 },
    ...over,
  } as LightInput;
}

function scene(lights: LightInput[], over: Partial<SceneInput> = {}): SceneInput {
  return {
    lights,
    // Subject facing +x, towards the camera.
    subject: { x: SUBJECT.x, y: SUBJECT.y, heightM: SUBJECT.z, facingDeg: 0 },
    camera: { x: 3, y: 0, heightM: 1.6, aimDeg: 180, aperture: 8, shutterS: 1 / 125, iso: 100 },
    ...over,
  };
}

const front = (d: number): P => ({ x: d, y: 0, z: SUBJECT.z });

describe('meter — direct light', () => {
  it('guide-number definition: GN 32 m at 4 m → f/8 at ISO 100, f/11.3 at ISO 200', () => {
    const r = meter(scene([flash('a', front(4))]));
    expect(r.lights[0]!.aperture).toBeCloseTo(8, 6);
    expect(r.subject.aperture).toBeCloseTo(8, 6);
    expect(r.subject.stopsVsCamera).toBeCloseTo(0, 6);
    const r200 = meter(scene([flash('a', front(4))], { camera: { x: 3, y: 0, aimDeg: 180, aperture: 8, shutterS: 1 / 125, iso: 200 } }));
    expect(r200.subject.aperture).toBeCloseTo(8 * Math.SQRT2, 6);
  });

  it('common practice: doubling the distance to a light costs two stops (inverse-square law)', () => {
    const near = meter(scene([flash('a', front(1.5))])).subject.luxSeconds;
    const far = meter(scene([flash('a', front(3))])).subject.luxSeconds;
    expect(Math.log2(far / near)).toBeCloseTo(-2, 8);
  });

  it('uses the true 3-D distance: a light 2 m up and 2 m out is √8 m away', () => {
    const at = { x: 2, y: 0, z: SUBJECT.z + 2 };
    const r = meter(scene([flash('a', at)], { subject: { x: 0, y: 0, heightM: SUBJECT.z, facingDeg: 45 } }));
    expect(r.lights[0]!.distanceM).toBeCloseTo(Math.sqrt(8), 10);
  });

  it("Lambert's cosine law: light arriving 60° off the subject's facing gives half", () => {
    const on = meter(scene([flash('a', front(2))])).subject.luxSeconds;
    const at = { x: 2 * Math.cos(Math.PI / 3), y: 2 * Math.sin(Math.PI / 3), z: SUBJECT.z };
    const r = meter(scene([flash('a', at)]));
    expect(r.lights[0]!.incidenceDeg).toBeCloseTo(60, 8);
    expect(r.subject.luxSeconds / on).toBeCloseTo(0.5, 8);
  });

  it('a light behind the subject reads nothing on its flat receptor', () => {
    const r = meter(scene([flash('a', { x: -2, y: 0, z: 1.6 })]));
    expect(r.subject.luxSeconds).toBe(0);
    expect(r.subject.aperture).toBeNull();
    expect(r.warnings.map((w) => w.code)).toContain('no-light-on-subject');
  });

  it('beam profile: a subject at the modifier half angle off the axis is one stop down', () => {
    const at = front(3);
    const onAxis = meter(scene([flash('a', at, { modifier: 'grid-20' })])).subject.luxSeconds;
    const half = MODIFIERS['grid-20'].halfAngleDeg;
    const off = meter(scene([flash('a', at, { modifier: 'grid-20', aimDeg: 180 + half })]));
    expect(off.lights[0]!.offAxisDeg).toBeCloseTo(half, 8);
    expect(Math.log2(off.subject.luxSeconds / onAxis)).toBeCloseTo(-1, 2);
  });

  it('modifier and gel losses come from the tables, in stops', () => {
    const base = meter(scene([flash('a', front(3))])).subject.luxSeconds;
    const box = meter(scene([flash('a', front(3), { modifier: 'softbox' })])).subject.luxSeconds;
    const cto = meter(scene([flash('a', front(3), { gel: 'full-cto' })])).subject.luxSeconds;
    expect(Math.log2(box / base)).toBeCloseTo(-MODIFIERS.softbox.lossStops, 8);
    expect(Math.log2(cto / base)).toBeCloseTo(-GELS['full-cto'].lossStops, 8);
    const over = meter(scene([flash('a', front(3), { modifier: 'softbox', modifierOverride: { faceRadiusM: 0, lossStops: 0.5 } })])).subject.luxSeconds;
    expect(Math.log2(over / base)).toBeCloseTo(-0.5, 8);
  });

  it('the near-field term keeps a large source finite and matches the coaxial-disc formula on its axis', () => {
    const R = MODIFIERS.octa.faceRadiusM;
    const lit = (d: number) =>
      meter(scene([flash('a', front(d), { modifier: 'octa', modifierOverride: {} })])).subject.luxSeconds;
    // E = I/(d² + R²): the ratio between two distances follows the disc law, not the point law (coaxial disc
    // view factor, Howell's catalogue). The octa is an area source whose face is an octagon of the disc's
    // area, so the ratio matches the disc within 0.1 %.
    const ratio = lit(0.5) / lit(2);
    const disc = (4 + R * R) / (0.25 + R * R);
    expect(Math.abs(ratio / disc - 1)).toBeLessThan(1e-3);
  });
});

describe('meter — light output', () => {
  it('common practice: each halving of flash power is one stop, eight stops from 1/1 to 1/256', () => {
    const full = meter(scene([flash('a', front(2))])).subject.luxSeconds;
    for (let k = 1; k <= 8; k++) {
      const h = meter(scene([flash('a', front(2), { powerFraction: 1 / 2 ** k })])).subject.luxSeconds;
      expect(Math.log2(h / full)).toBeCloseTo(-k, 10);
    }
  });

  it('rated energy uses the documented default efficiency (from memory), overridable per light', () => {
    const ws = (over = {}) => flash('a', front(2), { output: { type: 'energy', ratedWs: 500, ...over } });
    const r = meter(scene([ws()]));
    // GN² = I·t·S/C with I·t = Ws × cd·s/Ws
    expect(r.lights[0]!.guideNumberM).toBeCloseTo(Math.sqrt((500 * DEFAULT_FLASH_CD_S_PER_WS * 100) / 250), 8);
    const r2 = meter(scene([ws({ efficiencyCdSPerWs: 2 * DEFAULT_FLASH_CD_S_PER_WS })]));
    expect(Math.log2(r2.subject.luxSeconds / r.subject.luxSeconds)).toBeCloseTo(1, 10);
  });

  it('continuous light scales with the shutter, flash does not (common practice, non-HSS flash up to sync)', () => {
    const led: LightInput = { ...flash('led', front(1)), kind: 'continuous', output: { type: 'luxAt1m', lux: 1000 } } as LightInput;
    const cam = (shutterS: number) => ({ camera: { x: 3, y: 0, aimDeg: 180, aperture: 8, shutterS, iso: 100 } });
    const a = meter(scene([led], cam(1 / 100)));
    // E = 1000 lx × 1/100 s = 10 lx·s → N = √(10·100/250) = 2 (ISO 2720)
    expect(a.subject.luxSeconds).toBeCloseTo(10, 8);
    expect(a.subject.aperture).toBeCloseTo(2, 8);
    const b = meter(scene([led], cam(1 / 50)));
    expect(Math.log2(b.subject.luxSeconds / a.subject.luxSeconds)).toBeCloseTo(1, 10);
    const f1 = meter(scene([flash('a', front(2))], cam(1 / 60))).subject.luxSeconds;
    const f2 = meter(scene([flash('a', front(2))], cam(1 / 200))).subject.luxSeconds;
    expect(f1).toBeCloseTo(f2, 10);
  });

  it('lumens go into the bare-reflector beam: lm / Ω equals the same rating as lux at 1 m', () => {
    const mk = (output: LightInput['output']) => ({ ...flash('led', front(2)), kind: 'continuous', output }) as LightInput;
    const a = meter(scene([mk({ type: 'lumens', lumens: 3000 })])).subject.luxSeconds;
    const b = meter(scene([mk({ type: 'luxAt1m', lux: 3000 / BARE_REFLECTOR_BEAM_SR })])).subject.luxSeconds;
    expect(a).toBeCloseTo(b, 10);
  });

  it('a calibration reading anchors the light: the meter reads the same f-number at the reading distance, two stops less at twice it', () => {
    const cal = { aperture: 11, distanceM: 2, iso: 100 };
    const at2 = meter(scene([flash('a', front(2), { calibration: cal })]));
    expect(at2.lights[0]!.calibrated).toBe(true);
    expect(at2.lights[0]!.aperture).toBeCloseTo(11, 8);
    const at4 = meter(scene([flash('a', front(4), { calibration: cal })]));
    expect(Math.log2(at4.subject.luxSeconds / at2.subject.luxSeconds)).toBeCloseTo(-2, 8);
    // It replaces the output model: the rating no longer matters.
    const other = meter(scene([flash('a', front(2), { calibration: cal, output: { type: 'energy', ratedWs: 1200 } })]));
    expect(other.lights[0]!.aperture).toBeCloseTo(11, 8);
    // Read at half power, now at quarter power: one stop less.
    const q = meter(scene([flash('a', front(2), { calibration: { ...cal, powerFraction: 0.5 }, powerFraction: 0.25 })]));
    expect(Math.log2(q.subject.luxSeconds / at2.subject.luxSeconds)).toBeCloseTo(-1, 8);
    // A calibrated softbox keeps its near-field term, so the reading is still reproduced at its distance.
    const box = meter(scene([flash('a', front(0.8), { modifier: 'softbox', modifierOverride: {}, calibration: { aperture: 16, distanceM: 0.8, iso: 100 } })]));
    expect(box.lights[0]!.aperture).toBeCloseTo(16, 8);
  });

  it('calibrates a continuous light from a reading with its shutter time', () => {
    const led = { ...flash('led', front(1.5)), kind: 'continuous', output: { type: 'luxAt1m', lux: 500 }, calibration: { aperture: 4, distanceM: 1.5, iso: 400, shutterS: 1 / 60 } } as LightInput;
    const same = meter(scene([led], { camera: { x: 3, y: 0, aimDeg: 180, aperture: 4, shutterS: 1 / 60, iso: 400 } }));
    expect(same.subject.aperture).toBeCloseTo(4, 8);
  });
});

describe('meter — advice and ratios', () => {
  it('power for a target aperture: f/5.6 → f/8 needs one stop more; beyond full and below 1/256 are flagged', () => {
    // GN 32 at 4 m at power p reads f/(8√p); at half power: f/5.66.
    const r = meter(scene([flash('a', front(4), { powerFraction: 0.5 })]));
    expect(r.lights[0]!.aperture).toBeCloseTo(8 / Math.SQRT2, 6);
    expect(r.lights[0]!.forTarget.stopsChange).toBeCloseTo(1, 8);
    expect(r.lights[0]!.forTarget.fraction).toBeCloseTo(1, 8);
    expect(r.lights[0]!.forTarget.beyondFull).toBe(false);

    const far = meter(scene([flash('a', front(8))]));
    expect(far.lights[0]!.forTarget.stopsChange).toBeCloseTo(2, 8);
    expect(far.lights[0]!.forTarget.beyondFull).toBe(true);
    expect(far.warnings.map((w) => w.code)).toContain('beyond-full-power');
    // Never nonsense: a power beyond full reads as how far over, in stops (a quarter of the light: 2 stops over).
    expect(far.warnings.find((w) => w.code === 'beyond-full-power')!.message).toBe('a: over full power by 2.0 stops for f/8');

    const close = meter(scene([flash('a', front(0.1), { powerFraction: 1 / 256 })]));
    // GN 32 at 1/256 (GN × 1/16) and 0.1 m reads f/20: f/8 needs 2.6 stops less than the lowest setting
    expect(close.lights[0]!.forTarget.fraction!).toBeLessThan(1 / 256);
    expect(close.lights[0]!.forTarget.belowMinimum).toBe(true);
    expect(close.warnings.map((w) => w.code)).toContain('below-minimum-power');
  });

  it('all lights together: the stops to shift every light to reach the target keep the ratios', () => {
    const r = meter(scene([flash('a', front(4), { powerFraction: 0.25 }), flash('b', { x: 0, y: 4, z: 1.6 }, { powerFraction: 0.25 })]));
    const s = r.allLightsStopsChange!;
    expect(2 ** s * r.subject.luxSeconds).toBeCloseTo(160, 6); // f/8 at ISO 100, C 250 → 160 lx·s
  });

  it('common practice: a 2:1 key:fill ratio is one stop (brightest light is the key, the others fill)', () => {
    // Key on the facing axis at 3 m; fill at 45° at 3 m and √½ power: cos 45° × √½ = ½ of the key.
    const at45 = { x: 3 * Math.SQRT1_2, y: 3 * Math.SQRT1_2, z: 1.6 };
    const r = meter(scene([flash('fill', at45, { powerFraction: Math.SQRT1_2 }), flash('key', front(3))]));
    expect(r.keyFill.keyId).toBe('key');
    expect(r.keyFill.fillIds).toEqual(['fill']);
    expect(r.keyFill.ratio).toBeCloseTo(2, 8);
    expect(r.keyFill.ratioStops).toBeCloseTo(1, 8);
    expect(r.keyFill.litToShadowRatio).toBeCloseTo(3, 8);
    expect(r.keyFill.rule).toBe('brightest');
    expect(r.lights.find((l) => l.id === 'key')!.ratioRole).toBe('key');
  });

  it('roles set in the scene win over brightness; rim lights are neither key nor fill', () => {
    const r = meter(
      scene([
        flash('big', front(2), { role: 'fill' }),
        flash('small', front(4), { role: 'key' }),
        flash('rim', { x: 2, y: 1, z: 2 }, { role: 'rim' }),
      ]),
    );
    expect(r.keyFill.keyId).toBe('small');
    expect(r.keyFill.fillIds).toEqual(['big']);
    expect(r.keyFill.ratio).toBeCloseTo(0.25, 8);
    expect(r.keyFill.rule).toBe('roles');
    expect(r.lights.find((l) => l.id === 'rim')!.ratioRole).toBe('none');
  });

  it('common practice: f/2.8 ISO 400 → f/7 ISO 100 puts the ambient about 4.6 stops under', () => {
    const ambientEv = exposureValue({ aperture: 2.8, shutterS: 1 / 200, iso: 400 }); // metered ambient, correct at f/2.8 ISO 400
    const at = (aperture: number, iso: number) =>
      meter(scene([flash('a', front(3))], { ambient: { ev100: ambientEv }, camera: { x: 3, y: 0, aimDeg: 180, aperture, shutterS: 1 / 200, iso } })).ambient!;
    expect(at(2.8, 400).stopsVsCamera).toBeCloseTo(0, 10);
    expect(at(7, 100).stopsVsCamera).toBeCloseTo(-4.644, 3);
  });

  it('flags a shutter faster than the sync speed (default 1/200 s, common practice) only when a flash is on', () => {
    const cam = (shutterS: number, syncSpeedS?: number) => ({ camera: { x: 3, y: 0, aimDeg: 180, aperture: 8, shutterS, iso: 100, ...(syncSpeedS ? { syncSpeedS } : {}) } });
    expect(meter(scene([flash('a', front(3))], cam(1 / 250))).camera.overSync).toBe(true);
    expect(meter(scene([flash('a', front(3))], cam(1 / 250))).warnings.map((w) => w.code)).toContain('shutter-faster-than-sync');
    expect(meter(scene([flash('a', front(3))], cam(1 / 200))).camera.overSync).toBe(false);
    expect(meter(scene([flash('a', front(3))], cam(1 / 250, 1 / 250))).camera.overSync).toBe(false);
    const led = { ...flash('led', front(1)), kind: 'continuous', output: { type: 'luxAt1m', lux: 1000 } } as LightInput;
    expect(meter(scene([led], cam(1 / 1000))).camera.overSync).toBe(false);
    expect(meter(scene([flash('a', front(3), { enabled: false })], cam(1 / 1000))).camera.overSync).toBe(false);
  });

  it('reports the camera angle of view: 50 mm on a 36 mm frame is 39.6° (2·atan(d/2f))', () => {
    const r = meter(scene([flash('a', front(3))], { camera: { x: 3, y: 0, aimDeg: 180, aperture: 8, shutterS: 1 / 125, iso: 100, focalMm: 50 } }));
    expect(r.camera.horizontalAovDeg).toBeCloseTo(39.6, 1);
    expect(r.camera.verticalAovDeg).toBeCloseTo(26.99, 1);
  });
});

describe('meter — shadows', () => {
  it('an opaque flag between light and subject blocks it; a one-stop scrim passes half', () => {
    const at = { x: 2, y: 2, z: 1.6 };
    const flagOn = (transmission: number) => meter(scene([flash('a', at)], { flags: [{ id: 'f', x1: 1, y1: 0.5, x2: 0.5, y2: 1, transmission }] }));
    const clear = meter(scene([flash('a', at)])).subject.luxSeconds;
    expect(flagOn(0).subject.luxSeconds).toBe(0);
    expect(flagOn(0).lights[0]!.transmission).toBe(0);
    expect(Math.log2(flagOn(0.5).subject.luxSeconds / clear)).toBeCloseTo(-1, 10);
  });
  it('a flag below the ray (height range) casts no shadow; a wall in between does', () => {
    const at = { x: 2, y: 2, z: 2.5 };
    const low = meter(scene([flash('a', at)], { flags: [{ id: 'f', x1: 1, y1: 0.5, x2: 0.5, y2: 1, baseM: 0, topM: 1 }] }));
    expect(low.lights[0]!.transmission).toBe(1);
    const wall = meter(scene([flash('a', at)], { surfaces: [{ id: 'w', x1: 1, y1: 0.5, x2: 0.5, y2: 1, colour: '#808080' }] }));
    expect(wall.lights[0]!.directLuxSeconds).toBe(0);
  });
});

describe('meter — background and probes', () => {
  const backdrop = { id: 'paper', kind: 'backdrop' as const, x1: -2, y1: -2, x2: -2, y2: 2, colour: '#808080' };
  it('finds the background on the backdrop behind the subject, along the camera line, facing the camera', () => {
    const r = meter(scene([flash('a', front(2))], { surfaces: [backdrop] }));
    expect(r.background!.surfaceId).toBe('paper');
    expect(r.background!.point.x).toBeCloseTo(-2, 2);
    expect(r.background!.point.y).toBeCloseTo(0, 8);
    expect(r.background!.point.z).toBeCloseTo(1.6, 8);
  });
  it('falloff to the background follows the inverse square (light on the camera line, bounce off)', () => {
    const r = meter(scene([flash('a', front(2))], { surfaces: [backdrop], options: { bounce: false } }));
    // subject 2 m from the light, background 4 m (1 mm nudge off the paper)
    expect(r.background!.stopsVsSubject!).toBeCloseTo(2 * Math.log2(2 / 3.999), 6);
    expect(r.lights[0]!.backgroundStopsVsSubject!).toBeCloseTo(r.background!.stopsVsSubject!, 10);
  });
  it('meters any chosen point relative to the subject', () => {
    const r = meter(scene([flash('a', front(2))], { probes: [{ id: 'p', x: -2, y: 0, z: 1.6 }] }));
    expect(r.probes[0]!.stopsVsSubject!).toBeCloseTo(2 * Math.log2(2 / 4), 8);
  });
  it('the room light adds to both sides, as the frame records them: a dark background comes up with the room lights on', () => {
    const dark = meter(scene([flash('a', front(2))], { surfaces: [backdrop], probes: [{ id: 'p', x: -1.9, y: 0, z: 1.6 }], options: { bounce: false } }));
    // Room light of about the flash's level at the background (EV100 chosen from the background's own lux·s).
    const bgH = dark.background!.luxSeconds;
    const shutterS = 1 / 125;
    const ev100 = Math.log2((bgH / shutterS) / 2.5); // E = 2.5·2^EV (ISO 2720 incident, C = 250 lx·s at ISO 100 → 2.5 lx)
    const lit = meter(scene([flash('a', front(2))], { surfaces: [backdrop], probes: [{ id: 'p', x: -1.9, y: 0, z: 1.6 }], options: { bounce: false }, ambient: { ev100 } }));
    const amb = lit.ambient!.luxSeconds;
    expect(amb / bgH).toBeCloseTo(1, 1);
    const subjH = dark.subject.luxSeconds;
    expect(lit.background!.stopsVsSubject!).toBeCloseTo(Math.log2((bgH + amb) / (subjH + amb)), 6);
    expect(lit.background!.stopsVsSubject! - dark.background!.stopsVsSubject!).toBeGreaterThan(0.6); // −2 → log2(2/5) = −1.3
    const probeH = dark.probes[0]!.luxSeconds;
    expect(lit.probes[0]!.stopsVsSubject!).toBeCloseTo(Math.log2((probeH + amb) / (subjH + amb)), 6);
  });
});

describe('meter — one bounce', () => {
  // A light facing a 20 m × 6 m white wall 2 m away, its back to the subject; the subject faces the wall.
  const wall = { id: 'w', x1: -10, y1: 10, x2: -10, y2: -10, baseM: 0, topM: 6, colour: '#ffffff', reflectance: 0.8 };
  // front of (x1,y1)→(x2,y2) going −y at x = −10: on the right on screen is +x... the room side.
  const light = { ...flash('a', { x: -8, y: 0, z: 1.6 }), aimDeg: 180, tiltDeg: 0, modifier: 'umbrella-reflective', modifierOverride: { faceRadiusM: 0 } } as LightInput;
  const s = scene([light], { surfaces: [wall], subject: { x: -6, y: 0, heightM: 1.6, facingDeg: 180 } });

  /** Brute-force reference: inverse-square + cosine onto fine wall cells, then Lambertian patches to the subject. */
  function reference(reflectance: number): number {
    const r = meter({ ...s, options: { bounce: false } }); // only for the light's intensity
    const I = r.lights[0]!.axialCdS;
    const spec = MODIFIERS['umbrella-reflective'];
    const n = 240;
    let e = 0;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n / 4; j++) {
        const y = -10 + ((i + 0.5) * 20) / n;
        const z = ((j + 0.5) * 6) / (n / 4);
        const area = (20 / n) * (6 / (n / 4));
        // light → wall cell
        const lx = -2;
        const dL = Math.hypot(lx, y, z - 1.6);
        const offAxis = (Math.acos(2 / dL) * 180) / Math.PI;
        const k = 2 + 18 * (1 - spec.edgeSoftness);
        const prof = 1 / (1 + (offAxis / spec.halfAngleDeg) ** k);
        const lux = illuminanceLux(I * prof, dL, offAxis); // wall normal is along the axis here
        // wall cell → subject (4 m from the wall, facing it)
        const dS = Math.hypot(4, y, z - 1.6);
        const ang = (Math.acos(4 / dS) * 180) / Math.PI;
        e += patchBounceLux({ incidentLux: lux, reflectance, areaM2: area, distanceM: dS, emitAngleDeg: ang, receiveAngleDeg: ang });
      }
    }
    return e;
  }

  it('matches a fine brute-force integration of inverse-square, cosine and Lambertian reflection within 3 %', () => {
    const r = meter(s);
    expect(r.subject.directLuxSeconds).toBeLessThan(1e-6 * r.subject.bounceLuxSeconds);
    expect(r.subject.bounceLuxSeconds / reference(0.8)).toBeCloseTo(1, 1);
    expect(Math.abs(r.subject.bounceLuxSeconds / reference(0.8) - 1)).toBeLessThan(0.03);
  });

  it('scales with the reflectance and takes the colour of the wall', () => {
    const r8 = meter(s).subject.bounceLuxSeconds;
    const r4 = meter({ ...s, surfaces: [{ ...wall, reflectance: 0.4 }] }).subject.bounceLuxSeconds;
    expect(r4 / r8).toBeCloseTo(0.5, 10);
    const red = meter({ ...s, surfaces: [{ ...wall, colour: '#c03020', reflectance: undefined }] });
    const rgb = red.subject.colour!.linearRgb;
    expect(rgb[0]).toBeGreaterThan(rgb[1]);
    expect(rgb[0]).toBeGreaterThan(rgb[2]);
  });

  it('does not bounce to a receptor on the other side of the wall', () => {
    const r = meter({ ...s, subject: { x: -12, y: 0, heightM: 1.6, facingDeg: 0 } });
    expect(r.subject.bounceLuxSeconds).toBe(0);
  });
});

describe('meter — colour', () => {
  it('reports colour temperature per light: 5500 K flash, 3200 K tungsten, and mired-shifted gels', () => {
    const led = { ...flash('led', front(2)), kind: 'continuous', output: { type: 'luxAt1m', lux: 1000 } } as LightInput;
    const r = meter(scene([flash('a', front(3)), led, flash('c', front(3), { id: 'c', gel: 'full-cto' })]));
    expect(r.lights[0]!.kelvin).toBe(5500);
    expect(r.lights[1]!.kelvin).toBe(3200);
    expect(r.lights[2]!.kelvin).toBeCloseTo(shiftKelvin(5500, GELS['full-cto'].miredShift), 8);
    expect(r.lights[0]!.colourHex).toBe('#ffffff'); // camera white balance 5500 K
  });

  it('mixes gelled lights by exposure in linear RGB (culori as the reference for the hex)', () => {
    const r = meter(scene([flash('a', front(3)), flash('b', { x: 3 * Math.SQRT1_2, y: 3 * Math.SQRT1_2, z: 1.6 }, { gel: 'full-ctb' })]));
    const [a, b] = r.lights;
    const ca = kelvinToLinearRgb(a!.kelvin);
    const cb = kelvinToLinearRgb(b!.kelvin);
    const mix = [0, 1, 2].map((i) => a!.luxSeconds * ca[i]! + b!.luxSeconds * cb[i]!);
    const m = Math.max(...mix);
    expect(r.subject.colour!.absoluteHex).toBe(formatHex({ mode: 'lrgb', r: mix[0]! / m, g: mix[1]! / m, b: mix[2]! / m }));
    // the mixed CCT lies between the two lights'
    expect(r.subject.colour!.cctK!).toBeGreaterThan(a!.kelvin);
    expect(r.subject.colour!.cctK!).toBeLessThan(b!.kelvin);
  });

  it('lightColour gives the drawing colour the meter uses, without metering', () => {
    const r = meter(scene([flash('a', front(3), { gel: 'half-ctb' })]));
    const c = lightColour({ kind: 'flash', gel: 'half-ctb' });
    expect(c.kelvin).toBeCloseTo(r.lights[0]!.kelvin, 10);
    expect(c.hex).toBe(r.lights[0]!.colourHex);
    expect(lightColour({ kind: 'continuous' }).kelvin).toBe(3200);
    expect(lightColour({ kind: 'flash', gel: 'red' }).hex).not.toBe('#ffffff');
  });

  it('an ungelled flash reads about 5500 K at the subject', () => {
    const r = meter(scene([flash('a', front(3))]));
    expect(Math.abs(r.subject.colour!.cctK! - 5500)).toBeLessThan(55);
    expect(r.subject.colour!.hex).toBe('#ffffff');
  });
});

describe('meterParsed', () => {
  it('gives the same readings as meter for a scene parsed once', async () => {
    const { meter, meterParsed, parseScene } = await import('../../../calc');
    const input: SceneInput = {
      lights: [{ id: 'k', kind: 'flash', x: 0, y: 1, heightM: 1.6, aimDeg: -90, output: { type: 'energy', ratedWs: 400 } }],
      subject: { x: 0, y: 0, heightM: 1.6, facingDeg: 90 },
      camera: { x: 0, y: 3, aimDeg: -90, aperture: 8, shutterS: 1 / 200, iso: 100 },
    };
    expect(meterParsed(parseScene(input))).toEqual(meter(input));
  });
});
