/**
 * The evidence around one quotation: its dialogue tag, the action beats of its
 * paragraph, and the vocatives inside it.
 *
 * Tag after the quotation (first clause of the narrative that follows it):
 *   inverted   [adverbs] VERB [adverbs] SPEAKER   "said Ada", "said she", "cried the ferryman"
 *   plain      SPEAKER [adverbs] VERB             "Ada said", "she whispered", "Osric said gloomily"
 * Tag before the quotation (last clause of the narrative before it, ending in
 * a comma, colon, dash or nothing): the same two orders with the verb among
 * the clause's last five words; failing a speaker next to the verb, the
 * clause's subject ("Ada turned to him and said:").
 * After the speaker or the verb, "to X" (or the object of a verb such as
 * "asked", "told") names the addressee.
 *
 * A tag's verb must not be negated ("said nothing") nor, when phrasal, be
 * followed by an -ing form ("went on cutting").
 *
 * An action beat is a narrative clause of the paragraph whose subject is a cast
 * member or a pronoun ("Ada put down her cup."), or a part of one standing for
 * them ("Ada's voice shook", "His hands trembled"). Beats whose subject is a
 * description or an outsider ("The old man smiled.") are kept too, as a sign
 * that someone not named acts there.
 *
 * A vocative is a cast mention inside the quotation set off by punctuation or
 * the quotation's edges on both sides ("Tansy, come here", "Come, Ada!"),
 * outside any quotation within the speech ("‘Mabel, your bowl is cracked’").
 *
 * Self-naming: "My name is X", "I am X", "I'm X", "Call me X" with X a cast
 * mention ending the phrase.
 */

import { refAt, skipAdverbs, subjectStart, TITLES, type Ref } from './refs.ts';
import { ADDRESSING_VERBS, verbLength, type VerbList } from './verbs.ts';
import { firstTokenAtOrAfter, gapBetween, narrativeTokens, surface, word, type TokenView } from './view.ts';
import type { Quote } from './quotes.ts';
import { LEADING_ELISIONS, wordStartingAt } from './marks.ts';

export interface Tag {
  /** Who speaks, as written. */
  speaker: Ref;
  /** Who is spoken to, when the tag says ("to her father", "asked Tom"). */
  to: Ref | null;
  /** Whether the tag follows or precedes the quotation. */
  place: 'after' | 'before';
  /** Offset where the narrative stretch holding the tag starts: two quotations sharing it share the tag. */
  stretch: number;
  /** The speaker's first token, for pronoun resolution. */
  token: number;
  /** The speech verb as written in lower case ("said", "went on"). */
  verb: string;
}

export interface Beat {
  subject: Ref;
  /** Token of the subject. */
  token: number;
  /** Characters between the beat and the quotation. */
  distance: number;
}

export interface Stretch {
  start: number;
  end: number;
  tokens: number[];
}

/** Abbreviations whose full stop does not end a clause. common practice, no source. */
const ABBREVIATIONS: ReadonlySet<string> = new Set(['mr', 'mrs', 'ms', 'mx', 'dr', 'st', 'capt', 'rev', 'prof', 'messrs', 'col', 'gen', 'lt', 'sgt']);

/** Split narrative tokens into clauses at sentence punctuation, semicolons, colons and quotations. */
export function clauses(v: TokenView, toks: readonly number[], stops = /[.!?;:\u2014]/): number[][] {
  const out: number[][] = [];
  let cur: number[] = [];
  for (let k = 0; k < toks.length; k++) {
    if (cur.length > 0) {
      const prev = cur[cur.length - 1];
      let gap = gapBetween(v, prev, toks[k]);
      if (gap.startsWith('.') && (ABBREVIATIONS.has(word(v, prev)) || /^\p{Lu}$/u.test(surface(v, prev)))) gap = gap.slice(1);
      if (toks[k] !== prev + 1 || stops.test(gap)) {
        out.push(cur);
        cur = [];
      }
    }
    cur.push(toks[k]);
  }
  if (cur.length) out.push(cur);
  return out;
}

const NEGATIONS: ReadonlySet<string> = new Set(['nothing', 'not', 'no', 'never']);

