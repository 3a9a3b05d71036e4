import { describe, it, expect } from 'vitest';
import { analyseDialogue, MIN_CONFIDENCE } from '../../pipeline/dialogue/attribute.ts';
import { checkPins, unmatchedPins } from '../../pipeline/dialogue/pins.ts';
import { SPEECH_VERBS } from '../../pipeline/dialogue/verbs.ts';
import type { CastMember } from '../../pipeline/text/model.ts';
import { CAST, context, quote, quotesOf } from './helpers.ts';

const lines = (...ps: string[]): string => ps.join('\n\n');

// The expected speakers are how a reader of English fiction takes these invented lines: a tag names the
// speaker; a new paragraph of dialogue means a new speaker; a name set off inside the speech is the person
// addressed. Common practice, no source. The sieve of rules follows Elson & McKeown 2010 and Muzny et al.
// 2017 (rule names are the project's own).

describe('speaker attribution: each rule fires and records itself', () => {
  it('tag: a name, an alias, an inverted tag with an adverb, a tag before the quotation', () => {
    const q = quotesOf(
      lines(
        '“Row on,” said Ada.',
        '“The almanac is wrong,” the ferryman replied.',
        '“It always was,” said Osric gloomily.',
        'Then Mabel turned to the others and said: “Supper.”',
      ),
      CAST,
    );
    expect([quote(q, 'Row on').speaker, quote(q, 'The almanac').speaker, quote(q, 'It always').speaker, quote(q, 'Supper').speaker]).toEqual([
      'ada',
      'osric',
      'osric',
      'mabel',
    ]);
    for (const x of q) {
      expect(x.rule).toBe('tag');
      expect(x.confidence).toBe(0.95);
    }
  });

  it('outsider: a tag naming someone outside the cast leaves the speaker null', () => {
    const q = quote(quotesOf('“The tide is turning,” said Captain Marr.', CAST), 'The tide');
    expect(q.speaker).toBeNull();
    expect(q.rule).toBe('outsider');
  });

  it('tag-pronoun: "she said" resolved from the paragraph, "said he" from the scene', () => {
    const q = quotesOf(
      lines('Ada shipped the oars and looked at Osric. “Enough,” she said.', 'Osric stood up in the boat.', '“Not yet,” said he.'),
      CAST,
    );
    expect(quote(q, 'Enough')).toMatchObject({ speaker: 'ada', rule: 'tag-pronoun' });
    expect(quote(q, 'Not yet')).toMatchObject({ speaker: 'osric', rule: 'tag-pronoun' });
  });

  it('beat: a cast member as the subject of a clause in the same paragraph', () => {
    const q = quote(quotesOf('Osric spat over the gunwale into the brown water. “The almanac is a book.”', CAST), 'The almanac');
    expect(q).toMatchObject({ speaker: 'osric', rule: 'beat', confidence: 0.8 });
  });

  it('self-naming: a speaker who gives their own name', () => {
    const q = quote(quotesOf(lines('A stranger came up the steps and took off his hat.', '“Good evening. My name is Hollis Fenn.”'), CAST), 'Good evening');
    expect(q).toMatchObject({ speaker: 'hollis', rule: 'self-naming' });
  });

  it('alternation: untagged turns in consecutive paragraphs alternate between the two speakers', () => {
    // Source: Elson & McKeown 2010 §4 and Muzny et al. 2017 §3 both use turn alternation in runs of dialogue (from memory).
    const q = quotesOf(
      lines('“Is the weir shut?” asked Ada.', '“Since noon,” said Osric.', '“And the sluice?”', '“Open.”', '“Both?”', '“Both.”', '“Then we wait.”', '“We wait.”'),
      CAST,
    );
    expect(q.map((x) => x.speaker)).toEqual(['ada', 'osric', 'ada', 'osric', 'ada', 'osric', 'ada', 'osric']);
    expect(q.slice(2).every((x) => x.rule === 'alternation')).toBe(true);
    // Confidence falls with the distance from a known speaker.
    expect(q[7].confidence).toBeLessThan(q[2].confidence);
  });

  it('alternation stops at a narrative paragraph', () => {
    const q = quotesOf(lines('“Is the weir shut?” asked Ada.', '“Since noon,” said Osric.', 'The rain came on harder.', '“Then we wait.”'), CAST);
    expect(quote(q, 'Then we wait').rule).not.toBe('alternation');
  });

  it('vocative: a speech addressing someone by name is not theirs', () => {
    const q = quotesOf(lines('Ada and Hollis sat on the sea wall.', '“It will rain,” said Hollis.', 'The rain came on harder.', '“Come inside, Hollis.”'), CAST);
    expect(quote(q, 'Come inside')).toMatchObject({ speaker: 'ada', addressee: 'hollis', rule: 'vocative' });
  });

  it('scene: dialogue right after narrative goes to the person acting there', () => {
    const q = quote(quotesOf(lines('Mabel Pryor came in from the yard with the eggs.', '“Six today.”'), CAST), 'Six today');
    expect(q).toMatchObject({ speaker: 'mabel', rule: 'scene' });
  });

  it('scene: a named outsider acting just before pure dialogue keeps it from the cast', () => {
    const q = quote(quotesOf(lines('There was a knock, and Clem stood on the step with his cap in his hands.', '“Message for the house.”'), CAST), 'Message');
    expect(q.speaker).toBeNull();
  });

  it('the parts of an interrupted speech and of a long speech share one turn and speaker', () => {
    const q = quotesOf(lines('“Well,” said Ada, “I suppose it was the miller.”', '“It stood by the weir.', '“Then the gale came,” said Osric.'), CAST);
    expect(quote(q, 'Well').turn).toBe(quote(q, 'I suppose').turn);
    expect(quote(q, 'I suppose').speaker).toBe('ada');
    expect(quote(q, 'It stood').turn).toBe(quote(q, 'Then the gale').turn);
    expect(quote(q, 'It stood').speaker).toBe('osric');
    expect(quote(q, 'It stood').turn).not.toBe(quote(q, 'Well').turn);
  });

  it('two quotations of one paragraph with tags naming different people are two turns', () => {
    const q = quotesOf('“Yes,” said Ada. “No,” said Osric.', CAST);
    expect(q.map((x) => [x.speaker, x.turn])).toEqual([
      ['ada', 0],
      ['osric', 1],
    ]);
  });

  it('a quotation within a speech belongs to the outer speaker', () => {
    const q = quotesOf('“Osric told me, ‘Mind the weir,’ and I did,” said Ada.', CAST);
    expect(q).toHaveLength(1);
    expect(q[0].speaker).toBe('ada');
  });

  it('reads the plan\'s extra speech verbs', () => {
    // "piped" is not a built-in speech verb: without the plan's verbs the tag is not read as one.
    expect(SPEECH_VERBS.has('piped')).toBe(false);
    const text = '“Six eggs today,” piped Mabel.';
    expect(quotesOf(text, CAST)[0].rule).not.toBe('tag');
    expect(quotesOf(text, CAST, { verbs: ['piped'], pins: [] })[0]).toMatchObject({ speaker: 'mabel', rule: 'tag' });
  });

  it('leaves no attributed speaker below the confidence threshold', () => {
    const q = quotesOf(lines('Ada and Hollis sat on the wall.', '“Rain.”', '“Yes.”', 'A gull cried.', '“Home?”'), CAST);
    for (const x of q) {
      if (x.speaker !== null) expect(x.confidence).toBeGreaterThanOrEqual(MIN_CONFIDENCE);
      else expect(['none', 'outsider', 'pin']).toContain(x.rule);
      expect(x.confidence).toBeGreaterThanOrEqual(0);
      expect(x.confidence).toBeLessThanOrEqual(1);
    }
  });
});

