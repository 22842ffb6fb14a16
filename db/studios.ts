// Studio and class membership, studio members and invitations.
import { createHash, randomBytes } from 'node:crypto';
import { and, asc, eq, gt, isNull, sql } from 'drizzle-orm';
import type { InvitationPreview, StudioInvitation, StudioMember, StudioRole, StudioView } from '../model/api';
import type { Db } from './client';
import { classMembers, classes, studioInvitations, studioMembers, studios, user } from './schema';

/** An invitation link works this long. */
const INVITATION_DAYS = 14;

export async function createPersonalStudio(db: Db, u: { id: string; name: string }) {
  return db.transaction(async (tx) => {
    const [studio] = await tx
      .insert(studios)
      .values({ name: `${u.name.split(' ')[0] || 'My'}'s studio`, personal: true, createdBy: u.id })
      .returning();
    await tx.insert(studioMembers).values({ studioId: studio!.id, userId: u.id, role: 'owner' });
    return studio!;
  });
}

/** A shared studio, with its creator as owner. */
export async function createStudio(db: Db, userId: string, name: string): Promise<StudioView> {
  return db.transaction(async (tx) => {
    const [s] = await tx.insert(studios).values({ name, createdBy: userId }).returning();
    await tx.insert(studioMembers).values({ studioId: s!.id, userId, role: 'owner' });
    return { id: s!.id, name: s!.name, personal: false, role: 'owner' as const, memberCount: 1, createdAt: s!.createdAt.toISOString(), crewMayCopy: s!.crewMayCopy };
  });
}

export async function studiosOf(db: Db, userId: string) {
  return db
    .select({ id: studios.id, name: studios.name, personal: studios.personal, role: studioMembers.role })
    .from(studioMembers)
    .innerJoin(studios, eq(studios.id, studioMembers.studioId))
    .where(eq(studioMembers.userId, userId))
    .orderBy(studios.personal, studios.name);
}

const memberCount = sql<number>`(select count(*)::int from ${studioMembers} c where c.studio_id = ${studios.id})`.mapWith(Number);

/** The user's studios with member counts: one query. */
export async function studioViewsOf(db: Db, userId: string, studioId?: string): Promise<StudioView[]> {
  const rows = await db
    .select({ id: studios.id, name: studios.name, personal: studios.personal, role: studioMembers.role, memberCount, createdAt: studios.createdAt, crewMayCopy: studios.crewMayCopy })
    .from(studioMembers)
    .innerJoin(studios, eq(studios.id, studioMembers.studioId))
    .where(and(eq(studioMembers.userId, userId), studioId ? eq(studios.id, studioId) : undefined))
    .orderBy(studios.personal, studios.name);
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

export async function updateStudio(db: Db, studioId: string, changes: { name?: string; crewMayCopy?: boolean }) {
  await db.update(studios).set(changes).where(eq(studios.id, studioId));
}

export async function crewMayCopy(db: Db, studioId: string): Promise<boolean> {
  const [r] = await db.select({ v: studios.crewMayCopy }).from(studios).where(eq(studios.id, studioId));
  return r?.v ?? false;
}

export async function isPersonalStudio(db: Db, studioId: string): Promise<boolean> {
  const [r] = await db.select({ personal: studios.personal }).from(studios).where(eq(studios.id, studioId));
  return r?.personal ?? false;
}

export async function classesOf(db: Db, userId: string) {
  return db
    .select({ id: classes.id, name: classes.name, role: classMembers.role })
    .from(classMembers)
    .innerJoin(classes, eq(classes.id, classMembers.classId))
    .where(eq(classMembers.userId, userId))
    .orderBy(classes.name);
}

export async function studioRoleOf(db: Db, userId: string, studioId: string) {
  const [row] = await db
    .select({ role: studioMembers.role })
    .from(studioMembers)
    .where(and(eq(studioMembers.userId, userId), eq(studioMembers.studioId, studioId)));
  return row?.role ?? null;
}

// ---------------------------------------------------------------------------------------------
// Members

export async function listMembers(db: Db, studioId: string): Promise<StudioMember[]> {
  const rows = await db
    .select({ userId: studioMembers.userId, name: user.name, email: user.email, role: studioMembers.role, joinedAt: studioMembers.createdAt })
    .from(studioMembers)
    .innerJoin(user, eq(user.id, studioMembers.userId))
    .where(eq(studioMembers.studioId, studioId))
    .orderBy(sql`case ${studioMembers.role} when 'owner' then 0 when 'editor' then 1 else 2 end`, asc(user.name));
  return rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
}

export type MemberChange = 'ok' | 'not_member' | 'last_owner';

/**
 * Change a member's role, or remove them (role null). The studio's member rows are locked first, so two
 * owners demoting each other at the same moment cannot leave the studio without one.
 */
export async function changeMember(db: Db, studioId: string, userId: string, role: StudioRole | null): Promise<MemberChange> {
  return db.transaction(async (tx) => {
    const members = await tx.select({ userId: studioMembers.userId, role: studioMembers.role }).from(studioMembers).where(eq(studioMembers.studioId, studioId)).for('update');
    const target = members.find((m) => m.userId === userId);
    if (!target) return 'not_member';
    const owners = members.filter((m) => m.role === 'owner').length;
    if (target.role === 'owner' && role !== 'owner' && owners <= 1) return 'last_owner';
    const where = and(eq(studioMembers.studioId, studioId), eq(studioMembers.userId, userId));
    if (role === null) await tx.delete(studioMembers).where(where);
    else await tx.update(studioMembers).set({ role }).where(where);
    return 'ok';
  });
}

export async function isMemberByEmail(db: Db, studioId: string, email: string): Promise<boolean> {
  const [r] = await db
    .select({ id: user.id })
    .from(studioMembers)
    .innerJoin(user, eq(user.id, studioMembers.userId))
    .where(and(eq(studioMembers.studioId, studioId), sql`lower(${user.email}) = ${email.toLowerCase()}`));
  return !!r;
}

// ---------------------------------------------------------------------------------------------
// Invitations

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

type InvitationRow = typeof studioInvitations.$inferSelect;
const invitationOut = (r: InvitationRow, invitedByName: string | null): StudioInvitation => ({
  id: r.id,
  email: r.email,
  role: r.role,
  invitedBy: invitedByName,
  createdAt: r.createdAt.toISOString(),
  expiresAt: r.expiresAt.toISOString(),
  delivery: r.delivery,
});

/** A new invitation (replacing an open one to the same address) and its token, which is returned only here. */
export async function createInvitation(
  db: Db,
  v: { studioId: string; email: string; role: StudioRole; invitedBy: { id: string; name: string } },
): Promise<{ invitation: StudioInvitation; token: string }> {
  const token = randomBytes(32).toString('base64url');
  return db.transaction(async (tx) => {
    await tx
      .update(studioInvitations)
      .set({ revokedAt: sql`now()` })
      .where(and(eq(studioInvitations.studioId, v.studioId), sql`lower(${studioInvitations.email}) = ${v.email.toLowerCase()}`, isNull(studioInvitations.acceptedAt), isNull(studioInvitations.revokedAt)));
    const [row] = await tx
      .insert(studioInvitations)
      .values({
        studioId: v.studioId,
        email: v.email,
        role: v.role,
        tokenHash: hashToken(token),
        invitedBy: v.invitedBy.id,
        expiresAt: sql`now() + make_interval(days => ${INVITATION_DAYS})`,
      })
      .returning();
    return { invitation: invitationOut(row!, v.invitedBy.name), token };
  });
}

/** Open invitations of a studio (not accepted, revoked or expired), newest first. */
export async function listInvitations(db: Db, studioId: string): Promise<StudioInvitation[]> {
  const rows = await db
    .select({ inv: studioInvitations, by: user.name })
    .from(studioInvitations)
    .leftJoin(user, eq(user.id, studioInvitations.invitedBy))
    .where(and(eq(studioInvitations.studioId, studioId), isNull(studioInvitations.acceptedAt), isNull(studioInvitations.revokedAt), gt(studioInvitations.expiresAt, sql`now()`)))
    .orderBy(sql`${studioInvitations.createdAt} desc`);
  return rows.map((r) => invitationOut(r.inv, r.by));
}

export async function revokeInvitation(db: Db, studioId: string, invitationId: string): Promise<boolean> {
  const r = await db
    .update(studioInvitations)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(studioInvitations.id, invitationId), eq(studioInvitations.studioId, studioId), isNull(studioInvitations.acceptedAt), isNull(studioInvitations.revokedAt)))
    .returning({ id: studioInvitations.id });
  return r.length > 0;
}

