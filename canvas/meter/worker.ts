// The meter's Web Worker: readings and the light map for one document per message, off the UI thread.
// Bundled on its own by scripts/ensure.mjs (esbuild) to dist/workers/meter.js.
import { createLightMapCache } from '../../calc';
import { computeReadings } from '../../model/setupReadings';
import type { MeterJob } from './engine';
import { packReadings } from './transfer';

const cache = createLightMapCache();
const scope = self as unknown as { onmessage: ((e: MessageEvent<{ id: number; job: MeterJob }>) => void) | null; postMessage: (m: unknown, transfer: ArrayBuffer[]) => void };

scope.onmessage = (e) => {
  const { id, job } = e.data;
  const { readings, transfer } = packReadings(computeReadings(job.doc, { stepIndex: job.stepIndex, lightMap: job.lightMap, cache }));
  scope.postMessage({ id, readings }, transfer);
};
