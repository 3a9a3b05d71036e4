import { z } from 'zod';
import type { Measure, MeasureContext } from './types.ts';
import type { BarsData, KwicData, TextmapData } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { TOKEN_FLAGS } from '../text/model.ts';
import { hasStopwords, stopwords } from './stopwords.ts';
import { requireEnglish } from '../nlp/english.ts';
import { tagModel } from '../nlp/tag.ts';
import { speakerOfTokens } from './frequency.ts';

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
  // Occurrences say who speaks them when the text has a cast.
  readsCast: () => true,
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

/** A maximal recurring phrase: its word types and the token index of each occurrence. */
export interface Phrase {
  types: number[];
  positions: number[];
}

/**
 * Maximal recurring phrases of `minN`…`maxN` tokens within one sentence,
 * occurring at least `minCount` times and holding a content token.
 *
 * Level by level: every (n+1)-word phrase is a frequent n-word phrase followed
 * by the frequent n-word phrase one position on (they share n−1 words), so
 * each level is one pass over the positions that survived the last. An n-word
 * phrase is dropped when one (n+1)-word phrase that extends it to the right
 * or the left has as many occurrences (it then covers all of them).
 */
export function recurringPhrases(model: TextModel, content: Uint8Array, opts: { minN: number; maxN: number; minCount: number }): Phrase[] {
  const { tokens } = model;
  const n = tokens.count;
  const { type, sentence } = tokens;
  const out: Phrase[] = [];
  // Level 1: the word types that occur at least minCount times.
  let groups = model.vocab.length;
  let counts: Uint32Array = new Uint32Array(groups);
  for (let i = 0; i < n; i++) counts[type[i]!]!++;
  let gid: Int32Array = new Int32Array(n);
  for (let i = 0; i < n; i++) gid[i] = counts[type[i]!]! >= opts.minCount ? type[i]! : -1;

  for (let len = 1; len <= opts.maxN; len++) {
    // Build level len+1 (when needed) and mark the level-len groups it covers.
    const covered = new Uint8Array(groups);
    let next: Int32Array | null = null;
    let nextCounts = new Uint32Array(0);
    let nextGroups = 0;
    if (len < opts.maxN) {
      const ids = new Map<number, number>();
      const raw = new Int32Array(n).fill(-1);
      const rawCounts: number[] = [];
      const prefix: number[] = [];
      const suffix: number[] = [];
      for (let p = 0; p + len < n; p++) {
        const a = gid[p]!;
        const b = gid[p + 1]!;
        if (a < 0 || b < 0 || sentence[p] !== sentence[p + len]) continue;
        const key = a * groups + b;
        let id = ids.get(key);
        if (id === undefined) {
          id = rawCounts.length;
          ids.set(key, id);
          rawCounts.push(0);
          prefix.push(a);
          suffix.push(b);
        }
        rawCounts[id]!++;
        raw[p] = id;
      }
      // Keep the frequent ones, renumbered densely.
      const dense = new Int32Array(rawCounts.length).fill(-1);
      for (let id = 0; id < rawCounts.length; id++) {
        const c = rawCounts[id]!;
        if (c < opts.minCount) continue;
        dense[id] = nextGroups++;
        if (c === counts[prefix[id]!]) covered[prefix[id]!] = 1;
        if (c === counts[suffix[id]!]) covered[suffix[id]!] = 1;
      }
      nextCounts = new Uint32Array(nextGroups);
      for (let id = 0; id < rawCounts.length; id++) if (dense[id]! >= 0) nextCounts[dense[id]!] = rawCounts[id]!;
      for (let p = 0; p < n; p++) raw[p] = raw[p]! >= 0 ? dense[raw[p]!]! : -1;
      next = raw;
    }
    if (len >= opts.minN) {
      // The maximal level-len phrases that hold a content word.
      const index = new Int32Array(groups).fill(-1);
      for (let p = 0; p + len <= n; p++) {
        const g = gid[p]!;
        if (g < 0 || covered[g]) continue;
        let k = index[g]!;
        if (k === -1) {
          let hasContent = false;
          for (let j = p; j < p + len && !hasContent; j++) hasContent = content[j] === 1;
          if (!hasContent) {
            index[g] = -2;
            continue;
          }
          k = index[g] = out.length;
          out.push({ types: Array.from(type.subarray(p, p + len)), positions: [] });
        }
        if (k >= 0) out[k]!.positions.push(p);
      }
    }
    if (!next) break;
    gid = next;
    counts = nextCounts;
    groups = nextGroups;
    if (groups === 0) break;
  }
  return out;
}

/**
 * The places where a family's members occur, in text order, as [first token,
 * end token (exclusive), member]: occurrences that overlap ("mark my words"
 * inside "mark my words, girl"; two overlapping pieces of a repeat longer than
 * maxN) are one place, spanning them all; its member is the longest one that
 * starts there.
 */
