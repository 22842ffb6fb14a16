// Photos on a setup, through the fake S3 (server/fakes.ts): camera settings read from EXIF, GPS gone from
// everything served, thumbnails, HEIC kept without one, size and type refused with a 4xx and nothing stored,
// delete removing the objects. Test images are made here with sharp (no binary files in the repo).
import exifr from 'exifr';
import { crc32, deflateSync } from 'node:zlib';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { demoSetups } from '../../db/seed-setups';
import { createObjectStore } from '../../server/storage/objects';
import { raw } from './exports.helpers';
import { fresh, newSetup, studioWithTeam } from './fixtures';
import type { Client } from '../support/http';

const base = inject('baseUrl');
const bucket = createObjectStore({ ...inject('s3'), region: 'us-east-1', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true });
let team: Awaited<ReturnType<typeof studioWithTeam>>;
let setupId: string;
const stored = () => bucket.list(`setups/${setupId}/`);

const GPS = { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 12/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 30/1' };

/** A grey 1200 × 800 JPEG as a camera would write it: f/8, 1/160 s, ISO 200, 85 mm, and where it was taken. */
async function cameraJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 1200, height: 800, channels: 3, background: '#7d7a74' } })
    .jpeg({ quality: 90 })
    .withExif({
      IFD0: { Make: 'Falloff', Model: 'Falloff Bench Camera' },
      IFD2: { ISOSpeedRatings: '200', FNumber: '8/1', ExposureTime: '1/160', FocalLength: '85/1', DateTimeOriginal: '2026:05:12 10:30:00' },
      IFD3: GPS,
    })
    .toBuffer();
}

/** ISO-BMFF box: size, type, body. */
const box = (type: string, ...body: Buffer[]) => {
  const b = Buffer.concat(body);
  const head = Buffer.alloc(8);
  head.writeUInt32BE(8 + b.length);
  head.write(type, 4, 'latin1');
  return Buffer.concat([head, b]);
};
const u16 = (n: number) => Buffer.from([n >> 8, n & 255]);
const u32 = (n: number) => {
  const b = Buffer.alloc(4);
  b.writeUInt32BE(n);
  return b;
};

/** A HEIC container holding only an EXIF item (TIFF bytes from a JPEG with GPS); enough to be sniffed, read and stripped. */
async function heicWithExif(): Promise<Buffer> {
  const jpg = await cameraJpeg();
  const app1 = jpg.indexOf(Buffer.from('Exif\0\0', 'latin1'));
  const len = jpg.readUInt16BE(app1 - 2);
  const tiff = jpg.subarray(app1 + 6, app1 - 2 + len);
  const exifItem = Buffer.concat([u32(0), tiff]); // exif_tiff_header_offset, then the TIFF block
  const ftyp = box('ftyp', Buffer.from('heic', 'latin1'), u32(0), Buffer.from('mif1heic', 'latin1'));
  const hdlr = box('hdlr', u32(0), u32(0), Buffer.from('pict', 'latin1'), Buffer.alloc(12), Buffer.from([0]));
  const infe = box('infe', Buffer.from([2, 0, 0, 0]), u16(1), u16(0), Buffer.from('Exif', 'latin1'), Buffer.from([0]));
  const iinf = box('iinf', u32(0), u16(1), infe);
  const ilocFor = (offset: number) => box('iloc', u32(0), Buffer.from([0x44, 0x00]), u16(1), u16(1), u16(0), u16(1), u32(offset), u32(exifItem.length));
  const metaFor = (offset: number) => box('meta', u32(0), hdlr, box('pitm', u32(0), u16(1)), iinf, ilocFor(offset));
  const head = Buffer.concat([ftyp, metaFor(0)]);
  const offset = head.length + 8; // the item's bytes start right after mdat's header
  return Buffer.concat([ftyp, metaFor(offset), box('mdat', exifItem)]);
}