/** Not "said nothing", and not a phrasal verb before an -ing form ("went on cutting"). */
function verbOk(v: TokenView, cl: readonly number[], k: number, len: number): boolean {
  const next = k + len < cl.length ? word(v, cl[k + len]) : '';
  if (NEGATIONS.has(next)) return false;
  return !(len === 2 && next.length > 4 && next.endsWith('ing'));
}

/** The addressee after position k of a clause: "to X", or the object of an addressing verb. */
function addresseeAfter(v: TokenView, cl: readonly number[], k: number, addressing: boolean): Ref | null {
  const j = skipAdverbs(v, cl, k);
  if (j >= cl.length) return null;
  if (word(v, cl[j]) === 'to') return refAt(v, cl, j + 1, 'object');
  if (addressing) return refAt(v, cl, j, 'object');
  return null;
}

/** A phrase that can name a speaker: not "you" or "it". */
function speaksRef(r: Ref | null): r is Ref {
  return r !== null && (r.kind !== 'pronoun' || (r.gender !== 'you' && r.gender !== 'it'));
}

/** Parse a tag at the start of a clause (the narrative after a quotation). */
interface Parsed {
  speaker: Ref;
  to: Ref | null;
  at: number;
  verb: string;
}

function verbText(v: TokenView, cl: readonly number[], k: number, len: number): string {
  return cl.slice(k, k + len).map((t) => word(v, t)).join(' ');
}

export function tagAfter(v: TokenView, verbs: VerbList, cl: readonly number[]): Parsed | null {
  const words = cl.map((t) => word(v, t));
  const j = subjectStart(v, cl);
  // Inverted: VERB SPEAKER.
  const j2 = skipAdverbs(v, cl, j);
  const len = verbLength(verbs, words, j2);
  if (len > 0 && verbOk(v, cl, j2, len)) {
    const k = skipAdverbs(v, cl, j2 + len);
    const r = refAt(v, cl, k, 'subject');
    if (speaksRef(r) && (r.kind !== 'pronoun' || k === j2 + len)) {
      return { speaker: r, to: addresseeAfter(v, cl, r.next, false), at: cl[r.first], verb: verbText(v, cl, j2, len) };
    }
  }
  // Plain: SPEAKER VERB.
  const r = refAt(v, cl, j, 'subject');
  if (speaksRef(r)) {
    const k = skipAdverbs(v, cl, r.next, 3);
    const l2 = verbLength(verbs, words, k);
    if (l2 > 0 && verbOk(v, cl, k, l2)) {
      return { speaker: r, to: addresseeAfter(v, cl, k + l2, ADDRESSING_VERBS.has(words[k])), at: cl[r.first], verb: verbText(v, cl, k, l2) };
    }
  }
  return null;
}

/** Parse a tag at the end of a clause (the narrative before a quotation). */
export function tagBefore(v: TokenView, verbs: VerbList, cl: readonly number[]): Parsed | null {
  const words = cl.map((t) => word(v, t));
  for (let k = cl.length - 1; k >= Math.max(0, cl.length - 6); k--) {
    const len = verbLength(verbs, words, k);
    if (len === 0 || !verbOk(v, cl, k, len)) continue;
    const to = addresseeAfter(v, cl, k + len, ADDRESSING_VERBS.has(words[k]));
    // Plain: "Ada said,", "Ada quietly said:", "she asked Tom:".
    for (let s = k - 1; s >= Math.max(0, k - 5); s--) {
      const r = refAt(v, cl, s, 'subject');
      if (speaksRef(r) && skipAdverbs(v, cl, r.next, 3) === k) return { speaker: r, to, at: cl[r.first], verb: verbText(v, cl, k, len) };
    }
    // Inverted: "said Ada:".
    const after = refAt(v, cl, skipAdverbs(v, cl, k + len), 'subject');
    if (speaksRef(after) && after.kind !== 'desc' && word(v, cl[k + len]) !== 'to') {
      return { speaker: after, to: addresseeAfter(v, cl, after.next, false), at: cl[after.first], verb: verbText(v, cl, k, len) };
    }
    // The clause's subject: "Ada turned to him and said:".
    const r = refAt(v, cl, subjectStart(v, cl), 'subject');
    if (speaksRef(r)) return { speaker: r, to, at: cl[r.first], verb: verbText(v, cl, k, len) };
    return null;
  }
  return null;
}

