// Studio and class membership queries.
import { and, eq } from 'drizzle-orm';
import type { Db } from './client';
import { classMembers, classes, studioMembers, studios } from './schema';

export async function createPersonalStudio(db: Db, user: { id: string; name: string }) {
  return db.transaction(async (tx) => {
    const [studio] = await tx
      .insert(studios)
      .values({ name: `${user.name.split(' ')[0] || 'My'}'s studio`, personal: true, createdBy: user.id })
      .returning();
    await tx.insert(studioMembers).values({ studioId: studio!.id, userId: user.id, role: 'owner' });
    return studio!;
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
