/**
 * The prepared exhibit: everything the site needs, as plain JSON-serialisable
 * data. It is the one seam between the pipeline and Astro: pages read this
 * (through the `virtual:vitrine/exhibit` module) and never import measure code.
 */
import type { MethodCard } from '../measures/types.ts';
import type { Table } from '../charts/types.ts';
import type { Edition, Passage } from '../edition/edition.ts';

export interface PreparedNote {
  label: string;
  text: string;
  /** What the note points at, in words ("Chapter 4: The Flood"). */
  target: string;
  /** Its passage of the panel's text in the reading edition (a chapter, or a paragraph of one), when it points at one. */
  passage: { chapter: number; paragraph: number | null } | null;
}

export interface PreparedPanel {
  id: string;
  room: string;
  title: string;
  text: string;
  measure: string;
  params: Record<string, unknown>;
  chart: string;
  options: Record<string, unknown>;
  svg: string;
  /** The same chart laid out for narrow screens (about 360 px), when the chart kind has one. */
  svgNarrow: string | null;
  /** The chart's description: its summary, then a sentence for each note drawn (or the curator's own alt text). */
  alt: string;
  /** The summary alone, without the notes (or the curator's own alt text): for cards and teasers. */
  summary: string;
  table: Table;
  /** Where each row of the table stands in the reading edition of the panel's text (per row; null for a row that is no place), or null when the rows are not places. */
  passages: (Passage[] | null)[] | null;
  notes: PreparedNote[];
  /** Caption file, relative to the exhibit folder (as written in the plan). */
  caption: string;
  /** The measure's result: offered as the JSON download. */
  data: unknown;
  /** One-line citation of the panel. */
  citation: string;
}

export interface PreparedRoom {
  id: string;
  title: string;
  intro: string | null;
  panels: PreparedPanel[];
}

export interface PreparedParamDoc {
  key: string;
  description: string;
}

export interface PreparedMethod {
  name: string;
  version: number;
  card: MethodCard;
  params: PreparedParamDoc[];
  /** Attribution required by data the measure ships with. */
  credits: string | null;
}

export interface PreparedText {
  id: string;
  /** Its title as printed (the plan's, else its id) and its author. */
  title: string;
  author: string | null;
  source: string;
  edition: string | null;
  hash: string;
  words: number;
  chapters: { number: number; title: string; part: string | null; words: number }[];
  /** The reading edition: every chapter and paragraph, set for the page. */
  pages: Edition;
}

export interface PreparedExhibit {
  exhibit: {
    title: string;
    subtitle: string | null;
    organiser: string;
    language: string;
    base: string;
    /** The public address of the home page (absolute, ending in "/"), or null: then link previews carry no picture or address. */
    url: string | null;
    credit: string | null;
    intro: string | null;
    rights: string | null;
  };
  texts: PreparedText[];
  cast: { id: string; name: string; aliases: string[]; pronoun: string | null }[];
  rooms: PreparedRoom[];
  methods: PreparedMethod[];
  /** Caption and intro files the site renders, relative to the exhibit folder. */
  captionFiles: string[];
  /** Short hash of everything the exhibit was built from. */
  buildHash: string;
  generator: string;
}
