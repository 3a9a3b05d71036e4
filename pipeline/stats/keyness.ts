/**
 * Keywords of one corpus against another from their frequency lists: every
 * word type is scored with log-likelihood G² (two-cell form) for significance
 * and Log Ratio for effect size, filtered and ranked.
 *
 * Any comparison plugs in by building two count arrays over one shared id
 * space: a chapter against the rest of its text (ids = the text's vocab), a
 * speaker against the other speakers (counts of their words), or one text
 * against another (map both vocabularies into one id space first, a type
 * missing from one side counting 0 there). Sizes are the corpora's token
 * counts, including words the `include` filter leaves out.
 */
import { logLikelihood } from './loglikelihood.ts';
import { logRatio } from './logratio.ts';
import { criticalValue, significanceBand } from './chisquare.ts';
import type { SignificanceBand, SignificanceLevel } from './chisquare.ts';

export type KeynessDirection = 'positive' | 'negative' | 'both';

export interface KeynessOptions {
  /** Least frequency on the side where a word is over-used (in A for positive keywords, in B for negative ones). Default: 3. */
  minFrequency?: number;
  /** Keep words significant at this level (χ²(1) critical value 3.84, 6.63, 10.83 or 15.13); 1 keeps every word tested. Default: 0.01. */
  p?: SignificanceLevel | 1;
  /** "positive": over-used in A; "negative": under-used in A; "both". Default: "positive". */
  direction?: KeynessDirection;
  /** Rank by G² ("g2") or by the size of Log Ratio ("logRatio"). Default: "g2". */
  sort?: 'g2' | 'logRatio';
  /** Rows kept per direction after ranking. Default: all. */
  top?: number;
  /** Which type ids may be keywords (e.g. not stopwords). Default: all. */
  include?: (type: number) => boolean;
  /** Order of two types that rank equal. Default: lower id first. */
  tieBreak?: (x: number, y: number) => number;
}

export interface KeynessRow {
  /** The type id, in the shared id space of the two count arrays. */
  type: number;
  /** Frequency in A and in B. */
  a: number;
  b: number;
  g2: number;
  band: SignificanceBand;
  /** log₂ of the ratio of relative frequencies, zero counts replaced by 0.5. */
  logRatio: number;
  /** "positive" when the word's relative frequency is higher in A (ties count as positive). */
  direction: 'positive' | 'negative';
}

export interface KeynessOutcome {
  /** Types that passed `include` and `minFrequency` and were scored. */
  tested: number;
  /** Of those, how many reached the significance level. */
  significant: number;
  /** Positive rows first, strongest first, then negative rows, strongest first; at most `top` of each. */
  rows: KeynessRow[];
}

export function keyness(
  countsA: ArrayLike<number>,
  sizeA: number,
  countsB: ArrayLike<number>,
  sizeB: number,
  options: KeynessOptions = {},
): KeynessOutcome {
  if (countsA.length !== countsB.length) {
    throw new RangeError(`the two frequency lists differ in length (${countsA.length} and ${countsB.length}): map both into one id space first`);
  }
  if (!(sizeA > 0) || !(sizeB > 0)) {
    throw new RangeError(`both corpora must hold words to be compared (sizes ${sizeA} and ${sizeB})`);
  }
  const minFrequency = options.minFrequency ?? 3;
  const critical = criticalValue(options.p ?? 0.01);
  const direction = options.direction ?? 'positive';
  const include = options.include;
  const tie = options.tieBreak ?? ((x: number, y: number) => x - y);
  const byRatio = options.sort === 'logRatio';
  const top = options.top ?? Infinity;
  const positive = bestOf(top, tie);
  const negative = bestOf(top, tie);
  let tested = 0;
  let significant = 0;
  for (let t = 0; t < countsA.length; t++) {
    const a = countsA[t]!;
    const b = countsB[t]!;
    if (a + b === 0) continue;
    // Cross-multiplied to compare rates a/sizeA and b/sizeB exactly.
    const over = a * sizeB >= b * sizeA;
    if (over ? direction === 'negative' : direction === 'positive') continue;
    if ((over ? a : b) < minFrequency) continue;
    if (include && !include(t)) continue;
    tested++;
    const g2 = logLikelihood(a, sizeA, b, sizeB);
    if (g2 < critical) continue;
    significant++;
    const strength = byRatio ? Math.abs(logRatio(a, sizeA, b, sizeB)) : g2;
    (over ? positive : negative).offer(t, strength, g2);
  }
  const row = (c: Candidate, over: boolean): KeynessRow => {
    const a = countsA[c.type]!;
    const b = countsB[c.type]!;
    return {
      type: c.type,
      a,
      b,
      g2: c.g2,
      band: significanceBand(c.g2),
      logRatio: logRatio(a, sizeA, b, sizeB),
      direction: over ? 'positive' : 'negative',
    };
  };
  return {
    tested,
    significant,
    rows: [...positive.ranked().map((c) => row(c, true)), ...negative.ranked().map((c) => row(c, false))],
  };
}

interface Candidate {
  type: number;
  strength: number;
  g2: number;
}

/**
 * The k strongest candidates offered, without keeping the others: a binary
 * heap with the weakest kept candidate at its root, so that a list of a few
 * dozen keywords out of thousands of words costs one comparison per word.
 */
function bestOf(k: number, tie: (x: number, y: number) => number) {
  const heap: Candidate[] = [];
  /** Whether x ranks below y. */
  const weaker = (x: Candidate, y: Candidate): boolean => x.strength < y.strength || (x.strength === y.strength && tie(x.type, y.type) > 0);
  const swap = (i: number, j: number): void => {
    const h = heap[i]!;
    heap[i] = heap[j]!;
    heap[j] = h;
  };
  const up = (i: number): void => {
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (!weaker(heap[i]!, heap[parent]!)) return;
      swap(i, parent);
      i = parent;
    }
  };
  const down = (i: number): void => {
    for (;;) {
      const l = 2 * i + 1;
      const r = l + 1;
      let min = i;
      if (l < heap.length && weaker(heap[l]!, heap[min]!)) min = l;
      if (r < heap.length && weaker(heap[r]!, heap[min]!)) min = r;
      if (min === i) return;
      swap(i, min);
      i = min;
    }
  };
  return {
    offer(type: number, strength: number, g2: number): void {
      if (k <= 0) return;
      if (heap.length < k) {
        heap.push({ type, strength, g2 });
        up(heap.length - 1);
        return;
      }
      const root = heap[0]!;
      // Most words lose to the weakest kept one: reject them before building anything.
      if (strength < root.strength || (strength === root.strength && tie(type, root.type) > 0)) return;
      heap[0] = { type, strength, g2 };
      down(0);
    },
    /** The kept candidates, strongest first. */
    ranked(): Candidate[] {
      return heap.slice().sort((x, y) => (weaker(x, y) ? 1 : weaker(y, x) ? -1 : 0));
    },
  };
}
