/**
 * Referring expressions in narrative: who a noun phrase at a given word names.
 *
 *   - a cast mention (name, alias, derived first name or surname, from the
 *     text model's mentions), with or without a title before it;
 *   - an ambiguous mention (a form two cast members share);
 *   - a pronoun (he, she, they, it, I, we; him, her, them as objects);
 *   - a descriptive phrase outside the cast ("the old man", "her father"), or
 *     a possessive name ("Ada's father");
 *   - a capitalised name outside the cast (an outsider).
 */

import { gapBetween, isCapitalised, surface, word, type TokenView } from './view.ts';

export type Gender = 'he' | 'she' | 'they' | 'it' | 'i' | 'we' | 'you';

export type Ref =
  | { kind: 'cast'; member: number; first: number; next: number }
  | { kind: 'ambiguous'; candidates: number[]; first: number; next: number }
  | { kind: 'pronoun'; gender: Gender; first: number; next: number }
  | { kind: 'desc'; text: string; first: number; next: number }
  | { kind: 'outsider'; text: string; first: number; next: number };

/** Title words that may stand before a name. common practice, no source. */
export const TITLES: ReadonlySet<string> = new Set([
  'mr', 'mrs', 'miss', 'ms', 'mx', 'dr', 'doctor', 'captain', 'capt', 'sir', 'lady', 'lord', 'madam', 'madame',
  'master', 'mistress', 'professor', 'prof', 'rev', 'reverend', 'father', 'mother', 'sister', 'brother', 'aunt',
  'uncle', 'cousin', 'dame', 'granny', 'grandfather', 'grandmother', 'old', 'young', 'little', 'big', 'poor', 'dear',
]);

const SUBJECT_PRONOUNS: Record<string, Gender> = { he: 'he', she: 'she', they: 'they', it: 'it', i: 'i', we: 'we', you: 'you' };
const OBJECT_PRONOUNS: Record<string, Gender> = { him: 'he', her: 'she', them: 'they', it: 'it', me: 'i', us: 'we', you: 'you' };

/** Words that open a descriptive noun phrase. common practice, no source. */
const DETERMINERS: ReadonlySet<string> = new Set([
  'the', 'a', 'an', 'his', 'her', 'their', 'my', 'our', 'your', 'its', 'this', 'that', 'old', 'young', 'little',
  'poor', 'another', 'both', 'all', 'each', 'somebody', 'someone', 'everyone', 'everybody', 'nobody', 'one',
]);

/** Words that end a descriptive noun phrase. common practice, no source. */
const PHRASE_STOPS: ReadonlySet<string> = new Set([
  'to', 'with', 'from', 'at', 'in', 'on', 'of', 'by', 'for', 'into', 'over', 'under', 'behind', 'beside', 'and',
  'but', 'or', 'who', 'which', 'that', 'as', 'then', 'again', 'had', 'was', 'were', 'is', 'did', 'would', 'could',
  'not', 'never', 'still', 'now', 'too', 'also', 'once', 'across', 'through', 'after', 'before', 'without',
]);

/** Capitalised words that are not names (sentence openers). common practice, no source. */
export const NOT_NAMES: ReadonlySet<string> = new Set([
  'the', 'a', 'an', 'then', 'but', 'and', 'so', 'yet', 'now', 'here', 'there', 'when', 'while', 'as', 'at', 'in',
  'on', 'with', 'after', 'before', 'for', 'if', 'oh', 'o', 'ah', 'well', 'still', 'again', 'all', 'both', 'everyone',
  'everybody', 'someone', 'somebody', 'nobody', 'no', 'one', 'each', 'this', 'that', 'these', 'those', 'his', 'her',
  'their', 'my', 'our', 'your', 'its', 'it', 'what', 'who', 'how', 'why', 'where', 'yes', 'nay', 'not', 'only',
  'even', 'just', 'perhaps', 'instead', 'meanwhile', 'outside', 'inside', 'above', 'below', 'behind', 'beyond',
  'across', 'down', 'up', 'over', 'under', 'through', 'from', 'to', 'by', 'of', 'once', 'twice', 'later', 'soon',
  'never', 'always', 'sometimes', 'none', 'neither', 'either', 'nothing', 'silence', 'somewhere', 'presently',
  'afterwards', 'long', 'at', 'without', 'though', 'although', 'because', 'since', 'until', 'unless', 'some',
  'many', 'most', 'several', 'few', 'another', 'other', 'such', 'any', 'every', 'half',
]);

