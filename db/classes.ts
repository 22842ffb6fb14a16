// Classes: the class itself, its roster (instructors and students), join codes and invitations by e-mail.
// Callers (server/routes) have already checked the caller's role.
import { randomInt } from 'node:crypto';
import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import type { ClassInvitation, ClassInvitePreview, ClassMember, ClassRole, ClassSummary, ClassView, JoinedClass } from '../model/api';
import type { Db } from './client';
import { classInvitations, classMembers, classes, lessons, user } from './schema';

/** Join codes avoid letters that read alike (0/O, 1/I/L) so one read aloud in class is typed right. */
const CODE_ALPHABET = 'ABCDEFGHJKMNPQRSTUVWXYZ23456789';
const JOIN_CODE_LENGTH = 6;
function newJoinCode(): string {
  return Array.from({ length: JOIN_CODE_LENGTH }, () => CODE_ALPHABET[randomInt(CODE_ALPHABET.length)]).join('');
}

const isUniqueViolation = (e: unknown) => (e as { code?: string; cause?: { code?: string } })?.code === '23505' || (e as { cause?: { code?: string } })?.cause?.code === '23505';

/** Retry a write that picks a fresh join code when the code happens to be taken already. */
async function withFreshCode<T>(write: (code: string) => Promise<T>): Promise<T> {
  for (let k = 0; ; k++) {
    try {
      return await write(newJoinCode());
    } catch (e) {
      if (!isUniqueViolation(e) || k >= 4) throw e;
    }
  }
}

export async function createClass(db: Db, u: { id: string; name: string }, name: string): Promise<ClassView> {
  const c = await withFreshCode((joinCode) =>
    db.transaction(async (tx) => {
      const [row] = await tx.insert(classes).values({ name, joinCode, createdBy: u.id }).returning();
      await tx.insert(classMembers).values({ classId: row!.id, userId: u.id, role: 'instructor' });
      return row!;
    }),
  );
  return { id: c.id, name: c.name, role: 'instructor', studentCount: 0, lessonCount: 0, createdAt: c.createdAt.toISOString(), instructors: [u.name], joinCode: c.joinCode };
}

export async function classRoleOf(db: Db, userId: string, classId: string): Promise<ClassRole | null> {
  const [r] = await db.select({ role: classMembers.role }).from(classMembers).where(and(eq(classMembers.classId, classId), eq(classMembers.userId, userId)));
  return r?.role ?? null;
}

const studentCount = sql<number>`(select count(*)::int from ${classMembers} m where m.class_id = "classes"."id" and m.role = 'student')`.mapWith(Number);
/** Students count published lessons only; instructors count their drafts too. */
const lessonCount = sql<number>`(select count(*)::int from ${lessons} l where l.class_id = "classes"."id" and (l.published or "class_members"."role" = 'instructor'))`.mapWith(Number);

/** The user's classes with counts, or one of them: one query. */
export async function classSummariesOf(db: Db, userId: string, classId?: string): Promise<(ClassSummary & { joinCode: string; createdAt: Date })[]> {
  return db
    .select({ id: classes.id, name: classes.name, role: classMembers.role, studentCount, lessonCount, joinCode: classes.joinCode, createdAt: classes.createdAt })
    .from(classMembers)
    .innerJoin(classes, eq(classes.id, classMembers.classId))
    .where(and(eq(classMembers.userId, userId), classId ? eq(classes.id, classId) : undefined))
    .orderBy(asc(classes.name), asc(classes.id));
}

export async function classView(db: Db, userId: string, classId: string): Promise<ClassView | null> {
  const [c] = await classSummariesOf(db, userId, classId);
  if (!c) return null;
  const instructors = await db
    .select({ name: user.name })
    .from(classMembers)
    .innerJoin(user, eq(user.id, classMembers.userId))
    .where(and(eq(classMembers.classId, classId), eq(classMembers.role, 'instructor')))
    .orderBy(asc(user.name));
  const { joinCode, createdAt, ...summary } = c;
  return { ...summary, createdAt: createdAt.toISOString(), instructors: instructors.map((i) => i.name), joinCode: c.role === 'instructor' ? joinCode : null };
}

