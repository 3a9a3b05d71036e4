import type { z } from 'zod';
import type { CastMember, Mentions, TextModel } from '../text/model.ts';
import type { ChartData, Table } from '../charts/types.ts';
import type { MarksPlan } from '../dialogue/conventions.ts';

/** A measure's method card: shown on its panel pages and on the methods page. */
export interface MethodCard {
  /** What the measure computes, in a sentence or two for a general reader. */
  what: string;
  /** The formula or procedure, in plain text (may use Unicode maths). */
  formula: string;
  /** Where the method comes from. */
  source: string;
  /** What a careful reader should keep in mind. */
  caveats: string[];
}

/** A curator-supplied word list: word (lower-cased) → the categories it belongs to. */
export interface WordCategories {
  /** The lexicon's id in the plan. */
  id: string;
  /** Every category named in the file, in first-seen order. */
  categories: string[];
  entries: Record<string, string[]>;
}

/** The plan's settings for reading dialogue in a text. */
export interface DialogueSettings {
  /** Speech verbs added to the built-in list ("said", "asked", …). */
  verbs: string[];
  /** Curator corrections: the quotation in `chapter` (1-based) whose words start with `startsWith`. */
  pins: { chapter: number; startsWith: string; speaker: string | null; addressee?: string | null }[];
  /** The marks that set off speech: one convention for the text, or a default and chapters that differ. Default: read from the text. */
  marks?: MarksPlan;
  /** Cast id of a first-person narrator: "I said" in the narrative is theirs. Default: none. */
  narrator?: string | null;
}

/** Everything a measure may read. Built once per text and shared by its panels. */
export interface MeasureContext {
  model: TextModel;
  cast: CastMember[];
  mentions: Mentions;
  /** ISO 639-1 code from the plan. */
  language: string;
  /** Word lists the plan names, parsed, by id. Default: none. */
  lexicons?: Record<string, WordCategories>;
  /** Dialogue settings of the text. Default: no extra verbs, no pins. */
  dialogue?: DialogueSettings;
}

export interface Measure<P = any, R = any> {
  name: string;
  /** Bump when the result for the same input changes: it is part of the cache key. */
  version: number;
  /** Every parameter with its default, documented with `.describe()`. */
  params: z.ZodType<P>;
  /** Whether the measure needs a cast in the plan. */
  needsCast: boolean;
  /** Whether a result with these parameters reads the cast or dialogue settings (part of the cache key). Default: `needsCast`. */
  readsCast?: (params: P) => boolean;
  compute(ctx: MeasureContext, params: P): R;
  method: MethodCard;
  /** Attribution that data the measure ships with requires (e.g. a word list's licence); shown in the site's credits. */
  credits?: string;
  /** The result as a table: shown beside the chart and offered as CSV/JSON. */
  table(result: R, params: P): Table;
  /** The chart kinds this measure can be drawn as, each turning a result into that chart's dataset. */
  views: Record<string, (result: R, params: P) => ChartData>;
}
