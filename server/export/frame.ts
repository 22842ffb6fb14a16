// The frame as a PNG for the server (GET …/frame.png, crew sheet): the same pure code as the editor's view
// (calc/frame/job.ts), run on the server's worker pool (server/pool.ts) so a render never holds the request
// thread and waits its turn with the exports and photos.
import sharp from 'sharp';
import type { FrameJob, FrameJobResult } from '../../calc/frame/job';
import type { FrameLook } from '../../calc/frame/looks';
import type { SetupDocument } from '../../model/document';
import { frameInputFromDocument } from '../../model/frame';
import { runTask } from '../pool';

let nextId = 1;

/** Render a frame job on the worker pool. */
function renderOnWorker(job: Omit<FrameJob, 'id'>): Promise<FrameJobResult> {
  return runTask<FrameJobResult>('calc/frame/job.ts', 'runFrameJob', { ...job, id: nextId++ }, 'the frame');
}

/** The frame of a setup (whole plan or one step) as a PNG, or null when the plan has no subject to frame. */
export async function framePng(doc: SetupDocument, o: { width: number; look?: FrameLook; stepIndex?: number }): Promise<{ png: Buffer; width: number; height: number } | null> {
  const { input } = frameInputFromDocument(doc, { stepIndex: o.stepIndex });
  if (!input) return null;
  const r = await renderOnWorker({ input, width: o.width, look: o.look ?? {} });
  if (!r.ok) throw new Error(`frame render failed: ${r.message}`);
  const png = await sharp(Buffer.from(r.rgba.buffer, r.rgba.byteOffset, r.rgba.byteLength), { raw: { width: r.width, height: r.height, channels: 4 } })
    .png()
    .toBuffer();
  return { png, width: r.width, height: r.height };
}

/** Width of the frame printed on the crew sheet, px (about 130 dpi across a column: enough for print, quick to render for a day of sheets). */
export const SHEET_FRAME_WIDTH = 480;

/**
 * The frame for the crew sheet ("the look we are after"), or undefined when the plan has none to show. A
 * failed render is logged and leaves the sheet without its picture: the sheet itself must still print.
 */
export async function sheetFrame(doc: SetupDocument): Promise<Buffer | undefined> {
  try {
    return (await framePng(doc, { width: SHEET_FRAME_WIDTH }))?.png;
  } catch (e) {
    console.error('crew sheet: the frame did not render', e instanceof Error ? e.message : e);
    return undefined;
  }
}
