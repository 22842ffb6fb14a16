// Seeds the demo studio, class, users and setups once (skipped when the demo owner exists), then the demo
// class's lesson and assignment once (skipped when the lesson is there), so a database seeded before
// lessons existed gets them too.
import { and, eq, inArray } from 'drizzle-orm';
import { generateRandomString, hashPassword } from 'better-auth/crypto';
import type { Db } from './client';
import { DEMO_CLASS, DEMO_JOIN_CODE, DEMO_PASSWORD, DEMO_STUDIO, demoUsers } from './demo';
import { createAssignment } from './assignments';
import { addLessonSetup, createLesson, updateLesson, updateLessonSetup, lessonSetupOf } from './lessons';
import { account, classMembers, classes, lessons, studioMembers, studios, user } from './schema';
import { DEMO_ASSIGNMENT, DEMO_LESSON } from './seed-lesson';
import { createSetup } from './setups';
import { demoSetups } from './seed-setups';
import { createPersonalStudio, studiosOf } from './studios';

export async function seedDemo(db: Db): Promise<boolean> {
  const people = await seedDemoPeople(db);
  // The demo people's addresses count as confirmed (they are invented, no mail reaches them), also in a
  // database seeded before addresses were confirmed.
  await db.update(user).set({ emailVerified: true }).where(inArray(user.email, Object.values(demoUsers).map((u) => u.email)));
  const lesson = await seedDemoLesson(db);
  return people || lesson;
}

async function seedDemoPeople(db: Db): Promise<boolean> {
  const [existing] = await db.select({ id: user.id }).from(user).where(eq(user.email, demoUsers.owner.email));
  if (existing) return false;

  // The rows better-auth's e-mail sign-up writes (a user and its 'credential' account holding the password
  // hash), written here so db/ does not depend on the server's auth set-up. Demo addresses count as verified.
  const password = await hashPassword(DEMO_PASSWORD);
  const ids: Record<string, string> = {};
  for (const [key, u] of Object.entries(demoUsers)) {
    const id = generateRandomString(32);
    await db.insert(user).values({ id, name: u.name, email: u.email, emailVerified: true });
    await db.insert(account).values({ id: generateRandomString(32), accountId: id, providerId: 'credential', userId: id, password });
    // and the personal studio every new account gets at sign-up (server/auth.ts)
    await createPersonalStudio(db, { id, name: u.name });
    ids[key] = id;
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
        // the demo's template is in the gallery for everyone, as if an operator had published it
        forEveryone: s.template,
        document: s.document,
      });
    }
  });
  return true;
}

/** The demo class's lesson, built from the instructor's own copies of two demo setups, and one assignment. */
async function seedDemoLesson(db: Db): Promise<boolean> {
  const [dana] = await db.select({ id: user.id }).from(user).where(eq(user.email, demoUsers.instructor.email));
  const [klass] = await db.select({ id: classes.id }).from(classes).where(and(eq(classes.name, DEMO_CLASS), eq(classes.joinCode, DEMO_JOIN_CODE)));
  if (!dana || !klass) return false;
  const [done] = await db.select({ id: lessons.id }).from(lessons).where(and(eq(lessons.classId, klass.id), eq(lessons.title, DEMO_LESSON.title)));
  if (done) return false;
  const studio = (await studiosOf(db, dana.id)).find((s) => s.personal);
  if (!studio) return false;

  await db.transaction(async (t) => {
    const tx = t as unknown as Db;
    const lesson = await createLesson(tx, { classId: klass.id, title: DEMO_LESSON.title, summary: DEMO_LESSON.summary, createdBy: dana.id });
    const entries: string[] = [];
    for (const part of DEMO_LESSON.setups) {
      const source = demoSetups.find((d) => d.title === part.from)!;
      const copy = await createSetup(tx, { studioId: studio.id, ownerId: dana.id, title: source.title, notes: source.notes, tags: [...source.tags, 'teaching'], document: source.document });
      const entry = await addLessonSetup(tx, lesson.id, { id: copy.id, title: copy.title, document: source.document, version: copy.version }, part.note);
      await updateLessonSetup(tx, (await lessonSetupOf(tx, lesson.id, entry.id))!, { stepNotes: { ...part.steps } });
      entries.push(entry.id);
    }
    await updateLesson(tx, lesson.id, { published: true });
    await createAssignment(tx, lesson.id, { ...DEMO_ASSIGNMENT, referenceId: entries[0]!, createdBy: dana.id });
  });
  return true;
}
