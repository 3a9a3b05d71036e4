/**
 * What a chart receives and returns. Charts are dumb: they draw a dataset that a
 * measure's view prepared, and never compute a measure themselves.
 */

import type * as kinds from './kinds.ts';
import type { DataOf } from './chart.ts';

export interface TableColumn {
  key: string;
  label: string;
  numeric: boolean;
}

/** A data table: shown beside every chart and offered as CSV/JSON. */
export interface Table {
  columns: TableColumn[];
  rows: (string | number | null)[][];
  /**
   * Where each row stands in the text, for rows that are places in it (a concordance line, a
   * quotation, a word's occurrences): the first word of each place, as a token index through
   * the whole text (null for a row that is no place). The site links each to its paragraph of
   * the reading edition. Absent when the rows are not places in the text.
   */
  places?: (number[] | null)[];
}

/**
 * What a note points at: in the text's terms, as the plan gives it once the
 * notes stage has made it exact (`TextAt`), or in the dataset's own terms
 * (`DataAt`). Each kind's `place` resolves either, once (see chart.ts).
 */
export type NoteAt = TextAt | DataAt;

/** A chapter (its number from 1, and its title), a character (cast id and name), a word or phrase as typed, or an equal segment (from 1, of `of` when the measure counted by segments). */
export type TextAt =
  | { chapter: number; title: string }
  | { character: string; name: string }
  | { word: string }
  | { segment: number; of: number | null };

/** A target in the dataset's own terms; keys a kind does not use leave the note beside the chart. */
export interface DataAt {
  /** A category of a bars dataset (its `categories[i]`), a row of a strip or matrix, a node, point, item or panel, by id or name. */
  category?: string;
  /** A position on the x axis of a lines/strip dataset, in its own units (segment index, or 0..1 for a strip); a line or span index of a concordance or text map. */
  x?: number;
  /** A series id (lines) to attach the note to. */
  series?: string;
}

/** A curator's note pinned to the data. */
export interface PinnedNote {
  /** Short label drawn in the chart ("1", "2", …) and repeated beside it. */
  label: string;
  text: string;
  at: NoteAt;
}

/** What became of one note: drawn, or why not, and the chart's words for its target when it has them. */
export interface NoteOutcome {
  label: string;
  /** "drawn"; "beside": the chart shows the target but has no place for the note; "absent": the chart does not show the target. */
  placed: 'drawn' | 'beside' | 'absent';
  /** The chart's own words for the target ("Segment 3 (words 1201–1800)"), when it has them. */
  words?: string;
}

/** Bars: one bar per category per series. */
export interface BarsData {
  kind: 'bars';
  /** Accessible name of the chart. */
  title: string;
  categoryLabel: string;
  valueLabel: string;
  categories: string[];
  series: { id: string; name: string; values: number[] }[];
  /** How values are formatted: 'count' (integers), 'share' (0..1 shown as %), 'decimal'. */
  format: 'count' | 'share' | 'decimal';
}

/** Lines over narrative time: `points` positions along the text, each a chapter or an equal segment. */
export interface LinesData {
  kind: 'lines';
  title: string;
  xLabel: string;
  yLabel: string;
  /** Label of each position (chapter title or "Segment 3 (words 1201–1800)"). */
  points: string[];
  /** Short tick label of each position ("I", "II", … or "3"). */
  ticks: string[];
  series: { id: string; name: string; values: number[] }[];
  format: 'count' | 'share' | 'decimal';
  /** Optional bands drawn behind their series. */
  bands?: LinesBand[];
}

/** A dispersion strip: one row per term or character, a mark at every occurrence along the text. */
export interface StripData {
  kind: 'strip';
  title: string;
  rows: { id: string; name: string; positions: number[] }[]; // positions in 0..1 of the text (by token index)
  /** Chapter boundaries as positions 0..1, with their labels. */
  boundaries: { at: number; label: string; title: string }[];
  /** Total tokens, for the table and the alt text. */
  totalTokens: number;
}

