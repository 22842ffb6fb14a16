// The meter's readings for a stored setup, computed with the same code the editor runs (calc/ through
// model/documentToScene.ts), so a crew sheet or another client can trust the server's numbers.
import { Router } from 'express';
import { ZodError, z } from 'zod';
import { meter } from '../../calc';
import type { Db } from '../../db/client';
import { getSetupDetailObject } from '../../db/setups';
import { sceneFromDocument } from '../../model/documentToScene';
import { requireSetup } from '../access';
import { HttpError, notFound, zodFields } from '../errors';
import { parseQuery } from '../validate';

/** `step`: meter the plan as it stands after that step (0-based), as a lesson shows it. */
const meterQuery = z.object({ step: z.coerce.number().int().min(0).max(99).optional() }).strict();

export function meterRoutes(db: Db) {
  const r = Router();

  r.get('/setups/:id/meter', async (req, res) => {
    const { user, id } = await requireSetup(db, req, 'read');
    const { step } = parseQuery(meterQuery, req);
    const setup = await getSetupDetailObject(db, id, user.id);
    if (!setup) throw notFound('no such setup');
    const build = sceneFromDocument(setup.document, { stepIndex: step });
    try {
      const readings = build.scene ? meter(build.scene) : null;
      res.json({ version: setup.version, readings, missing: build.missing, assumedCamera: build.assumedCamera });
    } catch (err) {
      // A plan the document schema accepts but the meter's scene refuses (a value beyond the physics' range).
      if (err instanceof ZodError) throw new HttpError(422, 'not_meterable', 'the meter cannot read this plan', { fields: zodFields(err) });
      throw err;
    }
  });

  return r;
}
