// Comments on a setup: every studio member reads and writes them, crew included.
import { Router } from 'express';
import type { Db } from '../../db/client';
import { addComment, listComments } from '../../db/comments';
import { commentBody } from '../../model/api';
import { requireSetup } from '../access';
import { parseBody } from '../validate';

export function commentRoutes(db: Db) {
  const r = Router();

  r.get('/setups/:id/comments', async (req, res) => {
    const { id } = await requireSetup(db, req, 'comment');
    res.json({ comments: await listComments(db, id) });
  });

  r.post('/setups/:id/comments', async (req, res) => {
    const { user, id } = await requireSetup(db, req, 'comment');
    const body = parseBody(commentBody, req);
    res.status(201).json(await addComment(db, { setupId: id, author: user, body: body.body, itemId: body.itemId }));
  });

  return r;
}
