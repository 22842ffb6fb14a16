// Progressive frame rendering for a document: a coarse picture at once for every change (only the newest
// waits while one renders, so a drag gets as many as the worker can make), and a refined one once the changes
// stop for REFINE_AFTER_MS. Results older than what is shown are dropped.
import { useEffect, useMemo, useRef, useState } from 'react';
import type { FrameLook } from '../../calc/frame/looks';
import type { SetupDocument } from '../../model/document';
import { frameInputFromDocument } from '../../model/frame';
import { type FrameEngine, type FrameImage, type FrameRequest, defaultFrameEngine } from './engine';

const COARSE_WIDTH = 128;
export const COARSE_LATTICE_STEP = 8;
export const REFINED_LATTICE_STEP = 8;
const REFINE_AFTER_MS = 160;

export type FrameState = { image: FrameImage | null; missing: string[]; error: string | null; coarseMs: number | null; refinedMs: number | null };

export function useFrame(doc: SetupDocument, o: { stepIndex?: number; width: number; look: FrameLook; engine?: FrameEngine }): FrameState {
  const engineRef = useRef<FrameEngine | null>(null);
  engineRef.current ??= o.engine ?? defaultFrameEngine();
  useEffect(() => () => engineRef.current?.dispose(), []);

  const build = useMemo(() => frameInputFromDocument(doc, { stepIndex: o.stepIndex }), [doc, o.stepIndex]);
  const version = useRef(0);
  const inputVersion = useMemo(() => ++version.current, [build]); // eslint-disable-line react-hooks/exhaustive-deps
  const [state, setState] = useState<FrameState>({ image: null, missing: [], error: null, coarseMs: null, refinedMs: null });
  const busy = useRef(false);
  const queued = useRef<FrameRequest | null>(null);
  const shown = useRef<{ version: number; quality: 'coarse' | 'refined' } | null>(null);
  const { width, look } = o;
  const lookKey = `${look.mono ? 1 : 0}${look.clipping ? 1 : 0}${look.contours ? 1 : 0}`;

  useEffect(() => {
    if (!build.input) {
      setState((s) => ({ ...s, image: null, missing: build.missing }));
      return;
    }
    const input = build.input;
    const run = (req: FrameRequest) => {
      if (busy.current) {
        // Keep only the newest request of the kind asked last; a refined request replaces a coarse one.
        if (!queued.current || req.quality === 'refined' || queued.current.quality === 'coarse') queued.current = req;
        return;
      }
      busy.current = true;
      void engineRef.current!.render(req).then((img) => {
        busy.current = false;
        if ('error' in img) setState((s) => ({ ...s, error: img.error }));
        else {
          const cur = shown.current;
          const stale = cur && (img.version < cur.version || (img.version === cur.version && cur.quality === 'refined' && img.quality === 'coarse'));
          if (!stale) {
            shown.current = { version: img.version, quality: img.quality };
            setState((s) => {
              if (s.image?.uri && s.image.uri.startsWith('blob:') && typeof URL !== 'undefined') URL.revokeObjectURL(s.image.uri);
              return { image: img, missing: [], error: null, coarseMs: img.quality === 'coarse' ? img.ms : s.coarseMs, refinedMs: img.quality === 'refined' ? img.ms : s.refinedMs };
            });
          }
        }
        const next = queued.current;
        queued.current = null;
        if (next) run(next);
      });
    };
    run({ version: inputVersion, quality: 'coarse', input, width: Math.min(width, COARSE_WIDTH), look, latticeStep: COARSE_LATTICE_STEP });
    const t = setTimeout(() => run({ version: inputVersion, quality: 'refined', input, width, look, latticeStep: REFINED_LATTICE_STEP }), REFINE_AFTER_MS);
    return () => clearTimeout(t);
  }, [build, inputVersion, width, lookKey]); // eslint-disable-line react-hooks/exhaustive-deps

  return state;
}
