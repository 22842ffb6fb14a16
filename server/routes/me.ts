// The signed-in user's own account: who they are, their studios and classes, their settings.
import { eq } from 'drizzle-orm';
import { Router } from 'express';
import type { Db } from '../../db/client';
import { user as users } from '../../db/schema';
import { classesOf, studiosOf } from '../../db/studios';
import { updateMeBody, type Me } from '../../model/api';
import { userOf } from '../session';
import { parseBody } from '../validate';

async function me(db: Db, id: string): Promise<Me> {
  // The user row is read fresh: the session may have been cached a moment before a settings change.
  const [[u], studios, classes] = await Promise.all([
    db.select({ id: users.id, name: users.name, email: users.email, units: users.units, paper: users.paper }).from(users).where(eq(users.id, id)),
    studiosOf(db, id),
    classesOf(db, id),
  ]);
  return {
    user: { id: u!.id, name: u!.name, email: u!.email, units: u!.units === 'imperial' ? 'imperial' : 'metric', paper: u!.paper === 'letter' ? 'letter' : 'a4' },
    studios,
    classes,
  };
}

export function meRoutes(db: Db) {
  const r = Router();
  r.get('/me', async (req, res) => {
    res.json(await me(db, userOf(req).id));
  });
  r.patch('/me', async (req, res) => {
    const id = userOf(req).id;
    const body = parseBody(updateMeBody, req);
    if (Object.keys(body).length) await db.update(users).set({ ...body, updatedAt: new Date() }).where(eq(users.id, id));
    res.json(await me(db, id));
  });
  return r;
}
