import { z } from 'zod';
import type { Measure } from './types.ts';
import type { BarsData, MatrixData } from '../charts/types.ts';
import { analyseDialogue, MIN_CONFIDENCE } from '../dialogue/attribute.ts';

/** Row and column id standing for a speaker or addressee who is not known. */
export const UNKNOWN_ID = '(unknown)';
/** Row id standing for speakers outside the cast (a tag such as "said the maid"; see the speech measure). */
export const OUTSIDE_ID = '(outside the cast)';

export const conversationParams = z
  .object({
    value: z
      .enum(['words', 'turns'])
      .default('words')
      .describe('What the charts show and what orders rows and columns: words spoken, or turns taken. Default: "words".'),
    unknown: z
      .boolean()
      .default(true)
      .describe('Keep a row and a column for speech whose speaker or addressee is not known, and a row for speakers outside the cast, so the matrix adds up to all the dialogue. Default: true.'),
  })
  .strict();

export type ConversationParams = z.infer<typeof conversationParams>;

export interface ConversationPerson {
  id: string;
  name: string;
  turns: number;
  words: number;
}

export interface ConversationResult {
  value: 'words' | 'turns';
  /** Speakers, most `value` first; the rows for speakers outside the cast and unknown speakers last. */
  rows: ConversationPerson[];
  /** Addressees, most `value` first; the unknown column last. */
  columns: ConversationPerson[];
  /** turns[r][c]: turns spoken by rows[r] to columns[c]. */
  turns: number[][];
  /** words[r][c]: words spoken by rows[r] to columns[c]. */
  words: number[][];
  /** All dialogue: every turn and word, whether or not its row or column is shown. */
  totals: { turns: number; words: number };
  /** Who talks to whom in each chapter: every speaker–addressee pair with at least one turn. */
  chapters: { number: number; title: string; pairs: { speaker: string; addressee: string; turns: number; words: number }[] }[];
  note: string | null;
}

/** Cast first, then speakers outside the cast, then unknown speakers. */
const rank = (id: string): number => (id === UNKNOWN_ID ? 2 : id === OUTSIDE_ID ? 1 : 0);

