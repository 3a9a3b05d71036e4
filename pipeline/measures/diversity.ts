import { z } from 'zod';
import type { Measure } from './types.ts';
import { narrativeTime, segmentsOf } from './params.ts';
import type { BarsData, LinesData, Table } from '../charts/types.ts';
import type { TextModel } from '../text/model.ts';
import { TOKEN_FLAGS } from '../text/model.ts';
import { chapterTick, segmentLabel } from '../text/labels.ts';
import { countTypes, mattr, mtld } from '../stats/diversity.ts';
import { positionRanges } from '../stats/windows.ts';

export const diversityParams = z
  .object({
    ...narrativeTime({ default: 'chapter', by: 'Measure each chapter, or each equal segment of narrative time.' }),
    score: z
      .enum(['mattr', 'mtld', 'ttr'])
      .default('mattr')
      .describe('What the charts show: "mattr" (moving-average type–token ratio), "mtld" (measure of textual lexical diversity) or "ttr" (plain type–token ratio). Default: "mattr".'),
    window: z
      .number()
      .int()
      .min(2)
      .max(100000)
      .default(500)
      .describe('MATTR window, in words. A chapter or segment shorter than the window gets its plain type–token ratio instead, and is flagged. Default: 500: a window of a page or two, long enough that a single sentence or refrain does not swing it, short enough that a chapter of a few thousand words yields many windows (this measure’s choice: the window is a free parameter of MATTR).'),
    threshold: z
      .number()
      .gt(0)
      .lt(1)
      .default(0.72)
      .describe('MTLD factor threshold: a factor ends when the running type–token ratio falls to this value. Default: 0.72 (McCarthy & Jarvis 2010).'),
    numbers: z.boolean().default(false).describe('Count numerals as words. Default: false.'),
  })
  .strict();

export type DiversityParams = z.infer<typeof diversityParams>;

export interface DiversityScores {
  /** Words counted (numerals left out unless `numbers`). */
  tokens: number;
  /** Distinct lower-cased word forms. */
  types: number;
  ttr: number | null;
  mattr: number | null;
  /** Windows MATTR averaged; 0 when it fell back to the TTR. */
  mattrWindows: number;
  /** True when the span was shorter than the MATTR window and `mattr` holds its TTR. */
  mattrFallback: boolean;
  /** Mean of the forward and backward MTLD; null when either is undefined (no factor at all). */
  mtld: number | null;
  mtldForward: number | null;
  mtldBackward: number | null;
}

export interface DiversityPosition extends DiversityScores {
  label: string;
  tick: string;
  firstToken: number;
}

export interface DiversityResult {
  by: 'chapter' | 'segment';
  window: number;
  threshold: number;
  whole: DiversityScores;
  positions: DiversityPosition[];
}

const round = (x: number | null, digits = 4): number | null => (x === null ? null : Math.round(x * 10 ** digits) / 10 ** digits);

function scoresOf(seq: Uint32Array, from: number, to: number, params: DiversityParams): DiversityScores {
  const types = countTypes(seq, from, to);
  const ttr = to > from ? types / (to - from) : null;
  const m = mattr(seq, params.window, from, to);
  const d = mtld(seq, params.threshold, from, to);
  return {
    tokens: to - from,
    types,
    ttr: round(ttr),
    mattr: round(m.value),
    mattrWindows: m.windows,
    mattrFallback: m.fallback,
    mtld: round(d.value, 2),
    mtldForward: round(d.forward.value, 2),
    mtldBackward: round(d.backward.value, 2),
  };
}

export function computeDiversity(model: TextModel, params: DiversityParams): DiversityResult {
  const { tokens, chapters } = model;
  // The counted words as a sequence of type ids, and where each token falls in it.
  const seq = new Uint32Array(tokens.count);
  const before = new Uint32Array(tokens.count + 1);
  let n = 0;
  for (let i = 0; i < tokens.count; i++) {
    before[i] = n;
    if (!params.numbers && tokens.flags[i]! & TOKEN_FLAGS.numeric) continue;
    seq[n++] = tokens.type[i]!;
  }
  before[tokens.count] = n;
  const counted = seq.subarray(0, n);
  const ranges = positionRanges(chapters, tokens.count, params.by, params.segments);
  return {
    by: params.by,
    window: params.window,
    threshold: params.threshold,
    whole: scoresOf(counted, 0, n, params),
    positions: ranges.map(([a, b], k) => ({
      label: params.by === 'chapter' ? chapters[k]!.title : segmentLabel(k, a, b),
      tick: params.by === 'chapter' ? chapterTick(k + 1) : String(k + 1),
      firstToken: a,
      ...scoresOf(counted, before[a]!, before[b]!, params),
    })),
  };
}

