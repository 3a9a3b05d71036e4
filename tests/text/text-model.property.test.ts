// Property tests for the decoder, normalisation and the segmenter: whatever bytes or text come in,
// nothing throws, and every offset the text model gives maps back to the source as read.
// References: Node's TextEncoder and Buffer (the platform's own UTF-8 and UTF-16 encoders).
// Runs are seeded and few enough for the unit tests to stay quick.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decodeText } from '../../pipeline/text/decode.ts';
import { normalise } from '../../pipeline/text/normalise.ts';
import { buildTextModel } from '../../pipeline/text/build.ts';

const RUNS = { seed: 20261202, numRuns: 200 };

/** Prose-like text: words, capitals, punctuation and quotation marks, headings, blank lines, CRLF and lone CR, a BOM, letters beyond Latin-1 and beyond the BMP. */
const piece = fc.constantFrom(
  'the', 'Tamsin', 'lamp', 'o’clock', 'well-kept', 'Mr.', 'St.', 'J. R.', '1848', '3.5', 'café', 'Ñandú', 'Ἀθῆναι', 'Тамсин', '灯', '𝔏amp', '😀',
  ' ', ' ', ' ', '  ', '\t', '\n', '\n\n', '\r\n', '\r\n\r\n', '\r', '\u00a0', '\u2028',
  '.', ',', ';', ':', '!', '?', '…', '—', '-', '(', ')', '“', '”', '‘', '’', '"', "'", '«', '»', '*',
  '\n\nCHAPTER I.\n\n', '\n\nChapter 2: The Weir\n\n', '\n\nBOOK ONE\n\n', '\n\nIII.\n\n', '\uFEFF',
);
const prose = fc.array(piece, { maxLength: 120 }).map((parts) => parts.join(''));
const anyText = fc.oneof({ weight: 3, arbitrary: prose }, { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 200 }) });

/** 1-based line and column of a source offset, counted the slow way (CRLF, CR and LF end lines; a leading BOM is not counted). */
function slowPosition(source: string, offset: number): { line: number; column: number } {
  let line = 1;
  let start = 0;
  for (let i = 0; i < offset; i++) {
    const c = source[i];
    if (c === '\n' || (c === '\r' && source[i + 1] !== '\n')) {
      line++;
      start = i + 1;
    }
  }
  const bom = start === 0 && source.charCodeAt(0) === 0xfeff ? 1 : 0;
  return { line, column: offset - start - bom + 1 };
}

describe('the decoder, on any bytes', () => {
  it('never throws, and gives back either text that encodes to the same bytes or a problem at a place', () => {
    const bytes = fc.oneof(
      fc.uint8Array({ maxLength: 300 }),
      prose.map((s) => new TextEncoder().encode(s)),
      prose.map((s) => Uint8Array.from(Buffer.from(s.replace(/^\uFEFF/, ''), 'utf16le'))),
    );
    fc.assert(
      fc.property(bytes, (b) => {
        const r = decodeText(b);
        if ('problem' in r) {
          expect(r.problem.line).toBeGreaterThanOrEqual(1);
          expect(r.problem.column).toBeGreaterThanOrEqual(1);
          return;
        }
        const back =
          r.encoding === 'utf-8'
            ? new TextEncoder().encode(r.text)
            : r.encoding === 'utf-16le'
              ? Uint8Array.from(Buffer.from(r.text, 'utf16le'))
              : Uint8Array.from(Buffer.from(r.text, 'utf16le').swap16());
        expect(Array.from(back)).toEqual(Array.from(b));
      }),
      RUNS,
    );
  });

  it('reads any text saved as UTF-8, or as UTF-16 with its byte order mark, as that text', () => {
    fc.assert(
      fc.property(prose, (s) => {
        const body = s.replace(/^\uFEFF/, '');
        const utf8 = decodeText(new TextEncoder().encode(body));
        expect('text' in utf8 && utf8.text).toBe(body);
        const utf16 = decodeText(Uint8Array.from(Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(body, 'utf16le')])));
        expect('text' in utf16 && utf16.text).toBe('\uFEFF' + body);
      }),
      RUNS,
    );
  });
});

