'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { createReadingsWorker } from '@/lib/readings/create-worker';
import { decodeSeries } from '@/lib/readings/encoding';
import type { CsvInspection } from '@/lib/readings/columns';
import type { ParseOptions } from '@/lib/readings/parse';
import type { ReadingsError, ReadingsMeta, Sample } from '@/lib/readings/types';
import type { WorkerResponse } from '@/lib/readings/worker-protocol';

export type CsvParseState =
  | { status: 'idle' }
  | { status: 'reading'; fileName: string }
  | { status: 'inspected'; fileName: string; inspection: CsvInspection; bytes: number }
  | { status: 'parsing'; fileName: string; inspection: CsvInspection; progress: number }
  | { status: 'done'; fileName: string; inspection: CsvInspection; samples: Sample[]; meta: ReadingsMeta }
  | { status: 'error'; fileName: string; inspection: CsvInspection | null; error: ReadingsError };

/**
 * Parses a logger CSV in a module web worker so the page keeps answering input: `inspect(file)`
 * reads and guesses the columns, `parse(options)` reads every row with progress. A newer call
 * supersedes an older one (its answers are ignored).
 */
export function useCsvParse(options: {
  /** Called once a new file is inspected, with a `parse` to start reading every row (e.g. with the guessed columns). */
  onInspected?: (inspection: CsvInspection, parse: (options: Omit<ParseOptions, 'onProgress'>) => void) => void;
} = {}): {
  state: CsvParseState;
  inspect: (file: File) => void;
  parse: (options: Omit<ParseOptions, 'onProgress'>) => void;
  reset: () => void;
} {
  const [state, setState] = useState<CsvParseState>({ status: 'idle' });
  const worker = useRef<Worker | null>(null);
  const seq = useRef(0);
  const current = useRef<{ fileName: string; inspection: CsvInspection | null }>({ fileName: '', inspection: null });
  const onInspected = useRef(options.onInspected);
  useEffect(() => {
    onInspected.current = options.onInspected;
  });
  const parseRef = useRef<(o: Omit<ParseOptions, 'onProgress'>) => void>(() => {});

  const ensureWorker = useCallback((): Worker => {
    if (worker.current) return worker.current;
    const w = createReadingsWorker();
    w.onmessage = (e: MessageEvent<WorkerResponse>) => {
      const msg = e.data;
      if (msg.id !== seq.current) return; // superseded
      const { fileName } = current.current;
      if (msg.type === 'progress') {
        setState((s) => (s.status === 'parsing' ? { ...s, progress: msg.fraction } : s));
      } else if (msg.type === 'inspected') {
        if (!msg.result.ok) {
          setState({ status: 'error', fileName, inspection: null, error: msg.result.error });
          return;
        }
        current.current.inspection = msg.result.inspection;
        setState({ status: 'inspected', fileName, inspection: msg.result.inspection, bytes: msg.result.bytes });
        onInspected.current?.(msg.result.inspection, (o) => parseRef.current(o));
      } else {
        const inspection = current.current.inspection!;
        if (!msg.result.ok) {
          setState({ status: 'error', fileName, inspection, error: msg.result.error });
          return;
        }
        const decoded = decodeSeries(msg.result.encoded);
        if (!decoded.ok) {
          setState({ status: 'error', fileName, inspection, error: { code: 'no-data-rows', message: decoded.error, rowErrors: [], badRows: [] } });
          return;
        }
        setState({ status: 'done', fileName, inspection, samples: decoded.samples, meta: msg.result.meta });
      }
    };
    w.onerror = () => {
      const { fileName, inspection } = current.current;
      setState({ status: 'error', fileName, inspection, error: { code: 'no-data-rows', message: 'The file reader stopped unexpectedly. Reload the page and try again.', rowErrors: [], badRows: [] } });
    };
    worker.current = w;
    return w;
  }, []);

  useEffect(
    () => () => {
      worker.current?.terminate();
      worker.current = null;
    },
    [],
  );

  const inspect = useCallback(
    (file: File) => {
      const id = ++seq.current;
      current.current = { fileName: file.name, inspection: null };
      setState({ status: 'reading', fileName: file.name });
      ensureWorker().postMessage({ id, type: 'inspect', file });
    },
    [ensureWorker],
  );

  const parse = useCallback(
    (options: Omit<ParseOptions, 'onProgress'>) => {
      const { fileName, inspection } = current.current;
      if (!inspection) return;
      const id = ++seq.current;
      setState({ status: 'parsing', fileName, inspection, progress: 0 });
      ensureWorker().postMessage({ id, type: 'parse', options });
    },
    [ensureWorker],
  );

  useEffect(() => {
    parseRef.current = parse;
  }, [parse]);

  const reset = useCallback(() => {
    seq.current++;
    current.current = { fileName: '', inspection: null };
    setState({ status: 'idle' });
  }, []);

  return { state, inspect, parse, reset };
}
