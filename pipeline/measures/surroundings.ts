import { z } from 'zod';
import type { Measure, MeasureContext } from './types.ts';
import type { BarsData, MultiplesData, ScatterData } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { TOKEN_FLAGS } from '../text/model.ts';
import { stopwords } from '../text/stopwords.ts';
import { logLikelihood } from '../stats/loglikelihood.ts';
import { AFINN_CREDIT, afinnLexicon } from '../lexicons/afinn.ts';
import { speechVerbs } from '../dialogue/verbs.ts';
import { requireEnglish } from '../nlp/english.ts';
import { tagModel, type TokenTags } from '../nlp/tag.ts';
import { UPOS_ID } from '../nlp/upos.ts';

export const surroundingsParams = z
  .object({
    window: z
      .number()
      .int()
      .min(1)
      .max(50)
      .default(10)
      .describe('Words taken on each side of a mention of a character, within its paragraph. Default: 10.'),
    top: z
      .number()
      .int()
      .min(1)
      .max(100)
      .default(15)
      .describe('How many distinctive words, and how many adjectives and adverbs, to keep per character. Default: 15.'),
    minCount: z
      .number()
      .int()
      .min(1)
      .default(2)
      .describe('Least number of times a word must occur around a character to be listed as distinctive. Default: 2.'),
    reference: z
      .enum(['whole', 'rest'])
      .default('whole')
      .describe(
        'What the words around a character are compared with: the "whole" text, or the "rest" of it (the whole text minus the words around that character). Default: "whole".',
      ),
    stopwords: z
      .boolean()
      .default(true)
      .describe(
        'Leave the stopwords of the plan\'s language (from stopwords-iso) out of the distinctive words (they still count in the sizes) and out of the adverbs of speech tags ("again", "then"); adjectives are always kept. Default: true.',
      ),
    characters: z
      .array(z.string())
      .optional()
      .describe('Only these cast ids, in this order. Default: the whole cast, most mentioned first.'),
    character: z
      .string()
      .optional()
      .describe('The cast id whose distinctive words a bar chart shows. Default: the first character listed (the most mentioned).'),
  })
  .strict();

export type SurroundingsParams = z.infer<typeof surroundingsParams>;

export interface DistinctiveWord {
  word: string;
  /** Occurrences around the character's mentions. */
  inWindows: number;
  /** Occurrences in the reference (the whole text, or the rest of it). */
  inReference: number;
  /** Log-likelihood G² (two-cell form), windows against the reference. */
  g2: number;
}

export interface Describer {
  /** The adjective or adverb, lower-cased. */
  word: string;
  count: number;
  /** How often it came in a speech tag ("said Osric gloomily"). */
  speech: number;
  /** …just before the name ("poor Osric"). */
  attributive: number;
  /** …after the name and a linking verb ("Osric was weary"). */
  predicative: number;
}

export interface CharacterSurroundings {
  id: string;
  name: string;
  mentions: number;
  /** Distinct word positions in the windows around the mentions (overlapping windows counted once). */
  windowTokens: number;
  distinctive: DistinctiveWord[];
  /** Mean AFINN-165 valence of the window words the list rates (−5…5, 2 decimals), or null when it rates none. */
  valence: number | null;
  /** How many window words AFINN-165 rates. */
  valenceWords: number;
  describers: Describer[];
}

export interface SurroundingsResult {
  window: number;
  reference: 'whole' | 'rest';
  totalTokens: number;
  characters: CharacterSurroundings[];
  /** The cast id a bar chart shows, or null when no character is listed. */
  character: string | null;
}

/** Linking verbs before a predicative adjective ("was weary", "seemed tired"), as lemmas. */
const LINKING = new Set(['be', 'seem', 'become', 'appear', 'look', 'remain', 'grow', 'feel', 'sound', 'stay']);
/** Words that negate what follows: a negated predicate ("was not weary") is not recorded. */
const NEGATORS = new Set(['not', 'never', 'no', "n't"]);

