import { failure, type ReadingsError } from './types';

/** Known binary signatures, so the message can say what the file probably is. */
const SIGNATURES: { bytes: number[]; what: string }[] = [
  { bytes: [0x50, 0x4b, 0x03, 0x04], what: 'a zip archive or a spreadsheet workbook (.xlsx, .ods)' },
  { bytes: [0xd0, 0xcf, 0x11, 0xe0], what: 'an old-style spreadsheet workbook (.xls)' },
  { bytes: [0x25, 0x50, 0x44, 0x46], what: 'a PDF' },
  { bytes: [0x89, 0x50, 0x4e, 0x47], what: 'a PNG image' },
  { bytes: [0xff, 0xd8, 0xff], what: 'a JPEG image' },
  { bytes: [0x1f, 0x8b], what: 'a gzip archive' },
];

function startsWith(bytes: Uint8Array, sig: number[]): boolean {
  return sig.every((b, i) => bytes[i] === b);
}

function binary(detail: string): { ok: false; error: ReadingsError } {
  return failure('binary-file', `This file is not a CSV text file: ${detail}. Export the logger data as CSV (comma, semicolon or tab separated text) and try again.`);
}

/**
 * Turns uploaded bytes into text: UTF-8 (with or without a byte-order mark), or UTF-16 with
 * its byte-order mark (spreadsheet "Unicode text" exports). Refuses empty files, binary
 * content (NUL bytes, known binary signatures) and invalid UTF-8, each with a clear message.
 */
export function decodeCsvBytes(bytes: Uint8Array): { ok: true; text: string } | { ok: false; error: ReadingsError } {
  if (bytes.length === 0) return failure('empty-file', 'The file is empty.');
  for (const sig of SIGNATURES) {
    if (startsWith(bytes, sig.bytes)) return binary(`it looks like ${sig.what}`);
  }
  let utf16: 'utf-16le' | 'utf-16be' | null = null;
  if (startsWith(bytes, [0xff, 0xfe])) utf16 = 'utf-16le';
  else if (startsWith(bytes, [0xfe, 0xff])) utf16 = 'utf-16be';
  if (utf16) {
    let text: string;
    try {
      text = new TextDecoder(utf16, { fatal: true }).decode(bytes);
    } catch {
      return failure('not-utf8', 'The file starts like UTF-16 text but is not valid UTF-16. Save it as "CSV UTF-8" and try again.');
    }
    return checkText(text);
  }
  const nul = bytes.indexOf(0);
  if (nul >= 0) return binary(`it contains a NUL byte (at byte ${nul + 1})`);
  let text: string;
  try {
    // The default ignoreBOM: false strips a UTF-8 byte-order mark.
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return failure(
      'not-utf8',
      `The file is not valid UTF-8 text (first bad byte at ${firstInvalidUtf8(bytes) + 1}). If it is a CSV in an older encoding, save it again as "CSV UTF-8".`,
    );
  }
  return checkText(text);
}

/** Checks text that is already decoded (or typed in): not empty, no NUL characters. */
export function checkText(text: string): { ok: true; text: string } | { ok: false; error: ReadingsError } {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (body.trim() === '') return failure('empty-file', 'The file is empty.');
  const nul = body.indexOf('\u0000');
  if (nul >= 0) return binary(`it contains a NUL character (at character ${nul + 1})`);
  return { ok: true, text: body };
}

/** Offset of the first byte that breaks UTF-8 (for the message only). */
function firstInvalidUtf8(b: Uint8Array): number {
  let i = 0;
  while (i < b.length) {
    const c = b[i]!;
    let need = 0;
    let min = 0;
    if (c < 0x80) need = 0;
    else if (c >= 0xc2 && c <= 0xdf) [need, min] = [1, 0x80];
    else if (c >= 0xe0 && c <= 0xef) [need, min] = [2, 0x800];
    else if (c >= 0xf0 && c <= 0xf4) [need, min] = [3, 0x10000];
    else return i;
    let cp = need === 0 ? c : c & (0x3f >> need);
    for (let k = 1; k <= need; k++) {
      const d = b[i + k];
      if (d === undefined || (d & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (d & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += need + 1;
  }
  return b.length - 1;
}
