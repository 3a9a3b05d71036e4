/**
 * Numbers and lists as words for labels, tables and alt text. Locale-free on
 * purpose (the build must give the same bytes everywhere): comma thousands
 * separators, a point for decimals, a true minus sign (U+2212).
 */

export type ValueFormat = 'count' | 'share' | 'decimal';

const MINUS = '\u2212';

/** Rounds half away from zero to `decimals` places (avoids 1.005 → 1 surprises for display). */
function roundTo(v: number, decimals: number): number {
  const f = 10 ** decimals;
  return (Math.sign(v) * Math.round(Math.abs(v) * f + 1e-9)) / f;
}

/** Groups the integer digits of a non-negative decimal string in threes: "2310.5" → "2,310.5". */
function groupThousands(digits: string): string {
  const [int, frac] = digits.split('.');
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return frac ? `${grouped}.${frac}` : grouped;
}

/**
 * `v` with at most `decimals` decimals and thousands grouped. Trailing zeros
 * are dropped unless `fixed` (then every number shows exactly `decimals`).
 */
export function formatNumber(v: number, decimals = 2, fixed = false): string {
  if (!Number.isFinite(v)) return '\u2014';
  const r = roundTo(v, decimals);
  if (r === 0 && !fixed) return '0';
  let digits = Math.abs(r).toFixed(decimals);
  if (digits.includes('.') && !fixed) digits = digits.replace(/\.?0+$/, '');
  const body = groupThousands(digits);
  return r < 0 ? `${MINUS}${body}` : body;
}

/** A share (0..1) as a percentage: whole percent from 10% up, one decimal below ("31%", "4.5%", "0.3%"). */
export function formatPercent(share: number): string {
  if (!Number.isFinite(share)) return '\u2014';
  return `${formatNumber(share * 100, Math.abs(share) < 0.1 ? 1 : 0)}%`;
}

/**
 * A value in the dataset's own format: 'count' → "2,310", 'share' → "31%",
 * 'decimal' → "0.42". For 'decimal', pass `decimals` (see `decimalsFor`) to
 * give every number of a chart the same number of decimals ("0.20", "0.42").
 */
export function formatValue(v: number, format: ValueFormat, decimals?: number): string {
  if (format === 'count') return formatNumber(v, 0);
  if (format === 'share') return formatPercent(v);
  return decimals === undefined ? formatNumber(v, 2) : formatNumber(v, decimals, true);
}

/** The fewest decimals (0 to `max`) that show every value exactly to `max` places. */
export function decimalsFor(values: readonly number[], max = 2): number {
  const finite = values.filter(Number.isFinite);
  for (let d = 0; d < max; d++) {
    if (finite.every((v) => Math.abs(roundTo(v, d) - roundTo(v, max)) < 1e-9)) return d;
  }
  return max;
}

/** "Ada", "Ada and Bram", "Ada, Bram and Cleo". */
export function joinWords(words: readonly string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/** Capitalises the first letter of a sentence. */
export function upperFirst(s: string): string {
  return s.length === 0 ? s : s[0].toUpperCase() + s.slice(1);
}

/** Makes sure a sentence ends with a full stop (or ?, !). */
export function sentence(s: string): string {
  const t = s.trim();
  if (t === '') return t;
  return /[.!?…]$/.test(t) ? t : `${t}.`;
}

/**
 * Column keys for a table from ids that may clash with each other or with
 * the table's own first key: an id already taken gets `prefix` in front of it
 * until it is free ("ada", "series-ada").
 */
export function columnKeys(ids: readonly string[], first: string, prefix: string): string[] {
  const used = new Set([first]);
  return ids.map((id) => {
    let key = id;
    while (used.has(key)) key = `${prefix}-${key}`;
    used.add(key);
    return key;
  });
}
