import { describe, it, expect } from 'vitest';
import { buildTextModel } from '../../pipeline/text/build.ts';
import { findQuotes } from '../../pipeline/dialogue/quotes.ts';
import { marksSetting, readConventions } from '../../pipeline/dialogue/conventions.ts';
import { dialogueReport } from '../../pipeline/dialogue/report.ts';
import { findMentions } from '../../pipeline/text/mentions.ts';
import { CAST, quotesOf } from './helpers.ts';

// How printed books set speech — double and single marks in English, guillemets, low-high marks and the
// quotation dash in French, German, Spanish, Russian and Scandinavian printing — and how an apostrophe
// differs from a closing mark: common practice, no source. The snippets are original.

const model = (t: string) => buildTextModel(t, { id: 'conventions-test' });
const scan = (t: string, marks?: Parameters<typeof marksSetting>[0]) => findQuotes(model(t), [], marksSetting(marks));
const texts = (t: string, marks?: Parameters<typeof marksSetting>[0]) => scan(t, marks).quotes.map((q) => q.text);
const lines = (...ps: string[]): string => ps.join('\n\n');

describe('the convention, stretch by stretch', () => {
  const mixed = [
    'CHAPTER I.',
    '',
    '“The tide is up,” said Ada. “We row at four.”',
    '',
    '“Four is late.”',
    '',
    'CHAPTER II.',
    '',
    '‘The gate is shut,’ said Osric. ‘It was shut at noon.’',
    '',
    '‘Who shut it?’',
    '',
    '‘The miller’s boy, with the ’prentice.’',
    '',
    'CHAPTER III.',
    '',
    '“Then we wait,” said Ada.',
    '',
    '“We wait.”',
    '',
    '* * *',
    '',
    '‘Still raining,’ said Mabel at the door.',
    '',
    '‘Still.’',
  ].join('\n');

  it('reads each chapter in its own marks, and a scene after an ornament in its own', () => {
    const c = readConventions(model(mixed));
    expect(c.chapters.map((x) => x.convention)).toEqual(['double', 'single', 'double']);
    expect(c.chapters[1].source).toBe('read');
    expect(c.chapters[2].scenes.map((s) => s.convention)).toEqual(['double', 'single']);
    expect(texts(mixed)).toEqual([
      'The tide is up,',
      'We row at four.',
      'Four is late.',
      'The gate is shut,',
      'It was shut at noon.',
      'Who shut it?',
      'The miller’s boy, with the ’prentice.',
      'Then we wait,',
      'We wait.',
      'Still raining,',
      'Still.',
    ]);
    expect(scan(mixed).quotes.map((q) => q.marks)).toEqual(['double', 'double', 'double', 'single', 'single', 'single', 'single', 'double', 'double', 'single', 'single']);
  });

  it('takes a wider gap than the usual one between paragraphs for a scene break', () => {
    const t = ['“One,” said Ada.', '', '“Two.”', '', '', '', '‘Three,’ said Osric.', '', '‘Four.’'].join('\n');
    expect(readConventions(model(t)).chapters[0].scenes.map((s) => s.convention)).toEqual(['double', 'single']);
    expect(texts(t)).toEqual(['One,', 'Two.', 'Three,', 'Four.']);
  });

  it('lets the plan fix the marks for the text, or for one chapter', () => {
    // Fixed to single marks, the double-quoted chapter has no speech; fixed per chapter, only that one changes.
    expect(texts(mixed, 'single').slice(0, 3)).toEqual(['The gate is shut,', 'It was shut at noon.', 'Who shut it?']);
    const c = readConventions(model(mixed), marksSetting({ chapters: { 3: 'single' } }));
    expect(c.chapters.map((x) => [x.convention, x.source])).toEqual([
      ['double', 'read'],
      ['single', 'read'],
      ['single', 'plan'],
    ]);
  });

  it('reads quotations in the other marks as quotations inside speech, never as speech of their own', () => {
    expect(texts('“Mabel told me, ‘Mind the weir,’ and I did,” said Ada.')).toEqual(['Mabel told me, ‘Mind the weir,’ and I did,']);
    expect(texts('‘Mabel told me, “Mind the weir,” and I did,’ said Ada.\n\n‘Good.’')).toEqual(['Mabel told me, “Mind the weir,” and I did,', 'Good.']);
    expect(texts('«Il m’a dit “attends” et j’ai attendu», dit-elle.')).toEqual(['Il m’a dit “attends” et j’ai attendu']);
    expect(texts('„Er sagte ‚warte‘ und ich wartete“, sagte sie.')).toEqual(['Er sagte ‚warte‘ und ich wartete']);
    expect(texts('— He wrote “paid” against it, — said Ada. — In ink.')).toEqual(['He wrote “paid” against it,', 'In ink.']);
  });
});

