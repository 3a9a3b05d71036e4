/**
 * Strict decoding of a text file (a text, a word list, a plan). UTF-8 is the
 * norm; UTF-16 is recognised by its byte order mark or, without one, by the
 * pattern of its zero bytes, and decoded. Anything else — bytes that are not
 * UTF-8, zero bytes that do not follow the UTF-16 pattern, UTF-32 — is refused
 * with the line and column of the first bad byte and what to do. Nothing is
 * ever silently replaced.
 *
 * A byte order mark is kept in the returned string (so that hashing a UTF-8
 * string gives the file's bytes back); the text model drops it.
 */

import { problem } from '../problems/problem.ts';
import type { Problem } from '../problems/problem.ts';

export type Encoding = 'utf-8' | 'utf-16le' | 'utf-16be';

/** Where in the file: 1-based line and column (UTF-16 code units of the decoded line before it, plus one) and the byte offset. */
interface At {
  line: number;
  column: number;
  offset: number;
}

/** Why a file cannot be read as text; worded by the problem catalogue ("file/…" codes). */
export type DecodeProblem =
  | ({ code: 'not-utf8'; byte: string } & At)
  | ({ code: 'zero-bytes' } & At)
  | { code: 'utf32'; line: 1; column: 1 }
  | ({ code: 'bad-utf16'; encoding: 'utf-16le' | 'utf-16be'; byMark: boolean; odd: boolean } & At);

/** An encoding that was guessed, worth telling the curator. */
export interface DecodeNote {
  code: 'utf16-no-bom';
  encoding: 'utf-16le' | 'utf-16be';
}

export type DecodeResult = { text: string; encoding: Encoding; note?: DecodeNote } | { problem: DecodeProblem };

/**
 * Offset of the first byte that does not begin a well-formed UTF-8 sequence,
 * or -1 when all bytes are well-formed.
 * Source: The Unicode Standard, ch. 3, Table 3-7 "Well-Formed UTF-8 Byte Sequences".
 */
export function firstInvalidByte(bytes: Uint8Array): number {
  const n = bytes.length;
  let i = 0;
  while (i < n) {
    const b = bytes[i];
    if (b < 0x80) {
      i++;
      continue;
    }
    // Continuation bytes needed, and the allowed range of the second byte.
    let need = 0;
    let lo = 0x80;
    let hi = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) need = 1;
    else if (b === 0xe0) [need, lo] = [2, 0xa0];
    else if ((b >= 0xe1 && b <= 0xec) || b === 0xee || b === 0xef) need = 2;
    else if (b === 0xed) [need, hi] = [2, 0x9f];
    else if (b === 0xf0) [need, lo] = [3, 0x90];
    else if (b >= 0xf1 && b <= 0xf3) need = 3;
    else if (b === 0xf4) [need, hi] = [3, 0x8f];
    else return i;
    if (i + need >= n) return i; // sequence cut short by the end of the file
    const second = bytes[i + 1];
    if (second < lo || second > hi) return i;
    for (let k = 2; k <= need; k++) {
      const c = bytes[i + k];
      if (c < 0x80 || c > 0xbf) return i;
    }
    i += need + 1;
  }
  return -1;
}

/** 1-based line and column at the end of `prefix` (CRLF, CR and LF end lines; a BOM is not counted). */
function endPosition(prefix: string): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < prefix.length; i++) {
    const c = prefix.charCodeAt(i);
    if (c === 10 || (c === 13 && prefix.charCodeAt(i + 1) !== 10)) {
      line++;
      lineStart = i + 1;
    }
  }
  const bom = lineStart === 0 && prefix.charCodeAt(0) === 0xfeff ? 1 : 0;
  return { line, column: prefix.length - lineStart - bom + 1 };
}

function hex(b: number): string {
  return `0x${b.toString(16).toUpperCase().padStart(2, '0')}`;
}

/** Where byte `at` stands, as line and column of the text before it (decoded leniently, for counting only). */
function positionOfByte(bytes: Uint8Array, at: number, encoding: Encoding): { line: number; column: number } {
  const prefix = new TextDecoder(encoding, { ignoreBOM: true }).decode(bytes.subarray(0, at));
  return endPosition(prefix);
}

/** Zero bytes at even and at odd offsets. */
function zeroBytes(bytes: Uint8Array): { even: number; odd: number; first: number } {
  let even = 0;
  let odd = 0;
  let first = -1;
  for (let i = bytes.indexOf(0); i !== -1; i = bytes.indexOf(0, i + 1)) {
    if (first < 0) first = i;
    if (i & 1) odd++;
    else even++;
  }
  return { even, odd, first };
}

/**
 * The UTF-16 byte order a BOM-less file shows by its zero bytes, or null.
 * Text in UTF-16 carries a zero high byte for every character below U+0100 —
 * spaces, line ends, digits, punctuation and all Latin letters — so its zero
 * bytes fall on one parity only (odd offsets for little-endian), while UTF-8
 * text has none at all. Common practice, no source.
 */
