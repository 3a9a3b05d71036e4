import { phraseSet, type Phrase, type PhraseSet } from './phrases.ts';
import { gapHasher, tupleTable, type GapHasher, type TupleTable } from './tuples.ts';
import { pairList, type Rows } from './ints.ts';

/** Families of phrases: the family of each phrase (the index of one of its members), and which phrases joined one as variants. */
export interface Families {
  family: Int32Array;
  joined: Uint8Array;
}

/*
 * Each loop over all the phrases has a function of its own: the engine
 * compiles a function while its first loop runs, and a later loop in the same
 * function would then run with no type feedback and fall back to the
 * interpreter.
 */

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
  const content = contentTypes(set, isContent);
  const family = familiesByCore(set, content);
  const size = familySizes(family);
  const asked = aloneInCore(set, family, size);
  const variants = variantIndex(set, content, asked);
  const joined = new Uint8Array(set.count);
  const alone = joinLargest(asked, variants, family, size, joined);
  groupAlone(alone, variants, family);
  return { family, joined };
}

/** `familiesOf` for phrases as objects. */
export function phraseFamilies(phrases: Phrase[], isContent: (type: number) => boolean): Families {
  return familiesOf(phraseSet(phrases), isContent);
}

/** 1 for each word type (of those in the set) that `isContent` accepts, else 0. */
function contentTypes(set: PhraseSet, isContent: (type: number) => boolean): Uint8Array {
  const known = new Uint8Array(largest(set.types) + 1); // 0 not asked yet, 1 content, 2 not
  askContent(set.types, known, isContent);
  for (let t = 0; t < known.length; t++) known[t] = known[t] === 1 ? 1 : 0;
  return known;
}

function largest(values: Int32Array): number {
  let most = -1;
  for (let k = 0; k < values.length; k++) most = Math.max(most, values[k]!);
  return most;
}

function askContent(types: Int32Array, known: Uint8Array, isContent: (type: number) => boolean): void {
  for (let k = 0; k < types.length; k++) {
    const t = types[k]!;
    if (known[t] === 0) known[t] = isContent(t) ? 1 : 2;
  }
}

/**
 * Step 1: the family of each phrase by its core, the 3-word run holding a
 * content word that the most phrases contain (ties: the earlier run in the
 * phrase); a phrase with no such run is its own family.
 */
function familiesByCore(set: PhraseSet, content: Uint8Array): Int32Array {
  // Ids of runs: known from the text, or interned here.
  const interned = set.runs ? null : tupleTable(set.count);
  const runs = phraseRuns(set, content, interned);
  const count = interned ? interned.size : set.runs!.count;
  return chooseCores(set.count, runs, support(runs.items, count), count);
}

/** The distinct runs (ids) of each phrase, in order, that hold a content word. */
function phraseRuns(set: PhraseSet, content: Uint8Array, interned: TupleTable | null): Rows {
  const { count: n, types, typeStart, positions, positionStart } = set;
  const start = new Int32Array(n + 1);
  const ids = new Int32Array(runRoom(typeStart, n));
  // The last phrase (plus one) that took each run, to take it once per phrase.
  const taken = new Int32Array(interned ? ids.length : set.runs!.count);
  let length = 0;
  for (let i = 0; i < n; i++) {
    start[i] = length;
    const from = typeStart[i]!;
    const first = positions[positionStart[i]!]! - from; // a token of the text where types[s] stands at first + s
    for (let s = from; s + 3 <= typeStart[i + 1]!; s++) {
      if (!content[types[s]!] && !content[types[s + 1]!] && !content[types[s + 2]!]) continue;
      const id = interned ? interned.add(types, s, s + 3) : set.runs!.at[first + s]!;
      if (taken[id] === i + 1) continue;
      taken[id] = i + 1;
      ids[length++] = id;
    }
  }
  start[n] = length;
  return { start, items: ids.subarray(0, length) };
}

/** How many 3-word runs the phrases have in all, at most. */
function runRoom(typeStart: Int32Array, n: number): number {
  let room = 0;
  for (let i = 0; i < n; i++) room += Math.max(0, typeStart[i + 1]! - typeStart[i]! - 2);
  return room;
}