/** Words that may stand between a subject and its verb, or before a clause's subject. common practice, no source. */
const ADVERBS: ReadonlySet<string> = new Set([
  'then', 'again', 'aloud', 'now', 'still', 'too', 'also', 'once', 'soon', 'instead', 'meanwhile', 'presently',
  'suddenly', 'only', 'just', 'even', 'yet', 'afterwards', 'later', 'first', 'next', 'finally', 'quietly',
]);
const NOT_ADVERBS: ReadonlySet<string> = new Set(['reply', 'supply', 'apply', 'rely', 'ally', 'belly', 'holly', 'folly', 'jelly', 'bully', 'lily', 'family', 'fly', 'july', 'italy']);

/** Connectives that may open a clause before its subject. common practice, no source. */
const LEADS: ReadonlySet<string> = new Set(['and', 'but', 'so', 'then', 'now', 'here', 'there', 'yet', 'still', 'again', 'instead', 'thus', 'meanwhile', 'presently']);
const AT_PHRASES: ReadonlySet<string> = new Set(['last', 'once', 'length', 'first', 'this', 'that']);
const PREPOSITIONS: ReadonlySet<string> = new Set(['with', 'after', 'before', 'for', 'in', 'on', 'at', 'without', 'from', 'over', 'under', 'by', 'as', 'when', 'while', 'having']);

export function isAdverb(v: TokenView, t: number): boolean {
  const w = word(v, t);
  if (ADVERBS.has(w)) return true;
  return w.length >= 5 && w.endsWith('ly') && !NOT_ADVERBS.has(w) && !isCapitalised(v, t);
}

/** Skip adverbs (and "at last", "at once") from position k of the clause; at most `max` words. */
export function skipAdverbs(v: TokenView, cl: readonly number[], k: number, max = 2): number {
  let n = 0;
  while (k < cl.length && n < max) {
    if (word(v, cl[k]) === 'at' && k + 1 < cl.length && AT_PHRASES.has(word(v, cl[k + 1]))) {
      k += 2;
    } else if (isAdverb(v, cl[k])) {
      k += 1;
    } else break;
    n++;
  }
  return k;
}

/**
 * The position where a clause's subject should stand: past connectives and
 * adverbs ("Then", "At last", "Presently") and past an opening phrase that
 * ends with a comma ("With a sigh, Ada…").
 */
export function subjectStart(v: TokenView, cl: readonly number[]): number {
  let k = 0;
  for (let n = 0; n < 4 && k < cl.length; n++) {
    const w = word(v, cl[k]);
    if (LEADS.has(w)) k++;
    else {
      const s = skipAdverbs(v, cl, k, 1);
      if (s === k) break;
      k = s;
    }
  }
  if (k < cl.length && PREPOSITIONS.has(word(v, cl[k]))) {
    for (let j = k + 1; j < Math.min(cl.length, k + 8); j++) {
      if (/,/.test(gapBetween(v, cl[j - 1], cl[j]))) return j;
    }
  }
  return k;
}

function possessive(v: TokenView, t: number): boolean {
  return /['\u2019]s$/u.test(surface(v, t)) || /s['\u2019]$/u.test(v.text.slice(v.model.tokens.start[t], v.model.tokens.end[t] + 1));
}

/** A mention starting at clause position k, or null. */
function mentionAt(v: TokenView, cl: readonly number[], k: number): Ref | null {
  const t = cl[k];
  const m = v.mention[t];
  if (m >= 0) {
    const len = v.mentionLength[t];
    const last = cl[Math.min(cl.length - 1, k + len - 1)];
    if (possessive(v, last)) return { kind: 'desc', text: surface(v, t), first: k, next: k + len };
    return { kind: 'cast', member: m, first: k, next: k + len };
  }
  const a = v.ambiguous.get(t);
  if (a) {
    const last = cl[Math.min(cl.length - 1, k + a.length - 1)];
    if (possessive(v, last)) return { kind: 'desc', text: surface(v, t), first: k, next: k + a.length };
    return { kind: 'ambiguous', candidates: a.candidates, first: k, next: k + a.length };
  }
  return null;
}

function tight(v: TokenView, cl: readonly number[], k: number): boolean {
  return k + 1 < cl.length && cl[k + 1] === cl[k] + 1 && /^\.?\s+$/.test(gapBetween(v, cl[k], cl[k + 1]));
}

