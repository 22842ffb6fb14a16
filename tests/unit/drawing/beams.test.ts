// Beams on the plan and on paper stop at walls and at the stage's edge.
import { describe, expect, it } from 'vitest';
import { beamClipOf, rayReach, sketchBeam, sketchPlan } from '../../../drawing/plan';
import { paperTheme } from '../../../drawing/theme';
import { nodeToSvg } from '../../../drawing/toSvg';
import { parseDocument } from '../../../model/document';
import { demoSetups } from '../../../db/seed-setups';

const stage = { widthM: 8, depthM: 6 };
const pointsOf = (d: string) => [...d.matchAll(/(-?\d+(?:\.\d+)?),(-?\d+(?:\.\d+)?)/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }));

describe('a ray', () => {
  it('stops at the first wall it meets, or the stage edge, or its reach', () => {
    const wall = { a: { x: 5, y: 0 }, b: { x: 5, y: 6 } };
    expect(rayReach(4, 3, 1, 0, 3, { walls: [wall], stage })).toBeCloseTo(1, 9);
    expect(rayReach(4, 3, -1, 0, 3, { walls: [wall], stage })).toBeCloseTo(3, 9);
    expect(rayReach(7, 3, 1, 0, 3, { walls: [], stage })).toBeCloseTo(1, 9); // the stage's right edge
    expect(rayReach(4, 3, 0, 1, 3, { walls: [wall], stage })).toBeCloseTo(3, 9); // parallel to the wall
  });
});

describe('a beam', () => {
  const light = (o: object) =>
    parseDocument({ schemaVersion: demoSetups[0]!.document.schemaVersion, stage, items: [{ id: 'l', kind: 'light', x: 4, y: 3, aimDeg: 0, source: { type: 'strobe', energyWs: 500 }, ...o }], steps: [], shots: [] }).items[0] as never;

  it('aimed at a wall 1 m away ends at the wall, not behind it', () => {
    const clip = { walls: [{ a: { x: 5, y: 0 }, b: { x: 5, y: 6 } }], stage };
    const node = sketchBeam(light({}), clip)!;
    const xs = pointsOf(String(node.attrs.d)).map((p) => p.x);
    expect(Math.max(...xs)).toBeLessThanOrEqual(5 + 1e-9);
    expect(Math.max(...xs)).toBeGreaterThan(4.99);
  });

  it('near the stage edge stays on the stage', () => {
    const node = sketchBeam(light({ x: 7.5, y: 5.5, aimDeg: 45 }), { walls: [], stage })!;
    for (const p of pointsOf(String(node.attrs.d))) {
      expect(p.x).toBeLessThanOrEqual(8 + 1e-9);
      expect(p.y).toBeLessThanOrEqual(6 + 1e-9);
    }
  });

  it('is clipped in the printed plan too', () => {
    const doc = parseDocument({
      schemaVersion: demoSetups[0]!.document.schemaVersion,
      stage,
      items: [
        { id: 'w', kind: 'wall', a: { x: 5, y: 0 }, b: { x: 5, y: 6 } },
        { id: 'l', kind: 'light', x: 4, y: 3, aimDeg: 0, source: { type: 'strobe', energyWs: 500 } },
      ],
      steps: [],
      shots: [],
    });
    expect(beamClipOf(doc).walls).toHaveLength(1);
    const svg = nodeToSvg(sketchPlan(doc, { theme: paperTheme, units: 'metric', pxPerM: 80 }).root);
    const beam = svg.match(/<path d="M4,3 L([^"]+) Z" fill="[^"]+" fill-opacity="0.1"\/>/);
    expect(beam).not.toBeNull();
    for (const p of pointsOf(beam![1]!)) expect(p.x).toBeLessThanOrEqual(5 + 1e-9);
  });

  it('is the plan view of a tilted beam: shorter for a steep tilt, no fan for a flash turned straight up to bounce', () => {
    const far = (o: object) => Math.max(...pointsOf(String(sketchBeam(light(o), { walls: [], stage })!.attrs.d)).map((p) => Math.hypot(p.x - 4, p.y - 3)));
    expect(far({ tiltDeg: 0 })).toBeCloseTo(3, 2); // points are written to the millimetre
    expect(far({ tiltDeg: -60 })).toBeCloseTo(1.5, 2); // 3 m × cos 60°
    expect(sketchBeam(light({ tiltDeg: 90 }), { walls: [], stage })).toBeNull();
    expect(sketchBeam(light({ tiltDeg: 90 }))).toBeNull();
  });
});
