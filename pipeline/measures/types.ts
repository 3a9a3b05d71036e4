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

/**
 * What a measure's result depends on besides the text and its parameters. The
 * pipeline gives the measure only what it declares here (an undeclared cast is
 * empty, undeclared dialogue settings and word lists are absent), and puts
 * exactly this into the result's cache key.
 */
export interface MeasureReads<P> {
  /** The cast (and so the cast mentions), always or for some parameters. Default: not read. */
  cast?: boolean | ((params: P) => boolean);
  /** The text's dialogue settings in the plan (extra speech verbs, curator pins). Default: not read. */
  dialogue?: boolean | ((params: P) => boolean);
  /** The id of the plan's word list the result counts with, if any. Default: none. */
  lexicon?: (params: P) => string | undefined;
  /** npm packages whose bundled data the result depends on (word lists, language models); their installed versions are part of the cache key. Default: none. */
  data?: readonly string[];
}

/** A chart kind's dataset, by the kind's name (the types live in charts/types.ts). */
export type ChartDataOf<K extends ChartData['kind']> = Extract<ChartData, { kind: K }>;

/** The chart kinds a measure can be drawn as, each turning a result into that kind's dataset: `bars` must return bars data. */
export type MeasureViews<R, P> = { [K in ChartData['kind']]?: (result: R, params: P) => ChartDataOf<K> };

export interface Measure<P = any, R = any> {
  name: string;
  /** Bump when the result for the same input changes: it is part of the cache key. */
  version: number;
  /** Every parameter with its default, documented with `.describe()`. */
  params: z.ZodType<P>;
  /** Whether the measure needs a cast in the plan (the plan is refused without one). */
  needsCast: boolean;
  /** What the result depends on besides the text and the parameters. */
  reads: MeasureReads<P>;
  /** How many equal segments of narrative time the result runs along, for notes that point at a segment (see measures/params.ts). Default: none. */
  segments?: (params: P) => number | undefined;
  compute(ctx: MeasureContext, params: P): R;
  method: MethodCard;
  /** Attribution that data the measure ships with requires (e.g. a word list's licence); shown in the site's credits. */
  credits?: string;
  /** The result as a table: shown beside the chart and offered as CSV/JSON. */
  table(result: R, params: P): Table;
  /** The chart kinds this measure can be drawn as. */
  views: MeasureViews<R, P>;
}

/** Whether a measure reads something, for these parameters. */
export function reads<P>(flag: boolean | ((params: P) => boolean) | undefined, params: P): boolean {
  return typeof flag === 'function' ? flag(params) : !!flag;
}
