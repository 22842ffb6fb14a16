// What the exports keep between requests: the worker thread's light-map cache (server/export/readings.ts) must
// give exactly what a fresh computation gives, whatever setups it saw before; the crew sheet's frame
// (server/export/sheetFrames.ts) is rendered once per document and kept as a JPEG, a changed document renders
// again, and a plan with nothing to frame keeps nothing.
import { afterAll, describe, expect, it } from 'vitest';
import { parseDocument, type SetupDocument } from '../../../model/document';
import { computeReadings } from '../../../model/setupReadings';
import { exportReadings } from '../../../server/export/readings';
import { cachedSheetFrame, forgetSheetFrames, keptFrames } from '../../../server/export/sheetFrames';
import { closePool } from '../../../server/pool';

const studio = (keyX: number, wallColour = '#808080'): SetupDocument =>
  parseDocument({
    schemaVersion: 1,
    stage: { widthM: 6, depthM: 5 },
    items: [
      { id: 'wall', kind: 'wall', surface: 'seamless', a: { x: 1, y: 0.6 }, b: { x: 5, y: 0.6 }, heightM: 2.7, colour: wallColour },
      { id: 'sub', kind: 'subject', x: 3, y: 2.2, facingDeg: 90 },
      { id: 'cam', kind: 'camera', x: 3, y: 4.4, aimDeg: -90, aperture: 8, shutterS: 1 / 160 },
      { id: 'key', kind: 'light', x: keyX, y: 3.2, aimDeg: -120, source: { type: 'strobe', energyWs: 400 }, power: 1 / 4, modifier: 'octa' },
      { id: 'rim', kind: 'light', x: 4.6, y: 1.2, aimDeg: 150, source: { type: 'strobe', energyWs: 400 }, power: 1 / 16, modifier: 'strip' },
    ],
  });

const mapOf = (doc: SetupDocument) => {
  const m = exportReadings(doc).map!;
  return { stops: Array.from(m.stops), contours: JSON.stringify(m.contours ?? null), nx: m.nx, ny: m.ny };
};
const freshMapOf = (doc: SetupDocument) => {
  const m = computeReadings(doc, { lightMap: true }).map!;
  return { stops: Array.from(m.stops), contours: JSON.stringify(m.contours ?? null), nx: m.nx, ny: m.ny };
};

describe("the export thread's light map", () => {
  it('equals a fresh computation after other documents went through it', () => {
    const a = studio(3.6);
    const moved = studio(2.2); // one light moved
    const darker = studio(3.6, '#202020'); // the room changed, every light with it
    for (const doc of [a, moved, a, darker, a]) expect(mapOf(doc)).toEqual(freshMapOf(doc));
    // And the documents really differ (a cache answering with the last map would fail above).
    expect(freshMapOf(moved).stops).not.toEqual(freshMapOf(a).stops);
  }, 120_000);
});

describe("the crew sheet's frame", () => {
  afterAll(async () => {
    forgetSheetFrames();
    await closePool();
  });

  it('is rendered once per document, kept as a JPEG, and rendered again for a changed one', async () => {
    forgetSheetFrames();
    const doc = studio(3.6);
    const first = await cachedSheetFrame(doc);
    expect(first?.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff])); // JPEG
    // The same document (another copy of it, as a second request parses it again): the kept bytes.
    const again = await cachedSheetFrame(structuredClone(doc));
    expect(again).toBe(first);
    expect(keptFrames()).toBe(1);
    const changed = await cachedSheetFrame(studio(2.2));
    expect(changed).not.toBe(first);
    expect(changed!.equals(first!)).toBe(false);
    expect(keptFrames()).toBe(2);
  }, 120_000);

  it('keeps nothing for a plan with no subject', async () => {
    forgetSheetFrames();
    const bare = parseDocument({ schemaVersion: 1, stage: { widthM: 4, depthM: 4 }, items: [] });
    expect(await cachedSheetFrame(bare)).toBeUndefined();
    await new Promise((r) => setTimeout(r, 0));
    expect(keptFrames()).toBe(0);
  }, 60_000);
});