export async function renameClass(db: Db, classId: string, name: string) {
  await db.update(classes).set({ name }).where(eq(classes.id, classId));
}

/** A new join code; the old one stops working. */
export async function regenerateJoinCode(db: Db, classId: string): Promise<string> {
  return withFreshCode(async (joinCode) => {
    await db.update(classes).set({ joinCode }).where(eq(classes.id, classId));
    return joinCode;
  });
}

/** Join the class with this code as a student (a member keeps their role); null when no class has it. */
export async function joinByCode(db: Db, u: { id: string; email: string }, code: string): Promise<JoinedClass | null> {
  const [c] = await db.select({ id: classes.id }).from(classes).where(eq(classes.joinCode, code.toUpperCase()));
  if (!c) return null;
  return join(db, c.id, u, 'student');
}

async function join(db: Db, classId: string, u: { id: string; email: string }, role: ClassRole): Promise<JoinedClass> {
  return db.transaction(async (tx) => {
    await tx.insert(classMembers).values({ classId, userId: u.id, role }).onConflictDoNothing();
    // Any open invitation to this address is used up by joining.
    await tx
      .update(classInvitations)
      .set({ acceptedAt: sql`now()` })
      .where(and(eq(classInvitations.classId, classId), sql`lower(${classInvitations.email}) = ${u.email.toLowerCase()}`, isNull(classInvitations.acceptedAt), isNull(classInvitations.revokedAt)));
    const [m] = await tx.select({ role: classMembers.role }).from(classMembers).where(and(eq(classMembers.classId, classId), eq(classMembers.userId, u.id)));
    return { classId, role: m!.role };
  });
}

// ---------------------------------------------------------------------------------------------
// Roster

export async function listClassMembers(db: Db, classId: string, withEmails: boolean): Promise<ClassMember[]> {
  const rows = await db
    .select({ userId: classMembers.userId, name: user.name, email: user.email, role: classMembers.role, joinedAt: classMembers.createdAt })
    .from(classMembers)
    .innerJoin(user, eq(user.id, classMembers.userId))
    .where(eq(classMembers.classId, classId))
    .orderBy(sql`case ${classMembers.role} when 'instructor' then 0 else 1 end`, asc(user.name));
  return rows.map((r) => ({ ...r, email: withEmails ? r.email : null, joinedAt: r.joinedAt.toISOString() }));
}

/** Addresses to notify: the class's instructors or its students. */
export async function classEmails(db: Db, classId: string, role: ClassRole): Promise<{ name: string; email: string }[]> {
  return db
    .select({ name: user.name, email: user.email })
    .from(classMembers)
    .innerJoin(user, eq(user.id, classMembers.userId))
    .where(and(eq(classMembers.classId, classId), eq(classMembers.role, role)));
}

/** Remove a member; the member rows are locked so two instructors removing each other leave one. */
export async function removeClassMember(db: Db, classId: string, userId: string): Promise<'ok' | 'not_member' | 'last_instructor'> {
  return db.transaction(async (tx) => {
    const members = await tx.select({ userId: classMembers.userId, role: classMembers.role }).from(classMembers).where(eq(classMembers.classId, classId)).for('update');
    const target = members.find((m) => m.userId === userId);
    if (!target) return 'not_member';
    if (target.role === 'instructor' && members.filter((m) => m.role === 'instructor').length <= 1) return 'last_instructor';
    await tx.delete(classMembers).where(and(eq(classMembers.classId, classId), eq(classMembers.userId, userId)));
    return 'ok';
  });
}

export async function isClassMemberByEmail(db: Db, classId: string, email: string): Promise<boolean> {
  const [r] = await db
    .select({ id: user.id })
    .from(classMembers)
    .innerJoin(user, eq(user.id, classMembers.userId))
    .where(and(eq(classMembers.classId, classId), sql`lower(${user.email}) = ${email.toLowerCase()}`));
  return !!r;
}

