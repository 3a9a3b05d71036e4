/**
 * The notes stage (pipeline/stages/notes.ts): a plan's notes made exact
 * against the text, placed once by the chart kind, and what the chart cannot
 * draw reported at the note's own place in the plan. These check the
 * project's own rules for notes (no outside source); the datasets are the
 * invented ones of the chart tests.
 */
import { describe, expect, it } from 'vitest';
import { charts } from '../../pipeline/charts/index.ts';
import { drawPanel, exactTarget } from '../../pipeline/stages/notes.ts';
import type { NoteFacts, PlanNote } from '../../pipeline/stages/notes.ts';
import { arcLines, chapterWordsBars, mentionsBars, presenceStrip } from '../charts/fixtures.ts';
import { ledgerKwic } from '../charts/fixtures-kinds.ts';

const facts: NoteFacts = {
  chapters: ['I. The Ferry', 'II. High Water', 'III. The Eel Market', 'IV. A Ledger Opened', 'V. Lock Gates'].map((title) => ({ title })),
  cast: [
    { id: 'ada', name: 'Ada Vell', aliases: [] },
    { id: 'bram', name: 'Bram Osk', aliases: [] },
    { id: 'cleo', name: 'Cleo Harrow', aliases: [] },
    { id: 'essa', name: 'Essa Quill', aliases: [] },
    { id: 'fen', name: 'Fen Marlow', aliases: [] },
  ],
};

/** Notes as the plan gives them, the k-th on line 20 + k of the plan. */
function planNotes(...ats: PlanNote['at'][]): PlanNote[] {
  return ats.map((at, k) => ({ at, text: `Note ${k + 1} of the curator.`, where: { file: 'content/exhibit.yaml', line: 20 + k, column: 13, path: `rooms[0].panels[0].notes[${k}]` } }));
}

/** [line, severity, code] of each problem, in order. */
const where = (problems: { line?: number; severity: string; code: string }[]) => problems.map((p) => [p.line, p.severity, p.code]);

describe('notes made exact against the text', () => {
  it('gives the chapter its title, the character its name, and says what the text lacks', () => {
    expect(exactTarget({ chapter: 2 }, facts)).toEqual({ at: { chapter: 2, title: 'II. High Water' }, target: 'II. High Water', passage: { chapter: 2, paragraph: null } });
    expect(exactTarget({ character: 'ada' }, facts)).toEqual({ at: { character: 'ada', name: 'Ada Vell' }, target: 'Ada Vell', passage: null });
    expect(exactTarget({ word: 'ledger' }, facts)).toEqual({ at: { word: 'ledger' }, target: '\u201Cledger\u201D', passage: null });
    expect(exactTarget({ segment: 2 }, { ...facts, segments: 4 })).toEqual({ at: { segment: 2, of: 4 }, target: 'Segment 2 of 4', passage: null });
    expect(exactTarget({ chapter: 9 }, facts)).toEqual({ problem: 'the note points at chapter 9, but the text has 5 chapters', hint: 'use a chapter from 1 to 5' });
    expect(exactTarget({ character: 'nobody' }, facts)).toMatchObject({ problem: 'the note points at the character "nobody", who is not in the cast' });
    // Parts: chapter 2 of part 2 is the fourth chapter through the text.
    const parted = { ...facts, parts: [{ title: 'Part One', firstChapter: 1, chapters: 2 }, { title: 'Part Two', firstChapter: 3, chapters: 3 }] };
    expect(exactTarget({ part: 2, chapter: 2 }, parted)).toEqual({ at: { chapter: 4, title: 'IV. A Ledger Opened' }, target: 'IV. A Ledger Opened', passage: { chapter: 4, paragraph: null } });
    expect(exactTarget({ part: 1, chapter: 3 }, parted)).toEqual({ problem: 'the note points at chapter 3 of Part One, which has 2 chapters', hint: 'use a chapter from 1 to 2' });
    expect(exactTarget({ part: 1, chapter: 1 }, facts)).toMatchObject({ problem: 'the note points at part 1, but the text has no parts' });
  });

  it('points a note at a paragraph of a chapter, drawn where its chapter is, or at the segment holding it', () => {
    const counted: NoteFacts = { ...facts, chapters: facts.chapters.map((c) => ({ ...c, paragraphs: 40 })) };
    expect(exactTarget({ chapter: 4, paragraph: 33 }, counted)).toEqual({
      at: { chapter: 4, title: 'IV. A Ledger Opened' },
      target: 'IV. A Ledger Opened, paragraph 33',
      passage: { chapter: 4, paragraph: 33 },
    });
    expect(exactTarget({ chapter: 4, paragraph: 41 }, counted)).toEqual({ problem: 'the note points at paragraph 41 of IV. A Ledger Opened, which has 40 paragraphs', hint: 'use a paragraph from 1 to 40' });
    const segmented: NoteFacts = { ...counted, segments: 4, segmentOfPassage: (at, of) => (at.chapter === 4 && of === 4 ? 3 : null) };
    expect(exactTarget({ chapter: 4, paragraph: 33 }, segmented)).toMatchObject({ at: { segment: 3, of: 4 }, passage: { chapter: 4, paragraph: 33 } });
  });

  it('gives a segment note the paragraph where its segment begins, when the edition is known', () => {
    const withEdition: NoteFacts = { ...facts, segments: 4, segmentPassage: (segment, of) => ({ chapter: 2, paragraph: segment * 10 + of }) };
    expect(exactTarget({ segment: 2 }, withEdition)).toEqual({ at: { segment: 2, of: 4 }, target: 'Segment 2 of 4', passage: { chapter: 2, paragraph: 24 } });
  });
});

