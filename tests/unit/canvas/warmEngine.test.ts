// The meter's warm engine (canvas/meter/engine.ts): started early where there are workers, taken by the next
// defaultEngine() call, once.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { defaultEngine, warmMeterEngine } from '../../../canvas/meter/engine';

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

  it('does nothing where there are no workers', () => {
    warmMeterEngine();
    expect(defaultEngine().kind).toBe('inline');
  });
});
