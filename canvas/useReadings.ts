// The meter's readings for a plan shown without the editor (the read-only link): computed by the meter's
// engine (canvas/meter/engine.ts: the same Web Worker as the editor's live meter on the web; this thread, after
// the current task, elsewhere), never while rendering, and shown at transition priority, so the plan paints
// first and a reading that arrives while the page is busy never holds up a touch. null until the first
// arrives; after a change of document, the last readings stay until the new ones come.
import { startTransition, useEffect, useRef, useState } from 'react';
import type { SetupDocument } from '../model/document';
import type { Readings } from '../model/setupReadings';
import { defaultEngine, type MeterEngine } from './meter/engine';

export type { Readings } from '../model/setupReadings';

export function useReadings(doc: SetupDocument, opts: { stepIndex?: number; lightMap?: boolean } = {}, makeEngine: () => MeterEngine = defaultEngine): Readings | null {
  const engine = useRef<MeterEngine | null>(null);
  const [readings, setReadings] = useState<Readings | null>(null);
  // One engine (one worker) while the screen is up.
  useEffect(() => {
    const e = makeEngine();
    engine.current = e;
    return () => {
      e.dispose();
      engine.current = null;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  const { stepIndex, lightMap = false } = opts;
  useEffect(() => {
    let current = true;
    void engine.current?.compute({ doc, stepIndex, lightMap }).then((r) => {
      if (current) startTransition(() => setReadings(r));
    });
    return () => {
      current = false;
    };
  }, [doc, stepIndex, lightMap]);
  return readings;
}
