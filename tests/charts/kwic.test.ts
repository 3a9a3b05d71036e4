import { describe, expect, it } from 'vitest';
import { kwic, kwicOptions } from '../../pipeline/charts/kwic.ts';
import { clipEnd, clipStart } from '../../pipeline/charts/clip.ts';
import { mixColour } from '../../pipeline/charts/colour.ts';
import { contrastRatio, defaultTheme } from '../../pipeline/charts/theme.ts';
import { textWidth } from '../../pipeline/charts/svg.ts';
import { ledgerKwic, kwicNotes } from './fixtures-kinds.ts';
import { count, textFills, texts, titles } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';
import { AMP, HOSTILE, commonChecks, expectEmpty, expectEscaped } from './kind-checks.ts';

/** Data indices of the lines drawn, in drawing order. */
function drawnLines(svg: string): number[] {
  return Array.from(svg.matchAll(/<g class="vt-kwic-line" data-line="(\d+)">/g), (m) => Number(m[1]));
}

/** The texts of one drawn line: [where, left, keyword, right]. */
function lineTexts(svg: string, index: number): string[] {
  const g = new RegExp(`<g class="vt-kwic-line" data-line="${index}">([\\s\\S]*?)</g>`).exec(svg)![1];
  return texts(g);
}

describe('kwic: shared promises', () => {
  commonChecks('kwic', ledgerKwic.title, () => kwic.render(ledgerKwic, {}, defaultTheme, kwicNotes));
});

describe('kwic: snapshots', () => {
  it('28 lines, the first 25 drawn, two notes', () => {
    const out = kwic.render(ledgerKwic, {}, defaultTheme, kwicNotes);
    expectSvgSnapshot('kwic', out.svg);
    expectSvgSnapshot('kwic-narrow', out.svgNarrow!);
  });
});

describe('kwic: alt text', () => {
  it('counts the lines and names the commonest word after the keyword', () => {
    // First words after "ledger" in the fixture, counted by hand: "and" opens 4 lines
    // (trusted, the last ten pages, began, went), "was" 3, every other word fewer.
    expect(kwic.render(ledgerKwic).alt).toBe(
      'Concordance of \u201Cledger\u201D: 28 lines; the commonest word after it is \u201Cand\u201D (4 of 28 lines). The chart shows 25 of them; the table lists all.',
    );
  });
  it('names ties and says when no word repeats', () => {
    const was = ledgerKwic.lines.filter((l) => l.right.startsWith('was ')).slice(0, 2);
    const went = ledgerKwic.lines.filter((l) => l.right.startsWith('went ')).slice(0, 2);
    const two = { ...ledgerKwic, lines: [...was, ...went] };
    expect(kwic.render(two).alt).toContain('the commonest words after it are \u201Cwas\u201D and \u201Cwent\u201D');
    const once = { ...ledgerKwic, lines: ledgerKwic.lines.slice(0, 3) };
    expect(kwic.render(once).alt).toContain('no word follows the keyword more than once');
  });
  it('appends the notes drawn', () => {
    expect(kwic.render(ledgerKwic, {}, defaultTheme, kwicNotes).alt).toMatch(
      / Note 1: The first sign that the ledger was altered\. Note 2: The flood reaches the ferry house\.$/,
    );
  });
});