/** How many phrases hold each run. */
function support(ids: Int32Array, count: number): Int32Array {
  const out = new Int32Array(count);
  for (let k = 0; k < ids.length; k++) out[ids[k]!]!++;
  return out;
}

function chooseCores(n: number, runs: Rows, support: Int32Array, count: number): Int32Array {
  const family = new Int32Array(n);
  const byCore = new Int32Array(count).fill(-1);
  for (let i = 0; i < n; i++) {
    let best = -1;
    for (let k = runs.start[i]!; k < runs.start[i + 1]!; k++) {
      const id = runs.items[k]!;
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

function familySizes(family: Int32Array): Uint32Array {
  const size = new Uint32Array(family.length);
  for (let i = 0; i < family.length; i++) size[family[i]!]!++;
  return size;
}

/** The phrases of 4 or more words alone in their family. */
function aloneInCore(set: PhraseSet, family: Int32Array, size: Uint32Array): number[] {
  const out: number[] = [];
  for (let i = 0; i < set.count; i++) if (size[family[i]!] === 1 && set.typeStart[i + 1]! - set.typeStart[i]! >= 4) out.push(i);
  return out;
}

/**
 * Step 2, first part: each asked phrase joins the largest family (of 2 or
 * more, from step 1) holding one of its variants (ties: the family named by
 * the earlier phrase); marks it in `joined`. Returns the phrases left alone.
 */
function joinLargest(asked: number[], variants: Rows, family: Int32Array, size: Uint32Array, joined: Uint8Array): number[] {
  const alone: number[] = [];
  for (const i of asked) {
    let target = -1;
    for (let r = variants.start[i]!; r < variants.start[i + 1]!; r++) {
      const f = family[variants.items[r]!]!;
      if (size[f]! < 2) continue;
      if (target < 0 || size[f]! > size[target]! || (size[f] === size[target] && f < target)) target = f;
    }
    if (target >= 0) {
      family[i] = target;
      joined[i] = 1;
    } else alone.push(i);
  }
  return alone;
}

/** Step 2, second part: the phrases left alone are grouped with their lone variants (named by the earliest). */
function groupAlone(alone: number[], variants: Rows, family: Int32Array): void {
  const n = family.length;
  const lonely = new Uint8Array(n);
  for (const i of alone) lonely[i] = 1;
  // Union-find over phrase indices, each set named by its smallest.
  const parent = new Int32Array(n);
  for (const i of alone) parent[i] = i;
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]!]!;
      x = parent[x]!;
    }
    return x;
  };
  for (const i of alone) {
    for (let r = variants.start[i]!; r < variants.start[i + 1]!; r++) {
      const j = variants.items[r]!;
      if (!lonely[j]) continue;
      const a = find(i);
      const b = find(j);
      if (a !== b) parent[Math.max(a, b)] = Math.min(a, b);
    }
  }
  for (const i of alone) family[i] = find(i);
}

/** The keys of the asked phrases, and which asked phrases have each. */
interface AskedKeys {
  keys: TupleTable;
  /** Key → the asked phrase that is it; with it starred; with it as one word less. */
  whole: Rows;
  starred: Rows;
  less: Rows;
}

/**
 * The phrases at token edit distance 1 from each of the `asked` phrases (of 4
 * or more words), among all phrases of 4 or more words. Keys: the phrase with
 * one word starred (substitution) and the phrase less one word (deletion),
 * each kept only when the shared words hold a content word. Only the asked
 * phrases' keys are stored; every phrase then looks its own keys up.
 * Returns the variants of each asked phrase, ascending (a row per phrase).
 */
function variantIndex(set: PhraseSet, content: Uint8Array, asked: number[]): Rows {
  const keys = askedKeys(set, content, asked);
  const found = pairList(); // asked phrase → a variant
  lookUpKeys(set, content, keys, (owners, key, j) => {
    for (let r = owners.start[key]!; r < owners.start[key + 1]!; r++) found.push(owners.items[r]!, j);
  });
  return ascendingOnce(found.rows(set.count));
}

