import { phraseSet, type Phrase, type PhraseSet } from './phrases.ts';
import { gapHasher, tupleTable, type Gap } from './tuples.ts';
import { pairList, type Rows } from './ints.ts';

/** Families of phrases: the family of each phrase (the index of one of its members), and which phrases joined one as variants. */
export interface Families {
  family: Int32Array;
  joined: Uint8Array;
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
 * Step 1 of `phraseFamilies`: the family of each phrase by its core, the 3-word
 * run holding a content word that the most phrases contain (ties: the earlier
 * run in the phrase); a phrase with no such run is its own family.
 */
function familiesByCore(set: PhraseSet, isContent: (type: number) => boolean): Int32Array {
  const { count: n, types, typeStart, positions, positionStart } = set;
  // Ids of runs: known from the text, or interned here.
  const interned = set.runs ? null : tupleTable(n);
  // The distinct runs of each phrase, in order: ids[runStart[i] … runStart[i+1]).
  const runStart = new Int32Array(n + 1);
  let most = 0;
  for (let i = 0; i < n; i++) most += Math.max(0, typeStart[i + 1]! - typeStart[i]! - 2);
  const ids = new Int32Array(most);
  let length = 0;
  for (let i = 0; i < n; i++) {
    runStart[i] = length;
    const from = typeStart[i]!;
    const first = positions[positionStart[i]!]! - from; // a token of the text where types[s] stands at first + s
    for (let s = from; s + 3 <= typeStart[i + 1]!; s++) {
      if (!isContent(types[s]!) && !isContent(types[s + 1]!) && !isContent(types[s + 2]!)) continue;
      const id = interned ? interned.add(types, s, s + 3) : set.runs!.at[first + s]!;
      let seen = false;
      for (let k = runStart[i]!; k < length && !seen; k++) seen = ids[k] === id;
      if (!seen) ids[length++] = id;
    }
  }
  runStart[n] = length;
  const runCount = interned ? interned.size : set.runs!.count;
  const support = new Int32Array(runCount);
  for (let k = 0; k < length; k++) support[ids[k]!]!++;
  const family = new Int32Array(n);
  const byCore = new Int32Array(runCount).fill(-1);
  for (let i = 0; i < n; i++) {
    let best = -1;
    for (let k = runStart[i]!; k < runStart[i + 1]!; k++) {
      const id = ids[k]!;
      if (best < 0 || support[id]! > support[best]!) best = id;
    }
    if (best < 0) {
      family[i] = i;
      continue;
    }
    if (byCore[best] === -1) byCore[best] = i;
    family[i] = byCore[best]!;
  }
  return family;
}

/**
 * The phrases at token edit distance 1 from each of the `asked` phrases (of 4
 * or more words), among all phrases of 4 or more words. Keys: the phrase with
 * one word starred (substitution) and the phrase less one word (deletion),
 * each kept only when the shared words hold a content word. Only the asked
 * phrases' keys are stored; every phrase then looks its own keys up.
 * Returns the variants of an asked phrase, ascending.
 */
function variantIndex(set: PhraseSet, isContent: (type: number) => boolean, asked: number[]): (i: number) => number[] {
  const { count: n, types, typeStart } = set;
  const keys = tupleTable(asked.length * 16);
  const wholeOwners = pairList(); // key → asked phrase that is it
  const starOwners = pairList(); // key → asked phrases with it starred
  const lessOwners = pairList(); // key → asked phrases with it as one word less
  const keysOf = (i: number, visit: (gap: Gap, at: number) => void): void => {
    const from = typeStart[i]!;
    const to = typeStart[i + 1]!;
    let contentWords = 0;
    for (let s = from; s < to; s++) if (isContent(types[s]!)) contentWords++;
    for (let s = from; s < to; s++) {
      // The shared words must hold a content word.
      if (contentWords - (isContent(types[s]!) ? 1 : 0) === 0) continue;
      visit('star', s);
      if (to - from >= 5) visit('omit', s);
    }
  };
  for (const i of asked) {
    const from = typeStart[i]!;
    const to = typeStart[i + 1]!;
    wholeOwners.push(keys.add(types, from, to), i);
    keysOf(i, (gap, at) => (gap === 'star' ? starOwners : lessOwners).push(keys.add(types, from, to, at, gap), i));
  }
  const size = keys.size;
  const wholeRows = wholeOwners.rows(size);
  const starRows = starOwners.rows(size);
  const lessRows = lessOwners.rows(size);
  const found = pairList(); // asked phrase → a variant
  const report = (rows: Rows, key: number, j: number): void => {
    if (key < 0) return;
    for (let r = rows.start[key]!; r < rows.start[key + 1]!; r++) found.push(rows.items[r]!, j);
  };
  const hashes = gapHasher();
  let star = new Int32Array(16);
  let omit = new Int32Array(16);
  for (let j = 0; j < n; j++) {
    const from = typeStart[j]!;
    const to = typeStart[j + 1]!;
    if (to - from < 4) continue;
    if (to - from > star.length) {
      star = new Int32Array(to - from);
      omit = new Int32Array(to - from);
    }
    const whole = hashes(types, from, to, star, omit);
    // j is an asked phrase less one word.
    if (keys.mayHold(whole)) report(lessRows, keys.findHashed(whole, types, from, to), j);
    let contentWords = 0;
    for (let s = from; s < to; s++) if (isContent(types[s]!)) contentWords++;
    for (let s = from; s < to; s++) {
      // The shared words must hold a content word (as for the asked phrases' keys).
      if (contentWords - (isContent(types[s]!) ? 1 : 0) === 0) continue;
      // j and an asked phrase differ in one word.
      const h = star[s - from]!;
      if (keys.mayHold(h)) report(starRows, keys.findHashed(h, types, from, to, s, 'star'), j);
      // An asked phrase is j less one word.
      const o = omit[s - from]!;
      if (to - from >= 5 && keys.mayHold(o)) report(wholeRows, keys.findHashed(o, types, from, to, s, 'omit'), j);
    }
  }
  const variants = found.rows(n);
  return (i) => {
    const list = Array.from(variants.items.subarray(variants.start[i]!, variants.start[i + 1]!)).sort((a, b) => a - b);
    return list.filter((j, k) => j !== i && (k === 0 || list[k - 1] !== j));
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
export function familiesOf(set: PhraseSet, isContent: (type: number) => boolean): Families {
  const n = set.count;
  const family = familiesByCore(set, isContent);
  const size = new Uint32Array(n);
  for (let i = 0; i < n; i++) size[family[i]!]!++;

  const asked: number[] = [];
  for (let i = 0; i < n; i++) if (size[family[i]!] === 1 && set.typeStart[i + 1]! - set.typeStart[i]! >= 4) asked.push(i);
  const variants = variantIndex(set, isContent, asked);
  const joined = new Uint8Array(n);
  const alone: number[] = [];
  const lonely = new Uint8Array(n);
  for (const i of asked) {
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

/** `familiesOf` for phrases as objects. */
export function phraseFamilies(phrases: Phrase[], isContent: (type: number) => boolean): Families {
  return familiesOf(phraseSet(phrases), isContent);
}
