// The frame's Web Worker: renders off the UI thread and encodes the picture here too (OffscreenCanvas → PNG
// blob) so the page only shows it. Bundled on its own by scripts/ensure.mjs (esbuild) to dist/workers/frame.js.
import { applyLook } from '../../calc/frame/looks';
import { type FrameResult, renderFrame } from '../../calc/frame/render';
import type { FrameWorkerMessage, FrameWorkerReply } from './engine';

const scope = self as unknown as { onmessage: ((e: MessageEvent<FrameWorkerMessage>) => void) | null; postMessage: (m: unknown, t?: Transferable[]) => void };
/** The last frame of each quality, by version: a new look on the same version is not rendered again. */
const last = new Map<string, { version: number; frame: FrameResult }>();

scope.onmessage = async (e) => {
  const m = e.data;
  const t0 = performance.now();
  try {
    const hit = last.get(m.quality);
    const frame = hit && hit.version === m.version && hit.frame.width === m.width ? hit.frame : renderFrame(m.input, { width: m.width, latticeStep: m.latticeStep });
    last.set(m.quality, { version: m.version, frame });
    const rgba = applyLook(frame, m.look);
    let blob: Blob | null = null;
    if (typeof OffscreenCanvas !== 'undefined') {
      const c = new OffscreenCanvas(frame.width, frame.height);
      const g = c.getContext('2d');
      if (g) {
        g.putImageData(new ImageData(rgba, frame.width, frame.height), 0, 0);
        blob = await c.convertToBlob({ type: 'image/png' });
      }
    }
    const reply: FrameWorkerReply = {
      id: m.id,
      version: m.version,
      quality: m.quality,
      result: { id: m.id, ok: true, width: frame.width, height: frame.height, rgba: blob ? new Uint8ClampedArray(0) : rgba, ms: performance.now() - t0, subjectStops: frame.subjectStops },
      blob,
    };
    scope.postMessage(reply);
  } catch (err) {
    scope.postMessage({ id: m.id, version: m.version, quality: m.quality, result: { id: m.id, ok: false, message: err instanceof Error ? err.message : String(err) }, blob: null } satisfies FrameWorkerReply);
  }
};
