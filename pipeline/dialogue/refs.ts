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
import { IRREGULAR_PASTS, looksPast, SPEECH_VERBS } from './verbs.ts';

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

/** Indefinite pronouns that stand for a person. common practice, no source. */
const INDEFINITES: ReadonlySet<string> = new Set(['someone', 'somebody', 'everyone', 'everybody', 'nobody', 'one', 'another']);

/** Ordinals that the adverb list also holds. common practice, no source. */
const ORDINALS: ReadonlySet<string> = new Set(['first', 'next', 'last', 'only']);

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
  'many', 'most', 'several', 'few', 'another', 'other', 'such', 'any', 'every', 'half', 'i',
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
      // An ordinal right after the article is part of the phrase: "the first fisherman", "the next man".
      if (PHRASE_STOPS.has(wj) || (isAdverb(v, cl[j]) && !(j === k + 1 && ORDINALS.has(wj))) || v.quoteOf[cl[j]] >= 0 || verbAt(v, cl, j)) break;
      j++;
    }
    // "someone said", "nobody answered": an indefinite pronoun is a description of its own.
    if (j === k + 1) return INDEFINITES.has(w) ? { kind: 'desc', text: surface(v, t), first: k, next: j } : null;
    return { kind: 'desc', text: cl.slice(k, j).map((x) => surface(v, x)).join(' '), first: k, next: j };
  }
  if (isCapitalised(v, t) && !NOT_NAMES.has(w)) return names(v, cl, k);
  return null;
}

/**
 * Whether clause position j holds the verb after a noun phrase rather than a
 * word of it: a speech verb or a common irregular past ("the boy answered",
 * "the maid came"), or an -ed form that ends the clause or comes before a
 * preposition or a pronoun ("the maid curtsied", "the old man smiled at her",
 * but not "the bearded man").
 */
function verbAt(v: TokenView, cl: readonly number[], j: number): boolean {
  const w = word(v, cl[j]);
  if (SPEECH_VERBS.has(w) || IRREGULAR_PASTS.has(w)) return true;
  if (!looksPast(w)) return false;
  if (j + 1 >= cl.length || cl[j + 1] !== cl[j] + 1) return true;
  const next = word(v, cl[j + 1]);
  return PHRASE_STOPS.has(next) || next in OBJECT_PRONOUNS || DETERMINERS.has(next) || isAdverb(v, cl[j + 1]);
}

/** Head words of a description that do not name one person (anaphora, groups, a voice). common practice, no source. */
const NOT_PERSONS: ReadonlySet<string> = new Set([
  'voice', 'voices', 'other', 'others', 'one', 'ones', 'former', 'latter', 'first', 'second', 'third', 'last', 'younger',
  'elder', 'older', 'eldest', 'youngest', 'rest', 'two', 'three', 'four', 'both', 'all', 'each', 'pair', 'couple',
  'company', 'crowd', 'group', 'party', 'same', 'stranger', 'newcomer', 'speaker', 'figure', 'shape', 'somebody',
  'someone', 'everybody', 'everyone', 'nobody', 'anyone', 'anybody', 'who', 'whole', 'room', 'house', 'table',
]);

/** Kin and close companions: "his mother", "her friend" may well be a cast member. common practice, no source. */
const RELATIONS: ReadonlySet<string> = new Set([
  'mother', 'father', 'brother', 'sister', 'son', 'daughter', 'wife', 'husband', 'uncle', 'aunt', 'cousin', 'niece',
  'nephew', 'grandmother', 'grandfather', 'granddaughter', 'grandson', 'parent', 'parents', 'child', 'children', 'friend',
  'companion', 'partner', 'lover', 'sweetheart', 'fiance', 'fiancé', 'fiancée', 'guardian', 'ward', 'mistress', 'master',
  'brother-in-law', 'sister-in-law', 'mother-in-law', 'father-in-law', 'stepmother', 'stepfather', 'twin', 'mamma', 'papa',
]);

/** Kin words that say who is meant is a woman or a man. common practice, no source. */
const KIN_SHE: ReadonlySet<string> = new Set(['mother', 'sister', 'daughter', 'wife', 'aunt', 'niece', 'grandmother', 'granddaughter', 'stepmother', 'mamma', 'mother-in-law', 'sister-in-law', 'fiancée', 'mistress']);
const KIN_HE: ReadonlySet<string> = new Set(['father', 'brother', 'son', 'husband', 'uncle', 'nephew', 'grandfather', 'grandson', 'stepfather', 'papa', 'father-in-law', 'brother-in-law', 'fiancé', 'master']);

/**
 * The pronoun a relation implies ("his mother" → she, "her brother" → he),
 * or null: a relation may be a cast member the plan has not given the alias,
 * but not one of the other pronoun.
 */
export function relationPronoun(r: Ref): 'he' | 'she' | null {
  if (r.kind !== 'desc') return null;
  const words = r.text.toLowerCase().split(/\s+/);
  if (words.length < 2 || !POSSESSIVES.has(words[0])) return null;
  const head = words[words.length - 1];
  return KIN_SHE.has(head) ? 'she' : KIN_HE.has(head) ? 'he' : null;
}

const ARTICLES: ReadonlySet<string> = new Set(['the', 'a', 'an', 'this', 'that', 'another', 'some', 'one', 'old', 'young', 'little', 'poor']);
const POSSESSIVES: ReadonlySet<string> = new Set(['his', 'her', 'their', 'my', 'our', 'your', 'its']);

