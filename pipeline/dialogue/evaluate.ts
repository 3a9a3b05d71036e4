/**
 * Scoring attribution against a hand-annotated gold list.
 *
 * Gold file: tab-separated, lines starting with # are comments, a header line
 * naming the columns — `n chapter kind speaker addressee first_words`, with an
 * optional `marks` column before first_words — then one row per quoted span
 * in text order. speaker/addressee are cast ids or "-" (nobody in the cast).
 * marks is the convention the speech is printed in (double, single,
 * guillemets, low, dash); a file without the column may say it once in a
 * comment line "# marks: single". Gold rows are aligned with the quotations
 * found by matching the chapter and the first words (compared as pins are:
 * case, marks and spacing ignored), searching forward from the last match.
 *
 * Figures:
 *   accuracy      correct speakers ÷ gold speech rows whose speaker is in the cast
 *                 (a null, or a quotation not found, counts as wrong)
 *   null rate     null speakers ÷ the same rows
 *   per rule      among the rows each rule decided: correct, wrong, null, and
 *                 addressees correct ÷ those rows with a cast addressee
 *   per marks     the same accuracy and null rate per gold convention
 *   outsiders     gold speech rows spoken by someone outside the cast: how many
 *                 were left null, and by which rule the others went to the cast
 *   addressees    correct ÷ gold speech rows whose addressee is in the cast
 */

import type { CastMember } from '../text/model.ts';
import type { DialogueSettings } from '../measures/types.ts';
import { buildTextModel } from '../text/build.ts';
import { findMentions } from '../text/mentions.ts';
import { analyseDialogue, type AttributedQuote, type DialogueAnalysis } from './attribute.ts';
import { pinForm } from './pins.ts';

export interface GoldRow {
  n: number;
  chapter: number;
  kind: 'speech' | 'text';
  speaker: string | null;
  addressee: string | null;
  /** The convention the quotation is printed in, or null when the file does not say. */
  marks: string | null;
  firstWords: string;
}

const REQUIRED = ['n', 'chapter', 'kind', 'speaker', 'addressee', 'first_words'];

/** Read a gold file (see the module comment for its layout). */
export function parseGold(tsv: string): GoldRow[] {
  const rows: GoldRow[] = [];
  let columns = REQUIRED;
  let defaultMarks: string | null = null;
  for (const [i, line] of tsv.split(/\r?\n/).entries()) {
    if (line.trim() === '') continue;
    if (line.startsWith('#')) {
      const m = /^#\s*marks:\s*(\S+)\s*$/.exec(line);
      if (m) defaultMarks = m[1];
      continue;
    }
    if (line.startsWith('n\t')) {
      columns = line.split('\t').map((c) => c.trim());
      const missing = REQUIRED.filter((c) => !columns.includes(c));
      if (missing.length || columns[columns.length - 1] !== 'first_words') {
        throw new Error(`gold line ${i + 1}: the header must name ${REQUIRED.join(', ')} (first_words last); it lacks ${missing.join(', ') || 'first_words at the end'}`);
      }
      continue;
    }
    const f = line.split('\t');
    const at = (c: string): string => f[columns.indexOf(c)] ?? '';
    const fixed = columns.length - 1;
    if (f.length < columns.length || !/^\d+$/.test(at('n')) || !/^\d+$/.test(at('chapter')) || (at('kind') !== 'speech' && at('kind') !== 'text')) {
      throw new Error(`gold line ${i + 1} is not "${columns.join(', ')}" separated by tabs: ${line}`);
    }
    const id = (s: string): string | null => (s === '-' || s === '' ? null : s);
    rows.push({
      n: Number(at('n')),
      chapter: Number(at('chapter')),
      kind: at('kind') as 'speech' | 'text',
      speaker: id(at('speaker')),
      addressee: id(at('addressee')),
      marks: columns.includes('marks') ? at('marks') : defaultMarks,
      firstWords: f.slice(fixed).join('\t'),
    });
  }
  return rows;
}

export interface Score {
  total: number;
  correct: number;
  /** Share correct, 0..1 (four decimals); 0 when total is 0. */
  accuracy: number;
}

