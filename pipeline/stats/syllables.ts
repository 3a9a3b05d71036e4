/**
 * An English syllable counter made of spelling rules: vowel groups, with
 * adjustments for silent final e, syllabic -le/-re, -ed and -es endings,
 * y as a consonant or a vowel, vowel pairs spoken as two syllables (hiatus),
 * compounds and suffixes after a silent e, and a short list of exceptions.
 * It estimates; readability formulas were fitted to hand counts that were
 * estimates too. Counts are meant to be computed once per vocabulary type.
 */

/** Words the rules get wrong, with their syllable count in a standard dictionary's division. */
const EXCEPTIONS: Record<string, number> = {
  aches: 1,
  apostrophe: 4,
  area: 3,
  areas: 3,
  beloved: 3,
  business: 2,
  businesses: 3,
  cashier: 2,
  catastrophe: 4,
  chandelier: 3,
  coyote: 3,
  crooked: 2,
  dogged: 2,
  element: 3,
  elements: 3,
  epitome: 4,
  evening: 2,
  evenings: 2,
  every: 2,
  familiar: 3,
  finale: 3,
  frontier: 2,
  frontiers: 2,
  glacier: 2,
  headaches: 2,
  hyperbole: 4,
  idea: 3,
  ideal: 3,
  ideals: 3,
  ideas: 3,
  isle: 1,
  aisle: 1,
  jagged: 2,
  jeopardy: 3,
  karate: 3,
  leopard: 2,
  maybe: 2,
  moreover: 3,
  naive: 2,
  naked: 2,
  nevertheless: 4,
  oasis: 3,
  ocean: 2,
  peculiar: 3,
  people: 2,
  peoples: 2,
  persuade: 2,
  persuaded: 3,
  pharaoh: 2,
  premier: 2,
  psyche: 2,
  ragged: 2,
  react: 2,
  reaction: 3,
  reality: 4,
  realise: 3,
  realised: 3,
  realize: 3,
  realized: 3,
  recipe: 3,
  rugged: 2,
  science: 2,
  scientist: 3,
  scientists: 3,
  sesame: 3,
  simile: 3,
  society: 4,
  soldier: 2,
  soldiers: 2,
  suave: 1,
  tenement: 3,
  tenements: 3,
  theatre: 3,
  theater: 3,
  vehement: 3,
  wednesday: 2,
  wednesdays: 2,
  wicked: 2,
  wretched: 2,
  yeoman: 2,
  yeomen: 2,
};

/** Second halves of compounds whose first half ends in a silent e or would merge vowels ("someone", "therefore"). */
const TAILS = [
  'where',
  'times',
  'time',
  'thing',
  'things',
  'stone',
  'house',
  'place',
  'shore',
  'some',
  'fore',
  'like',
  'wise',
  'side',
  'line',
  'come',
  'life',
  'made',
  'ware',
  'fire',
  'tide',
  'body',
  'ones',
  'one',
];

/** First halves of compounds that end in a silent e ("somebody", "homeward", "lifeboat"). */
const HEADS = [
  'every',
  'fore',
  'some',
  'fire',
  'home',
  'life',
  'time',
  'grave',
  'whole',
  'stone',
  'tide',
  'shore',
  'house',
  'care',
  'hope',
  'love',
  'name',
  'safe',
  'lone',
  'wide',
  'side',
  'base',
  'eye',
  'use',
];

/** "there-" and "where-" join only these ("therefore", "whereupon"). */
const THERE_TAILS = new Set(['in', 'of', 'on', 'by', 'upon', 'after', 'as', 'fore', 'with', 'unto', 'under', 'to', 'at', 'abouts']);

/** Suffixes after which a stem's final e stays silent ("lovely", "movement", "hopeful"). */
const SUFFIXES = ['lessness', 'lessly', 'ments', 'fully', 'ment', 'ness', 'less', 'ful', 'ly'];

