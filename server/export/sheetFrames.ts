// The frame printed on a crew sheet, kept for the setups drawn lately. The render (server/export/frame.ts, on
// the worker pool) is the dearest part of a crew sheet — more than the PDF itself — and it depends on the
// document alone, while the same version's sheet is fetched again and again (crew opening the share link, the
// device keeping it offline, the day sheets, the e-mail to the crew). Keyed by a hash of the document's JSON;
// requests for a frame still rendering share the one render. A render that fails or has nothing to frame is not
// kept. Stored as JPEG: pdfkit embeds a JPEG as it is, while a PNG with an alpha channel is decoded and split
// on every sheet, and the sheet is a quarter of the size.
import { createHash } from 'node:crypto';
import sharp from 'sharp';
import type { SetupDocument } from '../../model/document';
import { sheetFrame } from './frame';

/** Frames kept (about 8–20 KB each as JPEG). */
const KEEP = 48;
const kept = new Map<string, Promise<Buffer | undefined>>();

export const frameKey = (doc: SetupDocument) => createHash('sha256').update(JSON.stringify(doc)).digest('base64url');

async function render(doc: SetupDocument): Promise<Buffer | undefined> {
  const png = await sheetFrame(doc);
  if (!png) return undefined;
  // The render is opaque; flattened onto white anyway, so no alpha reaches the PDF.
  return sharp(png).flatten({ background: '#ffffff' }).jpeg({ quality: 90, chromaSubsampling: '4:4:4' }).toBuffer();
}

/** The crew sheet's frame of `doc` (JPEG), from the kept ones when this document was drawn lately. */
export function cachedSheetFrame(doc: SetupDocument): Promise<Buffer | undefined> {
  const key = frameKey(doc);
  const hit = kept.get(key);
  if (hit) {
    // Most recently used last (a Map keeps insertion order): the oldest goes first when full.
    kept.delete(key);
    kept.set(key, hit);
    return hit;
  }
  const p = render(doc).catch((e: unknown) => {
    console.error('crew sheet: the frame did not convert', e instanceof Error ? e.message : e);
    return undefined;
  });
  kept.set(key, p);
  void p.then((b) => {
    if (!b && kept.get(key) === p) kept.delete(key);
  });
  while (kept.size > KEEP) kept.delete(kept.keys().next().value!);
  return p;
}

/** How many frames are kept (tests). */
export const keptFrames = () => kept.size;

/** Forget the kept frames (the bench's cold runs, tests). */
export function forgetSheetFrames() {
  kept.clear();
}