/** Lines over narrative time may carry a band (e.g. the spread behind a smoothed arc). */
export interface LinesBand {
  /** The series the band belongs to. */
  series: string;
  low: number[];
  high: number[];
}

/** A heatmap: rows × columns of values, in the order given (measures order them). */
export interface MatrixData {
  kind: 'matrix';
  title: string;
  rowLabel: string;
  columnLabel: string;
  rows: { id: string; name: string }[];
  columns: { id: string; name: string }[];
  /** values[r][c]. */
  values: number[][];
  valueLabel: string;
  format: 'count' | 'share' | 'decimal';
}

/** A network: nodes with a size measure and a community, weighted edges. */
export interface NetworkData {
  kind: 'network';
  title: string;
  nodes: { id: string; name: string; size: number; community: number }[];
  edges: { source: string; target: string; weight: number }[];
  /** What node size shows, e.g. "Weighted degree". */
  sizeLabel: string;
  /** What edge weight counts, e.g. "Paragraphs shared". */
  weightLabel: string;
}

/** A word tree: a hierarchy of continuations from a root phrase (d3-hierarchy ready). */
export interface TreeNode {
  word: string;
  count: number;
  children: TreeNode[];
  /** The first word (token index) of each occurrence that takes this path, when the measure records them. */
  at?: number[];
}
export interface TreeData {
  kind: 'tree';
  title: string;
  root: TreeNode;
  /** 'right' when the tree shows what follows the phrase, 'left' for what precedes it. */
  direction: 'right' | 'left';
}

/** Keyword-in-context lines, the keyword aligned on a centre axis. */
export interface KwicData {
  kind: 'kwic';
  title: string;
  keyword: string;
  lines: { left: string; keyword: string; right: string; where: string }[];
}

/** Running text where each word or phrase carries a value encoded by type size, weight or colour. */
export interface TextmapData {
  kind: 'textmap';
  title: string;
  /** What the value means, e.g. "Valence (AFINN-165)". */
  valueLabel: string;
  /** Value range for the legend, e.g. [-5, 5]. */
  domain: [number, number];
  /** Spans in reading order; `value` null for plain text (spaces and punctuation included in `text`). */
  spans: { text: string; value: number | null }[];
  /** Optional paragraph breaks: indices into `spans` where a new paragraph starts. */
  breaks?: number[];
}

/** Small multiples: one simple chart per chapter or per character, on shared scales. */
export interface MultiplesData {
  kind: 'multiples';
  title: string;
  panels: { id: string; title: string; data: BarsData | LinesData }[];
}

/** A scatter plot of labelled points. */
export interface ScatterData {
  kind: 'scatter';
  title: string;
  xLabel: string;
  yLabel: string;
  points: { id: string; label: string; x: number; y: number; group?: string }[];
}

/** A treemap of labelled values, optionally grouped. */
export interface TreemapData {
  kind: 'treemap';
  title: string;
  valueLabel: string;
  items: { id: string; label: string; value: number; group?: string }[];
}

/**
 * The data of any chart kind: the union of what each kind registered in
 * kinds.ts draws, so a new kind's data type (declared in its own file) is
 * part of it without being listed here.
 */
export type ChartData = { [K in keyof typeof kinds]: DataOf<(typeof kinds)[K]> }[keyof typeof kinds];

export interface ChartOutput {
  /** The wide layout (720 units). */
  svg: string;
  /**
   * The same chart laid out for a narrow viewBox (360 units wide, for phones);
   * its ids differ from `svg`'s so both can sit on one page.
   */
  svgNarrow: string;
  /** The SVG's description: `summary`, then a sentence for each note drawn. */
  alt: string;
  /** One or two sentences stating the main finding in words, without the notes. */
  summary: string;
  /** The values the chart draws. */
  table: Table;
  /** One entry per note given, in order. */
  notes: NoteOutcome[];
  /** Labels of the notes that were not drawn (every outcome but "drawn"). */
  skippedNotes: string[];
}
