// Seeds the demo studio, class, users and setups once (skipped when the demo owner exists).
import { eq } from 'drizzle-orm';
import { createAuth } from '../server/auth';
import type { Db } from './client';
import { DEMO_CLASS, DEMO_JOIN_CODE, DEMO_PASSWORD, DEMO_STUDIO, demoUsers } from './demo';
import { classMembers, classes, studioMembers, studios, user } from './schema';
import { createSetup } from './setups';
import { demoSetups } from './seed-setups';

export async function seedDemo(db: Db): Promise<boolean> {
  const [existing] = await db.select({ id: user.id }).from(user).where(eq(user.email, demoUsers.owner.email));
  if (existing) return false;

  const auth = createAuth(db, { baseURL: 'http://127.0.0.1', secret: 'seed-only-secret-0123456789abcdef' });
  const ids: Record<string, string> = {};
  for (const [key, u] of Object.entries(demoUsers)) {
    const r = await auth.api.signUpEmail({ body: { name: u.name, email: u.email, password: DEMO_PASSWORD } });
    ids[key] = r.user.id;
  }

  await db.transaction(async (tx) => {
    const [studio] = await tx.insert(studios).values({ name: DEMO_STUDIO, createdBy: ids.owner }).returning();
    for (const [key, u] of Object.entries(demoUsers)) {
      if (u.studioRole) await tx.insert(studioMembers).values({ studioId: studio!.id, userId: ids[key]!, role: u.studioRole });
    }
    const [klass] = await tx.insert(classes).values({ name: DEMO_CLASS, joinCode: DEMO_JOIN_CODE, createdBy: ids.instructor }).returning();
    await tx.insert(classMembers).values([
      { classId: klass!.id, userId: ids.instructor!, role: 'instructor' },
      { classId: klass!.id, userId: ids.student!, role: 'student' },
    ]);
    for (const s of demoSetups) {
      await createSetup(tx as unknown as Db, {
        studioId: studio!.id,
        ownerId: ids.owner!,
        title: s.title,
        notes: s.notes,
        tags: s.tags,
        isTemplate: s.template,
        document: s.document,
      });
    }
  });
  return true;
}
