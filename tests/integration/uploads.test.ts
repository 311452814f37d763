/**
 * Photos and files on a trial, end to end: the route handlers, the real test PostgreSQL and the
 * S3 fake (s3rver) that scripts/test.sh starts. Every picture is generated here with sharp.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { deflateSync } from 'node:zlib';
import sharp from 'sharp';
import { createWorkspace, callRoute, actorOf, APP_ORIGIN, authHeaders, type WorkspaceFixture, type Caller } from './harness';
import { createFixtureTrial } from './fixtures';
import { trialWithVariants } from './access-trials';
import { getEm } from '@/lib/db';
import { Upload } from '@/entities';
import { ensureBucket, getObjectBytes, listObjectKeys } from '@/lib/storage';
import { createUpload } from '@/lib/uploads/mutations';
import { cleanFileName, contentDisposition, csvProblem, FILE_NAME_MAX_CHARS } from '@/lib/uploads/content';
import { FILE_MAX_BYTES, PHOTO_MAX_BYTES, PHOTO_MAX_PIXELS, THUMBNAIL_MAX_PX, UPLOAD_LIMITS } from '@/lib/uploads/schema';
import * as trialUploads from '@/app/api/v1/trials/[trialId]/uploads/route';
import * as oneUpload from '@/app/api/v1/uploads/[uploadId]/route';
import * as thumbnailRoute from '@/app/api/v1/uploads/[uploadId]/thumbnail/route';

let a: WorkspaceFixture;
let b: WorkspaceFixture;
let developer: Caller;
let outsiderAdmin: Caller;

beforeAll(async () => {
  await ensureBucket();
  a = await createWorkspace('Uploads A');
  b = await createWorkspace('Uploads B');
  developer = { kind: 'session', person: a.people.developer };
  outsiderAdmin = { kind: 'session', person: b.people.admin };
});

// --- generated inputs --------------------------------------------------------------------------

async function generatedPng(width: number, height: number): Promise<Uint8Array> {
  // Noise, so the PNG is not trivially small and the round trip compares many bytes.
  const raw = Buffer.alloc(width * height * 3);
  for (let i = 0; i < raw.length; i++) raw[i] = (i * 2654435761) >>> 24;
  return new Uint8Array(await sharp(raw, { raw: { width, height, channels: 3 } }).png().toBuffer());
}

/** A JPEG stored sideways (orientation 6) with a GPS position in its EXIF. */
async function sidewaysJpegWithGps(): Promise<Uint8Array> {
  const jpeg = await sharp({ create: { width: 600, height: 300, channels: 3, background: '#8e1b3a' } })
    .jpeg({ quality: 85 })
    .withMetadata({ orientation: 6 })
    .withExif({ IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '48/1 51/1 24/1', GPSLongitudeRef: 'E', GPSLongitude: '2/1 21/1 3/1' } })
    .toBuffer();
  return new Uint8Array(jpeg);
}

/** The first 64 bytes of a 64-bit little-endian ELF file: what a renamed program starts with. */
function elfHeader(): Uint8Array {
  const bytes = new Uint8Array(64);
  bytes.set([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]);
  return bytes;
}

/** A one-entry ZIP local file header (a workbook or archive renamed to .jpg). */
function zipHeader(): Uint8Array {
  return new Uint8Array([0x50, 0x4b, 0x03, 0x04, 20, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 1, 0, 0, 0, 1, 0, 0, 0, 0x61, 0x61]);
}

