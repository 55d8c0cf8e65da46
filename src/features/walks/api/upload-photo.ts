// POST /api/photos, one file per request through XMLHttpRequest: fetch() still has no upload progress,
// and one file per request gives each photo its own progress bar, outcome and retry.
import { currentCsrfToken, setCsrfToken } from '../../../lib/api-client.ts';
import type { PhotoOutcome, PhotoUploadResponse } from '@shared/schemas/sightings.ts';

export interface PhotoUpload {
  file: File;
  clientId: string;
  pestId: string;
  count?: number;
  walkId?: string;
  fieldId?: string;
}

/** Why a request failed; `retryable` is true for a dropped connection or a server fault (5xx). */
export class PhotoUploadError extends Error {
  constructor(
    message: string,
    public readonly retryable: boolean,
  ) {
    super(message);
    this.name = 'PhotoUploadError';
  }
}

/** The session's CSRF token for a multipart write: the one the API client keeps, so a queue of photos does not ask for it each time. */
export const csrfTokenForUpload = () => currentCsrfToken();

export function uploadPhoto(upload: PhotoUpload, csrfToken: string, onProgress: (share: number) => void): Promise<PhotoOutcome> {
  const form = new FormData();
  form.append('pestId', upload.pestId);
  if (upload.count !== undefined) form.append('count', String(upload.count));
  if (upload.walkId) form.append('walkId', upload.walkId);
  if (upload.fieldId) form.append('fieldId', upload.fieldId);
  form.append('clientIds', JSON.stringify([upload.clientId]));
  form.append('photos', upload.file, upload.file.name);

  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/photos');
    xhr.withCredentials = true;
    xhr.setRequestHeader('x-csrf-token', csrfToken);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.responseType = 'json';
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    xhr.onerror = () => reject(new PhotoUploadError('The connection dropped before this photo arrived.', true));
    xhr.ontimeout = () => reject(new PhotoUploadError('The upload took too long; the signal may be weak.', true));
    xhr.onload = () => {
      const body = xhr.response as (Partial<PhotoUploadResponse> & { error?: { code?: string; message?: string } }) | null;
      if (xhr.status >= 200 && xhr.status < 300 && body?.results?.length) {
        onProgress(1);
        resolve(body.results.find((r) => r.clientId === upload.clientId) ?? body.results[0]);
        return;
      }
      const message = body?.error?.message ?? `The server answered ${xhr.status} without an explanation.`;
      // A stale CSRF token (the session was renewed) is cured by asking again.
      if (body?.error?.code === 'csrf') setCsrfToken(null);
      reject(new PhotoUploadError(message, xhr.status >= 500 || xhr.status === 0 || body?.error?.code === 'csrf'));
    };
    xhr.send(form);
  });
}
