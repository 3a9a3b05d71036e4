import { describe, it, expect } from 'vitest';
import { createHash } from 'node:crypto';
import { decodeText, firstInvalidByte } from '../../pipeline/text/decode.ts';
import { buildTextModel } from '../../pipeline/text/build.ts';

const bytes = (...b: number[]): Uint8Array => Uint8Array.from(b);
const utf8 = (s: string): Uint8Array => new TextEncoder().encode(s);
const concat = (...parts: Uint8Array[]): Uint8Array => Uint8Array.from(parts.flatMap((p) => Array.from(p)));

describe('firstInvalidByte', () => {
  // Source: The Unicode Standard, ch. 3, Table 3-7 "Well-Formed UTF-8 Byte Sequences".
  it.each([
    ['ASCII', [0x41, 0x42], -1],
    ['two-byte é', [0xc3, 0xa9], -1],
    ['three-byte €', [0xe2, 0x82, 0xac], -1],
    ['four-byte U+1F600', [0xf0, 0x9f, 0x98, 0x80], -1],
    ['overlong C0 80', [0x41, 0xc0, 0x80], 1],
    ['overlong E0 80 80', [0xe0, 0x80, 0x80], 0],
    ['surrogate ED A0 80', [0x41, 0x42, 0xed, 0xa0, 0x80], 2],
    ['above U+10FFFF: F4 90 80 80', [0xf4, 0x90, 0x80, 0x80], 0],
    ['F5 lead byte', [0xf5, 0x80, 0x80, 0x80], 0],
    ['lone continuation byte', [0x41, 0x80], 1],
    ['Latin-1 é', [0x63, 0x61, 0x66, 0xe9], 3],
    ['sequence cut short at the end', [0x41, 0xe2, 0x82], 1],
    ['sequence cut short by ASCII', [0xe2, 0x41, 0x42], 0],
  ])('%s', (_name, b, expected) => {
    expect(firstInvalidByte(Uint8Array.from(b))).toBe(expected);
  });

  it('agrees with the WHATWG UTF-8 decoder on random bytes', () => {
    // Source: WHATWG Encoding Standard, "UTF-8 decoder" (Node's TextDecoder): with fatal off, the first
    // U+FFFD appears exactly where the well-formed prefix ends.
    let seed = 7;
    const rnd = (): number => (seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff;
    const pool = [0x41, 0x0a, 0x0d, 0x80, 0x9f, 0xa0, 0xbf, 0xc2, 0xc3, 0xdf, 0xe0, 0xe2, 0xed, 0xef, 0xf0, 0xf4, 0xf5, 0xff];
    for (let n = 0; n < 2000; n++) {
      const b = Uint8Array.from({ length: 1 + Math.floor(rnd() * 8) }, () => pool[Math.floor(rnd() * pool.length)]);
      const bad = firstInvalidByte(b);
      const loose = new TextDecoder('utf-8', { ignoreBOM: true }).decode(b);
      if (bad === -1) {
        expect(loose.includes('\uFFFD')).toBe(false);
      } else {
        const prefix = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(b.subarray(0, bad));
        expect(loose.indexOf('\uFFFD')).toBe(prefix.length);
      }
    }
  });
});

describe('decodeText', () => {
  it('decodes UTF-8 and keeps a BOM (the model drops it)', () => {
    expect(decodeText(concat(bytes(0xef, 0xbb, 0xbf), utf8('Où?')), 'a.txt')).toEqual({ text: '\uFEFFOù?' });
  });

  it('keeps the bytes: the model hash of the decoded text is the sha256 of the file', () => {
    const file = concat(bytes(0xef, 0xbb, 0xbf), utf8('CHAPTER I.\r\n\r\nLa rivière monte.\r\n'));
    const r = decodeText(file, 'a.txt');
    expect('text' in r).toBe(true);
    if (!('text' in r)) return;
    expect(buildTextModel(r.text, { id: 'a' }).hash).toBe(createHash('sha256').update(file).digest('hex'));
  });

  it('reports line and column of the first bad byte and asks for UTF-8', () => {
    // "Line one\r\nLine two\ncafé" with é in Latin-1 (0xE9): line 3, column 4.
    const r = decodeText(concat(utf8('Line one\r\nLine two\ncaf'), bytes(0xe9), utf8('\nmore')), 'texts/weir.txt');
    expect('problem' in r).toBe(true);
    if (!('problem' in r)) return;
    expect(r.problem.line).toBe(3);
    expect(r.problem.column).toBe(4);
    expect(r.problem.message).toContain('texts/weir.txt');
    expect(r.problem.message).toContain('0xE9');
    expect(r.problem.message).toMatch(/re-save the file as UTF-8/i);
  });

  it('counts columns in characters after multi-byte text, lone CR as a line end, BOM not counted', () => {
    const r = decodeText(concat(bytes(0xef, 0xbb, 0xbf), utf8('Ñandú\rÉté '), bytes(0xff)), 'x.txt');
    expect('problem' in r && [r.problem.line, r.problem.column]).toEqual([2, 5]);
    const first = decodeText(concat(bytes(0xef, 0xbb, 0xbf), utf8('ab'), bytes(0xc0)), 'x.txt');
    expect('problem' in first && [first.problem.line, first.problem.column]).toEqual([1, 3]);
  });
});