function minimalPdf(catalogExtra = ''): Uint8Array {
  const objects = [
    `1 0 obj << /Type /Catalog /Pages 2 0 R${catalogExtra} >> endobj\n`,
    '2 0 obj << /Type /Pages /Kids [3 0 R] /Count 1 >> endobj\n',
    '3 0 obj << /Type /Page /Parent 2 0 R /MediaBox [0 0 200 200] >> endobj\n',
  ];
  let body = '%PDF-1.4\n';
  const offsets: number[] = [];
  for (const o of objects) {
    offsets.push(body.length);
    body += o;
  }
  const xref = body.length;
  body += `xref\n0 4\n0000000000 65535 f \n${offsets.map((n) => `${String(n).padStart(10, '0')} 00000 n \n`).join('')}`;
  body += `trailer << /Size 4 /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return new TextEncoder().encode(body);
}

/**
 * A valid greyscale PNG of any size, 1 bit per pixel, built by hand (signature, IHDR, one IDAT
 * of zero rows, IEND): a 79-megapixel picture in about 10 kB.
 * Source: W3C Portable Network Graphics (PNG) Specification (Third Edition), §5 and §11.2 (memory).
 */
function bilevelPng(width: number, height: number): Uint8Array {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (bytes: Buffer) => {
    let c = 0xffffffff;
    for (const b of bytes) c = crcTable[(c ^ b) & 0xff] ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
    const out = Buffer.alloc(8 + data.length + 4);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(crc(body), 8 + data.length);
    return out;
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([1, 0, 0, 0, 0], 8); // bit depth 1, greyscale, deflate, adaptive filtering, no interlace
  const rows = Buffer.alloc((1 + Math.ceil(width / 8)) * height); // filter byte 0 + all-black pixels per row
  return new Uint8Array(Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(rows)), chunk('IEND', Buffer.alloc(0))]));
}

/** Whether EXIF data (as sharp returns it, starting "Exif\0\0") has a GPS IFD pointer in IFD0. */
function hasGpsPointer(exif: Buffer | undefined): boolean {
  if (!exif) return false;
  const tiff = exif.subarray(exif.subarray(0, 6).toString('latin1') === 'Exif\0\0' ? 6 : 0);
  const little = tiff.subarray(0, 2).toString('latin1') === 'II';
  const u16 = (o: number) => (little ? tiff.readUInt16LE(o) : tiff.readUInt16BE(o));
  const u32 = (o: number) => (little ? tiff.readUInt32LE(o) : tiff.readUInt32BE(o));
  const ifd0 = u32(4);
  const count = u16(ifd0);
  for (let i = 0; i < count; i++) if (u16(ifd0 + 2 + i * 12) === 0x8825) return true;
  return false;
}

// --- calls -------------------------------------------------------------------------------------

function form(name: string, bytes: Uint8Array, fields: Record<string, string> = {}): FormData {
  const f = new FormData();
  // The browser's claimed type is deliberately wrong: only the bytes count.
  f.set('file', new File([bytes as BlobPart], name, { type: 'image/jpeg' }));
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

function post(trialId: string, body: FormData, caller: Caller = developer) {
  return callRoute(trialUploads.POST, { method: 'POST', path: `/api/v1/trials/${trialId}/uploads`, caller, params: { trialId }, body });
}

function list(trialId: string, caller: Caller = developer, query = '') {
  return callRoute(trialUploads.GET, { method: 'GET', path: `/api/v1/trials/${trialId}/uploads${query}`, caller, params: { trialId } });
}

/** Downloads keep their bytes (callRoute would decode them as text). */
async function download(handler: typeof oneUpload.GET, uploadId: string, suffix = '', caller: Caller = developer) {
  const req = new Request(`${APP_ORIGIN}/api/v1/uploads/${uploadId}${suffix}`, { headers: authHeaders(caller) });
  const res = await handler(req, { params: Promise.resolve({ uploadId }) });
  return { status: res.status, headers: res.headers, bytes: new Uint8Array(await res.arrayBuffer()) };
}

async function storedFor(fx: WorkspaceFixture, trialId: string) {
  const em = await getEm();
  const rows = await em.count(Upload, { workspace: fx.workspaceId, trial: trialId });
  const keys = await listObjectKeys(`${fx.workspaceId}/${trialId}/`);
  return { rows, keys };
}

const same = (x: Uint8Array, y: Uint8Array) => Buffer.from(x).equals(Buffer.from(y));

// --- tests -------------------------------------------------------------------------------------

describe('photos', () => {
  it('stores a PNG as uploaded, with its size in pixels and a WebP thumbnail, and serves it back byte for byte', async () => {
    const { trialId } = await createFixtureTrial(a);
    const png = await generatedPng(1200, 800);
    // Source: W3C PNG Specification, "PNG file signature": 137 80 78 71 13 10 26 10.
    expect([...png.subarray(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);

    const res = await post(trialId, form('strawberry-jar.jpg', png, { subject: 'jar' }));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const up = res.body.upload;
    expect(up).toMatchObject({
      kind: 'photo',
      subject: 'jar',
      contentType: 'image/png', // the bytes say PNG, whatever the name and the browser claimed
      originalName: 'strawberry-jar.jpg',
      sizeBytes: png.byteLength,
      width: 1200,
      height: 800,
      url: `/api/v1/uploads/${up.id}`,
      thumbnailUrl: `/api/v1/uploads/${up.id}/thumbnail`,
    });
    expect(up.uploadedByName).toBeTruthy();

    const original = await download(oneUpload.GET, up.id);
    expect(original.status).toBe(200);
    expect(same(original.bytes, png)).toBe(true);
    expect(original.headers.get('content-type')).toBe('image/png');
    // Source: WHATWG Fetch Standard, "X-Content-Type-Options" header: the value nosniff (memory).
    expect(original.headers.get('x-content-type-options')).toBe('nosniff');
    expect(original.headers.get('cache-control')).toBe('private, max-age=300');
    // Source: RFC 6266 §4.2, disposition type "inline" (memory).
    expect(original.headers.get('content-disposition')).toMatch(/^inline; filename="strawberry-jar\.jpg"/);

    const thumb = await download(thumbnailRoute.GET, up.id, '/thumbnail');
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toBe('image/webp');
    // Source: RFC 9649 (WebP Image Format), RIFF header: "RIFF", 4-byte size, "WEBP" (memory).
    expect(Buffer.from(thumb.bytes.subarray(0, 4)).toString('latin1')).toBe('RIFF');
    expect(Buffer.from(thumb.bytes.subarray(8, 12)).toString('latin1')).toBe('WEBP');
    const meta = await sharp(thumb.bytes).metadata();
    // Setwell's own rule: the long side shrinks to THUMBNAIL_MAX_PX, keeping the 3:2 shape.
    expect([meta.width, meta.height]).toEqual([THUMBNAIL_MAX_PX, (THUMBNAIL_MAX_PX * 800) / 1200]);

    const listed = await list(trialId);
    expect(listed.status).toBe(200);
    expect(listed.body.uploads.map((u: { id: string }) => u.id)).toEqual([up.id]);
  });

  it('turns a sideways JPEG upright for its size and thumbnail, strips EXIF GPS from the thumbnail and keeps the original untouched', async () => {
    const { trialId } = await createFixtureTrial(a);
    const jpeg = await sidewaysJpegWithGps();
    // Source: ITU-T T.81 (ISO/IEC 10918-1), Table B.1: SOI marker X'FFD8' (memory).
    expect([jpeg[0], jpeg[1]]).toEqual([0xff, 0xd8]);
    // Source: Exif 2.3 (JEITA CP-3451C), GPS Info IFD Pointer tag 34853 = 0x8825 in IFD0 (memory).
    expect(hasGpsPointer((await sharp(jpeg).metadata()).exif)).toBe(true);

    const res = await post(trialId, form('set-test.jpeg', jpeg, { subject: 'set_test' }));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // Source: Exif 2.3 (JEITA CP-3451C), Orientation tag value 6: the stored image is shown turned 90°, so width and height swap (memory).
    expect(res.body.upload).toMatchObject({ contentType: 'image/jpeg', width: 300, height: 600 });

    const original = await download(oneUpload.GET, res.body.upload.id);
    expect(same(original.bytes, jpeg)).toBe(true);

    const thumb = await download(thumbnailRoute.GET, res.body.upload.id, '/thumbnail');
    const meta = await sharp(thumb.bytes).metadata();
    expect([meta.width, meta.height]).toEqual([THUMBNAIL_MAX_PX / 2, THUMBNAIL_MAX_PX]);
    expect(meta.exif).toBeUndefined();
    expect(meta.orientation).toBeUndefined();
  });

  it('files a photo under a variant of the trial and lists by variant; a variant of another trial is 404', async () => {
    const { trialId, baseId, otherId } = await trialWithVariants(a);
    const png = await generatedPng(64, 48);
    const onBase = await post(trialId, form('a.png', png, { variantId: baseId }));
    const onOther = await post(trialId, form('b.png', png, { variantId: otherId }));
    expect([onBase.status, onOther.status]).toEqual([201, 201]);
    const filtered = await list(trialId, developer, `?variantId=${baseId}`);
    expect(filtered.body.uploads.map((u: { id: string }) => u.id)).toEqual([onBase.body.upload.id]);
    expect(filtered.body.uploads[0].variantId).toBe(baseId);

    const { trialId: elsewhere } = await createFixtureTrial(a);
    const wrong = await post(elsewhere, form('c.png', png, { variantId: baseId }));
    expect(wrong.status).toBe(404);
    expect(await storedFor(a, elsewhere)).toEqual({ rows: 0, keys: [] });
  });

  it('refuses a HEIC photo that this server cannot open, with a message saying what to do', async () => {
    const { trialId } = await createFixtureTrial(a);
    // Source: ISO/IEC 23008-12 (HEIF), file type box "ftyp" with major brand "heic" (memory).
    // The prebuilt sharp has no HEVC decoder, so a real HEIC takes the same path as this header.
    const ftyp = Buffer.concat([Buffer.from([0, 0, 0, 24]), Buffer.from('ftypheic\0\0\0\0mif1heic', 'latin1')]);
    const res = await post(trialId, form('IMG_0001.HEIC', new Uint8Array(Buffer.concat([ftyp, Buffer.alloc(64)]))));
    // Source: RFC 9110 (HTTP Semantics), 415 Unsupported Media Type (memory).
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/HEIC/);
    expect(res.body.error.message).toMatch(/JPEG/);
    expect(await storedFor(a, trialId)).toEqual({ rows: 0, keys: [] });
  });
});

describe('refused content', () => {
  it('refuses a program renamed jam.jpg (415), naming what it really is, and stores nothing', async () => {
    const { trialId } = await createFixtureTrial(a);
    // Source: System V ABI / Tool Interface Standard ELF Specification 1.2, e_ident[EI_MAG0..3] = 0x7f 'E' 'L' 'F' (memory).
    const res = await post(trialId, form('jam.jpg', elfHeader()));
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_type');
    expect(res.body.error.message).toMatch(/ELF executable/);
    expect(await storedFor(a, trialId)).toEqual({ rows: 0, keys: [] });
  });

  it('refuses a Windows program and a ZIP archive renamed to photos', async () => {
    const { trialId } = await createFixtureTrial(a);
    // Source: Microsoft PE Format specification, MS-DOS stub signature "MZ" (memory).
    const exe = new Uint8Array(128);
    exe.set([0x4d, 0x5a]);
    const asExe = await post(trialId, form('spread.png', exe));
    expect(asExe.status).toBe(415);
    expect(asExe.body.error.message).toMatch(/Windows program/);
    // Source: PKWARE APPNOTE.TXT §4.3.7, local file header signature 0x04034b50 ("PK\x03\x04") (memory).
    const asZip = await post(trialId, form('jar.jpg', zipHeader()));
    expect(asZip.status).toBe(415);
    expect(asZip.body.error.message).toMatch(/ZIP archive/);
    expect(await storedFor(a, trialId)).toEqual({ rows: 0, keys: [] });
  });

  it('refuses an empty file with 422', async () => {
    const { trialId } = await createFixtureTrial(a);
    const res = await post(trialId, form('nothing.png', new Uint8Array(0)));
    // Source: RFC 9110 (HTTP Semantics), 422 Unprocessable Content (memory).
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('empty_file');
  });

  it('refuses a body without a file, and a body that is not multipart', async () => {
    const { trialId } = await createFixtureTrial(a);
    const noFile = new FormData();
    noFile.set('subject', 'jar');
    const missing = await post(trialId, noFile);
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields.file).toBeTruthy();
    const asJson = await callRoute(trialUploads.POST, { method: 'POST', path: `/api/v1/trials/${trialId}/uploads`, caller: developer, params: { trialId }, body: { file: 'x' } });
    expect(asJson.status).toBe(415);
  });
});

describe('size limits', () => {
  it('refuses a photo one byte over the 12 MB limit (413) and stores nothing', async () => {
    const { trialId } = await createFixtureTrial(a);
    const png = await generatedPng(16, 16);
    const oversized = new Uint8Array(PHOTO_MAX_BYTES + 1);
    oversized.set(png); // a real PNG at the start, padding after its end: still sniffed as PNG
    const res = await post(trialId, form('big.png', oversized));
    // Source: RFC 9110 (HTTP Semantics), 413 Content Too Large (memory).
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/12\.0 MB/);
    expect(await storedFor(a, trialId)).toEqual({ rows: 0, keys: [] });
  });

  it('refuses a request whose declared length is over the limit before reading it', async () => {
    const { trialId } = await createFixtureTrial(a);
    const headers = authHeaders(developer, true);
    headers.set('content-type', 'multipart/form-data; boundary=setwell');
    headers.set('content-length', String(FILE_MAX_BYTES * 2));
    const req = new Request(`${APP_ORIGIN}/api/v1/trials/${trialId}/uploads`, { method: 'POST', headers, body: '--setwell--\r\n' });
    const res = await trialUploads.POST(req, { params: Promise.resolve({ trialId }) });
    expect(res.status).toBe(413);
  });

  it('applies the file limit to PDFs (checked with a smaller injected limit)', async () => {
    const { trialId } = await createFixtureTrial(a);
    const pdf = minimalPdf();
    const small = { ...UPLOAD_LIMITS, fileMaxBytes: pdf.byteLength - 1 };
    await expect(createUpload(actorOf(a, 'developer'), { trialId, file: { name: 'lab.pdf', bytes: pdf } }, small)).rejects.toMatchObject({ status: 413 });
    const fits = await createUpload(actorOf(a, 'developer'), { trialId, file: { name: 'lab.pdf', bytes: pdf } }, { ...small, fileMaxBytes: pdf.byteLength });
    expect(fits.kind).toBe('file');
  });
});

describe('files', () => {
  it('accepts a minimal PDF as a file, without a thumbnail, served as an attachment', async () => {
    const { trialId } = await createFixtureTrial(a);
    const pdf = minimalPdf();
    // Source: ISO 32000-1:2008 §7.5.2, file header "%PDF-1.n" on the first line (memory).
    expect(new TextDecoder().decode(pdf.subarray(0, 8))).toBe('%PDF-1.4');
    const res = await post(trialId, form('cook-sheet.pdf', pdf));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.upload).toMatchObject({ kind: 'file', contentType: 'application/pdf', width: null, height: null, thumbnailUrl: null });
    const file = await download(oneUpload.GET, res.body.upload.id);
    expect(same(file.bytes, pdf)).toBe(true);
    expect(file.headers.get('content-disposition')).toMatch(/^attachment;/);
    expect((await download(thumbnailRoute.GET, res.body.upload.id, '/thumbnail')).status).toBe(404);
  });

  it('accepts a UTF-8 CSV named .csv, served as an attachment', async () => {
    const { trialId } = await createFixtureTrial(a);
    // Source: RFC 4180 §2, fields separated by commas, records by CRLF.
    const csv = new TextEncoder().encode('variant,brix_reading,ph\r\nA,64.5,3.2\r\nB,62.0,3.3\r\n');
    const res = await post(trialId, form('Cooks – Dezember.csv', csv));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // Source: RFC 4180 §3, media type text/csv.
    expect(res.body.upload).toMatchObject({ kind: 'file', contentType: 'text/csv', thumbnailUrl: null });
    const file = await download(oneUpload.GET, res.body.upload.id);
    expect(same(file.bytes, csv)).toBe(true);
    expect(file.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    // Source: RFC 6266 §4.3 (ASCII filename beside filename*) and RFC 8187 §3.2.1 (UTF-8'' percent-encoding) (memory).
    expect(file.headers.get('content-disposition')).toBe(`attachment; filename="Cooks  Dezember.csv"; filename*=UTF-8''Cooks%20%E2%80%93%20Dezember.csv`);
  });

  it('refuses a CSV with NUL bytes, one that is not UTF-8, one without column separators, and text not named .csv', async () => {
    const { trialId } = await createFixtureTrial(a);
    const withNul = await post(trialId, form('cooks.csv', new TextEncoder().encode('variant,ph\nA,3.2\0\0\0\n')));
    expect(withNul.status).toBe(415);
    expect(withNul.body.error.message).toMatch(/NUL/);
    const latin1 = await post(trialId, form('cooks.csv', new Uint8Array([0x41, 0x2c, 0xe9, 0x0a])));
    expect(latin1.status).toBe(415);
    expect(latin1.body.error.message).toMatch(/UTF-8/);
    const noDelimiter = await post(trialId, form('cooks.csv', new TextEncoder().encode('just a sentence about jam\n')));
    expect(noDelimiter.status).toBe(415);
    const notNamedCsv = await post(trialId, form('cooks.txt', new TextEncoder().encode('variant,ph\nA,3.2\n')));
    expect(notNamedCsv.status).toBe(415);
    expect(await storedFor(a, trialId)).toEqual({ rows: 0, keys: [] });
    // Tabs and semicolons separate columns too (spreadsheet exports in many locales).
    expect(csvProblem(new TextEncoder().encode('variant;ph\nA;3,2\n'))).toBeNull();
    expect(csvProblem(new TextEncoder().encode('variant\tph\nA\t3.2\n'))).toBeNull();
  });

  it('never lets a file name break the Content-Disposition header', () => {
    const header = contentDisposition('attachment', 'C:\\fakepath\\jar "B"\r\nSet-Cookie: x=1;.csv');
    expect(header).not.toMatch(/[\r\n]/);
    expect(header.startsWith('attachment; filename="jar _B_Set-Cookie: x=1_.csv"; ')).toBe(true);
  });
});

describe('file names', () => {
  it('file names: strips bidi overrides and other control characters, NUL and lone surrogates; bounds the length, keeps the extension', () => {
    // Source: Unicode Standard Annex #9, explicit directional formatting characters (U+202A–U+202E, U+2066–U+2069) and marks (U+200E, U+200F, U+061C).
    expect(cleanFileName('invoice\u202Egpj.exe')).toBe('invoicegpj.exe');
    expect(cleanFileName('\u2067jar\u2069 \u200Eb\u200F\u061C.png')).toBe('jar b.png');
    expect(cleanFileName('set\u0000test\u0085\u009b.jpg')).toBe('settest.jpg');
    expect(cleanFileName('zero\u200Bwidth\uFEFF\u2028line.csv')).toBe('zerowidthline.csv');
    expect(cleanFileName('lone\uD800 \uDC00surrogates.png')).toBe('lone surrogates.png');
    expect(cleanFileName('jar \uD83C\uDF53 strawberry.jpg')).toBe('jar \uD83C\uDF53 strawberry.jpg');
    expect(cleanFileName('\u202E\u202D\u0000 ')).toBe('upload');
    const long = cleanFileName(`${'Aprikose '.repeat(60)}.jpg`);
    expect(Array.from(long)).toHaveLength(FILE_NAME_MAX_CHARS);
    expect(long.endsWith('.jpg')).toBe(true);
    expect(Array.from(cleanFileName(`${'\uD83C\uDF53'.repeat(300)}`))).toHaveLength(FILE_NAME_MAX_CHARS);
    // Cut between characters, never inside a surrogate pair.
    expect(cleanFileName(`${'\uD83C\uDF53'.repeat(300)}`)).toBe('\uD83C\uDF53'.repeat(FILE_NAME_MAX_CHARS));
  });

  it('file names: an upload named with a right-to-left override is stored and served without it', async () => {
    const { trialId } = await createFixtureTrial(a);
    const res = await post(trialId, form('jar\u202Egnp.exe', await generatedPng(40, 30)));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.upload.originalName).toBe('jargnp.exe');
    const file = await download(oneUpload.GET, res.body.upload.id);
    expect(file.headers.get('content-disposition')).toBe(`inline; filename="jargnp.exe"; filename*=UTF-8''jargnp.exe`);
    const nameless = await post(trialId, form('\u202E\u2066', await generatedPng(40, 30)));
    expect(nameless.body.upload.originalName).toBe('upload.png');
  });
});

describe('downloads', () => {
  it('downloads: a PDF with an auto-run action is served as an attachment with nosniff; photos stay inline', async () => {
    const { trialId } = await createFixtureTrial(a);
    // Source: ISO 32000-1:2008 §12.3.2 and §12.6.4.16, a catalog /OpenAction running JavaScript when the document opens (memory).
    const pdf = minimalPdf(' /OpenAction << /S /JavaScript /JS (app.alert\\(1\\)) >>');
    const res = await post(trialId, form('recall-notice.pdf', pdf));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const file = await download(oneUpload.GET, res.body.upload.id);
    expect(file.headers.get('content-type')).toBe('application/pdf');
    // Source: RFC 6266 §4.2 — "attachment" asks the browser to save rather than display; WHATWG Fetch, X-Content-Type-Options: nosniff.
    expect(file.headers.get('content-disposition')).toMatch(/^attachment; filename="recall-notice.pdf"/);
    expect(file.headers.get('x-content-type-options')).toBe('nosniff');
    const photo = await post(trialId, form('jar.png', await generatedPng(40, 30)));
    const shown = await download(oneUpload.GET, photo.body.upload.id);
    expect(shown.headers.get('content-disposition')).toMatch(/^inline;/);
    expect(shown.headers.get('x-content-type-options')).toBe('nosniff');
  });
});

describe('pixel budget', () => {
  it(`pixel budget: refuses a 79-megapixel PNG (413) from its header, over the ${PHOTO_MAX_PIXELS / 1e6}-megapixel budget, and stores nothing`, async () => {
    const { trialId } = await createFixtureTrial(a);
    const png = bilevelPng(10_000, 7_900);
    expect(png.byteLength).toBeLessThan(PHOTO_MAX_BYTES);
    const meta = await sharp(png).metadata();
    expect([meta.width, meta.height]).toEqual([10_000, 7_900]);
    const res = await post(trialId, form('scan.png', png));
    expect(res.status, JSON.stringify(res.body)).toBe(413);
    expect(res.body.error.message).toBe(
      'The photo is 10000 × 7900 pixels (79 megapixels); Setwell keeps photos up to 50 megapixels. Export it smaller (for example with the long side at 4000 pixels) and try again.',
    );
    expect(await storedFor(a, trialId)).toEqual({ rows: 0, keys: [] });
  });

  it('pixel budget: the budget is inclusive (checked with a smaller injected budget)', async () => {
    const { trialId } = await createFixtureTrial(a);
    const budget = { ...UPLOAD_LIMITS, maxPixels: 40 * 25 };
    const fits = await createUpload(actorOf(a, 'developer'), { trialId, file: { name: 'fits.png', bytes: bilevelPng(40, 25) } }, budget);
    expect([fits.width, fits.height]).toEqual([40, 25]);
    await expect(createUpload(actorOf(a, 'developer'), { trialId, file: { name: 'over.png', bytes: bilevelPng(40, 26) } }, budget)).rejects.toMatchObject({ status: 413 });
  });
});

describe('workspaces', () => {
  it('answers another workspace with 404 on download, thumbnail, list and delete, and leaves the upload alone', async () => {
    const { trialId } = await createFixtureTrial(a);
    const res = await post(trialId, form('private.png', await generatedPng(40, 30)));
    expect(res.status).toBe(201);
    const id = res.body.upload.id;

    expect((await download(oneUpload.GET, id, '', outsiderAdmin)).status).toBe(404);
    expect((await download(thumbnailRoute.GET, id, '/thumbnail', outsiderAdmin)).status).toBe(404);
    expect((await list(trialId, outsiderAdmin)).status).toBe(404);
    const del = await callRoute(oneUpload.DELETE, { method: 'DELETE', path: `/api/v1/uploads/${id}`, caller: outsiderAdmin, params: { uploadId: id } });
    expect(del.status).toBe(404);
    const upload = await post(trialId, form('intruder.png', await generatedPng(8, 8)), outsiderAdmin);
    expect(upload.status).toBe(404);

    expect(await storedFor(a, trialId)).toMatchObject({ rows: 1 });
    expect((await download(oneUpload.GET, id)).status).toBe(200);
  });

  it('deletes the object, the thumbnail and the row', async () => {
    const { trialId } = await createFixtureTrial(a);
    const res = await post(trialId, form('gone.png', await generatedPng(40, 30)));
    const id = res.body.upload.id;
    expect((await storedFor(a, trialId)).keys.sort()).toEqual([`${a.workspaceId}/${trialId}/${id}/original`, `${a.workspaceId}/${trialId}/${id}/thumb.webp`]);
    expect(await getObjectBytes(`${a.workspaceId}/${trialId}/${id}/original`)).not.toBeNull();

    const del = await callRoute(oneUpload.DELETE, { method: 'DELETE', path: `/api/v1/uploads/${id}`, caller: developer, params: { uploadId: id } });
    expect(del.status).toBe(200);
    expect(await storedFor(a, trialId)).toEqual({ rows: 0, keys: [] });
    expect((await download(oneUpload.GET, id)).status).toBe(404);
  });
});
