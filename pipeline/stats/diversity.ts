/**
 * Lexical diversity of a sequence of word types (integer type ids, e.g. the
 * vocabulary indices of a text's tokens): type–token ratio, moving-average
 * type–token ratio (MATTR) and the measure of textual lexical diversity (MTLD).
 * Each runs in one pass over the span with a per-type array, so a
 * million-word text takes milliseconds.
 */

/** Type ids, read over [from, to). */
export type TypeSequence = ArrayLike<number>;

function typeBound(types: TypeSequence, from: number, to: number): number {
  let max = 0;
  for (let i = from; i < to; i++) if (types[i]! > max) max = types[i]!;
  return max + 1;
}

/** Distinct types over [from, to). */
export function countTypes(types: TypeSequence, from = 0, to = types.length): number {
  if (to <= from) return 0;
  const seen = new Uint8Array(typeBound(types, from, to));
  let distinct = 0;
  for (let i = from; i < to; i++) {
    const t = types[i]!;
    if (!seen[t]) {
      seen[t] = 1;
      distinct++;
    }
  }
  return distinct;
}

/** Type–token ratio: distinct types ÷ tokens over [from, to); null for an empty span. */
export function typeTokenRatio(types: TypeSequence, from = 0, to = types.length): number | null {
  return to > from ? countTypes(types, from, to) / (to - from) : null;
}

export interface MattrResult {
  /** Mean TTR over every window of `window` tokens, or the span's TTR when it is shorter than the window; null when empty. */
  value: number | null;
  /** Windows averaged (n − window + 1), 0 when the span was shorter than the window. */
  windows: number;
  /** True when the span was shorter than the window and its plain TTR was used instead. */
  fallback: boolean;
}

/**
 * MATTR (Covington & McFall 2010): the TTR of every window of `window`
 * consecutive tokens (the window moving one token at a time), averaged. A
 * span shorter than the window falls back to its plain TTR.
 */
export function mattr(types: TypeSequence, window: number, from = 0, to = types.length): MattrResult {
  const n = to - from;
  if (n <= 0) return { value: null, windows: 0, fallback: false };
  if (n < window) return { value: typeTokenRatio(types, from, to), windows: 0, fallback: true };
  const counts = new Uint32Array(typeBound(types, from, to));
  let distinct = 0;
  for (let i = from; i < from + window; i++) if (counts[types[i]!]!++ === 0) distinct++;
  let total = distinct;
  for (let i = from + window; i < to; i++) {
    if (counts[types[i]!]!++ === 0) distinct++;
    if (--counts[types[i - window]!]! === 0) distinct--;
    total += distinct;
  }
  const windows = n - window + 1;
  return { value: total / (windows * window), windows, fallback: false };
}

export interface MtldPass {
  /** Completed factors plus the partial factor of the remainder. */
  factors: number;
  /** Tokens ÷ factors; null when the factor count is 0 (every token a new type and no factor completed). */
  value: number | null;
}

export interface MtldResult {
  /** Mean of the forward and backward values; null when either is null. */
  value: number | null;
  forward: MtldPass;
  backward: MtldPass;
}

function mtldPass(types: TypeSequence, from: number, to: number, threshold: number, backward: boolean, stamp: Uint32Array, epoch: { n: number }): MtldPass {
  const n = to - from;
  let factors = 0;
  let distinct = 0;
  let tokens = 0;
  epoch.n++;
  for (let k = 0; k < n; k++) {
    const t = types[backward ? to - 1 - k : from + k]!;
    tokens++;
    if (stamp[t] !== epoch.n) {
      stamp[t] = epoch.n;
      distinct++;
    }
    if (distinct / tokens <= threshold) {
      factors++;
      epoch.n++;
      distinct = 0;
      tokens = 0;
    }
  }
  if (tokens > 0) factors += (1 - distinct / tokens) / (1 - threshold);
  return { factors, value: factors > 0 ? n / factors : null };
}

/**
 * MTLD (McCarthy & Jarvis 2010). Reading forward, the running TTR of the
 * current stretch is checked after each token; when it falls to `threshold`
 * or below, one factor is complete and a new stretch starts. Tokens left at
 * the end add a partial factor (1 − TTR) ÷ (1 − threshold) — 0 when the
 * remainder's TTR is 1. MTLD = tokens ÷ factors; the same is done reading
 * backward and the two are averaged.
 */
export function mtld(types: TypeSequence, threshold = 0.72, from = 0, to = types.length): MtldResult {
  const stamp = new Uint32Array(to > from ? typeBound(types, from, to) : 0);
  const epoch = { n: 0 };
  const forward = mtldPass(types, from, to, threshold, false, stamp, epoch);
  const backward = mtldPass(types, from, to, threshold, true, stamp, epoch);
  const value = forward.value !== null && backward.value !== null ? (forward.value + backward.value) / 2 : null;
  return { value, forward, backward };
}
