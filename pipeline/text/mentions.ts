/**
 * Cast mentions: where the text names a cast member.
 *
 * Each member is named by its `name`, its `aliases` (explicit forms) and, when
 * the name has two or more words, its first name and surname (derived forms;
 * leading titles such as "Mrs." and initials are skipped). Forms are matched
 * on whole word tokens within one sentence, longest first. A word written
 * with a capital matches case-sensitively; a lower-case word matches in any
 * case ("the miller" also matches "The miller", "the Captain" also "The
 * Captain" but not "the captain"). The gaps between words must be the same as
 * in the form, up to white space. A possessive "'s" on the last word still
 * matches ("Ada's").
 *
 * A form that belongs to two or more members is ambiguous and reported, not
 * attributed; explicit forms take precedence over derived ones. A title just
 * before the form narrows the candidates by pronoun: Mr/Sir/Lord → he;
 * Mrs/Miss/Ms/Madam/Mme/Mlle/Lady/Dame → she (members without a pronoun, or
 * with "they", fit either). One fitting candidate is attributed; none means
 * the text names someone outside the cast and nothing is recorded.
 */

import type { AmbiguousMention, CastMember, Mentions, TextModel } from './model.ts';
import { u32Buffer, u8Buffer } from './columns.ts';
import { tokenise, vocabForm } from './tokens.ts';

/** Titles that mark a man. common practice, no source. */
export const HE_TITLES: ReadonlySet<string> = new Set(['Mr', 'Sir', 'Lord']);
/** Titles that mark a woman. common practice, no source. */
export const SHE_TITLES: ReadonlySet<string> = new Set(['Mrs', 'Miss', 'Ms', 'Madam', 'Mme', 'Mlle', 'Lady', 'Dame']);
const ALL_TITLES = new Set(['Mr', 'Mrs', 'Ms', 'Miss', 'Messrs', 'Madam', 'Mme', 'Mlle', 'Dr', 'Prof', 'Rev', 'Capt', 'Col', 'Gen', 'Lt', 'Sgt', 'Sir', 'Lord', 'Lady', 'Dame', 'Master', 'Mistress']);

interface Form {
  /** Surface words, apostrophes as ASCII. */
  words: string[];
  /** Vocabulary forms of the words. */
  lower: string[];
  /** Text between consecutive words, white space collapsed to one space. */
  gaps: string[];
  /** Per word: written with a capital, so matched case-sensitively. */
  exact: boolean[];
  key: string;
}

interface Entry {
  form: Form;
  /** Index of the form in `Mentions.forms`. */
  index: number;
  /** Member indices that may be meant: explicit owners, else derived owners. */
  members: number[];
  /** vocab type of each word, -1 when the text never has it. */
  types: number[];
}

