// Property tests for the quotation finder: whatever marks a text holds, paired or not, nothing
// throws, every quotation lies inside its paragraph, quotations do not overlap, and their offsets
// point at the marks and words they report. Seeded, and few enough runs for the unit tests.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildTextModel } from '../../pipeline/text/build.ts';
import { findQuotes } from '../../pipeline/dialogue/quotes.ts';

const RUNS = { seed: 1848, numRuns: 200 };

/** Prose with many quotation marks, paired and stray, in either convention, over one or several paragraphs. */
const piece = fc.constantFrom(
  'Tamsin', 'said', 'asked', 'she', 'he said', 'the lamp', 'Keep the light', 'o’clock', 'rock ’n’ roll', 'the boys’ boat', '’Tis', 'Mr. Rook',
  ' ', ' ', ' ', ',', '.', '!', '?', '…', '—', ';',
  '“', '”', '‘', '’', '"', "'", '«', '»', '„', '‹', '›',
  '\n', '\n\n', '\r\n\r\n', '\n\nCHAPTER II.\n\n',
);
const prose = fc.array(piece, { maxLength: 150 }).map((parts) => `CHAPTER I.\n\n${parts.join('')}\n`);
const verbs = fc.constantFrom([], ['whispered'], ['called out']);

describe('the quotation finder, on any text', () => {
  it('never throws; quotations lie in their paragraph and chapter, in order, without overlapping', () => {
    fc.assert(
      fc.property(prose, verbs, (source, extra) => {
        const model = buildTextModel(source, { id: 'q' });
        const { quotes, problems } = findQuotes(model, extra);
        let previous: (typeof quotes)[number] | undefined;
        quotes.forEach((q, i) => {
          expect(q.index).toBe(i);
          const ps = model.paragraphs.start[q.paragraph]!;
          const pe = model.paragraphs.end[q.paragraph]!;
          expect(model.paragraphs.chapter[q.paragraph]).toBe(q.chapter);
          // The opening mark, then the words, then the closing mark (if any), all inside the paragraph.
          expect(q.open).toBeGreaterThanOrEqual(ps);
          expect(q.start).toBeGreaterThan(q.open);
          expect(q.end).toBeGreaterThanOrEqual(q.start);
          expect(q.close === -1 ? q.end : q.close + 1).toBeLessThanOrEqual(pe);
          if (q.close !== -1) expect(q.close).toBeGreaterThanOrEqual(q.end);
          // No two quotations share a word: each opens after the words of the one before, and a
          // closing mark comes before the next quotation's words.
          if (previous) {
            expect(q.open).toBeGreaterThanOrEqual(previous.end);
            if (previous.close !== -1) expect(previous.close).toBeLessThan(q.start);
          }
          previous = q;
        });
        for (const p of problems) {
          expect(p.chapter).toBeGreaterThanOrEqual(1);
          expect(p.chapter).toBeLessThanOrEqual(model.chapters.length);
          expect(p.line).toBeGreaterThanOrEqual(1);
        }
      }),
      RUNS,
    );
  });

  it('reports offsets that round-trip: the marks are marks, the words are the text between them, and the source has them too', () => {
    // Quotation marks, and the dashes that open speech in dash dialogue.
    const marks = /["'«»„‹›\u2018-\u201F\u2012-\u2015-]/u;
    fc.assert(
      fc.property(prose, (source) => {
        const model = buildTextModel(source, { id: 'q' });
        for (const q of findQuotes(model).quotes) {
          expect(model.text[q.open]).toMatch(marks);
          if (q.close !== -1) expect(model.text[q.close]).toMatch(marks);
          expect(q.text).toBe(model.text.slice(q.start, q.end).replace(/\s+/g, ' ').trim());
          // The same characters stand at the mapped offsets of the file as read.
          expect(source[model.sourceOffset(q.open)]).toBe(model.text[q.open]);
          expect(source.slice(model.sourceOffset(q.start), model.sourceOffset(q.end)).replace(/\r\n?/g, '\n')).toBe(model.text.slice(q.start, q.end));
        }
      }),
      RUNS,
    );
  });
});
