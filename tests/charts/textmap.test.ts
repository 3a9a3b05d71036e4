import { describe, expect, it } from 'vitest';
import { textmap, textmapOptions } from '../../pipeline/charts/textmap.ts';
import { minContrast, valueScale } from '../../pipeline/charts/diverging.ts';
import { mixColour, strongestTint } from '../../pipeline/charts/colour.ts';
import { flowLines } from '../../pipeline/charts/flow.ts';
import { contrastRatio, defaultTheme, parseHex, relativeLuminance } from '../../pipeline/charts/theme.ts';
import type { TextmapData } from '../../pipeline/charts/types.ts';
import { floodTextmap } from './fixtures-kinds.ts';
import { count, textFills, texts } from './inspect.ts';
import { expectSvgSnapshot } from './snapshot.ts';
import { AMP, HOSTILE, commonChecks, expectEmpty, expectEscaped } from './kind-checks.ts';

const t = defaultTheme;

/** Every tinted word: its tint, the colour of its type, its text and its attributes. */
function tintedWords(svg: string): { bg: string; fg: string; word: string; attrs: string; x: number; width: number }[] {
  return Array.from(
    svg.matchAll(/<g class="vt-span" data-span="\d+"><title>[^<]*<\/title><rect x="([\d.]+)" y="[\d.]+" width="([\d.]+)" height="[\d.]+" rx="2" fill="(#[0-9A-F]{6})"\/><text([^>]*) fill="(#[0-9A-F]{6})">([^<]*)<\/text><\/g>/g),
    (m) => ({ x: Number(m[1]), width: Number(m[2]), bg: m[3], attrs: m[4], fg: m[5], word: m[6] }),
  );
}

/** The lines of text: the words of each `vt-line-of-text` group. */
function linesOf(svg: string): string[][] {
  return Array.from(svg.matchAll(/<g class="vt-line-of-text">([\s\S]*?)<\/g>(?=<g class="vt-line-of-text">|<\/g>)/g), (m) => texts(m[1]));
}

const ENCODINGS = ['colour', 'size', 'weight'] as const;

describe('textmap: shared promises', () => {
  commonChecks('textmap', floodTextmap.title, () => textmap.render(floodTextmap, {}, t, [{ label: '1', text: 'The ledger survives', at: { x: 29 } }]));
});

describe('textmap: snapshots', () => {
  it('colour, wide and narrow, with a note', () => {
    const out = textmap.render(floodTextmap, {}, t, [{ label: '1', text: 'The ledger survives', at: { x: 29 } }]);
    expectSvgSnapshot('textmap', out.svg);
    expectSvgSnapshot('textmap-narrow', out.svgNarrow!);
  });
  it('size', () => {
    expectSvgSnapshot('textmap-size', textmap.render(floodTextmap, { encode: 'size' }).svg);
  });
});

describe('textmap: contrast', () => {
  it('keeps every word at 4.5:1 or more against the tint behind it, in every encoding and layout', () => {
    // Source: WCAG 2.2, SC 1.4.3 Contrast (Minimum): 4.5:1 for text.
    for (const encode of ENCODINGS) {
      const out = textmap.render(floodTextmap, { encode });
      for (const svg of [out.svg, out.svgNarrow!]) {
        const words = tintedWords(svg);
        expect(words.length).toBe(count(svg, 'class="vt-span"'));
        expect(words.length).toBe(floodTextmap.spans.filter((sp) => sp.value !== null).length);
        for (const w of words) expect(contrastRatio(w.fg, w.bg), `${w.word} ${w.fg} on ${w.bg}`).toBeGreaterThanOrEqual(4.5);
        // Everything else is set in ink or muted ink on paper.
        for (const f of textFills(svg)) expect(contrastRatio(f, t.paper) >= 4.5 || f === t.paper, f).toBe(true);
      }
    }
  });

  it('keeps ink readable on the strongest tint of either hue, for any value', () => {
    const scale = valueScale([-5, 5], t);
    for (let v = -5; v <= 5; v += 0.25) expect(contrastRatio(t.ink, scale.fill(v)), String(v)).toBeGreaterThanOrEqual(4.5);
    for (const d of [[0, 1], [-1, 0], [2, 9]] as [number, number][]) {
      const s = valueScale(d, t);
      for (let k = 0; k <= 20; k++) expect(contrastRatio(t.ink, s.fill(d[0] + ((d[1] - d[0]) * k) / 20))).toBeGreaterThanOrEqual(4.5);
    }
  });

  it('finds the strongest tint by bisection and never overshoots the ratio', () => {
    const tint = strongestTint(t.paper, '#0072B2', t.ink, minContrast);
    expect(tint).toBeGreaterThan(0.3);
    expect(tint).toBeLessThan(1);
    expect(contrastRatio(t.ink, mixColour(t.paper, '#0072B2', tint))).toBeGreaterThanOrEqual(minContrast);
    expect(contrastRatio(t.ink, mixColour(t.paper, '#0072B2', Math.min(1, tint + 0.05)))).toBeLessThan(minContrast);
    // A hue so light that ink reads on it at full strength keeps it.
    expect(strongestTint(t.paper, '#F0E442', t.ink, minContrast)).toBe(1);
  });
});

