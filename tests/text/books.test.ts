import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { model } from './helpers.ts';
import type { TextModel } from '../../pipeline/text/model.ts';

// Invented book-shaped texts (tests/fixtures/headings/). Heading styles, contents pages, stanza numbers and the
// e-text licence header are conventions of printed books and e-texts: common practice, no source. The expected
// chapters, heading lines and word counts were read off each fixture by hand and written here before the detector
// was run; words must agree within 2 %. Word counts are `wc -w` over each chapter's body lines, from the line after
// the heading (or its title line) to the line before the next heading; "THE END" is not counted.

function book(name: string): TextModel {
  return model(readFileSync(fileURLToPath(new URL(`../fixtures/headings/${name}`, import.meta.url)), 'utf8'));
}

function expectChapters(m: TextModel, expected: [title: string, line: number, words: number][]): void {
  expect(m.chapters.map((c) => c.title)).toEqual(expected.map((e) => e[0]));
  expect(m.chapters.map((c) => c.line)).toEqual(expected.map((e) => e[1]));
  m.chapters.forEach((c, i) => {
    const want = expected[i]![2];
    expect(Math.abs(c.tokenCount - want), `${c.title}: ${c.tokenCount} words, expected ${want}`).toBeLessThanOrEqual(Math.max(0.02 * want, 0.5));
  });
}

describe('book-shaped fixtures', () => {
  it('bare Roman numerals, alone or with a title, past a contents page, a poem with numbered stanzas, a list and a date', () => {
    const m = book('bare-roman.txt');
    expectChapters(m, [
      ['Chapter 1', 21, 68],
      ['II. Low Water, and a Wedding', 31, 74],
      ["III. The Miller's Song", 41, 125],
      ['IV. What the Chandler Owed', 72, 109],
      ['Chapter 5', 95, 8],
      ['VI. The Last Crossing', 99, 100],
    ]);
    const rejected = m.headings!.rejected.map((r) => [r.line, r.text]);
    // The stanza numbers of the miller's song are seen and turned down.
    expect(rejected).toEqual(expect.arrayContaining([[48, 'I.'], [55, 'II.'], [62, 'III.']]));
    expect(m.headings!.taken.map((h) => h.line)).toEqual([21, 31, 41, 72, 95, 99]);
  });

  it('an e-text with the licence header and footer and a contents page, read with no start or end given', () => {
    const m = book('etext.txt');
    expectChapters(m, [
      ['Chapter I: The Salt Road', 50, 82],
      ['Chapter II: The Inn at Crossways', 63, 92],
      ['Chapter III: A Bargain', 80, 35],
      ['Chapter IV: Home', 89, 97],
    ]);
    expect(m.trimmed).toMatchObject({ front: { from: 1, to: 19 }, back: { from: 105, to: 128 } });
    // The contents lines are seen and turned down, and the footer's "Section 1." is gone with the footer.
    expect(m.headings!.rejected.filter((r) => /contents/.test(r.reason)).map((r) => r.line)).toEqual([38, 39, 40, 41]);
    expect(m.text).not.toMatch(/Section 1\./);
  });

  it('spelled-out ordinals before and after the word Chapter, an interlude, and a title on the next line', () => {
    const m = book('ordinals.txt');
    expectChapters(m, [
      ['Chapter the First', 6, 46],
      ['Chapter the Second', 15, 45],
      ['The Third Chapter', 24, 41],
      ['Interlude', 31, 7],
      ['The Fourth Chapter: The Visitor', 36, 82],
      ['Chapter the Fifth: Spring', 49, 12],
    ]);
  });

  it('two levels: books above chapters numbered within each book, with a prologue and an epilogue outside them', () => {
    // Chapter numbers restart in each book, so each title carries its book (see nameChaptersWithinParts).
    const m = book('two-level.txt');
    expectChapters(m, [
      ['Prologue', 6, 26],
      ['Book One, Chapter I', 16, 39],
      ['Book One, Chapter II', 22, 48],
      ['Book One, Chapter III', 30, 8],
      ['Book Two, Chapter I', 39, 82],
      ['Book Two, Chapter II', 49, 11],
      ['Book Three, Chapter I', 56, 50],
      ['Epilogue', 65, 12],
    ]);
    expect(m.parts!.map((p) => [p.title, p.line, p.firstChapter, p.chapterCount])).toEqual([
      ['Book One: The Mill', 12, 1, 3],
      ['Book Two: The Miller', 35, 4, 2],
      ['Book Three', 54, 6, 1],
    ]);
    expect(m.chapters.map((c) => c.part)).toEqual([null, 'Book One: The Mill', 'Book One: The Mill', 'Book One: The Mill', 'Book Two: The Miller', 'Book Two: The Miller', 'Book Three', null]);
    expect(m.chapters.map((c) => [c.partIndex, c.numberInPart])).toEqual([
      [null, null], [0, 1], [0, 2], [0, 3], [1, 1], [1, 2], [2, 1], [null, null],
    ]);
  });

  it('letters, each with a place and date line, as the units of an epistolary text', () => {
    const m = book('letters.txt');
    expectChapters(m, [
      ['Letter I', 6, 44],
      ['Letter II', 20, 40],
      ['Letter III', 33, 93],
      ['Letter IV', 50, 10],
    ]);
  });

  it('staves with spelled-out numbers and titles on the next line', () => {
    const m = book('staves.txt');
    expectChapters(m, [
      ['Stave One: The Cold Lamps', 6, 53],
      ['Stave Two: The First of the Lights', 17, 13],
      ['Stave Three: The Second of the Lights', 24, 68],
      ['Stave Four: The Last of the Lights', 36, 32],
    ]);
  });
});

