/**
 * Dash dialogue: speech that opens its paragraph with a dash (— or –, or the
 * quotation dash ―), as in many translations and in French, Spanish,
 * Italian, Russian and Scandinavian printing. There is no closing mark: the
 * speech runs to the next dash that starts a narrative aside, or to the
 * paragraph's end. Printers set the aside in three common ways, all read
 * here:
 *
 *   — Yes, — he said. — I know.     spaced dashes around the aside
 *   —Yes —he said—. I know.          dashes set close to the aside's words
 *   – Yes, he said. I know.          no second dash: the tag runs on after a comma
 *
 * Inside a speech a dash starts a narrative aside when what follows it reads
 * as narrative: a dash with a space before it and a letter right after it
 * (the close-set style), or words that begin a tag or an action — a speech
 * verb ("said Ada"), a subject then a speech verb ("he said", "the miller
 * said", "Ada asked"), or a pronoun or name then a past-tense verb ("He
 * leaned the shovel…"). Any other dash is a pause or a break inside the
 * speech ("I — I don't know", "for one more winter—"). The aside ends at the
 * next dash, and the speech resumes after it (past any punctuation the aside
 * left, "—."); without one the aside runs to the paragraph's end.
 *
 * A tag that runs on after a comma (or ? ! …) — a subject and a speech verb,
 * or a speech verb and its subject — is narrative up to the end of its
 * sentence, or only up to the comma that follows it directly ("– Well, he
 * said, I suppose so."), unless the words after that comma carry the
 * narrative on (when, as, and, with, an -ing form…).
 *
 * A narrative paragraph may also introduce speech after a colon: "He said:
 * — Come in." Marks of any other kind inside dash speech are quotations
 * within it; in the narrative they are quoted words, not speech.
 */

import type { Span } from './scan.ts';
import { NOT_NAMES } from './refs.ts';
import { looksPast, verbLength, type VerbList } from './verbs.ts';

const DASH = /[\u2014\u2013\u2015]/;
const LETTER = /[\p{L}\p{N}]/u;

function isDash(text: string, i: number): boolean {
  return DASH.test(text[i] ?? '');
}

