import { z } from 'zod';
import type { Measure, MeasureContext } from './types.ts';
import type { BarsData, LinesData, TreemapData, MultiplesData } from '../charts/types.ts';
import { TOKEN_FLAGS } from '../text/model.ts';
import { hasStopwords, stopwords } from '../text/stopwords.ts';
import { chapterTick } from '../text/labels.ts';
import { UPOS, uposMask } from '../nlp/upos.ts';
import { requireEnglish } from '../nlp/english.ts';
import { tagModel } from '../nlp/tag.ts';
import { speakerOfTokens } from '../dialogue/speakers.ts';

export const frequencyParams = z
  .object({
    top: z
      .number()
      .int()
      .min(1)
      .max(1000)
      .default(20)
      .describe('How many of the most frequent words to keep (per chapter too, when `by` is "chapter"). Default: 20.'),
    chapter: z.number().int().min(1).optional().describe('Count only this chapter (1-based). Default: the whole text.'),
    stopwords: z.boolean().default(true).describe("Leave out the stopwords of the plan's language (from stopwords-iso). Default: true."),
    minLength: z.number().int().min(1).max(20).default(2).describe('Leave out words shorter than this many characters. Default: 2.'),
    numbers: z.boolean().default(false).describe('Count numerals as words. Default: false.'),
    exclude: z.array(z.string()).default([]).describe('Further words to leave out (case-insensitive). Default: none.'),
    unit: z
      .enum(['form', 'lemma'])
      .default('form')
      .describe(
        'What is counted: "form", each word as written (lower-cased); "lemma", its dictionary form ("walks", "walked", "walking" → "walk"), from an English language model. Default: "form".',
      ),
    pos: z
      .array(z.enum(UPOS))
      .default([])
      .describe(
        'Count only words with these parts of speech (Universal Dependencies tags, e.g. ["NOUN", "ADJ"]), from an English language model. Default: none (every word).',
      ),
    by: z
      .enum(['text', 'chapter', 'speaker'])
      .default('text')
      .describe(
        '"text": one list for the whole scope; "chapter": also the top words of each chapter; "speaker": also the top words each cast member speaks (inside quotation marks, speakers found as by the speech measure; needs a cast). Default: "text".',
      ),
  })
  .strict();

export type FrequencyParams = z.infer<typeof frequencyParams>;

export interface FrequencyWord {
  /** The form, or the lemma when `unit` is "lemma". */
  word: string;
  count: number;
  per10k: number;
  /** Counts in every chapter of the text (with the same filters). */
  perChapter: number[];
  /** When `unit` is "lemma": the forms counted under it, most frequent first (at most 5). */
  forms?: { form: string; count: number }[];
}

export interface ChapterWords {
  number: number;
  title: string;
  tokens: number;
  counted: number;
  words: { word: string; count: number; per10k: number }[];
}

export interface SpeakerWords {
  id: string;
  name: string;
  /** Words spoken (inside the member's quotations). */
  tokens: number;
  counted: number;
  words: { word: string; count: number; per10k: number }[];
}

export interface FrequencyResult {
  /** Tokens in the counted scope (before filtering). */
  tokens: number;
  /** Tokens left after the filters. */
  counted: number;
  scope: { chapter: number | null; title: string };
  stopwordList: string | null;
  words: FrequencyWord[];
  chapters: { number: number; title: string; tokens: number }[];
  unit: 'form' | 'lemma';
  /** The part-of-speech filter (empty: none). */
  pos: string[];
  by: 'text' | 'chapter' | 'speaker';
  /** When `by` is "chapter": the top words of each chapter in scope. */
  byChapter?: ChapterWords[];
  /** When `by` is "speaker": the top words each cast member speaks in scope, most words spoken first (members who say nothing left out). */
  bySpeaker?: SpeakerWords[];
}

