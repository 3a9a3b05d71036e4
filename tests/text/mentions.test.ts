import { describe, it, expect } from 'vitest';
import { fixture, model } from './helpers.ts';
import { derivedNames, findMentions } from '../../pipeline/text/mentions.ts';
import type { CastMember, Mentions, TextModel } from '../../pipeline/text/model.ts';

// Expected mentions are counted by hand in the invented passages below.

const ADA: CastMember = { id: 'ada', name: 'Ada Fenwick', aliases: [], pronoun: 'she' };
const TOM: CastMember = { id: 'tom', name: 'Tom Fenwick', aliases: [], pronoun: 'he' };
const ORRIN: CastMember = { id: 'orrin', name: 'Orrin Dalby', aliases: ['the lamplighter'], pronoun: 'he' };

function listed(m: TextModel, men: Mentions, cast: CastMember[]): Array<[string, string]> {
  return Array.from({ length: men.count }, (_, i) => {
    const first = men.token[i];
    const last = first + men.length[i] - 1;
    return [m.text.slice(m.tokens.start[first], m.tokens.end[last]), cast[men.member[i]].id] as [string, string];
  });
}

describe('findMentions', () => {
  it('matches full names, first names and surnames, longest first', () => {
    const cast = [ADA, ORRIN];
    const m = model('Ada Fenwick waited. Ada waited longer. Dalby came late, and Orrin Dalby apologised.');
    const men = findMentions(m, cast);
    expect(listed(m, men, cast)).toEqual([
      ['Ada Fenwick', 'ada'],
      ['Ada', 'ada'],
      ['Dalby', 'orrin'],
      ['Orrin Dalby', 'orrin'],
    ]);
    expect(Array.from(men.length)).toEqual([2, 1, 1, 2]);
    expect(men.ambiguous).toEqual([]);
  });

  it('matches whole words only, case-sensitively for capitalised forms', () => {
    const cast = [ADA];
    const m = model('Adaline and the fenwick hedge. ADA shouted. Ada’s lamp and Ada\'s coat.');
    expect(listed(m, findMentions(m, cast), cast)).toEqual([
      ['Ada’s', 'ada'],
      ["Ada's", 'ada'],
    ]);
  });

  it('matches lower-case aliases in any case', () => {
    const cast = [ORRIN];
    const m = model('The lamplighter whistled. Everyone knew the lamplighter.');
    expect(listed(m, findMentions(m, cast), cast)).toEqual([
      ['The lamplighter', 'orrin'],
      ['the lamplighter', 'orrin'],
    ]);
  });

  it('capitalised words of a form match case-sensitively, lower-case words in any case', () => {
    const cast: CastMember[] = [{ id: 'amos', name: 'Amos Tull', aliases: ['the Captain'], pronoun: 'he' }];
    const m = model('The Captain waved. Then the Captain sat. Any captain would, said the captain of the ferry.');
    expect(listed(m, findMentions(m, cast), cast)).toEqual([
      ['The Captain', 'amos'],
      ['the Captain', 'amos'],
    ]);
  });

  it('does not match across sentences or punctuation', () => {
    const cast = [ADA];
    const m = model('It was Ada. Fenwick came later. Ada, Fenwick said.');
    const men = findMentions(m, cast);
    expect(listed(m, men, cast)).toEqual([
      ['Ada', 'ada'],
      ['Fenwick', 'ada'],
      ['Ada', 'ada'],
      ['Fenwick', 'ada'],
    ]);
    expect(Array.from(men.length)).toEqual([1, 1, 1, 1]);
  });

  it('reports a shared surname as ambiguous instead of attributing it', () => {
    const cast = [ADA, TOM];
    const m = model('CHAPTER I.\n\nFenwick sighed. Tom laughed.\n\nCHAPTER II.\n\nThe Fenwick cart was late.');
    const men = findMentions(m, cast);
    expect(listed(m, men, cast)).toEqual([['Tom', 'tom']]);
    expect(men.ambiguous).toEqual([
      { token: 0, text: 'Fenwick', chapter: 0, candidates: ['ada', 'tom'] },
      { token: 5, text: 'Fenwick', chapter: 1, candidates: ['ada', 'tom'] },
    ]);
  });

  it('an alias listed for two members is ambiguous', () => {
    const cast = [
      { ...ADA, aliases: ['the twins'] },
      { ...TOM, aliases: ['the twins'] },
    ];
    const m = model('Nobody could tell the twins apart.');
    const men = findMentions(m, cast);
    expect(men.count).toBe(0);
    expect(men.ambiguous.map((a) => [a.text, a.candidates])).toEqual([['the twins', ['ada', 'tom']]]);
  });

  it('a title before a surname narrows the candidates by pronoun', () => {
    const cast = [ADA, TOM, { id: 'nell', name: 'Nell Fenwick', aliases: [], pronoun: 'she' as const }];
    const m = model('Mr. Fenwick bowed. Mr Fenwick sat. Mrs. Fenwick frowned. Miss Fenwick left.');
    const men = findMentions(m, cast);
    expect(listed(m, men, cast)).toEqual([
      ['Fenwick', 'tom'],
      ['Fenwick', 'tom'],
    ]);
    expect(men.ambiguous.map((a) => [a.text, a.candidates])).toEqual([
      ['Fenwick', ['ada', 'nell']],
      ['Fenwick', ['ada', 'nell']],
    ]);
  });

  it('a title that fits no candidate names someone outside the cast', () => {
    const cast = [TOM, ORRIN];
    const m = model('Mrs. Fenwick came. Fenwick stayed.');
    const men = findMentions(m, cast);
    expect(listed(m, men, cast)).toEqual([['Fenwick', 'tom']]);
    expect(men.ambiguous).toEqual([]);
  });

  it('explicit aliases take precedence over derived names', () => {
    // "Fenwick" is Ada's alias and Tom's derived surname: Ada wins, nothing is ambiguous.
    const cast = [{ ...ADA, aliases: ['Fenwick'] }, TOM];
    const m = model('Fenwick wrote to Tom Fenwick.');
    const men = findMentions(m, cast);
    expect(listed(m, men, cast)).toEqual([
      ['Fenwick', 'ada'],
      ['Tom Fenwick', 'tom'],
    ]);
    expect(men.ambiguous).toEqual([]);
  });

  it('names with initials and titles', () => {
    expect(derivedNames('J. R. Tolley')).toEqual(['Tolley']);
    expect(derivedNames('Mrs. Orme')).toEqual(['Orme']);
    expect(derivedNames('Dr. Emmet Vale')).toEqual(['Emmet', 'Vale']);
    expect(derivedNames('Cobb')).toEqual([]);
    const cast: CastMember[] = [{ id: 'jrt', name: 'J. R. Tolley', aliases: [] }];
    const m = model(fixture('chapter-arabic.txt'));
    expect(listed(m, findMentions(m, cast), cast)).toEqual([
      ['J. R. Tolley', 'jrt'],
      ['Tolley', 'jrt'],
    ]);
  });

  it('mention columns are sized exactly and an empty cast finds nothing', () => {
    const m = model(fixture('parts.txt'));
    const men = findMentions(m, [ADA, TOM]);
    expect(men.token.length).toBe(men.count);
    expect(men.member.length).toBe(men.count);
    expect(men.length.length).toBe(men.count);
    expect(findMentions(m, []).count).toBe(0);
  });
});
