import { z } from 'zod';
import type { Measure } from './types.ts';
import type { BarsData, LinesData } from '../charts/types.ts';
import { chapterTick } from '../text/labels.ts';
import { analyseDialogue, MIN_CONFIDENCE, type Rule } from '../dialogue/attribute.ts';
import type { QuoteProblem } from '../dialogue/quotes.ts';
import type { Convention } from '../dialogue/conventions.ts';
import { chapterMarks, countOutsiders, type ChapterMarks, type OutsiderCount } from '../dialogue/report.ts';
import { firstTokenAtOrAfter } from '../dialogue/view.ts';

export const speechParams = z
  .object({
    top: z
      .number()
      .int()
      .min(1)
      .max(1000)
      .optional()
      .describe('List and draw only this many speakers, those with the most words first. Default: every cast member who speaks.'),
    includeText: z
      .boolean()
      .default(true)
      .describe('List quoted written words (a sign, a letter, a scare-quoted word) among the quotations, flagged kind "text"; they never count as speech. Default: true.'),
    maxQuotes: z
      .number()
      .int()
      .min(0)
      .max(100000)
      .default(20000)
      .describe('Keep at most this many quotations in the list (counts and shares always use every quotation). Default: 20000.'),
  })
  .strict();

export type SpeechParams = z.infer<typeof speechParams>;

export interface SpeechQuote {
  /** The words inside the marks, white space collapsed, without the outer marks. */
  text: string;
  /** Cast id, or null. */
  speaker: string | null;
  addressee: string | null;
  /** 1-based chapter. */
  chapter: number;
  /** 1-based turn, shared by the parts of one speech; null for written words. */
  turn: number | null;
  rule: Rule;
  confidence: number;
  kind: 'speech' | 'text';
  words: number;
  /** Rule "outsider": the speaker outside the cast as the text names or describes them ("the maid"), when it does; else null. */
  outsider: string | null;
  /** The convention of the stretch the quotation stands in. */
  marks: Convention;
  /** The first word inside the marks, as a token index through the text: where the quotation stands. */
  token: number;
}

export interface SpeakerCounts {
  turns: number;
  words: number;
  /** Share of all dialogue words (0..1, four decimals). */
  share: number;
  turnsPerChapter: number[];
  wordsPerChapter: number[];
}

export interface SpeechResult {
  /** The convention of most of the text. */
  convention: Convention;
  /** The convention of each chapter, and of scenes that differ from their chapter. */
  conventions: ChapterMarks[];
  quotes: SpeechQuote[];
  /** Quotations left out of `quotes` by `maxQuotes` or `includeText`. */
  omitted: number;
  speakers: (SpeakerCounts & { id: string; name: string })[];
  /** Speech whose speaker is unknown or outside the cast. */
  unattributed: SpeakerCounts;
  /** Of that, speech by someone outside the cast (rule "outsider"). */
  outside: SpeakerCounts;
  /** Speakers outside the cast by their name or description in the text, most turns first ("the maid" ×2). */
  outsiders: OutsiderCount[];
  chapters: { number: number; title: string }[];
  totals: { quotes: number; speech: number; text: number; turns: number; words: number };
  /** Unpaired quotation marks: where, and what was done. */
  problems: QuoteProblem[];
  /** A plain-language note when there is nothing, or little, to show; else null. */
  note: string | null;
}

const round4 = (x: number): number => Math.round(x * 10000) / 10000;

