/** Sends one photo with XMLHttpRequest (fetch cannot report upload progress) and resolves with the outcome in words. */

export type UploadOutcome = { ok: true; photoId: string } | { ok: false; message: string };

export function uploadPhotoXhr(slug: string, file: File, alt: string, onProgress: (fraction: number) => void): Promise<UploadOutcome> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/v1/gear/${encodeURIComponent(slug)}/photos`);
    xhr.responseType = 'json';
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      const body = xhr.response as { photo?: { id: string }; error?: { message?: string } } | null;
      if (xhr.status === 201 && body?.photo) {
        onProgress(1);
        resolve({ ok: true, photoId: body.photo.id });
        return;
      }
      const message = body?.error?.message ?? `The server refused the photo (status ${xhr.status}).`;
      resolve({ ok: false, message: xhr.status === 401 ? 'Your session has ended. Sign in again, then retry.' : message });
    };
    xhr.onerror = () => resolve({ ok: false, message: 'The connection was lost during the upload. Check your network and retry.' });
    xhr.onabort = () => resolve({ ok: false, message: 'The upload was cancelled.' });
    const form = new FormData();
    form.set('file', file);
    form.set('alt', alt);
    xhr.send(form);
  });
}
