import { describe, it, expect } from 'vitest';
import { fixture, model, paragraphs } from './helpers.ts';
import type { TextModel } from '../../pipeline/text/model.ts';

// Heading styles are conventions of book typography: common practice, no source.
// Expected chapter lists are read off each invented fixture by hand.

const titles = (m: TextModel): string[] => m.chapters.map((c) => c.title);
const headings = (m: TextModel): Array<string | null> => m.chapters.map((c) => c.heading);
const parts = (m: TextModel): Array<string | null> => m.chapters.map((c) => c.part);

describe('chapter headings, one fixture per style', () => {
  it('CHAPTER I. / CHAPTER III without stop / title on the next line', () => {
    const m = model(fixture('chapter-keyword-roman.txt'));
    expect(titles(m)).toEqual(['Chapter I', 'Chapter II', 'Chapter III', 'Chapter IV: The Weir']);
    expect(headings(m)).toEqual(['CHAPTER I.', 'CHAPTER II.', 'CHAPTER III', 'CHAPTER IV']);
    expect(m.chapters.map((c) => c.line)).toEqual([7, 17, 26, 32]);
    // The title line is not a paragraph of the chapter.
    expect(paragraphs(m)[m.chapters[3].firstParagraph]).toMatch(/^By the end of the week/);
    // The title and epigraph before CHAPTER I are outside every chapter.
    expect(m.skipped).toHaveLength(1);
    expect(m.text.slice(m.skipped![0].start, m.skipped![0].end)).toMatch(/^THE WEIR AT LANNOCK[\s\S]*Lannock saying$/);
  });

  it('Chapter 1 (Arabic) with Prologue and Epilogue', () => {
    const m = model(fixture('chapter-arabic.txt'));
    expect(titles(m)).toEqual(['Prologue', 'Chapter 1', 'Chapter 2', 'Chapter 3', 'Epilogue']);
    expect(m.chapters[1].paragraphCount).toBe(2);
  });

  it('CHAPTER XII.—A TITLE with em dash, en dash, spaced hyphen and double hyphen', () => {
    const m = model(fixture('chapter-dash-title.txt'));
    expect(titles(m)).toEqual([
      "Chapter I: The Lamplighter's Round",
      'Chapter II: A Wet Night on the Quay',
      'Chapter III: What the Chandler Saw',
      'Chapter IV: Morning',
    ]);
    expect(headings(m)[1]).toBe('CHAPTER II.–A WET NIGHT ON THE QUAY');
  });

  it('Chapter II: A Title (mixed case kept as written)', () => {
    const m = model(fixture('chapter-colon-title.txt'));
    expect(titles(m)).toEqual(['Chapter I: The Orchard Wall', 'Chapter II: An Agreement of Sorts', 'Chapter III: Stones']);
  });

  it('Chapter the First (ordinal words)', () => {
    const m = model(fixture('chapter-ordinal.txt'));
    expect(titles(m)).toEqual(['Chapter the First', 'Chapter the Second', 'Chapter the Third']);
    // "In which …" lines are sentences of the body, not titles (they end with a full stop).
    expect(m.chapters.every((c) => c.paragraphCount === 1)).toBe(true);
  });

  it('III. alone on a line (Roman numeral sequence)', () => {
    const m = model(fixture('roman-alone.txt'));
    expect(titles(m)).toEqual(['Chapter 1', 'Chapter 2', 'Chapter 3', 'Chapter 4']);
    expect(headings(m)).toEqual(['I.', 'II.', 'III.', 'IV.']);
    // The stray "II." inside chapter 3 breaks the sequence, so it stays a paragraph.
    expect(paragraphs(m).slice(m.chapters[2].firstParagraph, m.chapters[2].firstParagraph + m.chapters[2].paragraphCount)).toContain('II.');
  });

  it('VI. A Title (Roman numeral and short title)', () => {
    const m = model(fixture('roman-titled.txt'));
    expect(titles(m)).toEqual(['I. The Tin Box', 'II. A Key Without a Door', 'III. The Cellar']);
    expect(headings(m)[2]).toBe('III. THE CELLAR');
  });

  it('CHAPTER ONE (spelled out), title on the next line of the same block', () => {
    const m = model(fixture('spelled-out.txt'));
    expect(titles(m)).toEqual(['Chapter One', 'Chapter Two', 'Chapter Three: A Swarm']);
    expect(m.chapters[2].paragraphCount).toBe(1);
  });

  it('BOOK ONE / Book the Second / PART III set the part and are not chapters', () => {
    const m = model(fixture('parts.txt'));
    // Chapter numbers restart in each part, so each title carries its part.
    expect(titles(m)).toEqual(['Book One, Chapter I', 'Book One, Chapter II', 'Book the Second, Chapter I', 'Book the Second, Chapter II', 'Part III, Chapter I']);
    expect(parts(m)).toEqual([
      'Book One: The River Years',
      'Book One: The River Years',
      'Book the Second',
      'Book the Second',
      'Part III: The Flood',
    ]);
  });

  it('bare numerals restarting in each part', () => {
    const m = model(fixture('parts-bare-numerals.txt'));
    expect(titles(m)).toEqual(['Part One, Chapter 1', 'Part One, Chapter 2', 'Part Two, Chapter 1', 'Part Two, Chapter 2']);
    expect(parts(m)).toEqual(['Part One', 'Part One', 'Part Two', 'Part Two']);
  });

  it('a text without headings is one implicit chapter', () => {
    const m = model(fixture('no-headings.txt'));
    expect(m.chapters).toHaveLength(1);
    expect(m.chapters[0]).toMatchObject({ title: 'Whole text', heading: null, part: null, line: 1, paragraphCount: 2 });
    expect(m.chapters[0].tokenCount).toBe(m.tokens.count);
  });

  it('parts without chapters become the chapters', () => {
    const m = model('PART ONE\n\nThe first half.\n\nPART TWO\n\nThe second half.\n');
    expect(titles(m)).toEqual(['Part One', 'Part Two']);
    expect(parts(m)).toEqual([null, null]);
  });
});