export const frequency: Measure<FrequencyParams, FrequencyResult> = {
  name: 'frequency',
  version: 4,
  params: frequencyParams,
  needsCast: false,
  reads: { cast: (p) => p.by === 'speaker', dialogue: (p) => p.by === 'speaker', data: ['stopwords-iso', 'wink-eng-lite-web-model'] },
  compute(ctx, params) {
    return computeFrequency(ctx, params);
  },
  method: {
    what: 'The words used most often, after leaving out very common function words (stopwords); optionally as dictionary forms (lemmas), only some parts of speech, chapter by chapter or in each character’s speech.',
    formula:
      'count(w) = occurrences of the lower-cased word form (or lemma) w in the scope; rate = count(w) ÷ tokens in scope × 10,000. Words are ranked by count, ties broken alphabetically. Lemmas and parts of speech come from wink-nlp with its English model (wink-eng-lite-web-model), aligned to the words by character position. By speaker: the words inside the quotations given to each cast member by the dialogue analysis (the speech measure’s rules).',
    source:
      'Raw and normalised frequency as in corpus linguistics handbooks (e.g. McEnery & Hardie 2012, ch. 3); stopword lists from stopwords-iso; part-of-speech tags are the Universal Dependencies set (UPOS).',
    caveats: [
      'By default forms are counted as written: "river" and "rivers" are separate words; set unit to "lemma" to count them together.',
      'The stopword list is generic; it removes some words that may matter in a literary reading (e.g. "home", "night" are kept, but "little" or "old" may not be).',
      'A high count shows what a text repeats, not what it is about: names and dialogue habits weigh heavily.',
      'Lemmas and parts of speech come from a statistical tagger trained on modern English: it errs on invented words, names and archaic forms ("thou", "hath"), and maps British spellings to American lemmas ("colour" → "color"). A word it splits ("don\'t", "well-kept") takes the tag of its first part.',
      'Lemmas and parts of speech need an English text: with another language the measure stops and says so.',
      'By speaker, only quotations whose speaker was found count; unattributed speech and narrative are left out, and a wrongly attributed quotation moves its words to another character.',
    ],
  },
  table(result) {
    return {
      columns: [
        { key: 'rank', label: 'Rank', numeric: true },
        { key: 'word', label: result.unit === 'lemma' ? 'Lemma' : 'Word', numeric: false },
        { key: 'count', label: 'Count', numeric: true },
        { key: 'per10k', label: 'Per 10,000 words', numeric: true },
        ...result.chapters.map((c) => ({ key: `ch${c.number}`, label: `Ch. ${c.number}`, numeric: true })),
      ],
      rows: result.words.map((w, i) => [i + 1, w.word, w.count, w.per10k, ...w.perChapter]),
    };
  },
  views: {
    treemap(result): TreemapData {
      return {
        kind: 'treemap',
        title: `Most frequent words — ${result.scope.title}`,
        valueLabel: 'Occurrences',
        items: result.words.map((w) => ({ id: w.word, label: w.word, value: w.count })),
      };
    },
    bars(result): BarsData {
      return {
        kind: 'bars',
        title: `Most frequent ${noun(result)}${posNote(result)} — ${result.scope.title}`,
        categoryLabel: result.unit === 'lemma' ? 'Lemma' : 'Word',
        valueLabel: 'Occurrences',
        categories: result.words.map((w) => w.word),
        series: [{ id: 'count', name: 'Occurrences', values: result.words.map((w) => w.count) }],
        format: 'count',
      };
    },
    lines(result): LinesData {
      const shown = result.words.slice(0, 6);
      return {
        kind: 'lines',
        title: `Most frequent ${noun(result)}${posNote(result)} across the chapters (per 10,000 words)`,
        xLabel: 'Chapter',
        yLabel: 'Per 10,000 words',
        points: result.chapters.map((c) => c.title),
        ticks: result.chapters.map((c) => chapterTick(c.number)),
        series: shown.map((w) => ({
          id: w.word,
          name: w.word,
          values: w.perChapter.map((n, i) => rate(n, result.chapters[i]!.tokens)),
        })),
        format: 'decimal',
      };
    },
    multiples(result): MultiplesData {
      // By chapter: each chapter's own top words. Otherwise: the scope's top words, counted in each chapter.
      if (result.bySpeaker) {
        return {
          kind: 'multiples',
          title: `Most frequent ${noun(result)}${posNote(result)} in each character’s speech`,
          panels: result.bySpeaker.map((sp) => ({
            id: sp.id,
            title: sp.name,
            data: chapterBars(
              `Most frequent ${noun(result)} spoken by ${sp.name}`,
              result,
              sp.words.map((w) => w.word),
              sp.words.map((w) => w.count),
            ),
          })),
        };
      }
      const panels = result.byChapter
        ? result.byChapter.map((c) => ({
            id: `ch${c.number}`,
            title: c.title,
            data: chapterBars(
              `Most frequent ${noun(result)} — ${c.title}`,
              result,
              c.words.map((w) => w.word),
              c.words.map((w) => w.count),
            ),
          }))
        : result.chapters.map((c, i) => ({
            id: `ch${c.number}`,
            title: c.title,
            data: chapterBars(
              `${cap(noun(result))} in ${c.title}`,
              result,
              result.words.map((w) => w.word),
              result.words.map((w) => w.perChapter[i]!),
            ),
          }));
      return {
        kind: 'multiples',
        title: result.byChapter
          ? `Most frequent ${noun(result)}${posNote(result)} of each chapter`
          : `The ${result.words.length} most frequent ${noun(result)}${posNote(result)}, chapter by chapter`,
        panels,
      };
    },
  },
};

