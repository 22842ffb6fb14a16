// Where the meter's readings are computed: in a Web Worker on the web (the drag never waits for the physics),
// else in this thread after the current task (native, tests, or a web build without the worker file).
// Either way a job is one document in, readings out, and the light map's per-light cache lives with the
// engine between jobs.
import { createLightMapCache } from '../../calc';
import type { SetupDocument } from '../../model/document';
import { computeReadings, type Readings } from '../../model/setupReadings';
import { inlineClient, workerClient } from '../workerClient';
import { unpackReadings, type PackedReadings } from './transfer';
import { METER_WORKER_NAME, METER_WORKER_URL, startMeterWorker, takeMeterWorker } from './warmWorker';

export type MeterJob = { doc: SetupDocument; stepIndex?: number; lightMap: boolean };
export type MeterEngine = { compute(job: MeterJob): Promise<Readings>; dispose(): void; readonly kind: 'worker' | 'inline' };


function inlineEngine(): MeterEngine {
  const cache = createLightMapCache();
  const c = inlineClient((job: MeterJob) => computeReadings(job.doc, { stepIndex: job.stepIndex, lightMap: job.lightMap, cache }));
  return { kind: 'inline', compute: c.run, dispose: c.dispose };
}

type Reply = { id: number; readings: PackedReadings };

/** A worker engine, falling back to computing in the page if the worker cannot start (say, the dev server,
 *  which does not serve the worker bundle). It takes the worker started early (warmWorker.ts) if there is one. */
function workerEngine(): MeterEngine {
  const cache = createLightMapCache();
  const c = workerClient<MeterJob, Readings, Reply>({
    url: METER_WORKER_URL,
    name: METER_WORKER_NAME,
    create: (url, name) => takeMeterWorker() ?? new Worker(url, { type: 'module', name }),
    inline: (job) => computeReadings(job.doc, { stepIndex: job.stepIndex, lightMap: job.lightMap, cache }),
    toMessage: (job, id) => ({ id, job }),
    replyId: (r) => r.id,
    fromReply: (r) => unpackReadings(r.readings),
  });
  return {
    get kind() {
      return c.kind;
    },
    compute: c.run,
    dispose: c.dispose,
  };
}

/** Starts the meter's worker now, where there are workers, so its script downloads and evaluates while the page
 *  does other work (the read-only link's screen, before its setup has arrived; the editor's route, while its
 *  chunks and setup download); the next defaultEngine() takes it. */
export function warmMeterEngine() {
  startMeterWorker();
}

export function defaultEngine(): MeterEngine {
  return typeof Worker !== 'undefined' && typeof window !== 'undefined' ? workerEngine() : inlineEngine();
}
