// A submission and its review: read (its student, the instructors, the class once shared), comments pinned
// to an item or a point of the plan, and the instructor marking it reviewed (which e-mails the student) or
// sharing it with the class.
import { Router } from 'express';
import { addSubmissionComment, getSubmission, listSubmissionComments, referenceDocument, setSubmissionState, submissionNotice } from '../../db/assignments';
import type { Db } from '../../db/client';
import { submissionCommentBody, updateSubmissionBody, type ClassRole, type SubmissionDetail } from '../../model/api';
import { classCan, requireSubmission } from '../access';
import { HttpError } from '../errors';
import type { Mailer } from '../mail/mailer';
import { parseBody } from '../validate';
import { appLink, classMail, sendAll } from './classMail';

export async function submissionDetail(db: Db, id: string, who: { role: ClassRole; own: boolean }): Promise<SubmissionDetail | null> {
  const s = await getSubmission(db, id);
  if (!s) return null;
  const [reference, comments] = await Promise.all([referenceDocument(db, s.assignmentId), listSubmissionComments(db, [id])]);
  return { ...s, reference, comments, canComment: classCan.teach(who.role) || who.own, canReview: classCan.teach(who.role) };
}

export function submissionRoutes(db: Db, mailer?: Mailer) {
  const r = Router();

  r.get('/submissions/:id', async (req, res) => {
    const { id, own, access } = await requireSubmission(db, req, 'read');
    res.json(await submissionDetail(db, id, { role: access.role, own }));
  });

  r.patch('/submissions/:id', async (req, res) => {
    const { user, id, own, access } = await requireSubmission(db, req, 'review');
    const body = parseBody(updateSubmissionBody, req);
    const before = (await getSubmission(db, id))!;
    await setSubmissionState(db, id, body, user.id);
    const detail = (await submissionDetail(db, id, { role: access.role, own }))!;
    if (body.reviewed && before.status !== 'reviewed') {
      const n = (await submissionNotice(db, id))!;
      await sendAll(mailer, req, [
        classMail.reviewed({ to: n.email, reviewerName: user.name, title: n.assignmentTitle, attempt: n.attempt, comments: detail.comments.length, link: appLink(req, `/submissions/${id}`) }),
      ]);
    }
    res.json(detail);
  });

  r.post('/submissions/:id/comments', async (req, res) => {
    const { user, id } = await requireSubmission(db, req, 'comment');
    const body = parseBody(submissionCommentBody, req);
    if (body.itemId) {
      const s = (await getSubmission(db, id))!;
      if (!s.document.items.some((i) => i.id === body.itemId)) {
        throw new HttpError(400, 'invalid_input', 'invalid body: itemId: no such item on this plan', { fields: { itemId: 'no such item on this plan' } });
      }
    }
    res.status(201).json(await addSubmissionComment(db, { submissionId: id, author: user, body: body.body, itemId: body.itemId, point: body.point }));
  });

  return r;
}