function askedKeys(set: PhraseSet, content: Uint8Array, asked: number[]): AskedKeys {
  const { types, typeStart } = set;
  const keys = tupleTable(asked.length * 12);
  const whole = pairList();
  const starred = pairList();
  const less = pairList();
  for (const i of asked) {
    const from = typeStart[i]!;
    const to = typeStart[i + 1]!;
    whole.push(keys.add(types, from, to), i);
    const words = contentWords(types, from, to, content);
    for (let s = from; s < to; s++) {
      // The shared words must hold a content word.
      if (words - content[types[s]!]! === 0) continue;
      starred.push(keys.add(types, from, to, s, 'star'), i);
      if (to - from >= 5) less.push(keys.add(types, from, to, s, 'omit'), i);
    }
  }
  return { keys, whole: whole.rows(keys.size), starred: starred.rows(keys.size), less: less.rows(keys.size) };
}

/**
 * Every phrase of 4 or more words looks up its keys among the asked ones
 * (hashed in one pass, and first tested against the table's filter in line,
 * as most were never added), and `report`s each row of owners it meets.
 */
function lookUpKeys(set: PhraseSet, content: Uint8Array, asked: AskedKeys, report: (owners: Rows, key: number, j: number) => void): void {
  const { count: n, types, typeStart } = set;
  const { keys, whole, starred, less } = asked;
  const { filter, filterShift } = keys;
  const hashes: GapHasher = gapHasher();
  const star = new Int32Array(longest(typeStart, n));
  const omit = new Int32Array(star.length);
  for (let j = 0; j < n; j++) {
    const from = typeStart[j]!;
    const to = typeStart[j + 1]!;
    if (to - from < 4) continue;
    const h = hashes(types, from, to, star, omit);
    // j is an asked phrase less one word.
    let bit = h >>> filterShift;
    if (filter[bit >>> 5]! & (1 << (bit & 31))) {
      const key = keys.findHashed(h, types, from, to);
      if (key >= 0) report(less, key, j);
    }
    const words = contentWords(types, from, to, content);
    for (let s = from; s < to; s++) {
      // The shared words must hold a content word (as for the asked phrases' keys).
      if (words - content[types[s]!]! === 0) continue;
      // j and an asked phrase differ in one word.
      bit = star[s - from]! >>> filterShift;
      if (filter[bit >>> 5]! & (1 << (bit & 31))) {
        const key = keys.findHashed(star[s - from]!, types, from, to, s, 'star');
        if (key >= 0) report(starred, key, j);
      }
      // An asked phrase is j less one word (never so for j of 4 words: its
      // lookups just fail, and the loop runs alike for every phrase).
      bit = omit[s - from]! >>> filterShift;
      if (filter[bit >>> 5]! & (1 << (bit & 31))) {
        const key = keys.findHashed(omit[s - from]!, types, from, to, s, 'omit');
        if (key >= 0) report(whole, key, j);
      }
    }
  }
}

/** The most words in a phrase. */
function longest(typeStart: Int32Array, n: number): number {
  let most = 0;
  for (let i = 0; i < n; i++) most = Math.max(most, typeStart[i + 1]! - typeStart[i]!);
  return most;
}

/** Each row ascending, once each, its own index left out. */
function ascendingOnce(rows: Rows): Rows {
  const { start, items } = rows;
  const n = start.length - 1;
  const out = new Int32Array(items.length);
  const outStart = new Int32Array(n + 1);
  let length = 0;
  for (let i = 0; i < n; i++) {
    outStart[i] = length;
    if (start[i] === start[i + 1]) continue;
    const row = items.subarray(start[i]!, start[i + 1]!).sort();
    for (let r = 0; r < row.length; r++) {
      const j = row[r]!;
      if (j !== i && (r === 0 || row[r - 1] !== j)) out[length++] = j;
    }
  }
  outStart[n] = length;
  return { start: outStart, items: out };
}

/** How many of `types[from…to)` are content words. */
function contentWords(types: Int32Array, from: number, to: number, content: Uint8Array): number {
  let words = 0;
  for (let s = from; s < to; s++) words += content[types[s]!]!;
  return words;
}
