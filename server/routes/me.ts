import { Router } from 'express';
import type { Db } from '../../db/client';
import { classesOf, studiosOf } from '../../db/studios';
import type { Me } from '../../model/api';
import { userOf } from '../session';

export function meRoutes(db: Db) {
  const r = Router();
  r.get('/me', async (req, res) => {
    const user = userOf(req);
    const [studios, classes] = await Promise.all([studiosOf(db, user.id), classesOf(db, user.id)]);
    const body: Me = { user, studios, classes };
    res.json(body);
  });
  return r;
}
