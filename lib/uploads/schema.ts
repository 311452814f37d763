/** Upload limits, form fields and the view the API and pages receive. Pure: no database, no framework. */
import { z } from 'zod';

const MB = 1024 * 1024;

/** Largest photo accepted, in bytes (12 MB). */
export const PHOTO_MAX_BYTES = 12 * MB;
/** Largest PDF or CSV accepted, in bytes (20 MB). */
export const FILE_MAX_BYTES = 20 * MB;
/** The multipart envelope around the largest file (boundaries, field headers, the small text fields). */
export const UPLOAD_REQUEST_MAX_BYTES = FILE_MAX_BYTES + 256 * 1024;
/** Thumbnails fit inside this square, in pixels, and are never enlarged. */
export const THUMBNAIL_MAX_PX = 480;
/**
 * Pixel budget of a photo (50 megapixels), read from the file's header before anything is
 * decoded: a small compressed file can expand to gigabytes once opened (a 50-megapixel photo
 * is about 200 MB as RGBA). 48- and 50-megapixel phone photos fit; larger ones are refused (413).
 */
export const PHOTO_MAX_PIXELS = 50_000_000;

export interface UploadLimits {
  photoMaxBytes: number;
  fileMaxBytes: number;
  maxPixels: number;
  thumbnailMaxPx: number;
}

export const UPLOAD_LIMITS: UploadLimits = {
  photoMaxBytes: PHOTO_MAX_BYTES,
  fileMaxBytes: FILE_MAX_BYTES,
  maxPixels: PHOTO_MAX_PIXELS,
  thumbnailMaxPx: THUMBNAIL_MAX_PX,
};

export const UPLOAD_KINDS = ['photo', 'file'] as const;
export type UploadKind = (typeof UPLOAD_KINDS)[number];

/** What a photo shows. The keys are stable; the labels are what people read. */
export const UPLOAD_SUBJECTS = ['jar', 'set_test', 'spread', 'other'] as const;
export type UploadSubject = (typeof UPLOAD_SUBJECTS)[number];
export const UPLOAD_SUBJECT_LABELS: Record<UploadSubject, string> = {
  jar: 'The filled jar',
  set_test: 'Set test',
  spread: 'Spread on bread',
  other: 'Something else',
};

/** Browsers send untouched optional form fields as empty strings: those mean "not given". */
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
const optionalId = (what: string) => z.preprocess(blankToUndefined, z.uuid(`must be a ${what} id`).optional());

/** The text fields sent beside the file. */
export const uploadFieldsSchema = z.object({
  variantId: optionalId('variant'),
  cookId: optionalId('measurement'),
  subject: z.preprocess(
    blankToUndefined,
    z.enum(UPLOAD_SUBJECTS, `must be one of: ${UPLOAD_SUBJECTS.join(', ')}`).optional(),
  ),
});
export type UploadFields = z.infer<typeof uploadFieldsSchema>;

/** Narrows a trial's uploads (query string of the list). */
export const uploadListQuerySchema = z.object({
  variantId: optionalId('variant'),
  cookId: optionalId('measurement'),
});
export type UploadListQuery = z.infer<typeof uploadListQuerySchema>;

export interface UploadFile {
  /** The name the person's computer gave it; kept for display and downloads only, never trusted for the type. */
  name: string;
  bytes: Uint8Array;
}

export interface CreateUploadInput {
  trialId: string;
  variantId?: string | null;
  cookId?: string | null;
  subject?: string | null;
  file: UploadFile;
}

/** A stored upload as the API and pages see it (plain data, never an entity). */
export interface UploadView {
  id: string;
  kind: UploadKind;
  subject: UploadSubject | null;
  variantId: string | null;
  cookId: string | null;
  originalName: string;
  /** The type sniffed from the bytes, e.g. image/jpeg, application/pdf, text/csv. */
  contentType: string;
  sizeBytes: number;
  /** Pixels, as the photo is displayed (after its orientation tag); null for files. */
  width: number | null;
  height: number | null;
  createdAt: string;
  uploadedByName: string | null;
  /** Same-origin, authorised download of the original. */
  url: string;
  /** A WebP of at most THUMBNAIL_MAX_PX on the long side; null for files. */
  thumbnailUrl: string | null;
}

export function uploadUrl(uploadId: string): string {
  return `/api/v1/uploads/${uploadId}`;
}

export function thumbnailUrl(uploadId: string): string {
  return `/api/v1/uploads/${uploadId}/thumbnail`;
}

/** A stored file as a download answers it. */
export interface UploadDownload {
  body: ReadableStream<Uint8Array>;
  headers: Record<string, string>;
}
