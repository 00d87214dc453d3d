/** Starts the readings module worker (browser only). The bundler (webpack or Turbopack) emits worker.ts as its own chunk. */
export function createReadingsWorker(): Worker {
  return new Worker(new URL('./worker.ts', import.meta.url), { type: 'module', name: 'readings' });
}
