// The meter's readings for a setup document: the one call the editor, the server's /meter route, the crew
// sheet and the lesson player make. The physics is all in calc/.
import { createLightMapCache, meterParsed, parseScene, warmRoomCache, type LightMapCache, type LightMapResult, type MeterResult } from '../calc';
import type { SetupDocument } from './document';
import { sceneFromDocument, type SceneBuild } from './documentToScene';

export type Readings = { build: SceneBuild; meter: MeterResult | null; map: LightMapResult | null; error: string | null };

/** Light-map resolution: points along the stage's longer side. */
export const MAP_POINTS = 112;

export function mapGridFor(stage: SetupDocument['stage']) {
  const long = Math.max(stage.widthM, stage.depthM);
  const step = long / (MAP_POINTS - 1);
  return {
    x0: 0,
    y0: 0,
    x1: stage.widthM,
    y1: stage.depthM,
    nx: Math.max(2, Math.round(stage.widthM / step) + 1),
    ny: Math.max(2, Math.round(stage.depthM / step) + 1),
  };
}

/** What a screen shows while its readings are still being computed (hooks that compute off the main thread). */
export const readingsPending: Readings = {
  build: { scene: null, missing: [], assumedCamera: false },
  meter: null,
  map: null,
  error: 'the meter is still reading the plan',
};

/** Prepares what a cold computeReadings(doc) spends most of its time on (the room's geometry, kept in calc's
 *  room cache), so the reading itself, asked next, is short: a caller that must not hold its thread long splits
 *  a first reading in two tasks. Changes no result; a plan the meter cannot read is left to computeReadings. */
export function warmReadings(doc: SetupDocument, opts: { stepIndex?: number } = {}): void {
  try {
    const build = sceneFromDocument(doc, { stepIndex: opts.stepIndex });
    if (build.scene) warmRoomCache(parseScene(build.scene));
  } catch {
    // computeReadings says what is wrong.
  }
}

export function computeReadings(doc: SetupDocument, opts: { stepIndex?: number; lightMap?: boolean; cache?: LightMapCache } = {}): Readings {
  const build = sceneFromDocument(doc, { stepIndex: opts.stepIndex });
  if (!build.scene) return { build, meter: null, map: null, error: build.error ?? null };
  try {
    const scene = parseScene(build.scene);
    const m = meterParsed(scene);
    const map = opts.lightMap && scene.lights.length ? (opts.cache ?? createLightMapCache()).updateParsed(scene, mapGridFor(doc.stage)) : null;
    return { build, meter: m, map, error: null };
  } catch (e) {
    // A plan the meter cannot read (a value out of its range) must not take the caller down.
    return { build, meter: null, map: null, error: e instanceof Error ? e.message : String(e) };
  }
}