function utf16ByZeros(zeros: { even: number; odd: number }, length: number): 'utf-16le' | 'utf-16be' | null {
  const pairs = Math.floor(length / 2);
  if (pairs === 0) return null;
  const [major, minor, order] = zeros.odd >= zeros.even ? [zeros.odd, zeros.even, 'utf-16le' as const] : [zeros.even, zeros.odd, 'utf-16be' as const];
  // At least one character in twenty below U+0100 (the spaces alone give more), and the other parity nearly
  // clean. A single zero byte proves nothing: it is a damaged file, refused below.
  if (major < Math.max(2, pairs / 20)) return null;
  if (minor > major / 20) return null;
  return order;
}

/** Decodes UTF-16 strictly: an odd byte count or an unpaired surrogate is refused with its position. */
function decodeUtf16(bytes: Uint8Array, encoding: 'utf-16le' | 'utf-16be', byMark: boolean): DecodeResult {
  if (bytes.length % 2 === 1) {
    const offset = bytes.length - 1;
    return { problem: { code: 'bad-utf16', encoding, byMark, odd: true, offset, ...positionOfByte(bytes, offset, encoding) } };
  }
  const le = encoding === 'utf-16le';
  const unit = (k: number): number => (le ? bytes[k] | (bytes[k + 1] << 8) : (bytes[k] << 8) | bytes[k + 1]);
  for (let k = 0; k < bytes.length; k += 2) {
    const u = unit(k);
    if (u < 0xd800 || u > 0xdfff) continue;
    if (u <= 0xdbff && k + 2 < bytes.length) {
      const next = unit(k + 2);
      if (next >= 0xdc00 && next <= 0xdfff) {
        k += 2;
        continue;
      }
    }
    return { problem: { code: 'bad-utf16', encoding, byMark, odd: false, offset: k, ...positionOfByte(bytes, k, encoding) } };
  }
  return { text: new TextDecoder(encoding, { ignoreBOM: true }).decode(bytes), encoding };
}

/**
 * Decode a file's bytes: the text and the encoding it was read in (with a
 * note when the encoding was guessed), or the first problem with its place.
 */
export function decodeText(bytes: Uint8Array): DecodeResult {
  const b0 = bytes[0];
  const b1 = bytes[1];
  // UTF-32 marks begin with the UTF-16 LE mark: test them first. Source: The Unicode Standard, ch. 23.8, Table 23-4 "Unicode Encoding Form Signatures".
  if ((b0 === 0xff && b1 === 0xfe && bytes[2] === 0 && bytes[3] === 0) || (b0 === 0 && b1 === 0 && bytes[2] === 0xfe && bytes[3] === 0xff)) {
    return { problem: { code: 'utf32', line: 1, column: 1 } };
  }
  if (b0 === 0xff && b1 === 0xfe) return decodeUtf16(bytes, 'utf-16le', true);
  if (b0 === 0xfe && b1 === 0xff) return decodeUtf16(bytes, 'utf-16be', true);

  const zeros = zeroBytes(bytes);
  if (zeros.first >= 0) {
    const order = utf16ByZeros(zeros, bytes.length);
    if (order) {
      const decoded = decodeUtf16(bytes, order, false);
      return 'problem' in decoded ? decoded : { ...decoded, note: { code: 'utf16-no-bom', encoding: order } };
    }
    return { problem: { code: 'zero-bytes', offset: zeros.first, ...positionOfByte(bytes, zeros.first, 'utf-8') } };
  }

  try {
    return { text: new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes), encoding: 'utf-8' };
  } catch {
    const bad = firstInvalidByte(bytes);
    const offset = bad < 0 ? bytes.length : bad;
    const byte = offset < bytes.length ? hex(bytes[offset]) : '(end of file)';
    return { problem: { code: 'not-utf8', byte, offset, ...positionOfByte(bytes, offset, 'utf-8') } };
  }
}

/**
 * A file's bytes as text, or the problem that stops it being read, placed in
 * `file` (as shown to the user); a guessed encoding comes as a warning.
 */
export function readFileText(bytes: Uint8Array, file: string): { text: string | null; problems: Problem[] } {
  const decoded = decodeText(bytes);
  if ('problem' in decoded) {
    const p = decoded.problem;
    const at = { file, line: p.line, column: p.column };
    switch (p.code) {
      case 'not-utf8':
        return { text: null, problems: [problem('file/not-utf8', { file, byte: p.byte, line: p.line, column: p.column, offset: p.offset }, at)] };
      case 'zero-bytes':
        return { text: null, problems: [problem('file/zero-bytes', { file, line: p.line, column: p.column, offset: p.offset }, at)] };
      case 'utf32':
        return { text: null, problems: [problem('file/utf32', { file }, { file })] };
      case 'bad-utf16':
        return { text: null, problems: [problem('file/bad-utf16', { file, encoding: p.encoding, byMark: p.byMark, odd: p.odd, line: p.line, column: p.column, offset: p.offset }, at)] };
    }
  }
  const problems = decoded.note ? [problem('file/utf16-no-bom', { file, encoding: decoded.note.encoding }, { file })] : [];
  return { text: decoded.text, problems };
}