describe('heading forms', () => {
  const firstTitle = (line: string): string => model(`${line}\n\nSome words here.\n\n${line}\n\nMore words.\n`).chapters[0].title;

  it.each([
    ['CHAPTER XII.—A TITLE', 'Chapter XII: A Title'],
    ['Chapter Twenty-Three', 'Chapter Twenty-Three'],
    ['CHAPTER TWENTY-THREE', 'Chapter Twenty-Three'],
    ['Chapter the Twenty-First', 'Chapter the Twenty-First'],
    ['Chapter the Fiftieth', 'Chapter the Fiftieth'],
    ['CHAPTER THE FORTY-SECOND', 'Chapter the Forty-Second'],
    ['Chapter One Hundred and Two', 'Chapter One Hundred and Two'],
    ['chapter iv', 'Chapter IV'],
    ['Chap. 7', 'Chapter 7'],
    ['CHAPTER 9. AT THE MILL', 'Chapter 9: At the Mill'],
    ['Chapter 4 The Long Field', 'Chapter 4: The Long Field'],
  ])('%s → %s', (line, title) => {
    expect(firstTitle(line)).toBe(title);
  });

  it('EPILOGUE.—A YEAR LATER → Epilogue: A Year Later (beside numbered chapters)', () => {
    const m = model('CHAPTER I.\n\nWords.\n\nEPILOGUE.—A YEAR LATER\n\nMore words.\n');
    expect(m.chapters.map((c) => c.title)).toEqual(['Chapter I', 'Epilogue: A Year Later']);
  });

  it('a lone Epilogue line without chapters is a paragraph', () => {
    const m = model('Words.\n\nEpilogue\n\nMore words.\n');
    expect(m.chapters.map((c) => c.title)).toEqual(['Whole text']);
    expect(m.paragraphs.count).toBe(3);
  });

  it('keeps the heading verbatim', () => {
    const m = model('  CHAPTER XII.—A TITLE  \n\nWords.\n');
    expect(m.chapters[0].heading).toBe('CHAPTER XII.—A TITLE');
  });

  it('splits a heading from prose that follows it without a blank line', () => {
    const m = model('CHAPTER I.\nThe morning was grey and the river\nran high under the bridge.\n\nCHAPTER II.\nRain.\n');
    expect(m.chapters.map((c) => c.title)).toEqual(['Chapter I', 'Chapter II']);
    expect(paragraphs(m)).toEqual(['The morning was grey and the river ran high under the bridge.', 'Rain.']);
  });

  it('a part line, a chapter line and a title line in one block', () => {
    const m = model('BOOK ONE\nCHAPTER I.\nTHE FIRST DAY\n\nWords here.\n\nCHAPTER II.\n\nMore.\n');
    expect(m.chapters.map((c) => [c.title, c.part])).toEqual([
      ['Chapter I: The First Day', 'Book One'],
      ['Chapter II', 'Book One'],
    ]);
  });

  it('a bare numeral takes a title from the next line', () => {
    const m = model('I.\nTHE MILL\n\nWords.\n\nII.\n\nThe Weir\n\nMore.\n');
    expect(m.chapters.map((c) => c.title)).toEqual(['I. The Mill', 'II. The Weir']);
  });

  it('text between a part heading and its first chapter is skipped', () => {
    const m = model('Chapter 1\n\nA.\n\nBOOK TWO\n\nIntro text of book two.\n\nChapter 2\n\nB.\n');
    expect(m.chapters.map((c) => [c.title, c.part])).toEqual([
      ['Chapter 1', null],
      ['Chapter 2', 'Book Two'],
    ]);
    expect(m.skipped!.map((r) => [m.text.slice(r.start, r.end), r.line])).toEqual([['Intro text of book two.', 7]]);
  });

  it('does not take a sentence or dialogue as a title', () => {
    const m = model('CHAPTER I\n\n"Come in."\n\nCHAPTER II\n\nNobody came, and the door stayed shut.\n');
    expect(m.chapters.map((c) => c.title)).toEqual(['Chapter I', 'Chapter II']);
    expect(m.chapters[0].paragraphCount).toBe(1);
  });

  it('keeps empty chapters', () => {
    const m = model('CHAPTER I.\n\nCHAPTER II.\n\nWords at last.\n');
    expect(m.chapters.map((c) => [c.paragraphCount, c.tokenCount])).toEqual([[0, 0], [1, 3]]);
  });
});

