import { describe, it, expect } from 'vitest';
import { speech } from '../../pipeline/measures/speech.ts';
import { dialogueReport } from '../../pipeline/dialogue/report.ts';
import { asksWho } from '../../pipeline/dialogue/tags.ts';
import type { CastMember } from '../../pipeline/text/model.ts';
import { CAST, context, quote, quotesOf } from './helpers.ts';

// How a reader of English fiction takes these original lines: a tag with a description or a name not in
// the cast is spoken by someone outside it; a new paragraph of dialogue is a new speaker; "I" in the
// narrative of a first-person story is its narrator. Common practice, no source.
const lines = (...ps: string[]): string => ps.join('\n\n');

describe('speakers outside the cast', () => {
  it('leaves the speaker empty, with rule outsider and the description, for a tag with a common noun', () => {
    const q = quotesOf(
      lines(
        '“The tide is turning,” said the maid.',
        '“Shut the door,” a boy called from the yard.',
        '“Mind the step,” said the old lady.',
        '“Fourpence the crab,” said the second fisherman.',
        '“Row on,” said Captain Marr.',
      ),
      CAST,
    );
    expect(q.map((x) => [x.speaker, x.rule, x.outsider])).toEqual([
      [null, 'outsider', 'the maid'],
      [null, 'outsider', 'a boy'],
      [null, 'outsider', 'the old lady'],
      [null, 'outsider', 'the second fisherman'],
      [null, 'outsider', 'Captain Marr'],
    ]);
  });

  it('does not take relations, anaphora or a voice for outsiders', () => {
    for (const tag of ['said her mother', 'said the other', 'said a voice', 'said the younger']) {
      const q = quote(quotesOf(lines('Ada and Osric sat in the boat.', '“Row on,” said Ada.', `“Not yet,” ${tag}.`), CAST), 'Not yet');
      expect([tag, q.rule]).not.toEqual([tag, 'outsider']);
    }
  });

  it('breaks the alternation: the turn answering an outsider goes to the other side, their next turn stays outside', () => {
    const q = quotesOf(
      lines(
        'Ada came down to the quay, where the fishermen had their barrow.',
        '“Fourpence,” said the first fisherman.',
        '“It was threepence on Tuesday.”',
        '“Tuesday’s Tuesday.”',
        '“Then I shall come back on Tuesday.”',
      ),
      CAST,
    );
    expect(q.map((x) => [x.speaker, x.rule])).toEqual([
      [null, 'outsider'],
      ['ada', 'alternation'],
      [null, 'outsider'],
      ['ada', 'alternation'],
    ]);
    expect(q[2].outsider).toBe('the first fisherman');
  });

  it('gives "he said" to a person described by a role just before, not to the cast', () => {
    const q = quotesOf(lines('Ada stood at the gate.', 'The postman came up the lane with the letters and stood stamping in the yard.', '“There’s ice on the bridge,” he said.'), CAST);
    expect(q[0]).toMatchObject({ speaker: null, rule: 'outsider', outsider: 'the postman' });
  });

  it('reads a definite generic description in the narrative as an epithet that may be a cast member’s', () => {
    // "The old man" after Osric has been named is Osric, as a reader takes it.
    const q = quotesOf(lines('Osric Dunn sat splitting wood in the yard.', '“Mr. Dunn?” said Ada.', 'The old man straightened, axe in hand. “You’ll be the Fenn girl.”'), CAST);
    expect(quote(q, 'You’ll be').speaker).toBe('osric');
  });

  it('gives a self-introduction in reply to "who are you?" to the person named', () => {
    const q = quotesOf(lines('Mabel looked the girl up and down.', '“And who might you be?”', '“Ada Fenn, ma’am. I keep the lamps.”'), CAST);
    expect(quote(q, 'Ada Fenn')).toMatchObject({ speaker: 'ada', rule: 'self-naming' });
    // Not a reply to such a question: the name is a vocative, and the speaker is someone else.
    const v = quotesOf(lines('Mabel and Ada sat by the fire.', '“Is it raining?” asked Mabel.', '“Ada Fenn, you know it is.”'), CAST);
    expect(quote(v, 'Ada Fenn').speaker).not.toBe('ada');
    expect(asksWho('And who might you be, if I may ask?')).toBe(true);
    expect(asksWho('What’s your name?')).toBe(true);
    expect(asksWho('Who told you?')).toBe(false);
  });

  it('reads a relation in a tag as a person of its pronoun, not as an outsider', () => {
    const q = quote(quotesOf(lines('Osric and Ada sat by the fire.', '“Tea?” said Osric.', '“Yes, and a slice of the cake,” said his mother.'), CAST), 'Yes, and');
    expect(q.rule).not.toBe('outsider');
    expect(['osric', 'hollis']).not.toContain(q.speaker);
  });

  it('lets the person called at the opening of any quotation of a turn answer it', () => {
    const q = quotesOf(lines('The kitchen was dark and the fire was low.', '“It is late,” someone said. “Osric, go to bed.”', '“Not yet.”'), CAST);
    expect(quote(q, 'Not yet')).toMatchObject({ speaker: 'osric', rule: 'alternation' });
  });

  it('gives "I said" to the narrator the plan names, and to nobody without one', () => {
    const cast: CastMember[] = [...CAST, { id: 'hugh', name: 'Hugh Fellowes', aliases: [], pronoun: 'he' }];
    const text = lines('I had not meant to go to the fair at all.', '“You will enjoy it,” said Ada.', '“I shall enjoy nothing,” I said.', '“He will,” she said to Osric.');
    const with_ = quotesOf(text, cast, { verbs: [], pins: [], narrator: 'hugh' });
    expect(quote(with_, 'I shall').speaker).toBe('hugh');
    expect(quote(with_, 'He will').speaker).toBe('ada');
    expect(quote(quotesOf(text, cast), 'I shall').speaker).not.toBe('hugh');
  });
});

describe('outsiders in the speech measure and in vitrine check', () => {
  const text = lines(
    'The maid put her head in at the door.',
    '“The gig is waiting, miss,” said the maid.',
    '“Tell Thomas we are coming,” said Ada.',
    '“Yes, miss,” said the maid.',
    '“Gingerbread!” cried a boy. “Ha’penny a piece!”',
  );

  it('counts them by their description', () => {
    const r = speech.compute(context(text, CAST), speech.params.parse({}));
    expect(r.outsiders).toEqual([
      { name: 'the maid', turns: 2, words: 7 },
      { name: 'a boy', turns: 1, words: 4 },
    ]);
    expect(r.outside).toMatchObject({ turns: 3, words: 11 });
    expect(r.quotes[0]).toMatchObject({ speaker: null, rule: 'outsider', outsider: 'the maid', marks: 'double' });
    const bars = speech.views.bars!(r, speech.params.parse({}));
    if (bars.kind !== 'bars') throw new Error('wrong view kind');
    expect(bars.categories).toEqual(['Ada Fenn', 'Outside the cast']);
  });

  it('lists them for curators, most turns first', () => {
    const ctx = context(text, CAST);
    expect(dialogueReport(ctx.model, CAST, ctx.mentions).outsiders.map((o) => `${o.name} ×${o.turns}`)).toEqual(['the maid ×2', 'a boy ×1']);
  });
});
