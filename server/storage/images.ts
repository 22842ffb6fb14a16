// What an uploaded photo is and what of it may be served: the type from its bytes, its camera settings from
// EXIF, a copy to serve with no location in it, and a thumbnail.
//
// The decoding runs on the worker pool (preparePhotoTask, through server/pool.ts) from the upload's temp file;
// the request thread only sniffs the type and reads the header's size (photoHeader) before anything decodes.
import exifr from 'exifr';
import { open, readFile } from 'node:fs/promises';
import sharp from 'sharp';
import { MAX_PHOTO_PIXELS, PHOTO_TYPES } from '../../model/api';
import { stripHeifExif } from './heif';

/** Every sharp input here refuses a picture above the pixel cap before decoding it. */
const input = { limitInputPixels: MAX_PHOTO_PIXELS } as const;

export type PhotoType = (typeof PHOTO_TYPES)[number];
export const EXTENSION: Record<PhotoType, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp', 'image/heic': 'heic', 'image/heif': 'heif' };
const THUMB_PX = 480;

/** The type the bytes say they are (never the name or the header's), if it is one we take. */
export async function sniffPhotoFile(path: string): Promise<PhotoType | null> {
  const f = await open(path, 'r');
  try {
    const head = Buffer.alloc(4100);
    const { bytesRead } = await f.read(head, 0, head.length, 0);
    return sniffPhotoType(head.subarray(0, bytesRead));
  } finally {
    await f.close();
  }
}

/** The picture's size from its header alone (nothing decoded); null when the header says nothing we can read. */
export async function photoHeader(path: string): Promise<{ width: number; height: number } | null> {
  try {
    const m = await sharp(path, { ...input, limitInputPixels: false }).metadata();
    return m.width && m.height ? { width: m.width, height: m.height } : null;
  } catch {
    return null;
  }
}

async function sniffPhotoType(bytes: Buffer): Promise<PhotoType | null> {
  const { fileTypeFromBuffer } = await import('file-type');
  const t = await fileTypeFromBuffer(bytes);
  return t && (PHOTO_TYPES as readonly string[]).includes(t.mime) ? (t.mime as PhotoType) : null;
}

type CameraSettings = { iso: number | null; aperture: number | null; shutterS: number | null; focalMm: number | null; camera: string | null; takenAt: Date | null };

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) && v > 0 ? v : null);

/** ISO, aperture, shutter and focal length as the camera wrote them; nulls when the photo does not say. */
async function readCameraSettings(bytes: Buffer): Promise<CameraSettings> {
  let t: Record<string, unknown> | undefined;
  try {
    t = await exifr.parse(bytes, { pick: ['ISO', 'ISOSpeedRatings', 'FNumber', 'ExposureTime', 'FocalLength', 'Make', 'Model', 'DateTimeOriginal'] });
  } catch {
    t = undefined;
  }
  if (!t) return { iso: null, aperture: null, shutterS: null, focalMm: null, camera: null, takenAt: null };
  const iso = num(Array.isArray(t.ISO) ? t.ISO[0] : t.ISO) ?? num(Array.isArray(t.ISOSpeedRatings) ? t.ISOSpeedRatings[0] : t.ISOSpeedRatings);
  const camera = [t.Make, t.Model].filter((x) => typeof x === 'string' && x.trim()).map((x) => (x as string).trim());
  // A model name often starts with the make ("Canon" + "Canon EOS R6"): say it once.
  const name = camera.length === 2 && camera[1]!.toLowerCase().startsWith(camera[0]!.toLowerCase()) ? camera[1]! : camera.join(' ');
  const taken = t.DateTimeOriginal instanceof Date && !Number.isNaN(t.DateTimeOriginal.getTime()) ? t.DateTimeOriginal : null;
  return { iso, aperture: num(t.FNumber), shutterS: num(t.ExposureTime), focalMm: num(t.FocalLength), camera: name || null, takenAt: taken };
}

type Prepared = { served: Buffer; thumb: Buffer | null; width: number | null; height: number | null; notes: string[] };

/**
 * The copy to serve and its thumbnail. JPEG, PNG and WebP are re-encoded upright with no metadata but their
 * colour profile (so no GPS, no serial numbers). HEIC cannot be decoded by this server's image library, so
 * it is served as uploaded with its EXIF block blanked, and has no thumbnail.
 */
async function preparePhoto(bytes: Buffer, type: PhotoType): Promise<Prepared> {
  if (type === 'image/heic' || type === 'image/heif') {
    const served = stripHeifExif(bytes);
    let thumb: Buffer | null = null;
    try {
      thumb = await sharp(bytes, input).rotate().resize(THUMB_PX, THUMB_PX, { fit: 'inside' }).jpeg({ quality: 80 }).toBuffer();
    } catch {
      thumb = null;
    }
    return { served, thumb, width: null, height: null, notes: thumb ? [] : ['no thumbnail: this server cannot decode HEIC'] };
  }
  // Read top to bottom (libvips streams the picture instead of holding it whole where it can), no cache of
  // decoded pictures kept between photos, and no optimised Huffman coding: optimising it holds every DCT
  // coefficient of the picture at once (about 770 MB for a 62 MP JPEG, 20 MB without).
  sharp.cache(false);
  const img = sharp(bytes, { ...input, failOn: 'error', sequentialRead: true }).rotate().keepIccProfile();
  const encoded =
    type === 'image/jpeg' ? img.jpeg({ quality: 92, chromaSubsampling: '4:4:4', optimiseCoding: false }) : type === 'image/png' ? img.png() : img.webp({ quality: 92 });
  const { data: served, info } = await encoded.toBuffer({ resolveWithObject: true });
  // From the original, so a JPEG shrinks while it decodes (an eighth of the pixels) instead of decoding the copy whole.
  const thumb = await sharp(bytes, { ...input, sequentialRead: true }).rotate().resize(THUMB_PX, THUMB_PX, { fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 80 }).toBuffer();
  return { served, thumb, width: info.width, height: info.height, notes: [] };
}

export type PreparedFile = { settings: CameraSettings; served: Uint8Array; thumb: Uint8Array | null; width: number | null; height: number | null; notes: string[] } | { unreadable: string };

/**
 * The pool task (server/pool.ts): read the upload's temp file, its camera settings and the copies to serve.
 * A damaged file or one over the pixel cap comes back as { unreadable } (the route answers 422).
 * @public run by name on the worker pool (server/routes/photos.ts)
 */
export async function preparePhotoTask(a: { path: string; type: PhotoType }): Promise<PreparedFile> {
  const bytes = await readFile(a.path);
  const settings = await readCameraSettings(bytes);
  try {
    const p = await preparePhoto(bytes, a.type);
    return { settings, ...p };
  } catch (e) {
    return { unreadable: e instanceof Error ? e.message : String(e) };
  }
}