/** The stretch of narrative before and after each speech quotation of a paragraph, up to the neighbouring speech quotations. */
export function stretches(v: TokenView, q: Quote, prev: Quote | null, next: Quote | null): { before: Stretch; after: Stretch | null } {
  const p = q.paragraph;
  const pa = v.model.paragraphs.start[p];
  const pb = v.model.paragraphs.end[p];
  const bStart = prev && prev.paragraph === p ? (prev.close >= 0 ? prev.close + 1 : prev.end) : pa;
  const before: Stretch = { start: bStart, end: q.open, tokens: narrativeTokens(v, p, bStart, q.open) };
  if (q.close < 0) return { before, after: null };
  const aEnd = next && next.paragraph === p ? next.open : pb;
  return { before, after: { start: q.close + 1, end: aEnd, tokens: narrativeTokens(v, p, q.close + 1, aEnd) } };
}

/** The tag of quotation q: after it first, else before it. */
export function findTag(v: TokenView, verbs: VerbList, before: Stretch, after: Stretch | null): Tag | null {
  if (after && after.tokens.length) {
    const first = clauses(v, after.tokens)[0];
    // The clause must start right after the closing mark (nothing but punctuation between).
    const lead = v.text.slice(after.start, v.model.tokens.start[first[0]]);
    if (!/\p{L}/u.test(lead)) {
      const t = tagAfter(v, verbs, first);
      if (t) return { speaker: t.speaker, to: t.to, place: 'after', stretch: after.start, token: t.at, verb: t.verb };
    }
  }
  if (before.tokens.length) {
    const tail = v.text.slice(v.model.tokens.end[before.tokens[before.tokens.length - 1]], before.end);
    if (/^[\s,:\u2014\u2013-]*$/.test(tail)) {
      const cls = clauses(v, before.tokens, /[.!?;]/);
      const t = tagBefore(v, verbs, cls[cls.length - 1]);
      if (t) return { speaker: t.speaker, to: t.to, place: 'before', stretch: before.start, token: t.at, verb: t.verb };
    }
  }
  return null;
}

/** Parts of a person that may stand for them as a clause's subject. common practice, no source. */
const BODY_WORDS: ReadonlySet<string> = new Set([
  'voice', 'eyes', 'eye', 'face', 'hand', 'hands', 'lips', 'mouth', 'head', 'heart', 'gaze', 'brow', 'brows', 'cheeks',
  'shoulders', 'fingers', 'tone', 'chin', 'jaw', 'smile', 'laugh', 'glance', 'look', 'expression', 'throat', 'breath',
]);

/**
 * Action beats in narrative stretches: clauses whose subject is a cast member,
 * an ambiguous name or a pronoun — or someone described ("the old man") or
 * named outside the cast, listed so that the turn is known to have an actor.
 */
export function findBeats(v: TokenView, stretchesOfTurn: readonly Stretch[], anchor: number): Beat[] {
  const out: Beat[] = [];
  for (const s of stretchesOfTurn) {
    for (const cl of clauses(v, s.tokens, /[.!?;]/)) {
      let r = refAt(v, cl, subjectStart(v, cl), 'subject');
      if (r?.kind === 'desc') {
        // A possessive subject that is part of its owner speaks for them: "Ada's voice shook", "His hands trembled".
        const t0 = cl[r.first];
        const w0 = word(v, t0);
        const head = r.next - 1 > r.first ? word(v, cl[r.next - 1]) : '';
        if (BODY_WORDS.has(head)) {
          if (v.mention[t0] >= 0) r = { kind: 'cast', member: v.mention[t0], first: r.first, next: r.next };
          else if (w0 === 'his' || w0 === 'her' || w0 === 'their') r = { kind: 'pronoun', gender: w0 === 'his' ? 'he' : w0 === 'her' ? 'she' : 'they', first: r.first, next: r.next };
        }
      }
      if (!r) continue;
      if (r.kind === 'desc' || r.kind === 'outsider') {
        out.push({ subject: r, token: cl[r.first], distance: Math.abs(v.model.tokens.start[cl[r.first]] - anchor) });
        continue;
      }
      if (r.kind === 'pronoun' && r.gender !== 'he' && r.gender !== 'she' && r.gender !== 'they') continue;
      const t = cl[r.first];
      const at = v.model.tokens.start[t];
      out.push({ subject: r, token: t, distance: Math.abs(at - anchor) });
    }
  }
  return out.sort((x, y) => x.distance - y.distance);
}

