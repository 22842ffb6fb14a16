// key:fill counts the key's light that fill-side panels return to the face. Checked by hand against a numeric
// diffuse-radiance integral: a Lambertian panel re-emits L = ρE/π (Lambertian reflection), and a receptor
// receives ∫ L·cosθe·cosθr / s² dA over the panel (the view-factor integral).
import { describe, expect, it } from 'vitest';
import { type SceneInput, MODIFIERS, beamProfile, candelaSecondsFromGuideNumber, meter } from '../../../calc';
import { FILL_SIDE_MIN_DEG } from '../../../calc/meter';

const subject = { x: 0, y: 0, heightM: 1.6, facingDeg: 0 };
const camera = { x: 3, y: 0, heightM: 1.6, aimDeg: 180, aperture: 8, shutterS: 1 / 200, iso: 100 };
// A clamshell: a point-like key 1.2 m in front and 1 m over the face, aimed at it.
const KEY = { x: 1.2, y: 0, z: 2.6 };
const keyTilt = (-Math.atan2(1, 1.2) * 180) / Math.PI;
const GN = 32;
const key = {
  id: 'key', kind: 'flash', role: 'key', x: KEY.x, y: KEY.y, heightM: KEY.z, aimDeg: 180, tiltDeg: keyTilt,
  output: { type: 'guideNumber', guideNumberM: GN }, modifierOverride: { faceRadiusM: 0 },
} as const;
// A white card under the chin: its lower edge 0.3 m in front of the face at 1.0 m, 0.6 m wide and 0.5 m along
// the card, turned 45° face up towards the face (its front faces −x, towards the subject).
const RHO = 0.8;
const card = (tiltDeg: number) => ({ id: 'card', kind: 'reflector' as const, x1: 0.3, y1: -0.3, x2: 0.3, y2: 0.3, baseM: 1.0, topM: 1.5, tiltDeg, colour: '#ffffff', reflectance: RHO });
const scene = (over: Partial<SceneInput> = {}): SceneInput => ({
  lights: [key],
  surfaces: [card(45)],
  subject,
  camera,
  options: { receptor: 'dome-camera', interreflection: false },
  ...over,
});

/** The key's light the card returns to a flat disc at the face pointed at the card's centre, by brute force. */
function numericReturn(tiltDeg: number, n = 240): number {
  const t = (tiltDeg * Math.PI) / 180;
  // Front normal turned up by the tilt; the card rises from its lower edge along v, leaning back (+x).
  const nrm = [-Math.cos(t), 0, Math.sin(t)];
  const v = [Math.sin(t), 0, Math.cos(t)];
  const len = 0.5;
  const width = 0.6;
  const I = candelaSecondsFromGuideNumber(GN, 250);
  const axis = [-1.2, 0, -1].map((c) => c / Math.hypot(1.2, 1));
  const centre = [0.3 + v[0]! * len / 2, 0, 1.0 + v[2]! * len / 2];
  const toC = [centre[0]! - 0, centre[1]! - 0, centre[2]! - 1.6];
  const rl = Math.hypot(toC[0]!, toC[1]!, toC[2]!);
  const rn = toC.map((c) => c / rl);
  const dA = (len / n) * (width / n);
  let e = 0;
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      const w = ((a + 0.5) / n) * len;
      const y = -0.3 + ((b + 0.5) / n) * width;
      const C = [0.3 + v[0]! * w, y, 1.0 + v[2]! * w];
      // Direct light on the cell: I·p(θ)·cos i / d².
      const L = [KEY.x - C[0]!, KEY.y - C[1]!, KEY.z - C[2]!];
      const d = Math.hypot(L[0]!, L[1]!, L[2]!);
      const cosInc = (L[0]! * nrm[0]! + L[1]! * nrm[1]! + L[2]! * nrm[2]!) / d;
      if (cosInc <= 0) continue;
      const cosOff = -(L[0]! * axis[0]! + L[1]! * axis[1]! + L[2]! * axis[2]!) / d;
      const p = beamProfile(MODIFIERS['bare-reflector'], (Math.acos(Math.min(1, cosOff)) * 180) / Math.PI);
      const E = (I * p * cosInc) / (d * d);
      // Lambertian reflection: luminance ρE/π; to the face's disc: L·cosθe·cosθr/s²·dA.
      const S = [0 - C[0]!, 0 - C[1]!, 1.6 - C[2]!];
      const s = Math.hypot(S[0]!, S[1]!, S[2]!);
      const cosE = (S[0]! * nrm[0]! + S[1]! * nrm[1]! + S[2]! * nrm[2]!) / s;
      const cosR = -(S[0]! * rn[0]! + S[1]! * rn[1]! + S[2]! * rn[2]!) / s;
      if (cosE <= 0 || cosR <= 0) continue;
      e += ((RHO * E) / Math.PI) * ((cosE * cosR) / (s * s)) * dA;
    }
  }
  return e;
}

