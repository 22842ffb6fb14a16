// The meter's readings for the plan on screen: recomputed when the document changes, with the light map's
// per-light cache kept between drag frames.
import { useMemo, useRef } from 'react';
import { createLightMapCache, type LightMapCache } from '../calc';
import type { SetupDocument } from '../model/document';
import { computeReadings, type Readings } from '../model/setupReadings';

export type { Readings } from '../model/setupReadings';

export function useReadings(doc: SetupDocument, opts: { stepIndex?: number; lightMap?: boolean } = {}): Readings {
  const cache = useRef<LightMapCache | null>(null);
  cache.current ??= createLightMapCache();
  return useMemo(
    () => computeReadings(doc, { ...opts, cache: cache.current! }),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [doc, opts.stepIndex, opts.lightMap],
  );
}