const VOCATIVE_LEADS: ReadonlySet<string> = new Set(['my', 'dear', 'o', 'oh', 'ah', 'poor', 'good', 'old', 'little', 'darling', 'sweet', 'young']);

/** Opening marks of quotations within speech, and the marks that close each. common practice, no source. */
const INNER: ReadonlyMap<number, readonly number[]> = new Map([
  [0x201c, [0x201d]], // “…”
  [0x22, [0x22]], // "…"
  [0x201e, [0x201c, 0x201d]], // „…“ „…”
  [0xab, [0xbb]], // «…»
  [0x2039, [0x203a]], // ‹…›
  [0x201a, [0x2018, 0x2019]], // ‚…‘
]);

/**
 * Ranges of quotation q that are quotations within the speech (‘…’ inside
 * “…”, “…” inside ‘…’, and any other marks inside guillemets, low-high marks
 * or dash speech): words someone else said or wrote.
 */
export function nestedRanges(text: string, q: Quote): [number, number][] {
  const out: [number, number][] = [];
  let open = -1;
  let closers: readonly number[] = [];
  const singles = q.marks !== 'single';
  for (let i = q.start; i < q.end; i++) {
    const c = text.charCodeAt(i);
    const prevLetter = i > q.start && /[\p{L}\p{N}]/u.test(text[i - 1]);
    const nextLetter = i + 1 < q.end && /[\p{L}\p{N}]/u.test(text[i + 1]);
    if (open >= 0) {
      if (closers.includes(c) && (c !== 0x2019 || (!nextLetter && i > q.start && !/\s/.test(text[i - 1])))) {
        out.push([open, i + 1]);
        open = -1;
      }
      continue;
    }
    if (singles && (c === 0x2018 || c === 0x27)) {
      // A single mark opens at a word's start, not before an elided word ('tis, ’em).
      if (!prevLetter && (nextLetter || /[\u2014\u2026]/.test(text[i + 1] ?? ' ')) && !LEADING_ELISIONS.has(wordStartingAt(text, i + 1, q.end))) {
        open = i;
        closers = c === 0x27 ? [0x27] : [0x2019];
      }
      continue;
    }
    if (q.marks === 'double' || (q.marks === 'low' && c === 0x201e) || (q.marks === 'guillemets' && (c === 0xab || c === 0xbb))) continue;
    const cl = INNER.get(c);
    if (cl && !/\s/.test(text[i + 1] ?? ' ')) {
      open = i;
      closers = cl;
    }
  }
  if (open >= 0) out.push([open, q.end]);
  return out;
}

