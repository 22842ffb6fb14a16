// Read-only share links. Owners and editors create and revoke them; every studio member may list them (crew
// can read the setup anyway, and may pass a link on). Holding a live link opens the setup and its crew sheet
// with no account; an unknown, revoked or deleted one is a 404, from the next request on.
import { Router, type Request, type Response } from 'express';
import type { Db } from '../../db/client';
import { SHARE_TOKEN, createShare, listShares, openShare, printSettingsOf, revokeShare, type ShareRow } from '../../db/shares';
import { createShareBody, type ShareCreated, type ShareLink, type ShareMembership, type SharedSetup } from '../../model/api';
import { checkSetup, pathId, requireSetup, studioCan } from '../access';
import { getSetupAccess } from '../../db/setups';
import { userOf } from '../session';
import { notFound } from '../errors';
import { qrFor, sendExport, type ExportKind } from '../export';
import { parseBody } from '../validate';

export function publicOrigin(req: Request): string {
  return process.env.PUBLIC_URL ?? `${req.protocol}://${req.get('host')}`;
}
export const shareUrl = (req: Request, token: string) => `${publicOrigin(req)}/s/${token}`;

const linkView = (r: ShareRow): ShareLink => ({
  id: r.id,
  label: r.label,
  tokenTail: r.tokenTail,
  createdAt: r.createdAt.toISOString(),
  createdBy: r.createdBy,
  lastOpenedAt: r.lastOpenedAt?.toISOString() ?? null,
});

export function shareRoutes(db: Db) {
  const r = Router();

  r.post('/setups/:id/shares', async (req, res) => {
    const { user, id } = await requireSetup(db, req, 'write');
    const body = parseBody(createShareBody, req);
    const { token, row } = await createShare(db, { setupId: id, label: body.label ?? '', createdBy: user.id, ...(await printSettingsOf(db, user.id)) });
    const url = shareUrl(req, token);
    const created: ShareCreated = { token, url, share: linkView({ ...row, createdBy: user.name }) };
    res.status(201).json(created);
  });

  r.get('/setups/:id/shares', async (req, res) => {
    const { id } = await requireSetup(db, req, 'member');
    res.json({ shares: (await listShares(db, id)).map(linkView) });
  });

  /**
   * Behind a share link, for a signed-in visitor: are they a member of the setup's studio? Then the share page
   * shows the comment thread (the setup's id and their role); anyone else gets a 404.
   */
  r.get('/shared/:token/membership', async (req, res) => {
    const user = userOf(req);
    const token = String(req.params.token ?? '');
    const s = SHARE_TOKEN.test(token) ? await openShare(db, token) : null;
    if (!s) throw notFound('this link does not open anything: it may have been withdrawn');
    const a = checkSetup(await getSetupAccess(db, s.setupId, user.id), 'read');
    if (!studioCan.comment(a.role)) throw notFound('not a member of this setup’s studio');
    const body: ShareMembership = { setupId: s.setupId, role: a.role!, me: { id: user.id, name: user.name } };
    res.setHeader('Cache-Control', 'no-store');
    res.json(body);
  });

  r.delete('/setups/:id/shares/:shareId', async (req, res) => {
    const { id } = await requireSetup(db, req, 'write', { deleted: 'allow' });
    if (!(await revokeShare(db, id, pathId(req.params.shareId, 'share link')))) throw notFound('no such share link');
    res.status(204).end();
  });

  return r;
}

/** Mounted before sign-in is required: the token is the key. */
export function sharedRoutes(db: Db) {
  const r = Router();

  async function opened(req: Request) {
    const token = String(req.params.token ?? '');
    const s = SHARE_TOKEN.test(token) ? await openShare(db, token) : null;
    if (!s) throw notFound('this link does not open anything: it may have been withdrawn');
    return { s, token };
  }

  r.get('/shared/:token', async (req, res) => {
    const { s } = await opened(req);
    const view: SharedSetup = { title: s.title, notes: s.notes, studioName: s.studioName, version: s.version, updatedAt: s.updatedAt.toISOString(), units: s.units, paper: s.paper, document: s.document };
    res.setHeader('Cache-Control', 'no-store');
    res.json(view);
  });

  const send = (kind: ExportKind) => async (req: Request, res: Response) => {
    const { s, token } = await opened(req);
    const link = shareUrl(req, token);
    await sendExport(req, res, kind, { doc: s.document, title: s.title, notes: s.notes, studioName: s.studioName, version: s.version, updatedAt: s.updatedAt, units: s.units, paper: s.paper, link, qr: qrFor({ shareUrl: link }) }, 'none');
  };
  r.get('/shared/:token/crew-sheet.pdf', send('crew-sheet.pdf'));
  r.get('/shared/:token/plan.svg', send('plan.svg'));
  r.get('/shared/:token/plan.png', send('plan.png'));
  r.get('/shared/:token/frame.png', send('frame.png'));
  return r;
}
