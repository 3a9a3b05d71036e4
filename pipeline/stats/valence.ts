/**
 * Scoring the tokens of a text with a valence word list: phrases first
 * (longest match), then single words, with a simple negation rule.
 * Lookups are prepared once per vocabulary type.
 */

/** The text-model columns the scorer reads. */
export interface ScoredText {
  text: string;
  vocab: readonly string[];
  tokens: { count: number; type: ArrayLike<number>; start: ArrayLike<number>; end: ArrayLike<number>; sentence: ArrayLike<number> };
}

export interface ValenceList {
  words: ReadonlyMap<string, number>;
  phrases: readonly { words: readonly string[]; value: number }[];
}

export interface NegationOptions {
  /** How many words before a scored word are searched for a negator; 0 turns negation off. */
  window: number;
  /** Negating words (lower case); besides these, any word ending in "n't" negates. */
  words: readonly string[];
}

/** The negators used when none are given: not, no, never, nor, neither, cannot, and every "-n't" form. */
export const DEFAULT_NEGATORS: readonly string[] = ['not', 'no', 'never', 'nor', 'neither', 'cannot'];

/** Clause punctuation that stops a negation from reaching further: , ; : ( ) and dashes. */
const CLAUSE_BREAK = /[,;:()\u2013\u2014]|--/;

export interface TokenScores {
  /** Valence applied at each token (after negation); a phrase's value sits on its first token, its other tokens 0. */
  value: Int8Array;
  /** Tokens covered by a scored word or phrase, 1 at the first token of each match. */
  matched: Uint8Array;
  /** Length in tokens of the match starting at each token (0 elsewhere). */
  span: Uint8Array;
  /** 1 where the match's sign was flipped by a negator. */
  negated: Uint8Array;
}

/**
 * Score every token. At each position the longest phrase of the list that
 * starts there wins; otherwise the word's own valence. A negator among the
 * `negation.window` words before a match, in the same sentence and with no
 * clause punctuation between, flips the match's sign. Negators are read as
 * negators only and are not scored themselves; words inside a matched phrase
 * ("not good", "does not work") belong to the phrase and negate nothing else.
 */
export function scoreTokens(t: ScoredText, list: ValenceList, negation: NegationOptions): TokenScores {
  const { vocab, tokens, text } = t;
  const n = tokens.count;
  const ids = new Map<string, number>();
  for (let i = 0; i < vocab.length; i++) ids.set(vocab[i]!, i);

  // Per vocabulary type: its own valence, whether it negates, phrases starting with it.
  const own = new Int8Array(vocab.length);
  const negator = new Uint8Array(vocab.length);
  const negSet = new Set(negation.words.map((w) => w.toLowerCase()));
  for (let i = 0; i < vocab.length; i++) {
    const w = vocab[i]!;
    if (negSet.has(w) || /n't$/.test(w)) negator[i] = 1;
    else own[i] = list.words.get(w) ?? 0;
  }
  const phrasesByFirst = new Map<number, { ids: number[]; value: number }[]>();
  for (const p of list.phrases) {
    const pids = p.words.map((w) => ids.get(w));
    if (pids.some((x) => x === undefined)) continue;
    const first = pids[0]!;
    const bucket = phrasesByFirst.get(first) ?? [];
    bucket.push({ ids: pids as number[], value: p.value });
    phrasesByFirst.set(first, bucket);
  }
  for (const bucket of phrasesByFirst.values()) bucket.sort((a, b) => b.ids.length - a.ids.length);

  const value = new Int8Array(n);
  const matched = new Uint8Array(n);
  const span = new Uint8Array(n);
  const negated = new Uint8Array(n);
  const consumed = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const type = tokens.type[i]!;
    let v = 0;
    let len = 0;
    const bucket = phrasesByFirst.get(type);
    if (bucket) {
      for (const p of bucket) {
        if (i + p.ids.length > n) continue;
        let ok = true;
        for (let k = 1; k < p.ids.length && ok; k++) {
          ok = tokens.type[i + k] === p.ids[k] && tokens.sentence[i + k] === tokens.sentence[i];
        }
        if (ok) {
          v = p.value;
          len = p.ids.length;
          break;
        }
      }
    }
    if (len === 0 && own[type] !== 0) {
      v = own[type]!;
      len = 1;
    }
    if (len === 0) continue;
    matched[i] = 1;
    span[i] = len;
    for (let k = 1; k < len; k++) consumed[i + k] = 1;
    consumed[i] = 1;
    if (v !== 0 && negation.window > 0 && isNegated(i, negation.window)) {
      v = -v;
      negated[i] = 1;
    }
    value[i] = v;
    i += len - 1;
  }
  return { value, matched, span, negated };

  function isNegated(i: number, window: number): boolean {
    const sentence = tokens.sentence[i]!;
    for (let j = i - 1; j >= 0 && j >= i - window; j--) {
      if (tokens.sentence[j] !== sentence) return false;
      if (CLAUSE_BREAK.test(text.slice(tokens.end[j]!, tokens.start[j + 1]!))) return false;
      if (consumed[j]) continue;
      if (negator[tokens.type[j]!]) return true;
    }
    return false;
  }
}
