// A setup's crew sheet and plan images for a signed-in reader: anyone who may read the setup (studio members,
// and every user for a template). Units and paper are the account's unless the query names them.
import { Router, type Request, type Response } from 'express';
import type { Db } from '../../db/client';
import { getSetupDetail } from '../../db/setups';
import { printSettingsOf } from '../../db/shares';
import { parseDocument } from '../../model/document';
import { checkSetup, pathId } from '../access';
import { sendExport, type ExportKind } from '../export';
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
    await sendExport(req, res, kind, { doc, title: meta.title, studioName: meta.studioName, version: meta.version, updatedAt: new Date(meta.updatedAt), ...print }, 'private');
  };
  r.get('/setups/:id/crew-sheet.pdf', send('crew-sheet.pdf'));
  r.get('/setups/:id/plan.svg', send('plan.svg'));
  r.get('/setups/:id/plan.png', send('plan.png'));
  return r;
}
