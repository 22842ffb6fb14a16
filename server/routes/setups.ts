// Setups: list, create, read, save, delete and restore, duplicate, tags, the gallery for everyone. Thin over db/setups.ts; roles from
// server/access.ts.
import type { Response } from 'express';
import { Router, type Request } from 'express';
import type { Db } from '../../db/client';
import {
  BadCursor,
  createSetup,
  duplicateSetup,
  getSetupAccess,
  getSetupDetail,
  alreadyApplied,
  getSetupDetailObject,
  listSetups,
  restoreDeletedSetup,
  pruneSaveReceipts,
  saveSetup,
  savedByKey,
  setForEveryone,
  softDeleteSetup,
  tagsInUse,
} from '../../db/setups';
import { studioRoleOf, studiosOf } from '../../db/studios';
import { createSetupBody, duplicateSetupBody, forEveryoneBody, listSetupsQuery, updateSetupBody, type ForEveryoneResponse, type StudioRole } from '../../model/api';
import { emptyDocument } from '../../model/document';
import { checkCopyOut, checkSetup, pathId, requireOperator, requireSetup, studioCan } from '../access';
import { HttpError, notFound } from '../errors';
import { userOf, type SessionUser } from '../session';
import { parseBody, parseQuery } from '../validate';

type Detail = NonNullable<Awaited<ReturnType<typeof getSetupDetail>>>;

/** Send a setup with its document as stored: the JSON text is spliced in, not parsed and re-serialised. */
function sendDetail(res: Response, d: Detail, status = 200) {
  const head = JSON.stringify(d.meta);
  res.status(status).type('application/json').send(`${head.slice(0, -1)},"document":${d.documentJson}}`);
}

async function sendStored(db: Db, res: Response, id: string, userId: string, status = 200) {
  const d = await getSetupDetail(db, id, userId);
  if (!d) throw notFound('no such setup');
  sendDetail(res, d, status);
}

/** The studio a new setup or copy goes into: the one named (the caller must be able to write there), else a default. */
async function targetStudio(db: Db, user: SessionUser, named: string | undefined, fallback?: { studioId: string; role: StudioRole | null }) {
  if (named) {
    const role = await studioRoleOf(db, user.id, named);
    if (!studioCan.read(role)) throw notFound('no such studio');
    if (!studioCan.write(role)) throw new HttpError(403, 'forbidden', `your role in this studio (${role}) cannot add setups`);
    return named;
  }
  if (fallback && studioCan.write(fallback.role)) return fallback.studioId;
  const mine = await studiosOf(db, user.id);
  const id = (mine.find((s) => s.personal && s.role === 'owner') ?? mine.find((s) => studioCan.write(s.role)))?.id;
  if (!id) throw new HttpError(403, 'forbidden', 'you have no studio you may add setups to');
  return id;
}

const KEY = /^[A-Za-z0-9_-]{8,100}$/;
/** The request's Idempotency-Key header (null without one; a 400 naming the header when malformed). */
function idempotencyKey(req: Request): string | null {
  const v = req.get('idempotency-key');
  if (v === undefined) return null;
  if (!KEY.test(v)) throw new HttpError(400, 'invalid_input', 'invalid header: Idempotency-Key: 8 to 100 letters, digits, - or _', { fields: { 'Idempotency-Key': '8 to 100 letters, digits, - or _' } });
  return v;
}

