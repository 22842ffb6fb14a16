// The view onto the plan: fitting, zooming about a point (pinch and wheel), panning, the scale bar.
import { describe, expect, it } from 'vitest';
import { MAX_SCALE, MIN_SCALE, fitStage, panBy, scaleBarLength, toPlan, toScreen, zoomAt } from '../../../canvas/editor/camera';

describe('camera', () => {
  it('fits the stage with its margin inside the box, centred', () => {
    const v = fitStage({ widthM: 8, depthM: 6 }, 920, 720, 0.6);
    expect(v.scale).toBeCloseTo(Math.min(920 / 9.2, 720 / 7.2));
    const c = toScreen(v, { x: 4, y: 3 });
    expect(c.x).toBeCloseTo(460);
    expect(c.y).toBeCloseTo(360);
  });

  it('zooming keeps the plan point under the fingers where it was', () => {
    const v = { scale: 50, tx: 10, ty: 20 };
    const under = toPlan(v, 300, 200);
    const z = zoomAt(v, 1.8, 300, 200);
    expect(z.scale).toBeCloseTo(90);
    const after = toPlan(z, 300, 200);
    expect(after.x).toBeCloseTo(under.x, 9);
    expect(after.y).toBeCloseTo(under.y, 9);
  });

  it('clamps the zoom', () => {
    expect(zoomAt({ scale: 50, tx: 0, ty: 0 }, 1000, 0, 0).scale).toBe(MAX_SCALE);
    expect(zoomAt({ scale: 50, tx: 0, ty: 0 }, 0.0001, 0, 0).scale).toBe(MIN_SCALE);
  });

  it('pans by screen pixels', () => {
    expect(panBy({ scale: 50, tx: 1, ty: 2 }, 10, -5)).toEqual({ scale: 50, tx: 11, ty: -3 });
  });

  it('picks a round scale-bar length near the target width', () => {
    expect(scaleBarLength(80, 1, 100)).toBe(1); // 100 px ≈ 1.25 m → 1 m
    expect(scaleBarLength(20, 1, 100)).toBe(5);
    expect(scaleBarLength(300, 1, 100)).toBeCloseTo(0.5);
    expect(scaleBarLength(80, 0.3048, 100)).toBe(5); // feet: 100 px ≈ 4.1 ft → 5 ft
  });
});

describe('a pinch', () => {
  it('keeps the plan point first under the fingers under them as they spread and move', async () => {
    const { pinchCamera } = await import('../../../canvas/editor/camera');
    const start = { scale: 42, tx: 20, ty: 60 };
    const focal0 = { x: 195, y: 300 };
    const under = toPlan(start, focal0.x, focal0.y);
    // The fingers spread to twice the distance and their midpoint drifts 40 px right and 25 px up.
    const now = pinchCamera(start, focal0, 2, { x: 235, y: 275 });
    expect(now.scale).toBeCloseTo(84, 9);
    const p = toScreen(now, under);
    expect(p.x).toBeCloseTo(235, 9);
    expect(p.y).toBeCloseTo(275, 9);
    // The old way (zooming the start view about the fingers' current midpoint) lets the point drift away.
    const old = zoomAt(start, 2, 235, 275);
    const q = toScreen(old, under);
    expect(Math.hypot(q.x - 235, q.y - 275)).toBeGreaterThan(40);
  });

  it('still clamps the zoom, keeping the point under the fingers', async () => {
    const { pinchCamera } = await import('../../../canvas/editor/camera');
    const now = pinchCamera({ scale: 500, tx: 0, ty: 0 }, { x: 100, y: 100 }, 10, { x: 100, y: 100 });
    expect(now.scale).toBe(MAX_SCALE);
    expect(toScreen(now, { x: 0.2, y: 0.2 })).toEqual({ x: 100, y: 100 });
  });
});
