import { describe, it, expect } from 'vitest';
import { buildTextModel } from '../../pipeline/text/build.ts';
import { findQuotes } from '../../pipeline/dialogue/quotes.ts';
import { readConventions } from '../../pipeline/dialogue/conventions.ts';
import { letterShaped } from '../../pipeline/dialogue/kind.ts';

const scan = (text: string) => findQuotes(buildTextModel(text, { id: 'quotes-test' }));
const texts = (text: string) => scan(text).quotes.map((q) => q.text);

describe('quotation finder: marks and conventions', () => {
  it('reads curly and straight double marks, and leaves the marks out of the text', () => {
    // Source: The Chicago Manual of Style, 17th ed., §13.28 (double marks for quotations; from memory).
    expect(texts('“Row on,” said Nessa. "The tide will not wait."')).toEqual(['Row on,', 'The tide will not wait.']);
  });

  it('collapses line breaks and runs of spaces inside a quotation to one space', () => {
    expect(texts('“The weir was\nhigh,   and the   sluice\n  shut.”')).toEqual(['The weir was high, and the sluice shut.']);
  });

  it('detects the single-mark convention and keeps double marks inside as part of the speech', () => {
    // Source: New Hart's Rules, 2nd ed. (2014), §9.2: British practice, single marks first, double marks within (from memory).
    const text = '‘He said “never again” to me,’ said Tom, ‘and he meant it.’\n\n‘Then he was wrong,’ said Ada.';
    const r = scan(text);
    expect(r.convention).toBe('single');
    expect(r.quotes.map((q) => q.text)).toEqual(['He said “never again” to me,', 'and he meant it.', 'Then he was wrong,']);
  });

  it('keeps a quotation within a speech inside it in the double convention', () => {
    expect(texts('“Miss Rook said, ‘Go home,’ and so I went,” said Kit.')).toEqual(['Miss Rook said, ‘Go home,’ and so I went,']);
  });

  it('tells apostrophes and elisions from closing single marks', () => {
    // Elisions and possessives written with ’ (’twas, goin’, o’er, miller’s, the Rooks’): common practice, no source.
    const text = [
      '‘I’m goin’ to the Rooks’ landing,’ said Ada. ‘’Tis late, but the tide’s o’er the bar.’',
      '',
      '‘The miller’s boat is out,’ said Tom.',
      '',
      "'Straight marks too,' said Ada, 'with the Rooks' nets and 'em all.'",
    ].join('\n');
    expect(texts(text)).toEqual([
      'I’m goin’ to the Rooks’ landing,',
      '’Tis late, but the tide’s o’er the bar.',
      'The miller’s boat is out,',
      'Straight marks too,',
      "with the Rooks' nets and 'em all.",
    ]);
  });

  it('closes a quotation at a possessive-looking mark when a tag follows it', () => {
    expect(texts('‘The nets’ she said, ‘are torn.’')).toEqual(['The nets', 'are torn.']);
  });

  it('splits a speech interrupted by its tag into two entries', () => {
    expect(texts('“Well,” said Ada, “I suppose it was the miller.”')).toEqual(['Well,', 'I suppose it was the miller.']);
  });

  it('gives each paragraph of a long speech its own entry, linked to the next', () => {
    // Source: The Chicago Manual of Style, 17th ed., §13.30: each paragraph of a quotation opens with a mark,
    // only the last one closes (from memory).
    const text = '“It stood by the weir,\na great brick cone.\n\n“Then the gale came.\n\n“That is all.”\n\nNarrative follows.';
    const r = scan(text);
    expect(r.quotes.map((q) => [q.text, q.continued, q.continuation])).toEqual([
      ['It stood by the weir, a great brick cone.', true, false],
      ['Then the gale came.', true, true],
      ['That is all.', false, true],
    ]);
    expect(r.problems).toEqual([]);
  });

  it('detects the convention from how paragraphs open, and from opening marks elsewhere', () => {
    const conv = (t: string) => readConventions(buildTextModel(t, { id: 'c' })).text;
    expect(conv('‘Go,’ she said.\n\n‘Now.’')).toBe('single');
    expect(conv('She said “go” and he said ‘now’ and “later”.')).toBe('double');
    expect(conv('’Tis late. “Go,” she said.')).toBe('double');
  });
});

