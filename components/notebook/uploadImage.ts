import { readErrorBody } from '@/lib/api/error-body';
/** Sends one photo to the uploads API with progress, for inline images in the notebook. */

export interface UploadedPhoto {
  id: string;
  url: string;
  thumbnailUrl: string | null;
  width: number | null;
  height: number | null;
  originalName: string;
  kind: 'photo' | 'file';
}

export type UploadOutcome = { ok: true; upload: UploadedPhoto } | { ok: false; message: string };

/**
 * POST /api/v1/trials/{trialId}/uploads as multipart (file, variantId). XHR rather
 * than fetch because only XHR reports upload progress. The browser sends the same-site Origin
 * header the API requires for cookie-authenticated writes.
 */
export function uploadPhoto(
  trialId: string,
  variantId: string | null,
  file: File,
  onProgress: (fraction: number) => void,
): Promise<UploadOutcome> {
  return new Promise((resolve) => {
    const form = new FormData();
    form.set('file', file);
    if (variantId) form.set('variantId', variantId);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/v1/trials/${encodeURIComponent(trialId)}/uploads`);
    xhr.responseType = 'text';
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress(e.loaded / e.total);
    };
    xhr.onerror = () => resolve({ ok: false, message: 'The upload did not reach the server. Check the connection and try again.' });
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = null;
      }
      const upload = (body as { upload?: UploadedPhoto } | null)?.upload;
      if (xhr.status === 201 && upload) {
        resolve({ ok: true, upload });
        return;
      }
      const message = readErrorBody(body).message;
      const fallback =
        xhr.status === 413 ? 'The photo is too large.' : xhr.status === 415 ? 'That file type cannot be used as a photo.' : `The upload failed (HTTP ${xhr.status}).`;
      resolve({ ok: false, message: message || fallback });
    };
    xhr.send(form);
  });
}
