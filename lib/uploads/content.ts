/**
 * Decides what an uploaded file really is from its bytes (magic numbers via file-type), never
 * from its name or the content type the browser claims, and prepares photos: dimensions and a
 * WebP thumbnail without metadata (no EXIF, so no GPS position). Pure: no database, no framework.
 */
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { ApiError } from '@/lib/api/errors';
import { UPLOAD_LIMITS, type UploadKind, type UploadLimits } from './schema';

export interface InspectedUpload {
  kind: UploadKind;
  /** The sniffed type the file is stored and served with. */
  contentType: string;
  /** Pixels as displayed (orientation applied); null for files. */
  width: number | null;
  height: number | null;
  /** WebP bytes, photos only. */
  thumbnail: Uint8Array | null;
}

const ACCEPTED_HINT = 'Setwell keeps photos as JPEG, PNG or WebP, and files as PDF or CSV.';

/** The photo types kept; the only uploads served inline. */
export const PHOTO_CONTENT_TYPES: ReadonlySet<string> = new Set(['image/jpeg', 'image/png', 'image/webp']);
const HEIC_TYPES = new Set(['image/heic', 'image/heic-sequence', 'image/heif', 'image/heif-sequence']);

/** Plain words for the types people most often send by mistake. */
const TYPE_NAMES: Record<string, string> = {
  'application/x-elf': 'a program (an ELF executable)',
  'application/x-msdownload': 'a Windows program (an EXE or DLL)',
  'application/x-mach-binary': 'a program (a Mach-O executable)',
  'application/zip': 'a ZIP archive',
  'application/x-rar-compressed': 'a RAR archive',
  'application/x-7z-compressed': 'a 7-Zip archive',
  'application/gzip': 'a gzip archive',
  'application/x-tar': 'a tar archive',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet': 'an Excel workbook (XLSX)',
  'application/vnd.openxmlformats-officedocument.wordprocessingml.document': 'a Word document (DOCX)',
  'application/x-cfb': 'an old Office document (XLS or DOC)',
  'image/gif': 'a GIF image',
  'image/tiff': 'a TIFF image',
  'image/avif': 'an AVIF image',
  'image/bmp': 'a BMP image',
  'image/svg+xml': 'an SVG drawing',
  'application/xml': 'an XML document',
  'text/html': 'a web page (HTML)',
};

function megabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(bytes < 1024 * 1024 ? 2 : 1)} MB`;
}

function tooLarge(what: string, sizeBytes: number, maxBytes: number): ApiError {
  return new ApiError(413, 'too_large', `${what} can be at most ${megabytes(maxBytes)}; this one is ${megabytes(sizeBytes)}.`);
}

function megapixels(pixels: number): string {
  return String(Math.round(pixels / 1e5) / 10);
}

function overPixelBudget(width: number, height: number, maxPixels: number): ApiError {
  return new ApiError(
    413,
    'too_large',
    `The photo is ${width} × ${height} pixels (${megapixels(width * height)} megapixels); Setwell keeps photos up to ${megapixels(maxPixels)} megapixels. Export it smaller (for example with the long side at 4000 pixels) and try again.`,
  );
}

function unsupported(message: string): ApiError {
  return new ApiError(415, 'unsupported_type', message);
}

/** Why the bytes are not a text CSV, or null when they plausibly are one (RFC 4180 shape, UTF-8). */
export function csvProblem(bytes: Uint8Array): string | null {
  if (bytes.includes(0)) return 'it contains NUL bytes, so it is binary data, not a text CSV';
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    return 'it is not valid UTF-8 text';
  }
  const firstLine = text.split(/\r\n|\n|\r/).find((line) => line.trim() !== '');
  if (firstLine === undefined) return 'it holds no rows';
  if (!/[,;\t]/.test(firstLine)) return 'its first row has no comma, semicolon or tab between columns';
  return null;
}

function hasCsvName(name: string): boolean {
  return /\.csv$/i.test(name.trim());
}

async function inspectPhoto(bytes: Uint8Array, contentType: string, limits: UploadLimits): Promise<InspectedUpload> {
  const input = { limitInputPixels: limits.maxPixels, failOn: 'error' as const };
  let width: number;
  let height: number;
  let thumbnail: Uint8Array;
  try {
    // The header only: the size is known before a single pixel is decoded.
    const meta = await sharp(bytes, { ...input, limitInputPixels: false }).metadata();
    width = meta.autoOrient?.width ?? meta.width;
    height = meta.autoOrient?.height ?? meta.height;
    if (width * height > limits.maxPixels) throw overPixelBudget(width, height, limits.maxPixels);
    // Turned upright first, because the orientation tag goes with the rest of the metadata.
    const webp = await sharp(bytes, input)
      .autoOrient()
      .resize({ width: limits.thumbnailMaxPx, height: limits.thumbnailMaxPx, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 80 })
      .toBuffer();
    thumbnail = new Uint8Array(webp);
  } catch (err) {
    if (err instanceof ApiError) throw err;
    const reason = err instanceof Error ? err.message : '';
    if (/pixel limit/i.test(reason)) {
      throw new ApiError(413, 'too_large', `The photo is larger than ${megapixels(limits.maxPixels)} megapixels once opened. Export it smaller and try again.`);
    }
    if (HEIC_TYPES.has(contentType)) {
      throw unsupported(
        'This is a HEIC/HEIF photo, which this server cannot open. Save or share it as JPEG (most phones offer a "most compatible" setting) and upload it again.',
      );
    }
    throw new ApiError(422, 'unreadable', 'The photo could not be opened: the file looks damaged or incomplete.');
  }
  return { kind: 'photo', contentType, width, height, thumbnail };
}

/**
 * What the file is and, for photos, its size in pixels and thumbnail.
 * 422 empty or damaged; 413 over the limit for its kind; 415 not a type Setwell keeps.
 */
export async function inspectUpload(name: string, bytes: Uint8Array, limits: UploadLimits = UPLOAD_LIMITS): Promise<InspectedUpload> {
  if (bytes.byteLength === 0) throw new ApiError(422, 'empty_file', 'The file is empty (0 bytes).');
  const largest = Math.max(limits.photoMaxBytes, limits.fileMaxBytes);
  if (bytes.byteLength > largest) throw tooLarge('An upload', bytes.byteLength, largest);

  const detected = await fileTypeFromBuffer(bytes);

  if (detected && (PHOTO_CONTENT_TYPES.has(detected.mime) || HEIC_TYPES.has(detected.mime))) {
    if (bytes.byteLength > limits.photoMaxBytes) throw tooLarge('A photo', bytes.byteLength, limits.photoMaxBytes);
    return inspectPhoto(bytes, detected.mime, limits);
  }
  if (detected?.mime === 'application/pdf') {
    if (bytes.byteLength > limits.fileMaxBytes) throw tooLarge('A file', bytes.byteLength, limits.fileMaxBytes);
    return { kind: 'file', contentType: 'application/pdf', width: null, height: null, thumbnail: null };
  }
  if (detected) {
    const what = TYPE_NAMES[detected.mime] ?? `a ${detected.ext.toUpperCase()} file (${detected.mime})`;
    throw unsupported(`"${name}" is really ${what}, whatever its name says. ${ACCEPTED_HINT}`);
  }

  // No magic number: text. Only a CSV is kept, and only when both the name and the bytes say so.
  if (!hasCsvName(name)) {
    throw unsupported(`Setwell could not recognise "${name}" as a photo, a PDF or a CSV. ${ACCEPTED_HINT}`);
  }
  const problem = csvProblem(bytes);
  if (problem) throw unsupported(`"${name}" is named .csv, but ${problem}. ${ACCEPTED_HINT}`);
  if (bytes.byteLength > limits.fileMaxBytes) throw tooLarge('A file', bytes.byteLength, limits.fileMaxBytes);
  return { kind: 'file', contentType: 'text/csv', width: null, height: null, thumbnail: null };
}

/**
 * Characters a file name never keeps: C0 and C1 controls and DEL; the bidirectional embeddings,
 * overrides, isolates and marks that make "gpj.exe" read as "exe.jpg" (Unicode Standard Annex #9,
 * explicit directional formatting characters, and the implicit marks LRM, RLM, ALM); zero-width
 * characters, the byte-order mark and the line/paragraph separators; lone UTF-16 surrogates.
 */
const UNSAFE_IN_NAMES =
  /[\u0000-\u001f\u007f-\u009f\u061c\u200b-\u200f\u2028-\u202e\u2060-\u2069\ufeff]|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g;

/** Longest kept file name, in characters (code points); the extension survives the cut. */
export const FILE_NAME_MAX_CHARS = 200;
/** The name given when nothing usable is left. */
export const FALLBACK_FILE_NAME = 'upload';

/**
 * The name as shown and offered for download: no folders (some browsers send a path), none of the
 * characters above, spaces collapsed, at most FILE_NAME_MAX_CHARS characters with the extension
 * kept; "upload" when nothing is left.
 */
export function cleanFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  const clean = base.replace(UNSAFE_IN_NAMES, '').normalize('NFC').replace(/\s+/g, ' ').trim();
  const chars = Array.from(clean);
  if (chars.length <= FILE_NAME_MAX_CHARS) return clean || FALLBACK_FILE_NAME;
  const ext = /\.[A-Za-z0-9]{1,10}$/.exec(clean)?.[0] ?? '';
  return chars.slice(0, FILE_NAME_MAX_CHARS - ext.length).join('').trimEnd() + ext;
}

const EXTENSIONS: Record<string, string> = { 'image/jpeg': '.jpg', 'image/png': '.png', 'image/webp': '.webp', 'application/pdf': '.pdf', 'text/csv': '.csv' };

/** "upload.pdf" rather than a bare "upload" when the name had nothing usable in it. */
export function nameForStorage(cleanName: string, contentType: string): string {
  return cleanName === FALLBACK_FILE_NAME ? `${FALLBACK_FILE_NAME}${EXTENSIONS[contentType] ?? ''}` : cleanName;
}

/** RFC 6266 Content-Disposition with an ASCII fallback and the UTF-8 name (RFC 8187). */
export function contentDisposition(disposition: 'inline' | 'attachment', fileName: string): string {
  const name = cleanFileName(fileName);
  const ascii = name
    .normalize('NFKD')
    .replace(/[^\x20-\x7e]/g, '')
    .replace(/["\\;%]/g, '_')
    .trim() || 'upload';
  const encoded = encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${disposition}; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}