export function familyPlaces(phrases: Phrase[], members: number[]): [number, number, number][] {
  const all = members
    .flatMap((m) => phrases[m]!.positions.map((p) => [p, m] as [number, number]))
    .sort((a, b) => a[0] - b[0] || phrases[b[1]]!.types.length - phrases[a[1]]!.types.length);
  const places: [number, number, number][] = [];
  for (const [p, m] of all) {
    const end = p + phrases[m]!.types.length;
    const last = places[places.length - 1];
    if (last && p < last[1]) last[1] = Math.max(last[1], end);
    else places.push([p, end, m]);
  }
  return places;
}

/** Union-find over phrase indices. */
function disjointSets(size: number): { find: (x: number) => number; union: (a: number, b: number) => void } {
  const parent = new Int32Array(size);
  for (let i = 0; i < size; i++) parent[i] = i;
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]!]!;
      x = parent[x]!;
    }
    return x;
  };
  return {
    find,
    union(a, b) {
      const ra = find(a);
      const rb = find(b);
      if (ra !== rb) parent[Math.max(ra, rb)] = Math.min(ra, rb);
    },
  };
}

/**
 * Families of near-variant phrases, in two steps that do not chain (a family
 * found by linking every pair of related phrases would, in a long text, swallow
 * thousands of phrases through one shared word after another):
 * 1. Core: each phrase takes, of its 3-word runs holding a content word, the
 *    one the most phrases contain (ties: the earlier run in the phrase); the
 *    phrases that take the same run are one family and all contain that run.
 * 2. Variants: a phrase of 4 or more words left alone in step 1 joins the
 *    largest family holding a phrase at token edit distance 1 from it (one
 *    word substituted, inserted or deleted; both of 4 or more words; the
 *    shared words holding a content word). Phrases still alone are grouped
 *    with their lone variants.
 * Returns the family of each phrase (the index of one of its members), and
 * which phrases joined a family in step 2.
 */
export function phraseFamilies(phrases: Phrase[], isContent: (type: number) => boolean): { family: Int32Array; joined: Uint8Array } {
  const n = phrases.length;

  // 1. Cores.
  const support = new Map<string, number>();
  const runsOf = phrases.map(({ types: ts }) => {
    const runs: string[] = [];
    for (let s = 0; s + 3 <= ts.length; s++) {
      if (!isContent(ts[s]!) && !isContent(ts[s + 1]!) && !isContent(ts[s + 2]!)) continue;
      const key = `${ts[s]} ${ts[s + 1]} ${ts[s + 2]}`;
      if (!runs.includes(key)) runs.push(key);
    }
    for (const key of runs) support.set(key, (support.get(key) ?? 0) + 1);
    return runs;
  });
  const family = new Int32Array(n);
  const byCore = new Map<string, number>();
  for (let i = 0; i < n; i++) {
    let best: string | null = null;
    for (const key of runsOf[i]!) if (best === null || support.get(key)! > support.get(best)!) best = key;
    if (best === null) {
      family[i] = i;
      continue;
    }
    let f = byCore.get(best);
    if (f === undefined) byCore.set(best, (f = i));
    family[i] = f;
  }
  const size = new Uint32Array(n);
  for (let i = 0; i < n; i++) size[family[i]!]!++;

  // 2. Variants at edit distance 1, for phrases of 4 words or more. Keys: the
  // phrase with one word starred (substitution), the phrase less one word (deletion).
  const whole = new Map<string, number>();
  const starred: string[][] = [];
  const less: string[][] = [];
  const byStarred = new Map<string, number[]>();
  const byLess = new Map<string, number[]>();
  const push = (map: Map<string, number[]>, key: string, i: number): void => {
    const list = map.get(key);
    if (list) list.push(i);
    else map.set(key, [i]);
  };
  phrases.forEach(({ types: ts }, i) => {
    starred[i] = [];
    less[i] = [];
    if (ts.length < 4) return;
    whole.set(ts.join(' '), i);
    const contentWords = ts.reduce((c, t) => c + (isContent(t) ? 1 : 0), 0);
    for (let s = 0; s < ts.length; s++) {
      // The shared words must hold a content word.
      if (contentWords - (isContent(ts[s]!) ? 1 : 0) === 0) continue;
      const before = ts.slice(0, s).join(' ');
      const after = ts.slice(s + 1).join(' ');
      const star = `${before}|${after}`;
      starred[i]!.push(star);
      push(byStarred, star, i);
      if (ts.length >= 5) {
        const rest = before && after ? `${before} ${after}` : before || after;
        less[i]!.push(rest);
        push(byLess, rest, i);
      }
    }
  });
  const variants = (i: number): number[] => {
    const out = new Set<number>();
    for (const key of starred[i]!) for (const j of byStarred.get(key)!) out.add(j);
    for (const key of less[i]!) {
      const shorter = whole.get(key);
      if (shorter !== undefined) out.add(shorter);
    }
    for (const j of byLess.get(phrases[i]!.types.join(' ')) ?? []) out.add(j);
    out.delete(i);
    return [...out].sort((a, b) => a - b);
  };
  const joined = new Uint8Array(n);
  const alone: number[] = [];
  const lonely = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    if (size[family[i]!] !== 1 || phrases[i]!.types.length < 4) continue;
    let target = -1;
    for (const j of variants(i)) {
      const f = family[j]!;
      if (size[f]! < 2) continue;
      if (target < 0 || size[f]! > size[target]! || (size[f] === size[target] && f < target)) target = f;
    }
    if (target >= 0) {
      family[i] = target;
      joined[i] = 1;
    } else {
      alone.push(i);
      lonely[i] = 1;
    }
  }
  const sets = disjointSets(n);
  for (const i of alone) for (const j of variants(i)) if (lonely[j]) sets.union(i, j);
  for (const i of alone) family[i] = sets.find(i);
  return { family, joined };
}

