import { describe, expect, it } from 'vitest';
import { exposureAt, prepareField } from '../../../calc/field';
import type { SceneInput } from '../../../calc';

const camera = { x: 3, y: 0, aimDeg: 180, aperture: 8, shutterS: 1 / 200, iso: 100 };
const flash = { id: 'k', kind: 'flash' as const, x: 2, y: 0, heightM: 1.6, aimDeg: 180, output: { type: 'guideNumber' as const, guideNumberM: 32 }, modifierOverride: { faceRadiusM: 0 } };

describe('field: exposure at any receptor', () => {
  it('a point light on a flat receptor facing it follows the inverse-square law (IES cosine/inverse-square law)', () => {
    const f = prepareField({ lights: [flash], subject: { x: 0, y: 0, heightM: 1.6, facingDeg: 0 }, camera, options: { bounce: false } } satisfies SceneInput);
    // GN 32 m at ISO 100 → I·t = GN²·C/100 = 2560 cd·s (ISO 2720 with the guide number's definition); at 2 m: 640 lx·s.
    const e = exposureAt(f, { x: 0, y: 0, z: 1.6, nx: 1, ny: 0, nz: 0, atSubject: true });
    expect(e.lux).toBeCloseTo(640, 6);
    // Channels of a 5500 K flash, luminance-weighted (IEC 61966-2-1 relative luminance), sum back to lux.
    expect(0.2126 * e.rgb[0] + 0.7152 * e.rgb[1] + 0.0722 * e.rgb[2]).toBeCloseTo(640, 6);
  });

  it('the subject body shades the wall behind it, and points beside the shadow stay lit', () => {
    const scene: SceneInput = {
      lights: [flash],
      surfaces: [{ id: 'w', x1: -2, y1: -3, x2: -2, y2: 3, colour: '#808080' }],
      subject: { x: 0, y: 0, heightM: 1.6, facingDeg: 0, body: { widthM: 0.45, depthM: 0.3, topM: 1.75 } },
      camera,
      options: { bounce: false },
    };
    const f = prepareField(scene);
    const inShadow = exposureAt(f, { x: -1.999, y: 0, z: 1.6, nx: 1, ny: 0, nz: 0 });
    const beside = exposureAt(f, { x: -1.999, y: 1.5, z: 1.6, nx: 1, ny: 0, nz: 0 });
    expect(inShadow.lux).toBe(0);
    expect(beside.lux).toBeGreaterThan(0);
  });

  it('a light standing on a wall line lights only the side it points to', () => {
    const scene: SceneInput = {
      lights: [{ ...flash, x: 1, y: 0, aimDeg: 180 }],
      surfaces: [{ id: 'w', x1: 1, y1: -3, x2: 1, y2: 3, colour: '#808080' }],
      subject: { x: 0, y: 0, heightM: 1.6, facingDeg: 0 },
      camera: { ...camera, x: -1, aimDeg: 0 },
      options: { bounce: false },
    };
    const f = prepareField(scene);
    expect(exposureAt(f, { x: 0, y: 0, z: 1.6, nx: 1, ny: 0, nz: 0, atSubject: true }).lux).toBeGreaterThan(0);
    expect(exposureAt(f, { x: 2, y: 0, z: 1.6, nx: -1, ny: 0, nz: 0 }).lux).toBe(0);
  });
});