const statusOf = (r: InvitationRow): InvitationPreview['status'] =>
  r.acceptedAt ? 'accepted' : r.revokedAt ? 'revoked' : r.expiresAt.getTime() <= Date.now() ? 'expired' : 'open';

/** What the link shows before joining; null for a token that was never issued. */
export async function previewInvitation(db: Db, token: string): Promise<(InvitationPreview & { studioId: string }) | null> {
  const [r] = await db
    .select({ inv: studioInvitations, studioName: studios.name, by: user.name })
    .from(studioInvitations)
    .innerJoin(studios, eq(studios.id, studioInvitations.studioId))
    .leftJoin(user, eq(user.id, studioInvitations.invitedBy))
    .where(eq(studioInvitations.tokenHash, hashToken(token)));
  if (!r) return null;
  return { studioId: r.inv.studioId, studioName: r.studioName, role: r.inv.role, email: r.inv.email, invitedBy: r.by, expiresAt: r.inv.expiresAt.toISOString(), status: statusOf(r.inv) };
}

export type AcceptResult = { ok: true; studioId: string; role: StudioRole } | { ok: false; reason: 'unknown' | 'not_open' | 'wrong_email' };

/** Join the studio with the invited role (an existing member keeps their role). The invitation is locked while used. */
export async function acceptInvitation(db: Db, token: string, u: { id: string; email: string }): Promise<AcceptResult> {
  return db.transaction(async (tx) => {
    const [inv] = await tx.select().from(studioInvitations).where(eq(studioInvitations.tokenHash, hashToken(token))).for('update');
    if (!inv) return { ok: false, reason: 'unknown' };
    if (statusOf(inv) !== 'open') return { ok: false, reason: 'not_open' };
    if (inv.email.toLowerCase() !== u.email.toLowerCase()) return { ok: false, reason: 'wrong_email' };
    await tx.insert(studioMembers).values({ studioId: inv.studioId, userId: u.id, role: inv.role }).onConflictDoNothing();
    await tx.update(studioInvitations).set({ acceptedAt: sql`now()`, acceptedBy: u.id }).where(eq(studioInvitations.id, inv.id));
    const [m] = await tx.select({ role: studioMembers.role }).from(studioMembers).where(and(eq(studioMembers.studioId, inv.studioId), eq(studioMembers.userId, u.id)));
    return { ok: true, studioId: inv.studioId, role: m!.role };
  });
}
