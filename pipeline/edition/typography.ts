/**
 * A paragraph of a plain text as a printed page sets it: the typography that a
 * plain-text source can only mark by convention, read back into forms a page
 * can show. Every rule is how printed books and plain-text e-texts work:
 *
 * - Italics. E-texts mark italic words with underscores, `_like this_`: an
 *   underscore that opens (after a space, a punctuation mark or the start,
 *   before a letter) and one that closes (after a non-space, before anything
 *   but a letter or digit) in the same paragraph. A lone underscore stays.
 * - Small capitals. A plain text can only print small capitals as capitals:
 *   words of two or more capital letters in a paragraph that also has small
 *   letters (`NOTICE`, `CLOSED`, an `A.D.`-style abbreviation, a Roman
 *   numeral) are set in small capitals, as printers set such words. A
 *   paragraph entirely in capitals (an inscription) is left in capitals.
 * - Set-off blocks. A paragraph whose every line is indented further than the
 *   text's ordinary paragraphs is set off from the prose, as a letter, a
 *   notice or an extract is in print. When its lines are short (none reaches
 *   three quarters of the wrap width) it is verse, and each line is kept with
 *   its own indentation; otherwise it is an indented block of prose.
 * - Verse in running text: two or more short lines each opening with a
 *   capital (the rule the heading detection uses, text/structure.ts) keep
 *   their line breaks.
 * - Deliberate line breaks. In wrapped prose a line that ends well short of
 *   the wrap width (under three fifths of it) before the paragraph's end was
 *   ended on purpose (a letter's salutation, its closing, an address), and so
 *   was one before a line indented further than itself (a signature set
 *   towards the right): the break is kept, with the deeper indentation. Other line breaks are only the wrapping, and become spaces.
 *   In a text of unwrapped paragraphs (one line each) every line break in a
 *   paragraph was made on purpose and is kept.
 * - A paragraph with no letters or digits (`* * *`) is a section break.
 *
 * Pure: the paragraph's lines and the text's measurements in, plain JSON out.
 * The words are never changed, only marked, so every word a reader sees is a
 * word the text model counted.
 */
import { isVerseLines } from '../text/structure.ts';

/** A run of a paragraph, as the page sets it. */
export type Inline =
  /** Plain text. */
  | { t: 'text'; v: string }
  /** Italic (underscores in the source), holding runs of its own. */
  | { t: 'i'; c: Inline[] }
  /** Small capitals: the words as printed in capitals. */
  | { t: 'sc'; v: string }
  /** A line break kept from the source; `indent` is the next line's indentation, in character widths. */
  | { t: 'br'; indent?: number };

export type ParagraphForm =
  /** Ordinary prose. */
  | 'prose'
  /** Lines kept, each with its indentation: a poem, a song, a signature. */
  | 'verse'
  /** An indented block of prose: a letter, a notice, an extract. */
  | 'set-off'
  /** A section break: a paragraph of ornaments only. */
  | 'break';

export interface SetParagraph {
  form: ParagraphForm;
  /** Indentation of the first line (verse only), in character widths. */
  indent?: number;
  content: Inline[];
}

/** What a paragraph is measured against: the text's wrap width and its ordinary indentation. */
export interface PageMeasure {
  /** The wrap width of the text's prose (Infinity: paragraphs are single lines). */
  wrap: number;
  /** The usual indentation of a paragraph's first line, and of its other lines. */
  firstIndent: number;
  indent: number;
}

/** Indentations deeper than this are shown at this depth (a centred signature is not a column). */
const MOST_INDENT = 24;

/** Width of the white space opening a line: a tab counts four. */
export function indentOf(line: string): number {
  let w = 0;
  for (const ch of line) {
    if (ch === ' ' || ch === '\u00a0') w++;
    else if (ch === '\t') w += 4;
    else break;
  }
  return w;
}

function mode(values: readonly number[]): number {
  const counts = new Map<number, number>();
  let best = 0;
  let bestCount = 0;
  for (const v of values) {
    const c = (counts.get(v) ?? 0) + 1;
    counts.set(v, c);
    if (c > bestCount || (c === bestCount && v < best)) {
      best = v;
      bestCount = c;
    }
  }
  return best;
}

/**
 * The text's ordinary indentation, from the lines of all its paragraphs (each paragraph's
 * lines as they stand in the source, the first with its leading white space): the most
 * common indentation of first lines and of the other lines.
 */
export function ordinaryIndent(paragraphs: readonly (readonly string[])[]): { firstIndent: number; indent: number } {
  const first: number[] = [];
  const rest: number[] = [];
  for (const lines of paragraphs) {
    lines.forEach((l, k) => (k === 0 ? first : rest).push(indentOf(l)));
  }
  return { firstIndent: mode(first), indent: rest.length ? mode(rest) : mode(first) };
}

/** Whether a paragraph's lines stand further in than the text's ordinary paragraphs (by two or more). */
function isIndented(lines: readonly string[], m: PageMeasure): boolean {
  return lines.every((l, k) => indentOf(l) >= (k === 0 ? m.firstIndent : m.indent) + 2);
}

/**
 * Sets one paragraph. `lines` are its lines as they stand in the source, the first with
 * its leading white space (the paragraph's own indentation), without blank lines.
 */
