import type { CsvInspection } from './columns';
import type { ParseOptions } from './parse';
import type { ReadingsError, ReadingsMeta } from './types';

/** Messages to the readings worker. The worker keeps the text of the last inspected file for `parse`. */
export type WorkerRequest =
  | { id: number; type: 'inspect'; file: Blob }
  | { id: number; type: 'parse'; options: Omit<ParseOptions, 'onProgress'> };

/** Messages from the readings worker. A parsed series travels as `encodeSeries` bytes (transferred, not copied). */
export type WorkerResponse =
  | { id: number; type: 'inspected'; result: { ok: true; inspection: CsvInspection; bytes: number } | { ok: false; error: ReadingsError } }
  | { id: number; type: 'progress'; fraction: number }
  | { id: number; type: 'parsed'; result: { ok: true; encoded: Uint8Array; meta: ReadingsMeta } | { ok: false; error: ReadingsError } };
