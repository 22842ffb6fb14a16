// Sending a setup as a crew sheet PDF, a plan SVG or a plan PNG: the one path both the signed-in routes
// (server/routes/exports.ts) and the share-link routes (server/routes/shares.ts) take.
import type { Request, Response } from 'express';
import { crewSheetQuery, planPngQuery, planSvgQuery, type PaperSize } from '../../model/api';
import type { SetupDocument } from '../../model/document';
import { fileStem as slug } from '../../model/fileNames';
import type { Units } from '../../model/units';
import { parseQuery } from '../validate';
import { crewSheetPdf } from './pdf';
import { planPng, planSvg } from './plan';

export { slug };

export type ExportKind = 'crew-sheet.pdf' | 'plan.svg' | 'plan.png';
export type ExportSource = { doc: SetupDocument; title: string; studioName: string; version: number; updatedAt: Date; units: Units; paper: PaperSize; link?: string };


export function subtitle(s: Pick<ExportSource, 'studioName' | 'version' | 'updatedAt' | 'paper'>): string {
  const date = s.updatedAt.toLocaleDateString(s.paper === 'letter' ? 'en-US' : 'en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
  return `${s.studioName} · version ${s.version} · saved ${date}`;
}

/** Render and send one export; `cache` is 'private' for a signed-in reader, 'none' for a share link. */
export async function sendExport(req: Request, res: Response, kind: ExportKind, s: ExportSource, cache: 'private' | 'none') {
  res.setHeader('Cache-Control', cache === 'none' ? 'no-store' : 'private, no-cache');
  const name = `${kind === 'crew-sheet.pdf' ? 'crew-sheet' : 'plan'}-${slug(s.title)}.${kind.split('.')[1]}`;
  if (kind === 'plan.png') {
    const { width } = parseQuery(planPngQuery, req);
    const { png } = planPng(s.doc, { units: s.units, widthPx: width });
    res.type('image/png').setHeader('Content-Disposition', `inline; filename="${name}"`);
    return void res.send(png);
  }
  if (kind === 'plan.svg') {
    parseQuery(planSvgQuery, req);
    const { svg } = planSvg(s.doc, { units: s.units, widthPx: 1200 });
    res.type('image/svg+xml').setHeader('Content-Disposition', `inline; filename="${name}"`);
    return void res.send(`<?xml version="1.0" encoding="UTF-8"?>\n${svg}`);
  }
  const q = parseQuery(crewSheetQuery, req);
  const paper = q.paper ?? s.paper;
  const units = q.units ?? s.units;
  const pdf = await crewSheetPdf({ doc: s.doc, title: s.title, units, paper, subtitle: subtitle({ ...s, paper }), link: s.link });
  res.type('application/pdf').setHeader('Content-Disposition', `${q.download === '1' ? 'attachment' : 'inline'}; filename="${name}"`);
  res.send(pdf);
}
