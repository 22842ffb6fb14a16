// E-mail confirmation as a gate: an account whose address is not confirmed (better-auth's emailVerified, set
// when its mailed link is opened) may sign in and draw, but may not accept an invitation, join a class by
// invitation or send mail to others. Read from the database at the moment of the request, so a confirmation
// counts at once.
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { schema } from '../db/client';
import { HttpError } from './errors';
import type { SessionUser } from './session';

export async function requireVerifiedEmail(db: Db, user: SessionUser, toDo: string): Promise<void> {
  const [row] = await db.select({ verified: schema.user.emailVerified }).from(schema.user).where(eq(schema.user.id, user.id));
  if (row?.verified) return;
  throw new HttpError(403, 'email_not_verified', `confirm your e-mail address first to ${toDo}: open the link we mailed to ${user.email}`, {
    resend: '/api/auth/send-verification-email',
  });
}