describe('textmap: the scale', () => {
  const scale = valueScale([-5, 5], t);
  const [r, , b] = [0, 1, 2];

  it('diverges from 0: Okabe–Ito blue above, vermillion below, light near 0, stronger further out', () => {
    // Source: Okabe & Ito (2008), "Color Universal Design": blue #0072B2 and vermillion #D55E00 (from memory).
    expect(scale.diverging).toBe(true);
    const pos = parseHex(scale.fill(3));
    const neg = parseHex(scale.fill(-3));
    expect(pos[b]).toBeGreaterThan(pos[r]);
    expect(neg[r]).toBeGreaterThan(neg[b]);
    for (const sign of [1, -1]) {
      const lum = [1, 2, 3, 4, 5].map((v) => relativeLuminance(scale.fill(sign * v)));
      for (let i = 1; i < lum.length; i++) expect(lum[i]).toBeLessThan(lum[i - 1]);
    }
    expect(contrastRatio(scale.fill(0.25), t.paper)).toBeLessThan(1.3);
    expect(contrastRatio(scale.fill(-0.25), t.paper)).toBeLessThan(1.3);
  });

  it('tells a scored neutral value from plain text, and clamps values outside the domain', () => {
    expect(scale.fill(0)).not.toBe(t.paper);
    expect(scale.strength(0)).toBe(0);
    expect(scale.fill(9)).toBe(scale.fill(5));
    expect(scale.fill(-9)).toBe(scale.fill(-5));
    expect(scale.strength(2.5)).toBeCloseTo(0.5, 10);
    expect(scale.strength(-2.5)).toBeCloseTo(0.5, 10);
  });

  it('uses one hue, light at the end nearest 0, for a domain on one side of 0', () => {
    const seq = valueScale([0, 1], t);
    expect(seq.diverging).toBe(false);
    expect(seq.strength(0)).toBe(0);
    expect(seq.strength(1)).toBe(1);
    const neg = valueScale([-4, -1], t);
    expect(neg.strength(-1)).toBe(0);
    expect(neg.strength(-4)).toBe(1);
    expect(parseHex(neg.fill(-4))[r]).toBeGreaterThan(parseHex(neg.fill(-4))[b]);
  });
});

