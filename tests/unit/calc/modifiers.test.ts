import { describe, expect, it } from 'vitest';
import { beamProfile, beamSolidAngleSr, GEL_IDS, GELS, MODIFIER_IDS, MODIFIERS } from '../../../calc';
import { lookupProfile, profileLut } from '../../../calc/modifiers';

describe('modifier and gel tables (defaults from memory)', () => {
  it('every modifier has a label, a positive beam, a softness in 0–1 and a non-negative loss', () => {
    for (const id of MODIFIER_IDS) {
      const m = MODIFIERS[id];
      expect(m.label.length).toBeGreaterThan(0);
      expect(m.halfAngleDeg).toBeGreaterThan(0);
      expect(m.edgeSoftness).toBeGreaterThanOrEqual(0);
      expect(m.edgeSoftness).toBeLessThanOrEqual(1);
      expect(m.lossStops).toBeGreaterThanOrEqual(0);
    }
  });
  it('grids are named by their full beam angle: halfAngleDeg is half of it', () => {
    for (const deg of [10, 20, 30, 40] as const) expect(MODIFIERS[`grid-${deg}`].halfAngleDeg).toBe(deg / 2);
  });
  it('gels use plain trade names; CTO warms (positive mired), CTB cools, fractions are ordered', () => {
    expect(GELS['full-cto'].label).toBe('full CTO');
    expect(GELS['half-ctb'].label).toBe('half CTB');
    expect(GELS['plus-green'].label).toBe('plus green');
    expect(GELS['full-cto'].miredShift).toBeGreaterThan(GELS['half-cto'].miredShift);
    expect(GELS['half-cto'].miredShift).toBeGreaterThan(GELS['quarter-cto'].miredShift);
    expect(GELS['full-ctb'].miredShift).toBeLessThan(GELS['half-ctb'].miredShift);
    for (const id of GEL_IDS) expect(GELS[id].lossStops).toBeGreaterThanOrEqual(0);
    // ND n: n / 0.3 stops (density 0.3 ≈ log10 2)
    expect(GELS['nd-0.6'].lossStops).toBeCloseTo(0.6 / Math.log10(2), 0);
  });
});

describe('beam profile', () => {
  const specs = MODIFIER_IDS.map((id) => [id, MODIFIERS[id]] as const);
  it.each(specs)('%s: 1 on axis, one stop down at halfAngleDeg, never rising off axis', (_id, spec) => {
    expect(beamProfile(spec, 0)).toBe(1);
    expect(beamProfile(spec, spec.halfAngleDeg)).toBeCloseTo(0.5, 12);
    let prev = 1;
    for (let a = 0; a <= 180; a += 0.5) {
      const p = beamProfile(spec, a);
      expect(p).toBeLessThanOrEqual(prev + 1e-12);
      prev = p;
    }
  });
  it.each(specs)('%s: the lookup table agrees with the formula within 1 % of the axis value', (_id, spec) => {
    const lut = profileLut(spec);
    for (let a = 0; a < 180; a += 0.37) {
      const c = Math.cos((a * Math.PI) / 180);
      expect(Math.abs(lookupProfile(lut, c) - beamProfile(spec, a))).toBeLessThan(0.01);
    }
  });
  it('solid angle of a hard-edged cone of half-angle θ is close to 2π(1 − cos θ)', () => {
    const spec = { halfAngleDeg: 30, edgeSoftness: 0, backSpill: 0 };
    expect(beamSolidAngleSr(spec) / (2 * Math.PI * (1 - Math.cos(Math.PI / 6)))).toBeCloseTo(1, 1);
    // isotropic: profile 1 everywhere (half angle huge, full back spill) → 4π
    expect(beamSolidAngleSr({ halfAngleDeg: 1e6, edgeSoftness: 0, backSpill: 1 })).toBeCloseTo(4 * Math.PI, 3);
  });
  it('harder edges fall off faster past the half angle', () => {
    const soft = beamProfile({ halfAngleDeg: 20, edgeSoftness: 1, backSpill: 0 }, 30);
    const hard = beamProfile({ halfAngleDeg: 20, edgeSoftness: 0, backSpill: 0 }, 30);
    expect(hard).toBeLessThan(soft);
  });
});