/**
 * The description of someone outside the cast that a referring expression
 * gives, or null: a capitalised name the cast does not know ("Mrs
 * Threlkeld"), or a noun phrase led by an article ("the maid", "a boy", "the
 * old lady", "the second fisherman") or by a possessive before a word that is
 * not kin ("her neighbour"). Not: anaphora and groups ("the other", "the
 * younger", "both"), a voice, someone unnamed ("a stranger", "someone"), or
 * kin ("his mother": that may be a cast member the plan has not given the
 * alias). A sentence-initial article is lower-cased: "The maid" → "the maid".
 */
export function outsiderDescription(r: Ref): string | null {
  if (r.kind === 'outsider') return r.text;
  if (r.kind !== 'desc') return null;
  const words = r.text.split(/\s+/);
  if (words.length < 2) return null;
  const first = words[0].toLowerCase();
  const head = words[words.length - 1].toLowerCase().replace(/['\u2019]s$/u, '');
  if (!/^\p{L}[\p{L}'\u2019-]*$/u.test(words[words.length - 1]) || NOT_PERSONS.has(head)) return null;
  if (POSSESSIVES.has(first)) {
    if (RELATIONS.has(head)) return null;
  } else if (!ARTICLES.has(first)) return null;
  return [first, ...words.slice(1)].join(' ');
}

/** Head nouns that name a person. common practice, no source. */
const PERSON_HEADS: ReadonlySet<string> = new Set([
  'man', 'woman', 'men', 'women', 'boy', 'girl', 'lady', 'gentleman', 'child', 'lad', 'lass', 'fellow', 'chap', 'maid',
  'wife', 'widow', 'servant', 'landlord', 'landlady', 'doctor', 'nurse', 'clerk', 'porter', 'guard', 'driver', 'soldier',
  'sailor', 'officer', 'priest', 'vicar', 'parson', 'curate', 'farmer', 'keeper', 'miller', 'baker', 'butcher', 'smith',
  'constable', 'innkeeper', 'neighbour', 'neighbor', 'cook', 'butler', 'housekeeper', 'governess', 'king', 'queen',
  'prince', 'princess', 'duke', 'duchess', 'countess', 'baron', 'baroness', 'baby', 'youth', 'waiter', 'waitress',
  'peddler', 'pedlar', 'beggar', 'shepherd', 'carter', 'carrier', 'groom', 'bride', 'judge', 'magistrate', 'sergeant',
  'captain', 'mate', 'pilot', 'bargee', 'boatman', 'gardener', 'schoolmaster', 'schoolmistress', 'teacher', 'clergyman',
  'pupil', 'student', 'customer', 'visitor', 'guest', 'host', 'hostess', 'messenger', 'tailor', 'grocer', 'shopkeeper',
  'villager', 'passenger', 'traveller', 'traveler', 'labourer', 'laborer', 'workman', 'merchant', 'hawker', 'seller',
]);

/**
 * Whether a description outside the cast names a person, for the narrative
 * around the dialogue (in a tag every subject of a speech verb is taken for a
 * person): a head noun from a short list of people or ending in one
 * (fisherman, milkmaid, schoolgirl), or one the text itself uses as a speaker
 * (`speaking`: heads of descriptions in the text's tags).
 */
export function namesPerson(description: string, speaking: ReadonlySet<string> = new Set()): boolean {
  const head = description.split(/\s+/).at(-1)!.toLowerCase().replace(/['\u2019]s$/u, '');
  if (PERSON_HEADS.has(head) || speaking.has(head)) return true;
  return /(?:man|woman|men|women|maid|boy|girl|wife|lady)$/.test(head) && head.length > 4;
}

/** Person nouns that re-describe someone already met rather than name a role: "the old man", "the girl". common practice, no source. */
const GENERIC_PERSONS: ReadonlySet<string> = new Set([
  'man', 'woman', 'men', 'women', 'boy', 'girl', 'lady', 'gentleman', 'fellow', 'child', 'lad', 'lass', 'youth', 'chap',
  'person', 'people', 'baby', 'infant', 'creature', 'soul', 'visitor', 'guest',
]);

/**
 * Whether a description outside the cast may be an epithet for someone
 * already on stage: a definite article before a generic person noun ("the
 * old man", "the girl"), as narrators re-describe their characters. An
 * indefinite description ("a boy", "an old woman") brings someone new in, and
 * a role ("the maid", "the postman", "the second fisherman") names a person
 * by what they do: those are not epithets.
 */
export function mayBeEpithet(description: string): boolean {
  const words = description.toLowerCase().split(/\s+/);
  return (words[0] === 'the' || words[0] === 'this' || words[0] === 'that') && GENERIC_PERSONS.has(words[words.length - 1]);
}

/** A run of capitalised words: an outsider's name, unless a cast mention starts inside it. */
function names(v: TokenView, cl: readonly number[], k: number): Ref {
  let j = k + 1;
  while (j < cl.length && j <= k + 3 && cl[j] === cl[j - 1] + 1 && /^\.?\s+$/.test(gapBetween(v, cl[j - 1], cl[j])) && isCapitalised(v, cl[j])) {
    const inner = mentionAt(v, cl, j);
    if (inner) return { ...inner, first: k };
    j++;
  }
  const text = cl.slice(k, j).map((x) => surface(v, x)).join(' ');
  // "Mr Quist's exhibition": a possessive speaks of the person; it names no one acting.
  if (possessive(v, cl[j - 1])) return { kind: 'desc', text, first: k, next: j };
  return { kind: 'outsider', text, first: k, next: j };
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
  if (g === 'i') return own === 'i'; // the first-person narrator
  if (g === 'he' || g === 'she') return own === undefined || own === g;
  if (g === 'they') return own === 'they';
  if (g === 'it') return own === 'it';
  return false;
}
