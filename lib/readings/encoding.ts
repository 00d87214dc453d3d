import { VALUE_FIELDS, type Sample, type ValueField } from './types';

/*
 * Compact, exact storage of a series ("TBS1"): one block per column (t, then each value field).
 * A column whose every number is a decimal with at most 6 places (as logger output is) is stored
 * as scaled integers, delta-encoded, zigzag, as variable-length integers (LEB128): a log at a
 * steady interval costs one byte per row for t and one to three per value. Any other column
 * (long binary fractions, -0, NaN) is stored as raw little-endian float64. Decoding gives back
 * exactly the same numbers (checked at encode time, value by value).
 *
 * Layout: "TBS1" · varint rows · u8 columns · per column: u8 field (0 t, 1 value, 2 watts,
 * 3 volts, 4 amps) · u8 mode (0 float64, 1 decimal delta) · u8 decimal places · varint bytes · payload.
 */

const MAGIC = [0x54, 0x42, 0x53, 0x31]; // "TBS1"
const FIELD_IDS: readonly ('t' | ValueField)[] = ['t', ...VALUE_FIELDS];
const MAX_PLACES = 6;
/** Scaled integers stay within ±2^50, so deltas (±2^51) and their zigzag (< 2^53) are exact. */
const MAX_SCALED = 2 ** 50;

class Writer {
  buf = new Uint8Array(1024);
  len = 0;
  private ensure(n: number): void {
    if (this.len + n <= this.buf.length) return;
    let size = this.buf.length * 2;
    while (size < this.len + n) size *= 2;
    const next = new Uint8Array(size);
    next.set(this.buf.subarray(0, this.len));
    this.buf = next;
  }
  byte(b: number): void {
    this.ensure(1);
    this.buf[this.len++] = b;
  }
  /** Unsigned integer < 2^53 as LEB128. */
  varint(n: number): void {
    this.ensure(8);
    while (n >= 128) {
      this.buf[this.len++] = (n % 128) | 128;
      n = Math.floor(n / 128);
    }
    this.buf[this.len++] = n;
  }
  bytes(b: Uint8Array): void {
    this.ensure(b.length);
    this.buf.set(b, this.len);
    this.len += b.length;
  }
  result(): Uint8Array {
    return this.buf.slice(0, this.len);
  }
}

/** Decimal places (0–6) that represent every value exactly as scaled integers, or null. */
function decimalPlaces(values: Float64Array): number | null {
  for (let k = 0; k <= MAX_PLACES; k++) {
    const p = 10 ** k;
    let ok = true;
    for (let i = 0; i < values.length; i++) {
      const v = values[i]!;
      const n = Math.round(v * p);
      // -0 scales to an integer that decodes as +0, so a column holding it stays raw.
      if (!(Math.abs(n) <= MAX_SCALED) || !Object.is(n / p, v) || Object.is(v, -0)) {
        ok = false;
        break;
      }
    }
    if (ok) return k;
  }
  return null;
}

function encodeColumn(w: Writer, field: number, values: Float64Array): void {
  const places = decimalPlaces(values);
  const body = new Writer();
  if (places === null) {
    const raw = new Uint8Array(values.length * 8);
    const view = new DataView(raw.buffer);
    for (let i = 0; i < values.length; i++) view.setFloat64(i * 8, values[i]!, true);
    body.bytes(raw);
  } else {
    const p = 10 ** places;
    let prev = 0;
    for (let i = 0; i < values.length; i++) {
      const n = Math.round(values[i]! * p);
      const d = n - prev;
      body.varint(d >= 0 ? 2 * d : -2 * d - 1);
      prev = n;
    }
  }
  w.byte(field);
  w.byte(places === null ? 0 : 1);
  w.byte(places ?? 0);
  w.varint(body.len);
  w.bytes(body.buf.subarray(0, body.len));
}

/** The value fields every sample of the series has (those of the first sample). */
function fieldsOf(samples: readonly Sample[]): ValueField[] {
  const first = samples[0];
  return first ? VALUE_FIELDS.filter((f) => first[f] !== undefined) : [];
}