describe('quotation finder: written words are not speech', () => {
  const kinds = (text: string) => scan(text).quotes.map((q) => [q.text, q.kind]);

  it('flags a sign read, a word named and a title called by name', () => {
    expect(kinds('The board over the door read “NO NAKED LIGHTS”, and nobody minded it.')).toEqual([['NO NAKED LIGHTS', 'text']]);
    expect(kinds('She had never liked the word “dutiful” in a report.')).toEqual([['dutiful', 'text']]);
    expect(kinds('They sailed in a ketch called “Heron” that summer.')).toEqual([['Heron', 'text']]);
    expect(kinds('The card was signed “J. Rook” in pencil.')).toEqual([['J. Rook', 'text']]);
  });

  it('flags a short scare-quoted word inside narrative, but not speech reported with a verb', () => {
    expect(kinds('Her so-called “friend” was late again.')).toEqual([['friend', 'text']]);
    expect(kinds('He said “yes” and left the room.')).toEqual([['yes', 'speech']]);
    expect(kinds('Ada called “Come here!” across the yard.')).toEqual([['Come here!', 'speech']]);
  });

  it('flags a letter set out after a colon, over several paragraphs', () => {
    const text = 'She smoothed the page and read:\n\n“My dear Maud,—I write in haste.\n\n“Your brother, Edwin.”\n\n“Bad news?” asked Ada.';
    expect(kinds(text)).toEqual([
      ['My dear Maud,—I write in haste.', 'text'],
      ['Your brother, Edwin.', 'text'],
      ['Bad news?', 'speech'],
    ]);
  });

  it('flags a letter-shaped paragraph after a sentence about reading, but not a reply after it', () => {
    const letter = 'She read it by the fire.\n\n“Dear Tam,—I shall be home on Friday. Your brother, J. Rook.”';
    expect(kinds(letter)).toEqual([['Dear Tam,—I shall be home on Friday. Your brother, J. Rook.', 'text']]);
    const reply = 'She read it by the fire.\n\n“He is coming home on Friday.”';
    expect(kinds(reply)).toEqual([['He is coming home on Friday.', 'speech']]);
    expect(letterShaped('NOTICE. The gates are closed.')).toBe(true);
    expect(letterShaped('Yours truly, A. Pryor')).toBe(true);
    expect(letterShaped('I shall come on Friday.')).toBe(false);
  });
});

describe('quotation finder: bad input', () => {
  it('finds nothing in a text without quotation marks', () => {
    const r = scan('CHAPTER I.\n\nThe river rose in the night, and nobody spoke of it.');
    expect(r.quotes).toEqual([]);
    expect(r.problems).toEqual([]);
  });

  it('reports an unclosed quotation with its chapter and paragraph, and reads the rest', () => {
    const text = [
      'CHAPTER I.',
      '',
      '“All is well,” said Ada.',
      '',
      'CHAPTER II.',
      '',
      'The weir held.',
      '',
      '“This one never closes, said nobody.',
      '',
      'Then the rain came.',
      '',
      '“But this one does,” said Tom.',
    ].join('\n');
    const r = scan(text);
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]).toMatchObject({ chapter: 2, paragraph: 2, line: 9 });
    expect(r.problems[0].message).toMatch(/no closing mark/);
    expect(r.quotes.map((q) => [q.chapter, q.text])).toEqual([
      [0, 'All is well,'],
      [1, 'This one never closes, said nobody.'],
      [1, 'But this one does,'],
    ]);
  });

  it('reports a closing mark with no opening mark and reads the rest', () => {
    const r = scan('The weir held” for once.\n\n“Good,” said Ada.');
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]).toMatchObject({ chapter: 1, paragraph: 1 });
    expect(r.quotes.map((q) => q.text)).toEqual(['Good,']);
  });
});