describe('normalisation, on any text', () => {
  it('maps every offset of the normalised text back to the same character of the source, and to its line and column', () => {
    fc.assert(
      fc.property(anyText, (source) => {
        const n = normalise(source);
        expect(n.text).not.toMatch(/\r/);
        for (let i = 0; i < n.text.length; i++) {
          const at = n.sourceOffset(i);
          if (n.text[i] === '\n') expect(['\r', '\n']).toContain(source[at]);
          else expect(source[at]).toBe(n.text[i]);
          expect(n.position(i)).toEqual(slowPosition(source, at));
        }
        expect(n.sourceOffset(n.text.length)).toBe(source.length);
      }),
      RUNS,
    );
  });
});

describe('the segmenter, on any text', () => {
  const options = fc.oneof(
    fc.constant({}),
    fc.constant({ start: 'CHAPTER I.', end: 'BOOK ONE' }),
    fc.constant({ chapterPattern: '^chapter \\d+' }),
    fc.constant({ chapterPattern: '(' }),
  );

  it('never throws, and keeps tokens in sentences, sentences in paragraphs, paragraphs in chapters, all in order', () => {
    fc.assert(
      fc.property(anyText, options, (source, opts) => {
        const m = buildTextModel(source, { id: 'p', ...opts });
        const inside = (s: number, e: number, from: number, to: number) => {
          expect(s).toBeGreaterThanOrEqual(from);
          expect(e).toBeLessThanOrEqual(to);
          expect(s).toBeLessThanOrEqual(e);
        };
        let last = 0;
        for (let p = 0; p < m.paragraphs.count; p++) {
          inside(m.paragraphs.start[p]!, m.paragraphs.end[p]!, last, m.text.length);
          last = m.paragraphs.end[p]!;
          const ch = m.chapters[m.paragraphs.chapter[p]!]!;
          expect(p).toBeGreaterThanOrEqual(ch.firstParagraph);
          expect(p).toBeLessThan(ch.firstParagraph + ch.paragraphCount);
        }
        last = 0;
        for (let s = 0; s < m.sentences.count; s++) {
          const p = m.sentences.paragraph[s]!;
          inside(m.sentences.start[s]!, m.sentences.end[s]!, Math.max(last, m.paragraphs.start[p]!), m.paragraphs.end[p]!);
          last = m.sentences.end[s]!;
          expect(m.sentences.tokenCount[s]).toBeGreaterThan(0);
        }
        last = 0;
        for (let t = 0; t < m.tokens.count; t++) {
          const s = m.tokens.sentence[t]!;
          inside(m.tokens.start[t]!, m.tokens.end[t]!, Math.max(last, m.sentences.start[s]!), m.sentences.end[s]!);
          expect(m.tokens.end[t]).toBeGreaterThan(m.tokens.start[t]!);
          expect(t).toBeGreaterThanOrEqual(m.sentences.firstToken[s]!);
          expect(t).toBeLessThan(m.sentences.firstToken[s]! + m.sentences.tokenCount[s]!);
          last = m.tokens.end[t]!;
        }
        expect(m.chapters.reduce((n, c) => n + c.tokenCount, 0)).toBe(m.tokens.count);
      }),
      RUNS,
    );
  });

  it('gives offsets that round-trip to the source as read: every token, and every line break of a paragraph', () => {
    fc.assert(
      fc.property(anyText, options, (source, opts) => {
        const m = buildTextModel(source, { id: 'p', ...opts });
        for (let t = 0; t < m.tokens.count; t++) {
          const s = m.tokens.start[t]!;
          const e = m.tokens.end[t]!;
          const word = m.text.slice(s, e);
          expect(word).not.toMatch(/\s/);
          expect(source.slice(m.sourceOffset(s), m.sourceOffset(e))).toBe(word);
          expect(m.position(s)).toEqual(slowPosition(source, m.sourceOffset(s)));
        }
        for (let p = 0; p < m.paragraphs.count; p++) {
          const s = m.paragraphs.start[p]!;
          const e = m.paragraphs.end[p]!;
          // A paragraph's source is its text with each line end as it was written (CRLF, CR or LF).
          expect(source.slice(m.sourceOffset(s), m.sourceOffset(e)).replace(/\r\n?/g, '\n')).toBe(m.text.slice(s, e));
          expect(m.paragraphs.line[p]).toBe(slowPosition(source, m.sourceOffset(s)).line);
        }
      }),
      RUNS,
    );
  });
});
