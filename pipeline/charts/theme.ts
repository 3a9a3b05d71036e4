/**
 * The look of every chart: paper and ink, series colours, type and sizes.
 *
 * Colours. Series hues come from the Okabe–Ito palette (Okabe & Ito 2008,
 * "Color Universal Design"), chosen to stay distinct for the common forms of
 * colour-vision deficiency. Each hue has two variants:
 * - `mark`: used for bars, lines, dots; reaches at least 3:1 against `paper`
 *   (WCAG 2.2 SC 1.4.11, non-text contrast). Hues that are too light on paper
 *   (orange, sky blue, yellow, reddish purple) have their sRGB channels scaled
 *   down until the ratio is at least 3.1.
 * - `text`: used when a label is set in the series colour; reaches at least
 *   4.5:1 (WCAG 2.2 SC 1.4.3), scaled the same way to at least 4.6.
 * The small margins above the thresholds keep rounding from tipping a pair under.
 *
 * Sizes. Charts are drawn in two layouts: a wide one with a viewBox 720 units
 * wide, meant for containers from about 540 CSS px up, and a narrow one 360
 * units wide for phones. No text is smaller than 13 units, so the smallest
 * text renders at ≥ 9.75 px in the wide layout at 540 px and at ≥ 11.5 px in
 * the narrow layout at a 320 px viewport. The page picks one of the two SVGs
 * with a media query.
 */

/** A series colour: one variant for marks, a darker one for text set in that colour. */
export interface SeriesColour {
  /** Okabe–Ito name of the hue. */
  name: string;
  /** The hue as published, before any darkening. */
  source: string;
  /** For marks: ≥ 3:1 on paper. */
  mark: string;
  /** For text: ≥ 4.5:1 on paper. */
  text: string;
}

export interface Theme {
  /** Background of the chart (drawn as a rect, so contrast holds wherever the SVG is placed). */
  paper: string;
  /** Main text and strong marks. */
  ink: string;
  /** Secondary text: ticks, counts, axis titles. */
  inkMuted: string;
  /** Axis lines and note outlines: graphics needed to read the chart (≥ 3:1). */
  axis: string;
  /** Gridlines and chapter rules: light, supplementary, not required to read values. */
  rule: string;
  /** Series colours in the order they are given out. */
  series: readonly SeriesColour[];
  /** Font stacks: CSS variables the site sets when it self-hosts fonts, with system fallbacks. */
  fonts: { serif: string; sans: string };
  /** Type sizes in viewBox units. */
  sizes: {
    /** Category and row labels, direct line labels, legend. */
    label: number;
    /** Ticks, value labels, counts: the smallest text in a chart. */
    small: number;
    /** Axis titles and the empty-chart message (serif, italic). */
    axisTitle: number;
    /** Numbers inside note markers. */
    note: number;
  };
  /** viewBox widths of the two layouts. */
  widths: { wide: number; narrow: number };
}

function deepFreeze<T>(o: T): T {
  if (o && typeof o === 'object') {
    for (const v of Object.values(o)) deepFreeze(v);
    Object.freeze(o);
  }
  return o;
}

/** The default look: warm paper, brown-black ink, serif notes, sans labels. */
export const defaultTheme: Theme = deepFreeze({
  paper: '#FBF8F1',
  ink: '#2B2620',
  inkMuted: '#5C554B',
  axis: '#8A8175',
  rule: '#E3DCCD',
  series: [
    { name: 'blue', source: '#0072B2', mark: '#0072B2', text: '#0072B2' },
    { name: 'vermillion', source: '#D55E00', mark: '#D55E00', text: '#B95200' },
    { name: 'bluish green', source: '#009E73', mark: '#009E73', text: '#00805D' },
    { name: 'reddish purple', source: '#CC79A7', mark: '#C474A0', text: '#9B5C7F' },
    { name: 'sky blue', source: '#56B4E9', mark: '#4795C1', text: '#39779A' },
    { name: 'orange', source: '#E69F00', mark: '#BD8200', text: '#956700' },
    { name: 'yellow', source: '#F0E442', mark: '#97902A', text: '#787221' },
    { name: 'black', source: '#000000', mark: '#000000', text: '#000000' },
  ],
  fonts: {
    serif: 'var(--vt-serif, Charter, Georgia, Cambria, serif)',
    sans: 'var(--vt-sans, system-ui, Helvetica, Arial, sans-serif)',
  },
  sizes: { label: 14, small: 13, axisTitle: 14, note: 13 },
  widths: { wide: 720, narrow: 360 },
});

/** Style attribute for serif text (axis titles, notes, messages). */
export function serifStyle(theme: Theme, italic = false): string {
  return `font-family:${theme.fonts.serif}${italic ? ';font-style:italic' : ''}`;
}

/** The colour of series `i`, cycling through the palette. */
export function seriesColour(theme: Theme, i: number): SeriesColour {
  return theme.series[i % theme.series.length];
}

/* ---------- contrast (WCAG 2.2) ---------- */

/** Parses "#rgb" or "#rrggbb" into 0..255 channels; throws on anything else. */
export function parseHex(colour: string): [number, number, number] {
  const m = /^#([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(colour.trim());
  if (!m) throw new Error(`Colour "${colour}" is not a hex colour: write it as #rgb or #rrggbb.`);
  const h = m[1].length === 3 ? Array.from(m[1], (c) => c + c).join('') : m[1];
  return [0, 2, 4].map((i) => parseInt(h.slice(i, i + 2), 16)) as [number, number, number];
}

/** Linearises one sRGB channel (0..255), per the WCAG 2.2 definition of relative luminance. */
function linear(channel: number): number {
  const c = channel / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** Relative luminance L = 0.2126 R + 0.7152 G + 0.0722 B of linearised sRGB (WCAG 2.2). */
export function relativeLuminance(colour: string): number {
  const [r, g, b] = parseHex(colour).map(linear);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** Contrast ratio (L1 + 0.05) / (L2 + 0.05), L1 the lighter; from 1 to 21 (WCAG 2.2). */
export function contrastRatio(fg: string, bg: string): number {
  const a = relativeLuminance(fg);
  const b = relativeLuminance(bg);
  return (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
}
