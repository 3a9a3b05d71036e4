/**
 * Who is on stage: cast members named in the narrative (outside quotations),
 * paragraph by paragraph, with the clause subjects marked. A clause whose
 * subject is a pronoun counts as a mention of the latest compatible cast
 * member named before it as a subject (else named at all), within the
 * paragraph and the two before it, so that "He had his ledger open" keeps
 * the factor on stage. A possessive ("Marta's husband") does not put anyone
 * on stage.
 */

import type { TextModel } from '../text/model.ts';
import { fitsGender, isAdverb, mayBeEpithet, namesPerson, NOT_NAMES, outsiderDescription, refAt, subjectStart, TITLES } from './refs.ts';
import { clauses } from './tags.ts';
import { gapBetween, isCapitalised, narrativeTokens, surface, word, type TokenView } from './view.ts';
import { looksPast, verbLength, type VerbList } from './verbs.ts';
import type { Turn } from './turns.ts';

export interface NarrativeMention {
  token: number;
  /** Cast index, or −1 for a capitalised name outside the cast acting in the narrative ("Clem stood on the step"). */
  member: number;
  /** The mention is its clause's subject (or the subject is a pronoun standing for it). */
  subject: boolean;
  /** A verb follows the mention: the person acts ("Jory Penhallow came in"). */
  agent: boolean;
  /** Index of the mention's sentence within the paragraph. */
  sentence: number;
  /** Someone outside the cast: how the text names or describes them ("Clem", "the maid"); null for a cast member. */
  name: string | null;
  /** A possessive ("Marta's husband"): the person is spoken of, not on stage. */
  possessive?: boolean;
}

export interface Scene {
  /** Narrative mentions of paragraph p, in text order. */
  mentionsOf(p: number): NarrativeMention[];
  /**
   * Cast members on stage in paragraphs p, p−1, … p−back (not before
   * `firstPara`): clause subjects first, then other mentions (not
   * possessives), each latest first. With `subjectsOnly`, the subjects alone.
   */
  members(p: number, back: number, firstPara: number, subjectsOnly?: boolean): number[];
}

