// The exports as pool tasks (server/pool.ts runs these on a worker thread): plain data in, bytes out. The
// request thread only parses, checks access and sends what comes back.
import type { Units } from '../../model/units';
import type { SetupDocument } from '../../model/document';
import { crewSheetPdf, daySheetPdf, type DaySheetInput, type SheetInput } from './pdf';
import { prepareResvgFonts } from './fonts';
import { planPng, planSvg } from './plan';

export async function planPngTask(a: { doc: SetupDocument; units: Units; widthPx: number }): Promise<Uint8Array> {
  // The font subsets are made once per worker thread, before its first PNG (server/export/fonts.ts).
  await prepareResvgFonts();
  return planPng(a.doc, a).png;
}

export function planSvgTask(a: { doc: SetupDocument; units: Units; widthPx: number }): string {
  return planSvg(a.doc, a).svg;
}

// A Buffer sent to a thread arrives as a Uint8Array; pdfkit wants a Buffer for an image.
const sheet = (s: SheetInput): SheetInput => (s.frame ? { ...s, frame: Buffer.from(s.frame) } : s);

export function crewSheetTask(input: SheetInput): Promise<Buffer> {
  return crewSheetPdf(sheet(input));
}

export function daySheetTask(input: DaySheetInput): Promise<Buffer> {
  return daySheetPdf({ ...input, sheets: input.sheets.map(sheet) });
}