describe('key:fill and fill-side panels', () => {
  it(`a white card tilted 45° under the chin of a clamshell: its return of the key, pointed at the card, agrees with the Lambertian view-factor integral within 5 %`, () => {
    const m = meter(scene());
    const exact = numericReturn(45);
    expect(m.keyFill.fillPanels.panelIds).toEqual(['card']);
    expect(Math.abs(m.keyFill.fillPanels.luxSeconds / exact - 1)).toBeLessThan(0.05);
    // With no fill light, the card is the whole fill side: key:fill is the key over the card's return.
    expect(m.keyFill.fillIds).toEqual([]);
    expect(m.keyFill.ratio).not.toBeNull();
    expect(m.keyFill.ratioStops!).toBeGreaterThan(1);
    // The key's side is its pointed reading less the card's share of it (the disc pointed at the key sees the
    // card too, obliquely): a little under the pointed reading.
    const keySide = m.keyFill.ratio! * m.keyFill.fillPanels.luxSeconds;
    expect(keySide).toBeLessThan(m.lights[0]!.pointed.luxSeconds);
    expect(keySide).toBeGreaterThan(0.97 * m.lights[0]!.pointed.luxSeconds);
  });

  it('upright, the same card faces the subject with the key behind its back: it returns nothing, and key:fill has no fill', () => {
    const upright = meter(scene({ surfaces: [card(0)] }));
    expect(upright.keyFill.fillPanels.luxSeconds).toBe(0);
    expect(upright.keyFill.ratio).toBeNull();
    // Tilted 30° it starts to catch the key (the key is 50° over the card's plane from its middle).
    expect(meter(scene({ surfaces: [card(30)] })).keyFill.fillPanels.luxSeconds).toBeGreaterThan(0);
  });

  it(`a panel within ${FILL_SIDE_MIN_DEG}° of the key (around the subject) is on the key's side and does not count as fill`, () => {
    // The same card hung beside the key, facing the subject from 20° around.
    const near = { id: 'near', kind: 'reflector' as const, x1: 1.1, y1: -0.2, x2: 1.1, y2: 0.4, baseM: 1.9, topM: 2.5, colour: '#ffffff', reflectance: RHO };
    const m = meter(scene({ surfaces: [near] }));
    expect(m.keyFill.fillPanels).toEqual({ luxSeconds: 0, panelIds: [] });
    expect(m.keyFill.ratio).toBeNull();
  });

  it("the card's return adds to a fill light on the fill side, and leaves the key's side", () => {
    const fill = { id: 'fill', kind: 'flash', role: 'fill', x: 0.3, y: -1.5, heightM: 1.6, aimDeg: 90 - (Math.atan2(0.3, 1.5) * 180) / Math.PI, output: { type: 'guideNumber', guideNumberM: 8 }, modifierOverride: { faceRadiusM: 0 } } as const;
    const withCard = meter(scene({ lights: [key, fill] }));
    const without = meter(scene({ lights: [key, fill], surfaces: [] }));
    const fillPointed = withCard.lights[1]!.pointed.luxSeconds;
    const panel = withCard.keyFill.fillPanels.luxSeconds;
    expect(panel).toBeGreaterThan(0);
    // key / (fill + card), against key / fill without the card.
    expect(withCard.keyFill.ratio! / without.keyFill.ratio!).toBeLessThan(fillPointed / (fillPointed + panel) + 1e-3);
  });
});