/** `speaking`: head nouns of descriptions that speak in the text's tags ("said the porter"): people, whatever the noun. */
export function sceneIndex(v: TokenView, model: TextModel, verbs: VerbList, speaking: ReadonlySet<string> = new Set()): Scene {
  const memo = new Map<number, NarrativeMention[]>();
  // A first-person narrator (pronoun "i" in the cast as the rules see it) is on stage wherever "I" acts.
  const narrator = v.cast.findIndex((c) => (c.pronoun as string | undefined) === 'i');
  const mentionsOf = (p: number): NarrativeMention[] => {
    const known = memo.get(p);
    if (known) return known;
    const out: NarrativeMention[] = [];
    memo.set(p, out);
    const toks = narrativeTokens(v, p, model.paragraphs.start[p], model.paragraphs.end[p]);
    const chapter = model.paragraphs.chapter[p];
    const chapterStart = model.chapters[chapter].firstParagraph;
    let sentence = -1;
    let prevClauseEnd = -1;
    for (const cl of clauses(v, toks, /[.!?;]/)) {
      if (prevClauseEnd < 0 || /[.!?]/.test(v.text.slice(model.tokens.end[prevClauseEnd], model.tokens.start[cl[0]]))) sentence++;
      prevClauseEnd = cl[cl.length - 1];
      const k = subjectStart(v, cl);
      let subj = refAt(v, cl, k, 'subject');
      if (!subj) {
        // An inverted tag: "said Isidore", "cried the ferryman".
        const len = verbLength(verbs, cl.map((t) => word(v, t)), k);
        if (len > 0) subj = refAt(v, cl, k + len, 'subject');
      }
      if (subj?.kind === 'pronoun' && subj.gender === 'i' && narrator >= 0) {
        out.push({ token: cl[subj.first], member: narrator, subject: true, agent: true, sentence, name: null });
      } else if (subj?.kind === 'pronoun' && (subj.gender === 'he' || subj.gender === 'she' || subj.gender === 'they')) {
        const g = subj.gender;
        const fits = (m: NarrativeMention): boolean => m.member >= 0 && fitsGender(v.cast[m.member].pronoun, g);
        // The latest fitting subject first (a pronoun keeps to the subject of the clauses before it), then any fitting mention.
        const latest = (l: readonly NarrativeMention[], subject: boolean): NarrativeMention | undefined => [...l].reverse().find((m) => fits(m) && (!subject || m.subject));
        let found: NarrativeMention | undefined = latest(out, true) ?? latest(out, false);
        for (let q = p - 1; !found && q >= Math.max(chapterStart, p - 2); q--) found = latest(mentionsOf(q), true) ?? latest(mentionsOf(q), false);
        if (found) out.push({ token: cl[subj.first], member: found.member, subject: true, agent: true, sentence, name: null });
      }
      // Someone outside the cast as the clause's subject: "The maid put her head in at the door."
      const described = subj ? outsiderDescription(subj) : null;
      const person = described !== null && (subj!.kind === 'outsider' || (namesPerson(described, speaking) && !mayBeEpithet(described)));
      let outsiderToken = -1;
      if (person && subj && (subj.kind === 'outsider' ? pastVerbFollows(v, cl, subj.next) : pastVerbWithin(v, cl, subj.next, 12))) {
        outsiderToken = cl[subj.first];
        out.push({ token: outsiderToken, member: -1, subject: true, agent: true, sentence, name: described });
      }
      for (let j = 0; j < cl.length; j++) {
        const t = cl[j];
        const m = v.mention[t];
        if (m >= 0) {
          const end = j + v.mentionLength[t];
          const possessive = /['\u2019]s$/u.test(surface(v, cl[Math.min(cl.length - 1, end - 1)]));
          const subject = subj !== null && subj.kind === 'cast' && cl[subj.first] === t;
          out.push({ token: t, member: m, subject, agent: !possessive && (subject || verbFollows(v, cl, end)), sentence, name: null, possessive });
          j = end - 1;
        } else if (j > 0 && t !== outsiderToken && !ARTICLES_BEFORE_NAMES.has(word(v, cl[j - 1])) && isCapitalised(v, t) && !NOT_NAMES.has(word(v, t)) && !TITLES.has(word(v, t)) && v.ambiguous.get(t) === undefined && pastVerbFollows(v, cl, j + 1)) {
          out.push({ token: t, member: -1, subject: j === k, agent: true, sentence, name: surface(v, t) });
        }
      }
    }
    return out;
  };
  const members = (p: number, back: number, firstPara: number, subjectsOnly = false): number[] => {
    const subjects: number[] = [];
    const others: number[] = [];
    for (let q = p; q >= Math.max(firstPara, p - back); q--) {
      const l = mentionsOf(q);
      for (let k = l.length - 1; k >= 0; k--) {
        const m = l[k];
        if (m.member < 0 || m.possessive) continue;
        if (m.subject) {
          if (!subjects.includes(m.member)) subjects.push(m.member);
        } else if (!others.includes(m.member)) others.push(m.member);
      }
    }
    return subjectsOnly ? subjects : [...subjects, ...others.filter((m) => !subjects.includes(m))];
  };
  return { mentionsOf, members };
}

/** Words before a capitalised word that make it no person's name: "the Juliane", "a Coker". common practice, no source. */
const ARTICLES_BEFORE_NAMES: ReadonlySet<string> = new Set(['the', 'a', 'an', 'this', 'that', 'every', 'each', 'no']);

/** Words that cannot follow a subject as its verb. common practice, no source. */
const NOT_VERBS: ReadonlySet<string> = new Set([
  'and', 'or', 'but', 'nor', 'of', 'to', 'in', 'on', 'at', 'with', 'for', 'from', 'by', 'the', 'a', 'an', 'his', 'her',
  'their', 'its', 'my', 'your', 'our', 'who', 'whom', 'which', 'that', 'as', 'if', 'than', 'into', 'onto', 'about', 'over',
]);

/** Whether clause position k holds a word that can be a verb (after at most one adverb), right after a name. */
function verbFollows(v: TokenView, cl: readonly number[], k: number): boolean {
  if (k >= cl.length || cl[k] !== cl[k - 1] + 1 || !/^\s+$/.test(gapBetween(v, cl[k - 1], cl[k]))) return false;
  let j = k;
  if (isAdverb(v, cl[j]) && j + 1 < cl.length) j++;
  return !isCapitalised(v, cl[j]) && !NOT_VERBS.has(word(v, cl[j])) && !/^\p{N}/u.test(word(v, cl[j]));
}

/** Whether a past-tense verb stands within `n` words from clause position k ("A stout woman at my elbow turned…"). */
function pastVerbWithin(v: TokenView, cl: readonly number[], k: number, n: number): boolean {
  for (let j = k; j < Math.min(cl.length, k + n); j++) if (looksPast(word(v, cl[j]))) return true;
  return false;
}

/** Whether a past-tense verb (a regular -ed form or a common irregular one) follows a name outside the cast. */
function pastVerbFollows(v: TokenView, cl: readonly number[], k: number): boolean {
  if (!verbFollows(v, cl, k)) return false;
  const w = word(v, cl[k]);
  const w2 = k + 1 < cl.length ? word(v, cl[k + 1]) : '';
  return looksPast(w) || (isAdverb(v, cl[k]) && looksPast(w2));
}

/**
 * Speakers of the turns before turn i in its chapter, within 8 turns and 8
 * paragraphs, latest first; with `known`, only speakers settled by evidence
 * (pin, tag, beat, resolved pronoun, scene), not by alternation.
 */
export function recentSpeakers(turns: readonly Turn[], i: number, known = false): number[] {
  const out: number[] = [];
  const w = turns[i];
  for (let k = i - 1; k >= 0 && k >= i - 8; k--) {
    const u = turns[k];
    if (u.chapter !== w.chapter || w.firstPara - u.lastPara > 8) break;
    if (u.speaker !== null && (!known || u.fixed) && !out.includes(u.speaker)) out.push(u.speaker);
  }
  return out;
}

/** Whether turn b starts in the paragraph where turn a ends, or in the next one, in the same chapter. */
export function adjacent(a: Turn | undefined, b: Turn | undefined): boolean {
  return a !== undefined && b !== undefined && a.chapter === b.chapter && (b.firstPara === a.lastPara + 1 || b.firstPara === a.lastPara);
}

/** Whether turn b starts at most two paragraphs after turn a ends, in the same chapter. */
export function near(a: Turn | undefined, b: Turn | undefined): boolean {
  return a !== undefined && b !== undefined && a.chapter === b.chapter && b.firstPara - a.lastPara <= 2;
}
