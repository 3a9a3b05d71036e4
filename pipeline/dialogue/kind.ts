/**
 * Speech or written words? A quotation is `text` (not counted as speech) when
 *   1. a cue word stands just before its opening mark, with only a colon or a
 *      comma between: words for what is written or shown ("read", "signed",
 *      "headed", "marked", "entitled", "the word", "the sign") — or, with
 *      nothing but a space between, at most six words quoted and no
 *      punctuation at their end, words that name ("called", "named", "known
 *      as": a boat called “Heron”);
 *   2. it opens its paragraph, and the paragraph before ends with a colon
 *      after such a cue or a word for a written thing (letter, note, card,
 *      notice, paint): a letter or a notice set out on its own — or the
 *      paragraph before has such a word in its last sentence and the
 *      quotation is shaped like a letter or a notice (a salutation such as
 *      "Dear Tam," or "Sir,", a closing such as "Your brother," or "Yours
 *      truly", or a heading word in capitals such as "NOTICE.");
 *   3. it is short (at most four words), sits inside a narrative sentence (a
 *      word, not punctuation, just before the opening mark; a lower-case word
 *      or punctuation after the closing mark), and no speech verb stands within
 *      three words on either side: a scare-quoted word or a title in passing.
 * Everything else is speech.
 */

import type { Span } from './scan.ts';
import type { VerbList } from './verbs.ts';
import { tokenise } from '../text/tokens.ts';

/** Cue words for written or displayed words; may be followed by a colon or comma. common practice, no source. */
export const WRITTEN_CUES: ReadonlySet<string> = new Set([
  'read', 'reads', 'signed', 'headed', 'entitled', 'titled', 'labelled', 'labeled', 'marked', 'inscribed',
  'lettered', 'stamped', 'carved', 'printed', 'painted', 'engraved', 'chalked', 'scrawled', 'pencilled', 'penciled',
  'word', 'words', 'motto', 'legend', 'sign', 'notice', 'placard', 'heading', 'caption', 'spelled', 'spelt', 'title',
  'inscription', 'wrote', 'written', 'writes', 'writing', 'reading',
]);

/** Cue words that name; only with nothing but a space before the mark. common practice, no source. */
export const NAMING_CUES: ReadonlySet<string> = new Set(['called', 'named', 'nicknamed', 'dubbed', 'christened', 'as', 'so-called', 'styled']);

/** Written things announced by a paragraph ending in a colon. common practice, no source. */
export const WRITTEN_THINGS: ReadonlySet<string> = new Set([
  'letter', 'letters', 'lettering', 'note', 'card', 'message', 'telegram', 'notice', 'inscription', 'placard', 'sign',
  'bill', 'postcard', 'entry', 'page', 'verse', 'epitaph', 'will', 'advertisement', 'label', 'ticket', 'paper', 'list',
  'read', 'ran', 'wrote', 'written', 'follows', 'board', 'paint', 'poster', 'headline', 'handwriting', 'hand',
]);

/** A salutation, a closing or a heading in capitals: the shape of a letter or a notice. common practice, no source. */
export function letterShaped(s: string): boolean {
  const t = s.trim();
  if (/^(?:my\s+)?(?:dear|dearest)\s+[\p{L}.\s]{1,40}[,\u2014—]/iu.test(t)) return true;
  if (/^(?:sir|madam|sirs|gentlemen)\s*[,\u2014—:]/iu.test(t)) return true;
  if (/^\p{Lu}{4,}[.:!]/u.test(t)) return true;
  return /(?:yours(?:\s+\p{L}+)?|your\s+(?:affectionate|loving|obedient|humble|devoted|sincere)?\s*\p{L}+)\s*,[^,]{1,60}$/iu.test(t.slice(-90));
}

function lowerWords(s: string): string[] {
  return tokenise(s).map((t) => s.slice(t.start, t.end).toLowerCase().replace(/\u2019/g, "'"));
}

/** Decide the kind of the quotation `span` in the paragraph text[a, b); `prev` is the previous paragraph of the chapter. */
export function quoteKind(
  text: string,
  span: Span,
  a: number,
  b: number,
  prev: { start: number; end: number } | null,
  verbs: VerbList,
): 'speech' | 'text' {
  const before = text.slice(Math.max(a, span.open - 80), span.open);
  const gap = /[\s:,\u2014\u2013-]*$/.exec(before)![0];
  const beforeWords = lowerWords(before.slice(0, before.length - gap.length));
  const cue = beforeWords.at(-1);
  const quoted = tokenise(text.slice(span.start, span.end)).length;

  // 1. A cue word just before the mark.
  if (cue !== undefined && !/[.!?;]/.test(gap)) {
    if (WRITTEN_CUES.has(cue)) return 'text';
    if (NAMING_CUES.has(cue) && /^\s+$/.test(gap) && quoted <= 6 && !/[.,!?\u2026]$/.test(text.slice(span.start, span.end))) {
      if (cue !== 'as' || beforeWords.at(-2) === 'known') return 'text';
    }
  }

  // 2. A paragraph announced by "The letter ran thus:", or a letter after "She read it by the lamp."
  if (span.open === a && prev) {
    const p = text.slice(prev.start, prev.end).trimEnd();
    const written = (w: string): boolean => WRITTEN_THINGS.has(w) || WRITTEN_CUES.has(w);
    if (p.endsWith(':') && lowerWords(p.slice(-160)).slice(-8).some(written)) return 'text';
    const lastSentence = p.slice(Math.max(0, p.slice(0, -1).search(/[.!?][^.!?]*$/)));
    if (lowerWords(lastSentence).some(written) && letterShaped(text.slice(span.start, span.end))) return 'text';
  }

  // 3. A short quotation inside a narrative sentence, no speech verb near.
  if (quoted <= 4 && span.open > a && /^\s+$/.test(gap) && /\p{L}$/u.test(before.slice(0, before.length - gap.length))) {
    const endAt = span.close >= 0 ? span.close + 1 : b;
    const after = text.slice(endAt, Math.min(b, endAt + 60));
    const afterOk = endAt >= b || /^[\s]*[,.;:)!?\u2014\u2013-]/.test(after) || /^\s+\p{Ll}/u.test(after);
    const inside = text.slice(span.start, span.end);
    const speechLike = /[!?]$/.test(inside.trim());
    const near = [...beforeWords.slice(-3), ...lowerWords(after).slice(0, 3)];
    if (afterOk && !speechLike && !near.some((w) => verbs.single.has(w))) return 'text';
  }
  return 'speech';
}
