// A setup's history: list, one version, restore one (as a new version). Thin over db/history.ts.
import { Router } from 'express';
import { z } from 'zod';
import type { Db } from '../../db/client';
import { getVersion, listHistory, restoreVersion } from '../../db/history';
import { getSetupAccess, getSetupDetailObject } from '../../db/setups';
import { historyQuery } from '../../model/api';
import { checkSetup, pathId, requireSetup } from '../access';
import { HttpError, notFound } from '../errors';
import { parseBody, parseQuery } from '../validate';

/** Optional: the version the client is looking at; the restore is refused (409) when it is no longer current. */
const restoreBody = z.object({ version: z.number().int().min(1).optional() }).strict();

export function historyRoutes(db: Db) {
  const r = Router();

  r.get('/setups/:id/history', async (req, res) => {
    const { id } = await requireSetup(db, req, 'member');
    const q = parseQuery(historyQuery, req);
    res.json(await listHistory(db, id, q));
  });

  r.get('/setups/:id/history/:versionId', async (req, res) => {
    const { id } = await requireSetup(db, req, 'member');
    const v = await getVersion(db, id, pathId(req.params.versionId, 'version'));
    if (!v) throw notFound('no such version of this setup');
    res.json(v);
  });

  r.post('/setups/:id/history/:versionId/restore', async (req, res) => {
    const { user, id } = await requireSetup(db, req, 'write');
    const versionId = pathId(req.params.versionId, 'version');
    const { version } = parseBody(restoreBody, req);
    const saved = await restoreVersion(db, id, versionId, user.id, version);
    if (saved) return void res.json(saved);
    checkSetup(await getSetupAccess(db, id, user.id), 'write');
    if (!(await getVersion(db, id, versionId))) throw notFound('no such version of this setup');
    const current = await getSetupDetailObject(db, id, user.id);
    throw new HttpError(409, 'version_conflict', `this setup was saved by someone else; it is now at version ${current!.version}`, { current });
  });

  return r;
}