describe('textmap: setting the text', () => {
  it('wraps into lines that fit the width, more of them in the narrow layout', () => {
    const out = textmap.render(floodTextmap);
    const wide = linesOf(out.svg);
    const narrow = linesOf(out.svgNarrow!);
    expect(narrow.length).toBeGreaterThan(wide.length);
    for (const [svg, W] of [[out.svg, 720], [out.svgNarrow!, 360]] as const) {
      for (const w of tintedWords(svg)) {
        expect(w.x).toBeGreaterThanOrEqual(12);
        expect(w.x + w.width).toBeLessThanOrEqual(W - 12 + 0.01);
      }
    }
    // No character is lost or doubled (pieces of one word may be set apart: "stolen" and ":").
    const letters = floodTextmap.spans.map((sp) => sp.text).join('').replace(/\s+/g, '');
    expect(wide.flat().join('')).toBe(letters);
    expect(narrow.flat().join('')).toBe(letters);
  });

  it('starts each paragraph on a new line, with a little more room before it', () => {
    const out = textmap.render(floodTextmap);
    const starts = linesOf(out.svg).map((l) => l[0]);
    expect(starts).toContain('At');
    expect(starts).toContain('Then');
    const baselines = Array.from(out.svg.matchAll(/<g class="vt-line-of-text">(?:<g class="vt-span"[^>]*><title>[^<]*<\/title><rect[^>]*\/>)?<text x="[\d.]+" y="([\d.]+)"/g), (m) => Number(m[1]));
    expect(baselines).toHaveLength(linesOf(out.svg).length);
    const gaps = baselines.slice(1).map((y, i) => y - baselines[i]);
    const para = linesOf(out.svg).findIndex((l) => l[0] === 'At');
    expect(gaps[para - 1]).toBeGreaterThan(Math.min(...gaps) + 5);
  });

  it('sets at most `maxWords` words, ends with an ellipsis and says so', () => {
    const out = textmap.render(floodTextmap, { maxWords: 20 });
    const words = linesOf(out.svg).flat();
    expect(words.at(-1)).toBe('\u2026');
    expect(words.join(' ').replace(/ ([:;,.])/g, '$1').split(' ').filter((w) => /\p{L}/u.test(w))).toHaveLength(20);
    // Words as the chart counts them: runs between white space that hold a letter or digit.
    // (A paragraph break separates words too.)
    const joined = floodTextmap.spans.map((sp, i) => (floodTextmap.breaks!.includes(i) ? ' ' : '') + sp.text).join('');
    const total = joined.split(/\s+/).filter((w) => /[\p{L}\p{N}]/u.test(w)).length;
    expect(out.alt).toContain(`The panel sets the first 20 words of ${total}; the table lists every span with a value.`);
    expect(texts(out.svgNarrow!).join(' ')).toContain('First 20 of');
    expect(out.table.rows.length).toBe(floodTextmap.spans.filter((s) => s.value !== null).length);
  });

  it('encodes size and weight as asked, and colour alone by default', () => {
    const strong = (svg: string) => tintedWords(svg).find((w) => w.word === 'killed')!;
    const weak = (svg: string) => tintedWords(svg).find((w) => w.word === 'quiet')!;
    const colour = textmap.render(floodTextmap).svg;
    expect(strong(colour).attrs).not.toMatch(/font-size|font-weight/);
    const size = textmap.render(floodTextmap, { encode: 'size' }).svg;
    const px = (w: { attrs: string }) => Number(/font-size="([\d.]+)"/.exec(w.attrs)?.[1] ?? 16);
    expect(px(strong(size))).toBeGreaterThan(px(weak(size)));
    const weight = textmap.render(floodTextmap, { encode: 'weight' }).svg;
    expect(strong(weight).attrs).toContain('font-weight="700"');
    expect(weak(weight).attrs).not.toContain('font-weight');
  });

  it('heads the panel with a legend of the scale', () => {
    const svg = textmap.render(floodTextmap).svg;
    expect(svg).toContain('class="vt-legend"');
    const t0 = texts(/<g class="vt-legend">([\s\S]*?)<g class="vt-text"/.exec(svg)![1]);
    expect(t0).toEqual(['Valence (AFINN-165)', '\u22125', '0', '5']);
  });
});

describe('textmap: alt text and table', () => {
  it('names the most positive and the most negative spans', () => {
    const valued = floodTextmap.spans.filter((s) => s.value !== null).length;
    expect(textmap.render(floodTextmap).alt).toBe(
      `Valence (AFINN-165): ${valued} of ${floodTextmap.spans.length} spans carry a value; the most positive is \u201Cgood\u201D and \u201Cglad\u201D (3), the most negative \u201Ckilled\u201D and \u201Cworst\u201D (\u22123).`,
    );
  });
  it('says so when nothing carries a value', () => {
    const plain: TextmapData = { ...floodTextmap, spans: floodTextmap.spans.map((s) => ({ text: s.text, value: null })) };
    expect(textmap.render(plain).alt).toMatch(/^Valence \(AFINN-165\): no span of the \d+ words carries a value\.$/);
  });
  it('lists every span with a value, its paragraph and its value', () => {
    const { table } = textmap.render(floodTextmap);
    expect(table.columns.map((c) => c.key)).toEqual(['span', 'paragraph', 'text', 'value']);
    expect(table.rows[0]).toEqual([2, 1, 'quiet', 1]);
    expect(table.rows.at(-1)).toEqual([floodTextmap.spans.length - 1, 3, 'worst', -3]);
  });
});

