/**
 * Reads an upload's multipart/form-data body with a hard size cap: a declared Content-Length
 * over the cap is refused before a byte is read, and a body without one (chunked) is cut off
 * the moment it passes the cap. Pure: web Request only.
 */
import { ApiError } from '@/lib/api/errors';
import { ValidationFailed } from '@/lib/errors';
import { FILE_MAX_BYTES, PHOTO_MAX_BYTES, UPLOAD_REQUEST_MAX_BYTES, type UploadFile } from './schema';

const mb = (bytes: number) => Math.floor(bytes / (1024 * 1024));

export interface UploadForm {
  file: UploadFile;
  /** The text fields, as sent (validated by the caller). */
  fields: Record<string, string>;
}

function tooLarge(maxBytes: number): ApiError {
  return new ApiError(
    413,
    'too_large',
    `The upload is larger than ${mb(maxBytes)} MB, more than Setwell accepts (photos up to ${mb(PHOTO_MAX_BYTES)} MB, PDF and CSV files up to ${mb(FILE_MAX_BYTES)} MB).`,
  );
}

async function readCapped(req: Request, maxBytes: number): Promise<Uint8Array> {
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw tooLarge(maxBytes);
    }
    chunks.push(value);
  }
  const all = new Uint8Array(total);
  let offset = 0;
  for (const c of chunks) {
    all.set(c, offset);
    offset += c.byteLength;
  }
  return all;
}

export async function readUploadForm(req: Request, maxBytes = UPLOAD_REQUEST_MAX_BYTES): Promise<UploadForm> {
  const contentType = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(contentType)) {
    throw new ApiError(415, 'multipart_required', 'Send the upload as multipart/form-data, with the file in a field named "file".');
  }
  const declared = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge(maxBytes);

  const raw = await readCapped(req, maxBytes);
  let form: FormData;
  try {
    form = await new Response(raw as BodyInit, { headers: { 'content-type': contentType } }).formData();
  } catch {
    throw new ApiError(400, 'bad_form', 'The multipart body could not be read.');
  }

  const file = form.get('file');
  if (file === null || typeof file === 'string') {
    throw new ValidationFailed('Choose a file to upload.', { file: ['Choose a file to upload.'] });
  }
  const fields: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (key !== 'file' && typeof value === 'string') fields[key] = value;
  return { file: { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) }, fields };
}