describe('heading styles, one line each', () => {
  const titles = (src: string): string[] => model(src).chapters.map((c) => c.title);

  it('the other unit words of printed books: Canto, Section, and Chapter Twenty-One', () => {
    expect(titles('CANTO I.\n\nArms and the river.\n\nCANTO II.\n\nThe weir.\n')).toEqual(['Canto I', 'Canto II']);
    expect(titles('Section 1\n\nFirst.\n\nSection 2\n\nSecond.\n')).toEqual(['Section 1', 'Section 2']);
    expect(titles('Chapter Twenty\n\nA.\n\nChapter Twenty-One\n\nB.\n')).toEqual(['Chapter Twenty', 'Chapter Twenty-One']);
  });

  it('a Section inside chapters is a subdivision, reported as such', () => {
    const m = model('CHAPTER I.\n\nSection 1\n\nWords.\n\nSection 2\n\nMore.\n\nCHAPTER II.\n\nEnd.\n');
    expect(m.chapters.map((c) => [c.title, c.tokenCount])).toEqual([['Chapter I', 6], ['Chapter II', 1]]);
    expect(m.headings!.rejected.map((r) => [r.line, r.reason])).toEqual([
      [3, expect.stringMatching(/section inside a chapter/)],
      [7, expect.stringMatching(/section inside a chapter/)],
    ]);
  });

  it('an Arabic numeral with a title, and a run of numbered lines that is a list', () => {
    expect(titles('1. The Salt Road\n\nWords here.\n\n2. The Inn\n\nMore words.\n')).toEqual(['1. The Salt Road', '2. The Inn']);
    const m = model('I.\n\nThe list:\n\n1.\n\n2.\n\n3.\n\nII.\n\nOn.\n');
    expect(m.chapters.map((c) => c.heading)).toEqual(['I.', 'II.']);
    expect(m.headings!.rejected.map((r) => r.text)).toEqual(['1.', '2.', '3.']);
  });

  it('a contents page without a label, known by the headings that repeat it', () => {
    const src = 'CHAPTER I. THE MILL\nCHAPTER II. THE WEIR\n\nCHAPTER I.\n\nTHE MILL\n\nWords of the mill, a good many of them, enough to be a chapter of a sort.\n\nCHAPTER II.\n\nTHE WEIR\n\nThe weir.\n';
    const m = model(src);
    expect(m.chapters.map((c) => [c.title, c.line])).toEqual([['Chapter I: The Mill', 4], ['Chapter II: The Weir', 10]]);
    expect(m.headings!.rejected.map((r) => r.line)).toEqual([1, 2]);
  });

  it('does not take short numbered sections that restart their numbering for a contents page', () => {
    const section = (n: string): string => `${n}\n\nA short section of a few words only.\n`;
    const m = model(['1', '2', '3', '1', '2', '3'].map(section).join('\n'));
    expect(m.headings!.rejected.filter((r) => /contents/.test(r.reason))).toEqual([]);
    expect(m.chapters.map((c) => c.line)).toEqual([1, 5, 9]);
  });

  it('reports a line that starts like a heading but reads as a sentence, and not a sentence starting "Part of"', () => {
    const m = model('Chapter one was the dullest, she thought.\n\nPart of the reason was the rain.\n');
    expect(m.headings!.rejected.map((r) => [r.line, r.text])).toEqual([[1, 'Chapter one was the dullest, she thought.']]);
  });

  it('leaves a closing THE END outside the last chapter', () => {
    const m = model('CHAPTER I.\n\nWords.\n\nTHE END\n');
    expect(m.chapters[0]!.tokenCount).toBe(1);
    expect(m.skipped!.map((r) => m.text.slice(r.start, r.end))).toEqual(['THE END']);
  });
});

