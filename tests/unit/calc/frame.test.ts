// The frame agrees with the meter: the same transport shades every pixel (calc/frame/field.ts adapts it).
import { vi } from 'vitest';
vi.setConfig({ testTimeout: 120_000 });
import { describe, expect, it } from 'vitest';
import { type SceneInput, linearToSrgb, meter } from '../../../calc';
import {
  FACE_FRONT_M,
  ID_SUBJECT,
  ID_SURFACE,
  REC709_LUMA_WEIGHTS,
  type FrameExtrasInput,
  type FrameResult,
  applyLook,
  encode8,
  projectToFrame,
  renderFrame,
} from '../../../calc/frame';

const W = 480;

/** An invented set: backdrop along y = 0 facing +y, a white side wall, subject 2 m out facing the camera. */
function baseScene(over: Partial<SceneInput> = {}): SceneInput {
  return {
    lights: [
      { id: 'key', kind: 'flash', x: 0.4, y: 4, heightM: 1.75, aimDeg: -95, tiltDeg: -3, powerFraction: 1 / 8, output: { type: 'energy', ratedWs: 500 } },
    ],
    surfaces: [
      { id: 'backdrop', x1: -3, y1: 0, x2: 3, y2: 0, topM: 3, colour: '#9a9a9a' },
      { id: 'side', x1: -2.5, y1: 6, x2: -2.5, y2: -0.5, topM: 3, colour: '#f0f0f0' },
    ],
    subject: { x: 0, y: 2, heightM: 1.6, facingDeg: 90 },
    camera: { x: 0, y: 5, heightM: 1.6, aimDeg: -90, focalMm: 50, aperture: 8, shutterS: 1 / 160, iso: 100 },
    ...over,
  };
}

function pixelAt(f: FrameResult, x: number, y: number, z: number): number {
  const p = projectToFrame(f.camera, f.width, f.height, x, y, z)!;
  return Math.round(p.py) * f.width + Math.round(p.px);
}

/** The forehead straight ahead of the meter's subject point: its normal there is the subject's facing. */
function foreheadPixel(f: FrameResult, s: { x: number; y: number; heightM: number; facingDeg: number }): number {
  const a = (s.facingDeg * Math.PI) / 180;
  const fwd = FACE_FRONT_M * 0.08; // the cranium's front is a few mm proud of the brow line's point
  return pixelAt(f, s.x + Math.cos(a) * fwd, s.y + Math.sin(a) * fwd, s.heightM + 0.022);
}

describe('the frame and the meter agree (calc/frame/field.ts is the one door into the transport)', () => {
  it('the face: the frame\'s stops at the forehead equal the meter\'s subject reading within 0.1 stop (bounce off the white side wall included)', () => {
    const scene = baseScene();
    const m = meter(scene);
    const f = renderFrame({ scene }, { width: W });
    const i = foreheadPixel(f, scene.subject);
    expect(f.ids[i]).toBe(ID_SUBJECT);
    expect(m.subject.bounceLuxSeconds).toBeGreaterThan(0);
    const diff = f.stops[i]! - m.subject.stopsVsCamera!;
    expect(Math.abs(diff)).toBeLessThan(0.1);
    // The frame's reference for its contours is the meter's field at the subject point.
    expect(f.subjectStops!).toBeCloseTo(m.subject.stopsVsCamera!, 2);
  });

  it('the background: the frame\'s stops on the backdrop equal the meter\'s background reading within 0.1 stop', () => {
    const scene = baseScene({
      lights: [
        ...baseScene().lights,
        { id: 'bg', kind: 'flash', x: 1.6, y: 1.2, heightM: 1.0, aimDeg: -120, tiltDeg: 10, powerFraction: 1 / 16, output: { type: 'energy', ratedWs: 500 }, gel: 'teal' },
      ],
      background: { x: 0.9, y: 0.001, z: 1.4, facingDeg: 90 },
    });
    const m = meter(scene);
    const f = renderFrame({ scene }, { width: W });
    const i = pixelAt(f, 0.9, 0, 1.4);
    expect(f.ids[i]).toBe(ID_SURFACE);
    expect(Math.abs(f.stops[i]! - m.background!.stopsVsCamera!)).toBeLessThan(0.1);
  });

  it('an 18 % grey metered "correct" lands at middle grey: the mid skin tone at the meter\'s own aperture is sRGB ≈ 118 in black and white', () => {
    // Incident metering places an 18 % reflectance at middle grey (common practice); sRGB encoding of 0.18 is
    // 0.4613 → 118 (IEC 61966-2-1).
    const probe = meter(baseScene({ surfaces: [] }));
    const scene = baseScene({ surfaces: [], camera: { ...baseScene().camera, aperture: probe.subject.aperture! } });
    const f = renderFrame({ scene, extras: { skinTone: 'mid' } }, { width: W });
    const mono = applyLook(f, { mono: true });
    const i = foreheadPixel(f, scene.subject);
    expect(Math.abs(f.stops[i]!)).toBeLessThan(0.05);
    expect(Math.abs(mono[i * 4]! - 118)).toBeLessThanOrEqual(2);
  });
});