// ---------------------------------------------------------------------------------------------
// Invitations by e-mail

type InvitationRow = typeof classInvitations.$inferSelect;
const invitationOut = (r: InvitationRow, by: string | null): ClassInvitation => ({ id: r.id, email: r.email, role: r.role, invitedBy: by, createdAt: r.createdAt.toISOString(), delivery: r.delivery });

/** A new invitation, replacing an open one to the same address. */
export async function createClassInvitation(db: Db, v: { classId: string; email: string; role: ClassRole; invitedBy: { id: string; name: string } }): Promise<ClassInvitation> {
  return db.transaction(async (tx) => {
    await tx
      .update(classInvitations)
      .set({ revokedAt: sql`now()` })
      .where(and(eq(classInvitations.classId, v.classId), sql`lower(${classInvitations.email}) = ${v.email.toLowerCase()}`, isNull(classInvitations.acceptedAt), isNull(classInvitations.revokedAt)));
    const [row] = await tx.insert(classInvitations).values({ classId: v.classId, email: v.email, role: v.role, invitedBy: v.invitedBy.id }).returning();
    return invitationOut(row!, v.invitedBy.name);
  });
}

export async function setInvitationDelivery(db: Db, id: string, delivery: 'email' | 'failed', error: string | null = null) {
  await db.update(classInvitations).set({ delivery, deliveryError: error }).where(eq(classInvitations.id, id));
}

export async function listClassInvitations(db: Db, classId: string): Promise<ClassInvitation[]> {
  const rows = await db
    .select({ inv: classInvitations, by: user.name })
    .from(classInvitations)
    .leftJoin(user, eq(user.id, classInvitations.invitedBy))
    .where(and(eq(classInvitations.classId, classId), isNull(classInvitations.acceptedAt), isNull(classInvitations.revokedAt)))
    .orderBy(sql`${classInvitations.createdAt} desc`);
  return rows.map((r) => invitationOut(r.inv, r.by));
}

export async function revokeClassInvitation(db: Db, classId: string, id: string): Promise<boolean> {
  const r = await db
    .update(classInvitations)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(classInvitations.id, id), eq(classInvitations.classId, classId), isNull(classInvitations.acceptedAt), isNull(classInvitations.revokedAt)))
    .returning({ id: classInvitations.id });
  return r.length > 0;
}

/** Open invitations to this address, for classes the user is not in yet. */
export async function invitationsFor(db: Db, u: { id: string; email: string }): Promise<ClassInvitePreview[]> {
  const rows = await db
    .select({ classId: classes.id, className: classes.name, role: classInvitations.role, invitedBy: user.name, createdAt: classInvitations.createdAt })
    .from(classInvitations)
    .innerJoin(classes, eq(classes.id, classInvitations.classId))
    .leftJoin(user, eq(user.id, classInvitations.invitedBy))
    .where(
      and(
        sql`lower(${classInvitations.email}) = ${u.email.toLowerCase()}`,
        isNull(classInvitations.acceptedAt),
        isNull(classInvitations.revokedAt),
        sql`not exists (select 1 from ${classMembers} m where m.class_id = "classes"."id" and m.user_id = ${u.id})`,
      ),
    )
    .orderBy(sql`${classInvitations.createdAt} desc`);
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

/** Join from an invitation to the user's own address; null when there is none open for this class. */
export async function acceptClassInvitation(db: Db, classId: string, u: { id: string; email: string }): Promise<JoinedClass | null> {
  const [inv] = await db
    .select({ role: classInvitations.role })
    .from(classInvitations)
    .where(and(eq(classInvitations.classId, classId), sql`lower(${classInvitations.email}) = ${u.email.toLowerCase()}`, isNull(classInvitations.acceptedAt), isNull(classInvitations.revokedAt)));
  if (!inv) return null;
  return join(db, classId, u, inv.role);
}
