// The meter's readings and light map for an export, on the worker thread that makes it. Each thread keeps one
// light-map cache (calc/lightmap.ts): a plan drawn again (a crew sheet downloaded twice, its plan PNG, the next
// version with one light moved) reuses the room's geometry and every light that did not change, instead of
// computing the whole map again. The cache checks its own keys (room geometry, grid, each light), so a
// different setup on the same thread simply rebuilds it; a task runs alone on its thread, so nothing shares it
// mid-update.
import { createLightMapCache } from '../../calc';
import type { SetupDocument } from '../../model/document';
import { computeReadings, type Readings } from '../../model/setupReadings';

let cache = createLightMapCache();

/** Readings with the light map, for the crew sheet and the plan images. */
export function exportReadings(doc: SetupDocument): Readings {
  return computeReadings(doc, { lightMap: true, cache });
}

/** Forget what the thread's cache holds (the bench's cold runs). */
export function resetExportReadings() {
  cache = createLightMapCache();
}
