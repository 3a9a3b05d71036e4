import { describe, it, expect } from 'vitest';
import { createHash } from 'node:crypto';
import { decodeText, firstInvalidByte, readFileText } from '../../pipeline/text/decode.ts';
import { formatProblem } from '../../pipeline/problems/problem.ts';
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
    expect(decodeText(concat(bytes(0xef, 0xbb, 0xbf), utf8('Où?')))).toEqual({ text: '\uFEFFOù?', encoding: 'utf-8' });
  });

  it('keeps the bytes: the model hash of the decoded text is the sha256 of the file', () => {
    const file = concat(bytes(0xef, 0xbb, 0xbf), utf8('CHAPTER I.\r\n\r\nLa rivière monte.\r\n'));
    const r = decodeText(file);
    expect('text' in r).toBe(true);
    if (!('text' in r)) return;
    expect(buildTextModel(r.text, { id: 'a' }).hash).toBe(createHash('sha256').update(file).digest('hex'));
  });

  it('reports line and column of the first bad byte and asks for UTF-8', () => {
    // "Line one\r\nLine two\ncafé" with é in Latin-1 (0xE9): line 3, column 4.
    const file = concat(utf8('Line one\r\nLine two\ncaf'), bytes(0xe9), utf8('\nmore'));
    const r = decodeText(file);
    expect('problem' in r && r.problem).toEqual({ code: 'not-utf8', byte: '0xE9', line: 3, column: 4, offset: 22 });
    const read = readFileText(file, 'texts/weir.txt');
    expect(read.text).toBeNull();
    expect(read.problems.map(formatProblem)).toEqual([
      'texts/weir.txt:3:4: texts/weir.txt is not valid UTF-8: the byte 0xE9 at line 3, column 4 (byte offset 22) is not part of a UTF-8 character (the file may be in Latin-1 or Windows-1252) — Re-save the file as UTF-8: open it in a text editor and save it again as UTF-8 (in most editors: Save As, then choose the "UTF-8" encoding), then run the command again',
    ]);
  });

  it('counts columns in characters after multi-byte text, lone CR as a line end, BOM not counted', () => {
    const r = decodeText(concat(bytes(0xef, 0xbb, 0xbf), utf8('Ñandú\rÉté '), bytes(0xff)));
    expect('problem' in r && [r.problem.line, r.problem.column]).toEqual([2, 5]);
    const first = decodeText(concat(bytes(0xef, 0xbb, 0xbf), utf8('ab'), bytes(0xc0)));
    expect('problem' in first && [first.problem.line, first.problem.column]).toEqual([1, 3]);
  });
});

describe('decodeText: UTF-16 and zero bytes', () => {
  // Reference encoder: Node's Buffer ("utf16le"), the platform's own implementation of UTF-16.
  const le = (s: string): Uint8Array => Uint8Array.from(Buffer.from(s, 'utf16le'));
  const be = (s: string): Uint8Array => Uint8Array.from(Buffer.from(s, 'utf16le').swap16());
  const tale = 'CHAPTER I.\r\n\r\nThe tide rose over the staithe, and Tamsin lit the lamps one by one.\r\n';

  it.each([
    ['little-endian with a byte order mark', concat(bytes(0xff, 0xfe), le(tale)), 'utf-16le', '\uFEFF' + tale, false],
    ['big-endian with a byte order mark', concat(bytes(0xfe, 0xff), be(tale)), 'utf-16be', '\uFEFF' + tale, false],
    ['little-endian without a byte order mark', le(tale), 'utf-16le', tale, true],
    ['big-endian without a byte order mark', be(tale), 'utf-16be', tale, true],
  ])('decodes UTF-16 %s', (_name, input, encoding, text, guessed) => {
    const r = decodeText(input);
    expect('text' in r && r).toMatchObject({ text, encoding });
    expect('text' in r && r.note).toEqual(guessed ? { code: 'utf16-no-bom', encoding } : undefined);
    const read = readFileText(input, 'texts/tale.txt');
    expect(read.text).toBe(text);
    expect(read.problems.map((p) => [p.severity, p.code, p.file])).toEqual(guessed ? [['warning', 'file/utf16-no-bom', 'texts/tale.txt']] : []);
    if (guessed) expect(read.problems[0]!.message).toMatch(/the pattern of its zero bytes shows it is UTF-16/);
  });

  it('recognises BOM-less UTF-16 of a script whose letters have no zero byte, by its spaces and line ends', () => {
    // Greek letters are U+0391–U+03C9: their high byte is 0x03, only spaces, punctuation and line ends give zero bytes.
    const greek = 'Η παλίρροια ανέβηκε ως την αποβάθρα.\nΟ φανοκόρος άναψε τα φανάρια.\n';
    const r = decodeText(le(greek));
    expect('text' in r && [r.text, r.encoding]).toEqual([greek, 'utf-16le']);
  });

  it('refuses UTF-16 cut short by an odd byte, or holding half a character, with the position', () => {
    const odd = decodeText(concat(bytes(0xff, 0xfe), le('Lamps\nlit'), bytes(0x41)));
    expect('problem' in odd && odd.problem).toMatchObject({ code: 'bad-utf16', line: 2, column: 4 });
    // A high surrogate followed by a letter: "ab\nc" then U+D83D then "d".
    const lone = decodeText(concat(bytes(0xff, 0xfe), le('ab\nc'), bytes(0x3d, 0xd8), le('d')));
    expect('problem' in lone && lone.problem).toMatchObject({ code: 'bad-utf16', line: 2, column: 2 });
    const read = readFileText(concat(bytes(0xff, 0xfe), le('ab\nc'), bytes(0x3d, 0xd8), le('d')), 'a.txt');
    expect(read.problems[0]!.message).toMatch(/half of a character with no other half/);
  });

  it('refuses zero bytes that do not follow the UTF-16 pattern, and UTF-32, saying where and what to do', () => {
    const nul = decodeText(concat(utf8('The weir\nheld'), bytes(0), utf8(' fast.\n')));
    expect('problem' in nul && nul.problem).toMatchObject({ code: 'zero-bytes', line: 2, column: 5 });
    expect(readFileText(concat(utf8('The weir\nheld'), bytes(0), utf8(' fast.\n')), 'w.txt').problems[0]!.hint).toMatch(/save it again as UTF-8/);
    // Source: The Unicode Standard, ch. 23.8, Table 23-4: the UTF-32 LE signature is FF FE 00 00.
    const utf32 = decodeText(bytes(0xff, 0xfe, 0, 0, 0x41, 0, 0, 0));
    expect('problem' in utf32 && utf32.problem.code).toBe('utf32');
  });

  it('reads a UTF-16 text into the same model as its UTF-8 original', () => {
    const fromUtf8 = decodeText(utf8(tale));
    const fromUtf16 = decodeText(le(tale));
    if (!('text' in fromUtf8) || !('text' in fromUtf16)) throw new Error('both decode');
    const a = buildTextModel(fromUtf8.text, { id: 'a' });
    const b = buildTextModel(fromUtf16.text, { id: 'a' });
    expect(b.vocab).toEqual(a.vocab);
    expect(Array.from(b.tokens.start)).toEqual(Array.from(a.tokens.start));
    expect(b.chapters.map((c) => c.title)).toEqual(a.chapters.map((c) => c.title));
  });
});
