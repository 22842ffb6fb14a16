// Setups: list, create, read. Thin over db/setups.ts; roles from server/access.ts.
import { Router } from 'express';
import { z } from 'zod';
import type { Db } from '../../db/client';
import { createSetup, decodeCursor, getSetupWithRole, listSetups } from '../../db/setups';
import { studioRoleOf, studiosOf } from '../../db/studios';
import { createSetupBody, listSetupsQuery } from '../../model/api';
import { emptyDocument } from '../../model/document';
import { studioCan } from '../access';
import { HttpError, notFound } from '../errors';
import { userOf } from '../session';
import { parseBody, parseQuery } from '../validate';

const idParam = z.string().uuid();

export function setupRoutes(db: Db) {
  const r = Router();

  r.get('/setups', async (req, res) => {
    const user = userOf(req);
    const q = parseQuery(listSetupsQuery, req);
    const cursor = q.cursor ? decodeCursor(q.cursor) : null;
    if (q.cursor && !cursor) throw new HttpError(400, 'invalid_input', 'invalid query: cursor: not a cursor from this API', { fields: { cursor: 'not a cursor from this API' } });
    res.json(await listSetups(db, user.id, { ...q, cursor }));
  });

  r.post('/setups', async (req, res) => {
    const user = userOf(req);
    const body = parseBody(createSetupBody, req);
    let studioId = body.studioId;
    if (!studioId) {
      const mine = await studiosOf(db, user.id);
      studioId = (mine.find((s) => s.personal && s.role === 'owner') ?? mine.find((s) => studioCan.write(s.role)))?.id;
      if (!studioId) throw new HttpError(403, 'forbidden', 'you have no studio you may add setups to');
    } else {
      const role = await studioRoleOf(db, user.id, studioId);
      if (!studioCan.read(role)) throw notFound('no such studio');
      if (!studioCan.write(role)) throw new HttpError(403, 'forbidden', 'your role in this studio cannot add setups');
    }
    const row = await createSetup(db, { ...body, studioId, ownerId: user.id, document: body.document ?? emptyDocument() });
    res.status(201).json(row);
  });

  r.get('/setups/:id', async (req, res) => {
    const user = userOf(req);
    const id = idParam.safeParse(req.params.id);
    if (!id.success) throw notFound('no such setup');
    const found = await getSetupWithRole(db, id.data, user.id);
    if (!found || !(studioCan.read(found.role) || found.setup.isTemplate)) throw notFound('no such setup');
    res.json({ ...found.setup, role: found.role });
  });

  return r;
}