describe('false positives', () => {
  it('prose "I. said nothing", a lone "II." and a lone "I" are not headings', () => {
    const m = model(fixture('false-positives.txt'));
    expect(m.chapters).toHaveLength(1);
    expect(m.chapters[0].title).toBe('Whole text');
    expect(paragraphs(m)).toContain('I. said nothing, she wrote in the margin of the ledger, and meant it.');
    expect(paragraphs(m)).toContain('II.');
    expect(paragraphs(m)).toContain('I');
  });

  it('prose lines starting like headings are not headings', () => {
    const m = model('Part of the reason was the rain.\n\nBook two of the ledger was missing.\n\nChapter one was the dullest, she thought.\n');
    expect(m.chapters.map((c) => c.title)).toEqual(['Whole text']);
    expect(m.paragraphs.count).toBe(3);
  });

  it('bare numerals are ignored when keyword chapters exist', () => {
    const m = model('CHAPTER I.\n\nA list:\n\nI.\n\nII.\n\nCHAPTER II.\n\nEnd.\n');
    expect(m.chapters.map((c) => c.title)).toEqual(['Chapter I', 'Chapter II']);
    expect(m.chapters[0].paragraphCount).toBe(3);
  });

  it('Roman numerals that skip numbers only keep the consecutive run', () => {
    const m = model('I.\n\nOne.\n\nII.\n\nTwo.\n\nV.\n\nFive?\n\nIII.\n\nThree.\n');
    expect(m.chapters.map((c) => c.heading)).toEqual(['I.', 'II.', 'III.']);
  });

  it('a Roman run must start near 1', () => {
    const m = model('VII.\n\nSeven.\n\nVIII.\n\nEight.\n');
    expect(m.chapters.map((c) => c.title)).toEqual(['Whole text']);
  });
});

describe('chapterPattern', () => {
  it('replaces automatic detection and matches case-insensitively', () => {
    const src = '§ 1\n\nFirst.\n\nCHAPTER I.\n\nStill first.\n\n§ 2\n\nTHE LOCK\n\nSecond.\n';
    const m = model(src, { chapterPattern: '^§\\s*\\d+$' });
    expect(m.chapters.map((c) => c.title)).toEqual(['Chapter 1', 'Chapter 2: The Lock']);
    expect(m.chapters.map((c) => c.heading)).toEqual(['§ 1', '§ 2']);
    expect(m.chapters[0].paragraphCount).toBe(3);
    const ci = model('SCENE ONE\n\nA.\n\nscene two\n\nB.\n', { chapterPattern: '^Scene\\s+\\w+$' });
    // ALL CAPS is put into title case; other headings are kept as written.
    expect(ci.chapters.map((c) => c.title)).toEqual(['Scene One', 'scene two']);
  });

  it('is tried on every line, so headings need no blank lines around them', () => {
    const src = 'THE LANNOCK ROLLS\nROLL 1\n1:1 The river rose.\n1:2 The town slept.\nROLL 2\n2:1 The weir held.\n';
    const m = model(src, { chapterPattern: '^roll \\d+$' });
    expect(m.chapters.map((c) => [c.title, c.heading, c.line, c.sentenceCount])).toEqual([
      ['Roll 1', 'ROLL 1', 2, 2],
      ['Roll 2', 'ROLL 2', 5, 1],
    ]);
  });

  it('warns when the pattern is invalid or matches nothing', () => {
    const bad = model('CHAPTER I.\n\nWords.\n', { chapterPattern: '([' });
    expect(bad.warnings.map((w) => w.code)).toEqual(['text/bad-chapter-pattern']);
    expect(bad.chapters.map((c) => c.title)).toEqual(['Chapter I']);
    const none = model('CHAPTER I.\n\nWords.\n', { chapterPattern: '^SCENE' });
    expect(none.warnings.map((w) => w.code)).toEqual(['text/chapter-pattern-unmatched']);
    expect(none.chapters.map((c) => c.title)).toEqual(['Whole text']);
  });
});

describe('chapter columns', () => {
  it('partition paragraphs, sentences and tokens', () => {
    const m = model(fixture('chapter-keyword-roman.txt'));
    let p = 0;
    let s = 0;
    let t = 0;
    for (const c of m.chapters) {
      expect([c.firstParagraph, c.firstSentence, c.firstToken]).toEqual([p, s, t]);
      p += c.paragraphCount;
      s += c.sentenceCount;
      t += c.tokenCount;
      for (let i = c.firstToken; i < c.firstToken + c.tokenCount; i++) expect(m.tokens.chapter[i]).toBe(c.index);
      expect(m.text.slice(c.start, c.end)).toBe(m.text.slice(m.paragraphs.start[c.firstParagraph], m.paragraphs.end[c.firstParagraph + c.paragraphCount - 1]));
    }
    expect([p, s, t]).toEqual([m.paragraphs.count, m.sentences.count, m.tokens.count]);
  });
});
