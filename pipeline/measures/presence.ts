import { z } from 'zod';
import type { Measure } from './types.ts';
import { narrativeTime, segmentsOf } from './params.ts';
import type { BarsData, LinesData, StripData } from '../charts/types.ts';
import { chapterTick, segmentLabel } from '../text/labels.ts';
import { segmentBounds, segmentOf } from '../stats/windows.ts';

export const presenceParams = z
  .object({
    ...narrativeTime({ default: 'chapter', by: 'Count mentions per chapter, or per equal-width segment of narrative time (by word position).' }),
    rate: z
      .boolean()
      .default(false)
      .describe('Chart mentions per 10,000 words instead of raw counts, so long and short chapters compare fairly. Default: false.'),
    bars: z
      .enum(['cast', 'positions'])
      .default('cast')
      .describe(
        'What a bar chart runs along: "cast" draws one bar per character (split by chapter when stacked); "positions" one bar per chapter or segment, split by character. Default: "cast".',
      ),
    characters: z
      .array(z.string())
      .optional()
      .describe('Only these cast ids, in this order. Default: the whole cast, most mentioned first.'),
  })
  .strict();

export type PresenceParams = z.infer<typeof presenceParams>;

export interface PresencePosition {
  label: string;
  tick: string;
  firstToken: number;
  tokens: number;
}

export interface PresenceResult {
  by: 'chapter' | 'segment';
  totalTokens: number;
  totalMentions: number;
  chapters: { number: number; title: string; firstToken: number; tokens: number }[];
  /** The positions counted: chapters, or equal segments. */
  positions: PresencePosition[];
  characters: {
    id: string;
    name: string;
    mentions: number;
    share: number;
    perChapter: number[];
    /** Present when `by` is "segment". */
    perSegment?: number[];
    /** Token index of each mention, in text order. */
    tokens: number[];
    /** First and last chapter (1-based) with a mention, or null. */
    first: number | null;
    last: number | null;
  }[];
  ambiguous: { text: string; chapter: number; candidates: string[]; count: number }[];
}

