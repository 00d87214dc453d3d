import type { AppError } from './errors';

/**
 * Reads a request body up to `limit` bytes: refuses from Content-Length before reading, and again as soon as the
 * bytes actually received pass the limit (a chunked body declares no length). Route handlers have no default cap.
 */
export async function readBodyCapped(request: Request, limit: number, tooLarge: () => AppError): Promise<Uint8Array> {
  const declared = request.headers.get('content-length');
  if (declared !== null && Number(declared) > limit) throw tooLarge();
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel().catch(() => {});
      throw tooLarge();
    }
    chunks.push(value);
  }
  const body = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    body.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return body;
}
