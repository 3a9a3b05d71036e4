// What the reading of a text tells the curator: empty texts, texts without headings, and aliases
// that count more than their character. Texts are invented; counts are made by hand or by a plain
// regular expression over the same text, as said beside each check.
import { describe, expect, it } from 'vitest';
import lists from 'stopwords-iso/stopwords-iso.json' with { type: 'json' };
import { ALIAS_MIN_COUNT, ALIAS_MULTIPLE, readingProblems, readingReport, readingReportSchema } from '../../pipeline/stages/reading.ts';
import type { ReadingContext } from '../../pipeline/stages/reading.ts';
import { findMentions } from '../../pipeline/text/mentions.ts';
import type { CastMember } from '../../pipeline/text/model.ts';
import { model } from '../text/helpers.ts';

function read(source: string, cast: CastMember[] = [], options: { start?: string; end?: string; chapterPattern?: string } = {}, language = 'en') {
  const m = model(source, options);
  const report = readingReport(m, findMentions(m, cast), cast);
  const ctx: ReadingContext = {
    id: 'tale',
    display: 'texts/tale.txt',
    where: { path: 'texts[0]' },
    trimmed: options.start !== undefined || options.end !== undefined,
    pattern: options.chapterPattern !== undefined,
    cast,
    castPlaces: cast.map((c, i) => ({ name: { file: 'exhibit.yaml', line: 10 + i, column: 11 }, aliases: c.aliases.map((_, k) => ({ file: 'exhibit.yaml', line: 10 + i, column: 20 + k })) })),
    language,
  };
  return { report, problems: readingProblems(report, ctx) };
}

const chapters = 'CHAPTER I.\n\nThe ferry left the quay at dawn.\n\nCHAPTER II.\n\nThe ferry came back at dusk.\n';

describe('empty and wordless texts', () => {
  it.each([
    ['an empty file', ''],
    ['only white space', '\n\n   \n'],
    ['only punctuation', '* * *\n\n— … —\n'],
  ])('is an error for %s, naming the text and saying what to check', (_name, source) => {
    const { problems } = read(source);
    expect(problems).toEqual([
      expect.objectContaining({ severity: 'error', code: 'text/empty', file: 'texts/tale.txt', path: 'texts[0]', message: 'the text "tale" has no words, so there is nothing to measure' }),
    ]);
    expect(problems[0]!.hint).toMatch(/right file/);
  });

  it('blames the trim markers when they leave nothing between them', () => {
    const { problems } = read('BEGIN TEXT\n\nEND TEXT\n\nThe ferry left.\n', [], { start: 'BEGIN TEXT', end: 'END TEXT' });
    expect(problems.map((p) => p.code)).toEqual(['text/empty']);
    expect(problems[0]!.message).toMatch(/between its start and end markers/);
    expect(problems[0]!.hint).toMatch(/"start:" and "end:" markers/);
  });
});

describe('a text without headings', () => {
  it('is read as one chapter, with a warning that says so and how to mark chapters', () => {
    const { report, problems } = read('The ferry left the quay at dawn.\n\nIt came back at dusk.\n');
    expect(report.oneChapter).toBe(true);
    expect(problems).toEqual([expect.objectContaining({ severity: 'warning', code: 'text/no-headings', file: 'texts/tale.txt' })]);
    expect(problems[0]!.message).toBe('no chapter headings were found in the text "tale", so the whole text is read as one chapter, "Whole text"');
    expect(problems[0]!.hint).toMatch(/a line of its own/);
    expect(problems[0]!.hint).toMatch(/"chapters:" pattern/);
  });

  it('says nothing when headings are found', () => {
    expect(read(chapters).problems).toEqual([]);
  });

  it('leaves an unmatched chapter pattern to its own warning: one fault, one message', () => {
    const { problems } = read('The ferry left the quay at dawn.\n', [], { chapterPattern: '^Part \\d+$' });
    expect(problems.map((p) => p.code)).toEqual(['text/chapter-pattern-unmatched']);
  });
});

