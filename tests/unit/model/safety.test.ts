import { describe, expect, it } from 'vitest';
import { parseDocument } from '../../../model/document';
import { CIRCUIT_WARN_W, STANDING_CAUTIONS, planCautions } from '../../../model/safety';

const lamp = (id: string, watts: number, extra: Record<string, unknown> = {}) => ({
  id, kind: 'light', x: 1, y: 1, source: { type: 'continuous', lamp: 'tungsten', lumens: 10000, watts, kelvin: 3200 }, ...extra,
});
const doc = (items: unknown[]) => parseDocument({ schemaVersion: 1, stage: { widthM: 5, depthM: 5 }, items });

describe('plan cautions', () => {
  it('warns when continuous watts pass one circuit', () => {
    expect(planCautions(doc([lamp('a', 650), lamp('b', 650)])).map((c) => c.code)).not.toContain('circuit-load');
    expect(planCautions(doc([lamp('a', 1000), lamp('b', 1000)])).map((c) => c.code)).toContain('circuit-load');
    expect(CIRCUIT_WARN_W).toBeLessThan(2000);
  });
  it('warns about a gel on a hot tungsten lamp', () => {
    expect(planCautions(doc([lamp('a', 300, { gel: 'full-ctb' })]))[0]).toMatchObject({ code: 'hot-gel', itemId: 'a' });
  });
  it('warns about a boom with no sandbag noted, and not when it has one', () => {
    const boom = { id: 'k', kind: 'light', x: 1, y: 1, source: { type: 'strobe', energyWs: 500 }, stand: 'boom' };
    expect(planCautions(doc([{ ...boom, sandbagged: false }])).map((c) => c.code)).toEqual(['boom-no-sandbag']);
    expect(planCautions(doc([{ ...boom, sandbagged: true }]))).toEqual([]);
  });
  it('always defers to local codes on the crew sheet', () => {
    expect(STANDING_CAUTIONS.some((s) => /local electrical and venue codes/.test(s))).toBe(true);
  });
});