export const surroundings: Measure<SurroundingsParams, SurroundingsResult> = {
  name: 'surroundings',
  version: 1,
  params: surroundingsParams,
  needsCast: true,
  reads: { cast: true, dialogue: true, data: ['stopwords-iso', 'afinn-165', 'wink-eng-lite-web-model'] },
  compute(ctx, params) {
    return computeSurroundings(ctx, params);
  },
  method: {
    what: 'For each character, the words within a few words of their name: which of them are most distinctive of those surroundings, how positive or negative they are on average, and the adjectives and adverbs tied to the name.',
    formula:
      'Window: the W words before and after each mention, within its paragraph (overlapping windows counted once; the mention itself left out). Distinctive words: for each word, a = its count in the windows, c = window words, b = its count in the reference, d = reference words; E₁ = c(a+b)/(c+d), E₂ = d(a+b)/(c+d), G² = 2[a ln(a/E₁) + b ln(b/E₂)], kept when a/c > b/d, ranked by G². Valence: the mean of the AFINN-165 values of the window words the list rates. Adjectives and adverbs: an adverb within 2 words of a speech tag made of a speech verb and the name ("said Osric gloomily", "Osric answered softly"); an adjective just before the name ("poor Osric"); an adjective after the name and a linking verb, optionally past one or two adverbs ("Osric was very weary"; not when negated).',
    source: `Collocation windows as in Sinclair 1991 (Corpus, Concordance, Collocation); log-likelihood G² in the two-cell form of Rayson & Garside 2000 (after Dunning 1993); parts of speech (Universal Dependencies tags) and lemmas from wink-nlp with its English model wink-eng-lite-web-model. ${AFINN_CREDIT}`,
    caveats: [
      'A window blurs: the words near a name need not be about that character, and a scene with two characters gives both the same surroundings.',
      'Only named mentions count: a stretch where a character is "she" or "the old man" (unless that is an alias) is not looked at.',
      'The part-of-speech tagger errs on invented words and names and on archaic forms ("thou", "quoth"), so some adjectives and adverbs are missed or wrongly listed.',
      'Valence is context-blind: each word keeps its list value whatever surrounds it (no negation, irony or word sense), and AFINN-165 rates modern English; multi-word entries of the list are not used.',
      'Needs an English text: with another language the measure stops and says so.',
    ],
  },
  table(result) {
    return {
      columns: [
        { key: 'id', label: 'Id', numeric: false },
        { key: 'name', label: 'Character', numeric: false },
        { key: 'mentions', label: 'Mentions', numeric: true },
        { key: 'valence', label: 'Mean valence (AFINN-165)', numeric: true },
        { key: 'rank', label: 'Rank', numeric: true },
        { key: 'word', label: 'Distinctive word', numeric: false },
        { key: 'inWindows', label: 'Around the name', numeric: true },
        { key: 'inReference', label: result.reference === 'whole' ? 'In the whole text' : 'In the rest of the text', numeric: true },
        { key: 'g2', label: 'G²', numeric: true },
      ],
      rows: result.characters.flatMap((c) =>
        c.distinctive.length
          ? c.distinctive.map((w, i) => [c.id, c.name, c.mentions, c.valence, i + 1, w.word, w.inWindows, w.inReference, w.g2])
          : [[c.id, c.name, c.mentions, c.valence, null, null, null, null, null]],
      ),
    };
  },
  views: {
    bars(result): BarsData {
      const c = result.characters.find((x) => x.id === result.character);
      return characterBars(c ?? null, result);
    },
    multiples(result): MultiplesData {
      return {
        kind: 'multiples',
        title: `The most distinctive words around each character’s name (G², against ${referenceLabel(result)})`,
        panels: result.characters
          .filter((c) => c.distinctive.length)
          .map((c) => ({ id: c.id, title: c.name, data: characterBars(c, result) })),
      };
    },
    scatter(result): ScatterData {
      return {
        kind: 'scatter',
        title: 'Mean valence of the words around each character’s name, against how often the character is named',
        xLabel: 'Mentions',
        yLabel: 'Mean valence of the words around the name (AFINN-165, −5 to 5)',
        points: result.characters.filter((c) => c.valence !== null).map((c) => ({ id: c.id, label: c.name, x: c.mentions, y: c.valence! })),
      };
    },
  },
};

function referenceLabel(result: SurroundingsResult): string {
  return result.reference === 'whole' ? 'the whole text' : 'the rest of the text';
}