describe('the picture follows the light', () => {
  it('doubling a light\'s distance darkens its patch on the wall by two stops (inverse-square law)', () => {
    const at = (d: number) => {
      const scene = baseScene({
        lights: [{ id: 'w', kind: 'flash', x: 1, y: d, heightM: 1.5, aimDeg: -90, output: { type: 'energy', ratedWs: 500 }, modifierOverride: { faceRadiusM: 0 } }],
        surfaces: [{ id: 'backdrop', x1: -3, y1: 0, x2: 3, y2: 0, topM: 3, colour: '#9a9a9a' }],
        options: { bounce: false },
      });
      const f = renderFrame({ scene, extras: { subjectVisible: false } }, { width: W });
      return f.stops[pixelAt(f, 1, 0, 1.5)]!;
    };
    expect(at(1) - at(2)).toBeCloseTo(2, 2);
  });

  it('a light behind the subject lights the profile edge and not the front of the face', () => {
    const scene = baseScene({
      lights: [{ id: 'kick', kind: 'flash', x: -0.7, y: 1.0, heightM: 1.65, aimDeg: 55, tiltDeg: 0, powerFraction: 1 / 16, output: { type: 'energy', ratedWs: 500 }, modifier: 'grid-20' }],
      surfaces: [{ id: 'backdrop', x1: -3, y1: 0, x2: 3, y2: 0, topM: 3, colour: '#303030' }],
      options: { bounce: false },
    });
    const f = renderFrame({ scene }, { width: W });
    const front = foreheadPixel(f, scene.subject);
    const row = Math.floor(front / W);
    // The first subject pixel from the left (camera left is −x here, where the kicker stands).
    let edge = -1;
    for (let x = 0; x < W; x++) if (f.ids[row * W + x] === ID_SUBJECT) { edge = row * W + x; break; }
    expect(edge).toBeGreaterThan(0);
    const edgeLit = Math.max(...[0, 1, 2].map((k) => f.linear[(edge + k) * 3 + 1]!));
    expect(edgeLit).toBeGreaterThan(0.05);
    expect(f.linear[front * 3 + 1]!).toBe(0);
  });

  it('a flag between a light and the wall darkens the wall in the frame', () => {
    const wallLight = { id: 'w', kind: 'flash' as const, x: 1.2, y: 1.5, heightM: 2.0, aimDeg: -90, tiltDeg: -18.4, output: { type: 'energy' as const, ratedWs: 500 }, powerFraction: 1 / 8 };
    const open = baseScene({ lights: [wallLight] });
    // At y = 1 the light's ray to the wall point is 1.83 m up and the lens's sight line 1.52 m: the flag
    // (1.62–2.4 m) cuts the light and stays out of the picture there.
    const flagged = baseScene({ lights: [wallLight], flags: [{ id: 'f', x1: 0.9, y1: 1.0, x2: 1.6, y2: 1.0, baseM: 1.62, topM: 2.4 }] });
    const a = renderFrame({ scene: open, extras: { subjectVisible: false } }, { width: W });
    const b = renderFrame({ scene: flagged, extras: { subjectVisible: false } }, { width: W });
    // The flag is between the light and the wall, seen edge-on from nowhere near the wall point.
    const i = pixelAt(a, 1.2, 0, 1.5);
    expect(a.ids[i]).toBe(ID_SURFACE);
    expect(b.ids[i]).toBe(ID_SURFACE);
    expect(a.stops[i]! - b.stops[i]!).toBeGreaterThan(3);
  });

  it('turning the face changes the picture; catchlights show in the eyes of a light in front', () => {
    const scene = baseScene();
    const a = renderFrame({ scene }, { width: 800 });
    const b = renderFrame({ scene: { ...scene, subject: { ...scene.subject, facingDeg: 60 } } }, { width: 800 });
    let changed = 0;
    for (let i = 0; i < a.ids.length; i++) if (a.ids[i] === ID_SUBJECT && a.linear[i * 3] !== b.linear[i * 3]) changed++;
    expect(changed).toBeGreaterThan(1000);
    // Eyes sit ±32 mm to the sides of the face: somewhere around them a pixel clips (cornea mirror of the key).
    let brightest = 0;
    const c = projectToFrame(a.camera, a.width, a.height, 0, 2.06, 1.6)!;
    for (let y = Math.round(c.py) - 12; y <= Math.round(c.py) + 12; y++)
      for (let x = Math.round(c.px) - 24; x <= Math.round(c.px) + 24; x++) brightest = Math.max(brightest, a.linear[(y * a.width + x) * 3 + 1]!);
    expect(brightest).toBeGreaterThanOrEqual(1);
  });

  it('skin tone is the user\'s pick: a deeper tone renders darker under the same light', () => {
    const scene = baseScene();
    const tones: FrameExtrasInput['skinTone'][] = ['light', 'mid', 'deep'];
    const v = tones.map((skinTone) => {
      const f = renderFrame({ scene, extras: { skinTone } }, { width: W });
      return f.linear[foreheadPixel(f, scene.subject) * 3 + 1]!;
    });
    expect(v[0]!).toBeGreaterThan(v[1]!);
    expect(v[1]!).toBeGreaterThan(v[2]!);
  });
});

