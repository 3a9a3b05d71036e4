/**
 * Scoring attribution against a hand-annotated gold list.
 *
 * Gold file: tab-separated, lines starting with # are comments, a header line
 * `n chapter kind speaker addressee first_words`, then one row per quoted span
 * in text order. speaker/addressee are cast ids or "-" (nobody in the cast).
 * Gold rows are aligned with the quotations found by matching the chapter and
 * the first words (compared as pins are: case, marks and spacing ignored),
 * searching forward from the last match.
 *
 * Figures:
 *   accuracy      correct speakers ÷ gold speech rows whose speaker is in the cast
 *                 (a null, or a quotation not found, counts as wrong)
 *   null rate     null speakers ÷ the same rows
 *   per rule      the same accuracy among the rows each rule decided
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
  firstWords: string;
}

/** Read a gold file (see the module comment for its layout). */
export function parseGold(tsv: string): GoldRow[] {
  const rows: GoldRow[] = [];
  for (const [i, line] of tsv.split(/\r?\n/).entries()) {
    if (line.trim() === '' || line.startsWith('#') || line.startsWith('n\t')) continue;
    const f = line.split('\t');
    if (f.length < 6 || !/^\d+$/.test(f[0]) || !/^\d+$/.test(f[1]) || (f[2] !== 'speech' && f[2] !== 'text')) {
      throw new Error(`gold line ${i + 1} is not "n, chapter, kind, speaker, addressee, first words" separated by tabs: ${line}`);
    }
    const id = (s: string): string | null => (s === '-' || s === '' ? null : s);
    rows.push({ n: Number(f[0]), chapter: Number(f[1]), kind: f[2], speaker: id(f[3]), addressee: id(f[4]), firstWords: f.slice(5).join('\t') });
  }
  return rows;
}

export interface Score {
  total: number;
  correct: number;
  /** Share correct, 0..1 (four decimals); 0 when total is 0. */
  accuracy: number;
}

export interface EvalFigures {
  /** Gold rows, and how many were matched to a quotation. */
  gold: number;
  matched: number;
  /** Gold rows no quotation matched. */
  missed: { n: number; chapter: number; firstWords: string }[];
  /** Quotations found that no gold row names. */
  extra: number;
  speakers: Score & { nulls: number; nullRate: number };
  perRule: Record<string, Score>;
  /** Gold speech rows spoken by someone outside the cast, and how many of them were left null. */
  outsiders: { total: number; nulls: number };
  addressees: Score & { nulls: number };
  kinds: Score;
  /** Every wrong or null speaker, for reading. */
  errors: { n: number; chapter: number; firstWords: string; gold: string | null; got: string | null; rule: string; confidence: number }[];
}

const ratio = (a: number, b: number): number => (b ? Math.round((a / b) * 10000) / 10000 : 0);

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
  const perRule: Record<string, Score> = {};
  const errors: EvalFigures['errors'] = [];
  let spk = 0;
  let spkOk = 0;
  let nulls = 0;
  let outs = 0;
  let outNull = 0;
  let adr = 0;
  let adrOk = 0;
  let adrNull = 0;
  let kinds = 0;
  let kindOk = 0;
  gold.forEach((g, i) => {
    const q = align[i] >= 0 ? analysis.quotes[align[i]] : null;
    kinds++;
    if (q && q.kind === g.kind) kindOk++;
    if (g.kind !== 'speech') return;
    if (g.speaker === null) {
      outs++;
      if (!q || q.speaker === null) outNull++;
    } else {
      spk++;
      const got = q?.speaker ?? null;
      const rule = q?.rule ?? 'missed';
      const r = (perRule[rule] ??= { total: 0, correct: 0, accuracy: 0 });
      r.total++;
      if (got === g.speaker) {
        spkOk++;
        r.correct++;
      } else {
        if (got === null) nulls++;
        errors.push({ n: g.n, chapter: g.chapter, firstWords: g.firstWords, gold: g.speaker, got, rule, confidence: q?.confidence ?? 0 });
      }
    }
    if (g.addressee !== null) {
      adr++;
      const got = q?.addressee ?? null;
      if (got === g.addressee) adrOk++;
      else if (got === null) adrNull++;
    }
  });
  for (const r of Object.values(perRule)) r.accuracy = ratio(r.correct, r.total);
  const used = new Set(align.filter((k) => k >= 0));
  return {
    gold: gold.length,
    matched: used.size,
    missed: gold.filter((_, i) => align[i] < 0).map((g) => ({ n: g.n, chapter: g.chapter, firstWords: g.firstWords })),
    extra: analysis.quotes.length - used.size,
    speakers: { total: spk, correct: spkOk, accuracy: ratio(spkOk, spk), nulls, nullRate: ratio(nulls, spk) },
    perRule,
    outsiders: { total: outs, nulls: outNull },
    addressees: { total: adr, correct: adrOk, accuracy: ratio(adrOk, adr), nulls: adrNull },
    kinds: { total: kinds, correct: kindOk, accuracy: ratio(kindOk, kinds) },
    errors,
  };
}

/** Build the text model of `source`, analyse its dialogue with `cast`, and score it against the gold file's text. */
export function evaluateText(source: string, cast: CastMember[], goldTsv: string, dialogue?: DialogueSettings): EvalFigures {
  const model = buildTextModel(source, { id: 'evaluation' });
  const analysis = analyseDialogue({ model, cast, mentions: findMentions(model, cast), dialogue });
  return scoreDialogue(analysis, parseGold(goldTsv));
}
