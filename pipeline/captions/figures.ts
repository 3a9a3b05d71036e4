/**
 * Figures written out in a caption or a note, held against the panel's data:
 * a number that matches no value the panel knows was most likely copied from
 * an older build, or mistyped, and is reported as a warning (the fix is to
 * correct it, or to write it as `<Value …/>` so that it follows the data).
 *
 * What is read: numbers written in digits in the prose ("28", "1,765",
 * "0.17", "−0.88", "21.5", "40%"). Numbers spelt out in words are left alone,
 * and so are numbers that are not figures of the data: ordinals ("1st"),
 * years (four digits from 1000 to 2999 without a comma), the numbers of
 * chapters, parts, paragraphs, segments, lines and pages ("chapter 4",
 * "¶ 33"), and anything inside a quotation.
 *
 * How a figure matches: to the precision it is written in (12.5 is 12.45 to
 * 12.55), as printed figures are rounded; after "about", "around", "nearly",
 * "almost", "some", "roughly", "over", "under", "more than", "fewer than" or
 * "less than", to within a tenth, or to its last non-zero digit ("about 1,140"
 * is 1,135 to 1,145, "about 7,300" is 7,250 to 7,350); a percentage also as a
 * share of 1. The values a panel knows are every number in its data table
 * and its measure's result (positions in the text aside), its parameters and
 * chart options, and the text's own counts. common practice, no source.
 */
import type { Table } from '../charts/types.ts';

export interface WrittenFigure {
  /** As written ("1,765"). */
  text: string;
  value: number;
  /** Offset in the string it was found in. */
  index: number;
  /** Half the width of the interval it stands for. */
  tolerance: number;
  percent: boolean;
}

const APPROX = /(?:about|around|nearly|almost|some|roughly|approximately|over|under|more than|fewer than|less than|just over|just under|a little over|a little under|upwards of|close to|c\.)\s+$/i;
const NOT_A_FIGURE_BEFORE = /(?:chapters?|parts?|books?|volumes?|paragraphs?|¶|segments?|slices?|lines?|pages?|p\.|pp\.|no\.|number|verses?|stanzas?)\s*$/i;
const ORDINAL_AFTER = /^(?:st|nd|rd|th)\b/i;
const NUMBER = /(?<![\p{L}\p{N}.,\-‐])([−\-+]?)(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d+))?(?![\p{L}\p{N}]|[.,]\d)/gu;

/** The figures written in a stretch of prose (see the file comment for what is left out). */
export function writtenFigures(prose: string): WrittenFigure[] {
  const out: WrittenFigure[] = [];
  for (const m of prose.matchAll(NUMBER)) {
    const [whole, sign, int, frac] = m;
    const before = prose.slice(Math.max(0, m.index - 30), m.index);
    const after = prose.slice(m.index + whole.length);
    if (ORDINAL_AFTER.test(after)) continue;
    if (NOT_A_FIGURE_BEFORE.test(before)) continue;
    // "chapters I and 4", "in 3 and 4": a run of numbers after a chapter word is all chapter numbers.
    if (/(?:chapters?|parts?|paragraphs?|segments?)\s+[\dIVXLC]+(?:\s*(?:,|and|or|to|–|-)\s*[\dIVXLC]+)*\s*(?:,|and|or|to|–|-)\s*$/i.test(before)) continue;
    const digits = int!.replace(/,/g, '');
    if (!frac && !int!.includes(',') && digits.length === 4 && +digits >= 1000 && +digits <= 2999) continue;
    const value = (sign === '−' || sign === '-' ? -1 : 1) * Number(`${digits}${frac ? `.${frac}` : ''}`);
    const decimals = frac?.length ?? 0;
    let tolerance = 0.5 * 10 ** -decimals + 1e-9;
    if (APPROX.test(before)) {
      const trailing = decimals === 0 ? (digits.match(/0+$/)?.[0].length ?? 0) : 0;
      tolerance = Math.max(tolerance, 0.5 * 10 ** trailing, Math.abs(value) * 0.1);
    }
    out.push({ text: whole, value, index: m.index, tolerance, percent: /^\s*(?:%|per ?cent)/i.test(after) });
  }
  return out;
}

/** Keys of positions in the text (token indices, offsets, source lines), which are not figures to quote. */
const POSITION_KEY = /^(?:token|tokens|positions|offset|start|end|firstToken|line|column|at|places)$/i;

/** Every finite number in a value, at any depth, but positions in the text. */
export function knownNumbers(value: unknown, into: number[] = [], key = ''): number[] {
  if (POSITION_KEY.test(key)) return into;
  if (typeof value === 'number') {
    if (Number.isFinite(value)) into.push(value);
  } else if (Array.isArray(value)) {
    for (const v of value) knownNumbers(v, into, key);
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) knownNumbers(v, into, k);
  }
  return into;
}

/** Whether a written figure stands for one of the known values (sorted ascending). */
export function figureMatches(f: WrittenFigure, known: Float64Array): boolean {
  const wanted = f.percent ? [f.value, f.value / 100] : [f.value];
  return wanted.some((w, i) => {
    const tol = i === 1 ? f.tolerance / 100 : f.tolerance;
    // Binary search for the first known value ≥ w − tol.
    let lo = 0;
    let hi = known.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (known[mid]! < w - tol) lo = mid + 1;
      else hi = mid;
    }
    return lo < known.length && known[lo]! <= w + tol;
  });
}

/** The known values of a panel: its table's cells (but positions in the text) and every number of the other sources, sorted for figureMatches. */
export function knownValues(table: Table | null, ...sources: unknown[]): Float64Array {
  const all: number[] = [];
  if (table) {
    const kept = table.columns.map((c) => !POSITION_KEY.test(c.key) && !/offset/i.test(c.label));
    for (const row of table.rows) row.forEach((v, i) => kept[i] && typeof v === 'number' && Number.isFinite(v) && all.push(v));
  }
  for (const s of sources) knownNumbers(s, all);
  return Float64Array.from(all).sort();
}