describe('the head form and the pacing', () => {
  /** A head-and-shoulders frame: 85 mm (or longer) from 2 m, one key, no bounce and no ambient, so a shadow is black. */
  const headshot = (key: SceneInput['lights'][number], focalMm = 85): SceneInput =>
    baseScene({
      lights: [key],
      surfaces: [{ id: 'backdrop', x1: -3, y1: 0, x2: 3, y2: 0, topM: 3, colour: '#303030' }],
      camera: { x: 0, y: 4, heightM: 1.6, aimDeg: -90, focalMm, aperture: 8, shutterS: 1 / 160, iso: 100 },
      options: { bounce: false },
    });
  // The form in world terms for the subject at (0, 2) facing +y, brow line at 1.6 m (solids.ts): its head's
  // centre is FACE_FRONT_M behind the face; the tip of the nose 88 mm in front of the centre and 44 mm below the
  // brow line; the eyes 55 mm in front, ±32 mm to the sides. Camera right is +x: the far side from a key at −x.
  const headCentreY = 2 - FACE_FRONT_M;
  const noseTip = { x: 0, y: headCentreY + 0.088, z: 1.592 - 0.036 };
  const eyes = [-0.032, 0.032].map((x) => ({ x, y: headCentreY + 0.055, z: 1.598 }));
  const key45 = { id: 'key', kind: 'flash' as const, x: -1.06, y: 3.06, heightM: 1.9, aimDeg: -45, tiltDeg: -11, powerFraction: 1 / 8, output: { type: 'energy' as const, ratedWs: 500 }, modifier: 'grid-20' as const };

  it('a key 45° to camera left leaves a nose shadow toward the far cheek, and the far cheek darker than the near one', () => {
    const f = renderFrame({ scene: headshot(key45, 135) }, { width: W });
    const tip = projectToFrame(f.camera, f.width, f.height, noseTip.x, noseTip.y, noseTip.z)!;
    const mmPx = f.width / (2 * 2 * f.camera.tanH * 1000); // pixels per mm at the face, 2 m from the lens
    const g = (px: number, py: number) => f.linear[(Math.round(py) * f.width + Math.round(px)) * 3 + 1]!;
    const isSubject = (px: number, py: number) => f.ids[Math.round(py) * f.width + Math.round(px)] === ID_SUBJECT;
    // Beside and below the tip of the nose on the far side: skin that faces the key (the front of the face)
    // and still gets none of it — the nose's shadow.
    let shadowed = 0;
    let litMirror = 0;
    for (let dy = 2; dy <= 18 * mmPx; dy++)
      for (let dx = 4 * mmPx; dx <= 24 * mmPx; dx++) {
        if (!isSubject(tip.px + dx, tip.py + dy) || g(tip.px + dx, tip.py + dy) !== 0) continue;
        shadowed++;
        if (isSubject(tip.px - dx, tip.py + dy) && g(tip.px - dx, tip.py + dy) > 0.05) litMirror++;
      }
    expect(shadowed).toBeGreaterThan(12);
    // The same places on the near side are lit: the shadow is cast, not the far side turning away.
    expect(litMirror).toBeGreaterThan(shadowed / 2);
    // The far cheek (45 mm out, 20 mm below the eyes) is lit but turned from the key: at least half a stop darker.
    const cheek = (x: number) => pixelAt(f, x, headCentreY + 0.06, 1.578);
    const near = cheek(-0.045);
    const far = cheek(0.045);
    expect(f.ids[near]).toBe(ID_SUBJECT);
    expect(f.ids[far]).toBe(ID_SUBJECT);
    expect(f.linear[far * 3 + 1]!).toBeGreaterThan(0);
    expect(f.linear[near * 3 + 1]!).toBeGreaterThan(1.41 * f.linear[far * 3 + 1]!);
  });

  it('catchlights show in both eyes at 480 px: bright points on the dark eye, head and shoulders on 85 mm', () => {
    const key = { ...key45, x: -0.7, y: 3.3, aimDeg: -62, modifier: 'umbrella-shoot-through' as const, powerFraction: 1 / 4 };
    const f = renderFrame({ scene: headshot(key) }, { width: 480 });
    expect(f.width).toBe(480);
    for (const e of eyes) {
      const c = projectToFrame(f.camera, f.width, f.height, e.x, e.y, e.z)!;
      let bright = 0;
      let dark = 0;
      for (let y = Math.round(c.py) - 8; y <= Math.round(c.py) + 8; y++)
        for (let x = Math.round(c.px) - 8; x <= Math.round(c.px) + 8; x++) {
          const i = y * f.width + x;
          if (f.ids[i] !== ID_SUBJECT) continue;
          const v = f.linear[i * 3 + 1]!;
          if (v >= 0.5) bright++; // sRGB 188 and up
          if (v < 0.12) dark++;
        }
      // A few pixels, not a speck: visible at this size; and dark eye around them, so they read as catchlights.
      expect(bright).toBeGreaterThanOrEqual(3);
      expect(dark).toBeGreaterThanOrEqual(bright);
    }
  });

  it('the lattice frame (light computed every 8th pixel, per pixel at edges) matches the every-pixel frame', () => {
    const scene = baseScene({
      lights: [
        ...baseScene().lights,
        { id: 'kick', kind: 'flash', x: -0.7, y: 1.0, heightM: 1.65, aimDeg: 55, powerFraction: 1 / 16, output: { type: 'energy', ratedWs: 500 }, modifier: 'grid-20' },
      ],
    });
    const exact = applyLook(renderFrame({ scene }, { width: 240, latticeStep: 1 }));
    const fast = applyLook(renderFrame({ scene }, { width: 240, latticeStep: 8 }));
    let sum = 0;
    let off = 0;
    for (let i = 0; i < exact.length; i += 4)
      for (let q = 0; q < 3; q++) {
        const e = Math.abs(exact[i + q]! - fast[i + q]!);
        sum += e;
        if (e > 6) off++;
      }
    const n = (exact.length / 4) * 3;
    expect(sum / n).toBeLessThan(0.5); // mean error under half a code value
    expect(off / n).toBeLessThan(0.005); // under 0.5 % of values off by more than 6 code values
  });
});