/** Cast members addressed by name inside quotation q (vocatives), in order; names inside quotations within it are left out. */
export function findVocatives(v: TokenView, q: Quote): number[] {
  const { tokens } = v.model;
  const p = q.paragraph;
  const first = firstTokenAtOrAfter(v.model, q.start, v.paraFirst[p], v.paraEnd[p]);
  const out: number[] = [];
  const nested = nestedRanges(v.text, q);
  let end = first;
  while (end < v.paraEnd[p] && tokens.start[end] < q.end) end++;
  for (let t = first; t < end; t++) {
    const m = v.mention[t];
    if (m < 0) continue;
    if (nested.some(([a, b]) => tokens.start[t] >= a && tokens.start[t] < b)) continue;
    const len = v.mentionLength[t];
    const last = t + len - 1;
    if (/['\u2019]s$/u.test(surface(v, last))) continue;
    // Before: the quotation's start, punctuation, or leads such as "my dear" / a title after punctuation.
    let b = t - 1;
    while (b >= first && (VOCATIVE_LEADS.has(word(v, b)) || TITLES.has(word(v, b))) && /^[\s.]*$/.test(gapBetween(v, b, b + 1))) b--;
    const beforeGap = b >= first ? gapBetween(v, b, b + 1) : v.text.slice(q.start, tokens.start[b + 1]);
    const beforeOk = b < first || /[,;!?\u2014\u2013(.…]/.test(beforeGap);
    const afterGap = last + 1 < end ? gapBetween(v, last, last + 1) : v.text.slice(tokens.end[last], q.end) || '.';
    const afterOk = /^\s*[,;!?.\u2014\u2013…)]/.test(afterGap) || (last + 1 >= end && /^\s*$/.test(afterGap));
    if (beforeOk && afterOk && !out.includes(m)) out.push(m);
    t = last;
  }
  return out;
}

/** First-person forms that introduce the speaker's own name. common practice, no source. */
const SELF_NAMING: readonly string[][] = [['my', 'name', 'is'], ["name's"], ['i', 'am'], ["i'm"], ['call', 'me']];

/** A cast member the speaker names as themselves inside quotation q ("My name is Vell.", "I'm Ada Fenn."), or null. */
export function findSelfName(v: TokenView, q: Quote): number | null {
  const { tokens } = v.model;
  const p = q.paragraph;
  const first = firstTokenAtOrAfter(v.model, q.start, v.paraFirst[p], v.paraEnd[p]);
  let end = first;
  while (end < v.paraEnd[p] && tokens.start[end] < q.end) end++;
  for (let t = first; t < end; t++) {
    for (const form of SELF_NAMING) {
      if (t + form.length >= end || !form.every((w, k) => word(v, t + k) === w)) continue;
      const n = t + form.length;
      const m = v.mention[n];
      if (m < 0) continue;
      const last = n + v.mentionLength[n] - 1;
      if (/['\u2019]s$/u.test(surface(v, last))) continue;
      const after = last + 1 < end ? gapBetween(v, last, last + 1) : '.';
      if (/^\s*[,.;!?\u2014\u2026]/.test(after) || last + 1 >= end) return m;
    }
  }
  return null;
}

/**
 * A cast member whose name opens quotation q and is set off by punctuation
 * or ends it ("Lucy Venn, ma'am.", "Hollis Fenn."): the speaker introducing
 * themselves, when the turn before asked who they are (see asksWho). Null
 * when the quotation does not open with a cast mention.
 */
export function findIntroduction(v: TokenView, q: Quote): number | null {
  const { tokens } = v.model;
  const p = q.paragraph;
  const t = firstTokenAtOrAfter(v.model, q.start, v.paraFirst[p], v.paraEnd[p]);
  if (t >= v.paraEnd[p] || tokens.start[t] >= q.end || /[\p{L}\p{N}]/u.test(v.text.slice(q.start, tokens.start[t]))) return null;
  const m = v.mention[t];
  if (m < 0) return null;
  const last = t + v.mentionLength[t] - 1;
  if (/['\u2019]s$/u.test(surface(v, last))) return null;
  const after = v.text.slice(tokens.end[last], q.end);
  return after === '' || /^\s*[,.;!\u2014\u2013\u2026]/.test(after) ? m : null;
}

/**
 * Whether a speech asks who the person spoken to is: "Who are you?", "And
 * who might you be?", "What's your name?", "Who's there?", "What do they
 * call you?". common practice, no source.
 */
export function asksWho(s: string): boolean {
  const t = s.toLowerCase().replace(/\u2019/g, "'");
  if (!t.includes('?')) return false;
  return (
    /\bwho(?:'re|\s+(?:are|were|might|may|could|would|can|art|be))\b[^?.!]{0,24}\b(?:you|ye|thou)\b/.test(t) ||
    /\byour name\b/.test(t) ||
    /\bwho(?:'s| is) (?:there|that|this|it)\b/.test(t) ||
    /\bwhat[^?.!]*\bcall(?:ed)? you\b/.test(t)
  );
}