/** The referring expression starting at clause position k, as a subject or as an object. */
export function refAt(v: TokenView, cl: readonly number[], k: number, role: 'subject' | 'object'): Ref | null {
  if (k >= cl.length) return null;
  const t = cl[k];
  const w = word(v, t);
  const m = mentionAt(v, cl, k);
  if (m) return m;
  if (TITLES.has(w) && tight(v, cl, k)) {
    const m2 = mentionAt(v, cl, k + 1);
    if (m2) return { ...m2, first: k };
    if (isCapitalised(v, cl[k + 1]) && isCapitalised(v, t)) return names(v, cl, k);
  }
  if (role === 'subject' && w in SUBJECT_PRONOUNS && (w !== 'i' || surface(v, t) === 'I')) {
    return { kind: 'pronoun', gender: SUBJECT_PRONOUNS[w], first: k, next: k + 1 };
  }
  if (role === 'object' && w in OBJECT_PRONOUNS) {
    const nounFollows = w === 'her' && tight(v, cl, k) && !PHRASE_STOPS.has(word(v, cl[k + 1])) && !isAdverb(v, cl[k + 1]);
    if (!nounFollows) return { kind: 'pronoun', gender: OBJECT_PRONOUNS[w], first: k, next: k + 1 };
  }
  if (DETERMINERS.has(w) && !(isCapitalised(v, t) && !NOT_NAMES.has(w))) {
    let j = k + 1;
    while (j < cl.length && j <= k + 4 && cl[j] === cl[j - 1] + 1 && /^\s+$/.test(gapBetween(v, cl[j - 1], cl[j]))) {
      const inner = mentionAt(v, cl, j);
      if (inner) return inner.kind === 'desc' ? { ...inner, first: k } : { ...inner, first: k };
      const wj = word(v, cl[j]);
      if (PHRASE_STOPS.has(wj) || isAdverb(v, cl[j]) || v.quoteOf[cl[j]] >= 0) break;
      j++;
    }
    if (j === k + 1) return null;
    return { kind: 'desc', text: cl.slice(k, j).map((x) => surface(v, x)).join(' '), first: k, next: j };
  }
  if (isCapitalised(v, t) && !NOT_NAMES.has(w)) return names(v, cl, k);
  return null;
}

/** A run of capitalised words: an outsider's name, unless a cast mention starts inside it. */
function names(v: TokenView, cl: readonly number[], k: number): Ref {
  let j = k + 1;
  while (j < cl.length && j <= k + 3 && cl[j] === cl[j - 1] + 1 && /^\.?\s+$/.test(gapBetween(v, cl[j - 1], cl[j])) && isCapitalised(v, cl[j])) {
    const inner = mentionAt(v, cl, j);
    if (inner) return { ...inner, first: k };
    j++;
  }
  return { kind: 'outsider', text: cl.slice(k, j).map((x) => surface(v, x)).join(' '), first: k, next: j };
}

/** Whether two referring expressions in one paragraph could name the same person. */
export function sameReferent(a: Ref, b: Ref, genderOf: (member: number) => string | undefined): boolean {
  if (a.kind === 'desc' || b.kind === 'desc') return true;
  if (a.kind === 'cast' && b.kind === 'cast') return a.member === b.member;
  if (a.kind === 'outsider' && b.kind === 'outsider') return a.text === b.text;
  if (a.kind === 'pronoun' && b.kind === 'pronoun') return a.gender === b.gender;
  if (a.kind === 'cast' && b.kind === 'pronoun') return fitsGender(genderOf(a.member), b.gender);
  if (a.kind === 'pronoun' && b.kind === 'cast') return fitsGender(genderOf(b.member), a.gender);
  if (a.kind === 'ambiguous' && b.kind === 'cast') return a.candidates.includes(b.member);
  if (a.kind === 'cast' && b.kind === 'ambiguous') return b.candidates.includes(a.member);
  if (a.kind === 'ambiguous' && b.kind === 'ambiguous') return a.candidates.some((c) => b.candidates.includes(c));
  if (a.kind === 'ambiguous' && b.kind === 'pronoun') return true;
  if (a.kind === 'pronoun' && b.kind === 'ambiguous') return true;
  return false;
}

/** Whether a cast member with pronoun `own` can be referred to as `g`. */
export function fitsGender(own: string | undefined, g: Gender): boolean {
  if (g === 'he' || g === 'she') return own === undefined || own === g;
  if (g === 'they') return own === 'they';
  if (g === 'it') return own === 'it';
  return false;
}
