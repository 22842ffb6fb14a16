// A setup's crew sheet and plan images for a signed-in reader: anyone who may read the setup (studio members,
// and every user for a template). Units and paper are the account's unless the query names them.
import { Router, type Request, type Response } from 'express';
import type { Db } from '../../db/client';
import { getSetupDetail } from '../../db/setups';
import { printSettingsOf } from '../../db/shares';
import { parseDocument } from '../../model/document';
import { checkSetup, pathId } from '../access';
import { qrFor, sendExport, slug, subtitle, type ExportKind } from '../export';
import { cachedSheetFrame } from '../export/sheetFrames';
import type { SheetInput } from '../export/pdf';
import { daySheetOnPool } from '../export/run';
import { HttpError } from '../errors';
import { parseBody } from '../validate';
import { daySheetBody } from '../../model/api';
import { publicOrigin } from './shares';
import { userOf } from '../session';

export function exportRoutes(db: Db) {
  const r = Router();
  const send = (kind: ExportKind) => async (req: Request, res: Response) => {
    const user = userOf(req);
    const d = await getSetupDetail(db, pathId(req.params.id, 'setup'), user.id);
    checkSetup(d?.access ?? null, 'read');
    const { meta } = d!;
    const doc = parseDocument(JSON.parse(d!.documentJson));
    const print = await printSettingsOf(db, user.id);
    const qr = qrFor({ appUrl: `${publicOrigin(req)}/setups/${meta.id}` });
    await sendExport(req, res, kind, { doc, title: meta.title, notes: meta.notes, studioName: meta.studioName, version: meta.version, updatedAt: new Date(meta.updatedAt), qr, ...print }, 'private');
  };
  r.get('/setups/:id/crew-sheet.pdf', send('crew-sheet.pdf'));
  r.get('/setups/:id/plan.svg', send('plan.svg'));
  r.get('/setups/:id/plan.png', send('plan.png'));
  r.get('/setups/:id/frame.png', send('frame.png'));
  return r;
}

/**
 * A shoot day's crew sheets in one PDF: the setups named, in the order named, behind a cover listing them.
 * Every setup must be readable by the caller (a setup they cannot read is a 404 naming its place in the list).
 */
export function daySheetRoutes(db: Db) {
  const r = Router();
  r.post('/day-sheet.pdf', async (req, res) => {
    const user = userOf(req);
    const body = parseBody(daySheetBody, req);
    const print = await printSettingsOf(db, user.id);
    const sheets: SheetInput[] = [];
    for (const [k, id] of body.setupIds.entries()) {
      const d = await getSetupDetail(db, id, user.id);
      try {
        checkSetup(d?.access ?? null, 'read');
      } catch (e) {
        if (e instanceof HttpError) throw new HttpError(e.status, e.code, `setupIds.${k}: ${e.message}`, { fields: { [`setupIds.${k}`]: e.message } });
        throw e;
      }
      const meta = d!.meta;
      const doc = parseDocument(JSON.parse(d!.documentJson));
      sheets.push({
        doc,
        frame: await cachedSheetFrame(doc),
        title: meta.title,
        notes: meta.notes,
        units: print.units,
        paper: print.paper,
        subtitle: subtitle({ studioName: meta.studioName, version: meta.version, updatedAt: new Date(meta.updatedAt), paper: print.paper }),
        qr: qrFor({ appUrl: `${publicOrigin(req)}/setups/${meta.id}` }),
      });
    }
    const title = body.title || 'Shoot day';
    const pdf = await daySheetOnPool({ title, date: body.date, paper: print.paper, sheets });
    res.setHeader('Cache-Control', 'private, no-store');
    res.type('application/pdf').setHeader('Content-Disposition', `attachment; filename="day-sheets-${slug(title)}.pdf"`);
    res.send(pdf);
  });
  return r;
}
