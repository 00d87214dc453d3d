/*
 * Module web worker: reads a CSV file, inspects it, parses it with progress, and posts the
 * series back as compact bytes. Create it with `createReadingsWorker()` (create-worker.ts).
 */
import { encodeSeries } from './encoding';
import { inspectCsv, parseReadings } from './parse';
import { failure } from './types';
import type { WorkerRequest, WorkerResponse } from './worker-protocol';

interface WorkerScope {
  onmessage: ((e: MessageEvent<WorkerRequest>) => void) | null;
  postMessage(message: WorkerResponse, transfer?: Transferable[]): void;
}

const scope = globalThis as unknown as WorkerScope;
let text: string | null = null;

scope.onmessage = (e) => {
  const req = e.data;
  if (req.type === 'inspect') {
    void req.file.arrayBuffer().then(
      (buffer) => {
        const r = inspectCsv(new Uint8Array(buffer));
        text = r.ok ? r.text : null;
        scope.postMessage({ id: req.id, type: 'inspected', result: r.ok ? { ok: true, inspection: r.inspection, bytes: buffer.byteLength } : r });
      },
      () => scope.postMessage({ id: req.id, type: 'inspected', result: failure('empty-file', 'The file could not be read.') }),
    );
    return;
  }
  if (text === null) {
    scope.postMessage({ id: req.id, type: 'parsed', result: failure('empty-file', 'Choose a file first.') });
    return;
  }
  let last = -1;
  const r = parseReadings(text, {
    ...req.options,
    onProgress: (fraction) => {
      // About 50 progress messages at most.
      if (fraction === 1 || fraction - last >= 0.02) {
        last = fraction;
        scope.postMessage({ id: req.id, type: 'progress', fraction });
      }
    },
  });
  if (!r.ok) {
    scope.postMessage({ id: req.id, type: 'parsed', result: r });
    return;
  }
  const encoded = encodeSeries(r.samples);
  scope.postMessage({ id: req.id, type: 'parsed', result: { ok: true, encoded, meta: r.meta } }, [encoded.buffer]);
};