/** The words (lower case, letters and apostrophes) of text[from, to), with their offsets. */
function wordsIn(text: string, from: number, to: number, max = 8): { w: string; raw: string; at: number; end: number }[] {
  const out: { w: string; raw: string; at: number; end: number }[] = [];
  const re = /[\p{L}\p{N}]+(?:['\u2019][\p{L}]+)*/gu;
  re.lastIndex = from;
  for (let m = re.exec(text); m && m.index < to && out.length < max; m = re.exec(text)) {
    out.push({ w: m[0].toLowerCase().replace(/\u2019/g, "'"), raw: m[0], at: m.index, end: m.index + m[0].length });
  }
  return out;
}

const SUBJECT_PRONOUNS: ReadonlySet<string> = new Set(['he', 'she', 'they', 'we', 'i']);
const DETERMINERS: ReadonlySet<string> = new Set(['the', 'a', 'an', 'his', 'her', 'their', 'my', 'our', 'its', 'this', 'that']);

/**
 * A tag at the words `ws` (the start of a narrative aside): the index of the
 * word just past its verb and subject, or -1. Forms: VERB SUBJECT ("said Ada",
 * "said the miller", "said he"), SUBJECT VERB ("he said", "Ada asked", "the
 * old man said"), with at most one adverb (-ly) between.
 */
export function tagLength(ws: readonly { w: string; raw: string }[], verbs: VerbList): number {
  const words = ws.map((x) => x.w);
  const adv = (k: number): number => (k < words.length && words[k].length > 4 && words[k].endsWith('ly') ? k + 1 : k);
  // VERB SUBJECT
  let k = adv(0);
  let len = verbLength(verbs, words, k);
  if (len > 0) {
    let s = adv(k + len);
    if (s < words.length) {
      if (SUBJECT_PRONOUNS.has(words[s])) return s + 1;
      if (DETERMINERS.has(words[s])) {
        let e = s + 1;
        while (e < Math.min(words.length, s + 4) && !verbLength(verbs, words, e)) e++;
        return Math.min(e, s + 4);
      }
      if (/^\p{Lu}/u.test(ws[s].raw)) {
        let e = s + 1;
        while (e < Math.min(words.length, s + 3) && /^\p{Lu}/u.test(ws[e].raw)) e++;
        return e;
      }
    }
    return -1;
  }
  // SUBJECT VERB
  let s = 0;
  if (SUBJECT_PRONOUNS.has(words[0]) && (words[0] !== 'i' || ws[0].raw === 'I')) s = 1;
  else if (DETERMINERS.has(words[0])) {
    s = 1;
    while (s < Math.min(words.length, 4) && !verbLength(verbs, words, s)) s++;
  } else if (ws[0] && /^\p{Lu}/u.test(ws[0].raw) && !NOT_NAMES.has(words[0])) {
    s = 1;
    while (s < Math.min(words.length, 3) && /^\p{Lu}/u.test(ws[s].raw)) s++;
  } else return -1;
  k = adv(s);
  len = verbLength(verbs, words, k);
  return len > 0 ? k + len : -1;
}

/** Whether the text after a dash at offset j (up to b) reads as narrative rather than as more of the speech. */
export function narrativeAfter(text: string, j: number, b: number, verbs: VerbList): boolean {
  let k = j + 1;
  while (k < b && /\s/.test(text[k])) k++;
  if (k >= b || !LETTER.test(text[k])) return false;
  // Close-set style: a space before the dash, a letter right after it ("—Yes —he said—").
  if (k === j + 1 && j > 0 && /\s/.test(text[j - 1])) return true;
  const ws = wordsIn(text, k, Math.min(b, k + 120), 5);
  if (ws.length === 0) return false;
  if (tagLength(ws, verbs) > 0) return true;
  // An action: a pronoun or a capitalised name, then a past-tense verb ("He leaned…", "Ada turned…").
  const first = ws[0];
  const subject = (first.w === 'he' || first.w === 'she' || first.w === 'they') || (/^\p{Lu}/u.test(first.raw) && !NOT_NAMES.has(first.w) && first.w !== 'i');
  if (subject) {
    for (let q = 1; q < Math.min(ws.length, 3); q++) {
      if (looksPast(ws[q].w)) return true;
      if (!/^\p{Lu}/u.test(ws[q].raw) && !(ws[q].w.length > 4 && ws[q].w.endsWith('ly'))) break;
    }
  }
  return false;
}

/** Words after a comma that carry the narrative on rather than hand back to the speech. common practice, no source. */
const NARRATIVE_LINKS: ReadonlySet<string> = new Set([
  'when', 'while', 'as', 'and', 'but', 'with', 'without', 'after', 'before', 'then', 'not', 'who', 'which', 'though',
  'although', 'because', 'since', 'until', 'for', 'in', 'on', 'at', 'from', 'into', 'to', 'by', 'so', 'his', 'her',
  'their', 'its', 'a', 'the', 'half', 'still', 'almost', 'once',
]);

/** Split a speech span at tags that run on after a comma ("– Sit down, he said. I want…"). */
function splitRunOnTags(text: string, span: Span, verbs: VerbList): Span[] {
  const out: Span[] = [];
  let cur = span;
  for (let guard = 0; guard < 20; guard++) {
    const re = /[,?!\u2026]\s+/g;
    re.lastIndex = cur.start;
    let cut: { speechEnd: number; tagStart: number; tagEnd: number } | null = null;
    for (let m = re.exec(text); m && m.index < cur.end; m = re.exec(text)) {
      const tagStart = m.index + m[0].length;
      if (tagStart >= cur.end) break;
      const ws = wordsIn(text, tagStart, cur.end, 8);
      const n = tagLength(ws, verbs);
      if (n <= 0) continue;
      // "said nothing", "he said that…": not a tag.
      const after = ws[n]?.w;
      if (after === 'nothing' || after === 'that' || after === 'not') continue;
      const verbEnd = ws[n - 1].end;
      let tagEnd: number;
      const rest = text.slice(verbEnd, cur.end);
      const comma = /^\s*,\s*/.exec(rest);
      const nextWord = comma ? wordsIn(text, verbEnd + comma[0].length, cur.end, 1)[0] : undefined;
      if (comma && nextWord && !NARRATIVE_LINKS.has(nextWord.w) && !(nextWord.w.length > 4 && nextWord.w.endsWith('ing'))) {
        tagEnd = verbEnd + comma[0].length;
      } else {
        const stop = /[.!?](?=\s|$)/g;
        stop.lastIndex = verbEnd;
        const s = stop.exec(text);
        tagEnd = s && s.index < cur.end ? s.index + 1 : cur.end;
      }
      cut = { speechEnd: m.index + 1, tagStart, tagEnd };
      break;
    }
    if (!cut) break;
    out.push({ open: cur.open, start: cur.start, end: cut.speechEnd, close: cut.speechEnd, ambiguous: [] });
    let s = cut.tagEnd;
    while (s < cur.end && /[\s,.;:]/.test(text[s])) s++;
    if (s >= cur.end || !LETTER.test(text.slice(s, cur.end))) return out;
    cur = { open: s - 1, start: s, end: cur.end, close: cur.close, ambiguous: [] };
  }
  out.push(cur);
  return out;
}

function trimEnd(text: string, from: number, to: number): number {
  let e = to;
  while (e > from && /\s/.test(text[e - 1])) e--;
  return e;
}

/** Speech start after a dash at d: past spaces (and, after an aside, past the punctuation it left: "—. They say"). */
function contentStart(text: string, d: number, b: number, afterAside: boolean): number {
  let k = d + 1;
  while (k < b && (/\s/.test(text[k]) || (afterAside && /[.,;:]/.test(text[k])))) k++;
  return k;
}

/** The speech spans of a paragraph text[a, b) printed in the dash convention (see the module comment). */
export function scanDashParagraph(text: string, a: number, b: number, verbs: VerbList): Span[] {
  let d = -1;
  if (isDash(text, a)) d = a;
  else {
    // "He said: — Come in."
    const m = /:\s*[\u2014\u2013\u2015]\s*(?=[\p{L}\p{N}])/u.exec(text.slice(a, b));
    if (m) d = a + m.index + m[0].search(DASH);
  }
  if (d < 0) return [];
  const spans: Span[] = [];
  let afterAside = false;
  while (d >= 0 && d < b) {
    const start = contentStart(text, d, b, afterAside);
    if (start >= b) break;
    // The dash that ends this speech, if any.
    let end = -1;
    for (let j = start; j < b; j++) {
      if (!isDash(text, j)) continue;
      if (LETTER.test(text[j - 1] ?? '') && LETTER.test(text[j + 1] ?? '')) continue; // a dash between two letters: a break in a word or a stammer
      if (!LETTER.test(text.slice(j + 1, b))) break; // a trailing break: the speech runs to the end
      if (narrativeAfter(text, j, b, verbs)) {
        end = j;
        break;
      }
    }
    const stop = end >= 0 ? end : b;
    const e = trimEnd(text, start, stop);
    if (e > start && LETTER.test(text.slice(start, e))) {
      spans.push(...splitRunOnTags(text, { open: d, start, end: e, close: end, ambiguous: [] }, verbs));
    }
    if (end < 0) break;
    // The aside runs to the next dash (not one inside a word) that has speech after it.
    let next = -1;
    for (let j = end + 1; j < b; j++) {
      if (!isDash(text, j)) continue;
      if (LETTER.test(text[j - 1] ?? '') && LETTER.test(text[j + 1] ?? '')) continue; // a dash inside a word
      if (LETTER.test(text.slice(j + 1, b))) {
        next = j;
        break;
      }
    }
    d = next;
    afterAside = true;
  }
  return spans;
}
