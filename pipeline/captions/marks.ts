/**
 * The words for what a chart draws, by chart kind: a caption that speaks of
 * "cells" on a strip of tick marks, or of "bars" on a line chart, describes a
 * chart the visitor does not see, and is reported as a warning.
 *
 * Only words that name a mark and nothing else in a caption's prose are
 * checked ("line" and "row" are too common in other senses to be read as
 * marks); each kind lists the ones that fit what it draws. Small multiples
 * draw bars or lines in each panel. The vocabulary is the project's own,
 * from the charts it draws (pipeline/charts/). common practice, no source.
 */

/** A mark word and its other forms, as written in a caption. */
const MARK_WORDS: Record<string, RegExp> = {
  bar: /\bbars?\b/gi,
  cell: /\bcells?\b/gi,
  dot: /\bdots?\b/gi,
  circle: /\bcircles?\b/gi,
  rectangle: /\brectangles?\b/gi,
  tile: /\btiles?\b/gi,
  tick: /\bticks?(?: marks?)?\b/gi,
  stroke: /\bstrokes?\b/gi,
  shading: /\b(?:shaded|shading)\b/gi,
  branch: /\bbranch(?:es)?\b/gi,
  bubble: /\bbubbles?\b/gi,
  wedge: /\bwedges?\b/gi,
};

export type MarkWord = keyof typeof MARK_WORDS;

/** The mark words each chart kind may use in its captions: what it draws. */
export const KIND_MARKS: Readonly<Record<string, readonly MarkWord[]>> = {
  bars: ['bar'],
  lines: ['dot'],
  strip: ['tick', 'stroke'],
  matrix: ['cell', 'shading'],
  multiples: ['bar', 'dot'],
  network: ['circle', 'dot'],
  scatter: ['dot', 'circle'],
  treemap: ['rectangle', 'tile', 'shading'],
  tree: ['branch'],
  kwic: [],
  textmap: ['shading'],
};

/** What each kind draws, in words, for the message. */
export const KIND_DRAWS: Readonly<Record<string, string>> = {
  bars: 'bars',
  lines: 'lines over narrative time',
  strip: 'tick marks along a strip',
  matrix: 'shaded cells',
  multiples: 'small bar or line charts',
  network: 'circles joined by lines',
  scatter: 'dots on two axes',
  treemap: 'rectangles sized by count',
  tree: 'branches of words',
  kwic: 'lines of text',
  textmap: 'shaded words of a passage',
};

export interface StrayMark {
  /** As written ("cells"). */
  text: string;
  word: MarkWord;
  index: number;
}

/** Mark words in a stretch of prose that the chart kind does not draw. */
export function strayMarks(prose: string, kind: string): StrayMark[] {
  const allowed = KIND_MARKS[kind];
  if (!allowed) return [];
  const out: StrayMark[] = [];
  for (const [word, re] of Object.entries(MARK_WORDS) as [MarkWord, RegExp][]) {
    if (allowed.includes(word)) continue;
    for (const m of prose.matchAll(re)) out.push({ text: m[0], word, index: m.index });
  }
  return out.sort((a, b) => a.index - b.index);
}
