/**
 * What a chart receives and returns. Charts are dumb: they draw a dataset that a
 * measure's view prepared, and never compute a measure themselves.
 */

export interface TableColumn {
  key: string;
  label: string;
  numeric: boolean;
}

/** A data table: shown beside every chart and offered as CSV/JSON. */
export interface Table {
  columns: TableColumn[];
  rows: (string | number | null)[][];
}

/** A curator's note pinned to the data, already resolved by the pipeline. */
export interface PinnedNote {
  /** Short label drawn in the chart ("1", "2", …) and repeated beside it. */
  label: string;
  text: string;
  /** What the note points at, in the dataset's own terms. */
  at: {
    /** A category of a bars dataset (its `categories[i]`), or a row of a strip. */
    category?: string;
    /** A position on the x axis of a lines/strip dataset, in its own units (segment index, or 0..1 for a strip). */
    x?: number;
    /** A series id (lines) to attach the note to. */
    series?: string;
  };
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

export type ChartData = BarsData | LinesData | StripData;

export interface ChartOutput {
  svg: string;
  /** One or two sentences stating the main finding in words. */
  alt: string;
  table: Table;
  /**
   * The same chart laid out for a narrow viewBox (360 units wide, for phones);
   * its ids differ from `svg`'s so both can sit on one page.
   */
  svgNarrow?: string;
  /** Labels of the notes that were not drawn because their target is not in the data. */
  skippedNotes?: string[];
}
