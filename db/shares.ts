// Share links: create (the token is made here and returned once), list, revoke, and open by token.
// Callers (server/routes/shares.ts) have checked the caller's role; opening by token needs no account.
import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import { createHash, randomBytes } from 'node:crypto';
import { CURRENT_SCHEMA_VERSION, parseDocument, type SetupDocument } from '../model/document';
import type { Db } from './client';
import { setupShares, setups, studios, user } from './schema';

/** 32 random bytes as base64url (43 characters): 256 bits, far beyond guessing. */
const newShareToken = () => randomBytes(32).toString('base64url');
export const hashShareToken = (token: string) => createHash('sha256').update(token).digest('hex');
export const SHARE_TOKEN = /^[A-Za-z0-9_-]{43}$/;

export type ShareRow = { id: string; label: string; tokenTail: string; createdAt: Date; createdBy: string | null; lastOpenedAt: Date | null };

export async function createShare(db: Db, v: { setupId: string; label: string; createdBy: string; units: string; paper: string }): Promise<{ token: string; row: ShareRow }> {
  const token = newShareToken();
  const [row] = await db
    .insert(setupShares)
    .values({ setupId: v.setupId, tokenHash: hashShareToken(token), tokenTail: token.slice(-4), label: v.label, createdBy: v.createdBy, units: v.units, paper: v.paper })
    .returning();
  return { token, row: { id: row!.id, label: row!.label, tokenTail: row!.tokenTail, createdAt: row!.createdAt, createdBy: null, lastOpenedAt: null } };
}

/** The setup's live links, newest first, with the creator's name. */
export async function listShares(db: Db, setupId: string): Promise<ShareRow[]> {
  return db
    .select({ id: setupShares.id, label: setupShares.label, tokenTail: setupShares.tokenTail, createdAt: setupShares.createdAt, createdBy: user.name, lastOpenedAt: setupShares.lastOpenedAt })
    .from(setupShares)
    .leftJoin(user, eq(user.id, setupShares.createdBy))
    .where(and(eq(setupShares.setupId, setupId), isNull(setupShares.revokedAt)))
    .orderBy(desc(setupShares.createdAt), desc(setupShares.id));
}

/** Revoke one live link of the setup; false when there is none by that id. */
export async function revokeShare(db: Db, setupId: string, shareId: string): Promise<boolean> {
  const r = await db
    .update(setupShares)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(setupShares.id, shareId), eq(setupShares.setupId, setupId), isNull(setupShares.revokedAt)))
    .returning({ id: setupShares.id });
  return r.length > 0;
}

export type OpenedShare = {
  shareId: string;
  setupId: string;
  units: 'metric' | 'imperial';
  paper: 'a4' | 'letter';
  title: string;
  notes: string;
  studioName: string;
  version: number;
  updatedAt: Date;
  document: SetupDocument;
};

/**
 * The setup behind a live link, or null (unknown token, revoked link, deleted setup: all look the same).
 * Notes when it was last opened, at most once a minute per link.
 */
export async function openShare(db: Db, token: string): Promise<OpenedShare | null> {
  if (!SHARE_TOKEN.test(token)) return null;
  const [row] = await db
    .select({
      shareId: setupShares.id,
      setupId: setups.id,
      units: setupShares.units,
      paper: setupShares.paper,
      lastOpenedAt: setupShares.lastOpenedAt,
      title: setups.title,
      notes: setups.notes,
      studioName: studios.name,
      version: setups.version,
      updatedAt: setups.updatedAt,
      schemaVersion: setups.schemaVersion,
      document: setups.document,
    })
    .from(setupShares)
    .innerJoin(setups, eq(setups.id, setupShares.setupId))
    .innerJoin(studios, eq(studios.id, setups.studioId))
    .where(and(eq(setupShares.tokenHash, hashShareToken(token)), isNull(setupShares.revokedAt), isNull(setups.deletedAt)));
  if (!row) return null;
  if (!row.lastOpenedAt || Date.now() - row.lastOpenedAt.getTime() > 60_000) {
    await db.update(setupShares).set({ lastOpenedAt: sql`now()` }).where(eq(setupShares.id, row.shareId));
  }
  const { lastOpenedAt: _l, schemaVersion, document, ...rest } = row;
  return {
    ...rest,
    units: rest.units === 'imperial' ? 'imperial' : 'metric',
    paper: rest.paper === 'letter' ? 'letter' : 'a4',
    // Stored documents are valid at their version; older ones are brought up to date on the way out.
    document: schemaVersion === CURRENT_SCHEMA_VERSION ? (document as SetupDocument) : parseDocument(document),
  };
}

/**
 * A user's units and paper, read fresh: the session is cached for a few seconds (server/session.ts), and a
 * crew sheet printed right after changing the paper size must use the new one.
 */
export async function printSettingsOf(db: Db, userId: string): Promise<{ units: 'metric' | 'imperial'; paper: 'a4' | 'letter' }> {
  const [u] = await db.select({ units: user.units, paper: user.paper }).from(user).where(eq(user.id, userId));
  return { units: u?.units === 'imperial' ? 'imperial' : 'metric', paper: u?.paper === 'letter' ? 'letter' : 'a4' };
}