export interface RuleScore extends Score {
  /** Given to another cast member. */
  wrong: number;
  /** Left without a speaker (or the quotation was not found). */
  nulls: number;
  /** Rows of this rule whose gold addressee is in the cast, and how many got it. */
  addressees: Score;
}

export interface SpeakerScore extends Score {
  nulls: number;
  nullRate: number;
}

export interface EvalFigures {
  /** Gold rows, and how many were matched to a quotation. */
  gold: number;
  matched: number;
  /** Gold rows no quotation matched. */
  missed: { n: number; chapter: number; firstWords: string }[];
  /** Quotations found that no gold row names. */
  extra: number;
  speakers: SpeakerScore;
  perRule: Record<string, RuleScore>;
  /** Speaker accuracy per gold convention ("unstated" when the gold file does not say). */
  perMarks: Record<string, SpeakerScore>;
  /** Gold speech rows spoken by someone outside the cast: how many were left null, and the rules that gave the others to the cast. */
  outsiders: { total: number; nulls: number; givenBy: Record<string, number> };
  addressees: Score & { nulls: number };
  kinds: Score;
  /** Every wrong or null speaker, for reading. */
  errors: { n: number; chapter: number; firstWords: string; gold: string | null; got: string | null; rule: string; confidence: number }[];
}

const ratio = (a: number, b: number): number => (b ? Math.round((a / b) * 10000) / 10000 : 0);

/** The figures that add up over texts. */
export type Totals = Pick<EvalFigures, 'speakers' | 'perRule' | 'perMarks' | 'outsiders' | 'addressees'>;

/** Set every accuracy and null rate from its counts. */
function fillRatios(f: Pick<Totals, 'speakers' | 'perRule' | 'perMarks' | 'addressees'>): void {
  for (const s of [f.speakers, ...Object.values(f.perMarks)]) {
    s.accuracy = ratio(s.correct, s.total);
    s.nullRate = ratio(s.nulls, s.total);
  }
  for (const r of Object.values(f.perRule)) {
    r.accuracy = ratio(r.correct, r.total);
    r.addressees.accuracy = ratio(r.addressees.correct, r.addressees.total);
  }
  f.addressees.accuracy = ratio(f.addressees.correct, f.addressees.total);
}

/** Sum the figures of several texts. */
export function combine(all: readonly EvalFigures[]): Totals {
  const t: Totals = {
    speakers: { total: 0, correct: 0, accuracy: 0, nulls: 0, nullRate: 0 },
    perRule: {},
    perMarks: {},
    outsiders: { total: 0, nulls: 0, givenBy: {} },
    addressees: { total: 0, correct: 0, accuracy: 0, nulls: 0 },
  };
  for (const f of all) {
    for (const k of ['total', 'correct', 'nulls'] as const) {
      t.speakers[k] += f.speakers[k];
      t.addressees[k] += f.addressees[k];
    }
    for (const [rule, s] of Object.entries(f.perRule)) {
      const r = (t.perRule[rule] ??= { total: 0, correct: 0, accuracy: 0, wrong: 0, nulls: 0, addressees: { total: 0, correct: 0, accuracy: 0 } });
      for (const k of ['total', 'correct', 'wrong', 'nulls'] as const) r[k] += s[k];
      r.addressees.total += s.addressees.total;
      r.addressees.correct += s.addressees.correct;
    }
    for (const [marks, s] of Object.entries(f.perMarks)) {
      const m = (t.perMarks[marks] ??= { total: 0, correct: 0, accuracy: 0, nulls: 0, nullRate: 0 });
      for (const k of ['total', 'correct', 'nulls'] as const) m[k] += s[k];
    }
    t.outsiders.total += f.outsiders.total;
    t.outsiders.nulls += f.outsiders.nulls;
    for (const [rule, n] of Object.entries(f.outsiders.givenBy)) t.outsiders.givenBy[rule] = (t.outsiders.givenBy[rule] ?? 0) + n;
  }
  fillRatios(t);
  return t;
}