export const presence: Measure<PresenceParams, PresenceResult> = {
  name: 'presence',
  version: 1,
  params: presenceParams,
  needsCast: true,
  reads: { cast: true },
  segments: segmentsOf,
  compute({ model, cast, mentions }, params) {
    const { chapters, tokens } = model;
    const total = tokens.count;
    const order = params.characters ?? cast.map((c) => c.id);
    const unknown = order.filter((id) => !cast.some((c) => c.id === id));
    if (unknown.length) throw new RangeError(`characters names ids that are not in the cast: ${unknown.join(', ')}`);
    const members = order.map((id) => cast.findIndex((c) => c.id === id));
    const segments = params.by === 'segment' ? Math.min(params.segments, Math.max(1, total)) : 0;
    const bounds = segmentBounds(total, segments);
    const rows = members.map((m) => ({
      id: cast[m]!.id,
      name: cast[m]!.name,
      mentions: 0,
      share: 0,
      perChapter: new Array<number>(chapters.length).fill(0),
      perSegment: params.by === 'segment' ? new Array<number>(segments).fill(0) : undefined,
      tokens: [] as number[],
      first: null as number | null,
      last: null as number | null,
    }));
    const rowOf = new Map(members.map((m, i) => [m, i]));
    for (let k = 0; k < mentions.count; k++) {
      const r = rowOf.get(mentions.member[k]!);
      if (r === undefined) continue;
      const row = rows[r]!;
      const t = mentions.token[k]!;
      row.mentions++;
      row.perChapter[tokens.chapter[t]!]!++;
      if (row.perSegment) row.perSegment[segmentOf(t, total, segments)]!++;
      row.tokens.push(t);
    }
    const totalMentions = rows.reduce((s, r) => s + r.mentions, 0);
    for (const row of rows) {
      row.share = totalMentions ? Math.round((row.mentions / totalMentions) * 10000) / 10000 : 0;
      const withMention = row.perChapter.map((n, i) => (n ? i + 1 : 0)).filter(Boolean);
      row.first = withMention[0] ?? null;
      row.last = withMention.at(-1) ?? null;
    }
    if (!params.characters) rows.sort((a, b) => b.mentions - a.mentions || a.id.localeCompare(b.id));
    const ambiguous = new Map<string, { text: string; chapter: number; candidates: string[]; count: number }>();
    for (const a of mentions.ambiguous) {
      const key = `${a.text}\u0000${a.chapter}`;
      const seen = ambiguous.get(key);
      if (seen) seen.count++;
      else ambiguous.set(key, { text: a.text, chapter: a.chapter + 1, candidates: a.candidates, count: 1 });
    }
    return {
      by: params.by,
      totalTokens: total,
      totalMentions,
      chapters: chapters.map((c) => ({ number: c.index + 1, title: c.title, firstToken: c.firstToken, tokens: c.tokenCount })),
      positions:
        params.by === 'chapter'
          ? chapters.map((c) => ({ label: c.title, tick: chapterTick(c.index + 1), firstToken: c.firstToken, tokens: c.tokenCount }))
          : bounds.map(([a, b], i) => ({ label: segmentLabel(i, a, b), tick: String(i + 1), firstToken: a, tokens: b - a })),
      characters: rows.map((r) => (r.perSegment ? r : { ...r, perSegment: undefined })),
      ambiguous: [...ambiguous.values()],
    };
  },
  method: {
    what: 'Where each member of the cast is named: how often their name, or one of their aliases, appears in each chapter or in each equal stretch of the text.',
    formula:
      'A mention is a whole-word match of a cast member’s name, first name, surname or alias, longest match first ("Ada Fenwick" before "Ada"). A surname or alias shared by two members is ambiguous and not counted; a title (Mr., Mrs., Miss) settles it when only one member fits. Segments are equal spans of word positions: segment k holds words ⌊(k−1)N/S⌋+1 … ⌊kN/S⌋ of N words in S segments.',
    source: 'Named-mention counting across narrative time, a common first step in character network and distribution studies (e.g. Moretti 2011, "Network Theory, Plot Analysis"); segmenting by word position as in dispersion plots.',
    caveats: [
      'Pronouns (she, he, they) are not counted: a character who is on stage but only referred to as "she" looks absent.',
      'A name used in passing (a letter signed, a character remembered) counts like an appearance.',
      'Ambiguous mentions are left out and listed, so totals are a floor, not an exact census.',
    ],
  },
  table(result) {
    const pos = result.by === 'segment' ? result.positions : result.chapters.map((c) => ({ tick: String(c.number) }));
    return {
      columns: [
        { key: 'id', label: 'Id', numeric: false },
        { key: 'name', label: 'Character', numeric: false },
        { key: 'mentions', label: 'Mentions', numeric: true },
        { key: 'share', label: 'Share of mentions', numeric: true },
        ...pos.map((p) => ({
          key: `${result.by === 'segment' ? 's' : 'ch'}${p.tick}`,
          label: result.by === 'segment' ? `Seg. ${p.tick}` : `Ch. ${p.tick}`,
          numeric: true,
        })),
      ],
      rows: result.characters.map((c) => [
        c.id,
        c.name,
        c.mentions,
        c.share,
        ...(result.by === 'segment' ? c.perSegment! : c.perChapter),
      ]),
    };
  },
  views: {
    lines(result, params): LinesData {
      const rated = params.rate;
      return {
        kind: 'lines',
        title: `Mentions of each character per ${result.by}${rated ? ' (per 10,000 words)' : ''}`,
        xLabel: result.by === 'chapter' ? 'Chapter' : 'Narrative time (equal segments)',
        yLabel: rated ? 'Mentions per 10,000 words' : 'Mentions',
        points: result.positions.map((p) => p.label),
        ticks: result.positions.map((p) => p.tick),
        series: result.characters.map((c) => {
          const counts = result.by === 'segment' ? c.perSegment! : c.perChapter;
          return {
            id: c.id,
            name: c.name,
            values: rated ? counts.map((n, i) => perTenThousand(n, result.positions[i]!.tokens)) : counts,
          };
        }),
        format: rated ? 'decimal' : 'count',
      };
    },
    bars(result, params): BarsData {
      if (params.bars === 'positions') {
        return {
          kind: 'bars',
          title: `Mentions of each character per ${result.by}`,
          categoryLabel: result.by === 'chapter' ? 'Chapter' : 'Segment',
          valueLabel: 'Mentions',
          categories: result.positions.map((p) => p.label),
          series: result.characters.map((c) => ({
            id: c.id,
            name: c.name,
            values: result.by === 'segment' ? c.perSegment! : c.perChapter,
          })),
          format: 'count',
        };
      }
      const stacked = result.chapters.length > 1;
      return {
        kind: 'bars',
        title: 'Mentions of each character',
        categoryLabel: 'Character',
        valueLabel: 'Mentions',
        categories: result.characters.map((c) => c.name),
        series: stacked
          ? result.chapters.map((ch, i) => ({
              id: `ch${ch.number}`,
              name: ch.title,
              values: result.characters.map((c) => c.perChapter[i]!),
            }))
          : [{ id: 'mentions', name: 'Mentions', values: result.characters.map((c) => c.mentions) }],
        format: 'count',
      };
    },
    strip(result): StripData {
      const total = Math.max(1, result.totalTokens);
      return {
        kind: 'strip',
        title: 'Where each character is named, across the text',
        rows: result.characters.map((c) => ({ id: c.id, name: c.name, positions: c.tokens.map((t) => t / total) })),
        boundaries: result.chapters.map((c) => ({ at: c.firstToken / total, label: chapterTick(c.number), title: c.title })),
        totalTokens: result.totalTokens,
      };
    },
  },
};

function perTenThousand(n: number, tokens: number): number {
  return tokens ? Math.round((n / tokens) * 10000 * 100) / 100 : 0;
}