/**
 * Encodes a series exactly into bytes (see the layout above). Every sample must carry the same
 * fields as the first; a series that does not is a programming error and throws a TypeError.
 */
export function encodeSeries(samples: readonly Sample[]): Uint8Array {
  const fields = fieldsOf(samples);
  const n = samples.length;
  const w = new Writer();
  MAGIC.forEach((b) => w.byte(b));
  w.varint(n);
  w.byte(1 + fields.length);
  const t = new Float64Array(n);
  for (let i = 0; i < n; i++) t[i] = samples[i]!.t;
  encodeColumn(w, 0, t);
  for (const f of fields) {
    const col = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const v = samples[i]![f];
      if (v === undefined) throw new TypeError(`encodeSeries: sample ${i + 1} has no "${f}" but the first sample does.`);
      col[i] = v;
    }
    encodeColumn(w, FIELD_IDS.indexOf(f), col);
  }
  return w.result();
}

export type DecodeResult = { ok: true; samples: Sample[]; fields: ValueField[] } | { ok: false; error: string };

/** Decodes bytes from `encodeSeries`; corrupt or foreign bytes give `{ ok: false }`, never a throw. */
export function decodeSeries(bytes: Uint8Array): DecodeResult {
  const bad = (why: string): DecodeResult => ({ ok: false, error: `Stored readings are damaged (${why}).` });
  let pos = 0;
  const varint = (): number | null => {
    let result = 0;
    let mult = 1;
    for (let k = 0; k < 8; k++) {
      const b = bytes[pos++];
      if (b === undefined) return null;
      result += (b & 127) * mult;
      if (b < 128) return result;
      mult *= 128;
    }
    return null;
  };
  if (!MAGIC.every((b, i) => bytes[i] === b)) return bad('not a TBS1 series');
  pos = 4;
  const n = varint();
  const count = bytes[pos++];
  if (n === null || count === undefined || count < 1 || count > FIELD_IDS.length) return bad('bad header');
  const columns = new Map<'t' | ValueField, Float64Array>();
  for (let c = 0; c < count; c++) {
    const id = bytes[pos++];
    const mode = bytes[pos++];
    const places = bytes[pos++];
    const len = varint();
    if (id === undefined || mode === undefined || places === undefined || len === null) return bad('truncated');
    const field = FIELD_IDS[id];
    if (field === undefined || columns.has(field) || (c === 0) !== (field === 't')) return bad('bad column');
    const end = pos + len;
    if (end > bytes.length) return bad('truncated');
    const values = new Float64Array(n);
    if (mode === 0) {
      if (len !== n * 8) return bad('bad column length');
      const view = new DataView(bytes.buffer, bytes.byteOffset + pos, len);
      for (let i = 0; i < n; i++) values[i] = view.getFloat64(i * 8, true);
      pos = end;
    } else if (mode === 1 && places <= MAX_PLACES) {
      const p = 10 ** places;
      let acc = 0;
      for (let i = 0; i < n; i++) {
        const z = varint();
        if (z === null || pos > end) return bad('truncated');
        acc += z % 2 === 0 ? z / 2 : -(z + 1) / 2;
        values[i] = acc / p;
      }
      if (pos !== end) return bad('bad column length');
    } else return bad('unknown column mode');
    columns.set(field, values);
  }
  if (pos !== bytes.length) return bad('trailing bytes');
  const fields = VALUE_FIELDS.filter((f) => columns.has(f));
  const t = columns.get('t')!;
  const samples: Sample[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const s: Sample = { t: t[i]! };
    for (const f of fields) s[f] = columns.get(f)![i]!;
    samples[i] = s;
  }
  return { ok: true, samples, fields };
}

/** Base64 of bytes (for JSON transport); pure, chunked so long series do not overflow the call stack. */
export function bytesToBase64(bytes: Uint8Array): string {
  let binary = '';
  for (let i = 0; i < bytes.length; i += 0x8000) binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(binary);
}

/** Bytes from base64, or null when the text is not base64. */
export function base64ToBytes(text: string): Uint8Array | null {
  let binary: string;
  try {
    binary = atob(text);
  } catch {
    return null;
  }
  const out = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) out[i] = binary.charCodeAt(i);
  return out;
}