/** An XMP packet giving where the picture was taken (as phone and camera software write it). */
const XMP_WITH_GPS = `<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"><rdf:Description rdf:about="" xmlns:exif="http://ns.adobe.com/exif/1.0/" exif:GPSLatitude="51,30.2N" exif:GPSLongitude="0,7.5W"/></rdf:RDF></x:xmpmeta>`;

/** A HEIC container with an EXIF item (GPS) and an XMP item (GPS again), both in mdat. */
async function heicWithExifAndXmp(): Promise<Buffer> {
  const jpg = await cameraJpeg();
  const app1 = jpg.indexOf(Buffer.from('Exif\0\0', 'latin1'));
  const tiff = jpg.subarray(app1 + 6, app1 - 2 + jpg.readUInt16BE(app1 - 2));
  const exifItem = Buffer.concat([u32(0), tiff]);
  const xmpItem = Buffer.from(XMP_WITH_GPS, 'utf8');
  const ftyp = box('ftyp', Buffer.from('heic', 'latin1'), u32(0), Buffer.from('mif1heic', 'latin1'));
  const hdlr = box('hdlr', u32(0), u32(0), Buffer.from('pict', 'latin1'), Buffer.alloc(12), Buffer.from([0]));
  const exifInfe = box('infe', Buffer.from([2, 0, 0, 0]), u16(1), u16(0), Buffer.from('Exif', 'latin1'), Buffer.from([0]));
  const xmpInfe = box('infe', Buffer.from([2, 0, 0, 0]), u16(2), u16(0), Buffer.from('mime', 'latin1'), Buffer.from([0]), Buffer.from('application/rdf+xml\0', 'latin1'));
  const iinf = box('iinf', u32(0), u16(2), exifInfe, xmpInfe);
  const item = (id: number, offset: number, length: number) => Buffer.concat([u16(id), u16(0), u16(1), u32(offset), u32(length)]);
  const ilocFor = (o: number) => box('iloc', u32(0), Buffer.from([0x44, 0x00]), u16(2), item(1, o, exifItem.length), item(2, o + exifItem.length, xmpItem.length));
  const metaFor = (o: number) => box('meta', u32(0), hdlr, box('pitm', u32(0), u16(1)), iinf, ilocFor(o));
  const offset = Buffer.concat([ftyp, metaFor(0)]).length + 8;
  return Buffer.concat([ftyp, metaFor(offset), box('mdat', exifItem, xmpItem)]);
}

/** A PNG whose header says `width` × `height` with almost no picture data behind it (an image bomb's shape). */
function pngHeaderOnly(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const len = u32(data.length);
    const td = Buffer.concat([Buffer.from(type, 'latin1'), data]);
    return Buffer.concat([len, td, u32(crc32(td))]);
  };
  const ihdr = Buffer.concat([u32(width), u32(height), Buffer.from([8, 2, 0, 0, 0])]);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(Buffer.alloc(1000))), chunk('IEND', Buffer.alloc(0))]);
}

async function upload(c: Client | null, bytes: Buffer, name: string, type: string, fields: Record<string, string> = { kind: 'result' }) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('photo', new Blob([new Uint8Array(bytes)], { type }), name);
  return raw(base, c, `/api/setups/${setupId}/photos`, { method: 'POST', body: form });
}

beforeAll(async () => {
  team = await studioWithTeam(base);
  setupId = (await newSetup(team.owner.client, { studioId: team.studioId, title: 'Photos of the clamshell', document: demoSetups[0]!.document })).id;
});
afterAll(() => bucket.close());

