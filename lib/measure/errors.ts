/** The one error class thrown by lib/measure for bad input; `code` is stable, `message` is for people. */
export class MeasureError extends Error {
  readonly code: string;
  constructor(code: string, message: string) {
    super(message);
    this.name = 'MeasureError';
    this.code = code;
  }
}

export function assertFinite(value: number, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new MeasureError('not_finite', `${what} must be a finite number, got ${String(value)}.`);
  }
  return value;
}
