import type { Table } from './charts/types.ts';

/** RFC 4180 CSV: CRLF line ends, fields with comma, quote or line break quoted, quotes doubled. */
export function tableToCsv(table: Table): string {
  const cell = (v: string | number | null): string => {
    if (v === null) return '';
    const s = String(v);
    return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  const lines = [table.columns.map((c) => cell(c.label)), ...table.rows.map((r) => r.map(cell))];
  return lines.map((l) => l.join(',')).join('\r\n') + '\r\n';
}