/** Vowel pairs spoken as two syllables; each match adds one. */
const HIATUS: RegExp[] = [
  /(?<![cgstx]|[cs]h|ll|n)i(?=o)/g, // lion, period, curious — not nation, vision, million, union
  /(?<![cgst]|[cs]h|ll|rr)i(?=a)/g, // dial, trial, media — not social, initial, marriage
  /(?<=g)i(?=ants?$)/g, // giant
  /(?<!e)i(?=u)/g, // medium, radius
  /(?<![ct])i(?=et)/g, // quiet, diet, variety — not ancient
  /(?<![cts])i(?=en[ct])/g, // client, experience — not patient, ancient
  /(?<=^al)i(?=ens?$)/g, // alien
  /(?<=[ct])i(?=at)/g, // associate, initiate
  /(?<=[^aeiouy])(?<!^[^aeiouy])i(?=ers?$)/g, // happier, brier — not pier, tier
  /(?<=[^aeiouy])i(?=est$)/g, // happiest, liest
  /(?<![cg]|ch|ght)e(?=o)/g, // video, theory, hideous — not pigeon, gorgeous, luncheon, righteous
  /(?<![qg])u(?=a)/g, // actual, usual — not guard, language
  /(?<![qg])u(?=e[lnt])/g, // cruel, fluent, duet — not guest
  /(?<=cr)e(?=at(?!ure|h))/g, // create, creative — not creature
  /(?<!q)u(?=ou)/g, // continuous, ambiguous
  /(?<![qg])u(?=i(?:ns?$|ds?$|ne$|ty|ties))/g, // ruin, fluid, genuine, annuity
  /o(?=e[mt])/g, // poem, poet
  /(?<=[dg])o(?=ers?$)/g, // doer, goer
  /e(?=ums?$)/g, // museum
  /e(?=i(?:ty|st|sm))/g, // deity, atheist
  /a(?=o)/g, // chaos
  /[ao](?=ic$)/g, // mosaic, heroic
];

/** All the hiatus patterns in one expression (they match single letters and never the same one). */
const ANY_HIATUS = new RegExp(HIATUS.map((r) => `(?:${r.source})`).join('|'), 'g');
const VOWEL_PAIR = /[aeiou]{2}/;

/** Letters as vowel (1) or consonant (0), with y and the u of "qu" decided by context. */
function vowelMask(w: string): Uint8Array {
  const n = w.length;
  const v = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const c = w[i]!;
    if (c === 'a' || c === 'e' || c === 'i' || c === 'o') v[i] = 1;
    else if (c === 'u') v[i] = i > 0 && w[i - 1] === 'q' ? 0 : 1;
  }
  for (let i = 0; i < n; i++) {
    if (w[i] !== 'y') continue;
    const before = i > 0 ? v[i - 1] === 1 : false;
    const after = i + 1 < n ? v[i + 1] === 1 : false;
    // y starts a word ("yes"), or sits between two vowels ("player", "loyal"): a consonant.
    v[i] = i === 0 || (before && after) ? 0 : 1;
  }
  return v;
}

/** Whether `rest` can follow a compound's first half `head`: it starts with a consonant and has a vowel ("some|body", "fore|runner"; not "home|r", "fore|ver"). */
function joinsHead(head: string, rest: string): boolean {
  const c = rest[0];
  if (!isConsonant(c) || !/[aeiouy]/.test(rest)) return false;
  if (head === 'fore') return c !== 'v';
  return c !== 'r';
}

function isConsonant(c: string | undefined): boolean {
  return c !== undefined && c >= 'a' && c <= 'z' && !'aeiouy'.includes(c);
}

/** Whether w ends in a syllabic -le or -re (+ s or d) after the consonant at index k: "table", "centre", "troubled". */
function syllabicEnding(w: string, k: number): boolean {
  const liquid = w[k];
  const before = w[k - 1];
  if (liquid === 'l') return isConsonant(before) && before !== 'l' && before !== 'r' && before !== 'w';
  if (liquid === 'r') return isConsonant(before) && before !== 'r' && before !== 'w';
  return false;
}

