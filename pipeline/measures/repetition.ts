import { z } from 'zod';
import type { Measure, MeasureContext } from './types.ts';
import type { BarsData, KwicData, TextmapData } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { TOKEN_FLAGS } from '../text/model.ts';
import { hasStopwords, stopwords } from '../text/stopwords.ts';
import { requireEnglish } from '../nlp/english.ts';
import { tagModel } from '../nlp/tag.ts';
import { speakerOfTokens } from '../dialogue/speakers.ts';
import { findPhrases, type PhraseSet } from './repetition/phrases.ts';
import { familiesOf } from './repetition/families.ts';
import { placesOf } from './repetition/places.ts';
import { orderMembers, rankFamilies } from './repetition/ranking.ts';

export { recurringPhrases, findPhrases, phraseSet, phraseList } from './repetition/phrases.ts';
export type { Phrase, PhraseSet, PhraseOptions } from './repetition/phrases.ts';
export { phraseFamilies, familiesOf } from './repetition/families.ts';
export type { Families } from './repetition/families.ts';
export { familyPlaces, placesOf, placeCounter } from './repetition/places.ts';
export type { Place } from './repetition/places.ts';

export const repetitionParams = z
  .object({
    minN: z.number().int().min(2).max(12).default(3).describe('Fewest words in a recurring phrase. Default: 3.'),
    maxN: z
      .number()
      .int()
      .min(2)
      .max(12)
      .default(8)
      .describe(
        'Most words in a recurring phrase; a longer repeat is found as overlapping phrases of this length (one family). Default: 8.',
      ),
    minCount: z.number().int().min(2).default(2).describe('Fewest occurrences of a phrase. Default: 2.'),
    top: z.number().int().min(1).max(200).default(20).describe('How many families of phrases to keep, most frequent first. Default: 20.'),
    occurrences: z
      .number()
      .int()
      .min(1)
      .max(500)
      .default(50)
      .describe('How many occurrences to list per family, in text order. Default: 50.'),
    context: z
      .number()
      .int()
      .min(0)
      .max(30)
      .default(8)
      .describe('Words of context kept on each side of an occurrence (within its paragraph). Default: 8.'),
    family: z
      .number()
      .int()
      .min(1)
      .default(1)
      .describe('The family (by rank) whose occurrences a keyword-in-context chart shows. Default: 1.'),
    unit: z
      .enum(['form', 'lemma'])
      .default('form')
      .describe(
        'How words of the passage are matched: "form", as written (lower-cased); "lemma", by dictionary form ("walked" with "walks"), from an English language model. Default: "form".',
      ),
    passage: z
      .object({
        chapter: z.number().int().min(1).describe('The chapter (1-based).'),
        paragraph: z.number().int().min(1).describe('The paragraph within the chapter (1-based).'),
        paragraphs: z
          .number()
          .int()
          .min(1)
          .max(20)
          .default(1)
          .describe('How many paragraphs from there (cut at the chapter’s end). Default: 1.'),
      })
      .strict()
      .optional()
      .describe(
        'The passage whose repeated words are linked and marked. Default: the paragraph of the first occurrence of the top family (or the first paragraph when no phrase recurs).',
      ),
    passageWords: z
      .number()
      .int()
      .min(10)
      .max(5000)
      .default(600)
      .describe('Most words of the passage shown (a longer passage is cut at the end of a sentence). Default: 600.'),
  })
  .strict()
  .refine((p) => p.minN <= p.maxN, { message: 'minN is larger than maxN: make minN at most maxN', path: ['minN'] });

export type RepetitionParams = z.infer<typeof repetitionParams>;

export interface Occurrence {
  /** The member phrase that starts here (the longest), lower-cased words. */
  phrase: string;
  /** Words in this place: more than the phrase when overlapping members run on. */
  words: number;
  /** 1-based chapter, and 1-based paragraph within it. */
  chapter: number;
  paragraph: number;
  /** Character offset of the phrase in the text, and its first token. */
  offset: number;
  token: number;
  /** The words of the place as written, and the words around them within the paragraph. */
  text: string;
  left: string;
  right: string;
  /** The cast id of who says it (the phrase starts inside a quotation given to them), or null: narrative, an unknown speaker, or no cast in the plan. */
  speaker: string | null;
  /** Their name as the cast gives it, or null. */
  speakerName: string | null;
}

