/**
 * Front and back matter trimming: by the plan's marker lines, or, where the
 * plan gives none, by the licence header and footer that e-text archives put
 * around a public-domain text ("*** START OF THE … ***" above the text,
 * "*** END OF THE … ***" below it, often with an "End of the … e-book" line
 * just above the end marker).
 */

import type { TextWarning } from './model.ts';
import { wording } from '../problems/problem.ts';

export interface TrimCut {
  /** Offsets in the text of the first and just past the last trimmed character. */
  start: number;
  end: number;
  /** The marker line as it stands (trimmed), or the plan's marker. */
  marker: string;
  automatic: boolean;
}

export interface TrimResult {
  /** Offset of the first kept character. */
  start: number;
  /** Offset just past the last kept character. */
  end: number;
  /** What was cut from the front and the back, if anything. */
  front: TrimCut | null;
  back: TrimCut | null;
  warnings: TextWarning[];
}

/** The header's last line. Variants: with or without spaces after the asterisks, THE or THIS. common practice, no source. */
const ETEXT_START = /^[ \t]*\*{3,}[ \t]*START OF (?:THE|THIS)\b.*$/im;
/** The end of the header in older e-texts. common practice, no source. */
const ETEXT_SMALL_PRINT_END = /^[ \t]*\*END\*[ \t]*THE SMALL PRINT\b.*$/im;
/** The footer's first line. */
const ETEXT_END = /^[ \t]*\*{3,}[ \t]*END OF (?:THE|THIS)\b.*$/im;
/** "End of the … e-book/e-text of …", the closing line some e-texts print above the end marker (or without one). */
const ETEXT_END_LINE = /^[ \t]*End of (?:the |this )?.{0,100}?\be-?(?:book|text)s?\b.*$/im;

function lineEnd(text: string, at: number): number {
  const nl = text.indexOf('\n', at);
  return nl === -1 ? text.length : nl;
}

function lineStart(text: string, at: number): number {
  return text.lastIndexOf('\n', at - 1) + 1;
}

/** The first match of `re` at or after `from`, as the offsets of its line. */
function findLine(text: string, re: RegExp, from: number): { start: number; end: number } | null {
  const m = new RegExp(re.source, re.flags.includes('g') ? re.flags : re.flags + 'g');
  m.lastIndex = from;
  const hit = m.exec(text);
  return hit ? { start: hit.index, end: hit.index + hit[0].length } : null;
}

/** The e-text licence header's last line and the footer's first line, where the text has them. */
export function findEtextMarkers(text: string): { header: { start: number; end: number } | null; footer: { start: number; end: number } | null } {
  const header = findLine(text, ETEXT_START, 0) ?? findLine(text, ETEXT_SMALL_PRINT_END, 0);
  const from = header ? header.end : 0;
  let footer = findLine(text, ETEXT_END, from);
  if (footer) {
    // An "End of the … e-book" line among the few non-blank lines above the end marker starts the footer.
    let at = footer.start;
    for (let k = 0; k < 3 && at > from; k++) {
      let s = lineStart(text, at - 1);
      while (s > from && text.slice(s, lineEnd(text, s)).trim() === '') s = lineStart(text, s - 1);
      const line = { start: s, end: lineEnd(text, s) };
      if (line.start < from) break;
      // Right above the end marker, any "End of …" line closes the text ("End of the … e-book of X", "End of X's Y, by Z").
      if (/^[ \t]*End of\b/i.test(text.slice(line.start, line.end))) {
        footer = line;
        break;
      }
      at = line.start;
    }
  } else {
    // No end marker: a closing "End of the … e-book" line in the second half of the text still starts a footer.
    const half = Math.max(from, Math.floor(text.length / 2));
    let last: { start: number; end: number } | null = null;
    for (let hit = findLine(text, ETEXT_END_LINE, half); hit; hit = findLine(text, ETEXT_END_LINE, hit.end)) last = hit;
    footer = last;
  }
  return { header, footer };
}

/**
 * Keep the text after the line containing `startMarker` (that line dropped)
 * and before the first later line containing `endMarker` (that line dropped
 * too). Markers match case-sensitively anywhere in a line. A marker that is
 * given but not found trims nothing on its side and yields a warning. A side
 * without a marker is trimmed at the e-text licence header or footer, when the
 * text has one.
 */
export function trimByMarkers(
  text: string,
  startMarker: string | undefined,
  endMarker: string | undefined,
  position: (offset: number) => { line: number; column: number },
  /** The text's id, named in warnings. */
  id: string,
): TrimResult {
  const warnings: TextWarning[] = [];
  let start = 0;
  let end = text.length;
  let front: TrimCut | null = null;
  let back: TrimCut | null = null;
  const auto = startMarker === undefined || startMarker === '' || endMarker === undefined || endMarker === '' ? findEtextMarkers(text) : null;
  if (startMarker !== undefined && startMarker !== '') {
    const at = text.indexOf(startMarker);
    if (at === -1) {
      warnings.push(wording('text/marker-not-found', { id, marker: startMarker, end: 'start' }));
    } else {
      const nl = text.indexOf('\n', at + startMarker.length);
      start = nl === -1 ? text.length : nl + 1;
      front = { start: 0, end: start, marker: startMarker, automatic: false };
    }
  } else if (auto?.header) {
    const nl = text.indexOf('\n', auto.header.end);
    start = nl === -1 ? text.length : nl + 1;
    front = { start: 0, end: start, marker: text.slice(auto.header.start, auto.header.end).trim(), automatic: true };
  }
  if (endMarker !== undefined && endMarker !== '') {
    const at = text.indexOf(endMarker, start);
    if (at === -1) {
      warnings.push(wording('text/marker-not-found', { id, marker: endMarker, end: 'end', ...(start > 0 ? { after: position(start).line } : {}) }));
    } else {
      const nl = text.lastIndexOf('\n', at - 1);
      end = nl === -1 || nl < start ? start : nl;
      back = { start: lineStart(text, at), end: text.length, marker: endMarker, automatic: false };
    }
  } else if (auto?.footer && auto.footer.start >= start) {
    const nl = text.lastIndexOf('\n', auto.footer.start - 1);
    end = nl === -1 || nl < start ? start : nl;
    back = { start: auto.footer.start, end: text.length, marker: text.slice(auto.footer.start, auto.footer.end).trim(), automatic: true };
  }
  return { start, end, front, back, warnings };
}