/** The longest run of ≥ 3 words holding a content word that every member contains, or null. */
function sharedCore(members: number[][], isContent: (type: number) => boolean): number[] | null {
  const first = members[0]!;
  for (let len = first.length; len >= 3; len--) {
    for (let s = 0; s + len <= first.length; s++) {
      const run = first.slice(s, s + len);
      if (!run.some(isContent)) continue;
      if (members.every((m) => containsRun(m, run))) return run;
    }
  }
  return null;
}

function containsRun(haystack: number[], run: number[]): boolean {
  outer: for (let s = 0; s + run.length <= haystack.length; s++) {
    for (let k = 0; k < run.length; k++) if (haystack[s + k] !== run[k]) continue outer;
    return true;
  }
  return false;
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

export function computeRepetition(ctx: MeasureContext, params: RepetitionParams): RepetitionResult {
  const { model, language } = ctx;
  const { tokens, vocab, chapters, text } = model;
  const stop = stopwords(language);
  const contentType = new Uint8Array(vocab.length);
  for (let t = 0; t < vocab.length; t++) contentType[t] = stop.has(vocab[t]!) ? 0 : 1;
  const content = new Uint8Array(tokens.count);
  for (let i = 0; i < tokens.count; i++) content[i] = contentType[tokens.type[i]!]! && !(tokens.flags[i]! & TOKEN_FLAGS.numeric) ? 1 : 0;
  const numericType = new Uint8Array(vocab.length);
  for (let i = 0; i < tokens.count; i++) if (tokens.flags[i]! & TOKEN_FLAGS.numeric) numericType[tokens.type[i]!] = 1;
  const isContent = (t: number): boolean => contentType[t] === 1 && numericType[t] === 0;

  const phrases = recurringPhrases(model, content, params);
  const { family: familyOf, joined } = phraseFamilies(phrases, isContent);
  const byFamily = new Map<number, number[]>();
  phrases.forEach((_, i) => {
    const f = familyOf[i]!;
    const list = byFamily.get(f);
    if (list) list.push(i);
    else byFamily.set(f, [i]);
  });
  const words = (ts: number[]): string => ts.map((t) => vocab[t]!).join(' ');
  const labels = phrases.map((ph) => words(ph.types));
  const ranked = [...byFamily.values()].map((members) => {
    members.sort((a, b) => phrases[b]!.positions.length - phrases[a]!.positions.length || compare(labels[a]!, labels[b]!));
    const places = familyPlaces(phrases, members);
    return { members, places, count: places.length, label: labels[members[0]!]! };
  });
  ranked.sort((a, b) => b.count - a.count || compare(a.label, b.label));

  const paras = paragraphTokens(model);
  const who = ctx.cast.length ? speakerOfTokens(ctx) : null;
  const families: Family[] = ranked.slice(0, params.top).map((f, r) => {
    // The core is shared by the members grouped by it (variants that joined later may lack it).
    const grouped = f.members.filter((m) => !joined[m]);
    const core = sharedCore(
      (grouped.length ? grouped : f.members).map((m) => phrases[m]!.types),
      isContent,
    );
    const places = f.places.slice(0, params.occurrences);
    return {
      rank: r + 1,
      label: f.label,
      core: core ? words(core) : null,
      count: f.count,
      memberCount: f.members.length,
      members: f.members
        .slice(0, 10)
        .map((m) => ({ phrase: words(phrases[m]!.types), words: phrases[m]!.types.length, count: phrases[m]!.positions.length })),
      occurrences: places.map(([p, end, m]) => {
        const last = end - 1;
        const para = tokens.paragraph[p]!;
        const chapter = chapters[tokens.chapter[p]!]!;
        const from = Math.max(paras.first[para]!, p - params.context);
        const to = Math.min(paras.end[para]! - 1, last + params.context);
        return {
          phrase: words(phrases[m]!.types),
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
    phrases: phrases.length,
    familyCount: ranked.length,
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
