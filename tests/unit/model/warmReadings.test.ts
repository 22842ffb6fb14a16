// warmReadings prepares the room's geometry for a first reading split over two tasks (the editor's start): the
// reading after it is the same as one computed cold, for every demo setup and at a step.
import { describe, expect, it } from 'vitest';
import { resetRoomCache } from '../../../calc/room';
import { demoSetups } from '../../../db/seed-setups';
import { parseDocument } from '../../../model/document';
import { computeReadings, warmReadings } from '../../../model/setupReadings';

describe('warmReadings', () => {
  it('changes no reading: warmed then read equals read cold', () => {
    for (const s of demoSetups) {
      const doc = parseDocument(s.document);
      for (const stepIndex of [undefined, 0]) {
        resetRoomCache();
        const cold = computeReadings(doc, { stepIndex });
        resetRoomCache();
        warmReadings(doc, { stepIndex });
        const warmed = computeReadings(doc, { stepIndex });
        expect(warmed.meter, s.title).toEqual(cold.meter);
        expect(warmed.error).toBe(cold.error);
      }
    }
  });

  it('leaves a plan the meter cannot read to computeReadings', () => {
    const doc = parseDocument({ schemaVersion: 1, stage: { widthM: 6, depthM: 5 }, items: [] });
    expect(() => warmReadings(doc)).not.toThrow();
    expect(computeReadings(doc).build.missing.length).toBeGreaterThan(0);
  });
});
