// "Send to crew": e-mail a new read-only link to the setup (and its crew sheet PDF) to the addresses given.
// Owners and editors only (it makes a share link); limited per user so the app cannot be used to spam.
import { Router } from 'express';
import type { Db } from '../../db/client';
import { createShare, printSettingsOf } from '../../db/shares';
import { getSetupDetail } from '../../db/setups';
import { sendToCrewBody, type SendToCrewResult } from '../../model/api';
import { parseDocument } from '../../model/document';
import { requireSetup } from '../access';
import { HttpError } from '../errors';
import { slug, subtitle } from '../export';
import { crewSheetPdf } from '../export/pdf';
import { windowLimit } from '../mail/limit';
import type { Mailer } from '../mail/mailer';
import { crewSheetMessage } from '../mail/messages';
import { parseBody } from '../validate';
import { shareUrl } from './shares';

export const SENDS_PER_WINDOW = 10;
export const SEND_WINDOW_MS = 10 * 60_000;

export function mailRoutes(db: Db, mailer: Mailer | undefined) {
  const r = Router();
  const limit = windowLimit(SENDS_PER_WINDOW, SEND_WINDOW_MS);

  r.post('/setups/:id/send', async (req, res) => {
    const { user, id } = await requireSetup(db, req, 'write');
    const body = parseBody(sendToCrewBody, req);
    if (!mailer) throw new HttpError(503, 'mail_not_configured', 'this server has no mail service set up (SMTP_URL)');
    const wait = limit.take(user.id);
    if (wait) {
      res.setHeader('Retry-After', String(wait));
      throw new HttpError(429, 'rate_limited', `you have sent ${SENDS_PER_WINDOW} e-mails in the last ${SEND_WINDOW_MS / 60_000} minutes; try again in ${Math.ceil(wait / 60)} min`, { retryAfterS: wait });
    }
    const d = (await getSetupDetail(db, id, user.id))!;
    const { units, paper } = await printSettingsOf(db, user.id);
    const { token, row } = await createShare(db, { setupId: id, label: `E-mailed to ${body.to.join(', ')}`.slice(0, 80), createdBy: user.id, units, paper });
    const url = shareUrl(req, token);
    const meta = d.meta;
    const pdf = body.attachPdf
      ? await crewSheetPdf({ doc: parseDocument(JSON.parse(d.documentJson)), title: meta.title, units, paper, subtitle: subtitle({ ...meta, updatedAt: new Date(meta.updatedAt), paper }), link: url })
      : undefined;
    try {
      await mailer.send(crewSheetMessage({ to: body.to, senderName: user.name, senderEmail: user.email, title: meta.title, url, note: body.message, pdf, pdfName: `crew-sheet-${slug(meta.title)}.pdf` }));
    } catch (err) {
      req.log?.error({ err, setupId: id }, 'crew e-mail failed');
      throw new HttpError(502, 'mail_failed', 'the mail server did not take the message; the link was made, try sending again');
    }
    req.log?.info({ setupId: id, recipients: body.to.length }, 'crew sheet e-mailed');
    const result: SendToCrewResult = { sent: body.to, url, shareId: row.id, attached: !!pdf };
    res.status(201).json(result);
  });

  return r;
}
