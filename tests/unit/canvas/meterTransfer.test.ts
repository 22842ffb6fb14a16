// The worker's packed readings (canvas/meter/transfer.ts) come back as the readings it computed: the light map's
// contour lines unpacked on first read, equal to the calc's, and the rest untouched.
import { describe, expect, it } from 'vitest';
import { computeReadings } from '../../../model/setupReadings';
import { createLightMapCache } from '../../../calc';
import { packReadings, unpackReadings } from '../../../canvas/meter/transfer';
import { demoSetups } from '../../../db/seed-setups';

describe('the meter worker packs its readings', () => {
  const doc = demoSetups.find((d) => d.title.startsWith('Twin rims'))!.document;
  const readings = computeReadings(doc, { lightMap: true, cache: createLightMapCache() });

  it('sends the contour lines as one Float64Array a line, transferred, and no [x, y] objects', () => {
    const { readings: packed, transfer } = packReadings(readings);
    const lines = readings.map!.contours.flatMap((l) => l.lines);
    expect(lines.length).toBeGreaterThan(0);
    expect(transfer).toHaveLength(lines.length);
    expect(packed.map).not.toHaveProperty('contours');
    expect(packed.map!.packedContours.flatMap((l) => l.lines).every((a) => a instanceof Float64Array)).toBe(true);
  });

  it('comes back through a structured clone as the same readings', () => {
    const { readings: packed, transfer } = packReadings(readings);
    const copy = structuredClone(packed, { transfer });
    const back = unpackReadings(copy);
    expect(back.map!.contours).toEqual(readings.map!.contours);
    expect(back.map!.contourPaths).toEqual(readings.map!.contourPaths);
    expect(Array.from(back.map!.stops)).toEqual(Array.from(readings.map!.stops));
    expect(back.meter).toEqual(readings.meter);
    expect(back.build).toEqual(readings.build);
    // Unpacked once: the second read is the same array.
    expect(back.map!.contours).toBe(back.map!.contours);
  });

  it('passes readings without a map through', () => {
    const plain = computeReadings(doc, { lightMap: false });
    const { readings: packed, transfer } = packReadings(plain);
    expect(transfer).toEqual([]);
    expect(unpackReadings(structuredClone(packed))).toEqual(plain);
  });
});