export const conversation: Measure<ConversationParams, ConversationResult> = {
  name: 'conversation',
  version: 3,
  params: conversationParams,
  needsCast: true,
  reads: { cast: true, dialogue: true },
  compute(ctx, params) {
    const a = analyseDialogue(ctx);
    const name = new Map(ctx.cast.map((c) => [c.id, c.name]));
    name.set(UNKNOWN_ID, 'Unknown');
    name.set(OUTSIDE_ID, 'Outside the cast');
    const cell = new Map<string, { turns: number; words: number }>();
    const rowTot = new Map<string, { turns: number; words: number }>();
    const colTot = new Map<string, { turns: number; words: number }>();
    const perChapter = ctx.model.chapters.map(() => new Map<string, { speaker: string; addressee: string; turns: number; words: number }>());
    const bump = (m: Map<string, { turns: number; words: number }>, k: string, w: number): void => {
      const c = m.get(k) ?? m.set(k, { turns: 0, words: 0 }).get(k)!;
      c.turns++;
      c.words += w;
    };
    let turns = 0;
    let words = 0;
    for (const t of a.turns) {
      const s = t.speaker ?? (t.rule === 'outsider' ? OUTSIDE_ID : UNKNOWN_ID);
      const d = t.addressee ?? UNKNOWN_ID;
      turns++;
      words += t.words;
      const key = `${s}\u0000${d}`;
      bump(cell, key, t.words);
      bump(rowTot, s, t.words);
      bump(colTot, d, t.words);
      const ch = perChapter[t.chapter];
      const pair = ch.get(key) ?? ch.set(key, { speaker: s, addressee: d, turns: 0, words: 0 }).get(key)!;
      pair.turns++;
      pair.words += t.words;
    }
    const order = (m: Map<string, { turns: number; words: number }>): ConversationPerson[] =>
      [...m.entries()]
        .filter(([id]) => params.unknown || (id !== UNKNOWN_ID && id !== OUTSIDE_ID))
        .map(([id, c]) => ({ id, name: name.get(id) ?? id, turns: c.turns, words: c.words }))
        .sort((x, y) => rank(x.id) - rank(y.id) || y[params.value] - x[params.value] || x.id.localeCompare(y.id));
    const rows = order(rowTot);
    const columns = order(colTot);
    const grid = (k: 'turns' | 'words'): number[][] => rows.map((r) => columns.map((c) => cell.get(`${r.id}\u0000${c.id}`)?.[k] ?? 0));
    return {
      value: params.value,
      rows,
      columns,
      turns: grid('turns'),
      words: grid('words'),
      totals: { turns, words },
      chapters: ctx.model.chapters.map((c, i) => ({
        number: c.index + 1,
        title: c.title,
        pairs: [...perChapter[i].values()].sort((x, y) => y[params.value] - x[params.value] || x.speaker.localeCompare(y.speaker) || x.addressee.localeCompare(y.addressee)),
      })),
      note: turns === 0 ? 'No dialogue was found in this text (no quoted speech), so nobody talks to anybody here.' : null,
    };
  },
  method: {
    what: 'Who talks to whom: for every pair of characters, how many turns and words of dialogue the one addresses to the other, over the whole text and chapter by chapter.',
    formula: `Each turn of dialogue gets a speaker and an addressee (see the speech measure for speakers). The addressee is the one a curator's pin names; else the one the tag names ("said Ada to her father", "asked Tom"); else the first character addressed by name inside the speech ("Come here, Tansy"); else the other side of the exchange (the previous speaker, if different and at most two paragraphs back, else the next). Cell (r, c) = turns (or words) spoken by r to c. Rows and columns are ordered by their totals; speakers outside the cast (a tag such as "said the maid") have their own row, and unknown speakers and addressees (below confidence ${MIN_CONFIDENCE}, or spoken to someone outside the cast) their own row and column, so the matrix adds up to all the dialogue.`,
    source:
      'Speaker and addressee attribution as in conversational network studies of fiction (Elson, Dames & McKeown 2010, "Extracting Social Networks from Literary Fiction", ACL), with the rule-and-sieve speaker attribution of Elson & McKeown 2010 and Muzny et al. 2017.',
    caveats: [
      'An addressee is often implied rather than stated; the "other side of the exchange" rule assumes two people talk in turn, so in a group scene it can name the wrong listener.',
      'A speech to several people at once is given to one addressee, or to none.',
      'Errors in speaker attribution carry over to this matrix.',
    ],
  },
  table(result) {
    const cols = result.columns;
    return {
      columns: [
        { key: 'speaker', label: 'Speaker', numeric: false },
        ...cols.map((c) => ({ key: `to:${c.id}`, label: `To ${c.name}`, numeric: true })),
        { key: 'total', label: 'Total', numeric: true },
      ],
      rows: result.rows.map((r, i) => {
        const values = result[result.value][i];
        return [r.name, ...values, values.reduce((s, x) => s + x, 0)];
      }),
    };
  },
  views: {
    matrix(result): MatrixData {
      return {
        kind: 'matrix',
        title: `Who talks to whom: ${result.value} of dialogue from each speaker to each addressee`,
        rowLabel: 'Speaker',
        columnLabel: 'Addressee',
        rows: result.rows.map((r) => ({ id: r.id, name: r.name })),
        columns: result.columns.map((c) => ({ id: c.id, name: c.name })),
        values: result[result.value],
        valueLabel: result.value === 'words' ? 'Words spoken' : 'Turns taken',
        format: 'count',
      };
    },
    bars(result): BarsData {
      return {
        kind: 'bars',
        title: `${result.value === 'words' ? 'Words' : 'Turns'} of dialogue from each speaker, by addressee`,
        categoryLabel: 'Speaker',
        valueLabel: result.value === 'words' ? 'Words spoken' : 'Turns taken',
        categories: result.rows.map((r) => r.name),
        series: result.columns.map((c, j) => ({ id: c.id, name: `To ${c.name}`, values: result.rows.map((_, i) => result[result.value][i][j]) })),
        format: 'count',
      };
    },
  },
};
