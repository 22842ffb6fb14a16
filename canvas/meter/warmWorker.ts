// The meter's Web Worker started before anything needs it (its script is large: it downloads and evaluates
// while the page does other work), with nothing else imported: a route can start it before the plan screens'
// chunks (which hold the engine, canvas/meter/engine.ts) have arrived. The engine takes it once.

/** Where the built worker is served (scripts/ensure.mjs bundles canvas/meter/worker.ts there), and its name. */
export const METER_WORKER_URL = '/workers/meter.js';
export const METER_WORKER_NAME = 'falloff-meter';

let warm: { worker: Worker; failed: boolean } | null = null;

/** Starts the meter's worker now where there are workers (a page; not tests, not phones). Once until taken. */
export function startMeterWorker() {
  if (warm || typeof Worker === 'undefined' || typeof window === 'undefined') return;
  try {
    const worker = new Worker(METER_WORKER_URL, { type: 'module', name: METER_WORKER_NAME });
    const w = { worker, failed: false };
    // A script that fails to load (a server without the worker bundle) says so before anyone asks it anything:
    // kept, so the engine that takes it computes in the page instead of waiting for an answer.
    worker.onerror = (e) => {
      e.preventDefault?.();
      w.failed = true;
    };
    warm = w;
  } catch {
    warm = null;
  }
}

/** The worker started early, if any (taken: the next call starts nothing and returns null). Throws when it has
 *  already failed, so the caller falls back to the page (canvas/workerClient.ts). */
export function takeMeterWorker(): Worker | null {
  const w = warm;
  warm = null;
  if (!w) return null;
  if (w.failed) {
    w.worker.terminate();
    throw new Error('the meter worker did not start');
  }
  w.worker.onerror = null;
  return w.worker;
}
