// Reference and result photos of a setup. Any studio member may attach one (crew photograph the set as
// rigged); owners, editors and the uploader may delete it. The bytes go to object storage: the served copy
// has no GPS (server/storage/images.ts), the row keeps the camera settings read from the original's EXIF.
// An upload streams to a temp file (never whole into memory) under a size cap; its type and pixel count are
// read from the first bytes and the header before anything decodes it, and the decoding runs on the worker
// pool (server/pool.ts). The temp file is removed whatever happens.
import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { unlink } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Request, Response } from 'express';
import { Router } from 'express';
import multer from 'multer';
import type { Db } from '../../db/client';
import { deletePhotoRow, getPhoto, insertPhoto, listPhotos, type PhotoRow } from '../../db/photos';
import { MAX_PHOTO_BYTES, MAX_PHOTO_PIXELS, uploadPhotoFields, type PhotoKind, type SetupPhoto } from '../../model/api';
import { pathId, requireSetup, studioCan } from '../access';
import { HttpError, notFound } from '../errors';
import { asBuffer, runTask } from '../pool';
import { EXTENSION, photoHeader, sniffPhotoFile, type PreparedFile } from '../storage/images';
import type { ObjectStore } from '../storage/objects';
import { parseBody } from '../validate';

const uploadDir = join(tmpdir(), 'falloff-uploads');
mkdirSync(uploadDir, { recursive: true });
const upload = multer({ dest: uploadDir, limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 4, fieldSize: 1000 } }).single('photo');

/** Run multer as a promise, its errors as our JSON errors. */
function receive(req: Request, res: Response): Promise<void> {
  return new Promise((resolve, reject) =>
    upload(req, res, (err: unknown) => {
      if (!err) return resolve();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return reject(new HttpError(413, 'too_large', `a photo may be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB`, { fields: { photo: 'larger than 20 MB' } }));
        return reject(new HttpError(400, 'invalid_input', `invalid upload: ${err.message}`, { fields: { [err.field ?? 'photo']: err.message } }));
      }
      reject(new HttpError(400, 'invalid_input', 'the upload is not a multipart form with a photo'));
    }),
  );
}

function view(setupId: string, p: PhotoRow): SetupPhoto {
  const base = `/api/setups/${setupId}/photos/${p.id}`;
  const exif = { iso: p.iso, aperture: p.aperture, shutterS: p.shutterS, focalMm: p.focalMm, camera: p.camera, takenAt: p.takenAt?.toISOString() ?? null };
  const notes: string[] = [];
  if (!p.thumbKey) notes.push(p.mime === 'image/heic' || p.mime === 'image/heif' ? 'No preview: this server cannot decode HEIC. The original is kept; download it to view.' : 'No preview could be made.');
  if (exif.iso === null && exif.aperture === null && exif.shutterS === null) notes.push('The photo carries no camera settings (its EXIF was removed or never written).');
  return {
    id: p.id,
    kind: p.kind as PhotoKind,
    filename: p.filename,
    mime: p.mime,
    bytes: p.bytes,
    width: p.width,
    height: p.height,
    url: base,
    thumbnailUrl: p.thumbKey ? `${base}/thumbnail` : null,
    exif,
    uploadedBy: p.uploadedBy ? { id: p.uploadedBy, name: p.uploaderName ?? '' } : null,
    createdAt: p.createdAt.toISOString(),
    notes,
  };
}

const cleanName = (s: string) => s.replace(/[^\p{L}\p{N} ._()-]+/gu, '_').slice(0, 120) || 'photo';