export const speech: Measure<SpeechParams, SpeechResult> = {
  name: 'speech',
  version: 3,
  params: speechParams,
  needsCast: true,
  reads: { cast: true, dialogue: true },
  compute(ctx, params) {
    const a = analyseDialogue(ctx);
    const nCh = ctx.model.chapters.length;
    const blank = (): SpeakerCounts => ({ turns: 0, words: 0, share: 0, turnsPerChapter: new Array<number>(nCh).fill(0), wordsPerChapter: new Array<number>(nCh).fill(0) });
    const bySpeaker = new Map<string, SpeakerCounts>();
    const unattributed = blank();
    const outside = blank();
    let words = 0;
    for (const t of a.turns) {
      const counts = t.speaker === null ? [unattributed, ...(t.rule === 'outsider' ? [outside] : [])] : [bySpeaker.get(t.speaker) ?? bySpeaker.set(t.speaker, blank()).get(t.speaker)!];
      for (const c of counts) {
        c.turns++;
        c.words += t.words;
        c.turnsPerChapter[t.chapter]++;
        c.wordsPerChapter[t.chapter] += t.words;
      }
      words += t.words;
    }
    for (const c of [...bySpeaker.values(), unattributed, outside]) c.share = words ? round4(c.words / words) : 0;
    const speakers = ctx.cast
      .filter((m) => bySpeaker.has(m.id))
      .map((m) => ({ id: m.id, name: m.name, ...bySpeaker.get(m.id)! }))
      .sort((x, y) => y.words - x.words || y.turns - x.turns || x.id.localeCompare(y.id))
      .slice(0, params.top ?? Infinity);

    const listed = a.quotes.filter((q) => params.includeText || q.kind === 'speech');
    const kept = listed.slice(0, params.maxQuotes);
    const quotes: SpeechQuote[] = kept.map((q) => ({
      text: q.text,
      speaker: q.speaker,
      addressee: q.addressee,
      chapter: q.chapter + 1,
      turn: q.turn === null ? null : q.turn + 1,
      rule: q.rule,
      confidence: q.confidence,
      kind: q.kind,
      words: q.words,
      outsider: q.outsider,
      marks: q.marks,
      token: firstTokenAtOrAfter(ctx.model, q.start, 0, ctx.model.tokens.count),
    }));
    const speechCount = a.quotes.filter((q) => q.kind === 'speech').length;
    let note: string | null = null;
    if (a.quotes.length === 0) {
      note = 'No speech was found in this text: no quotation marks, and no paragraphs opening with a dash. Speech reported without marks is not read.';
    } else if (speechCount === 0) {
      note = 'Every quotation in this text reads as written words (signs, letters, titles), so there is no speech to count.';
    } else if (speakers.length === 0) {
      note = 'The text has dialogue, but no quotation could be given to a member of the cast. Check the cast names and aliases against the dialogue tags.';
    }
    const conventions = chapterMarks(ctx.model, a.conventions);
    return {
      convention: a.convention,
      conventions,
      quotes,
      omitted: a.quotes.length - quotes.length,
      speakers,
      unattributed,
      outside,
      outsiders: countOutsiders(a.turns),
      chapters: ctx.model.chapters.map((c) => ({ number: c.index + 1, title: c.title })),
      totals: { quotes: a.quotes.length, speech: speechCount, text: a.quotes.length - speechCount, turns: a.turns.length, words },
      problems: a.problems,
      note,
    };
  },
  method: {
    what: 'Who speaks, and how much: every quotation in the text, the character who speaks it and the one spoken to, with the rule that decided and how sure it is; then turns and words of dialogue per character, and the speakers outside the cast by how the text describes them.',
    formula: `Speech is found by the marks that set it off, read chapter by chapter and scene by scene (a scene break is an ornament line such as * * * or a wider gap): double marks “…”, single marks ‘…’, guillemets «…» or »…«, low-high marks „…“, or dashes opening the paragraph (the speech runs to the next dash that starts a narrative aside, or to the paragraph's end). A stretch takes the convention most of its paragraphs open with; the plan can fix it for the text or for chapters (dialogue.marks). The other marks are quotations inside speech. With single marks, a mark between two letters is an apostrophe (don’t), a mark before a letter an elision (’tis), and a mark after a letter and before a space (runnin’, the boys’) closes the speech only if nothing later can. A speech over several paragraphs, or interrupted by its tag, is one turn. Quoted written words (a sign, a letter, a scare-quoted word) are set aside. Speakers are found by a sieve of rules, strongest first, each with a confidence: a curator's pin (1.0); a tag naming a character, by name or alias — "said Ada", "the ferryman replied" (0.95); a tag naming someone outside the cast — an unknown name, or a description such as "the maid", "a boy", "the second fisherman" — which leaves the speaker empty (rule outsider, 0.9); a speaker giving their own name, or answering "who are you?" with a character's name (0.85); an action beat in the same paragraph — "Ada put down her cup." (0.8); a pronoun in a tag or beat, resolved from the paragraph, the exchange and the nearest fitting mentions ("I" is the narrator the plan names); alternation, two people taking turns through consecutive paragraphs of dialogue, anchored on the turns already known (someone outside the cast included: the turns that answer them go to the other side, and their own turns stay empty) and on whoever is addressed by name (0.6–0.88, less further from a known speaker); the character acting in the narrative just before a run of dialogue (0.6–0.7); a vocative, which rules the person addressed out (0.55). A name two characters share is not used alone. Below ${MIN_CONFIDENCE} the speaker is left empty. A character's share = their words ÷ all words of dialogue.`,
    source:
      'Rule-and-sieve quotation attribution after Elson & McKeown 2010 ("Automatic Attribution of Quoted Speech in Literary Narrative", AAAI) and Muzny, Fang, Chang & Jurafsky 2017 ("A Two-stage Sieve Approach for Quote Attribution", EACL). Quotation conventions as national printing uses them (double and single marks in English, guillemets and low-high marks and the quotation dash elsewhere); the project\'s own evaluation texts and their scores are in tests/fixtures/dialogue and `npm run eval`.',
    caveats: [
      'Attribution is a reading, not a fact: each quotation carries its rule and confidence, and a quotation with no sure speaker is left empty rather than guessed.',
      'Free indirect speech and speech reported without marks or dashes are not counted.',
      'A description in a tag is taken for someone outside the cast ("said the old man"), even when it is the narrator\'s epithet for a character: give that character the description as an alias, or pin the quotation. `vitrine check` lists the outsiders heard most often. Relations ("said her mother", read as a woman) and descriptions that name no one ("said a voice", "the other", "someone") are not taken for outsiders; they are filled by alternation.',
      'Pronouns are resolved only to cast members, or to someone outside the cast who is named or described by a role (the postman, the maid) just before; a speaker outside the cast referred to as "she" with nothing of the kind nearby may be given to a cast member of the same pronoun.',
      'Long runs of untagged dialogue are read as two people taking turns; a third voice joining without a tag, or a speaker going on after a pause in a new paragraph, is missed.',
      'In dash dialogue a dash inside a speech is taken to start a narrative aside only when a tag or an action follows it; a tag run on after a comma ("– Yes, she said.") is read for the usual tag forms only.',
      'A new speaker who starts in the same paragraph without a tag of their own is read as the paragraph\'s first speaker.',
    ],
  },
  table(result) {
    return {
      columns: [
        { key: 'n', label: '#', numeric: true },
        { key: 'chapter', label: 'Chapter', numeric: true },
        { key: 'turn', label: 'Turn', numeric: true },
        { key: 'speaker', label: 'Speaker', numeric: false },
        { key: 'addressee', label: 'Addressee', numeric: false },
        { key: 'kind', label: 'Kind', numeric: false },
        { key: 'rule', label: 'Rule', numeric: false },
        { key: 'outsider', label: 'Outside the cast', numeric: false },
        { key: 'confidence', label: 'Confidence', numeric: true },
        { key: 'words', label: 'Words', numeric: true },
        { key: 'text', label: 'Quotation', numeric: false },
      ],
      rows: result.quotes.map((q, i) => [i + 1, q.chapter, q.turn, q.speaker, q.addressee, q.kind, q.rule, q.outsider, q.confidence, q.words, q.text]),
      places: result.quotes.map((q) => [q.token]),
    };
  },
  views: {
    bars(result): BarsData {
      const rows = [...result.speakers.map((s) => ({ name: s.name, words: s.words }))];
      if (result.outside.words > 0) rows.push({ name: 'Outside the cast', words: result.outside.words });
      const unknown = result.unattributed.words - result.outside.words;
      if (unknown > 0) rows.push({ name: 'Unattributed', words: unknown });
      return {
        kind: 'bars',
        title: 'Words of dialogue spoken by each character',
        categoryLabel: 'Speaker',
        valueLabel: 'Words spoken',
        categories: rows.map((r) => r.name),
        series: [{ id: 'words', name: 'Words spoken', values: rows.map((r) => r.words) }],
        format: 'count',
      };
    },
    lines(result): LinesData {
      const series = result.speakers.map((s) => ({ id: s.id, name: s.name, values: s.wordsPerChapter }));
      if (result.outside.words > 0) series.push({ id: 'outside', name: 'Outside the cast', values: result.outside.wordsPerChapter });
      const unknown = result.unattributed.wordsPerChapter.map((w, i) => w - result.outside.wordsPerChapter[i]);
      if (unknown.some((w) => w > 0)) series.push({ id: 'unattributed', name: 'Unattributed', values: unknown });
      return {
        kind: 'lines',
        title: 'Words of dialogue spoken by each character, chapter by chapter',
        xLabel: 'Chapter',
        yLabel: 'Words spoken',
        points: result.chapters.map((c) => c.title),
        ticks: result.chapters.map((c) => chapterTick(c.number)),
        series,
        format: 'count',
      };
    },
  },
};