describe('ambiguous names', () => {
  const DOCTORS: CastMember[] = [
    { id: 'rhoda', name: 'Rhoda Vane', aliases: ['the doctor'], pronoun: 'she' },
    { id: 'silas', name: 'Silas Orme', aliases: ['the doctor'], pronoun: 'he' },
  ];

  it('an alias two cast members share does not attribute the speech', () => {
    const ctx = context('“Sit down and drink this,” said the doctor.', DOCTORS);
    expect(ctx.mentions.ambiguous.map((a) => a.candidates)).toEqual([['rhoda', 'silas']]);
    const q = analyseDialogue(ctx).quotes[0];
    expect(q.speaker).toBeNull();
    expect(q.rule).not.toBe('tag');
  });

  it('a shared surname is ambiguous alone, and a title settles it', () => {
    const q = quotesOf(lines('“Sit down,” said Fenn.', '“Stand up,” said Mr. Fenn.'), CAST);
    expect(quote(q, 'Sit down').speaker).toBeNull();
    expect(quote(q, 'Stand up')).toMatchObject({ speaker: 'hollis', rule: 'tag' });
  });
});

describe('addressees', () => {
  it('from the tag, from a vocative, and from the other side of the exchange', () => {
    const q = quotesOf(lines('“Is it far?” said Ada to Osric.', '“Far enough, Miss Fenn.”', '“Then we row,” said Ada.'), CAST);
    expect(quote(q, 'Is it far').addressee).toBe('osric');
    expect(quote(q, 'Far enough')).toMatchObject({ speaker: 'osric', addressee: 'ada' });
    expect(quote(q, 'Then we row').addressee).toBe('osric');
  });

  it('a name inside a quotation within the speech is not a vocative', () => {
    const q = quotesOf(lines('Ada and Osric walked up the lane.', '“Where are you going?” said Ada.', '“To say, ‘Mabel, your bowl is cracked.’”', '“You will not.”'), CAST);
    expect(quote(q, 'To say')).toMatchObject({ speaker: 'osric', addressee: 'ada' });
  });
});