describe('textmap: notes', () => {
  it('draws a marker after the span a note points at, and skips notes outside the text set', () => {
    const grief = floodTextmap.spans.findIndex((sp) => sp.text === 'grief');
    const out = textmap.render(floodTextmap, { maxWords: 60 }, t, [
      { label: '1', text: 'Mud', at: { x: grief } },
      { label: '2', text: 'Past the cut', at: { x: 40 } },
      { label: '3', text: 'Nowhere', at: { x: 1000 } },
      { label: '4', text: 'Half a span', at: { x: 2.5 } },
    ]);
    expect(count(out.svg, 'class="vt-note"')).toBe(1);
    expect(out.skippedNotes).toEqual(['2', '3', '4']);
    expect(out.alt).toContain('Note 1: Mud.');
    // The marker follows "grief", the span it points at.
    expect(/>grief<\/text><\/g><g class="vt-note" data-note="1">/.test(out.svg)).toBe(true);
  });
});

describe('textmap: escaping and empty data', () => {
  it('escapes the text of every span, plain or scored', () => {
    const out = textmap.render(
      {
        ...floodTextmap,
        title: AMP,
        valueLabel: HOSTILE,
        spans: [
          { text: `${HOSTILE} and `, value: null },
          { text: AMP, value: 3 },
          { text: ` then ${AMP} `, value: null },
          { text: HOSTILE, value: -2 },
        ],
      },
      {},
      t,
      [{ label: '&', text: HOSTILE, at: { x: 1 } }],
    );
    expectEscaped(out);
    expect(tintedWords(out.svg).map((w) => w.word)).toEqual(['&quot;&amp;amp;', '&lt;script&gt;alert(1)&lt;/script&gt;']);
  });
  it('says there is nothing to draw without text', () => {
    expectEmpty(textmap.render({ ...floodTextmap, spans: [] }));
    expectEmpty(textmap.render({ ...floodTextmap, spans: [{ text: '   ', value: null }] }));
  });
});

describe('textmap: options', () => {
  it('fills the documented defaults and rejects the rest', () => {
    expect(textmapOptions.parse({})).toEqual({ encode: 'colour', maxWords: 400 });
    expect(textmapOptions.safeParse({ encode: 'hue' }).success).toBe(false);
    expect(textmapOptions.safeParse({ maxWords: 5 }).success).toBe(false);
    expect(textmapOptions.safeParse({ colour: 'red' }).success).toBe(false);
    expect(() => textmap.render(floodTextmap, { width: 3 } as never)).toThrow();
    for (const field of Object.values(textmapOptions.shape)) expect(field.description).toMatch(/Default: /);
  });
});

describe('flowLines', () => {
  const word = (width: number, breakBefore = true, paragraph = false) => ({ width, breakBefore, spaceBefore: breakBefore ? 5 : 0, paragraph });
  it('fills each line with as many words as fit (first fit)', () => {
    const lines = flowLines([word(40), word(40), word(40), word(40)], 129);
    expect(lines.map((l) => l.items.map((i) => i.index))).toEqual([[0, 1], [2, 3]]);
    expect(lines[0].items.map((i) => i.x)).toEqual([0, 45]);
    expect(lines[0].width).toBe(85);
  });
  it('keeps glued pieces together and breaks before a paragraph', () => {
    const lines = flowLines([word(50), word(50), word(4, false), word(20, true, true)], 104);
    expect(lines.map((l) => l.items.map((i) => i.index))).toEqual([[0], [1, 2], [3]]);
    expect(lines.map((l) => l.paragraph)).toEqual([true, false, true]);
  });
  it('gives a word wider than the line a line of its own', () => {
    const lines = flowLines([word(10), word(300), word(10)], 100);
    expect(lines.map((l) => l.items.map((i) => i.index))).toEqual([[0], [1], [2]]);
  });
});
