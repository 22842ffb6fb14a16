/**
 * One frame job, as a worker runs it: document-free input in, 8-bit RGBA out. Shared by the browser's Web
 * Worker and the server's worker thread (each wraps it in its own message loop).
 */
import { type FrameLook, applyLook } from './looks';
import { renderFrame } from './render';
import type { FrameInput } from './scene';

export type FrameJob = { id: number; input: FrameInput; width: number; look: FrameLook; latticeStep?: number };
export type FrameJobResult =
  | { id: number; ok: true; width: number; height: number; rgba: Uint8ClampedArray; ms: number; subjectStops: number | null }
  | { id: number; ok: false; message: string };

export function runFrameJob(job: FrameJob): FrameJobResult {
  const t0 = Date.now();
  try {
    const f = renderFrame(job.input, { width: job.width, latticeStep: job.latticeStep });
    const rgba = applyLook(f, job.look);
    return { id: job.id, ok: true, width: f.width, height: f.height, rgba, ms: Date.now() - t0, subjectStops: f.subjectStops };
  } catch (e) {
    return { id: job.id, ok: false, message: e instanceof Error ? e.message : String(e) };
  }
}