describe('kwic: drawing', () => {
  it('draws at most `limit` lines and says so; the table keeps them all', () => {
    const out = kwic.render(ledgerKwic, { limit: 5 });
    expect(drawnLines(out.svg)).toEqual([0, 1, 2, 3, 4]);
    expect(texts(out.svg)).toContain('5 of 28 lines shown; the table lists all.');
    expect(out.table.rows).toHaveLength(28);
    expect(out.table.rows[12]).toEqual([13, 'IV \u00B6 6', 'Someone had written in the', 'Ledger', 'with a different hand, smaller and more careful.']);
    expect(texts(kwic.render(ledgerKwic, { limit: 100 }).svg).some((t) => t.includes('lines shown'))).toBe(false);
  });

  it('sorts by the words after the keyword, then by the words before it, read outwards', () => {
    // common practice, no source: concordances are sorted on the first word to the right (R1, then R2…)
    // or to the left (L1, then L2…) to bring repeated patterns together.
    const right = drawnLines(kwic.render(ledgerKwic, { sort: 'right' }).svg);
    // "aloud" first; then the four "and …" lines by their second word: began, the, trusted, went.
    expect(right.slice(0, 5)).toEqual([21, 24, 19, 5, 27]);
    const left = drawnLines(kwic.render(ledgerKwic, { sort: 'left' }).svg);
    // L1 words: a (keep a), fat, green, lock-keeper’s, new, old, own, parish, then the many "the".
    expect(left.slice(0, 8)).toEqual([26, 6, 0, 2, 24, 25, 5, 7]);
  });

  it('aligns the keyword on one axis, left context right-aligned, right context left-aligned', () => {
    const svg = kwic.render(ledgerKwic).svg;
    const keywordXs = new Set(Array.from(svg.matchAll(/<text x="([\d.]+)" y="[\d.]+" text-anchor="middle" font-weight="700"/g), (m) => m[1]));
    expect(keywordXs.size).toBe(1);
    const leftEnds = new Set(Array.from(svg.matchAll(/<text x="([\d.]+)" y="[\d.]+" text-anchor="end" style="font-family:var\(--vt-serif/g), (m) => m[1]));
    expect(leftEnds.size).toBe(1);
    expect(Number([...leftEnds][0])).toBeLessThan(Number([...keywordXs][0]));
  });

  it('cuts long contexts at the panel edge with an ellipsis on the outer side, keeping them whole in the tooltip', () => {
    const out = kwic.render(ledgerKwic);
    const [, left, keyword, right] = lineTexts(out.svgNarrow!, 1);
    expect(left.startsWith('\u2026')).toBe(true);
    expect(ledgerKwic.lines[1].left.endsWith(left.slice(1))).toBe(true);
    expect(keyword).toBe('ledger');
    expect(right.endsWith('\u2026')).toBe(true);
    expect(ledgerKwic.lines[1].right.startsWith(right.slice(0, -1))).toBe(true);
    expect(titles(out.svgNarrow!)).toContain('I \u00B6 9: Nobody in Wending Reach had ever asked to see the ledger before the night the water rose over the lower fields.');
  });

  it('keeps more context in the wide layout than in the narrow one', () => {
    const out = kwic.render(ledgerKwic);
    const len = (svg: string) => drawnLines(svg).reduce((s, i) => s + lineTexts(svg, i).join('').length, 0);
    expect(len(out.svg)).toBeGreaterThan(len(out.svgNarrow!) * 1.5);
  });

  it('shades every other row, in a shade on which all its text reads at 4.5:1', () => {
    const out = kwic.render(ledgerKwic);
    expect(count(out.svg, 'class="vt-shade"')).toBe(12); // rows 2, 4, … 24 of 25
    const shade = /class="vt-shade"[^>]* fill="(#[0-9A-F]{6})"/.exec(out.svg)![1];
    expect(shade).toBe(mixColour(defaultTheme.paper, defaultTheme.rule, 0.55));
    // Source: WCAG 2.2, SC 1.4.3 Contrast (Minimum): 4.5:1 for text.
    for (const f of new Set(textFills(out.svg))) {
      expect(contrastRatio(f, shade), f).toBeGreaterThanOrEqual(4.5);
      expect(contrastRatio(f, defaultTheme.paper), f).toBeGreaterThanOrEqual(4.5);
    }
  });

  it('sets the keyword in bold serif and the reference in the small sans', () => {
    const svg = kwic.render(ledgerKwic).svg;
    expect(svg).toMatch(/font-weight="700" style="font-family:var\(--vt-serif, [^"]*">ledger<\/text>/);
    expect(svg).toMatch(/font-size="13" fill="#5C554B">III ¶ 12<\/text>/);
  });
});

describe('kwic: notes', () => {
  it('marks the lines a note points at (at.x = line index) and skips the rest', () => {
    const out = kwic.render(ledgerKwic, {}, defaultTheme, [
      ...kwicNotes,
      { label: '3', text: 'Beyond the limit', at: { x: 27 } },
      { label: '4', text: 'Not a line', at: { x: 1.5 } },
      { label: '5', text: 'No line at all', at: { category: 'x' } },
      { label: '6', text: 'Same line again', at: { x: 12 } },
    ]);
    expect(count(out.svg, 'class="vt-note"')).toBe(2);
    expect(/<g class="vt-kwic-line" data-line="12">(?:(?!vt-kwic-line).)*data-note="1"/s.test(out.svg)).toBe(true);
    expect(/<g class="vt-kwic-line" data-line="19">(?:(?!vt-kwic-line).)*data-note="2"/s.test(out.svg)).toBe(true);
    expect(out.skippedNotes).toEqual(['3', '4', '5', '6']);
  });
  it('draws a note on a line that sorting brings into view', () => {
    const out = kwic.render(ledgerKwic, { sort: 'left', limit: 1 }, defaultTheme, [{ label: '1', text: 'A child’s ledger', at: { x: 26 } }]);
    expect(out.skippedNotes).toEqual([]);
  });
});

describe('kwic: escaping and empty data', () => {
  it('escapes every string it draws', () => {
    const hostileLines = ledgerKwic.lines.slice(0, 4).map((l, i) => ({
      where: i % 2 ? AMP : HOSTILE,
      left: `${HOSTILE} ${l.left} ${AMP}`,
      keyword: i % 2 ? HOSTILE : AMP,
      right: `${AMP} ${l.right} ${HOSTILE}`,
    }));
    const out = kwic.render({ ...ledgerKwic, title: HOSTILE, keyword: AMP, lines: hostileLines }, {}, defaultTheme, [{ label: '<', text: HOSTILE, at: { x: 0 } }]);
    expectEscaped(out);
    expect(out.alt).toContain(`\u201C${AMP}\u201D`);
  });
  it('says there is nothing to draw without lines', () => {
    const out = kwic.render({ ...ledgerKwic, lines: [] }, {}, defaultTheme, kwicNotes);
    expectEmpty(out);
    expect(out.skippedNotes).toEqual(['1', '2']);
  });
});

describe('kwic: options', () => {
  it('fills the documented defaults and rejects the rest', () => {
    expect(kwicOptions.parse({})).toEqual({ limit: 25, sort: 'text' });
    expect(kwicOptions.safeParse({ limit: 0 }).success).toBe(false);
    expect(kwicOptions.safeParse({ sort: 'random' }).success).toBe(false);
    expect(kwicOptions.safeParse({ colour: 'red' }).success).toBe(false);
    expect(() => kwic.render(ledgerKwic, { width: 3 } as never)).toThrow();
    for (const field of Object.values(kwicOptions.shape)) expect(field.description).toMatch(/Default: /);
  });
});

describe('clipping contexts', () => {
  const fs = 14;
  it('leaves text that fits alone, with its white space collapsed', () => {
    expect(clipEnd('the  quick\nfox', 500, fs)).toBe('the quick fox');
    expect(clipStart('the quick fox', 500, fs)).toBe('the quick fox');
  });
  it('keeps the start or the end, dropping a word cut in half', () => {
    const s = 'down, said Bram, and tell me who else has seen it';
    const end = clipEnd(s, 120, fs);
    expect(end.endsWith('\u2026')).toBe(true);
    expect(textWidth(end, fs)).toBeLessThanOrEqual(120);
    expect(s.startsWith(end.slice(0, -1))).toBe(true);
    expect(s.split(' ')).toEqual(expect.arrayContaining(end.slice(0, -1).split(' ')));
    const start = clipStart(s, 120, fs);
    expect(start.startsWith('\u2026')).toBe(true);
    expect(textWidth(start, fs)).toBeLessThanOrEqual(120);
    expect(s.endsWith(start.slice(1))).toBe(true);
    expect(s.split(' ')).toEqual(expect.arrayContaining(start.slice(1).split(' ')));
  });
  it('drops a comma left against the ellipsis', () => {
    // The cut falls inside "was": the word goes, then the comma before it.
    expect(clipEnd('for that week, was made on a Tuesday', textWidth('for that week, w', fs), fs)).toBe('for that week\u2026');
    expect(clipStart('made on a Tuesday, though the market', textWidth('ay, though the market', fs), fs)).toBe('\u2026though the market');
  });
  it('cuts inside a single word that is too long', () => {
    const out = clipEnd('Wendingreachfenlandferryhouse', 60, fs);
    expect(out.endsWith('\u2026')).toBe(true);
    expect(out.length).toBeGreaterThan(1);
  });
});
