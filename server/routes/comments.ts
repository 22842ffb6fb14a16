// Comments on a setup: every studio member reads and writes them, crew included. Threads (a start and its
// replies), pins to an item or a point on the plan, resolving a thread (its author or anyone who may change
// the setup), and the caller's last read (the library's unread count). New comments reach the setup's
// owners and editors by e-mail, grouped, rate limited and queued durably (server/mail/commentNotices.ts).
import { Router } from 'express';
import type { Db } from '../../db/client';
import { addComment, getComment, lastReadAt, listComments, markRead, setResolved } from '../../db/comments';
import { commentBody, resolveCommentBody, type CommentsResponse } from '../../model/api';
import { pathId, requireSetup, studioCan } from '../access';
import { HttpError, notFound } from '../errors';
import type { CommentNotices } from '../mail/commentNotices';
import { parseBody } from '../validate';
import { publicOrigin } from './shares';

export function commentRoutes(db: Db, notices?: CommentNotices) {
  const r = Router();

  r.get('/setups/:id/comments', async (req, res) => {
    const { id, user } = await requireSetup(db, req, 'comment');
    const [comments, read] = await Promise.all([listComments(db, id), lastReadAt(db, user.id, id)]);
    const body: CommentsResponse = { comments, lastReadAt: read?.toISOString() ?? null };
    res.json(body);
  });

  r.post('/setups/:id/comments', async (req, res) => {
    const { user, id } = await requireSetup(db, req, 'comment');
    const body = parseBody(commentBody, req);
    if (body.parentId) {
      const parent = await getComment(db, id, body.parentId);
      if (!parent) throw new HttpError(400, 'invalid_input', 'parentId: no such comment on this setup', { fields: { parentId: 'no such comment on this setup' } });
      if (parent.parentId) throw new HttpError(400, 'invalid_input', 'parentId: reply to the thread’s first comment', { fields: { parentId: 'reply to the thread’s first comment' } });
    }
    // The comment and its waiting e-mail digest are stored together: both or neither (a 503 when the queue refuses).
    const c = await db.transaction(async (tx) => {
      const made = await addComment(tx, { setupId: id, author: user, body: body.body, itemId: body.itemId, point: body.point, parentId: body.parentId });
      await notices?.commented(tx, id, publicOrigin(req));
      return made;
    });
    res.status(201).json(c);
  });

  /** Resolve or reopen a thread: its author, or anyone who may change the setup. */
  r.patch('/setups/:id/comments/:commentId', async (req, res) => {
    const { user, id, access } = await requireSetup(db, req, 'comment');
    const commentId = pathId(req.params.commentId, 'comment');
    const body = parseBody(resolveCommentBody, req);
    const c = await getComment(db, id, commentId);
    if (!c) throw notFound('no such comment');
    if (c.parentId) throw new HttpError(400, 'invalid_input', 'resolve the thread’s first comment, not a reply', { fields: { resolved: 'resolve the thread’s first comment' } });
    if (c.author?.id !== user.id && !studioCan.write(access.role)) throw new HttpError(403, 'forbidden', `your role in this studio (${access.role}) can resolve only the threads you started`);
    res.json(await setResolved(db, id, commentId, user.id, body.resolved));
  });

  /** Everything up to now is read (opening the thread does this). */
  r.post('/setups/:id/comments/read', async (req, res) => {
    const { user, id } = await requireSetup(db, req, 'comment');
    await markRead(db, user.id, id);
    res.status(204).end();
  });

  return r;
}