/** Syllables of a word made of the letters a–z only. */
function countLetters(w: string, accentedE: boolean): number {
  const n = w.length;
  if (n === 0) return 0;
  const known = EXCEPTIONS[w];
  if (known !== undefined) return known;
  if (w.endsWith('s') && EXCEPTIONS[w.slice(0, -1)] !== undefined && !w.endsWith('ss')) return EXCEPTIONS[w.slice(0, -1)]!;

  for (const tail of TAILS) {
    if (w.length > tail.length + 2 && w.endsWith(tail)) {
      const rest = w.slice(0, -tail.length);
      if (/[aeiouy]/.test(rest)) return countLetters(rest, false) + countLetters(tail, false);
    }
  }
  for (const head of HEADS) {
    if (w.length > head.length + 1 && w.startsWith(head)) {
      const rest = w.slice(head.length);
      if (joinsHead(head, rest)) return countLetters(head, false) + countLetters(rest, false);
    }
  }
  for (const head of ['there', 'where']) {
    if (w.startsWith(head) && THERE_TAILS.has(w.slice(head.length))) return 1 + countLetters(w.slice(head.length), false);
  }
  for (const suffix of SUFFIXES) {
    if (w.length >= suffix.length + 3 && w.endsWith(suffix)) {
      const stem = w.slice(0, -suffix.length);
      if (stem.endsWith('e') && !stem.endsWith('ee')) return countLetters(stem, false) + countLetters(suffix, false);
    }
  }

  const v = vowelMask(w);
  let groups = 0;
  for (let i = 0; i < n; i++) if (v[i] && (i === 0 || !v[i - 1])) groups++;
  if (VOWEL_PAIR.test(w)) {
    ANY_HIATUS.lastIndex = 0;
    while (ANY_HIATUS.exec(w)) groups++;
  }
  if (w.startsWith('geo') && !w.startsWith('georg')) groups++;

  const last = n - 1;
  // Silent final e: "make", "there" — but "table", "centre", "café", and "the" (one group) keep theirs.
  if (w[last] === 'e' && groups > 1 && !v[last - 1] && !accentedE && !syllabicEnding(w, last - 1)) groups--;
  // -ed is a syllable only after t or d: "wanted", but "walked", "loved".
  else if (n > 3 && w.endsWith('ed') && groups > 1 && !v[n - 3] && w[n - 3] !== 't' && w[n - 3] !== 'd' && !syllabicEnding(w, n - 3)) groups--;
  // -es is a syllable after a sibilant: "horses", "judges", "wishes", but "makes", "clothes".
  else if (n > 3 && w.endsWith('es') && groups > 1 && !v[n - 3] && !sibilantBeforeEs(w) && !syllabicEnding(w, n - 3)) groups--;
  // -gue after a vowel or n: "league", "tongue", but "argue" (-que is a silent e after the consonant "qu").
  if (/[aeioun]gues?$/.test(w) && groups > 1) groups--;
  // -ing after a vowel letter makes its own syllable: "going", "being", "flying".
  if (/ings?$/.test(w)) {
    const k = w.endsWith('s') ? n - 5 : n - 4;
    if (k >= 0 && v[k]) groups++;
  }
  // A final -sm or -thm is syllabic: "prism", "chasm", "rhythm".
  if (/(?:sm|thm)s?$/.test(w)) groups++;
  return Math.max(1, groups);
}

function sibilantBeforeEs(w: string): boolean {
  const c = w[w.length - 3];
  if (c === 's' || c === 'x' || c === 'z' || c === 'c' || c === 'g') return true;
  return c === 'h' && (w[w.length - 4] === 'c' || w[w.length - 4] === 's');
}

/**
 * Syllables in one English word token. Hyphenated words count each part;
 * apostrophes are dropped, and a consonant before "n't" adds one ("isn't" 2,
 * "don't" 1); letters with accents count as the bare letter, except a final
 * "é" which is spoken ("café" 2). A token without letters (a numeral) counts
 * one syllable per digit, an approximation of its spoken form. Never less
 * than 1 for a non-empty token.
 */
export function countSyllables(word: string): number {
  const lower = word.toLowerCase().replace(/[\u2019\u2018]/g, "'");
  if (/[-\u2010\u2011]/.test(lower)) {
    let sum = 0;
    for (const part of lower.split(/[-\u2010\u2011]+/)) if (part) sum += countSyllables(part);
    return Math.max(sum, lower.trim() ? 1 : 0);
  }
  const accentedE = /é$/.test(lower);
  let bare = /^[\x00-\x7f]*$/.test(lower) ? lower : lower.normalize('NFD').replace(/\p{M}/gu, '');
  let extra = 0;
  const nt = /([a-z]?)n't$/.exec(bare);
  if (nt) {
    bare = bare.slice(0, -3);
    if (isConsonant(nt[1]) && nt[1] !== 'y') extra = 1;
  }
  const letters = bare.replace(/[^a-z]/g, '');
  if (!letters) {
    const digits = bare.replace(/[^0-9]/g, '').length;
    return digits || (bare.trim() ? 1 : 0);
  }
  // "couldnt", "isnt": a contraction written without its apostrophe.
  if (!nt && /(?:[dsz]|st)nt$/.test(letters)) extra = 1;
  return countLetters(letters, accentedE) + extra;
}

/** Syllables of every vocabulary type, computed once per type (index = type id). */
export function syllablesPerType(vocab: readonly string[]): Uint8Array {
  const out = new Uint8Array(vocab.length);
  for (let t = 0; t < vocab.length; t++) out[t] = Math.min(255, countSyllables(vocab[t]!));
  return out;
}