export interface Family {
  rank: number;
  /** The most frequent member. */
  label: string;
  /** The longest run of 3 or more words (one a content word) shared by every member grouped by it (variants that joined for being one word away may lack it), or null. */
  core: string | null;
  /** Places where members occur (overlapping occurrences are one place). */
  count: number;
  memberCount: number;
  /** The most frequent members (at most 10), each with its own number of occurrences. */
  members: { phrase: string; words: number; count: number }[];
  occurrences: Occurrence[];
}

export interface PassageMap {
  chapter: number;
  paragraph: number;
  paragraphs: number;
  /** e.g. "Ch. 3, ¶ 2–3". */
  where: string;
  /** Words shown, and whether the passage was cut short (see `passageWords`). */
  shownWords: number;
  cut: boolean;
  /** The passage as TextmapData spans: a repeated word carries its number of occurrences in the passage, everything else null. */
  spans: { text: string; value: number | null }[];
  /** Indices into `spans` where a new paragraph starts. */
  breaks: number[];
  /** Repeated content words, most repeated first, with the spans where they stand. */
  words: { word: string; count: number; spans: number[] }[];
  /** Each occurrence of a repeated word linked to its next occurrence (span indices). */
  links: { word: string; from: number; to: number }[];
}

export interface RepetitionResult {
  minN: number;
  maxN: number;
  minCount: number;
  /** Maximal recurring phrases found, before grouping. */
  phrases: number;
  /** Families found, before keeping the top ones. */
  familyCount: number;
  stopwordList: string | null;
  /** Whether speakers were looked for (the plan has a cast). */
  speakers: boolean;
  families: Family[];
  passage: PassageMap;
}

export const repetition: Measure<RepetitionParams, RepetitionResult> = {
  name: 'repetition',
  version: 1,
  params: repetitionParams,
  needsCast: false,
  reads: { cast: true, dialogue: true, data: ['stopwords-iso', 'wink-eng-lite-web-model'] },
  // Occurrences say who speaks them when the text has a cast.
  compute(ctx, params) {
    return computeRepetition(ctx, params);
  },
  method: {
    what: 'Phrases of three or more words that come back, grouped into families of near-variants, with where each occurrence stands; and, for one passage, which words it repeats and how they link up.',
    formula:
      'A phrase is a run of minN…maxN words inside one sentence (punctuation ignored, case folded) that occurs at least minCount times and holds at least one content word (not a stopword, not a numeral). Only maximal phrases are kept: a phrase is dropped when a phrase one word longer covers every one of its occurrences. Families of near-variants: each phrase joins the phrases that share its most widely shared run of 3 words holding a content word ("mark my words, girl" and "you mark my words" both take "mark my words"); a phrase of 4 or more words left alone then joins the largest family holding a phrase one word away from it (a word substituted, inserted or deleted). A family counts the places where its members occur (overlapping occurrences, as "mark my words" inside "mark my words, girl", are one place). In the passage, a content word (form or lemma) that occurs twice or more is marked with its number of occurrences and each occurrence is linked to the next; the passage is cut at a sentence end after passageWords words.',
    source:
      'Recurrent word sequences (n-grams, "lexical bundles": Biber et al. 1999, Longman Grammar of Spoken and Written English, ch. 13; Stubbs 2007 on phrases in literary texts); maximal repeats as in suffix-based repeat finding (Gusfield 1997); stopword lists from stopwords-iso.',
    caveats: [
      'Punctuation is ignored inside a phrase: "mark my words, girl" and "mark my words. Girl" are the same four words (phrases never cross a sentence end our sentence splitter sees).',
      'A family gathers every phrase whose most widely shared 3-word run is the same: in a long text a common run ("of the lord") makes a large family of phrases that are related rather than variants; read the members, not only the label.',
      'A repeat longer than maxN words shows as several overlapping phrases of maxN words, which may fall into more than one family.',
      'Who says a phrase comes from the dialogue analysis (quotation marks, then the speech measure’s rules for speakers): it is empty in narrative, when the speaker was not found, and when the plan has no cast; a wrongly attributed quotation gives a wrong speaker.',
      'Matching lemmas in the passage needs an English text and inherits the tagger’s errors on invented and archaic words.',
    ],
  },
  table(result) {
    return {
      columns: [
        { key: 'rank', label: 'Rank', numeric: true },
        { key: 'label', label: 'Phrase', numeric: false },
        { key: 'core', label: 'Shared core', numeric: false },
        { key: 'count', label: 'Occurrences', numeric: true },
        { key: 'members', label: 'Variants', numeric: true },
        { key: 'variants', label: 'Most frequent variants', numeric: false },
      ],
      rows: result.families.map((f) => [
        f.rank,
        f.label,
        f.core,
        f.count,
        f.memberCount,
        f.members.map((m) => `${m.phrase} (${m.count})`).join(' / '),
      ]),
      places: result.families.map((f) => f.occurrences.map((o) => o.token)),
    };
  },
  views: {
    bars(result): BarsData {
      return {
        kind: 'bars',
        title: 'Recurring phrases, each with its near-variants, by number of occurrences',
        categoryLabel: 'Phrase (and variants)',
        valueLabel: 'Occurrences',
        categories: result.families.map((f) => (f.memberCount > 1 ? `${f.label} (+${f.memberCount - 1})` : f.label)),
        series: [{ id: 'count', name: 'Occurrences', values: result.families.map((f) => f.count) }],
        format: 'count',
      };
    },
    kwic(result, params): KwicData {
      const f = result.families[Math.min(params.family, result.families.length) - 1];
      if (!f) return { kind: 'kwic', title: 'No phrase recurs in this text with these settings', keyword: '', lines: [] };
      const shown = f.occurrences.length < f.count ? `${f.occurrences.length} of ${f.count}` : String(f.count);
      return {
        kind: 'kwic',
        title: `“${f.label}” and its variants in context (${shown} occurrences)`,
        keyword: f.label,
        lines: f.occurrences.map((o) => ({
          left: o.left,
          keyword: o.text,
          right: o.right,
          where: `Ch. ${o.chapter}, ¶ ${o.paragraph}${o.speakerName ? ` · ${o.speakerName}` : ''}`,
        })),
      };
    },
    textmap(result): TextmapData {
      const p = result.passage;
      const most = p.words.reduce((m, w) => Math.max(m, w.count), 2);
      return {
        kind: 'textmap',
        title: `Repeated words in ${p.where}`,
        valueLabel: 'Occurrences in the passage',
        domain: [2, most],
        spans: p.spans,
        breaks: p.breaks,
      };
    },
  },
};