const NAMES: Record<DiversityParams['score'], string> = {
  mattr: 'Moving-average type–token ratio',
  mtld: 'MTLD',
  ttr: 'Type–token ratio',
};

function valueOf(s: DiversityScores, score: DiversityParams['score']): number {
  return (score === 'mattr' ? s.mattr : score === 'mtld' ? s.mtld : s.ttr) ?? 0;
}

export const diversity: Measure<DiversityParams, DiversityResult> = {
  name: 'diversity',
  version: 1,
  params: diversityParams,
  needsCast: false,
  reads: {},
  segments: segmentsOf,
  compute({ model }, params) {
    return computeDiversity(model, params);
  },
  method: {
    what: 'How varied the vocabulary is: how often the text brings in a word it has not used before, measured in ways that do not simply reward shorter chapters.',
    formula:
      'TTR = distinct word forms ÷ words. MATTR = the mean TTR of every run of W consecutive words (the window moving one word at a time; W = `window`, 500 by default, about a page or two of prose); a span shorter than W gets its plain TTR, flagged. MTLD: reading forward, the TTR of the current stretch is updated after each word; when it falls to the threshold (0.72) or below a factor is complete and a new stretch begins; the words left at the end add a partial factor (1 − TTR) ÷ (1 − 0.72), which is 0 when every leftover word is new. MTLD = words ÷ factors, read forward and backward and averaged; undefined (shown empty) if no factor at all. Words are lower-cased word forms, not lemmas.',
    source:
      'Covington, M. A. & McFall, J. D. (2010), “Cutting the Gordian knot: the moving-average type–token ratio (MATTR)”, Journal of Quantitative Linguistics 17(2); McCarthy, P. M. & Jarvis, S. (2010), “MTLD, vocd-D, and HD-D: a validation study of sophisticated approaches to lexical diversity assessment”, Behavior Research Methods 42(2).',
    caveats: [
      'Plain TTR falls as a text grows, so it compares only spans of similar length; MATTR and MTLD are the fairer comparisons between chapters of different lengths.',
      'Word forms are counted as written: “river” and “rivers” are two types, and names add types of their own.',
      'A chapter shorter than the MATTR window gets its plain TTR, which runs higher than MATTR: such chapters are flagged in the table.',
      'Repetition used for effect (refrains, dialogue tags, lists) lowers the scores as much as a small vocabulary does.',
    ],
  },
  table(result): Table {
    const row = (label: string, s: DiversityScores): (string | number | null)[] => [
      label,
      s.tokens,
      s.types,
      s.ttr,
      s.mattr,
      s.mattrFallback ? 'TTR (shorter than the window)' : `${s.mattrWindows} windows`,
      s.mtld,
      s.mtldForward,
      s.mtldBackward,
    ];
    return {
      columns: [
        { key: 'position', label: result.by === 'chapter' ? 'Chapter' : 'Segment', numeric: false },
        { key: 'words', label: 'Words', numeric: true },
        { key: 'types', label: 'Distinct words', numeric: true },
        { key: 'ttr', label: 'TTR', numeric: true },
        { key: 'mattr', label: `MATTR (${result.window} words)`, numeric: true },
        { key: 'mattrBasis', label: 'MATTR from', numeric: false },
        { key: 'mtld', label: 'MTLD', numeric: true },
        { key: 'mtldForward', label: 'MTLD forward', numeric: true },
        { key: 'mtldBackward', label: 'MTLD backward', numeric: true },
      ],
      rows: [...result.positions.map((p) => row(p.label, p)), row('Whole text', result.whole)],
    };
  },
  views: {
    bars(result, params): BarsData {
      return {
        kind: 'bars',
        title: `${NAMES[params.score]} of each ${result.by}`,
        categoryLabel: result.by === 'chapter' ? 'Chapter' : 'Segment',
        valueLabel: NAMES[params.score],
        categories: result.positions.map((p) => p.label),
        series: [{ id: params.score, name: NAMES[params.score], values: result.positions.map((p) => valueOf(p, params.score)) }],
        format: 'decimal',
      };
    },
    lines(result, params): LinesData {
      return {
        kind: 'lines',
        title: `${NAMES[params.score]} across the text, by ${result.by}`,
        xLabel: result.by === 'chapter' ? 'Chapter' : 'Narrative time (equal segments)',
        yLabel: NAMES[params.score],
        points: result.positions.map((p) => p.label),
        ticks: result.positions.map((p) => p.tick),
        series: [{ id: params.score, name: NAMES[params.score], values: result.positions.map((p) => valueOf(p, params.score)) }],
        format: 'decimal',
      };
    },
  },
};