describe('curator pins', () => {
  const text = lines('CHAPTER I.', '“Row on,” said Ada.', '“The board read “CLOSED” all day.”', 'The sign read “CLOSED” in red.');

  it('override every rule, with the addressee they name', () => {
    const q = quotesOf(text, CAST, { verbs: [], pins: [{ chapter: 1, startsWith: 'row ON', speaker: 'mabel', addressee: 'osric' }] });
    expect(quote(q, 'Row on')).toMatchObject({ speaker: 'mabel', addressee: 'osric', rule: 'pin', confidence: 1 });
  });

  it('may say that nobody in the cast speaks, and may turn written words into speech', () => {
    const q = quotesOf(text, CAST, {
      verbs: [],
      pins: [
        { chapter: 1, startsWith: '“Row on', speaker: null },
        { chapter: 1, startsWith: 'CLOSED', speaker: 'osric' },
      ],
    });
    expect(quote(q, 'Row on')).toMatchObject({ speaker: null, rule: 'pin' });
    const closed = q.filter((x) => x.text === 'CLOSED');
    expect(closed.map((x) => x.kind)).toContain('speech');
  });

  it('pins that match nothing are reported, with where and what to do', () => {
    const ctx = context(text, CAST);
    const dialogue = {
      verbs: [],
      pins: [
        { chapter: 1, startsWith: 'Row on', speaker: 'ada' },
        { chapter: 2, startsWith: 'Row on', speaker: 'ada' },
        { chapter: 1, startsWith: 'Nothing of the kind', speaker: 'ada' },
        { chapter: 1, startsWith: 'Row', speaker: 'ghost' },
      ],
    };
    const unmatched = unmatchedPins(ctx.model, dialogue, CAST);
    expect(unmatched.map((p) => p.pin)).toEqual([1, 2]);
    expect(unmatched[0].message).toMatch(/chapter 2 has no quotations/);
    expect(unmatched[1].message).toMatch(/none starting with these words/);
    const all = checkPins(ctx.model, dialogue, CAST);
    expect(all.find((p) => p.pin === 3)?.reason).toBe('unknown-speaker');
    expect(unmatchedPins(ctx.model, undefined, CAST)).toEqual([]);
  });
});
