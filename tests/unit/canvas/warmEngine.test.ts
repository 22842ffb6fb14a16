// The meter's warm worker (canvas/meter/warmWorker.ts, through canvas/meter/engine.ts): started early where there
// are workers, taken by the next defaultEngine() call, once; one that failed to load makes the engine compute in
// the page.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { defaultEngine, warmMeterEngine } from '../../../canvas/meter/engine';
import { startMeterWorker } from '../../../canvas/meter/warmWorker';
import { demoSetups } from '../../../db/seed-setups';
import { parseDocument } from '../../../model/document';
import { computeReadings } from '../../../model/setupReadings';

afterEach(() => vi.unstubAllGlobals());

describe('the meter’s warm engine', () => {
  it('starts one worker early and hands it to the next engine asked for', () => {
    const made: string[] = [];
    vi.stubGlobal('window', {});
    vi.stubGlobal(
      'Worker',
      class {
        onmessage: unknown = null;
        onerror: unknown = null;
        constructor(url: string) {
          made.push(url);
        }
        postMessage() {}
        terminate() {}
      },
    );
    warmMeterEngine();
    warmMeterEngine();
    expect(made).toEqual(['/workers/meter.js']);
    const first = defaultEngine();
    expect(first.kind).toBe('worker');
    expect(made).toHaveLength(1);
    // Taken: the next engine is a worker of its own.
    defaultEngine();
    expect(made).toHaveLength(2);
    first.dispose();
  });

  it('an early worker that failed to start before it was taken: the engine computes in the page', async () => {
    const made: { onerror: ((e: { preventDefault(): void }) => void) | null; terminated: boolean }[] = [];
    vi.stubGlobal('window', {});
    vi.stubGlobal(
      'Worker',
      class {
        onmessage: unknown = null;
        onerror: ((e: { preventDefault(): void }) => void) | null = null;
        terminated = false;
        constructor() {
          made.push(this);
        }
        postMessage() {
          throw new Error('a failed worker is never asked');
        }
        terminate() {
          this.terminated = true;
        }
      },
    );
    startMeterWorker();
    made[0]!.onerror!({ preventDefault() {} });
    const engine = defaultEngine();
    expect(engine.kind).toBe('inline');
    expect(made[0]!.terminated).toBe(true);
    const doc = parseDocument(demoSetups[0]!.document);
    const r = await engine.compute({ doc, lightMap: false });
    expect(r.meter?.subject.aperture).toBe(computeReadings(doc).meter!.subject.aperture);
    engine.dispose();
  });

  it('does nothing where there are no workers', () => {
    warmMeterEngine();
    expect(defaultEngine().kind).toBe('inline');
  });
});
