/**
 * Strict UTF-8 decoding of a text file. A byte order mark is kept in the
 * returned string (so that hashing the string gives the file's bytes back);
 * the text model drops it.
 */

export interface DecodeProblem {
  /** 1-based line of the first byte that is not valid UTF-8. */
  line: number;
  /** 1-based column (UTF-16 code units of the decoded line before it, plus one). */
  column: number;
  message: string;
}

export type DecodeResult = { text: string } | { problem: DecodeProblem };

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

/**
 * Decode `bytes` as strict UTF-8. On invalid bytes, report where the first
 * one is and ask for the file to be re-saved as UTF-8. `file` names the file
 * in the message.
 */
export function decodeText(bytes: Uint8Array, file: string): DecodeResult {
  try {
    return { text: new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes) };
  } catch {
    const bad = firstInvalidByte(bytes);
    const at = bad < 0 ? bytes.length : bad;
    const prefix = new TextDecoder('utf-8', { ignoreBOM: true }).decode(bytes.subarray(0, at));
    const { line, column } = endPosition(prefix);
    const byte = at < bytes.length ? `0x${bytes[at].toString(16).toUpperCase().padStart(2, '0')}` : '(end of file)';
    return {
      problem: {
        line,
        column,
        message:
          `${file} is not valid UTF-8: the byte ${byte} at line ${line}, column ${column} (byte offset ${at}) is not part of a UTF-8 character. ` +
          'Re-save the file as UTF-8 (in most editors: Save As, then choose the UTF-8 encoding) and build again.',
      },
    };
  }
}
