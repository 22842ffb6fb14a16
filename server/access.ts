// What each role may do. Routes ask these, never compare role names themselves.
//   owner   everything, members and invitations, publishing templates
//   editor  create, edit, delete and restore setups
//   crew    read and comment, never write
//   anyone signed in: read (and copy) templates; everything else of a studio they are not in is a 404,
//   so its existence does not leak.
import type { Request } from 'express';
import type { Db } from '../db/client';
import { getSetupAccess, type SetupAccess } from '../db/setups';
import type { StudioRole } from '../model/api';
import { HttpError, notFound } from './errors';
import { userOf } from './session';

export const studioCan = {
  read: (r: StudioRole | null) => r !== null,
  comment: (r: StudioRole | null) => r !== null,
  write: (r: StudioRole | null) => r === 'owner' || r === 'editor',
  publishTemplates: (r: StudioRole | null) => r === 'owner',
  manageMembers: (r: StudioRole | null) => r === 'owner',
};

/** read: the setup itself (templates: anyone); member: what stays inside the studio (history, comments). */
export type SetupNeed = 'read' | 'member' | 'comment' | 'write' | 'publish';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** A path id that is not a UUID names nothing: 404, like an id that does not exist. */
export function pathId(value: unknown, what: string): string {
  if (typeof value !== 'string' || !UUID.test(value)) throw notFound(`no such ${what}`);
  return value.toLowerCase();
}

/** Decide from a setup's access row; throws the HTTP error the caller should get. */
export function checkSetup(a: SetupAccess | null, need: SetupNeed, opts: { deleted?: 'allow' | 'refuse' } = {}): SetupAccess {
  if (!a) throw notFound('no such setup');
  const readable = studioCan.read(a.role) || (a.isTemplate && !a.deletedAt);
  if (!readable) throw notFound('no such setup');
  if (a.deletedAt && opts.deleted !== 'allow') throw new HttpError(410, 'setup_deleted', 'this setup was deleted; restore it from the library first');
  const allowed = {
    read: true,
    member: studioCan.read(a.role),
    comment: studioCan.comment(a.role),
    write: studioCan.write(a.role),
    publish: studioCan.publishTemplates(a.role),
  }[need];
  if (!allowed) {
    const what = { read: 'read', member: 'see the history of', comment: 'comment on', write: 'change', publish: 'publish templates from' }[need];
    throw new HttpError(403, 'forbidden', a.role ? `your role in this studio (${a.role}) cannot ${what} this setup` : `only members of the setup's studio can ${what} it`);
  }
  return a;
}

/** The setup named by `req.params.id`, checked for the caller and `need`. */
export async function requireSetup(db: Db, req: Request, need: SetupNeed, opts: { deleted?: 'allow' | 'refuse' } = {}) {
  const user = userOf(req);
  const id = pathId(req.params.id, 'setup');
  return { user, id, access: checkSetup(await getSetupAccess(db, id, user.id), need, opts) };
}
