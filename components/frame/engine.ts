// Where the frame is rendered: in a Web Worker on the web (a drag never waits for the picture), else in this
// thread after the current task (native, component tests, or a web build without the worker file). A job is a
// frame input in, an image out; the worker keeps the last rendered frame of each quality so a change of look
// (black and white, clipping, stops) re-applies the look without rendering again.
import type { FrameJob, FrameJobResult } from '../../calc/frame/job';
import type { FrameLook } from '../../calc/frame/looks';
import type { FrameInput } from '../../calc/frame/scene';
import { inlineClient, workerClient } from '../../canvas/workerClient';

/** Where the built worker is served (scripts/ensure.mjs bundles components/frame/frame.worker.ts there). */
const FRAME_WORKER_URL = '/workers/frame.js';

export type FrameRequest = { version: number; quality: 'coarse' | 'refined'; input: FrameInput; width: number; look: FrameLook; latticeStep: number };
export type FrameImage = { version: number; quality: 'coarse' | 'refined'; width: number; height: number; ms: number; uri: string | null; rgba: Uint8ClampedArray | null };
export type FrameEngine = { render(r: FrameRequest): Promise<FrameImage | { error: string }>; dispose(): void; readonly kind: 'worker' | 'inline' };

/** Message to the worker: a job plus its version and quality. */
export type FrameWorkerMessage = FrameRequest & { id: number };
export type FrameWorkerReply = { id: number; version: number; quality: 'coarse' | 'refined'; result: FrameJobResult; blob: Blob | null };

function toImage(r: FrameRequest, res: FrameJobResult, blob: Blob | null): FrameImage | { error: string } {
  if (!res.ok) return { error: res.message };
  let uri: string | null = null;
  if (blob && typeof URL !== 'undefined' && URL.createObjectURL) uri = URL.createObjectURL(blob);
  else if (typeof document !== 'undefined') {
    const c = document.createElement('canvas');
    c.width = res.width;
    c.height = res.height;
    const g = c.getContext('2d');
    if (g) {
      g.putImageData(new ImageData(new Uint8ClampedArray(res.rgba), res.width, res.height), 0, 0);
      uri = c.toDataURL('image/png');
    }
  }
  return { version: r.version, quality: r.quality, width: res.width, height: res.height, ms: res.ms, uri, rgba: uri ? null : res.rgba };
}

// The renderer is loaded only when this thread renders (no worker: phones, tests, a worker that failed): on
// the web it is a chunk of its own (scripts/chunkTiers.cjs), so the pages that show a frame do not download it.
const renderInline = async (r: FrameRequest): Promise<FrameImage | { error: string }> => {
  const { runFrameJob } = await import('../../calc/frame/job');
  const job: FrameJob = { id: 0, input: r.input, width: r.width, look: r.look, latticeStep: r.latticeStep };
  return toImage(r, runFrameJob(job), null);
};

function inlineFrameEngine(): FrameEngine {
  const c = inlineClient(renderInline);
  return { kind: 'inline', render: c.run, dispose: c.dispose };
}

function workerFrameEngine(url = FRAME_WORKER_URL): FrameEngine {
  // The page's worker client (canvas/workerClient.ts): waiting requests, fallback to rendering in the page.
  const c = workerClient<FrameRequest, FrameImage | { error: string }, FrameWorkerReply>({
    url,
    name: 'falloff-frame',
    inline: renderInline,
    toMessage: (req, id) => ({ ...req, id }) satisfies FrameWorkerMessage,
    replyId: (r) => r.id,
    fromReply: (r, req) => toImage(req, r.result, r.blob),
  });
  return {
    get kind() {
      return c.kind;
    },
    render: c.run,
    dispose: c.dispose,
  };
}

export function defaultFrameEngine(): FrameEngine {
  return typeof Worker !== 'undefined' && typeof window !== 'undefined' ? workerFrameEngine() : inlineFrameEngine();
}
