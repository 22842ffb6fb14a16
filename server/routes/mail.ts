// "Send to crew": e-mail a new read-only link to the setup (and its crew sheet PDF) to the addresses given.
// Owners and editors only (it makes a share link); limited per user (in PostgreSQL, across processes) so the app cannot be used to spam.
import { Router } from 'express';
import type { Db } from '../../db/client';
import { createShare, printSettingsOf, revokeShare } from '../../db/shares';
import { getSetupDetail } from '../../db/setups';
import { sendToCrewBody, type SendToCrewResult } from '../../model/api';
import { parseDocument } from '../../model/document';
import { requireSetup } from '../access';
import { HttpError } from '../errors';
import type { Limits } from '../limits';
import { qrFor, slug, subtitle } from '../export';
import { cachedSheetFrame } from '../export/sheetFrames';
import { crewSheetOnPool } from '../export/run';
import type { Mailer } from '../mail/mailer';
import { MailQueueUnavailable } from '../mail/queue';
import { crewSheetMessage } from '../mail/messages';
import { parseBody } from '../validate';
import { requireVerifiedEmail } from '../verified';
import { shareUrl } from './shares';

export function mailRoutes(db: Db, mailer: Mailer | undefined, limits: Limits) {
  const r = Router();

  r.post('/setups/:id/send', async (req, res) => {
    const { user, id } = await requireSetup(db, req, 'write');
    const body = parseBody(sendToCrewBody, req);
    await requireVerifiedEmail(db, user, 'send mail to others');
    if (!mailer) throw new HttpError(503, 'mail_not_configured', 'this server has no mail service set up (SMTP_URL)');
    // Shared by every server process (server/limits.ts: 10 in 10 minutes).
    await limits.take('mail', user.id);
    const d = (await getSetupDetail(db, id, user.id))!;
    const { units, paper } = await printSettingsOf(db, user.id);
    const { token, row } = await createShare(db, { setupId: id, label: `E-mailed to ${body.to.join(', ')}`.slice(0, 80), createdBy: user.id, units, paper });
    const url = shareUrl(req, token);
    const meta = d.meta;
    const doc = parseDocument(JSON.parse(d.documentJson));
    // The same sheet as the download, the frame ("the look we are after") included.
    const pdf = body.attachPdf
      ? await crewSheetOnPool({ doc, title: meta.title, units, paper, subtitle: subtitle({ ...meta, updatedAt: new Date(meta.updatedAt), paper }), link: url, notes: meta.notes, qr: qrFor({ shareUrl: url }), frame: await cachedSheetFrame(doc) })
      : undefined;
    try {
      await mailer.send(crewSheetMessage({ to: body.to, senderName: user.name, senderEmail: user.email, title: meta.title, url, note: body.message, pdf, pdfName: `crew-sheet-${slug(meta.title)}.pdf` }));
    } catch (err) {
      // The queue did not store it: take the link made for this message back, and answer 503 with Retry-After.
      if (err instanceof MailQueueUnavailable) {
        await revokeShare(db, id, row.id);
        throw err;
      }
      req.log?.error({ err, setupId: id }, 'crew e-mail failed');
      throw new HttpError(502, 'mail_failed', 'the mail server did not take the message; the link was made, try sending again');
    }
    req.log?.info({ setupId: id, recipients: body.to.length }, 'crew sheet e-mailed');
    const result: SendToCrewResult = { sent: body.to, url, shareId: row.id, attached: !!pdf };
    res.status(201).json(result);
  });

  return r;
}
