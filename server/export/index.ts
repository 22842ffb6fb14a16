// Sending a setup as a crew sheet PDF, a plan SVG or a plan PNG: the one path both the signed-in routes
// (server/routes/exports.ts) and the share-link routes (server/routes/shares.ts) take.
import type { Request, Response } from 'express';
import { crewSheetQuery, framePngQuery, planPngQuery, planSvgQuery, type PaperSize } from '../../model/api';
import type { SetupDocument } from '../../model/document';
import { fileStem as slug } from '../../model/fileNames';
import { cleanForDisplay } from '../../model/text';
import type { Units } from '../../model/units';
import { parseQuery } from '../validate';
import { HttpError } from '../errors';
import { framePng } from './frame';
import { cachedSheetFrame } from './sheetFrames';
import { crewSheetOnPool, planPngOnPool, planSvgOnPool } from './run';

export { slug };

export type ExportKind = 'crew-sheet.pdf' | 'plan.svg' | 'plan.png' | 'frame.png';
export type ExportSource = {
  doc: SetupDocument;
  title: string;
  studioName: string;
  version: number;
  updatedAt: Date;
  units: Units;
  paper: PaperSize;
  /** The share link printed in the footer, when the sheet is opened through one. */
  link?: string;
  notes?: string;
  /** What the sheet's QR code opens. */
  qr?: { url: string; caption: string };
};

/** The QR code of a sheet: the share link (no account needed), else the setup in the app (members sign in). */
export const qrFor = (o: { shareUrl?: string; appUrl?: string }) =>
  o.shareUrl ? { url: o.shareUrl, caption: 'Scan: the live plan, no account needed' } : o.appUrl ? { url: o.appUrl, caption: 'Scan: the live plan (members sign in)' } : undefined;


export function subtitle(s: Pick<ExportSource, 'studioName' | 'version' | 'updatedAt' | 'paper'>): string {
  const date = s.updatedAt.toLocaleDateString(s.paper === 'letter' ? 'en-US' : 'en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
  return `${s.studioName} · version ${s.version} · saved ${date}`;
}

/** Render and send one export; `cache` is 'private' for a signed-in reader, 'none' for a share link. */
export async function sendExport(req: Request, res: Response, kind: ExportKind, source: ExportSource, cache: 'private' | 'none') {
  // Titles and names stored before the text rules may hold control characters: never into a PDF or a header.
  const s = { ...source, title: cleanForDisplay(source.title), studioName: cleanForDisplay(source.studioName) };
  res.setHeader('Cache-Control', cache === 'none' ? 'no-store' : 'private, no-cache');
  const name = `${kind.split('.')[0]}-${slug(s.title)}.${kind.split('.')[1]}`;
  if (kind === 'frame.png') {
    const q = parseQuery(framePngQuery, req);
    if (q.step !== undefined && q.step > s.doc.steps.length) throw new HttpError(400, 'bad_request', `step: this setup has ${s.doc.steps.length} steps`, { fields: { step: 'no such step' } });
    const f = await framePng(s.doc, { width: q.width, look: { mono: q.look === 'mono' }, stepIndex: q.step === undefined ? undefined : q.step - 1 });
    if (!f) throw new HttpError(409, 'nothing_to_frame', 'the plan has no subject to frame yet');
    res.type('image/png').setHeader('Content-Disposition', `inline; filename="${name}"`);
    return void res.send(f.png);
  }
  if (kind === 'plan.png') {
    const { width } = parseQuery(planPngQuery, req);
    const png = await planPngOnPool({ doc: s.doc, units: s.units, widthPx: width });
    res.type('image/png').setHeader('Content-Disposition', `inline; filename="${name}"`);
    return void res.send(png);
  }
  if (kind === 'plan.svg') {
    parseQuery(planSvgQuery, req);
    const svg = await planSvgOnPool({ doc: s.doc, units: s.units, widthPx: 1200 });
    res.type('image/svg+xml').setHeader('Content-Disposition', `inline; filename="${name}"`);
    return void res.send(`<?xml version="1.0" encoding="UTF-8"?>\n${svg}`);
  }
  const q = parseQuery(crewSheetQuery, req);
  const paper = q.paper ?? s.paper;
  const units = q.units ?? s.units;
  const pdf = await crewSheetOnPool({ doc: s.doc, title: s.title, units, paper, subtitle: subtitle({ ...s, paper }), link: s.link, notes: s.notes, qr: s.qr, frame: await cachedSheetFrame(s.doc) });
  res.type('application/pdf').setHeader('Content-Disposition', `${q.download === '1' ? 'attachment' : 'inline'}; filename="${name}"`);
  res.send(pdf);
}