describe('e-text licence header and footer', () => {
  const body = 'CHAPTER I.\n\nThe words of the tale.\n';

  it.each([
    ['*** START OF THE E-TEXT OF A TALE ***', '*** END OF THE E-TEXT OF A TALE ***'],
    ['***START OF THIS E-TEXT A TALE***', '***END OF THIS E-TEXT A TALE***'],
    ['*** START OF THE E-TEXT A TALE', '*** END OF THE E-TEXT A TALE'],
  ])('trims at %s … %s', (start, end) => {
    const m = model(`Licence words here.\nMore licence.\n${start}\n\n${body}\n${end}\n\nFooter licence.\nSection 1. Terms.\n`);
    expect(m.chapters.map((c) => [c.title, c.tokenCount])).toEqual([['Chapter I', 5]]);
    expect(m.trimmed).toEqual({
      front: { from: 1, to: 3, marker: start, automatic: true },
      back: { from: 9, to: 12, marker: end, automatic: true },
    });
  });

  it('trims at the end line above the end marker, and at the small-print line of older e-texts', () => {
    const m = model(`*END*THE SMALL PRINT! FOR PUBLIC DOMAIN ETEXTS*Ver.04.29.93*END*\n\n${body}\n\nEnd of the E-book of A Tale\n\n*** END OF THE E-BOOK A TALE ***\nfooter\n`);
    expect(m.trimmed!.front).toMatchObject({ from: 1, to: 1 });
    expect(m.trimmed!.back).toMatchObject({ from: 8, marker: 'End of the E-book of A Tale' });
    expect(m.chapters[0]!.tokenCount).toBe(5);
  });

  it('takes any "End of …" line just above the end marker as the start of the footer', () => {
    const m = model(`*** START OF THE E-TEXT A TALE ***\n${body}\nEnd of Wenna Trask's A Tale\n\n*** END OF THE E-TEXT A TALE ***\n`);
    expect(m.trimmed!.back).toMatchObject({ from: 6, marker: "End of Wenna Trask's A Tale" });
    expect(m.chapters[0]!.tokenCount).toBe(5);
  });

  it('leaves a text without them alone, and lets the plan’s markers win on their side', () => {
    expect(model(body).trimmed).toEqual({});
    const m = model(`*** START OF THE E-TEXT A TALE ***\nBEGIN\n${body}\n*** END OF THE E-TEXT A TALE ***\nfooter\n`, { start: 'BEGIN' });
    expect(m.trimmed!.front).toEqual({ from: 1, to: 2, marker: 'BEGIN', automatic: false });
    expect(m.trimmed!.back).toMatchObject({ automatic: true });
  });
});