export function setupRoutes(db: Db) {
  const r = Router();

  r.get('/setups', async (req, res) => {
    const user = userOf(req);
    const q = parseQuery(listSetupsQuery, req);
    const mode = q.templates ? 'templates' : q.deleted ? 'deleted' : 'library';
    try {
      res.json(await listSetups(db, user.id, { mode, sort: q.sort, studio: q.studio, q: q.q, tag: q.tag, cursor: q.cursor, limit: q.limit }));
    } catch (err) {
      if (err instanceof BadCursor) throw new HttpError(400, 'invalid_input', 'invalid query: cursor: not a cursor of this list', { fields: { cursor: 'not a cursor of this list' } });
      throw err;
    }
  });

  r.get('/tags', async (req, res) => {
    const user = userOf(req);
    const studio = typeof req.query.studio === 'string' && req.query.studio ? pathId(req.query.studio, 'studio') : undefined;
    res.json({ tags: await tagsInUse(db, user.id, studio) });
  });

  r.post('/setups', async (req, res) => {
    const user = userOf(req);
    const body = parseBody(createSetupBody, req);
    const studioId = await targetStudio(db, user, body.studioId);
    if (body.isTemplate && !studioCan.publishTemplates(await studioRoleOf(db, user.id, studioId))) {
      throw new HttpError(403, 'forbidden', "only the studio's owners can mark its templates");
    }
    const row = await createSetup(db, { ...body, studioId, ownerId: user.id, document: body.document ?? emptyDocument() });
    await sendStored(db, res, row.id, user.id, 201);
  });

  r.get('/setups/:id', async (req, res) => {
    // One query: the setup and the caller's role, then the same access rule as every route.
    const user = userOf(req);
    const d = await getSetupDetail(db, pathId(req.params.id, 'setup'), user.id);
    checkSetup(d?.access ?? null, 'read');
    sendDetail(res, d!);
  });

  // A save may carry an Idempotency-Key (the client makes one per save and sends it again on a retry): a
  // save that committed but whose answer was lost is answered again from its receipt instead of a 409.
  let saves = 0;
  r.put('/setups/:id', async (req, res) => {
    const { user, id, access } = await requireSetup(db, req, 'write');
    const key = idempotencyKey(req);
    if (key) {
      const earlier = await savedByKey(db, user.id, key, id);
      if (earlier) return void res.setHeader('Idempotent-Replay', 'true').json(earlier);
    }
    const { version, ...changes } = parseBody(updateSetupBody, req);
    if (changes.isTemplate !== undefined) checkSetup(access, 'publish');
    // Un-marking a template in the gallery for everyone would withdraw it from the gallery: an operator's call.
    if (changes.isTemplate === false && access.forEveryone) await requireOperator(db, req, 'withdraw a template from the gallery for everyone');
    const saved = await saveSetup(db, id, version, changes, user.id, key);
    if (++saves % 500 === 0) void pruneSaveReceipts(db).catch(() => undefined);
    if (saved) return void res.json(saved);
    // The same save, sent twice at once: the other copy committed it.
    const twin = key ? await savedByKey(db, user.id, key, id) : null;
    if (twin) return void res.setHeader('Idempotent-Replay', 'true').json(twin);
    // Nothing matched: someone else saved first, or it was deleted meanwhile (410). Nothing was overwritten.
    checkSetup(await getSetupAccess(db, id, user.id), 'write');
    const current = await getSetupDetailObject(db, id, user.id);
    // The same changes sent twice from one base (two senders on one device after a reconnect): already applied.
    if (await alreadyApplied(db, id, version, changes, current!)) {
      const { document: _document, role: _role, studioName: _studioName, ownerName: _ownerName, ...saved } = current!;
      return void res.setHeader('Already-Applied', 'true').json(saved);
    }
    throw new HttpError(409, 'version_conflict', `this setup was saved by someone else since version ${version}; it is now at version ${current!.version}`, { current });
  });

  r.delete('/setups/:id', async (req, res) => {
    const { id } = await requireSetup(db, req, 'write', { deleted: 'allow' });
    await softDeleteSetup(db, id);
    res.status(204).end();
  });

  r.post('/setups/:id/restore', async (req, res) => {
    const { user, id, access } = await requireSetup(db, req, 'write', { deleted: 'allow' });
    if (access.deletedAt && !(await restoreDeletedSetup(db, id))) {
      throw new HttpError(410, 'restore_expired', 'this setup was deleted more than 30 days ago and can no longer be restored');
    }
    await sendStored(db, res, id, user.id);
  });

  r.post('/setups/:id/duplicate', async (req, res) => {
    const { user, id, access } = await requireSetup(db, req, 'read');
    const body = parseBody(duplicateSetupBody, req);
    // Crew copying a studio's setups out is the studio's call (server/access.ts).
    await checkCopyOut(db, access);
    const studioId = await targetStudio(db, user, body.studioId, access);
    const copy = await duplicateSetup(db, id, { studioId, ownerId: user.id, title: body.title });
    if (!copy) throw notFound('no such setup');
    await sendStored(db, res, copy, user.id, 201);
  });

  // The gallery for everyone: an operator publishes a setup there (it becomes a template every signed-in user
  // may read and copy) or withdraws it. The operator need not be a member of the setup's studio, but the setup
  // must be a live one; its studio's members see the change, nothing else about it changes.
  r.put('/setups/:id/everyone', async (req, res) => {
    const id = pathId(req.params.id, 'setup');
    const body = parseBody(forEveryoneBody, req);
    await requireOperator(db, req, body.forEveryone ? 'publish a template to the gallery for everyone' : 'withdraw a template from the gallery for everyone');
    const done = await setForEveryone(db, id, body.forEveryone);
    if (!done) {
      const a = await getSetupAccess(db, id, userOf(req).id);
      if (a?.deletedAt) throw new HttpError(410, 'setup_deleted', 'this setup was deleted; it cannot be in the gallery for everyone');
      throw notFound('no such setup');
    }
    res.json(done satisfies ForEveryoneResponse);
  });

  return r;
}
