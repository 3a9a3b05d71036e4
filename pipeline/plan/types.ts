/**
 * The resolved plan: what later stages read. Everything is validated,
 * defaults are filled, files are absolute paths (with the path as written),
 * and every entry knows where it stands in the YAML so that later problems
 * about it can point there.
 */
import type { Problem } from '../problems/problem.ts';
import type { DialogueData, NoteAnchor, Pronoun } from './schema.ts';

/** Where an entry is written in the plan: spread it into a Problem. */
export interface Where {
  /** The plan file, relative to the working directory when inside it (as in Problem.file). */
  file: string;
  /** 1-based line of the entry's first key. */
  line: number;
  /** 1-based column of the entry's first key. */
  column: number;
  /** Path inside the plan, e.g. "rooms[1].panels[2]". */
  path: string;
}

/** A file named in the plan. */
export interface PlanFile {
  /** The path exactly as written in the plan (relative to the exhibit folder). */
  written: string;
  /** Absolute path; checked to exist and to stay inside the exhibit folder. */
  absolute: string;
}

export interface PlanExhibit {
  title: string;
  subtitle?: string;
  organiser: string;
  /** ISO 639-1 code; default "en". */
  language: string;
  /** Base path the site is served under, starting and ending with "/"; default "/". */
  base: string;
  /** The public address of the home page, an absolute http(s) URL as written. */
  url?: string;
  credit?: string;
  intro?: PlanFile;
  rights?: PlanFile;
  /** Where the `exhibit:` key is written. */
  where: Where;
}

export interface PlanText {
  id: string;
  source: PlanFile;
  /** Only "plain" in version 1. */
  format: 'plain';
  start?: string;
  end?: string;
  /** Chapter-heading pattern as written; compiles with the "i" flag. */
  chapters?: string;
  edition?: string;
  /** The text's title as printed, and its author. */
  title?: string;
  author?: string;
  /** Extra speech verbs and curator pins (speakers checked against the cast). */
  dialogue: DialogueData;
  where: Where;
}

export interface PlanLexicon {
  id: string;
  file: PlanFile;
  licence?: string;
  where: Where;
}

export interface PlanCastMember {
  id: string;
  name: string;
  /** Default []. Aliases shared with another member were reported as warnings and are kept here. */
  aliases: string[];
  pronoun?: Pronoun;
  where: Where;
  /** Where the name and each alias are written. */
  nameWhere: Where;
  aliasWhere: Where[];
}

export interface PlanNote {
  /** Exactly one of chapter (1-based; with a paragraph in it, 1-based), character (a cast id, checked), word, segment (1-based). */
  at: NoteAnchor;
  text: string;
  where: Where;
}

export interface PlanPanel {
  id: string;
  /** Id of the room holding the panel. */
  room: string;
  title: string;
  /** Id of the text the panel reads (filled in when the plan has one text). */
  text: string;
  /** A registered measure that supports `chart`. */
  measure: string;
  /** Output of the measure's params schema (defaults filled). */
  params: unknown;
  chart: string;
  /** Output of the chart's options schema (defaults filled). */
  options: unknown;
  caption: PlanFile;
  alt?: string;
  /** Default []. */
  notes: PlanNote[];
  where: Where;
}

export interface PlanRoom {
  id: string;
  title: string;
  intro?: PlanFile;
  panels: PlanPanel[];
  where: Where;
}

export interface Plan {
  version: 1;
  /** Absolute path of the plan file. */
  file: string;
  /** Absolute path of the exhibit folder (the folder holding the plan). */
  dir: string;
  exhibit: PlanExhibit;
  texts: PlanText[];
  /** Default [] (no cast). */
  cast: PlanCastMember[];
  /** Default [] (none). */
  lexicons: PlanLexicon[];
  rooms: PlanRoom[];
  /** Every panel of every room, in plan order (the same objects as in `rooms`). */
  panels: PlanPanel[];
}

export interface PlanResult {
  /** The resolved plan, or null when any problem is an error. */
  plan: Plan | null;
  /** Every problem found (errors and warnings), sorted by line then column. */
  problems: Problem[];
  /** Absolute path of the exhibit folder. */
  dir: string;
  /** Absolute path of the plan file. */
  file: string;
}

export interface LoadOptions {
  /** Folder that relative plan paths and shown file names are relative to. Default: process.cwd(). */
  cwd?: string;
}
