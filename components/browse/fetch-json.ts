/** GET JSON from the public API; a non-2xx answer throws with the API's own message (shared error format). */
export async function fetchJson<T>(url: string, signal?: AbortSignal): Promise<T> {
  const response = await fetch(url, { signal, headers: { accept: 'application/json' } });
  if (!response.ok) {
    let message = `The server answered ${response.status}.`;
    try {
      const body = (await response.json()) as { error?: { message?: string } };
      if (body.error?.message) message = body.error.message;
    } catch {
      // not JSON: keep the status line
    }
    throw new Error(message);
  }
  return (await response.json()) as T;
}