describe('aliases that count more than the character', () => {
  // Source for what a common word is: the stopwords-iso English list (npm "stopwords-iso").
  it('uses a list that has "the" and "will" and not "lamplighter"', () => {
    const en = (lists as Record<string, string[]>).en!;
    expect(en).toEqual(expect.arrayContaining(['the', 'will']));
    expect(en).not.toContain('lamplighter');
  });

  const tamsin: CastMember = { id: 'tamsin', name: 'Tamsin Rook', aliases: ['Tamsin', 'the'], pronoun: 'she' };
  const tale =
    'CHAPTER I.\n\nTamsin Rook lit the lamps on the quay. The tide was high and the wind was cold.\n\n' +
    'Tamsin watched the river. The ferry was late; the ferryman had the lantern.\n';

  it('warns about a common-word alias, with its count and the count of the other names', () => {
    const { report, problems } = read(tale, [tamsin]);
    // Regression value checked by a plain count: "the" in any case, as a whole word, in the chapter body.
    const body = tale.slice(tale.indexOf('Tamsin Rook'));
    const the = body.match(/\bthe\b/gi)!.length;
    expect(the).toBe(8);
    expect(report.counts[0]!.total).toBe(the + 2); // "Tamsin Rook" and "Tamsin"
    expect(problems).toEqual([
      expect.objectContaining({ severity: 'warning', code: 'cast/common-word-alias', file: 'exhibit.yaml', line: 10, column: 21 }),
    ]);
    expect(problems[0]!.message).toBe(
      `the alias "the" of "tamsin" is a common word, so it counts every "the" in the text as Tamsin Rook: in "tale" it matched ${the} times, against 2 times for all the other names of Tamsin Rook together`,
    );
  });

  it(`warns when an alias matches more than ${ALIAS_MULTIPLE} times as often as the other names together`, () => {
    const lamp = 'The lamp burned. ';
    const source = `CHAPTER I.\n\nAbel Hask came in. ${lamp.repeat(ALIAS_MIN_COUNT + 5)}\n`;
    const abel: CastMember = { id: 'abel', name: 'Abel Hask', aliases: ['lamp'], pronoun: 'he' };
    const { problems } = read(source, [abel]);
    expect(problems.map((p) => p.code)).toEqual(['cast/dominant-alias']);
    expect(problems[0]!.message).toMatch(new RegExp(`matched ${ALIAS_MIN_COUNT + 5} times, against 1 time for all the other names of Abel Hask`));
    expect(problems[0]!.hint).toMatch(/--measure concordance --param node="lamp"/);
  });

  it('lets a nickname the book prefers pass, and small counts too', () => {
    // "Sprat" five times as often as every other name of Kit: a nickname, not a common word.
    const source = `CHAPTER I.\n\nKit Pennock ran. Kit ran on. ${'Sprat ran. '.repeat(10)}\n`;
    const kit: CastMember = { id: 'kit', name: 'Kit Pennock', aliases: ['Sprat'], pronoun: 'he' };
    expect(read(source, [kit]).problems).toEqual([]);
    const few = `CHAPTER I.\n\nKit Pennock ran. ${'Sprat ran. '.repeat(ALIAS_MIN_COUNT - 1)}\n`;
    expect(read(few, [kit]).problems).toEqual([]);
  });

  it('checks common words in the language of the exhibit', () => {
    // "le" is a French stopword (stopwords-iso "fr"), not an English one.
    const member: CastMember = { id: 'jean', name: 'Jean Vautrin', aliases: ['le'] };
    expect(read('CHAPTER I.\n\nJean Vautrin le voit.\n', [member], {}, 'en').problems).toEqual([]);
    expect(read('CHAPTER I.\n\nJean Vautrin le voit.\n', [member], {}, 'fr').problems.map((p) => p.code)).toEqual(['cast/common-word-alias']);
  });
});

describe('the reading report in the cache', () => {
  it('has a schema the cache checks entries against', () => {
    const { report } = read(chapters, [{ id: 'x', name: 'Ferry Man', aliases: [] }]);
    expect(readingReportSchema.safeParse(JSON.parse(JSON.stringify(report))).success).toBe(true);
    expect(readingReportSchema.safeParse({ words: 'many' }).success).toBe(false);
  });
});