export function photoRoutes(db: Db, store: ObjectStore | undefined) {
  const r = Router();
  const needStore = () => {
    if (!store) throw new HttpError(503, 'storage_not_configured', 'this server has no photo storage set up (S3_ENDPOINT, S3_BUCKET)');
    return store;
  };

  r.post('/setups/:id/photos', async (req, res) => {
    const { user, id } = await requireSetup(db, req, 'comment');
    const objects = needStore();
    await receive(req, res);
    const file = req.file;
    try {
      if (!file) throw new HttpError(400, 'invalid_input', 'invalid body: photo: attach a photo file', { fields: { photo: 'attach a photo file' } });
      const fields = parseBody(uploadPhotoFields, req);
      await savePhoto(res, id, user.id, objects, file, fields.kind);
    } finally {
      if (file?.path) await unlink(file.path).catch(() => {});
    }
  });

  async function savePhoto(res: Response, id: string, userId: string, objects: ObjectStore, file: Express.Multer.File, kind: PhotoKind) {
    const type = await sniffPhotoFile(file.path);
    if (!type) throw new HttpError(415, 'unsupported_type', 'only JPEG, PNG, WebP or HEIC photos can be attached; this file is not one, whatever its name says', { fields: { photo: 'not a JPEG, PNG, WebP or HEIC image' } });
    const size = await photoHeader(file.path);
    if (size && size.width * size.height > MAX_PHOTO_PIXELS) {
      const mp = (size.width * size.height / 1e6).toFixed(0);
      throw new HttpError(413, 'too_many_pixels', `a photo may have at most ${MAX_PHOTO_PIXELS / 1e6} million pixels; this one is ${size.width} × ${size.height} (${mp} million)`, { fields: { photo: `more than ${MAX_PHOTO_PIXELS / 1e6} million pixels` } });
    }
    const done = await runTask<PreparedFile>('server/storage/images.ts', 'preparePhotoTask', { path: file.path, type }, 'the photo');
    if ('unreadable' in done) throw new HttpError(422, 'unreadable_image', 'the photo could not be read: the file may be damaged', { fields: { photo: 'damaged or incomplete image' } });
    const { settings } = done;
    const prepared = { ...done, served: asBuffer(done.served), thumb: done.thumb ? asBuffer(done.thumb) : null };
    const photoId = randomUUID();
    const prefix = `setups/${id}/photos/${photoId}`;
    const objectKey = `${prefix}/original.${EXTENSION[type]}`;
    const thumbKey = prepared.thumb ? `${prefix}/thumbnail.jpg` : null;
    await objects.put(objectKey, prepared.served, type);
    if (thumbKey) await objects.put(thumbKey, prepared.thumb!, 'image/jpeg');
    try {
      await insertPhoto(db, {
        id: photoId,
        setupId: id,
        kind,
        uploadedBy: userId,
        filename: cleanName(file.originalname),
        mime: type,
        bytes: prepared.served.length,
        width: prepared.width,
        height: prepared.height,
        objectKey,
        thumbKey,
        ...settings,
      });
    } catch (err) {
      await objects.remove([objectKey, ...(thumbKey ? [thumbKey] : [])]).catch(() => {});
      throw err;
    }
    res.status(201).json(view(id, (await getPhoto(db, id, photoId))!));
  }

  r.get('/setups/:id/photos', async (req, res) => {
    const { id } = await requireSetup(db, req, 'member');
    res.json({ photos: (await listPhotos(db, id)).map((p) => view(id, p)) });
  });

  const sendObject = (which: 'original' | 'thumbnail') => async (req: Request, res: Response) => {
    const { id } = await requireSetup(db, req, 'member');
    const objects = needStore();
    const p = await getPhoto(db, id, pathId(req.params.photoId, 'photo'));
    const key = p && (which === 'original' ? p.objectKey : p.thumbKey);
    if (!p || !key) throw notFound(which === 'thumbnail' && p ? 'this photo has no thumbnail' : 'no such photo');
    const bytes = await objects.get(key);
    if (!bytes) throw notFound('the photo’s file is missing from storage');
    res.setHeader('Cache-Control', 'private, max-age=3600');
    res.setHeader('Content-Disposition', `inline; filename*=UTF-8''${encodeURIComponent(which === 'original' ? p.filename : `thumbnail-${p.filename}`)}`);
    res.type(which === 'original' ? p.mime : 'image/jpeg').send(bytes);
  };
  r.get('/setups/:id/photos/:photoId', sendObject('original'));
  r.get('/setups/:id/photos/:photoId/thumbnail', sendObject('thumbnail'));

  r.delete('/setups/:id/photos/:photoId', async (req, res) => {
    const { user, id, access } = await requireSetup(db, req, 'comment');
    const objects = needStore();
    const p = await getPhoto(db, id, pathId(req.params.photoId, 'photo'));
    if (!p) throw notFound('no such photo');
    if (!studioCan.write(access.role) && p.uploadedBy !== user.id) throw new HttpError(403, 'forbidden', `your role in this studio (${access.role}) can delete only the photos you attached`);
    await objects.remove([p.objectKey, ...(p.thumbKey ? [p.thumbKey] : [])]);
    await deletePhotoRow(db, id, p.id);
    res.status(204).end();
  });

  return r;
}
