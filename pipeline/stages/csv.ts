import type { Table } from '../charts/types.ts';

/**
 * Characters that make a spreadsheet read a cell as a formula when they open it: `=`, `+`,
 * `-`, `@`, tab and carriage return (the OWASP "CSV Injection" list), and NUL (OWASP ASVS 5.0,
 * requirement 1.2.10). A cast name such as `=HYPERLINK(…)` or a concordance line that starts
 * with a dash would otherwise run as a formula on the reader's machine.
 */
export const FORMULA_STARTS: readonly string[] = ['=', '+', '-', '@', '\t', '\r', '\0'];

/** How the CSV downloads are written, in words for the site's methods page. */
export const CSV_NOTE =
  'The CSV files are UTF-8 text with a header row, commas between cells and CRLF line ends (RFC 4180). ' +
  'A text cell that begins with =, +, -, @, a tab, a carriage return or a NUL character is written with a leading apostrophe (\'), ' +
  'so that a spreadsheet shows it as text instead of running it as a formula; remove that apostrophe to get the text back. ' +
  'Numbers are written as numbers, minus signs included. The JSON download holds every value unchanged.';

/** A text cell as written to CSV: a leading apostrophe when a spreadsheet would take it for a formula. */
export function neutraliseFormula(s: string): string {
  return s.length > 0 && FORMULA_STARTS.includes(s[0]!) ? `'${s}` : s;
}

/**
 * RFC 4180 CSV: CRLF line ends, fields with comma, quote or line break quoted, quotes doubled.
 * Text cells (and column labels) that a spreadsheet would read as a formula start with an
 * apostrophe; numeric cells are written as numbers, so -3.2 stays a number.
 */
export function tableToCsv(table: Table): string {
  const text = (s: string): string => {
    const safe = neutraliseFormula(s);
    return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
  };
  const cell = (v: string | number | null): string => {
    if (v === null) return '';
    if (typeof v === 'number') return String(v);
    return text(v);
  };
  const lines = [table.columns.map((c) => text(c.label)), ...table.rows.map((r) => r.map(cell))];
  return lines.map((l) => l.join(',')).join('\r\n') + '\r\n';
}
