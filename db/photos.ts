// Photos attached to setups: rows only (the bytes are in object storage, server/storage/). Callers have
// checked the caller's role.
import { and, desc, eq } from 'drizzle-orm';
import type { Db } from './client';
import { setupPhotos, user } from './schema';

export type PhotoRow = typeof setupPhotos.$inferSelect & { uploaderName: string | null };
export type NewPhoto = typeof setupPhotos.$inferInsert;

export async function insertPhoto(db: Db, v: NewPhoto): Promise<string> {
  const [row] = await db.insert(setupPhotos).values(v).returning({ id: setupPhotos.id });
  return row!.id;
}

const columns = { photo: setupPhotos, uploaderName: user.name };

export async function listPhotos(db: Db, setupId: string): Promise<PhotoRow[]> {
  const rows = await db.select(columns).from(setupPhotos).leftJoin(user, eq(user.id, setupPhotos.uploadedBy)).where(eq(setupPhotos.setupId, setupId)).orderBy(desc(setupPhotos.createdAt), desc(setupPhotos.id));
  return rows.map((r) => ({ ...r.photo, uploaderName: r.uploaderName }));
}

export async function getPhoto(db: Db, setupId: string, photoId: string): Promise<PhotoRow | null> {
  const [r] = await db.select(columns).from(setupPhotos).leftJoin(user, eq(user.id, setupPhotos.uploadedBy)).where(and(eq(setupPhotos.id, photoId), eq(setupPhotos.setupId, setupId)));
  return r ? { ...r.photo, uploaderName: r.uploaderName } : null;
}

export async function deletePhotoRow(db: Db, setupId: string, photoId: string): Promise<boolean> {
  const r = await db.delete(setupPhotos).where(and(eq(setupPhotos.id, photoId), eq(setupPhotos.setupId, setupId))).returning({ id: setupPhotos.id });
  return r.length > 0;
}