describe('single marks: apostrophes, elisions and plural possessives', () => {
  it('reads a mark between two letters as an apostrophe, and one before a letter as an elision', () => {
    expect(texts('‘Don’t go,’ said Ada. ‘’Tis late, an’ the boys’ boots are wet.’\n\n‘I’ll go.’')).toEqual([
      'Don’t go,',
      '’Tis late, an’ the boys’ boots are wet.',
      'I’ll go.',
    ]);
  });

  it('keeps a dropped letter before a comma inside the speech when the speech goes on', () => {
    expect(texts('‘Mornin’, ma’am. Weir road, is it?’\n\n‘It is.’')).toEqual(['Mornin’, ma’am. Weir road, is it?', 'It is.']);
    expect(texts('‘I’m comin’,’ said Osric.')).toEqual(['I’m comin’,']);
  });

  it('closes at a plural possessive only when nothing later can close the speech, or a tag follows', () => {
    expect(texts('‘Give them to the boys’, she said. ‘They’re runnin’ late.’')).toEqual(['Give them to the boys', 'They’re runnin’ late.']);
    expect(texts('‘They went to the Fenns’\n\nNarrative.')).toEqual(['They went to the Fenns']);
  });

  it('reads straight single marks by the same rules', () => {
    expect(texts("'Don't,' said Ada, 'they're the girls' nets an' 'em all.'")).toEqual(["Don't,", "they're the girls' nets an' 'em all."]);
  });
});

describe('guillemets and low-high marks', () => {
  it('reads «…» and, the German way, »…«', () => {
    expect(texts('«Yes,» said Ada. «Now.»\n\n«Not yet.»')).toEqual(['Yes,', 'Now.', 'Not yet.']);
    expect(texts('»Yes,« said Ada. »Now.«\n\n»Not yet.«')).toEqual(['Yes,', 'Now.', 'Not yet.']);
    expect(texts('« Oui », dit-elle.\n\n« Non. »')).toEqual(['Oui', 'Non.']);
  });

  it('reads „…“ and „…”', () => {
    expect(texts('„Yes,“ said Ada. „Now.“\n\n„Not yet,” said Osric.')).toEqual(['Yes,', 'Now.', 'Not yet,']);
  });
});

describe('speech over several paragraphs, in each convention', () => {
  const expectLinked = (t: string) => {
    const r = scan(t);
    expect(r.quotes.map((q) => [q.text, q.continued, q.continuation])).toEqual([
      ['It stood by the weir.', true, false],
      ['Then the gale came.', true, true],
      ['That is all.', false, true],
    ]);
    expect(r.problems).toEqual([]);
  };
  it('links the paragraphs when each opens again and only the last closes', () => {
    expectLinked('“It stood by the weir.\n\n“Then the gale came.\n\n“That is all.”');
    expectLinked('‘It stood by the weir.\n\n‘Then the gale came.\n\n‘That is all.’');
    expectLinked('«It stood by the weir.\n\n«Then the gale came.\n\n«That is all.»');
    expectLinked('„It stood by the weir.\n\n„Then the gale came.\n\n„That is all.“');
  });

  it('takes a French paragraph opening with » as the speech going on', () => {
    expectLinked('«It stood by the weir.\n\n»Then the gale came.\n\n»That is all.»');
  });

  it('gives every dash paragraph its own entry (a dash opens a new speech)', () => {
    expect(scan('— It stood by the weir.\n\n— Then the gale came.').quotes.map((q) => [q.text, q.continuation])).toEqual([
      ['It stood by the weir.', false],
      ['Then the gale came.', false],
    ]);
  });
});

