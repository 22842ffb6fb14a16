// HEIC/HEIF files are ISO base media files: a `meta` box lists items (`iinf`) and where their bytes are
// (`iloc`). The EXIF block (GPS included) is one such item, an XMP packet (which may carry a location too) is
// another ('mime' items of type application/rdf+xml). This blanks those items' bytes in place, so offsets
// stay valid and the picture is untouched, without needing a HEIC decoder.

type Box = { type: string; start: number; body: number; end: number };

function* boxes(b: Buffer, from: number, to: number): Generator<Box> {
  let p = from;
  while (p + 8 <= to) {
    let size = b.readUInt32BE(p);
    const type = b.toString('latin1', p + 4, p + 8);
    let body = p + 8;
    if (size === 1) {
      if (p + 16 > to) return;
      size = Number(b.readBigUInt64BE(p + 8));
      body = p + 16;
    } else if (size === 0) size = to - p;
    if (size < body - p || p + size > to) return;
    yield { type, start: p, body, end: p + size };
    p += size;
  }
}

const child = (b: Buffer, parent: { body: number; end: number }, type: string, skip = 0) => {
  for (const x of boxes(b, parent.body + skip, parent.end)) if (x.type === type) return x;
  return null;
};

function readN(b: Buffer, p: number, n: number): number {
  if (n === 0) return 0;
  if (n === 2) return b.readUInt16BE(p);
  if (n === 4) return b.readUInt32BE(p);
  if (n === 8) return Number(b.readBigUInt64BE(p));
  throw new Error(`unexpected field size ${n}`);
}

/** A zero-terminated string at p (and where the next field starts). */
function cString(b: Buffer, p: number, end: number): [string, number] {
  const z = b.indexOf(0, p);
  const stop = z < 0 || z >= end ? end : z;
  return [b.toString('latin1', p, stop), Math.min(end, stop + 1)];
}

/** A copy of `input` with every `Exif` and XMP item's bytes set to zero; unchanged when it has none. */
export function stripHeifExif(input: Buffer): Buffer {
  const b = Buffer.from(input);
  const meta = [...boxes(b, 0, b.length)].find((x) => x.type === 'meta');
  if (!meta) return b;
  const FULL = 4; // version and flags before a full box's children or fields
  const iinf = child(b, meta, 'iinf', FULL);
  const iloc = child(b, meta, 'iloc', FULL);
  if (!iinf || !iloc) return b;

  const exifIds = new Set<number>();
  const iinfVersion = b[iinf.body]!;
  for (const infe of boxes(b, iinf.body + FULL + (iinfVersion === 0 ? 2 : 4), iinf.end)) {
    if (infe.type !== 'infe') continue;
    const v = b[infe.body]!;
    if (v < 2) continue;
    const id = v === 2 ? b.readUInt16BE(infe.body + 4) : b.readUInt32BE(infe.body + 4);
    const typeAt = infe.body + 4 + (v === 2 ? 2 : 4) + 2;
    const itemType = b.toString('latin1', typeAt, typeAt + 4);
    if (itemType === 'Exif') exifIds.add(id);
    else if (itemType === 'mime') {
      // item_name, then content_type: an XMP packet is application/rdf+xml.
      const [, afterName] = cString(b, typeAt + 4, infe.end);
      const [contentType] = cString(b, afterName, infe.end);
      if (/rdf\+xml|xmp/i.test(contentType)) exifIds.add(id);
    }
  }
  if (!exifIds.size) return b;

  const idat = child(b, meta, 'idat', FULL);
  const v = b[iloc.body]!;
  let p = iloc.body + FULL;
  const offsetSize = b[p]! >> 4;
  const lengthSize = b[p]! & 15;
  const baseSize = b[p + 1]! >> 4;
  const indexSize = v === 1 || v === 2 ? b[p + 1]! & 15 : 0;
  p += 2;
  const count = v < 2 ? b.readUInt16BE(p) : b.readUInt32BE(p);
  p += v < 2 ? 2 : 4;
  for (let i = 0; i < count; i++) {
    const id = v < 2 ? b.readUInt16BE(p) : b.readUInt32BE(p);
    p += v < 2 ? 2 : 4;
    let method = 0;
    if (v === 1 || v === 2) {
      method = b.readUInt16BE(p) & 15;
      p += 2;
    }
    p += 2; // data reference index
    const base = readN(b, p, baseSize);
    p += baseSize;
    const extents = b.readUInt16BE(p);
    p += 2;
    for (let e = 0; e < extents; e++) {
      p += indexSize;
      const off = readN(b, p, offsetSize);
      p += offsetSize;
      const len = readN(b, p, lengthSize);
      p += lengthSize;
      if (!exifIds.has(id)) continue;
      // Method 0: offsets in the file; 1: offsets in the meta box's idat.
      const at = method === 1 && idat ? idat.body + base + off : base + off;
      const end = len === 0 ? (method === 1 && idat ? idat.end : b.length) : at + len;
      if (method <= 1 && at >= 0 && end <= b.length && at < end) b.fill(0, at, end);
    }
  }
  return b;
}