/** Align gold rows with the quotations found: the quotation index matched by each row, or -1. */
export function alignGold(quotes: readonly AttributedQuote[], gold: readonly GoldRow[]): number[] {
  const forms = quotes.map((q) => pinForm(q.text));
  const out: number[] = [];
  let j = 0;
  for (const g of gold) {
    const want = pinForm(g.firstWords);
    let hit = -1;
    for (let k = j; k < quotes.length && k < j + 12; k++) {
      if (quotes[k].chapter + 1 === g.chapter && forms[k].startsWith(want)) {
        hit = k;
        break;
      }
    }
    out.push(hit);
    if (hit >= 0) j = hit + 1;
  }
  return out;
}

/** Score an analysis against gold rows. */
export function scoreDialogue(analysis: DialogueAnalysis, gold: readonly GoldRow[]): EvalFigures {
  const align = alignGold(analysis.quotes, gold);
  const perRule: Record<string, RuleScore> = {};
  const perMarks: Record<string, SpeakerScore> = {};
  const errors: EvalFigures['errors'] = [];
  const speakers: SpeakerScore = { total: 0, correct: 0, accuracy: 0, nulls: 0, nullRate: 0 };
  const outsiders: EvalFigures['outsiders'] = { total: 0, nulls: 0, givenBy: {} };
  const addressees = { total: 0, correct: 0, accuracy: 0, nulls: 0 };
  const kinds = { total: 0, correct: 0, accuracy: 0 };
  gold.forEach((g, i) => {
    const q = align[i] >= 0 ? analysis.quotes[align[i]] : null;
    kinds.total++;
    if (q && q.kind === g.kind) kinds.correct++;
    if (g.kind !== 'speech') return;
    const got = q?.speaker ?? null;
    const rule = q?.rule ?? 'missed';
    if (g.speaker === null) {
      outsiders.total++;
      if (got === null) outsiders.nulls++;
      else outsiders.givenBy[rule] = (outsiders.givenBy[rule] ?? 0) + 1;
    } else {
      const r = (perRule[rule] ??= { total: 0, correct: 0, accuracy: 0, wrong: 0, nulls: 0, addressees: { total: 0, correct: 0, accuracy: 0 } });
      const m = (perMarks[g.marks ?? 'unstated'] ??= { total: 0, correct: 0, accuracy: 0, nulls: 0, nullRate: 0 });
      for (const s of [speakers, r, m]) s.total++;
      if (got === g.speaker) {
        for (const s of [speakers, r, m]) s.correct++;
      } else {
        if (got === null) for (const s of [speakers, r, m]) s.nulls++;
        else r.wrong++;
        errors.push({ n: g.n, chapter: g.chapter, firstWords: g.firstWords, gold: g.speaker, got, rule, confidence: q?.confidence ?? 0 });
      }
      if (g.addressee !== null) {
        r.addressees.total++;
        if ((q?.addressee ?? null) === g.addressee) r.addressees.correct++;
      }
    }
    if (g.addressee !== null) {
      addressees.total++;
      const a = q?.addressee ?? null;
      if (a === g.addressee) addressees.correct++;
      else if (a === null) addressees.nulls++;
    }
  });
  fillRatios({ speakers, perRule, perMarks, addressees });
  kinds.accuracy = ratio(kinds.correct, kinds.total);
  const used = new Set(align.filter((k) => k >= 0));
  return {
    gold: gold.length,
    matched: used.size,
    missed: gold.filter((_, i) => align[i] < 0).map((g) => ({ n: g.n, chapter: g.chapter, firstWords: g.firstWords })),
    extra: analysis.quotes.length - used.size,
    speakers,
    perRule,
    perMarks,
    outsiders,
    addressees,
    kinds,
    errors,
  };
}

/** Build the text model of `source`, analyse its dialogue with `cast`, and score it against the gold file's text. */
export function evaluateText(source: string, cast: CastMember[], goldTsv: string, dialogue?: DialogueSettings): EvalFigures {
  const model = buildTextModel(source, { id: 'evaluation' });
  const analysis = analyseDialogue({ model, cast, mentions: findMentions(model, cast), dialogue });
  return scoreDialogue(analysis, parseGold(goldTsv));
}