const collapse = (s: string): string => s.replace(/\s+/g, ' ');
const ascii = (s: string): string => s.replace(/\u2019/g, "'");
const stripPossessive = (s: string): string => s.replace(/['\u2019]s$/u, '');

/** The key under which `findMentions` records a name or alias (see `Mentions.forms`), or null when it has no word. */
export function formKey(s: string): string | null {
  return makeForm(s)?.key ?? null;
}

function makeForm(s: string): Form | null {
  const spans = tokenise(s);
  if (spans.length === 0 || spans.length > 255) return null; // mention lengths are stored in a byte
  const words = spans.map((t) => ascii(s.slice(t.start, t.end)));
  const gaps = spans.slice(1).map((t, k) => collapse(s.slice(spans[k].end, t.start)));
  const exact = words.map((w) => /^[\p{Lu}\p{Lt}]/u.test(w));
  const lower = words.map(vocabForm);
  const key = words.map((w, k) => (k > 0 ? gaps[k - 1] : '') + (exact[k] ? w : `~${lower[k]}`)).join('\u0000');
  return { words, lower, gaps, exact, key };
}

/** First name and surname of a member, skipping leading titles and initials. */
export function derivedNames(name: string): string[] {
  const words = name.trim().split(/\s+/).filter((w) => w.length > 0);
  let i = 0;
  while (i < words.length - 1 && ALL_TITLES.has(words[i].replace(/\.$/, ''))) i++;
  const rest = words.slice(i);
  const out: string[] = [];
  if (rest.length >= 2) {
    const first = rest.find((w) => !/^\p{L}\.$/u.test(w) && !/^(?:\p{L}\.)+$/u.test(w));
    if (first !== undefined && first !== rest[rest.length - 1]) out.push(first);
    out.push(rest[rest.length - 1]);
  } else if (i > 0 && rest.length === 1) {
    out.push(rest[0]); // "Mrs. Orme" → "Orme"
  }
  return out;
}

interface Owners {
  form: Form;
  explicit: Set<number>;
  derived: Set<number>;
}

/** Every distinct form, with the members that own it explicitly and by derivation. */
function buildOwners(cast: CastMember[]): Map<string, Owners> {
  const owners = new Map<string, Owners>();
  const add = (s: string, member: number, explicit: boolean): void => {
    const form = makeForm(s);
    if (!form) return;
    let o = owners.get(form.key);
    if (!o) {
      o = { form, explicit: new Set(), derived: new Set() };
      owners.set(form.key, o);
    }
    (explicit ? o.explicit : o.derived).add(member);
  };
  cast.forEach((m, i) => {
    add(m.name, i, true);
    for (const a of m.aliases) add(a, i, true);
    for (const d of derivedNames(m.name)) add(d, i, false);
  });
  return owners;
}

function fits(member: CastMember, gender: 'he' | 'she'): boolean {
  return member.pronoun === undefined || member.pronoun === 'they' || member.pronoun === gender;
}

export function findMentions(model: TextModel, cast: CastMember[]): Mentions {
  const { tokens, text, vocab } = model;
  const typeOf = new Map<string, number>();
  vocab.forEach((v, i) => typeOf.set(v, i));

  // Candidates per vocabulary type of the first word, longest forms first.
  // A one-word form is also listed under its possessive ("ada's").
  const byType: Array<Entry[] | undefined> = new Array(vocab.length);
  const forms: string[] = [];
  for (const o of buildOwners(cast).values()) {
    const form = o.form;
    const entry: Entry = {
      form,
      index: forms.push(form.key) - 1,
      members: [...(o.explicit.size > 0 ? o.explicit : o.derived)].sort((x, y) => x - y),
      types: form.lower.map((w) => typeOf.get(w) ?? -1),
    };
    const keys = [entry.types[0]];
    if (form.words.length === 1) keys.push(typeOf.get(`${form.lower[0]}'s`) ?? -1);
    for (const t of keys) if (t >= 0) (byType[t] ??= []).push(entry);
  }
  byType.forEach((l) => l?.sort((x, y) => y.form.words.length - x.form.words.length));

  const surface = (i: number): string => ascii(text.slice(tokens.start[i], tokens.end[i]));
  const wordMatches = (e: Entry, k: number, i: number): boolean => {
    if (k < e.form.words.length - 1) {
      return tokens.type[i] === e.types[k] && (!e.form.exact[k] || surface(i) === e.form.words[k]);
    }
    const s = surface(i);
    const base = stripPossessive(s);
    if (e.form.exact[k]) return s === e.form.words[k] || base === e.form.words[k];
    return vocabForm(s) === e.form.lower[k] || vocabForm(base) === e.form.lower[k];
  };
  const matchAt = (e: Entry, i: number): boolean => {
    const n = e.form.words.length;
    if (i + n > tokens.count || tokens.sentence[i + n - 1] !== tokens.sentence[i]) return false;
    for (let k = 0; k < n; k++) {
      if (!wordMatches(e, k, i + k)) return false;
      if (k > 0 && collapse(text.slice(tokens.end[i + k - 1], tokens.start[i + k])) !== e.form.gaps[k - 1]) return false;
    }
    return true;
  };
  /** The title word just before token i ("Mr." or "Mr"), as written, or null. */
  const titleBefore = (i: number): string | null => {
    if (i === 0 || tokens.sentence[i - 1] !== tokens.sentence[i]) return null;
    const gap = text.slice(tokens.end[i - 1], tokens.start[i]);
    if (!/^\.?\s+$/.test(gap)) return null;
    const w = surface(i - 1);
    return HE_TITLES.has(w) || SHE_TITLES.has(w) ? w : null;
  };

  const out = { token: u32Buffer(), length: u8Buffer(), member: u32Buffer(), form: u32Buffer() };
  const ambiguous: AmbiguousMention[] = [];
  for (let i = 0; i < tokens.count; ) {
    const list = byType[tokens.type[i]];
    const matched = list ? (list.find((e) => matchAt(e, i)) ?? null) : null;
    if (!matched) {
      i++;
      continue;
    }
    const n = matched.form.words.length;
    let candidates = matched.members;
    const title = titleBefore(i);
    if (title !== null) {
      const gender = HE_TITLES.has(title) ? 'he' : 'she';
      candidates = candidates.filter((m) => fits(cast[m], gender));
    }
    if (candidates.length === 1) {
      out.token.push(i);
      out.length.push(n);
      out.member.push(candidates[0]);
      out.form.push(matched.index);
    } else if (candidates.length > 1) {
      ambiguous.push({
        token: i,
        text: text.slice(tokens.start[i], tokens.end[i + n - 1]),
        chapter: tokens.chapter[i],
        candidates: candidates.map((m) => cast[m].id),
      });
    }
    i += n;
  }
  return {
    count: out.token.length,
    token: out.token.toArray(),
    length: out.length.toArray(),
    member: out.member.toArray(),
    form: out.form.toArray(),
    forms,
    ambiguous,
  };
}