function noun(result: FrequencyResult): string {
  return result.unit === 'lemma' ? 'lemmas' : 'words';
}

function cap(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

function posNote(result: FrequencyResult): string {
  return result.pos.length ? ` (${result.pos.join(', ')})` : '';
}

function chapterBars(title: string, result: FrequencyResult, categories: string[], values: number[]): BarsData {
  return {
    kind: 'bars',
    title,
    categoryLabel: result.unit === 'lemma' ? 'Lemma' : 'Word',
    valueLabel: 'Occurrences',
    categories,
    series: [{ id: 'count', name: 'Occurrences', values }],
    format: 'count',
  };
}

function rate(count: number, tokens: number): number {
  return tokens ? Math.round((count / tokens) * 10000 * 100) / 100 : 0;
}

/** What each token is counted as: an id into `keys` per token. */
interface Units {
  of: ArrayLike<number>;
  keys: readonly string[];
}

function unitsOf(
  { model, language }: MeasureContext,
  params: FrequencyParams,
): { units: Units; allowed: Uint8Array | null; posOf: Uint8Array | null } {
  if (params.unit === 'lemma') requireEnglish(language, 'Counting lemmas (unit: "lemma")', 'Use unit: "form"');
  if (params.pos.length) requireEnglish(language, `The part-of-speech filter (pos: ${JSON.stringify(params.pos)})`, 'Leave out `pos`');
  const tags = params.unit === 'lemma' || params.pos.length ? tagModel(model) : null;
  return {
    units: params.unit === 'lemma' ? { of: tags!.lemma, keys: tags!.lemmas } : { of: model.tokens.type, keys: model.vocab },
    allowed: params.pos.length ? uposMask(params.pos) : null,
    posOf: params.pos.length ? tags!.pos : null,
  };
}

export function computeFrequency(ctx: MeasureContext, params: FrequencyParams): FrequencyResult {
  const { model, language } = ctx;
  const { tokens, chapters } = model;
  if (params.chapter !== undefined && params.chapter > chapters.length) {
    throw new RangeError(`chapter ${params.chapter} does not exist: the text has ${chapters.length} chapter(s)`);
  }
  const { units, allowed, posOf } = unitsOf(ctx, params);
  const { of, keys } = units;
  const stop = params.stopwords ? stopwords(language) : new Set<string>();
  const exclude = new Set(params.exclude.map((w) => w.toLowerCase().replace(/’/g, "'")));
  // Decide once per counted unit whether it is counted.
  const keep = new Uint8Array(keys.length);
  for (let t = 0; t < keys.length; t++) {
    const w = keys[t]!;
    keep[t] = w.length >= params.minLength && !stop.has(w) && !exclude.has(w) ? 1 : 0;
  }
  // An excluded form is left out under any unit.
  const excludedForm = params.unit === 'lemma' && exclude.size ? model.vocab.map((w) => exclude.has(w)) : null;
  const counts = (i: number): number => {
    const u = of[i]!;
    if (!keep[u]) return -1;
    if (!params.numbers && tokens.flags[i]! & TOKEN_FLAGS.numeric) return -1;
    if (allowed && !allowed[posOf![i]!]) return -1;
    if (excludedForm && excludedForm[tokens.type[i]!]) return -1;
    return u;
  };

  const scope = params.chapter !== undefined ? chapters[params.chapter - 1]! : null;
  const from = scope ? scope.firstToken : 0;
  const to = scope ? scope.firstToken + scope.tokenCount : tokens.count;
  const count = new Uint32Array(keys.length);
  let counted = 0;
  for (let i = from; i < to; i++) {
    const u = counts(i);
    if (u < 0) continue;
    count[u]!++;
    counted++;
  }
  const top = ranked(count, keys, params.top);
  // Per-chapter counts of the kept words, over the whole text.
  const index = new Map<number, number>(top.map((t, i) => [t, i]));
  const perChapter = top.map(() => new Array<number>(chapters.length).fill(0));
  const formCounts = params.unit === 'lemma' ? top.map(() => new Map<number, number>()) : null;
  for (let i = 0; i < tokens.count; i++) {
    const k = index.get(of[i]!);
    if (k === undefined || counts(i) < 0) continue;
    perChapter[k]![tokens.chapter[i]!]!++;
    if (formCounts && i >= from && i < to) {
      const f = tokens.type[i]!;
      formCounts[k]!.set(f, (formCounts[k]!.get(f) ?? 0) + 1);
    }
  }
  const scopeTokens = to - from;
  const result: FrequencyResult = {
    tokens: scopeTokens,
    counted,
    scope: scope ? { chapter: scope.index + 1, title: scope.title } : { chapter: null, title: 'whole text' },
    stopwordList: params.stopwords ? (hasStopwords(language) ? `stopwords-iso (${language})` : null) : null,
    words: top.map((t, k) => ({
      word: keys[t]!,
      count: count[t]!,
      per10k: rate(count[t]!, scopeTokens),
      perChapter: perChapter[k]!,
      ...(formCounts ? { forms: topForms(formCounts[k]!, model.vocab) } : {}),
    })),
    chapters: chapters.map((c) => ({ number: c.index + 1, title: c.title, tokens: c.tokenCount })),
    unit: params.unit,
    pos: [...params.pos],
    by: params.by,
  };
  // The top words of a group of tokens, with one shared count array cleared through the list of units it touched.
  count.fill(0);
  const touched: number[] = [];
  const topOf = (visit: (each: (i: number) => void) => void, tokensInGroup: number): { counted: number; words: ChapterWords['words'] } => {
    let n = 0;
    visit((i) => {
      const u = counts(i);
      if (u < 0) return;
      if (count[u] === 0) touched.push(u);
      count[u]!++;
      n++;
    });
    touched.sort((a, b) => count[b]! - count[a]! || compare(keys[a]!, keys[b]!));
    const words = touched.slice(0, params.top).map((u) => ({ word: keys[u]!, count: count[u]!, per10k: rate(count[u]!, tokensInGroup) }));
    for (const u of touched) count[u] = 0;
    touched.length = 0;
    return { counted: n, words };
  };
  if (params.by === 'chapter') {
    result.byChapter = (scope ? [scope] : chapters).map((c) => ({
      number: c.index + 1,
      title: c.title,
      tokens: c.tokenCount,
      ...topOf((each) => {
        for (let i = c.firstToken; i < c.firstToken + c.tokenCount; i++) each(i);
      }, c.tokenCount),
    }));
  }
  if (params.by === 'speaker') {
    if (!ctx.cast.length) {
      throw new RangeError(
        'counting words by speaker (by: "speaker") needs a cast, since speakers are found among its members: add a cast to the plan, or use by: "text" or "chapter"',
      );
    }
    const who = speakerOfTokens(ctx);
    const spoken = ctx.cast.map(() => [] as number[]);
    for (let i = from; i < to; i++) if (who[i]! >= 0) spoken[who[i]!]!.push(i);
    result.bySpeaker = ctx.cast
      .map((c, m) => ({
        id: c.id,
        name: c.name,
        tokens: spoken[m]!.length,
        ...topOf((each) => spoken[m]!.forEach(each), spoken[m]!.length),
      }))
      .filter((s) => s.tokens > 0)
      .sort((a, b) => b.tokens - a.tokens || compare(a.id, b.id));
  }
  return result;
}

function compare(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Ids with a non-zero count, most frequent first, ties alphabetical, at most `top`. */
function ranked(count: Uint32Array, keys: readonly string[], top: number): number[] {
  const ids: number[] = [];
  for (let t = 0; t < count.length; t++) if (count[t]) ids.push(t);
  ids.sort((a, b) => count[b]! - count[a]! || compare(keys[a]!, keys[b]!));
  return ids.slice(0, top);
}

function topForms(forms: Map<number, number>, vocab: readonly string[]): { form: string; count: number }[] {
  return [...forms]
    .sort((a, b) => b[1] - a[1] || compare(vocab[a[0]]!, vocab[b[0]]!))
    .slice(0, 5)
    .map(([f, n]) => ({ form: vocab[f]!, count: n }));
}
