'use client';

/** The shared API error body, or a stand-in when the response is not JSON. */
export interface ApiError {
  code: string;
  message: string;
  fields?: Record<string, string[]>;
}

export async function sendJson(method: string, url: string, body: unknown): Promise<{ ok: true; data: unknown } | { ok: false; status: number; error: ApiError }> {
  let res: Response;
  try {
    res = await fetch(url, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  } catch {
    return { ok: false, status: 0, error: { code: 'network', message: 'The server could not be reached. Check the connection and try again.' } };
  }
  const data = (await res.json().catch(() => null)) as { error?: ApiError } | null;
  if (!res.ok) return { ok: false, status: res.status, error: data?.error ?? { code: 'unknown', message: `The server answered ${res.status}.` } };
  return { ok: true, data };
}

/**
 * Sends a form with XMLHttpRequest so the upload reports real progress (fetch cannot), calling
 * `onProgress(0…1)` as bytes leave the browser.
 */
export function uploadWithProgress(url: string, form: FormData, onProgress: (fraction: number) => void): Promise<{ ok: true; data: unknown } | { ok: false; status: number; error: ApiError }> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.responseType = 'json';
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      const data = xhr.response as { error?: ApiError } | null;
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress(1);
        resolve({ ok: true, data });
      } else resolve({ ok: false, status: xhr.status, error: data?.error ?? { code: 'unknown', message: `The server answered ${xhr.status}.` } });
    };
    xhr.onerror = () => resolve({ ok: false, status: 0, error: { code: 'network', message: 'The upload failed: the server could not be reached.' } });
    xhr.send(form);
  });
}