function compare(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * The longest run of ≥ 3 words holding a content word that every one of
 * `members` contains, taken from the words of `members[0]`, or null.
 */
function sharedCore(set: PhraseSet, members: number[], isContent: (type: number) => boolean): number[] | null {
  const { types, typeStart } = set;
  const from = typeStart[members[0]!]!;
  const length = typeStart[members[0]! + 1]! - from;
  for (let len = length; len >= 3; len--) {
    for (let s = from; s + len <= from + length; s++) {
      let content = false;
      for (let k = s; k < s + len && !content; k++) content = isContent(types[k]!);
      if (content && members.every((m) => containsRun(types, typeStart[m]!, typeStart[m + 1]!, s, len))) {
        return Array.from(types.subarray(s, s + len));
      }
    }
  }
  return null;
}

/** Whether `types[from…to)` holds the run `types[run…run+len)`. */
function containsRun(types: Int32Array, from: number, to: number, run: number, len: number): boolean {
  outer: for (let s = from; s + len <= to; s++) {
    for (let k = 0; k < len; k++) if (types[s + k] !== types[run + k]) continue outer;
    return true;
  }
  return false;
}

/** 1 for each word type not in the stopword list. */
function notStopwords(vocab: readonly string[], stop: Set<string>): Uint8Array {
  const out = new Uint8Array(vocab.length);
  for (let t = 0; t < vocab.length; t++) out[t] = stop.has(vocab[t]!) ? 0 : 1;
  return out;
}

/** Content tokens (a word type not a stopword, not a numeral), and the word types seen as numerals. */
function contentTokens(model: TextModel, contentType: Uint8Array): { content: Uint8Array; numericType: Uint8Array } {
  const { tokens } = model;
  const content = new Uint8Array(tokens.count);
  const numericType = new Uint8Array(model.vocab.length);
  for (let i = 0; i < tokens.count; i++) {
    const t = tokens.type[i]!;
    if (tokens.flags[i]! & TOKEN_FLAGS.numeric) numericType[t] = 1;
    else content[i] = contentType[t]!;
  }
  return { content, numericType };
}

/** First token of each paragraph and one past its last. */
function paragraphTokens(model: TextModel): { first: Uint32Array; end: Uint32Array } {
  const { tokens, paragraphs } = model;
  const first = new Uint32Array(paragraphs.count);
  const end = new Uint32Array(paragraphs.count);
  let i = 0;
  for (let p = 0; p < paragraphs.count; p++) {
    while (i < tokens.count && tokens.paragraph[i]! < p) i++;
    first[p] = i;
    while (i < tokens.count && tokens.paragraph[i]! === p) i++;
    end[p] = i;
  }
  return { first, end };
}

function oneLine(s: string): string {
  return s.replace(/\s+/g, ' ').trim();
}

/** How many members of a family the result lists. */
const SHOWN_MEMBERS = 10;

export function computeRepetition(ctx: MeasureContext, params: RepetitionParams): RepetitionResult {
  const { model, language } = ctx;
  const { tokens, vocab, chapters, text } = model;
  const contentType = notStopwords(vocab, stopwords(language));
  const { content, numericType } = contentTokens(model, contentType);
  const isContent = (t: number): boolean => contentType[t] === 1 && numericType[t] === 0;

  const set = findPhrases(model, content, params);
  const { family: familyOf, joined } = familiesOf(set, isContent);
  const lengthOf = (i: number): number => set.typeStart[i + 1]! - set.typeStart[i]!;
  const words = (ts: ArrayLike<number>): string => Array.from(ts, (t) => vocab[t]!).join(' ');
  // Labels are written out only when a tie in counts needs them.
  const labels = new Map<number, string>();
  const label = (i: number): string => {
    let s = labels.get(i);
    if (s === undefined) labels.set(i, (s = words(set.types.subarray(set.typeStart[i]!, set.typeStart[i + 1]!))));
    return s;
  };
  const occurrencesOf = (i: number): number => set.positionStart[i + 1]! - set.positionStart[i]!;
  const { ranked, familyCount } = rankFamilies(set, familyOf, label, params.top);

  const paras = paragraphTokens(model);
  const who = ctx.cast.length ? speakerOfTokens(ctx) : null;
  const families: Family[] = ranked.map((f, r) => {
    // The core is shared by the members grouped by it (variants that joined later may lack it).
    const members = orderMembers(set, f.members, label, SHOWN_MEMBERS, (m) => !joined[m]);
    const grouped = members.filter((m) => !joined[m]);
    const core = sharedCore(set, grouped.length ? grouped : members, isContent);
    const places = placesOf(set, members, params.occurrences);
    return {
      rank: r + 1,
      label: label(f.head),
      core: core ? words(core) : null,
      count: f.count,
      memberCount: members.length,
      members: members.slice(0, SHOWN_MEMBERS).map((m) => ({ phrase: label(m), words: lengthOf(m), count: occurrencesOf(m) })),
      occurrences: places.map(([p, end, m]) => {
        const last = end - 1;
        const para = tokens.paragraph[p]!;
        const chapter = chapters[tokens.chapter[p]!]!;
        const from = Math.max(paras.first[para]!, p - params.context);
        const to = Math.min(paras.end[para]! - 1, last + params.context);
        return {
          phrase: label(m),
          words: end - p,
          chapter: chapter.index + 1,
          paragraph: para - chapter.firstParagraph + 1,
          offset: tokens.start[p]!,
          token: p,
          text: oneLine(text.slice(tokens.start[p]!, tokens.end[last]!)),
          left: from < p ? oneLine(text.slice(tokens.start[from]!, tokens.start[p]!)) : '',
          right: to > last ? oneLine(text.slice(tokens.end[last]!, tokens.end[to]!)) : '',
          speaker: who && who[p]! >= 0 ? ctx.cast[who[p]!]!.id : null,
          speakerName: who && who[p]! >= 0 ? ctx.cast[who[p]!]!.name : null,
        };
      }),
    };
  });

  return {
    minN: params.minN,
    maxN: params.maxN,
    minCount: params.minCount,
    phrases: set.count,
    familyCount,
    stopwordList: hasStopwords(language) ? `stopwords-iso (${language})` : null,
    speakers: who !== null,
    families,
    passage: passageMap(ctx, params, families[0]?.occurrences[0] ?? null, paras, numericType),
  };
}

/** The passage's repeated content words, as TextmapData spans and links. */
function passageMap(
  { model, language }: MeasureContext,
  params: RepetitionParams,
  firstOccurrence: Occurrence | null,
  paras: { first: Uint32Array; end: Uint32Array },
  numericType: Uint8Array,
): PassageMap {
  const { tokens, chapters, paragraphs, sentences, text, vocab } = model;
  const asked =
    params.passage ??
    (firstOccurrence
      ? { chapter: firstOccurrence.chapter, paragraph: firstOccurrence.paragraph, paragraphs: 1 }
      : { chapter: 1, paragraph: 1, paragraphs: 1 });
  const chapter = chapters[asked.chapter - 1];
  if (!params.passage && (!chapter || chapter.paragraphCount === 0)) {
    // A text with no words: nothing to map, and nothing the curator asked for.
    return {
      chapter: 1,
      paragraph: 1,
      paragraphs: 0,
      where: 'the text (it has no words)',
      shownWords: 0,
      cut: false,
      spans: [],
      breaks: [],
      words: [],
      links: [],
    };
  }
  if (!chapter) throw new RangeError(`passage chapter ${asked.chapter} does not exist: the text has ${chapters.length} chapter(s)`);
  if (asked.paragraph > chapter.paragraphCount) {
    throw new RangeError(
      `passage paragraph ${asked.paragraph} does not exist: chapter ${asked.chapter} has ${chapter.paragraphCount} paragraph(s)`,
    );
  }
  const count = Math.min(asked.paragraphs, chapter.paragraphCount - asked.paragraph + 1);
  const p0 = chapter.firstParagraph + asked.paragraph - 1;
  const p1 = p0 + count; // exclusive

  let keyOf: ArrayLike<number> = tokens.type;
  let keys: readonly string[] = vocab;
  if (params.unit === 'lemma') {
    requireEnglish(language, 'Matching the passage’s words by lemma (unit: "lemma")', 'Use unit: "form"');
    const tags = tagModel(model);
    keyOf = tags.lemma;
    keys = tags.lemmas;
  }
  const stop = stopwords(language);
  const isWord = (i: number): boolean => !numericType[tokens.type[i]!] && !stop.has(keys[keyOf[i]!]!);
  // The words shown: at most passageWords, cut back to a sentence end when that leaves any.
  const first = paras.first[p0]!;
  let last = paras.end[p1 - 1]!; // exclusive
  const cut = last - first > params.passageWords;
  if (cut) {
    let end = first + params.passageWords;
    while (end > first && tokens.sentence[end - 1] === tokens.sentence[end]) end--;
    last = end > first ? end : first + params.passageWords;
  }
  const counts = new Map<number, number>();
  for (let i = first; i < last; i++) {
    if (isWord(i)) counts.set(keyOf[i]!, (counts.get(keyOf[i]!) ?? 0) + 1);
  }

  const spans: { text: string; value: number | null }[] = [];
  const breaks: number[] = [];
  const at = new Map<number, number[]>(); // key → span indices, in order
  const plain = (s: string): void => {
    if (!s) return;
    const last = spans[spans.length - 1];
    if (last && last.value === null && (breaks.length === 0 || breaks[breaks.length - 1]! < spans.length)) last.text += s;
    else spans.push({ text: s, value: null });
  };
  for (let q = p0; q < p1 && paras.first[q]! < last; q++) {
    if (q > p0) breaks.push(spans.length);
    let cursor = paragraphs.start[q]!;
    const end = Math.min(paras.end[q]!, last);
    for (let i = paras.first[q]!; i < end; i++) {
      plain(inline(text.slice(cursor, tokens.start[i]!)));
      const word = text.slice(tokens.start[i]!, tokens.end[i]!);
      const n = isWord(i) ? counts.get(keyOf[i]!)! : 0;
      if (n >= 2) {
        const list = at.get(keyOf[i]!) ?? [];
        list.push(spans.length);
        at.set(keyOf[i]!, list);
        spans.push({ text: word, value: n });
      } else {
        plain(word);
      }
      cursor = tokens.end[i]!;
    }
    // The rest of the paragraph, or of the last sentence shown.
    const tail = end < paras.end[q]! ? Math.max(cursor, sentences.end[tokens.sentence[end - 1]!]!) : paragraphs.end[q]!;
    plain(inline(text.slice(cursor, tail)));
  }
  const repeated = [...at]
    .map(([k, list]) => ({ word: keys[k]!, count: list.length, spans: list }))
    .sort((a, b) => b.count - a.count || compare(a.word, b.word));
  const links = repeated.flatMap((w) => w.spans.slice(1).map((to, j) => ({ word: w.word, from: w.spans[j]!, to })));
  links.sort((a, b) => a.from - b.from || a.to - b.to);
  const para = count > 1 ? `¶ ${asked.paragraph}–${asked.paragraph + count - 1}` : `¶ ${asked.paragraph}`;
  return {
    chapter: asked.chapter,
    paragraph: asked.paragraph,
    paragraphs: count,
    where: `Ch. ${asked.chapter}, ${para}`,
    shownWords: last - first,
    cut,
    spans,
    breaks,
    words: repeated,
    links,
  };
}

/** Line breaks inside a paragraph (hard-wrapped text) read as spaces. */
function inline(s: string): string {
  return s.replace(/\s*\n\s*/g, ' ');
}