describe('POST /api/setups/:id/photos', () => {
  it('reads the camera settings from EXIF, serves a copy without GPS, and makes a thumbnail', async () => {
    const original = await cameraJpeg();
    expect(await exifr.gps(original)).toMatchObject({ latitude: expect.closeTo(51.5033, 3) }); // the upload has a location
    const r = await upload(team.crew.client, original, 'IMG_0420.JPG', 'image/jpeg');
    expect(r.status, r.body.toString()).toBe(201);
    const p = r.json;
    expect(p).toMatchObject({ kind: 'result', mime: 'image/jpeg', filename: 'IMG_0420.JPG', width: 1200, height: 800, uploadedBy: { name: 'Team Crew' }, notes: [] });
    expect(p.exif).toMatchObject({ iso: 200, aperture: 8, focalMm: 85, camera: 'Falloff Bench Camera' });
    expect(p.exif.shutterS).toBeCloseTo(1 / 160, 6);
    expect(p.exif.takenAt).toMatch(/^2026-05-12T/);

    const served = await raw(base, team.owner.client, p.url);
    expect(served.status).toBe(200);
    expect(served.type).toBe('image/jpeg');
    expect(await exifr.gps(served.body)).toBeUndefined();
    const tags = (await exifr.parse(served.body, true)) ?? {};
    expect(Object.keys(tags).filter((k) => k.startsWith('GPS'))).toEqual([]);
    expect((await sharp(served.body).metadata()).width).toBe(1200);

    const thumb = await raw(base, team.editor.client, p.thumbnailUrl);
    expect(thumb.type).toBe('image/jpeg');
    const tm = await sharp(thumb.body).metadata();
    expect(Math.max(tm.width!, tm.height!)).toBe(480);
    expect(await exifr.gps(thumb.body)).toBeUndefined();
    expect((await stored()).filter((k) => k.includes(p.id)).sort()).toEqual([`setups/${setupId}/photos/${p.id}/original.jpg`, `setups/${setupId}/photos/${p.id}/thumbnail.jpg`]);

    const list = await team.crew.client.get(`/api/setups/${setupId}/photos`);
    expect(list.body.photos.map((x: { id: string }) => x.id)).toContain(p.id);
  });

  it('takes a PNG with no EXIF and says it has no settings', async () => {
    const png = await sharp({ create: { width: 300, height: 200, channels: 4, background: '#20304080' } }).png().toBuffer();
    const r = await upload(team.owner.client, png, 'set.png', 'image/png', { kind: 'reference' });
    expect(r.status).toBe(201);
    expect(r.json).toMatchObject({ kind: 'reference', mime: 'image/png', exif: { iso: null, aperture: null, shutterS: null, focalMm: null } });
    expect(r.json.notes.join(' ')).toMatch(/no camera settings/);
  });

  it('keeps a HEIC without a thumbnail, says so, and blanks its EXIF (GPS) in the served copy', async () => {
    const heic = await heicWithExif();
    const r = await upload(team.editor.client, heic, 'IMG_0421.HEIC', 'image/heic');
    expect(r.status, r.body.toString()).toBe(201);
    expect(r.json.mime).toBe('image/heic');
    expect(r.json.thumbnailUrl).toBeNull();
    expect(r.json.notes.join(' ')).toMatch(/cannot decode HEIC/);
    expect(r.json.exif).toMatchObject({ iso: 200, aperture: 8, focalMm: 85 });
    const served = await raw(base, team.owner.client, r.json.url);
    expect(served.body.length).toBe(heic.length);
    expect(served.body.includes(Buffer.from('Falloff Bench Camera'))).toBe(false);
    expect(await exifr.gps(served.body).catch(() => undefined)).toBeUndefined();
    expect((await raw(base, team.owner.client, `${r.json.url}/thumbnail`)).status).toBe(404);
  });

  it('strips a location given in XMP: a JPEG is re-encoded without it, a HEIC has its XMP item blanked', async () => {
    const jpg = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#6f7a80' } }).jpeg().withXmp(XMP_WITH_GPS).toBuffer();
    expect(await exifr.parse(jpg, { xmp: true })).toMatchObject({ GPSLatitude: '51,30.2N' }); // the upload says where
    const r = await upload(team.crew.client, jpg, 'phone.jpg', 'image/jpeg');
    expect(r.status, r.body.toString()).toBe(201);
    for (const url of [r.json.url, r.json.thumbnailUrl]) {
      const served = await raw(base, team.owner.client, url);
      expect(served.status).toBe(200);
      expect(await exifr.parse(served.body, { xmp: true })).toBeUndefined();
      expect(served.body.includes(Buffer.from('GPSLatitude'))).toBe(false);
      expect(served.body.includes(Buffer.from('x:xmpmeta'))).toBe(false);
    }

    const heic = await heicWithExifAndXmp();
    expect(heic.includes(Buffer.from('GPSLatitude'))).toBe(true);
    expect(await exifr.gps(heic)).toMatchObject({ latitude: expect.closeTo(51.5033, 3) });
    const h = await upload(team.crew.client, heic, 'IMG_0500.HEIC', 'image/heic');
    expect(h.status, h.body.toString()).toBe(201);
    const served = await raw(base, team.owner.client, h.json.url);
    expect(served.body.length).toBe(heic.length);
    expect(served.body.includes(Buffer.from('GPSLatitude'))).toBe(false);
    expect(served.body.includes(Buffer.from('xmpmeta'))).toBe(false);
    expect(await exifr.gps(served.body).catch(() => undefined)).toBeUndefined();
  });

  it('strips XMP and EXIF locations from PNG and WebP too: the served copy and the thumbnail carry neither', async () => {
    const picture = () => sharp({ create: { width: 640, height: 480, channels: 3, background: '#5c6670' } });
    const exifGps = { IFD0: { Make: 'Falloff', Model: 'Falloff Bench Camera' }, IFD3: GPS };
    const cases = [
      { name: 'phone.png', type: 'image/png', bytes: await picture().png().withExif(exifGps).withXmp(XMP_WITH_GPS).toBuffer() },
      { name: 'phone.webp', type: 'image/webp', bytes: await picture().webp().withExif(exifGps).withXmp(XMP_WITH_GPS).toBuffer() },
    ];
    for (const c of cases) {
      // The upload says where it was taken, in XMP and in EXIF.
      // (PNG keeps its XMP in a compressed text chunk, so its words are not in the file's bytes as they are.)
      const given = await sharp(c.bytes).metadata();
      expect(given.xmp?.toString('utf8'), c.name).toContain('exif:GPSLatitude');
      expect(given.exif, c.name).toBeDefined();
      expect(given.exif!.includes(Buffer.from('Falloff Bench Camera')), c.name).toBe(true);
      const r = await upload(team.crew.client, c.bytes, c.name, c.type);
      expect(r.status, r.body.toString()).toBe(201);
      expect(r.json.mime).toBe(c.type);
      for (const url of [r.json.url, r.json.thumbnailUrl]) {
        const served = await raw(base, team.owner.client, url);
        expect(served.status, `${c.name} ${url}`).toBe(200);
        for (const mark of ['xmpmeta', 'XML:com.adobe.xmp', 'eXIf', 'XMP ', 'EXIF']) expect(served.body.includes(Buffer.from(mark, 'latin1')), `${c.name} ${url}: ${mark}`).toBe(false);
        expect(served.body.includes(Buffer.from('GPSLatitude')), `${c.name} ${url}`).toBe(false);
        expect(served.body.includes(Buffer.from('Falloff Bench Camera')), `${c.name} ${url}`).toBe(false);
        const meta = await sharp(served.body).metadata();
        expect(meta.xmp, `${c.name} ${url}`).toBeUndefined();
        expect(meta.exif, `${c.name} ${url}`).toBeUndefined();
      }
    }
  });

  it('refuses a picture of more than 64 million pixels from its header, before decoding it (413 naming the photo)', async () => {
    const before = await stored();
    const bomb = pngHeaderOnly(16_000, 16_000);
    expect(bomb.length).toBeLessThan(5000);
    const r = await upload(team.owner.client, bomb, 'small-file-huge-picture.png', 'image/png');
    expect(r.status).toBe(413);
    expect(r.json.error).toMatchObject({ code: 'too_many_pixels', fields: { photo: expect.stringMatching(/million pixels/) } });
    expect(r.json.error.message).toMatch(/16000 × 16000/);
    // Just under the cap by its header but damaged: read, found wanting, 422.
    const cut = await upload(team.owner.client, pngHeaderOnly(4000, 3000), 'cut.png', 'image/png');
    expect(cut.status).toBe(422);
    expect(cut.json.error.fields).toHaveProperty('photo');
    expect((await stored()).sort()).toEqual(before.sort());
  });

  it('refuses a file over 20 MB (413), a GIF and a script named .jpg (415), no file or a bad kind (400); nothing is stored', async () => {
    const before = await stored();
    const big = Buffer.concat([await cameraJpeg(), Buffer.alloc(20 * 1024 * 1024)]);
    const tooBig = await upload(team.owner.client, big, 'huge.jpg', 'image/jpeg');
    expect(tooBig.status).toBe(413);
    expect(tooBig.json.error).toMatchObject({ code: 'too_large', fields: { photo: expect.any(String) } });

    const gif = await sharp({ create: { width: 10, height: 10, channels: 3, background: '#fff' } }).gif().toBuffer();
    const script = Buffer.from('#!/bin/sh\necho "not a photo"\n');
    for (const [bytes, name] of [
      [gif, 'anim.gif'],
      [script, 'holiday.jpg'],
      [Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'plan.jpg'],
    ] as const) {
      const r = await upload(team.owner.client, bytes, name, 'image/jpeg');
      expect(r.status, name).toBe(415);
      expect(r.json.error.code).toBe('unsupported_type');
    }
    const damaged = (await cameraJpeg()).subarray(0, 300);
    const d = await upload(team.owner.client, damaged, 'cut.jpg', 'image/jpeg');
    expect(d.status).toBe(422);

    const form = new FormData();
    form.append('kind', 'result');
    const none = await raw(base, team.owner.client, `/api/setups/${setupId}/photos`, { method: 'POST', body: form });
    expect(none.status).toBe(400);
    expect(none.json.error.fields).toHaveProperty('photo');
    const badKind = await upload(team.owner.client, await cameraJpeg(), 'a.jpg', 'image/jpeg', { kind: 'selfie' });
    expect(badKind.status).toBe(400);
    expect(badKind.json.error.fields).toHaveProperty('kind');
    const json = await team.owner.client.post(`/api/setups/${setupId}/photos`, { photo: 'x' });
    expect(json.status).toBe(400);

    expect((await stored()).sort()).toEqual(before.sort());
  });

  it('is for studio members only', async () => {
    const other = await fresh(base, 'Photo Stranger');
    expect((await upload(other.client, await cameraJpeg(), 'a.jpg', 'image/jpeg')).status).toBe(404);
    expect((await upload(null, await cameraJpeg(), 'a.jpg', 'image/jpeg')).status).toBe(401);
    expect((await other.client.get(`/api/setups/${setupId}/photos`)).status).toBe(404);
  });
});

describe('DELETE /api/setups/:id/photos/:photoId', () => {
  it('lets the uploader or an editor delete, not other crew, and removes the stored objects', async () => {
    const mine = (await upload(team.crew.client, await cameraJpeg(), 'crew.jpg', 'image/jpeg')).json;
    const editors = (await upload(team.editor.client, await cameraJpeg(), 'editor.jpg', 'image/jpeg')).json;
    expect((await team.crew.client.del(`/api/setups/${setupId}/photos/${editors.id}`)).status).toBe(403);
    expect((await team.crew.client.del(`/api/setups/${setupId}/photos/${mine.id}`)).status).toBe(204);
    expect((await team.owner.client.del(`/api/setups/${setupId}/photos/${editors.id}`)).status).toBe(204);
    const keys = await stored();
    expect(keys.filter((k) => k.includes(mine.id) || k.includes(editors.id))).toEqual([]);
    expect((await raw(base, team.owner.client, mine.url)).status).toBe(404);
    expect((await team.owner.client.del(`/api/setups/${setupId}/photos/${mine.id}`)).status).toBe(404);
  });
});