describe('looks', () => {
  const synthetic = (rgb: number[][]): FrameResult => ({
    width: rgb.length,
    height: 1,
    linear: Float32Array.from(rgb.flat()),
    stops: new Float32Array(rgb.length),
    ids: new Int32Array(rgb.length),
    subjectStops: 0,
    camera: { ox: 0, oy: 0, oz: 0, f: [1, 0, 0], r: [0, 1, 0], u: [0, 0, 1], tanH: 1, tanV: 1 },
  });

  it('black and white uses the Rec. 709 / sRGB relative-luminance weights 0.2126, 0.7152, 0.0722 (ITU-R BT.709-6; IEC 61966-2-1)', () => {
    expect(REC709_LUMA_WEIGHTS).toEqual({ r: 0.2126, g: 0.7152, b: 0.0722 });
    const f = synthetic([[1, 0, 0], [0, 1, 0], [0, 0, 1], [0.3, 0.5, 0.2], [4, 0.2, 0.1]]);
    const out = applyLook(f, { mono: true });
    const expected = [0.2126, 0.7152, 0.0722, 0.2126 * 0.3 + 0.7152 * 0.5 + 0.0722 * 0.2, 0.2126 + 0.7152 * 0.2 + 0.0722 * 0.1];
    expected.forEach((y, k) => {
      const v = Math.round(linearToSrgb(y) * 255);
      expect(Math.abs(out[k * 4]! - v)).toBeLessThanOrEqual(1);
      expect(out[k * 4 + 1]).toBe(out[k * 4]);
    });
    // Pure red, not the average of the channels: 0.2126 → sRGB 127, where (1+0+0)/3 would give 156.
    expect(Math.abs(out[0]! - 127)).toBeLessThanOrEqual(1);
  });

  it('the mono frame of a rendered teal wash is the Rec. 709 luminance of its colour frame, pixel by pixel', () => {
    const scene = baseScene({
      lights: [{ id: 'bg', kind: 'flash', x: 1.2, y: 1.0, heightM: 1.0, aimDeg: -100, tiltDeg: 10, output: { type: 'energy', ratedWs: 500 }, gel: 'teal' }],
    });
    const f = renderFrame({ scene }, { width: 120 });
    const mono = applyLook(f, { mono: true });
    for (let i = 0; i < f.ids.length; i += 7) {
      const c = [0, 1, 2].map((k) => Math.min(1, Math.max(0, f.linear[i * 3 + k]!)));
      const y = 0.2126 * c[0]! + 0.7152 * c[1]! + 0.0722 * c[2]!;
      expect(Math.abs(mono[i * 4]! - encode8(y))).toBeLessThanOrEqual(0);
    }
  });

  it('clipping marks clipped channels in stripes: red where all clip, amber where only some do (a gelled colour)', () => {
    const f = synthetic([[2, 2, 2], [2, 0.3, 0.1], [0.4, 0.4, 0.4], [2, 2, 2], [2, 0.3, 0.1]]);
    f.width = 5;
    // Stripes run diagonally 4 px wide: pixels 4.. are on a marked stripe in row 0.
    const out = applyLook({ ...f, width: 5 }, { clipping: true });
    expect([out[16], out[17], out[18]]).toEqual([255, 176, 0]);
    const plain = applyLook(f, {});
    expect([plain[8], plain[9], plain[10]]).toEqual([out[8], out[9], out[10]]);
  });

  it('contours are drawn where the exposure crosses a whole stop relative to the subject', () => {
    const f = synthetic([[0.1, 0.1, 0.1], [0.1, 0.1, 0.1], [0.1, 0.1, 0.1], [0.1, 0.1, 0.1]]);
    f.stops.set([-0.6, -0.2, 0.3, 0.4]);
    f.subjectStops = 0;
    const out = applyLook(f, { contours: true });
    // Between −0.2 and 0.3 the level changes from −1 to 0: the subject's level is drawn in amber.
    expect([out[4], out[5], out[6]]).toEqual([255, 196, 60]);
    expect(out[0]).toBe(out[12]);
  });
});