describe('dash dialogue', () => {
  it('ends the speech at a dash that starts a narrative aside, and resumes it after the next', () => {
    expect(texts('— You are late, — said Ada. — The tide has turned.')).toEqual(['You are late,', 'The tide has turned.']);
    expect(texts('— So it is. — He leaned the oar against the wall. — Come in.')).toEqual(['So it is.', 'Come in.']);
  });

  it('reads dashes set close to the aside', () => {
    expect(texts('—There is ice on the bridge —he said—. You will not cross.')).toEqual(['There is ice on the bridge', 'You will not cross.']);
    expect(texts('—No. Well. —He looked at the mill and went off across the yard.')).toEqual(['No. Well.']);
  });

  it('keeps a pause or a break inside the speech', () => {
    expect(texts('— I — I do not know what you mean.')).toEqual(['I — I do not know what you mean.']);
    expect(texts('— I thought if the books looked well for one winter—')).toEqual(['I thought if the books looked well for one winter—']);
    expect(texts('— It was a well-kept secret, a half—hidden one.')).toEqual(['It was a well-kept secret, a half—hidden one.']);
  });

  it('reads a tag run on after a comma as narrative, to its sentence end or to the comma after it', () => {
    expect(texts('– Sit down, he said one evening, when the others had gone up. I want to ask you a thing.')).toEqual([
      'Sit down,',
      'I want to ask you a thing.',
    ]);
    expect(texts('– Well, she said, I suppose so.')).toEqual(['Well,', 'I suppose so.']);
    expect(texts('– Come in, said Osric, opening the door.')).toEqual(['Come in,']);
  });

  it('reads speech a narrative paragraph introduces after a colon, and nothing in narrative paragraphs', () => {
    expect(texts('— Yes.\n\nOn the stairs he said over his shoulder: — Mind the third board.\n\nThe board said “creak” and was still.')).toEqual(['Yes.', 'Mind the third board.']);
  });

  it('gives dash speech to its speakers by the usual rules', () => {
    const q = quotesOf('— The weir is shut, — said Osric. — Since noon.\n\n— And the sluice?\n\n— Open.', CAST);
    expect(q.map((x) => [x.text, x.speaker])).toEqual([
      ['The weir is shut,', 'osric'],
      ['Since noon.', 'osric'],
      ['And the sluice?', null],
      ['Open.', 'osric'],
    ]);
  });
});

describe('what vitrine check says about the marks', () => {
  const report = (t: string) => {
    const m = model(t);
    return dialogueReport(m, CAST, findMentions(m, CAST));
  };

  it('names the convention of each chapter and of a scene that differs', () => {
    const r = report('CHAPTER I.\n\n“Yes,” said Ada.\n\n“No.”\n\n* * *\n\n‘Maybe,’ said Osric.\n\n‘Never.’');
    expect(r.chapters).toEqual([
      {
        chapter: 1,
        convention: 'double',
        source: 'read',
        scenes: [
          { paragraph: 1, line: 3, convention: 'double', source: 'read' },
          { paragraph: 4, line: 9, convention: 'single', source: 'read' },
        ],
      },
    ]);
  });

  it('warns, with chapter and paragraph, where marks are frequent but no speech was found', () => {
    // Fixed to double marks, a chapter set in guillemets has marks everywhere and no speech.
    const t = 'CHAPTER I.\n\n«Yes,» said Ada. «Now.»\n\n«Not yet,» said Osric. «Later.»\n\n«When?» «Soon.»';
    const m = model(t);
    const r = dialogueReport(m, CAST, findMentions(m, CAST), { verbs: [], pins: [], marks: 'double' });
    expect(r.warnings).toEqual([expect.objectContaining({ code: 'dialogue/marks-without-speech', chapter: 1, paragraph: 1, line: 3 })]);
    expect(r.warnings[0].message).toMatch(/no speech was found in it when read as double marks.*dialogue\.marks/);
    expect(report(t).warnings).toEqual([]);
  });

  it('warns where marks stay unbalanced', () => {
    const r = report('“This never closes, said Ada.\n\nThe rain came.');
    expect(r.warnings).toEqual([expect.objectContaining({ code: 'dialogue/unbalanced', chapter: 1, paragraph: 1 })]);
  });
});

describe('the example texts stay as they were', () => {
  it('reads a text with no marks at all as double marks, finding nothing', () => {
    expect(readConventions(model('The river rose in the night, and nobody spoke of it.')).text).toBe('double');
    expect(texts('The river rose in the night.')).toEqual([]);
  });

  it('does not take an elided word opening a paragraph for single-marked speech', () => {
    expect(readConventions(model("'Twas a cold night.\n\n“Go,” she said.")).text).toBe('double');
    expect(lines('a', 'b')).toBe('a\n\nb');
  });
});