export function setParagraph(lines: readonly string[], m: PageMeasure): SetParagraph {
  const trimmed = lines.map((l) => l.trim());
  const joined = trimmed.join(' ');
  if (!/[\p{L}\p{N}]/u.test(joined)) return { form: 'break', content: [{ t: 'text', v: joined }] };
  const indented = isIndented(lines, m);
  const short = trimmed.every((l) => l.length < 0.75 * m.wrap);
  const verse = (indented && trimmed.length >= 2 && short) || isVerseLines(trimmed, m.wrap);
  if (verse) {
    const least = Math.min(...lines.map(indentOf));
    const depth = (l: string) => Math.min(MOST_INDENT, indentOf(l) - least);
    const source = trimmed.join('\n');
    const breaks = lines.slice(1).map(depth);
    const first = depth(lines[0]!);
    return { form: 'verse', ...(first > 0 ? { indent: first } : {}), content: inlines(source, caseOf(source), breaks) };
  }
  // Prose: wrapped lines joined, deliberate breaks kept.
  const least = Math.min(...lines.map(indentOf));
  let source = trimmed[0]!;
  const breaks: number[] = [];
  for (let k = 1; k < trimmed.length; k++) {
    const deeper = indentOf(lines[k]!) > indentOf(lines[k - 1]!);
    const deliberate = m.wrap === Infinity || trimmed[k - 1]!.length < 0.6 * m.wrap || deeper;
    source += (deliberate ? '\n' : ' ') + trimmed[k];
    if (deliberate) breaks.push(Math.min(MOST_INDENT, indentOf(lines[k]!) - least));
  }
  return { form: indented ? 'set-off' : 'prose', content: inlines(source, caseOf(source), breaks) };
}

/** Whether small capitals apply: the paragraph has small letters too. */
function caseOf(source: string): boolean {
  return /\p{Ll}/u.test(source);
}

/** Opening and closing underscores of italics, as index pairs into `s`. */
function italicSpans(s: string): [number, number][] {
  const spans: [number, number][] = [];
  const wordChar = (c: string | undefined) => c !== undefined && /[\p{L}\p{N}_]/u.test(c);
  const space = (c: string | undefined) => c === undefined || /\s/u.test(c);
  let open = -1;
  for (let i = 0; i < s.length; i++) {
    if (s[i] !== '_') continue;
    const before = i > 0 ? s[i - 1] : undefined;
    const after = s[i + 1];
    if (open < 0) {
      if (!wordChar(before) && !space(after) && after !== '_') open = i;
    } else if (!space(before) && before !== '_' && !wordChar(after)) {
      spans.push([open, i]);
      open = -1;
    }
  }
  return spans;
}

/** Words of two or more capitals, and runs of them separated by white space only. */
const CAPITALS = /(?<![\p{L}\p{N}])\p{Lu}(?:[\p{Lu}\p{M}.'’-]*\p{Lu})(?:\s+\p{Lu}(?:[\p{Lu}\p{M}.'’-]*\p{Lu}))*(?![\p{L}\p{N}])/gu;

/** The runs of a stretch of text without underscores: small capitals marked, line breaks as `br`. */
function plainRuns(s: string, smallCaps: boolean, breaks: number[], out: Inline[]): void {
  const parts = s.split('\n');
  parts.forEach((part, k) => {
    if (k > 0) {
      const indent = breaks.shift() ?? 0;
      out.push(indent > 0 ? { t: 'br', indent } : { t: 'br' });
    }
    if (!smallCaps) {
      if (part) out.push({ t: 'text', v: part });
      return;
    }
    let at = 0;
    for (const m of part.matchAll(CAPITALS)) {
      if (m.index > at) out.push({ t: 'text', v: part.slice(at, m.index) });
      out.push({ t: 'sc', v: m[0] });
      at = m.index + m[0].length;
    }
    if (at < part.length) out.push({ t: 'text', v: part.slice(at) });
  });
}

/** The runs of a paragraph's text, whose line breaks (`\n`) are kept, `breaks` giving each one's next indentation. */
export function inlines(source: string, smallCaps: boolean, breaks: number[] = []): Inline[] {
  const queue = [...breaks];
  const out: Inline[] = [];
  let at = 0;
  for (const [a, b] of italicSpans(source)) {
    plainRuns(source.slice(at, a), smallCaps, queue, out);
    const inner: Inline[] = [];
    plainRuns(source.slice(a + 1, b), smallCaps, queue, inner);
    out.push({ t: 'i', c: inner });
    at = b + 1;
  }
  plainRuns(source.slice(at), smallCaps, queue, out);
  return merge(out);
}

/** Adjacent text runs as one. */
function merge(runs: Inline[]): Inline[] {
  const out: Inline[] = [];
  for (const r of runs) {
    const last = out[out.length - 1];
    if (r.t === 'text' && last?.t === 'text') last.v += r.v;
    else out.push(r);
  }
  return out;
}

/** The words of a set paragraph as a reader sees them (markup gone, line breaks as spaces). */
export function plainText(content: readonly Inline[]): string {
  return content.map((r) => (r.t === 'i' ? plainText(r.c) : r.t === 'br' ? ' ' : r.v)).join('');
}
