/**
 * Cutting running text to a width from either end, at a word boundary when
 * one is near, with an ellipsis on the cut side: the contexts of a
 * concordance line are cut at the panel edge, the left one from its start.
 */

import { charWidthEm, textWidth } from './svg.ts';
import type { Face } from './svg.ts';

const ELLIPSIS = '\u2026';

/** Bold type runs wider than regular; layout multiplies estimates by this. */
export const BOLD_FACTOR = 1.12;

/** Width of `s` in bold (approximate, erring wide). */
export function boldWidth(s: string, fontSize: number, face: Face = 'sans'): number {
  return textWidth(s, fontSize, face) * BOLD_FACTOR;
}

/** Runs of white space collapsed to one space, ends trimmed. */
export function collapseSpace(s: string): string {
  return String(s).replace(/\s+/g, ' ').trim();
}

/**
 * How many characters of `chars` fit in `maxWidth`, counted from the start
 * (or the end when `fromEnd`), leaving room for an ellipsis.
 */
function fitCount(chars: readonly string[], maxWidth: number, fontSize: number, face: Face, fromEnd: boolean): number {
  const room = maxWidth - textWidth(ELLIPSIS, fontSize, face);
  let width = 0;
  let keep = 0;
  for (let k = 0; k < chars.length; k++) {
    const ch = chars[fromEnd ? chars.length - 1 - k : k];
    const w = charWidthEm(ch, face) * fontSize;
    if (width + w > room) break;
    width += w;
    keep++;
  }
  return keep;
}

/**
 * `s` cut to fit `maxWidth`, keeping its start and ending with "…". A word
 * cut in the middle is dropped, unless it is the only one that fits.
 */
export function clipEnd(s: string, maxWidth: number, fontSize: number, face: Face = 'sans'): string {
  const text = collapseSpace(s);
  if (textWidth(text, fontSize, face) <= maxWidth) return text;
  const chars = Array.from(text);
  const keep = fitCount(chars, maxWidth, fontSize, face, false);
  let kept = chars.slice(0, keep).join('');
  const cutInWord = keep < chars.length && chars[keep] !== ' ' && !kept.endsWith(' ');
  if (cutInWord) {
    const space = kept.lastIndexOf(' ');
    if (space > 0) kept = kept.slice(0, space);
  }
  // A comma or colon left before the ellipsis reads as a stutter: drop it.
  kept = kept.trimEnd().replace(/[,;:\u2013\u2014-]+$/u, '').trimEnd();
  return kept ? `${kept}${ELLIPSIS}` : ELLIPSIS;
}

/**
 * `s` cut to fit `maxWidth`, keeping its end and starting with "…". A word
 * cut in the middle is dropped, unless it is the only one that fits.
 */
export function clipStart(s: string, maxWidth: number, fontSize: number, face: Face = 'sans'): string {
  const text = collapseSpace(s);
  if (textWidth(text, fontSize, face) <= maxWidth) return text;
  const chars = Array.from(text);
  const keep = fitCount(chars, maxWidth, fontSize, face, true);
  let kept = chars.slice(chars.length - keep).join('');
  const cutInWord = keep < chars.length && chars[chars.length - keep - 1] !== ' ' && !kept.startsWith(' ');
  if (cutInWord) {
    const space = kept.indexOf(' ');
    if (space >= 0 && space < kept.length - 1) kept = kept.slice(space + 1);
  }
  kept = kept.trimStart().replace(/^[,;:.\u2013\u2014-]+/u, '').trimStart();
  return kept ? `${ELLIPSIS}${kept}` : ELLIPSIS;
}