describe('notes drawn on a panel', () => {
  it('on bars of chapters: a chapter is its bar; a character the bars do not show is an error at its line', () => {
    const drawn = drawPanel(charts.bars, chapterWordsBars, {}, planNotes({ chapter: 2 }, { chapter: 9 }, { character: 'ada' }, { character: 'nobody' }), facts);
    expect(drawn.out.notes.map((o) => o.placed)).toEqual(['drawn', 'absent']);
    expect(where(drawn.problems)).toEqual([
      [21, 'error', 'note/unresolved'],
      [23, 'error', 'note/unresolved'],
      [22, 'error', 'note/unresolved'],
    ]);
    expect(drawn.problems[2]!.message).toBe('the note points at Ada Vell, who is not shown in this chart');
    expect(drawn.problems[2]).toMatchObject({ file: 'content/exhibit.yaml', column: 13, path: 'rooms[0].panels[0].notes[2]' });
    expect(drawn.notes).toEqual([{ label: '1', text: 'Note 1 of the curator.', target: 'II. High Water', passage: { chapter: 2, paragraph: null } }]);
  });

  it('on bars of characters: a character beyond the bars drawn, and a chapter, go beside the chart with a warning', () => {
    const drawn = drawPanel(charts.bars, mentionsBars, { sort: 'descending', limit: 2 }, planNotes({ character: 'essa' }, { character: 'bram' }, { chapter: 1 }), facts);
    expect(drawn.out.skippedNotes).toEqual(['2', '3']);
    expect(where(drawn.problems)).toEqual([
      [21, 'warning', 'note/not-drawn'],
      [22, 'warning', 'note/not-drawn'],
    ]);
    expect(drawn.notes.map((n) => [n.label, n.target])).toEqual([
      ['1', 'Essa Quill'],
      ['2', 'Bram Osk'],
      ['3', 'I. The Ferry'],
    ]);
    expect(drawn.out.svg).toContain('data-note="1"');
    expect(drawn.out.svg).not.toContain('data-note="2"');
  });

  it('on lines: a segment is its position, named by the chart’s own label; a character, its series', () => {
    const drawn = drawPanel(charts.lines, arcLines, {}, planNotes({ segment: 3 }, { character: 'cleo' }, { segment: 7 }), facts);
    expect(drawn.out.notes.map((o) => o.placed)).toEqual(['drawn', 'drawn', 'absent']);
    expect(drawn.notes.map((n) => n.target)).toEqual(['Chapter 3: The Eel Market', 'Cleo Harrow']);
    expect(where(drawn.problems)).toEqual([[22, 'error', 'note/unresolved']]);
    expect(drawn.problems[0]!.message).toBe('the note points at segment 7, which this chart does not show');
  });

  it('keeps a paragraph note’s own words beside the chart, and its passage', () => {
    const drawn = drawPanel(charts.bars, chapterWordsBars, {}, planNotes({ chapter: 2, paragraph: 5 }), facts);
    expect(drawn.problems).toEqual([]);
    expect(drawn.notes).toEqual([{ label: '1', text: 'Note 1 of the curator.', target: 'II. High Water, paragraph 5', passage: { chapter: 2, paragraph: 5 } }]);
  });

  it('on a strip: a segment needs a measure counted by segments', () => {
    const counted = drawPanel(charts.strip, presenceStrip, {}, planNotes({ segment: 2 }), { ...facts, segments: 4 });
    expect(counted.problems).toEqual([]);
    expect(counted.notes[0]!.target).toBe('Segment 2 of 4');
    const uncounted = drawPanel(charts.strip, presenceStrip, {}, planNotes({ segment: 2 }), facts);
    expect(where(uncounted.problems)).toEqual([[20, 'error', 'note/unresolved']]);
  });

  it('on a concordance: a word is the first line that holds it, one note to a line', () => {
    const drawn = drawPanel(charts.kwic, ledgerKwic, {}, planNotes({ word: 'Oilcloth' }, { word: 'oilcloth' }, { word: 'weir' }), facts);
    expect(drawn.out.notes.map((o) => o.placed)).toEqual(['drawn', 'beside', 'absent']);
    expect(where(drawn.problems)).toEqual([
      [21, 'warning', 'note/not-drawn'],
      [22, 'error', 'note/unresolved'],
    ]);
    const svg = drawn.out.svg;
    expect(svg.slice(svg.indexOf('data-line="0"'), svg.indexOf('data-line="1"'))).toContain('data-note="1"');
  });

  it('keeps the summary apart from the notes the chart draws', () => {
    const { out } = drawPanel(charts.bars, chapterWordsBars, {}, planNotes({ chapter: 4 }), facts);
    expect(out.alt.startsWith(out.summary)).toBe(true);
    expect(out.summary).not.toContain('Note 1');
    expect(out.alt).toBe(`${out.summary} Note 1: Note 1 of the curator.`);
  });
});