describe('tilted panels in the frame', () => {
  it('a card between the camera and the subject, tilted 60° face up, is seen where it leans, not where it would stand upright', () => {
    // Faces the subject (−y) on the segment (0.3, 3)–(−0.3, 3), lower edge at 1.2 m, 0.4 m along the card.
    const card = { id: 'card', kind: 'reflector' as const, x1: 0.3, y1: 3, x2: -0.3, y2: 3, baseM: 1.2, topM: 1.6, colour: '#ffffff' };
    const tilted = renderFrame({ scene: baseScene({ surfaces: [...baseScene().surfaces!, { ...card, tiltDeg: 60 }] }) }, { width: W });
    const upright = renderFrame({ scene: baseScene({ surfaces: [...baseScene().surfaces!, card] }) }, { width: W });
    const cardId = ID_SURFACE + 2;
    // 0.3 m up the tilted card: leaned back 0.3·sin 60° towards the camera, 0.3·cos 60° over its lower edge.
    const onTilted = pixelAt(tilted, 0, 3 + 0.3 * Math.sin(Math.PI / 3), 1.2 + 0.3 * Math.cos(Math.PI / 3));
    expect(tilted.ids[onTilted]).toBe(cardId);
    // Near the top of where the upright card stands: the tilted one is not there (the view passes over it).
    const uprightTop = pixelAt(upright, 0, 3, 1.55);
    expect(upright.ids[uprightTop]).toBe(cardId);
    expect(tilted.ids[uprightTop]).not.toBe(cardId);
  });
});