function characterBars(c: CharacterSurroundings | null, result: SurroundingsResult): BarsData {
  return {
    kind: 'bars',
    title: c
      ? `Words most distinctive of the surroundings of “${c.name}” (G², against ${referenceLabel(result)})`
      : 'Words most distinctive of a character’s surroundings (no character listed)',
    categoryLabel: 'Word',
    valueLabel: 'Log-likelihood G²',
    categories: c ? c.distinctive.map((w) => w.word) : [],
    series: [{ id: 'g2', name: 'G²', values: c ? c.distinctive.map((w) => w.g2) : [] }],
    format: 'decimal',
  };
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

/** First token of each paragraph and one past its last (equal when the paragraph has none). */
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

export function computeSurroundings(ctx: MeasureContext, params: SurroundingsParams): SurroundingsResult {
  const { model, cast, mentions, language } = ctx;
  requireEnglish(
    language,
    'The surroundings measure (its adjectives, adverbs and AFINN-165 valence)',
    'For words around a name in another language, use a measure that needs no language model',
  );
  const { tokens, vocab } = model;
  const order = params.characters ?? cast.map((c) => c.id);
  const unknown = order.filter((id) => !cast.some((c) => c.id === id));
  if (unknown.length) throw new RangeError(`characters names ids that are not in the cast: ${unknown.join(', ')}`);
  if (params.character !== undefined && !order.includes(params.character)) {
    throw new RangeError(
      `character "${params.character}" is not ${params.characters ? 'among the characters listed' : 'in the cast'}: choose one of ${order.join(', ') || '(none)'}`,
    );
  }
  const tags = tagModel(model);
  const paras = paragraphTokens(model);
  const stop = params.stopwords ? stopwords(language) : new Set<string>();
  const rated = valenceByType(vocab);

  // Whole-text counts per type, and the member each mention token belongs to.
  const textCount = new Uint32Array(vocab.length);
  for (let i = 0; i < tokens.count; i++) textCount[tokens.type[i]!]!++;
  const mentionOf = new Int32Array(tokens.count).fill(-1);
  const byMember = cast.map(() => [] as number[]);
  for (let k = 0; k < mentions.count; k++) {
    const t = mentions.token[k]!;
    for (let j = 0; j < mentions.length[k]!; j++) mentionOf[t + j] = mentions.member[k]!;
    byMember[mentions.member[k]!]!.push(k);
  }
  const verbs = speechVerbs(ctx.dialogue?.verbs ?? []).single;
  const seen = new Int32Array(tokens.count).fill(-1);

  const rows = order.map((id) => {
    const m = cast.findIndex((c) => c.id === id);
    const counts = new Map<number, number>();
    let windowTokens = 0;
    let valenceSum = 0;
    let valenceWords = 0;
    const describers = new Map<string, Describer>();
    for (const k of byMember[m]!) {
      const t = mentions.token[k]!;
      const len = mentions.length[k]!;
      const p = tokens.paragraph[t]!;
      const from = Math.max(paras.first[p]!, t - params.window);
      const to = Math.min(paras.end[p]!, t + len + params.window);
      for (let i = from; i < to; i++) {
        if (seen[i] === m || mentionOf[i] === m) continue;
        seen[i] = m;
        windowTokens++;
        const type = tokens.type[i]!;
        counts.set(type, (counts.get(type) ?? 0) + 1);
        const v = rated[type]!;
        if (v !== 0) {
          valenceSum += v;
          valenceWords++;
        }
      }
      for (const [i, kind] of describersAt(model, tags, t, len, verbs)) {
        const word = vocab[tokens.type[i]!]!;
        // Adverbs that are stopwords ("then", "again") are noise in a speech tag; adjectives ("old", "little") are kept.
        if (kind === 'speech' && stop.has(word)) continue;
        const d = describers.get(word) ?? { word, count: 0, speech: 0, attributive: 0, predicative: 0 };
        d.count++;
        d[kind]++;
        describers.set(word, d);
      }
    }
    return {
      id,
      name: cast[m]!.name,
      mentions: byMember[m]!.length,
      windowTokens,
      distinctive: distinctiveWords(counts, windowTokens, textCount, tokens.count, params, vocab, stop, model),
      valence: valenceWords ? round(valenceSum / valenceWords, 2) : null,
      valenceWords,
      describers: [...describers.values()].sort((a, b) => b.count - a.count || compare(a.word, b.word)).slice(0, params.top),
    };
  });
  if (!params.characters) rows.sort((a, b) => b.mentions - a.mentions || compare(a.id, b.id));
  return {
    window: params.window,
    reference: params.reference,
    totalTokens: tokens.count,
    characters: rows,
    character: params.character ?? rows[0]?.id ?? null,
  };
}

function compare(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** AFINN-165 valence of each vocabulary type (0 when the list does not rate it). */
function valenceByType(vocab: readonly string[]): Int8Array {
  const words = afinnLexicon().words;
  const out = new Int8Array(vocab.length);
  for (let t = 0; t < vocab.length; t++) out[t] = words.get(vocab[t]!) ?? 0;
  return out;
}

function distinctiveWords(
  counts: Map<number, number>,
  windowTokens: number,
  textCount: Uint32Array,
  total: number,
  params: SurroundingsParams,
  vocab: readonly string[],
  stop: Set<string>,
  model: TextModel,
): DistinctiveWord[] {
  const rest = params.reference === 'rest';
  const d = rest ? total - windowTokens : total;
  const numeric = numericTypes(model);
  const out: DistinctiveWord[] = [];
  for (const [type, a] of counts) {
    if (a < params.minCount || stop.has(vocab[type]!) || numeric[type]) continue;
    const b = rest ? textCount[type]! - a : textCount[type]!;
    // Over-represented around the name only.
    if (a * d <= b * windowTokens) continue;
    out.push({ word: vocab[type]!, inWindows: a, inReference: b, g2: round(logLikelihood(a, windowTokens, b, d), 2) });
  }
  return out.sort((x, y) => y.g2 - x.g2 || compare(x.word, y.word)).slice(0, params.top);
}

const numericMemo = new WeakMap<TextModel, Uint8Array>();
/** 1 for vocabulary types that are numerals. */
function numericTypes(model: TextModel): Uint8Array {
  let out = numericMemo.get(model);
  if (!out) {
    out = new Uint8Array(model.vocab.length);
    for (let i = 0; i < model.tokens.count; i++) if (model.tokens.flags[i]! & TOKEN_FLAGS.numeric) out[model.tokens.type[i]!] = 1;
    numericMemo.set(model, out);
  }
  return out;
}

type DescriberKind = 'speech' | 'attributive' | 'predicative';

/**
 * The adjectives and adverbs tied to the mention at tokens t … t+len-1, as
 * [token, kind] pairs, all within the mention's sentence:
 * - speech: a speech verb just before or just after the name ("said Osric",
 *   "Osric said") and an adverb among the 2 words after that pair or the 2
 *   before it, with nothing but spaces (or a comma after the pair) between;
 * - attributive: an adjective just before the name;
 * - predicative: a linking verb just after the name, up to 2 adverbs, then an
 *   adjective (and more adjectives joined by "and"/"or"); none when a negator
 *   comes between.
 */
export function describersAt(
  model: TextModel,
  tags: TokenTags,
  t: number,
  len: number,
  verbs: ReadonlySet<string>,
): [number, DescriberKind][] {
  const { tokens, vocab, text } = model;
  const sentence = tokens.sentence[t]!;
  const end = t + len;
  const inSentence = (i: number): boolean => i >= 0 && i < tokens.count && tokens.sentence[i] === sentence;
  const form = (i: number): string => vocab[tokens.type[i]!]!;
  const gap = (i: number): string => text.slice(tokens.end[i]!, tokens.start[i + 1]!); // between token i and i+1
  const spaces = (i: number): boolean => /^\s*$/.test(gap(i));
  const spacesOrComma = (i: number): boolean => /^\s*,?\s*$/.test(gap(i));
  const is = (i: number, tag: number): boolean => inSentence(i) && tags.pos[i] === tag;
  const lemma = (i: number): string => tags.lemmas[tags.lemma[i]!]!;
  const out: [number, DescriberKind][] = [];

  // Speech tags.
  let pair: [number, number] | null = null;
  if (inSentence(t - 1) && verbs.has(form(t - 1)) && spaces(t - 1)) pair = [t - 1, end];
  else if (inSentence(end) && verbs.has(form(end)) && spaces(end - 1)) pair = [t, end + 1];
  if (pair) {
    const [a, b] = pair;
    for (let i = b; i < b + 2 && inSentence(i) && spacesOrComma(i - 1); i++) if (is(i, UPOS_ID.ADV)) out.push([i, 'speech']);
    for (let i = a - 1; i >= a - 2 && inSentence(i) && spaces(i); i--) if (is(i, UPOS_ID.ADV)) out.push([i, 'speech']);
  }

  // An adjective just before the name.
  if (is(t - 1, UPOS_ID.ADJ) && spaces(t - 1)) out.push([t - 1, 'attributive']);

  // The name, a linking verb, adverbs, an adjective.
  let i = end;
  if (inSentence(i) && spaces(i - 1) && LINKING.has(lemma(i)) && !form(i).endsWith("n't")) {
    i++;
    let adverbs = 0;
    while (is(i, UPOS_ID.ADV) && adverbs < 2 && spaces(i - 1)) {
      if (NEGATORS.has(form(i))) return out;
      adverbs++;
      i++;
    }
    while (is(i, UPOS_ID.ADJ) && spaces(i - 1)) {
      out.push([i, 'predicative']);
      if (inSentence(i + 1) && (form(i + 1) === 'and' || form(i + 1) === 'or') && is(i + 2, UPOS_ID.ADJ)) i += 2;
      else break;
    }
  }
  return out;
}
